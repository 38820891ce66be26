// Passages of a recording on its beat grid: bar numbers, skipping by a bar, a loop region snapped to beats or
// bars, and the beats a looping playback passes over (the loop repeats the region end to start).
import { formatClock } from '@/shared/format';

export interface Grid {
  beats: number[];
  downbeats: number[];
  durationSec: number;
}

export interface Passage {
  start: number;
  end: number;
}

/** Event times and, after the last, where the next would fall at the same spacing (capped at the end). */
function boundaries(times: number[], durationSec: number): number[] {
  if (times.length === 0) return [0, durationSec];
  const last = times[times.length - 1]!;
  const spacing = times.length > 1 ? (last - times[0]!) / (times.length - 1) : durationSec - last;
  return [...times, Math.min(durationSec, last + spacing)];
}

/** Bar boundaries: every downbeat and, after the last, where the next bar would start (or the end). */
export const barBoundaries = (grid: Grid) => boundaries(grid.downbeats, grid.durationSec);

/** Beat boundaries: every beat and the one after the last. */
export const beatBoundaries = (grid: Grid) => boundaries(grid.beats, grid.durationSec);

/** Bar number (1-based) heard at `t`; 0 before the first downbeat (the pickup). */
export function barAt(t: number, downbeats: number[]): number {
  let bar = 0;
  for (let i = 0; i < downbeats.length && downbeats[i]! <= t + 1e-6; i++) bar = i + 1;
  return bar;
}

/** Beat within its bar (1-based) heard at `t`; 0 before the first beat. */
export function beatInBar(t: number, beats: number[], downbeats: number[]): number {
  const bar = barAt(t, downbeats);
  const from = bar === 0 ? -Infinity : downbeats[bar - 1]!;
  let n = 0;
  for (const b of beats) if (b >= from - 1e-6 && b <= t + 1e-6) n++;
  return n;
}

/**
 * Where "skip a bar" lands from `t`: forward, the next bar start; back, the start of the current bar, or of
 * the one before when `t` is already within half a second of it (so repeated presses keep going back).
 */
export function skipBar(t: number, grid: Grid, direction: 1 | -1): number {
  const bounds = barBoundaries(grid);
  if (direction > 0) return bounds.find((b) => b > t + 1e-6) ?? grid.durationSec;
  const before = bounds.filter((b) => b <= t + 1e-6);
  if (before.length === 0) return 0;
  const current = before[before.length - 1]!;
  if (t - current > 0.5) return current;
  return before.length > 1 ? before[before.length - 2]! : 0;
}

/** The bars a passage covers: the bar its start is in and the bar its end closes (null for a pickup). */
export function barsOf(p: Passage, downbeats: number[]): { startBar: number | null; endBar: number | null } {
  // A millisecond inside the passage, so an edge on a bar line counts the bar it opens or closes.
  const startBar = barAt(p.start + 1e-3, downbeats);
  const endBar = barAt(p.end - 1e-3, downbeats);
  return { startBar: startBar || null, endBar: endBar || null };
}

/** The bar that `t` falls in (the first bar for a pickup before it). */
export function barContaining(t: number, grid: Grid): Passage | null {
  const bounds = barBoundaries(grid);
  if (bounds.length < 2) return null;
  let i = 0;
  while (i < bounds.length - 2 && bounds[i + 1]! <= t + 1e-6) i++;
  return { start: bounds[i]!, end: bounds[i + 1]! };
}

const nearest = (xs: number[], t: number) =>
  xs.reduce((best, x) => (Math.abs(x - t) < Math.abs(best - t) ? x : best), xs[0]!);

/**
 * A region between `a` and `b` (either order) snapped to the nearest bar or beat boundaries; at least one unit
 * long. Null when the grid has no such unit.
 */
