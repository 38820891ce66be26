// Short-time magnitude spectra, one frame at a time, through PFFFT (Pommier's SIMD FFT, compiled to WebAssembly;
// @echogarden/pffft-wasm); the autocorrelation through fft.js (a well-known radix-4 FFT in JavaScript). The
// short-time spectra are most of the engine's work: on a 5-minute file the 32 000 real transforms took 174 ms
// with fft.js and 47 ms with PFFFT (README, "The tempo engine", speed).
import FFT from 'fft.js';
import type { PffftModule } from '@echogarden/pffft-wasm/simd';

let pffft: PffftModule | null = null;
let loading: Promise<void> | null = null;

/** Loads the WebAssembly FFT, once per process or worker thread; `analyse` awaits it before its first spectrum. */
export function loadSpectrum(): Promise<void> {
  // Imported when first needed: the package is an ES module (its loader finds the .wasm beside it).
  loading ??= import('@echogarden/pffft-wasm/simd')
    .then(({ default: createPffft }) => createPffft())
    .then((m) => {
      pffft = m;
    });
  return loading;
}

export function hannWindow(size: number): Float32Array {
  const w = new Float32Array(size);
  for (let i = 0; i < size; i++) w[i] = 0.5 - 0.5 * Math.cos((2 * Math.PI * i) / size);
  return w;
}

export interface SpectrumOptions {
  /**
   * The signal is read as if this many zeros came before it, so an attack at the very first sample still has
   * a silent frame before it.
   */
  padStart?: number;
  /** Bins 0…bins−1 only (the rest are not read out): a stage that reads a low band need not pay for all. */
  bins?: number;
  /** Squared magnitudes (power) instead of magnitudes: no square root for a stage that sums power anyway. */
  power?: boolean;
}

/**
 * Calls `onFrame(frameIndex, magnitudes)` for each hop; the magnitudes array is reused between calls.
 */
export function forEachSpectrum(
  samples: Float32Array,
  frameSize: number,
  hop: number,
  onFrame: (index: number, magnitudes: Float32Array) => void,
  { padStart = 0, bins = frameSize / 2 + 1, power = false }: SpectrumOptions = {},
): number {
  if (!pffft) throw new Error('the FFT is not loaded yet: await loadSpectrum() first');
  const m = pffft;
  const window = hannWindow(frameSize);
  const nBins = Math.min(bins, frameSize / 2 + 1);
  const mags = new Float32Array(nBins);
  const frames = Math.max(0, Math.floor((samples.length + padStart - frameSize) / hop) + 1);
  const setup = m._pffft_new_setup(frameSize, 0);
  if (!setup) throw new Error(`PFFFT has no real transform of ${frameSize} points (a multiple of 32 is needed)`);
  const frame = m._pffft_aligned_malloc(frameSize * 4);
  // Scratch space of its own: without it PFFFT takes N floats of its small stack, which large frames overrun.
  const work = m._pffft_aligned_malloc(frameSize * 4);
  try {
    // The frame is windowed in a plain array and copied in (writing element by element into the module's
    // memory was 3× slower); the memory is read after the allocation (it may have grown), nothing allocates
    // inside the loop.
    const windowed = new Float32Array(frameSize);
    const spectrum = m.HEAPF32.subarray(frame >> 2, (frame >> 2) + frameSize);
    const last = frameSize / 2;
    for (let f = 0; f < frames; f++) {
      const start = f * hop - padStart;
      if (start >= 0) for (let i = 0; i < frameSize; i++) windowed[i] = samples[start + i]! * window[i]!;
      else for (let i = 0; i < frameSize; i++) windowed[i] = start + i >= 0 ? samples[start + i]! * window[i]! : 0;
      spectrum.set(windowed);
      m._pffft_transform_ordered(setup, frame, frame, work, 0);
      // PFFFT's order for a real transform: DC and Nyquist (both real) first, then re/im pairs of bins 1…N/2−1.
      for (let k = 1; k < nBins && k < last; k++) {
        const re = spectrum[2 * k]!;
        const im = spectrum[2 * k + 1]!;
        mags[k] = re * re + im * im;
      }
      mags[0] = spectrum[0]! * spectrum[0]!;
      if (nBins > last) mags[last] = spectrum[1]! * spectrum[1]!;
      if (!power) for (let k = 0; k < nBins; k++) mags[k] = Math.sqrt(mags[k]!);
      onFrame(f, mags);
    }
  } finally {
    m._pffft_aligned_free(work);
    m._pffft_aligned_free(frame);
    m._pffft_destroy_setup(setup);
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
