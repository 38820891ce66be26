// Waveform peaks for drawing: the minimum and maximum sample of each of `buckets` equal slices. The client builds
// coarser levels from these (components/waveform/view.ts), so one fine resolution serves every zoom.
export interface Peaks {
  /** Interleaved [min0, max0, min1, max1, …], rounded to 1/1000 of full scale. */
  minMax: number[];
  buckets: number;
  durationSec: number;
}

/** 25 buckets a second (40 ms each): finer than a sixteenth note at 180 BPM (83 ms), so two bars zoomed to a
 * phone's width still show their attacks; a 10-minute file’s JSON is about 190 KB (printed by tests/unit/waveform-view.test.ts). */
export const PEAKS_PER_SECOND = 25;
/** Short clips keep at least this many buckets (the resolution every recording had before zooming). */
const MIN_BUCKETS = 1200;

export function waveformPeaks(
  samples: Float32Array,
  sampleRate: number,
  buckets = Math.max(MIN_BUCKETS, Math.ceil((samples.length / sampleRate) * PEAKS_PER_SECOND)),
): Peaks {
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
