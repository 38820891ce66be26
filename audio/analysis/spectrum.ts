// Short-time magnitude spectra through fft.js (a well-known radix-4 FFT), one frame at a time.
import FFT from 'fft.js';

export function hannWindow(size: number): Float32Array {
  const w = new Float32Array(size);
  for (let i = 0; i < size; i++) w[i] = 0.5 - 0.5 * Math.cos((2 * Math.PI * i) / size);
  return w;
}

/**
 * Calls `onFrame(frameIndex, magnitudes)` for each hop; the magnitudes array is reused between calls.
 * The signal is read as if `padStart` zeros came before it, so an attack at the very first sample still
 * has a silent frame before it.
 */
export function forEachSpectrum(
  samples: Float32Array,
  frameSize: number,
  hop: number,
  onFrame: (index: number, magnitudes: Float32Array) => void,
  padStart = 0,
): number {
  const fft = new FFT(frameSize);
  const window = hannWindow(frameSize);
  const input = new Float64Array(frameSize);
  const out = fft.createComplexArray() as number[];
  const mags = new Float32Array(frameSize / 2 + 1);
  const frames = Math.max(0, Math.floor((samples.length + padStart - frameSize) / hop) + 1);
  for (let f = 0; f < frames; f++) {
    const start = f * hop - padStart;
    if (start >= 0) for (let i = 0; i < frameSize; i++) input[i] = samples[start + i]! * window[i]!;
    else for (let i = 0; i < frameSize; i++) input[i] = start + i >= 0 ? samples[start + i]! * window[i]! : 0;
    fft.realTransform(out, input);
    for (let k = 0; k <= frameSize / 2; k++) {
      const re = out[2 * k]!;
      const im = out[2 * k + 1]!;
      mags[k] = Math.sqrt(re * re + im * im);
    }
    onFrame(f, mags);
  }
  return frames;
}

/** Autocorrelation r[0..maxLag] of x through the FFT (zero-padded, so it is linear, not circular). */
export function autocorrelation(x: Float32Array, maxLag: number): Float32Array {
  let n = 1;
  while (n < 2 * x.length) n <<= 1;
  const fft = new FFT(n);
  const input = fft.createComplexArray() as number[];
  for (let i = 0; i < x.length; i++) input[2 * i] = x[i]!;
  const spec = fft.createComplexArray() as number[];
  fft.transform(spec, input);
  for (let k = 0; k < n; k++) {
    const re = spec[2 * k]!;
    const im = spec[2 * k + 1]!;
    spec[2 * k] = re * re + im * im;
    spec[2 * k + 1] = 0;
  }
  const back = fft.createComplexArray() as number[];
  fft.inverseTransform(back, spec);
  const r = new Float32Array(maxLag + 1);
  for (let lag = 0; lag <= maxLag && lag < x.length; lag++) r[lag] = back[2 * lag]!;
  return r;
}
