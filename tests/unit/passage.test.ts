// Passages on the beat grid and looping on a straight timeline; on grids whose truth is
// exact by construction (a steady 120 BPM in 4/4 with a one-beat pickup).
import {
  barAt,
  barContaining,
  barsToRegion,
  beatInBar,
  beatsBetween,
  describePassage,
  loopPass,
  skipBar,
  snapPassage,
  wrapIntoLoop,
} from '@/audio/practice/passage';
import { clicksBetween, PlaybackMap } from '@/audio/playback/click';
import { loopedSource } from '@/audio/playback/stretch';

// Beat 0 at 0.5 s is a pickup; bar 1 starts at 1.0 s; bars are 2 s long.
const beats = Array.from({ length: 41 }, (_, i) => 0.5 + i * 0.5);
const downbeats = beats.filter((_, i) => i >= 1 && (i - 1) % 4 === 0);
const grid = { beats, downbeats, durationSec: 21.5 };

describe('bars on the grid', () => {
  test('bar numbers start at the first downbeat; the pickup is bar 0', () => {
    expect(barAt(0.7, downbeats)).toBe(0);
    expect(barAt(1.0, downbeats)).toBe(1);
    expect(barAt(4.99, downbeats)).toBe(2);
    expect(barAt(5.0, downbeats)).toBe(3);
  });

  test('the beat within the bar: the pickup is beat 1 of bar 0, then 1–4 in every bar', () => {
    expect(beatInBar(0.2, beats, downbeats)).toBe(0);
    expect(beatInBar(0.6, beats, downbeats)).toBe(1);
    expect(beatInBar(1.0, beats, downbeats)).toBe(1);
    expect(beatInBar(2.7, beats, downbeats)).toBe(4);
    expect(beatInBar(3.1, beats, downbeats)).toBe(1);
  });

  test('skipping forward lands on the next bar line; back goes to this bar, or the one before when just past it', () => {
    expect(skipBar(1.7, grid, 1)).toBe(3);
    expect(skipBar(3.9, grid, -1)).toBe(3);
    expect(skipBar(3.2, grid, -1)).toBe(1);
    expect(skipBar(0.3, grid, -1)).toBe(0);
  });

  test('the bar that holds a time', () => {
    expect(barContaining(4.2, grid)).toEqual({ start: 3, end: 5 });
    expect(barContaining(0.2, grid)).toEqual({ start: 1, end: 3 });
  });
});

describe('a passage snapped to the grid', () => {
  test('a rough drag snaps to the nearest bar lines and reads as bars', () => {
    const p = snapPassage(grid, 5.3, 2.8, 'bar')!;
    expect(p).toEqual({ start: 3, end: 5 });
    expect(describePassage(p, downbeats)).toBe('bar 2');
    const q = snapPassage(grid, 3.1, 8.7, 'bar')!;
    expect(q).toEqual({ start: 3, end: 9 });
    expect(describePassage(q, downbeats)).toBe('bars 2–4');
  });

  test('snapping to beats; a tap (no drag) still gives one unit', () => {
    expect(snapPassage(grid, 2.26, 3.74, 'beat')).toEqual({ start: 2.5, end: 3.5 });
    expect(snapPassage(grid, 2.2, 2.2, 'beat')).toEqual({ start: 2, end: 2.5 });
  });

  test('a passage off the bar lines reads as clock times', () => {
    expect(describePassage({ start: 2.5, end: 3.5 }, downbeats)).toBe('0:02.5–0:03.5');
  });
});

describe('looping on a straight timeline', () => {
  const loop = { start: 3, end: 5 };

  test('virtual time wraps into the loop and counts the passes', () => {
    expect(wrapIntoLoop(4, loop)).toBe(4);
    expect(wrapIntoLoop(5.5, loop)).toBeCloseTo(3.5, 9);
    expect(wrapIntoLoop(9.25, loop)).toBeCloseTo(3.25, 9);
    expect(loopPass(4.9, loop)).toBe(0);
    expect(loopPass(5, loop)).toBe(1);
    expect(loopPass(9.1, loop)).toBe(3);
  });

  test("each pass clicks the loop's four beats again, the bar's first accented, on the right playback times", () => {
    // Played at 0.8 × from the loop's start at context time 10.
    const map = new PlaybackMap(10, 3, 0.8);
    const clicks = clicksBetween(map, beats, downbeats, 10, 10 + (3 * 2) / 0.8, loop);
    expect(clicks).toHaveLength(12);
    expect(clicks.map((c) => c.accent)).toEqual([
      true,
      false,
      false,
      false,
      true,
      false,
      false,
      false,
      true,
      false,
      false,
      false,
    ]);
    for (let i = 1; i < clicks.length; i++) expect(clicks[i]!.time - clicks[i - 1]!.time).toBeCloseTo(0.5 / 0.8, 6);
    // Every click lands on a grid beat once folded back into the loop.
    for (const c of clicks) expect(wrapIntoLoop(map.recordingTime(c.time), loop)).toBeCloseTo(beats[c.beat]!, 6);
  });

  test('beats before the loop play once, then the loop repeats', () => {
    const at = beatsBetween({ beats, downbeats }, loop, 2, 7).map((b) => b.at);
    expect(at).toEqual([2, 2.5, 3, 3.5, 4, 4.5, 5, 5.5, 6, 6.5]);
  });

  test('the looped source reads the region end to start, sample for sample', () => {
    const left = Float32Array.from({ length: 100 }, (_, i) => i);
    const src = loopedSource({ left, right: left }, { startFrame: 20, endFrame: 30 });
    const out = new Float32Array(2 * 25);
    src.extract(out, 25, 25);
    const got = Array.from({ length: 25 }, (_, i) => out[2 * i]);
    expect(got).toEqual([
      25, 26, 27, 28, 29, 20, 21, 22, 23, 24, 25, 26, 27, 28, 29, 20, 21, 22, 23, 24, 25, 26, 27, 28, 29,
    ]);
  });
});

describe('bars as a region of the recording', () => {
  // The grid above: bar 1 starts at 1.0 s and bars are 2 s long (10 downbeats, the last at 19.0 s).
  test('bars 2–3 run from the downbeat of bar 2 to that of bar 4', () => {
    expect(barsToRegion(2, 3, downbeats, 21.5)).toEqual({ start: 3, end: 7 });
  });
  test('the last bar ends with the recording; bars outside the grid give nothing', () => {
    expect(barsToRegion(downbeats.length, downbeats.length, downbeats, 21.5)).toEqual({ start: 19, end: 21.5 });
    expect(barsToRegion(0, 2, downbeats, 21.5)).toBeNull();
    expect(barsToRegion(3, 2, downbeats, 21.5)).toBeNull();
    expect(barsToRegion(40, 41, downbeats, 21.5)).toBeNull();
  });
});
