// Stage 3 — global tempo: the strongest periodicity under a broad prior on tempo (log-normal around 120 BPM,
// as in Ellis 2007 and librosa's beat tracker), with the other strong peaks ranked and named by their
// relation to it (half, double, dotted …).
import type { TempoCandidate, TempoRelation } from '@/shared/analysis';
import { parabolicOffset, round } from './numbers';
import type { PeriodicityCurve } from './periodicity';

const PRIOR_CENTRE_BPM = 120;
const PRIOR_OCTAVES = 1.0;

export const tempoPrior = (bpm: number) => Math.exp(-0.5 * (Math.log2(bpm / PRIOR_CENTRE_BPM) / PRIOR_OCTAVES) ** 2);

const RELATIONS: [number, TempoRelation][] = [
  [1, 'primary'],
  [0.5, 'half'],
  [2, 'double'],
  [3, 'triple'],
  [1 / 3, 'third'],
  [1.5, 'three-halves'],
  [2 / 3, 'two-thirds'],
  [4, 'quadruple'],
  [1 / 4, 'quarter'],
];

/** Names the relation of `bpm` to `primary` when the ratio is within 4 % of a simple one. */
export function relationTo(bpm: number, primary: number): TempoRelation {
  const r = bpm / primary;
  for (const [ratio, name] of RELATIONS) if (Math.abs(r / ratio - 1) <= 0.04) return name;
  return 'unrelated';
}

const FASTEST_PREFERRED_BPM = 210;
const COMPLETE_PULSE = 0.9;

export interface TempoEstimate {
  bpm: number;
  /** Raw periodicity at the chosen tempo (0…~1). */
  strength: number;
  candidates: TempoCandidate[];
}

/**
 * @param pulseAt strength of the plain pulse at a tempo (see localPulse), used to decide between a tempo and
 *   its double.
 * @param bassPulseAt the same for the bass band alone.
 */
export function estimateTempo(
  curve: PeriodicityCurve,
  pulseAt: (bpm: number) => number,
  bassPulseAt: (bpm: number) => number,
  maxCandidates = 5,
): TempoEstimate | null {
  const { bpm, score } = curve;
  const peaks: { i: number; s: number }[] = [];
  for (let i = 1; i < score.length - 1; i++) {
    if (score[i]! > score[i - 1]! && score[i]! >= score[i + 1]! && score[i]! > 0) peaks.push({ i, s: score[i]! });
  }
  if (!peaks.length) return null;
  const weighted = (p: { i: number; s: number }) => p.s * tempoPrior(bpm[p.i]!);
  let best = peaks.reduce((a, b) => (weighted(b) > weighted(a) ? b : a));
  // A pulse that is just as strong at half the period has no weaker off-beats between its beats: then the
  // faster pulse is the beat (every click of a plain click track, for instance), while it stays playable.
  // The bass band must agree: eighth notes on a hi-hat are as complete a pulse as any, but the kick and the
  // bass do not play every one of them (low-register accents mark the beat level, Klapuri, Eronen & Astola
  // 2006). On the real recordings this rule had doubled nine tempos, eight of them wrongly.
  const twice = 2 * bpm[best.i]!;
  const complete = (at: (bpm: number) => number) => at(twice) >= COMPLETE_PULSE * at(bpm[best.i]!);
  if (twice <= FASTEST_PREFERRED_BPM && complete(pulseAt) && complete(bassPulseAt)) {
    const faster = peaks.filter((p) => Math.abs(bpm[p.i]! / twice - 1) < 0.03).sort((a, b) => b.s - a.s)[0];
    if (faster) best = faster;
  }
  const primary = refinePeakBpm(bpm, score, best.i);

  // Candidates: the chosen peak first, then the strongest others at least 4 % apart.
  const ranked = [...peaks].sort((a, b) => b.s - a.s);
  const chosen: { bpm: number; s: number }[] = [{ bpm: primary, s: best.s }];
  for (const p of ranked) {
    if (chosen.length >= maxCandidates) break;
    const b = refinePeakBpm(bpm, score, p.i);
    if (chosen.every((c) => Math.abs(c.bpm / b - 1) > 0.04)) chosen.push({ bpm: b, s: p.s });
  }
  const top = Math.max(...chosen.map((c) => c.s));
  return {
    bpm: primary,
    strength: best.s,
    candidates: chosen.map((c) => ({
      bpm: round(c.bpm, 1),
      score: round(c.s / top, 3),
      relation: relationTo(c.bpm, primary),
    })),
  };
}

function refinePeakBpm(bpm: Float32Array, score: Float32Array, i: number): number {
  if (i <= 0 || i >= score.length - 1) return bpm[i]!;
  // The grid is log-spaced: interpolate in log-tempo.
  const step = Math.log(bpm[i + 1]! / bpm[i]!);
  return bpm[i]! * Math.exp(parabolicOffset(score, i) * step);
}
