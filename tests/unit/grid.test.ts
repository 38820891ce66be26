// The player's corrections to the beat grid (audio/analysis/grid.ts) on exact signals: a click track whose
// click times are placed to the sample (tests/unit/signals.ts), analysed, then moved to half or double
// tempo, given another "one", and nudged. The expected grids follow from the definitions: half tempo keeps
// every other beat, double tempo puts a beat halfway between each two (common practice), and the bar keeps
// its number of beats, so bar lines move with the beats.
import { analyse } from '@/audio/analysis/analyse';
import { applyGridCorrections, beatsAtLevel, moveDownbeat, nudgeBeats } from '@/audio/analysis/grid';
import type { Analysis } from '@/shared/analysis';
import { clickTrack, RATE, steadyBeats } from './signals';

const truth = steadyBeats(120, 20);
const found = analyse(clickTrack(truth, 20), RATE);

/** A hand-made analysis: beats every 0.5 s from 1 s, 4/4, bars from the second beat. */
const plain: Analysis = {
  ...found,
  bpm: 120,
  beats: [1, 1.5, 2, 2.5, 3, 3.5, 4, 4.5, 5, 5.5],
  downbeats: [1.5, 3.5, 5.5],
  meter: '4/4',
  beatCount: 10,
  curve: [{ t: 2, bpm: 120 }],
  startBpm: 120,
  endBpm: 120,
};

test('the click track is found at 120 with every click a beat (the grid the corrections start from)', () => {
  expect(found.beatCount).toBe(truth.length);
  expect(found.bpm).toBeCloseTo(120, 0);
});

describe('half tempo', () => {
  const half = beatsAtLevel(plain, 'half');
  test('every other beat, keeping the ones bar lines fall on', () => {
    expect(half.beats).toEqual([1.5, 2.5, 3.5, 4.5, 5.5]);
    expect(half.bpm).toBe(60);
    expect(half.beatCount).toBe(5);
    expect(half.curve[0]!.bpm).toBe(60);
  });
  test('bar lines every four of the new beats (every other old bar line)', () => {
    expect(half.downbeats).toEqual([1.5, 5.5]);
  });
  test('on an analysed click track: every other click', () => {
    const h = beatsAtLevel(found, 'half');
    const one = found.beats.indexOf(found.downbeats[0]!);
    expect(h.beats).toEqual(found.beats.filter((_, i) => i % 2 === one % 2));
    expect(h.bpm).toBeCloseTo(found.bpm! / 2, 2);
  });
});

describe('double tempo', () => {
  const double = beatsAtLevel(plain, 'double');
  test('a beat inserted halfway between each two', () => {
    expect(double.beats).toEqual([1, 1.25, 1.5, 1.75, 2, 2.25, 2.5, 2.75, 3, 3.25, 3.5, 3.75, 4, 4.25, 4.5, 4.75, 5, 5.25, 5.5]);
    expect(double.bpm).toBe(240);
    expect(double.beatCount).toBe(19);
  });
  test('bar lines every four of the new beats, counted from an old bar line, in both directions', () => {
    expect(double.downbeats).toEqual([1.5, 2.5, 3.5, 4.5, 5.5]);
  });
  test('half of double gives the grid back', () => {
    expect(beatsAtLevel(double, 'half').beats).toEqual(plain.beats);
  });
  test('on an analysed click track the inserted beats sit halfway between the clicks within 5 ms', () => {
    const d = beatsAtLevel(found, 'double');
    for (let i = 1; i < d.beats.length - 1; i += 2) expect(Math.abs(d.beats[i]! - (truth[(i - 1) / 2]! + truth[(i + 1) / 2]!) / 2)).toBeLessThan(0.005);
  });
});

test('"this beat is one" moves the bar lines to that beat and every fourth from it', () => {
  const moved = moveDownbeat(plain, 2.04);
  expect(moved.downbeats).toEqual([2, 4]);
  expect(moved.beats).toEqual(plain.beats);
  // In 3/4, every third beat.
  expect(moveDownbeat({ ...plain, meter: '3/4' }, 1).downbeats).toEqual([1, 2.5, 4, 5.5]);
});

test('a nudge moves every beat and bar line by the same milliseconds', () => {
  const later = nudgeBeats(plain, 20);
  expect(later.beats).toEqual(plain.beats.map((b) => +(b + 0.02).toFixed(4)));
  expect(later.downbeats).toEqual([1.52, 3.52, 5.52]);
  const earlier = nudgeBeats(plain, -1200);
  // Beats pushed before the start of the recording are dropped.
  expect(earlier.beats[0]).toBeCloseTo(0.3, 6);
  expect(earlier.beatCount).toBe(9);
});

test('stored corrections applied to a fresh analysis give the corrected grid again', () => {
  const corrected = applyGridCorrections(plain, { level: 'half', nudgeMs: 10, downbeatAt: 2.5 });
  expect(corrected.beats).toEqual([1.51, 2.51, 3.51, 4.51, 5.51]);
  expect(corrected.downbeats).toEqual([2.51]);
  expect(corrected.bpm).toBe(60);
});
