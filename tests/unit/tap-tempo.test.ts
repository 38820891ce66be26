// Tap tempo: the tempo of taps, robust to a stray or a missed tap.
import { tapTempo } from '@/audio/practice/tap-tempo';

describe('tap tempo', () => {
  const taps = (bpm: number, n: number, start = 1) => Array.from({ length: n }, (_, i) => start + (60 / bpm) * i);

  test('steady taps give their tempo', () => {
    expect(tapTempo(taps(96, 8))!.bpm).toBe(96);
  });

  test('human jitter of ±15 ms still reads within 1 BPM', () => {
    const jitter = [0.012, -0.008, 0.015, -0.013, 0.004, -0.011, 0.009, -0.002];
    const t = taps(132, 8).map((x, i) => x + jitter[i]!);
    expect(Math.abs(tapTempo(t)!.bpm - 132)).toBeLessThanOrEqual(1);
  });

  test('one stray extra tap between beats is left out', () => {
    const t = taps(120, 8);
    t.splice(4, 0, t[3]! + 0.21);
    const r = tapTempo(t)!;
    expect(r.bpm).toBe(120);
    expect(r.dropped).toBe(1);
  });

  test('a missed tap (one gap of two beats) does not halve the tempo', () => {
    const t = taps(100, 9);
    t.splice(5, 1);
    expect(tapTempo(t)!.bpm).toBe(100);
  });

  test('too few taps give no tempo', () => {
    expect(tapTempo([1, 1.5, 2])).toBeNull();
    expect(tapTempo([])).toBeNull();
  });
});
