// The steadiness report on beat times built from known tempo maps: every beat falls where the map puts it (a beat
// every 60 / BPM seconds, the definition of BPM, common practice; 4 beats a bar in 4/4, common practice), so the
// true start, end, drift and stray bars are known by construction and worked in the comments.
import {
  coefficientOfVariationPct,
  compareTakes,
  steadiness,
  steadinessSummary,
  theilSenAt,
  type IntendedChange,
} from '@/audio/practice/steadiness';

/** Beats whose k-th interval is played at bpmOf(k), a downbeat every 4 beats from the first. */
function take(bpmOf: (k: number) => number, intervals: number, jitterSec = 0, startAt = 0.5) {
  let seed = 12345;
  // A fixed linear congruential sequence (Numerical Recipes' constants): the same "human" wobble every run.
  const wobble = () => {
    seed = (seed * 1664525 + 1013904223) % 4294967296;
    return (seed / 4294967296 - 0.5) * 2 * jitterSec;
  };
  const exact = [startAt];
  for (let k = 0; k < intervals; k++) exact.push(exact[exact.length - 1]! + 60 / bpmOf(k));
  const beats = exact.map((t, i) => (i === 0 ? t : t + wobble()));
  const downbeats = beats.filter((_, i) => i % 4 === 0);
  return { beats, downbeats, durationSec: beats[beats.length - 1]! + 1 };
}

test('a steady take reads stability near zero and drift within ±0.5 %', () => {
  // 32 bars at 120 BPM with every beat moved by up to ±3 ms: a tight human player (Repp 2005 puts the timing
  // variability of skilled synchronisation at a few milliseconds to a few percent of the interval, from memory).
  const g = take(() => 120, 128, 0.003);
  const r = steadiness(g, { referenceBpm: 120 });
  expect(Math.abs(r.driftPct!)).toBeLessThan(0.5);
  expect(r.stabilityPct!).toBeLessThan(1.5);
  expect(Math.abs(r.startBpm! - 120)).toBeLessThan(1);
  expect(Math.abs(r.endBpm! - 120)).toBeLessThan(1);
  expect(r.regions).toEqual([]);
  // Exact beats: no variation at all.
  const exact = steadiness(
    take(() => 120, 128),
    { referenceBpm: 120 },
  );
  expect(exact.stabilityPct!).toBeCloseTo(0, 9);
  expect(exact.driftPct!).toBeCloseTo(0, 9);
  expect(steadinessSummary(exact)).toBe('Starts at 120, ends at 120 — the same tempo; every bar within 3 % of 120.');
});

test('a take that rushes by 4 % reads a drift of 4 ± 0.5 % and names the bars that run ahead', () => {
  // 12 bars at 100, then 8 bars pressing on evenly to 104 (32 intervals), then 12 bars at 104: 4 % faster.
  const bpmOf = (k: number) => (k < 48 ? 100 : k < 80 ? 100 + (4 * (k - 48)) / 32 : 104);
  const r = steadiness(take(bpmOf, 128, 0.002), { referenceBpm: 100 });
  expect(Math.abs(r.driftPct! - 4)).toBeLessThan(0.5);
  // Against 100 with ±3 %: from about bar 19 on the bars run ahead (smoothed ≥ 103).
  expect(r.regions).toHaveLength(1);
  expect(r.regions[0]!.direction).toBe('faster');
  expect(r.regions[0]!.lastBar).toBe(32);
  expect(steadinessSummary(r)).toMatch(/^Starts at 100, ends at 104 — 4 % faster; rushes in bars \d+–32\.$/);

  // The same 4 % as one even ramp over the whole take.
  const ramp = steadiness(
    take((k) => 100 + (4 * k) / 127, 128),
    { referenceBpm: 100 },
  );
  expect(Math.abs(ramp.driftPct! - 4)).toBeLessThan(0.5);
});

test('a ramp from 90 to 120 BPM starts at 90 ± 2 and ends at 120 ± 2', () => {
  // 128 intervals rising evenly from 90 to 120 (30 / 127 BPM an interval): bar 1 reads ≈ 90.35, bar 32 ≈ 119.65
  // (worked in tempo-by-bar.test.ts); the line through the first and last four bars reads the same there.
  const r = steadiness(take((k) => 90 + (30 * k) / 127, 128));
  expect(Math.abs(r.startBpm! - 90)).toBeLessThan(2);
  expect(Math.abs(r.endBpm! - 120)).toBeLessThan(2);
  expect(r.driftPct!).toBeGreaterThan(30);
});

test('a ritardando and return is one slower region at the right bars (±1 bar)', () => {
  // 24 bars at 120; bars 9–12 (intervals 32–47) slow along half a cosine to 96 (−20 %) and come back.
  const bpmOf = (k: number) => (k >= 32 && k < 48 ? 120 - 24 * Math.sin((Math.PI * (k - 32 + 0.5)) / 16) : 120);
  const r = steadiness(take(bpmOf, 96), { referenceBpm: 120 });
  expect(r.regions).toHaveLength(1);
  const [g] = r.regions;
  expect(g!.direction).toBe('slower');
  expect(Math.abs(g!.firstBar - 9)).toBeLessThanOrEqual(1);
  expect(Math.abs(g!.lastBar - 12)).toBeLessThanOrEqual(1);
  expect(steadinessSummary(r)).toMatch(/drags in bars (8|9|10)–(11|12|13)\.$/);
  // A wider tolerance than the dip (−20 %) finds nothing.
  expect(steadiness(take(bpmOf, 96), { referenceBpm: 120, tolerancePct: 25 }).regions).toEqual([]);
});

