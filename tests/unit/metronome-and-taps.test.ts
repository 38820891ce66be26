// Metronome marks, tempo-marking guides and tap tempo.
import { METRONOME_MARKS, markingsFor, nearestMark, nextMarkDown, nextMarkUp, TEMPO_MARKINGS } from '@/audio/practice/metronome';
import { tapTempo } from '@/audio/practice/tap-tempo';

describe('the mechanical metronome scale (as engraved on Maelzel-pattern metronomes; from memory)', () => {
  test('runs from 40 to 208 in 39 marks with the traditional steps', () => {
    expect(METRONOME_MARKS[0]).toBe(40);
    expect(METRONOME_MARKS[METRONOME_MARKS.length - 1]).toBe(208);
    expect(METRONOME_MARKS).toHaveLength(39);
    const steps = METRONOME_MARKS.slice(1).map((m, i) => m - METRONOME_MARKS[i]!);
    // 2 up to 60, 3 to 72, 4 to 120, 6 to 144, 8 to 208.
    expect(steps).toEqual([...Array(10).fill(2), ...Array(4).fill(3), ...Array(12).fill(4), ...Array(4).fill(6), ...Array(8).fill(8)]);
  });

  test.each([
    [60, 63, 58],
    [61, 63, 60],
    [100, 104, 96],
    [120, 126, 116],
    [121.5, 126, 120],
    [30, 40, 40],
    [208, 208, 200],
    [250, 208, 208],
  ])('from %p the next mark up is %p and down is %p', (bpm, up, down) => {
    expect(nextMarkUp(bpm)).toBe(up);
    expect(nextMarkDown(bpm)).toBe(down);
  });

  test('the nearest mark', () => {
    expect(nearestMark(125)).toBe(126);
    expect(nearestMark(99)).toBe(100);
  });
});

describe('tempo markings are overlapping guides', () => {
  test('a tempo can sit in two markings at once', () => {
    expect(markingsFor(115).map((m) => m.name)).toEqual(['Moderato', 'Allegretto']);
    expect(markingsFor(170).map((m) => m.name)).toEqual(['Vivace', 'Presto']);
  });
  test('Andante is a walking pace around 76–108 BPM (common practice)', () => {
    expect(markingsFor(92).map((m) => m.name)).toContain('Andante');
  });
  test('every range is well formed', () => {
    for (const m of TEMPO_MARKINGS) expect(m.lowBpm).toBeLessThan(m.highBpm);
  });
});

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
