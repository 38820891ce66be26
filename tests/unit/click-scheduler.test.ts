// The click scheduler on a stand-in audio context whose clock the test moves by hand, with jest's fake timers for
// the main thread's timer. Beat times by hand: at 120 BPM a beat lasts 60 / 120 = 0.5 s (common practice: BPM is
// beats per minute). What is checked is what the look-ahead pattern promises: every click is handed to the audio
// clock before it is due and no more than the look-ahead early, none twice, none dropped, and a click not yet
// heard can be taken back.
import { MetronomeTimeline } from '@/audio/playback/click';
import { ClickScheduler, LOOKAHEAD_SEC } from '@/client/click-scheduler';

interface Blip {
  at: number;
  /** Audio-clock time when it was handed over. */
  handedAt: number;
  stopped: boolean;
}

/** Just enough of a BaseAudioContext for scheduleBlip (client/click-sound.ts), recording each oscillator's start. */
function fakeContext() {
  const blips: Blip[] = [];
  const param = { value: 0, setValueAtTime() {}, linearRampToValueAtTime() {}, exponentialRampToValueAtTime() {} };
  const ctx = {
    currentTime: 0,
    createGain: () => ({ gain: param, connect: (n: unknown) => n, disconnect() {} }),
    createOscillator: () => {
      const blip: Blip = { at: NaN, handedAt: ctx.currentTime, stopped: false };
      return {
        frequency: { value: 0 },
        connect: (n: unknown) => n,
        disconnect() {},
        start(at: number) {
          blip.at = at;
          blips.push(blip);
        },
        stop(at: number) {
          if (at === 0) blip.stopped = true;
        },
      };
    },
  };
  return { ctx, blips, destination: {} as AudioNode };
}

/** Runs the audio clock and the timer together, 5 ms at a time, up to context time `until`. */
function runUntil(ctx: { currentTime: number }, until: number) {
  while (ctx.currentTime < until - 1e-9) {
    ctx.currentTime = Math.round((ctx.currentTime + 0.005) * 1000) / 1000;
    jest.advanceTimersByTime(5);
  }
}

beforeEach(() => jest.useFakeTimers());
afterEach(() => jest.useRealTimers());

test('a 120 BPM metronome: every beat handed over once, before it is due and at most the look-ahead early', () => {
  const { ctx, blips, destination } = fakeContext();
  const timeline = new MetronomeTimeline(0.05, 120, 4);
  const s = new ClickScheduler(ctx as unknown as BaseAudioContext, destination, (from, until) =>
    timeline.clicksBetween(from, until),
  );
  s.start(0.05);
  runUntil(ctx, 2.2);
  s.stop();
  // Beats from 0.05 s every 0.5 s up to 2.2 s plus the look-ahead: 0.05, 0.55, 1.05, 1.55, 2.05.
  expect(blips.map((b) => b.at)).toEqual([0.05, 0.55, 1.05, 1.55, 2.05].map((t) => expect.closeTo(t, 9)));
  for (const b of blips) {
    expect(b.handedAt).toBeLessThanOrEqual(b.at);
    expect(b.at - b.handedAt).toBeLessThanOrEqual(LOOKAHEAD_SEC + 1e-9);
  }
  expect(s.count).toBe(5);
});

test('the beat heard last is the one sounding; clicks not yet heard are taken back on a change', () => {
  const { ctx, blips, destination } = fakeContext();
  const timeline = new MetronomeTimeline(0, 120, 3);
  const s = new ClickScheduler(ctx as unknown as BaseAudioContext, destination, (from, until) =>
    timeline.clicksBetween(from, until),
  );
  s.start(0);
  runUntil(ctx, 1.2);
  // Beats at 0, 0.5 and 1.0 s are heard by 1.2 s; in 3/4 the third is the bar's third beat (place 2).
  expect(s.lastHeard()).toBe(2);
  // 1.5 s is within the look-ahead at 1.4 s: handed over, then taken back from 1.45 s on.
  runUntil(ctx, 1.4);
  expect(blips.some((b) => Math.abs(b.at - 1.5) < 1e-9)).toBe(true);
  s.cancelFrom(1.45);
  expect(blips.find((b) => Math.abs(b.at - 1.5) < 1e-9)!.stopped).toBe(true);
  // Scheduling goes on from 1.45 s: the beat at 1.5 s is handed over again, once.
  runUntil(ctx, 1.45);
  expect(blips.filter((b) => Math.abs(b.at - 1.5) < 1e-9 && !b.stopped)).toHaveLength(1);
  s.stop();
});

test('clicks added before start (a count-in) stay; stop silences those not yet heard', () => {
  const { ctx, blips, destination } = fakeContext();
  const s = new ClickScheduler(ctx as unknown as BaseAudioContext, destination, () => []);
  s.add(0.5, true);
  s.add(1.0, false);
  s.start(1.5);
  runUntil(ctx, 0.7);
  expect(blips.map((b) => b.stopped)).toEqual([false, false]);
  s.stop();
  // Heard at 0.5 s: left alone. Due at 1.0 s: silenced.
  expect(blips.map((b) => b.stopped)).toEqual([false, true]);
  expect(s.running).toBe(false);
});
