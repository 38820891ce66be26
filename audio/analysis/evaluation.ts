// Evaluation measures for tempo and beats, as published, so the engine can be scored against known truth:
// Accuracy1/Accuracy2 (Gouyon et al. 2006, IEEE TASLP 14(5)), and mir_eval's beat F-measure, beat P-score
// and tempo detection P-score (Raffel et al., ISMIR 2014), re-implemented from mir_eval's definitions and
// checked against its own test vectors in tests/unit/evaluation.test.ts.

/** Gouyon 2006: the estimate is within `tolerance` (4 %) of the reference tempo. */
export const accuracy1 = (estimated: number, reference: number, tolerance = 0.04) =>
  Math.abs(estimated - reference) <= tolerance * reference;

/** Gouyon 2006: as Accuracy1, but the reference may also be taken at 2, 3, 1/2 or 1/3 of its value. */
export const accuracy2 = (estimated: number, reference: number, tolerance = 0.04) =>
  [1, 2, 3, 1 / 2, 1 / 3].some((k) => accuracy1(estimated, reference * k, tolerance));

/** mir_eval.beat.trim_beats: beats before `minBeatTime` (5 s) are not scored. */
export const trimBeats = (beats: number[], minBeatTime = 5) => beats.filter((b) => b >= minBeatTime);

/**
 * The largest one-to-one matching of reference and estimated events no further apart than `window`
 * (mir_eval.util.match_events). Both lists sorted: each event's partners form a contiguous run that moves
 * forward with it, so matching greedily in time order is maximal.
 */
export function matchEvents(reference: number[], estimated: number[], window: number): number {
  let j = 0;
  let matched = 0;
  for (const r of reference) {
    while (j < estimated.length && estimated[j]! < r - window - 1e-12) j++;
    if (j < estimated.length && Math.abs(estimated[j]! - r) <= window + 1e-12) {
      matched++;
      j++;
    }
  }
  return matched;
}

/** mir_eval.beat.f_measure: F-measure of beats matched within ±70 ms. Call on trimmed beats. */
export function beatFMeasure(reference: number[], estimated: number[], window = 0.07): number {
  if (!reference.length || !estimated.length) return 0;
  const m = matchEvents(reference, estimated, window);
  const precision = m / estimated.length;
  const recall = m / reference.length;
  return precision + recall === 0 ? 0 : (2 * precision * recall) / (precision + recall);
}

/**
 * mir_eval.beat.p_score (McKinney et al. 2007): beats as 10 ms impulse trains, cross-correlated within
 * ±0.2 × the median reference interval, normalised by the longer list.
 */
export function beatPScore(reference: number[], estimated: number[], threshold = 0.2): number {
  if (!reference.length || !estimated.length) return 0;
  const rate = 100;
  const offset = Math.min(Math.min(...estimated), Math.min(...reference));
  const ref = reference.map((b) => Math.ceil((b - offset) * rate - 1e-9));
  const est = estimated.map((b) => Math.ceil((b - offset) * rate - 1e-9));
  const refSet = new Set(ref);
  const refIdx = [...refSet].sort((a, b) => a - b);
  const intervals = refIdx
    .slice(1)
    .map((x, i) => x - refIdx[i]!)
    .sort((a, b) => a - b);
  const mid = intervals.length >> 1;
  const medianInterval = intervals.length % 2 ? intervals[mid]! : (intervals[mid - 1]! + intervals[mid]!) / 2;
  const win = roundHalfEven(threshold * medianInterval);
  const estSet = new Set(est);
  let sum = 0;
  for (const e of estSet) for (let lag = -win; lag <= win; lag++) if (refSet.has(e - lag)) sum++;
  return sum / Math.max(estimated.length, reference.length);
}

/** numpy's round(): halves go to the even neighbour. */
function roundHalfEven(x: number): number {
  const r = Math.round(x);
  return Math.abs(x % 1) === 0.5 && r % 2 !== 0 ? r - 1 : r;
}

export interface TempoDetection {
  pScore: number;
  oneCorrect: boolean;
  bothCorrect: boolean;
}

/**
 * mir_eval.tempo.detection: two reference tempi with the weight of the first, two estimated tempi; a
 * reference tempo is hit when some estimate is within `tolerance` (8 %) of it.
 */
export function tempoDetection(
  referenceTempi: [number, number],
  referenceWeight: number,
  estimatedTempi: [number, number],
  tolerance = 0.08,
): TempoDetection {
  if (!(referenceWeight >= 0 && referenceWeight <= 1)) throw new RangeError('reference weight must lie in [0, 1]');
  if ([...referenceTempi, ...estimatedTempi].some((t) => !(t >= 0)))
    throw new RangeError('tempi must be non-negative numbers');
  if (!(tolerance >= 0 && tolerance <= 1)) throw new RangeError('tolerance must lie in [0, 1]');
  const hits = referenceTempi.map(
    (ref) => ref > 0 && Math.min(...estimatedTempi.map((e) => Math.abs(ref - e) / ref)) <= tolerance,
  );
  return {
    pScore: referenceWeight * Number(hits[0]) + (1 - referenceWeight) * Number(hits[1]),
    oneCorrect: hits.some(Boolean),
    bothCorrect: hits.every(Boolean),
  };
}
