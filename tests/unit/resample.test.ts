// Resampling to the analysis rate (audio/analysis/resample.ts): a tone in the pass band keeps its frequency
// and level, a tone above the new Nyquist frequency is removed rather than folded back (aliased) into the
// band, at the common rates (one precomputed phase for 44 100 Hz, 147 for 48 000 Hz) and at a rate whose
// phases are computed tap by tap (44 056 Hz, an old video rate).
import { ANALYSIS_RATE, resample } from '@/audio/analysis/resample';
import { sineTone, zeroCrossingFrequency } from './signals';

const rms = (x: Float32Array, from: number, to: number) => {
  let s = 0;
  for (let i = from; i < to; i++) s += x[i]! ** 2;
  return Math.sqrt(s / (to - from));
};

describe.each([44100, 48000, 44056])('from %p Hz to the analysis rate', (rate) => {
  test('a 1 kHz tone keeps its frequency (±0.1 %) and its level (±1 %; the sine has amplitude 0.5)', () => {
    const y = resample(sineTone(1000, 2, rate), rate, ANALYSIS_RATE);
    expect(y.length).toBe(Math.floor((2 * rate) / (rate / ANALYSIS_RATE)));
    // Away from the edges, where the filter reads past the ends of the signal.
    const a = Math.round(ANALYSIS_RATE / 10);
    const b = y.length - a;
    expect(Math.abs(zeroCrossingFrequency(y, ANALYSIS_RATE, a, b) / 1000 - 1)).toBeLessThan(0.001);
    expect(Math.abs(rms(y, a, b) / (0.5 * Math.SQRT1_2) - 1)).toBeLessThan(0.01);
  });

  test('an 8 kHz tone, above the new Nyquist frequency (5.5 kHz), is removed: at least 40 dB down', () => {
    const y = resample(sineTone(8000, 2, rate), rate, ANALYSIS_RATE);
    const a = Math.round(ANALYSIS_RATE / 10);
    expect(rms(y, a, y.length - a) / (0.5 * Math.SQRT1_2)).toBeLessThan(0.01);
  });
});
