// Tempo per bar on beat grids built by hand, whose tempos follow from the definition of BPM (beats per minute:
// a beat every 60 / BPM seconds, common practice) and of a bar in a meter (4/4: four beats, 3/4: three; common
// practice). Every expected figure below is arithmetic on those grids, worked in the comments.
import { smoothTempo, tempoByBar, type BarTempo } from '@/audio/practice/tempo-by-bar';

/** A grid from beat intervals (seconds), a downbeat every `perBar` beats from beat `firstDownbeat`. */
function grid(intervals: number[], perBar: number, firstDownbeat = 0, startAt = 0.5) {
  const beats = [startAt];
  for (const d of intervals) beats.push(beats[beats.length - 1]! + d);
  const downbeats = beats.filter((_, i) => i >= firstDownbeat && (i - firstDownbeat) % perBar === 0);
  return { beats, downbeats, durationSec: beats[beats.length - 1]! + 1 };
}

const bpms = (bars: BarTempo[]) => bars.map((b) => b.bpm);

test('a steady 120 BPM 4/4 grid reads 120 in every bar, numbered from the first downbeat', () => {
  // One pickup beat, then 8 bars of 4 beats at 0.5 s (60 / 120) and the final downbeat: 1 + 32 intervals.
  const g = grid(Array(33).fill(0.5), 4, 1);
  const bars = tempoByBar(g);
  // 4 beats × 60 / 2.0 s = 120 in each of the 8 full bars; the last downbeat alone is a bar of one beat with
  // no tempo. The pickup (bar 0) is left out, so the first bar is bar 1 at the first downbeat.
  expect(bars).toHaveLength(8);
  expect(bars[0]).toEqual({ bar: 1, start: g.downbeats[0], beats: 4, bpm: 120 });
  expect(bars.map((b) => b.bar)).toEqual([1, 2, 3, 4, 5, 6, 7, 8]);
  for (const b of bars) expect(b.bpm).toBeCloseTo(120, 9);
});

test('a 3/4 grid at 150 BPM reads 150 in every bar of three beats', () => {
  // 6 bars of 3 beats at 0.4 s (60 / 150) and the last bar's 3 beats: bar 7 is measured over its own two
  // intervals, 2 × 60 / 0.8 s = 150.
  const g = grid(Array(20).fill(0.4), 3);
  const bars = tempoByBar(g);
  expect(bars).toHaveLength(7);
  for (const b of bars) {
    expect(b.beats).toBe(3);
    expect(b.bpm).toBeCloseTo(150, 9);
  }
});

test('a linear ramp from 90 to 120 BPM rises bar by bar, first ≈ 90 and last ≈ 120 within 1 BPM', () => {
  // 128 beat intervals whose tempo rises evenly from 90 to 120 BPM (30 / 127 ≈ 0.236 BPM an interval), 32 bars
  // of 4/4 and a final downbeat. By hand: bar 1 holds intervals at 90, 90.24, 90.47, 90.71 BPM, so it lasts
  // 60/90 + 60/90.24 + 60/90.47 + 60/90.71 ≈ 2.6562 s and reads 4 × 60 / 2.6562 ≈ 90.35; bar 32 holds 119.29,
  // 119.53, 119.76, 120 BPM, lasts ≈ 2.0059 s and reads ≈ 119.65.
  const intervals = Array.from({ length: 128 }, (_, k) => 60 / (90 + (30 * k) / 127));
  const bars = tempoByBar(grid(intervals, 4));
  expect(bars).toHaveLength(32);
  expect(bars[0]!.bpm).toBeCloseTo(90.35, 1);
  expect(bars[31]!.bpm).toBeCloseTo(119.65, 1);
  expect(Math.abs(bars[0]!.bpm - 90)).toBeLessThan(1);
  expect(Math.abs(bars[31]!.bpm - 120)).toBeLessThan(1);
  for (let i = 1; i < bars.length; i++) expect(bars[i]!.bpm).toBeGreaterThan(bars[i - 1]!.bpm);
});

test('one bar stretched by 10 % reads 10 % slower in that bar only', () => {
  // 120 BPM 4/4, bar 3's four beats 0.55 s apart instead of 0.5: it lasts 2.2 s and reads 4 × 60 / 2.2 =
  // 109.09 = 120 / 1.1; every other bar still lasts 2.0 s and reads 120.
  const intervals = Array.from({ length: 24 }, (_, k) => (k >= 8 && k < 12 ? 0.55 : 0.5));
  const bars = tempoByBar(grid(intervals, 4));
  expect(bars).toHaveLength(6);
  bars.forEach((b) => expect(b.bpm).toBeCloseTo(b.bar === 3 ? 120 / 1.1 : 120, 9));
});

test('no beats, one beat, or beats without a downbeat give no bars', () => {
  expect(tempoByBar({ beats: [], downbeats: [], durationSec: 0 })).toEqual([]);
  expect(tempoByBar({ beats: [1.2], downbeats: [1.2], durationSec: 3 })).toEqual([]);
  expect(tempoByBar({ beats: [0.5, 1, 1.5], downbeats: [], durationSec: 3 })).toEqual([]);
});

describe('smoothing over a window of bars (centred moving median)', () => {
  const at = (values: number[]): BarTempo[] => values.map((bpm, i) => ({ bar: i + 1, start: i * 2, beats: 4, bpm }));

  test('one mis-tracked bar (read at double speed) disappears and its neighbours keep their tempo', () => {
    // Median of {100, 200, 100} is 100: the outlier is voted out.
    expect(bpms(smoothTempo(at([100, 100, 100, 200, 100, 100, 100]), 3))).toEqual([100, 100, 100, 100, 100, 100, 100]);
  });

  test('a change of tempo stays a step; the window shrinks at the ends', () => {
    // Over 5 bars: bar 3 sees {100, 100, 100, 110, 110} → 100, bar 4 sees {100, 100, 110, 110, 110} → 110.
    // Bar 1 sees bars 1–3 only.
    expect(bpms(smoothTempo(at([100, 100, 100, 110, 110, 110]), 5))).toEqual([100, 100, 100, 110, 110, 110]);
  });

  test('a window of one bar (or an even one, widened to stay centred) follows the definition', () => {
    expect(bpms(smoothTempo(at([90, 120, 100]), 1))).toEqual([90, 120, 100]);
    // Window 2 → 3: bar 2 sees {90, 120, 100} → 100; bar 1 sees {90, 120} → 105.
    expect(bpms(smoothTempo(at([90, 120, 100]), 2))).toEqual([105, 100, 110]);
  });
});
