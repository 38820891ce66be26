// Tap tempo: the tempo of a list of tap times (seconds), robust to a stray tap (an extra one between two
// beats, or one pressed far off time), which is simply left out.
import { tenth } from '@/shared/format';

export interface TapTempo {
  bpm: number;
  /** Taps that were used (the stray ones are dropped). */
  used: number;
  /** Taps left out as stray. */
  dropped: number;
}

/** At least this many taps (three intervals) before a tempo is offered. */
export const MIN_TAPS = 4;

export function tapTempo(taps: number[]): TapTempo | null {
  const t = [...taps].sort((a, b) => a - b);
  if (t.length < MIN_TAPS) return null;
  const intervals = t
    .slice(1)
    .map((x, i) => x - t[i]!)
    .filter((d) => d > 0);
  if (intervals.length < MIN_TAPS - 1) return null;
  // The beat period: the median interval, then the median of the intervals near it (an extra tap splits one
  // interval in two, which moves the median less than the mean).
  const sorted = [...intervals].sort((a, b) => a - b);
  let period = sorted[sorted.length >> 1]!;
  const near = intervals.filter((d) => Math.abs(d / period - 1) < 0.3).sort((a, b) => a - b);
  if (near.length) period = near[near.length >> 1]!;

  // Give each tap a beat number from the first; a tap far from any beat of that grid is stray, and of two taps
  // on the same beat the closer one counts.
  const byBeat = new Map<number, { time: number; residual: number }>();
  for (const time of t) {
    const beat = Math.round((time - t[0]!) / period);
    const residual = Math.abs(time - t[0]! - beat * period);
    if (residual > 0.25 * period) continue;
    const prev = byBeat.get(beat);
    if (!prev || residual < prev.residual) byBeat.set(beat, { time, residual });
  }
  const points = [...byBeat.entries()].map(([beat, p]) => ({ beat, time: p.time }));
  if (points.length < 3) return null;
  // Least squares of time against beat number: the slope is the period.
  const mb = points.reduce((s, p) => s + p.beat, 0) / points.length;
  const mt = points.reduce((s, p) => s + p.time, 0) / points.length;
  const num = points.reduce((s, p) => s + (p.beat - mb) * (p.time - mt), 0);
  const den = points.reduce((s, p) => s + (p.beat - mb) ** 2, 0);
  if (den === 0 || num <= 0) return null;
  return { bpm: tenth(60 / (num / den)), used: points.length, dropped: t.length - points.length };
}
