// Stage 6 — the tempo curve and its summary, from the beat times: beat-to-beat tempo, lightly smoothed,
// sampled once a second; start and end tempo, drift and stability (coefficient of variation).
import type { CurvePoint } from '@/shared/analysis';
import { round } from './numbers';

/** Tempo of each beat-to-beat interval, placed at the interval's midpoint. */
export function interBeatTempi(beats: number[]): { t: number; bpm: number }[] {
  const out: { t: number; bpm: number }[] = [];
  for (let i = 1; i < beats.length; i++) {
    const ibi = beats[i]! - beats[i - 1]!;
    if (ibi > 0) out.push({ t: (beats[i]! + beats[i - 1]!) / 2, bpm: 60 / ibi });
  }
  return out;
}

const median = (xs: number[]) => {
  const s = [...xs].sort((a, b) => a - b);
  const m = s.length >> 1;
  return s.length % 2 ? s[m]! : (s[m - 1]! + s[m]!) / 2;
};

/** Median over a sliding window of `width` values: one misplaced beat does not bend the curve. */
function medianSmooth(values: number[], width: number): number[] {
  const h = width >> 1;
  return values.map((_, i) => median(values.slice(Math.max(0, i - h), Math.min(values.length, i + h + 1))));
}

export function tempoCurve(beats: number[], stepSec = 1): CurvePoint[] {
  const ibt = interBeatTempi(beats);
  if (ibt.length < 2) return [];
  const smooth = medianSmooth(
    ibt.map((x) => x.bpm),
    5,
  );
  const points: CurvePoint[] = [];
  const first = Math.ceil(ibt[0]!.t / stepSec) * stepSec;
  const last = ibt[ibt.length - 1]!.t;
  let j = 0;
  for (let t = first; t <= last + 1e-9; t += stepSec) {
    while (j < ibt.length - 2 && ibt[j + 1]!.t < t) j++;
    const a = ibt[j]!;
    const b = ibt[j + 1]!;
    const f = Math.max(0, Math.min(1, (t - a.t) / (b.t - a.t || 1)));
    points.push({ t: round(t, 3), bpm: round(smooth[j]! * (1 - f) + smooth[j + 1]! * f, 2) });
  }
  return points;
}

export interface TempoSummary {
  startBpm: number;
  endBpm: number;
  driftPct: number;
  stabilityCv: number;
}

/** Start and end tempo are medians of the first and last eight beat-to-beat tempi (fewer in a short take). */
export function summarise(beats: number[]): TempoSummary | null {
  const tempi = interBeatTempi(beats).map((x) => x.bpm);
  if (tempi.length < 2) return null;
  const k = Math.max(1, Math.min(8, Math.floor(tempi.length / 3)));
  const startBpm = median(tempi.slice(0, k));
  const endBpm = median(tempi.slice(-k));
  const mean = tempi.reduce((a, b) => a + b, 0) / tempi.length;
  const sd = Math.sqrt(tempi.reduce((a, b) => a + (b - mean) ** 2, 0) / tempi.length);
  return {
    startBpm: round(startBpm, 2),
    endBpm: round(endBpm, 2),
    driftPct: round(((endBpm - startBpm) / startBpm) * 100, 2),
    stabilityCv: round(sd / mean, 4),
  };
}

/**
 * The tempo of a steady stretch of beats, to a fraction of a BPM: the slope of a least-squares line through
 * beat time against beat number (every beat counts, so frame quantisation averages out).
 */
export function regressionBpm(beats: number[]): number | null {
  const n = beats.length;
  if (n < 3) return null;
  const mi = (n - 1) / 2;
  const mt = beats.reduce((a, b) => a + b, 0) / n;
  let num = 0;
  let den = 0;
  for (let i = 0; i < n; i++) {
    num += (i - mi) * (beats[i]! - mt);
    den += (i - mi) ** 2;
  }
  const period = num / den;
  return period > 0 ? 60 / period : null;
}

export { median };
