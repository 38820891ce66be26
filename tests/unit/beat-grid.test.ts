// The felt grid on exact grids: 120 BPM (a beat every 0.5 s), 4/4, bar 1 at 1.0 s. What half-time and double
// time mean for a beat grid is common practice (half-time: the pulse on every other beat; double time: a pulse
// between each pair), as is counting bars from the beat a player calls one.
import {
  beatsAtLevel,
  downbeatsFrom,
  feltBeatCount,
  feltGrid,
  nudged,
  relationInWords,
} from '@/audio/practice/beat-grid';
import { analyse } from '@/audio/analysis/analyse';
import type { Analysis } from '@/shared/analysis';
import { clickTrack, RATE, steadyBeats } from './signals';

const beats = Array.from({ length: 17 }, (_, i) => 1 + i * 0.5); // 1.0 … 9.0 s
const downbeats = beats.filter((_, i) => i % 4 === 0); // 1, 3, 5, 7, 9
const found = { beats, downbeats, bpm: 120 };

test('half: every other beat, keeping the one nearest the beat called one', () => {
  expect(beatsAtLevel(beats, 'half', 1)).toEqual([1, 2, 3, 4, 5, 6, 7, 8, 9]);
  // One on the off-beat 1.5 s keeps the other half.
  expect(beatsAtLevel(beats, 'half', 1.52)).toEqual([1.5, 2.5, 3.5, 4.5, 5.5, 6.5, 7.5, 8.5]);
});

test('double: a beat halfway between each pair', () => {
  const d = beatsAtLevel(beats, 'double', 1);
  expect(d).toHaveLength(2 * beats.length - 1);
  expect(d.slice(0, 4)).toEqual([1, 1.25, 1.5, 1.75]);
});

test('bars are counted from the beat called one, both ways, with the beats per bar', () => {
  expect(downbeatsFrom(beats, 2.0, 4)).toEqual([2, 4, 6, 8]);
  expect(downbeatsFrom(beats, 2.5, 3)).toEqual([1, 2.5, 4, 5.5, 7, 8.5]);
});

test('nudge moves every time by the same amount, never before 0', () => {
  expect(nudged([0.01, 1, 2], -20)).toEqual([0, 0.98, 1.98]);
  expect(nudged([1, 2], 30)).toEqual([1.03, 2.03]);
});

test('as found with nothing changed is the engine grid itself', () => {
  const g = feltGrid(found, { beatLevel: 'as-found', barOneSec: null, nudgeMs: 0 }, 4);
  expect(g).toEqual({ beats, downbeats, bpm: 120 });
});

test('half level at 120 found: 60 BPM, a beat a second, 4 felt beats a bar (so a bar spans two found bars)', () => {
  const g = feltGrid(found, { beatLevel: 'half', barOneSec: null, nudgeMs: 0 }, 4);
  expect(g.bpm).toBe(60);
  expect(g.beats).toEqual([1, 2, 3, 4, 5, 6, 7, 8, 9]);
  expect(g.downbeats).toEqual([1, 5, 9]);
});

test('double level: 240 BPM and bars of four felt beats (one second each)', () => {
  const g = feltGrid(found, { beatLevel: 'double', barOneSec: null, nudgeMs: 0 }, 4);
  expect(g.bpm).toBe(240);
  expect(g.downbeats.slice(0, 3)).toEqual([1, 2, 3]);
});

test('"this beat is one" at 2.5 s moves bar 1 there; a nudge of +10 ms moves the whole grid', () => {
  const g = feltGrid(found, { beatLevel: 'as-found', barOneSec: 2.5, nudgeMs: 10 }, 4);
  // The beats before 2.5 s (1.0, 1.5, 2.0) are a pickup: no bar starts there.
  expect(g.downbeats.map((t) => Math.round(t * 1000))).toEqual([2510, 4510, 6510, 8510]);
  expect(g.beats[0]).toBeCloseTo(1.01, 9);
  expect(g.bpm).toBe(120);
});

test('felt beats: a 30 s recording found at 124 BPM (62 beats) that the player corrects to 120 holds 60 beats', () => {
  // By construction: 30 s at 120 BPM is 60 beats, at 124 BPM 62; the level halves or doubles what is felt.
  expect(feltBeatCount(62, 124, null, 'as-found')).toBe(62);
  expect(feltBeatCount(62, 124, 120, 'as-found')).toBeCloseTo(60, 9);
  expect(feltBeatCount(62, 124, 120, 'half')).toBeCloseTo(30, 9);
  expect(feltBeatCount(62, 124, null, 'double')).toBe(124);
  // At its own felt tempo it lasts as long as it does: 60 beats at 120 BPM, 30 beats at 60 BPM, both 30 s.
  expect((feltBeatCount(62, 124, 120, 'as-found') * 60) / 120).toBeCloseTo(30, 9);
  expect((feltBeatCount(62, 124, 120, 'half') * 60) / 60).toBeCloseTo(30, 9);
});

test('relations read in words', () => {
  expect(relationInWords(1.5)).toBe('one and a half times');
  expect(relationInWords(2 / 3)).toBe('two thirds');
  expect(relationInWords(0.5)).toBe('half');
  expect(relationInWords(1.23)).toBeNull();
});

describe('on an analysed click track (clicks placed to the sample, tests/unit/signals.ts)', () => {
  const truth = steadyBeats(120, 20);
  let analysed: Analysis;
  beforeAll(async () => {
    analysed = await analyse(clickTrack(truth, 20), RATE);
  });
  test('the engine finds every click as a beat at 120 (the grid the corrections start from)', () => {
    expect(analysed.beatCount).toBe(truth.length);
    expect(analysed.bpm).toBeCloseTo(120, 0);
  });
  test('half: every other click, keeping the first downbeat', () => {
    const one = analysed.downbeats[0]!;
    const parity = analysed.beats.indexOf(one) % 2;
    expect(beatsAtLevel(analysed.beats, 'half', one)).toEqual(analysed.beats.filter((_, i) => i % 2 === parity));
  });
  test('double: the inserted beats sit halfway between the clicks within 5 ms', () => {
    const d = beatsAtLevel(analysed.beats, 'double', analysed.downbeats[0]!);
    for (let i = 1; i < d.length - 1; i += 2)
      expect(Math.abs(d[i]! - (truth[(i - 1) / 2]! + truth[(i + 1) / 2]!) / 2)).toBeLessThan(0.005);
  });
});
