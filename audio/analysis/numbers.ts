// Small numeric helpers shared by the engine's stages: rounding for the reported figures, and the parabolic
// interpolation that places a peak between the samples of a sampled curve.

/** x rounded to `digits` decimal places. */
export const round = (x: number, digits: number) => {
  const p = 10 ** digits;
  return Math.round(x * p) / p;
};

/**
 * The offset (−0.5…0.5) of the true peak from sample i, from the parabola through values[i−1], values[i],
 * values[i+1] (the standard three-point peak interpolation, e.g. J. O. Smith, "Spectral Audio Signal
 * Processing", quadratic interpolation of spectral peaks). 0 at the edges or where i is no local maximum.
 */
export function parabolicOffset(values: ArrayLike<number>, i: number): number {
  if (i <= 0 || i >= values.length - 1) return 0;
  const a = values[i - 1]!;
  const b = values[i]!;
  const c = values[i + 1]!;
  const d = a - 2 * b + c;
  return d < 0 ? Math.max(-0.5, Math.min(0.5, (0.5 * (a - c)) / d)) : 0;
}
