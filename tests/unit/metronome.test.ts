// Metronome marks and tempo-marking guides.
import {
  METRONOME_MARKS,
  markingsFor,
  nearestMark,
  nextMarkDown,
  nextMarkUp,
  TEMPO_MARKINGS,
} from '@/audio/practice/metronome';

describe('the mechanical metronome scale (as engraved on Maelzel-pattern metronomes; from memory)', () => {
  test('runs from 40 to 208 in 39 marks with the traditional steps', () => {
    expect(METRONOME_MARKS[0]).toBe(40);
    expect(METRONOME_MARKS[METRONOME_MARKS.length - 1]).toBe(208);
    expect(METRONOME_MARKS).toHaveLength(39);
    const steps = METRONOME_MARKS.slice(1).map((m, i) => m - METRONOME_MARKS[i]!);
    // 2 up to 60, 3 to 72, 4 to 120, 6 to 144, 8 to 208.
    expect(steps).toEqual([
      ...Array(10).fill(2),
      ...Array(4).fill(3),
      ...Array(12).fill(4),
      ...Array(4).fill(6),
      ...Array(8).fill(8),
    ]);
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
