// Play-along feedback and latency calibration on onset times that are exact by construction.
import {
  LiveFeedback,
  nearestClick,
  OFFSET_TOLERANCE_MS,
  playState,
  ReferenceGrid,
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

describe('against a reference as it is heard (beats at any spacing)', () => {
  /** A grid of the given context times, each labelled with its place in the list. */
  const gridOf = (times: number[]) => {
    const g = new ReferenceGrid<number>();
    g.extend(times.map((time, i) => ({ time, label: i })));
    return g;
  };

  test('the nearest known beat, never one the grid does not know yet', () => {
    const g = gridOf([1, 1.5, 2.2]);
    expect(g.nearest(1.24)).toEqual({ beat: 0, time: 1 });
    expect(g.nearest(1.26)).toEqual({ beat: 1, time: 1.5 });
    // Past the last known beat by more than half the last interval (0.35 s): the next beat is not known.
    expect(g.nearest(2.2 + 0.34)).toEqual({ beat: 2, time: 2.2 });
    expect(g.nearest(2.2 + 0.36)).toBeNull();
    // Before the first beat by more than half the first interval (a count-in onset): no beat.
    expect(g.nearest(0.76)).toEqual({ beat: 0, time: 1 });
    expect(g.nearest(0.74)).toBeNull();
    expect(new ReferenceGrid().nearest(1)).toBeNull();
  });

  test('a tempo change: the target follows the beats heard, and a player who keeps the old tempo rushes at once', () => {
    // Five beats at 120 BPM (0.5 s apart), then the reference slows to 100 BPM (0.6 s apart): worked by hand.
    const times = [0, 0.5, 1, 1.5, 2, 2.6, 3.2, 3.8, 4.4, 5, 5.6, 6.2, 6.8];
    const onGrid = new LiveFeedback(gridOf(times));
    const marks = times.map((t) => onGrid.add(t)!);
    marks.forEach((m, i) => {
      expect(m.beat).toBe(i);
      expect(m.offsetMs).toBeCloseTo(0, 9);
      // Played exactly as heard: the running tempo is the target, whatever the reference does.
      expect(m.bpm ?? m.targetBpm).toBeCloseTo(m.targetBpm, 9);
      expect(m.state).toBe('steady');
    });
    expect(marks[0]!.targetBpm).toBeCloseTo(120, 9);
    // Beats 0–8 span 2 s + 4 × 0.6 s = 4.4 s: 8 × 60 / 4.4 = 109.09 BPM.
    expect(marks[8]!.targetBpm).toBeCloseTo(480 / 4.4, 9);
    // Beats 4–12 are all 0.6 s apart: 100 BPM.
    expect(marks[12]!.targetBpm).toBeCloseTo(100, 9);

    // Still at 120 after the change: the onset at 2.5 s is nearest beat 5 (2.6 s), 100 ms early.
    const kept = new LiveFeedback(gridOf(times));
    const played = [0, 0.5, 1, 1.5, 2, 2.5, 3, 3.5].map((t) => kept.add(t)!);
    expect(played.slice(0, 5).every((m) => m.state === 'steady')).toBe(true);
    expect(played[5]).toMatchObject({ beat: 5, state: 'rushing' });
    expect(played[5]!.offsetMs).toBeCloseTo(-100, 9);
  });

  test('a loop wrap: the beats repeat with an uneven gap and the running tempo counts across it', () => {
    // A passage of four beats 0.5 s apart whose end lies 0.7 s after its last beat: each pass is 2.2 s long.
    const pass = [0, 0.5, 1, 1.5];
    const g = new ReferenceGrid<string>();
    for (let k = 0; k < 3; k++) g.extend(pass.map((b, i) => ({ time: 10 + k * 2.2 + b, label: `1.${i + 1}` })));
    expect(g.size).toBe(12);
    // The second pass's first beat is bar 1, beat 1 again, at 12.2 s.
    expect(g.labelOf(4)).toBe('1.1');
    expect(g.timeOf(4)).toBeCloseTo(12.2, 9);
    const live = new LiveFeedback(g);
    // Played on every beat, the wrap's beat 8 ms late.
    const marks = Array.from({ length: 12 }, (_, i) => live.add(g.timeOf(i)! + (i === 4 ? 0.008 : 0))!);
    expect(marks.map((m) => m.beat)).toEqual(Array.from({ length: 12 }, (_, i) => i));
    expect(marks[4]!.offsetMs).toBeCloseTo(8, 9);
    // Beats 0–8 span two passes (4.4 s): 480 / 4.4 BPM expected; played as heard, so the same.
    expect(marks[8]!.targetBpm).toBeCloseTo(480 / 4.4, 9);
    expect(marks[8]!.bpm).toBeCloseTo(480 / 4.4, 9);
    expect(marks.every((m) => m.state === 'steady')).toBe(true);
    // Against a fixed 120 BPM the same playing would read 9 % slow: dragging, which is wrong for a loop.
    expect(playState(0, marks[8]!.bpm, 120)).toBe('dragging');
  });

  test('beats learnt ahead are forgotten from a tempo change on and learnt anew, keeping their numbers', () => {
    const g = new ReferenceGrid<number>();
    g.extend([0, 0.5, 1, 1.5, 2, 2.5].map((time, i) => ({ time, label: i })));
    // Asked again for the same span: nothing doubled.
    g.extend([2, 2.5].map((time, i) => ({ time, label: 4 + i })));
    expect(g.size).toBe(6);
    // The tempo changed at 1.8 s: the beats after it (2, 2.5) are heard later now.
    g.dropFrom(1.8);
    expect(g.knownUntil).toBe(1.5);
    g.extend([2.1, 2.7].map((time, i) => ({ time, label: 4 + i })));
    expect(g.timeOf(4)).toBe(2.1);
    expect(g.timeOf(5)).toBe(2.7);
    expect(g.labelOf(5)).toBe(5);
  });
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
