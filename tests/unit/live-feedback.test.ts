// Play-along feedback and latency calibration on onset times that are exact by construction.
import {
  LiveFeedback,
  nearestClick,
  OFFSET_TOLERANCE_MS,
  playState,
  runningTempo,
  TEMPO_TOLERANCE_PCT,
} from '@/audio/live/feedback';
import { calibrate } from '@/audio/live/calibration';
import { steadyThenRushing } from '@/fixtures/live-takes';

const grid = { start: 10, bpm: 120 };

test('an onset is placed against its nearest click, early negative and late positive, in ms', () => {
  expect(nearestClick(10.5 - 0.02, grid)).toEqual({ beat: 1, offsetMs: expect.closeTo(-20, 6) });
  expect(nearestClick(11.0 + 0.013, grid)).toEqual({ beat: 2, offsetMs: expect.closeTo(13, 6) });
  // Before the grid: beat 0, however early.
  expect(nearestClick(9.5, grid).beat).toBe(0);
});

test('the running tempo spans the last eight intervals and survives a missed beat', () => {
  // 9 beats at 0.5 s then 9 at 0.4 s: the last eight intervals are all 0.4 s = 150 BPM.
  const marks = [
    ...Array.from({ length: 9 }, (_, k) => ({ beat: k, time: k * 0.5 })),
    ...Array.from({ length: 8 }, (_, k) => ({ beat: 9 + k, time: 4 + (k + 1) * 0.4 })),
  ];
  expect(runningTempo(marks)).toBeCloseTo(150, 6);
  expect(runningTempo(marks.slice(0, 9))).toBeCloseTo(120, 6);
  // Beat 5 not played: beats 4→6 count as two intervals, not one.
  const gap = marks.slice(0, 9).filter((m) => m.beat !== 5);
  expect(runningTempo(gap)).toBeCloseTo(120, 6);
  expect(runningTempo(marks.slice(0, 1))).toBeNull();
});

test('the state follows the stated tolerances: offset first, then the running tempo', () => {
  expect(playState(-(OFFSET_TOLERANCE_MS + 1), 120, 120)).toBe('rushing');
  expect(playState(OFFSET_TOLERANCE_MS + 1, 120, 120)).toBe('dragging');
  expect(playState(0, 120 * (1 + (TEMPO_TOLERANCE_PCT + 0.5) / 100), 120)).toBe('rushing');
  expect(playState(0, 120 * (1 - (TEMPO_TOLERANCE_PCT + 0.5) / 100), 120)).toBe('dragging');
  expect(playState(-(OFFSET_TOLERANCE_MS - 1), 120 * (1 + (TEMPO_TOLERANCE_PCT - 0.5) / 100), 120)).toBe('steady');
  expect(playState(0, null, 120)).toBe('steady');
});

test('a take that starts to rush reads rushing on the first rushed beat, with its offsets to the millisecond', () => {
  // 12 beats on the click, then each 30 ms earlier than the last (-30, -60, …).
  const { times, offsetsMs } = steadyThenRushing(120, 12, 6, 30, grid.start + 2);
  const live = new LiveFeedback(grid, 4);
  const marks = times.map((t) => live.add(t)!);
  marks.forEach((m, i) => {
    expect(m.beat).toBe(4 + i);
    expect(m.offsetMs).toBeCloseTo(offsetsMs[i]!, 6);
  });
  expect(marks.slice(0, 12).every((m) => m.state === 'steady')).toBe(true);
  expect(marks.slice(12).every((m) => m.state === 'rushing')).toBe(true);
  expect(marks[11]!.bpm).toBeCloseTo(120, 6);
  expect(marks[17]!.bpm!).toBeGreaterThan(120);
});

test('count-in beats and a second onset on the same beat get no mark', () => {
  const live = new LiveFeedback(grid, 4);
  expect(live.add(grid.start + 0.5)).toBeNull();
  expect(live.add(grid.start + 2)).not.toBeNull();
  expect(live.add(grid.start + 2.1)).toBeNull();
  expect(live.marks).toHaveLength(1);
});

describe('calibration', () => {
  test('the latency is the median offset of the clicks coming back, one stray onset ignored', () => {
    const clicks = Array.from({ length: 8 }, (_, k) => grid.start + 2 + k * 0.5);
    const back = clicks.map((t, k) => t + 0.062 + (k % 2 ? 0.001 : -0.001));
    const stray = grid.start + 2.5 + 0.2;
    const r = calibrate(
      [...back, stray].sort((a, b) => a - b),
      grid,
      4,
    );
    expect(r.ok).toBe(true);
    if (r.ok) {
      expect(r.calibration.latencyMs).toBeCloseTo(62, 6);
      expect(r.calibration.used).toBe(8);
      expect(r.calibration.spreadMs).toBeCloseTo(1, 6);
    }
  });

  test('too few onsets or too uneven ones are refused with a reason in plain words', () => {
    const few = calibrate([grid.start + 2.05, grid.start + 2.55], grid, 4);
    expect(few).toEqual({ ok: false, reason: expect.stringContaining('Only 2 of the clicks') });
    const uneven = Array.from({ length: 8 }, (_, k) => grid.start + 2 + k * 0.5 + (k % 2 ? 0.15 : -0.1));
    expect(calibrate(uneven, grid, 4)).toEqual({ ok: false, reason: expect.stringContaining('too unevenly') });
  });
});
