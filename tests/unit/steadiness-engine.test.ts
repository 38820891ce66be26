// The steadiness report end to end: click takes rendered from known tempo maps (a click on every beat, louder on
// each bar's first, so the truth is known by construction), through the tempo engine, then the report on the
// grid the engine found. The tolerances are the acceptance figures.
import { analyse } from '@/audio/analysis/analyse';
import { steadiness } from '@/audio/practice/steadiness';
import { clickTrack, RATE } from './signals';

/** Beats whose k-th interval is played at bpmOf(k), from 0.5 s; accents on every 4th beat (4/4). */
function clickTake(bpmOf: (k: number) => number, intervals: number) {
  const beats = [0.5];
  for (let k = 0; k < intervals; k++) beats.push(beats[beats.length - 1]! + 60 / bpmOf(k));
  const durationSec = beats[beats.length - 1]! + 1.5;
  const accents = new Set(beats.map((_, i) => i).filter((i) => i % 4 === 0));
  return { beats, samples: clickTrack(beats, durationSec, RATE, accents) };
}

/** The take's true beat times, the beats the engine found, and the steadiness report on them. */
async function analysedTake(bpmOf: (k: number) => number, intervals: number, referenceBpm?: number) {
  const { beats, samples } = clickTake(bpmOf, intervals);
  const a = await analyse(samples, RATE);
  // The engine's first downbeat is the take's first accented beat: bar 1 is the bar the tempo map calls bar 1.
  expect(Math.abs(a.downbeats[0]! - beats[0]!)).toBeLessThan(0.05);
  const report = steadiness({ beats: a.beats, downbeats: a.downbeats, durationSec: a.durationSec }, { referenceBpm });
  return { truth: beats, found: a.beats, report };
}

const reportOf = async (bpmOf: (k: number) => number, intervals: number, referenceBpm?: number) =>
  (await analysedTake(bpmOf, intervals, referenceBpm)).report;

test('a steady 120 BPM take reads stability near zero and drift within ±0.5 %', async () => {
  const r = await reportOf(() => 120, 96, 120);
  expect(Math.abs(r.driftPct!)).toBeLessThan(0.5);
  // Near zero: the engine's beat times are quantised to its analysis frames (about 1 % of a beat here).
  expect(r.stabilityPct!).toBeLessThan(2);
  expect(r.regions).toEqual([]);
});

test('a take that rushes by 4 % reads 4 ± 0.5 %', async () => {
  // 8 bars at 100, 8 bars pressing on evenly to 104, 8 bars at 104.
  const r = await reportOf((k) => (k < 32 ? 100 : k < 64 ? 100 + (4 * (k - 32)) / 32 : 104), 96, 100);
  expect(Math.abs(r.driftPct! - 4)).toBeLessThan(0.5);
});

test('a ramp from 90 to 120 BPM starts at 90 ± 2 and ends at 120 ± 2', async () => {
  const r = await reportOf((k) => 90 + (30 * k) / 127, 128);
  expect(Math.abs(r.startBpm! - 90)).toBeLessThan(2);
  expect(Math.abs(r.endBpm! - 120)).toBeLessThan(2);
});

test('a ritardando to −20 % and return is found as one slower region at bars 9–12 (±1 bar), no beat slipped', async () => {
  // 20 bars at 120; bars 9–12 slow along half a cosine to 96 (−20 %) and come back: up to 4 % a beat at the
  // steepest. The tracker lets the beat interval move from beat to beat (beats.ts); with the interval held to
  // a tempo path read over 8-second windows (engine 4) it kept its period here and slipped two beats.
  const bpmOf = (k: number) => (k >= 32 && k < 48 ? 120 - 24 * Math.sin((Math.PI * (k - 32 + 0.5)) / 16) : 120);
  const { truth, found, report: r } = await analysedTake(bpmOf, 80, 120);
  expect(r.regions).toHaveLength(1);
  expect(r.regions[0]!.direction).toBe('slower');
  expect(Math.abs(r.regions[0]!.firstBar - 9)).toBeLessThanOrEqual(1);
  expect(Math.abs(r.regions[0]!.lastBar - 12)).toBeLessThanOrEqual(1);
  // Every beat of the take found within 50 ms (a quarter of a sixteenth at 120), and no beat added.
  expect(found).toHaveLength(truth.length);
  for (const t of truth) expect(Math.min(...found.map((b) => Math.abs(b - t)))).toBeLessThan(0.05);
});

test('a shallower ritardando (−13 %) and return is found as one slower region at bars 9–12 (±1 bar)', async () => {
  const bpmOf = (k: number) => (k >= 32 && k < 48 ? 120 - 16 * Math.sin((Math.PI * (k - 32 + 0.5)) / 16) : 120);
  const r = await reportOf(bpmOf, 80, 120);
  expect(r.regions).toHaveLength(1);
  expect(r.regions[0]!.direction).toBe('slower');
  expect(Math.abs(r.regions[0]!.firstBar - 9)).toBeLessThanOrEqual(1);
  expect(Math.abs(r.regions[0]!.lastBar - 12)).toBeLessThanOrEqual(1);
});
