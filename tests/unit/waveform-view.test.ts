// The waveform's drawing plan on exact grids: a 4-minute recording at 120 BPM in 4/4 (480 beats, 120 bars).
// Thinning ruler ticks and labels so they never overlap is common practice for time axes; the gap below which
// lines smear (6 px) is from memory.
import { waveformPeaks, PEAKS_PER_SECOND } from '@/audio/analysis/peaks';
import {
  columnsOf,
  DIGIT_PX,
  gridMarks,
  MIN_BEAT_GAP_PX,
  peakPyramid,
  windowAround,
  zoomLimits,
} from '@/components/waveform/view';

const durationSec = 240;
const beats = Array.from({ length: 480 }, (_, i) => i * 0.5);
const downbeats = beats.filter((_, i) => i % 4 === 0);

test('the pyramid halves the buckets per level and keeps the extremes', () => {
  // 8 buckets; one loud one in the middle.
  const minMax = [-0.1, 0.1, -0.1, 0.1, -0.1, 0.1, -0.9, 0.8, -0.1, 0.1, -0.1, 0.1, -0.1, 0.1, -0.1, 0.2];
  const levels = peakPyramid(minMax, 8);
  expect(levels.map((l) => l.minMax.length / 2)).toEqual([8, 4, 2, 1]);
  expect(Array.from(levels[3]!.minMax).map((v) => Math.round(v * 10) / 10)).toEqual([-0.9, 0.8]);
  // Columns over the second half read level 1's buckets: the loud one falls in column 1 of 4 over [0, 8).
  const cols = columnsOf(levels, 0, 8, 4);
  expect(cols.map((c) => Math.round(c.hi * 10) / 10)).toEqual([0.1, 0.8, 0.1, 0.2]);
});

test('zoomed out on a phone (340 px, whole song): no beat lines, bar numbers that never overlap', () => {
  const m = gridMarks(beats, downbeats, 0, durationSec, 340);
  expect(m.beats).toEqual([]);
  for (let i = 1; i < m.labels.length; i++) {
    const prevEnd = m.labels[i - 1]!.x + 3 + String(m.labels[i - 1]!.bar).length * DIGIT_PX;
    expect(m.labels[i]!.x).toBeGreaterThan(prevEnd);
  }
  // Bar 1 is always numbered; the step keeps four-bar phrases (1, 17, 33… or 1, 33, 65…).
  expect(m.labels[0]!.bar).toBe(1);
  expect([8, 16, 32]).toContain(m.labelEvery);
  for (let i = 1; i < m.bars.length; i++)
    expect(m.bars[i]!.x - m.bars[i - 1]!.x).toBeGreaterThanOrEqual(MIN_BEAT_GAP_PX);
});

test('zoomed in to two bars: every beat and every bar numbered', () => {
  const { min } = zoomLimits(durationSec, downbeats);
  expect(min).toBe(4); // two bars of 2 s
  const w = windowAround(113, min, durationSec); // bar 57 starts at 112 s
  const m = gridMarks(beats, downbeats, w.from, w.to, 340);
  expect(m.labelEvery).toBe(1);
  expect(m.labels.map((l) => l.bar)).toEqual([57, 58]);
  expect(m.beats.length).toBe(7); // 111 … 115 s: 9 beats, 2 of them bar lines (112 and 114 s)
});

test('the window stays inside the recording', () => {
  expect(windowAround(1, 10, 240)).toEqual({ from: 0, to: 10 });
  expect(windowAround(239, 10, 240)).toEqual({ from: 230, to: 240 });
  expect(windowAround(10, 500, 240)).toEqual({ from: 0, to: 240 });
});

test('peaks of a 10-minute file: 40 ms buckets, JSON small enough to fetch on a phone (size printed)', () => {
  const sampleRate = 8000;
  const samples = new Float32Array(600 * sampleRate);
  // A 2 Hz amplitude swell over noise-like values, so the numbers have their usual width in JSON.
  for (let i = 0; i < samples.length; i++)
    samples[i] = Math.sin(i * 0.37) * (0.3 + 0.6 * Math.abs(Math.sin((Math.PI * 2 * i) / sampleRate)));
  const peaks = waveformPeaks(samples, sampleRate);
  expect(peaks.buckets).toBe(600 * PEAKS_PER_SECOND);
  const bytes = JSON.stringify(peaks).length;
  console.log(`peaks of a 10-minute file: ${peaks.buckets} buckets, ${(bytes / 1024).toFixed(0)} KB of JSON`);
  // The pyramid reaches the whole file in one bucket.
  expect(peakPyramid(peaks.minMax, peaks.durationSec).at(-1)!.minMax.length).toBe(2);
});
