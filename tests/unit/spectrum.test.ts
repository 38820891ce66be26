// Short-time spectra through the WebAssembly FFT (PFFFT, single precision), checked against a worked example
// and against fft.js (a general-purpose FFT in double precision, from the registry).
import FFT from 'fft.js';
import { forEachSpectrum, hannWindow, loadSpectrum } from '@/audio/analysis/spectrum';

beforeAll(() => loadSpectrum());

/** Magnitude spectra of every frame, copied out (the callback's array is reused). */
function spectra(x: Float32Array, size: number, hop: number, options = {}): Float32Array[] {
  const out: Float32Array[] = [];
  forEachSpectrum(x, size, hop, (_, m) => out.push(m.slice()), options);
  return out;
}

test('a sine on bin 40 of a 512-point Hann frame reads N/4 there and N/8 on each neighbour', () => {
  // Hann window: coherent gain 0.5, so a unit sine on an exact bin gives (N/2)·0.5 = N/4, and its
  // transform is −1/4, 1/2, −1/4 of the rectangular one's on the bin and its neighbours (F. J. Harris,
  // "On the use of windows for harmonic analysis with the DFT", Proc. IEEE 66(1), 1978).
  const N = 512;
  const x = Float32Array.from({ length: N }, (_, i) => Math.sin((2 * Math.PI * 40 * i) / N));
  const [m] = spectra(x, N, N);
  expect(m![40]).toBeCloseTo(N / 4, 2);
  expect(m![39]).toBeCloseTo(N / 8, 2);
  expect(m![41]).toBeCloseTo(N / 8, 2);
  for (const k of [0, 10, 38, 42, 100, 256]) expect(m![k]).toBeLessThan(1e-3);
});

test("a 65 536-point frame (the stretch benchmark measures a bass note's pitch with one) reads its sine", () => {
  const N = 65536;
  const x = Float32Array.from({ length: N }, (_, i) => Math.sin((2 * Math.PI * 82 * i) / N));
  const [m] = spectra(x, N, N);
  expect(m![82]! / (N / 4)).toBeCloseTo(1, 4);
  expect(m![81]! / (N / 8)).toBeCloseTo(1, 4);
});

test.each([512, 2048])('every frame of noise matches fft.js (%p points) within single precision', (N) => {
  let seed = 7;
  const noise = Float32Array.from({ length: 6 * N }, () => ((seed = (seed * 16807) % 2147483647) / 2147483647) * 2 - 1);
  const hop = N / 4;
  const pad = N / 2;
  const ours = spectra(noise, N, hop, { padStart: pad });
  const fft = new FFT(N);
  const w = hannWindow(N);
  const out = fft.createComplexArray() as number[];
  expect(ours).toHaveLength(Math.floor((noise.length + pad - N) / hop) + 1);
  ours.forEach((m, f) => {
    const frame = Array.from({ length: N }, (_, i) => (noise[f * hop - pad + i] ?? 0) * w[i]!);
    fft.realTransform(out, frame);
    const ref = Array.from({ length: N / 2 + 1 }, (_, k) => Math.hypot(out[2 * k]!, out[2 * k + 1]!));
    const scale = Math.max(...ref);
    for (let k = 0; k <= N / 2; k++) expect(Math.abs(m[k]! - ref[k]!)).toBeLessThan(1e-5 * scale);
  });
});

test('power and a band limit: the squared magnitudes of the first bins only', () => {
  const x = Float32Array.from({ length: 4096 }, (_, i) => Math.sin(i / 3) + 0.5 * Math.sin(i / 11));
  const full = spectra(x, 1024, 256);
  const power = spectra(x, 1024, 256, { power: true, bins: 100 });
  expect(power).toHaveLength(full.length);
  power.forEach((p, f) => {
    expect(p).toHaveLength(100);
    for (let k = 0; k < 100; k++) expect(p[k]).toBeCloseTo(full[f]![k]! ** 2, 0);
  });
});
