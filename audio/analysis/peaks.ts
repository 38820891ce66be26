// Waveform peaks for drawing: the minimum and maximum sample of each of `buckets` equal slices.
export interface Peaks {
  /** Interleaved [min0, max0, min1, max1, …], rounded to 1/1000 of full scale. */
  minMax: number[];
  buckets: number;
  durationSec: number;
}

export function waveformPeaks(samples: Float32Array, sampleRate: number, buckets = 1200): Peaks {
  const n = Math.max(1, Math.min(buckets, samples.length));
  const minMax: number[] = new Array(2 * n);
  for (let b = 0; b < n; b++) {
    const from = Math.floor((b * samples.length) / n);
    const to = Math.max(from + 1, Math.floor(((b + 1) * samples.length) / n));
    let lo = 0;
    let hi = 0;
    for (let i = from; i < to && i < samples.length; i++) {
      const v = samples[i]!;
      if (v < lo) lo = v;
      if (v > hi) hi = v;
    }
    minMax[2 * b] = Math.round(Math.max(-1, lo) * 1000) / 1000;
    minMax[2 * b + 1] = Math.round(Math.min(1, hi) * 1000) / 1000;
  }
  return { minMax, buckets: n, durationSec: samples.length / sampleRate };
}