test('a region marked rubato leaves the figures unchanged by what happens inside it', () => {
  // Two takes at 120, identical outside bars 9–12. Inside, one is steady, the other swings freely between
  // 96 and 160 BPM; its intervals are rescaled so the four bars last the same 8 s, so every later beat falls at
  // the same time in both.
  const free = Array.from({ length: 16 }, (_, i) => 60 / (i % 3 === 0 ? 96 : i % 3 === 1 ? 160 : 110));
  const scale = 8 / free.reduce((a, b) => a + b, 0);
  const steadyTake = take(() => 120, 96);
  const freeTake = take((k) => (k >= 32 && k < 48 ? 60 / (free[k - 32]! * scale) : 120), 96);
  expect(freeTake.beats[96]).toBeCloseTo(steadyTake.beats[96]!, 9);
  // Bar 9 starts at beat 32 (0.5 + 32 × 0.5 = 16.5 s), bar 13 at 24.5 s.
  const marks: IntendedChange[] = [{ kind: 'rubato', startSec: 16.5, endSec: 24.5 }];

  const unmarked = steadiness(freeTake, { referenceBpm: 120 });
  // Unmarked, the free bars show: stability far from steady (a check that can fail).
  expect(unmarked.stabilityPct!).toBeGreaterThan(5);

  const a = steadiness(steadyTake, { referenceBpm: 120, intended: marks });
  const b = steadiness(freeTake, { referenceBpm: 120, intended: marks });
  for (const key of ['startBpm', 'endBpm', 'driftPct', 'stabilityPct', 'meanBpm'] as const)
    expect(b[key]!).toBeCloseTo(a[key]!, 9);
  expect(b.regions).toEqual(a.regions);
  expect(b.regions).toEqual([]);
  expect(b.intended).toEqual([{ ...marks[0], firstBar: 9, lastBar: 12 }]);
  expect(b.bars.filter((x) => x.intended === 'rubato').map((x) => x.bar)).toEqual([9, 10, 11, 12]);
  expect(b.countedBars).toBe(20);
});

test('a take held against a chosen tempo it never reaches drags throughout; against its own tempo it is steady', () => {
  // 16 bars at 100 against a chosen 120: every bar 16.7 % slow.
  const g = take(() => 100, 64);
  expect(steadiness(g, { referenceBpm: 120 }).regions).toMatchObject([
    { direction: 'slower', firstBar: 1, lastBar: 16 },
  ]);
  const own = steadiness(g);
  expect(own.referenceBpm).toBeCloseTo(100, 9);
  expect(own.regions).toEqual([]);
});

test('the summary names two places and counts the rest', () => {
  // 40 bars at 100 with four one-bar-wide bumps... widened to two bars each so a 1-bar window keeps them.
  const bumpBars = [5, 13, 21, 29];
  const bpmOf = (k: number) => (bumpBars.some((b) => k >= (b - 1) * 4 && k < (b + 1) * 4) ? 110 : 100);
  const r = steadiness(take(bpmOf, 160), { referenceBpm: 100, windowBars: 1 });
  expect(r.regions.map((g) => [g.firstBar, g.lastBar])).toEqual([
    [5, 6],
    [13, 14],
    [21, 22],
    [29, 30],
  ]);
  expect(steadinessSummary(r)).toBe(
    'Starts at 100, ends at 100 — the same tempo; rushes in bars 5–6, rushes in bars 13–14, 2 more places below.',
  );
});

test('Theil–Sen reads a line exactly and ignores one wild point among four', () => {
  // y = 2x + 1 at x = 1…4: the line at 1 is 3. With y(3) replaced by 50 the median slope is still 2 (four of
  // the six pairwise slopes do not involve the wild point… three of them are exactly 2).
  expect(
    theilSenAt(
      [1, 2, 3, 4].map((x) => ({ x, y: 2 * x + 1 })),
      1,
    ),
  ).toBeCloseTo(3, 9);
  const wild = [1, 2, 3, 4].map((x) => ({ x, y: x === 3 ? 50 : 2 * x + 1 }));
  expect(Math.abs(theilSenAt(wild, 1) - 3)).toBeLessThan(1);
});

test('the coefficient of variation is the population standard deviation over the mean', () => {
  // 90 and 110: mean 100, sd 10 → 10 %.
  expect(coefficientOfVariationPct([90, 110])).toBeCloseTo(10, 9);
  expect(coefficientOfVariationPct([100])).toBeNull();
});

test('two takes compared: the difference in how long they play and in mean tempo', () => {
  // 16 bars (64 intervals) at 100 BPM play 64 × 0.6 = 38.4 s; at 120 BPM 64 × 0.5 = 32 s: 6.4 s shorter,
  // 20 BPM (20 %) faster on average.
  const ga = take(() => 100, 64);
  const gb = take(() => 120, 64);
  const c = compareTakes({ grid: ga, report: steadiness(ga) }, { grid: gb, report: steadiness(gb) });
  expect(c.durationA).toBeCloseTo(38.4, 9);
  expect(c.durationDiffSec).toBeCloseTo(-6.4, 9);
  expect(c.meanDiffBpm!).toBeCloseTo(20, 9);
  expect(c.meanDiffPct!).toBeCloseTo(20, 9);
});