export function snapPassage(grid: Grid, a: number, b: number, unit: 'bar' | 'beat'): Passage | null {
  const bounds = unit === 'bar' ? barBoundaries(grid) : beatBoundaries(grid);
  if (bounds.length < 2) return null;
  const lo = Math.min(a, b);
  const hi = Math.max(a, b);
  let start = nearest(bounds.slice(0, -1), lo);
  let end = nearest(
    bounds.filter((x) => x > start + 1e-6),
    hi,
  );
  if (!(end > start)) {
    start = bounds[bounds.length - 2]!;
    end = bounds[bounds.length - 1]!;
  }
  return { start, end };
}

/** How a passage reads to a musician: "bars 5–8", "bar 3" or "0:12–0:18" when it is not on bar lines. */
export function describePassage(p: Passage, downbeats: number[]): string {
  const first = downbeats.findIndex((d) => Math.abs(d - p.start) < 0.02);
  const endIdx = downbeats.findIndex((d) => Math.abs(d - p.end) < 0.02);
  const lastBar = endIdx >= 0 ? endIdx : first >= 0 && p.end > downbeats[downbeats.length - 1]! ? downbeats.length : -1;
  if (first >= 0 && lastBar > first) return lastBar - first === 1 ? `bar ${first + 1}` : `bars ${first + 1}–${lastBar}`;
  return `${formatClock(p.start)}–${formatClock(p.end)}`;
}

/**
 * Playback with a loop runs on a straight "virtual" timeline: after the region's end it goes on, while the
 * recording heard wraps back to the start. These map between the two.
 */
export function wrapIntoLoop(v: number, loop: Passage | null): number {
  if (!loop || v < loop.end) return v;
  const len = loop.end - loop.start;
  return loop.start + ((v - loop.start) % len);
}

/** Finished passes through the loop at virtual time `v` (0 during the first). */
export function loopPass(v: number, loop: Passage): number {
  return v < loop.start ? 0 : Math.floor((v - loop.start) / (loop.end - loop.start) + 1e-9);
}

export interface GridBeat {
  /** Virtual time (seconds). */
  at: number;
  accent: boolean;
  /** Index of the beat in the recording's grid. */
  index: number;
}

/** The beats heard between virtual times [from, to): the grid, repeated pass after pass inside a loop. */
export function beatsBetween(
  grid: Pick<Grid, 'beats' | 'downbeats'>,
  loop: Passage | null,
  from: number,
  to: number,
): GridBeat[] {
  const down = new Set(grid.downbeats.map((d) => Math.round(d * 1000)));
  const out: GridBeat[] = [];
  const push = (b: number, i: number, shift: number) => {
    const at = b + shift;
    if (at >= from - 1e-9 && at < to) out.push({ at, accent: down.has(Math.round(b * 1000)), index: i });
  };
  if (!loop) {
    grid.beats.forEach((b, i) => push(b, i, 0));
    return out;
  }
  const len = loop.end - loop.start;
  grid.beats.forEach((b, i) => {
    if (b < loop.end - 1e-6) push(b, i, 0);
  });
  const firstPass = Math.max(1, Math.floor((from - loop.start) / len));
  for (let k = firstPass; loop.start + k * len < to; k++) {
    grid.beats.forEach((b, i) => {
      if (b >= loop.start - 1e-6 && b < loop.end - 1e-6) push(b, i, k * len);
    });
  }
  return out;
}

/**
 * The region of bars `first`–`last` (1-based, as the player counts them from the first downbeat): from the
 * downbeat of the first to the downbeat after the last (the end of the recording after the last bar). Null
 * when the grid has no such bars.
 */
export function barsToRegion(
  first: number,
  last: number,
  downbeats: number[],
  durationSec: number,
): { start: number; end: number } | null {
  if (first < 1 || last < first || first > downbeats.length) return null;
  const start = downbeats[first - 1]!;
  const end = last < downbeats.length ? downbeats[last]! : durationSec;
  return end > start ? { start, end } : null;
}
