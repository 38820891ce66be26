// The player's corrections to the beat grid, as pure functions of an analysis: take the beat at half or
// double the tempo found (the bar lines move with the beats), say "this beat is one", nudge the whole grid
// earlier or later. The server stores the corrections and applies them again to every new analysis
// (applyGridCorrections), so they survive re-analysis.
import type { Analysis } from '@/shared/analysis';
import { round } from './numbers';

export type MetricalLevelChoice = 'half' | 'as-found' | 'double';

export interface GridCorrections {
  level?: MetricalLevelChoice;
  /** Milliseconds to move every beat by (positive: later). */
  nudgeMs?: number;
  /** A time (s) the player marked as "this beat is one": the beat nearest to it becomes a downbeat. */
  downbeatAt?: number;
}

/** Beat times are reported to 0.1 ms, as the engine reports them. */
const TIME_DIGITS = 4;
/** Tempi are reported to 0.01 BPM, as the engine reports them. */
const BPM_DIGITS = 2;

/** Beats in a bar from the meter string ("3/4" → 3); 4 when there is none (common practice). */
export function beatsPerBar(meter: string | null): number {
  const n = meter ? Number.parseInt(meter, 10) : NaN;
  return Number.isFinite(n) && n > 0 ? n : 4;
}

/** Downbeats every `perBar` beats of `beats`, counting from the beat at index `one` in both directions. */
function barLines(beats: number[], one: number, perBar: number): number[] {
  return beats.filter((_, j) => (((j - one) % perBar) + perBar) % perBar === 0);
}

/** Index of the first downbeat in the beat list (0 when there is none). */
function firstDownbeatIndex(a: Pick<Analysis, 'beats' | 'downbeats'>): number {
  if (!a.downbeats.length) return 0;
  const i = a.beats.findIndex((b) => Math.abs(b - a.downbeats[0]!) < 1e-6);
  return i < 0 ? 0 : i;
}

const scaleBpm = (x: number | null, k: number) => (x === null ? null : round(x * k, BPM_DIGITS));

/**
 * The analysis with its beat at another metrical level. Half: every other beat, keeping the ones the bar
 * lines fall on. Double: a beat inserted halfway between each two. The bar keeps its number of beats, so
 * the bar lines move with the beats (twice as far apart at half tempo, twice as close at double).
 */
export function beatsAtLevel(a: Analysis, level: MetricalLevelChoice): Analysis {
  if (level === 'as-found' || a.beats.length === 0) return a;
  const perBar = beatsPerBar(a.meter);
  const one = firstDownbeatIndex(a);
  let beats: number[];
  let newOne: number;
  let k: number;
  if (level === 'half') {
    beats = a.beats.filter((_, i) => i % 2 === one % 2);
    newOne = (one - (one % 2)) / 2;
    k = 0.5;
  } else {
    beats = [];
    a.beats.forEach((b, i) => {
      beats.push(b);
      const next = a.beats[i + 1];
      if (next !== undefined) beats.push(round((b + next) / 2, TIME_DIGITS));
    });
    newOne = 2 * one;
    k = 2;
  }
  return {
    ...a,
    bpm: scaleBpm(a.bpm, k),
    beats,
    downbeats: a.downbeats.length ? barLines(beats, newOne, perBar) : [],
    beatCount: beats.length,
    curve: a.curve.map((p) => ({ t: p.t, bpm: round(p.bpm * k, BPM_DIGITS) })),
    startBpm: scaleBpm(a.startBpm, k),
    endBpm: scaleBpm(a.endBpm, k),
  };
}

/** "This beat is one": the beat nearest to `time` becomes a downbeat, and the bar lines follow from it. */
export function moveDownbeat(a: Analysis, time: number): Analysis {
  if (!a.beats.length) return a;
  let one = 0;
  a.beats.forEach((b, i) => {
    if (Math.abs(b - time) < Math.abs(a.beats[one]! - time)) one = i;
  });
  return { ...a, downbeats: barLines(a.beats, one, beatsPerBar(a.meter)) };
}

/** Every beat and bar line moved by `ms` milliseconds (positive: later); beats moved before 0 are dropped. */
export function nudgeBeats(a: Analysis, ms: number): Analysis {
  const shift = (ts: number[]) => ts.map((t) => round(t + ms / 1000, TIME_DIGITS)).filter((t) => t >= 0);
  const beats = shift(a.beats);
  return { ...a, beats, downbeats: shift(a.downbeats), beatCount: beats.length };
}

/** The player's stored corrections applied to an analysis, in a fixed order: level, then nudge, then "one". */
export function applyGridCorrections(a: Analysis, c: GridCorrections): Analysis {
  let out = beatsAtLevel(a, c.level ?? 'as-found');
  if (c.nudgeMs) out = nudgeBeats(out, c.nudgeMs);
  if (c.downbeatAt !== undefined) out = moveDownbeat(out, c.downbeatAt);
  return out;
}
