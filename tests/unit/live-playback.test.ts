// LivePlayback, the code the player's audio thread runs, driven block by block in Node as the AudioWorklet
// drives it (128 frames a block). Signals are exact by construction: a steady tone, and a click train whose
// click times are known.
import { LivePlayback } from '@/audio/playback/live-playback';
import { PlaybackMap } from '@/audio/playback/click';
import { heardOffsetSec, type MakeStretcher } from '@/audio/playback/stretch';
import { heardOffsetFor, stretcherMaker } from '@/audio/playback/stretch-method';
import { attackTimes, hitsOverBed, sineTone, zeroCrossingFrequency } from './signals';

const SR = 44100;
const Q = 128;
const tone = (hz: number, sec: number) => sineTone(hz, sec, SR);

/** Renders `sec` seconds from context time `t0`, calling `each(blockAt)` before every block. */
function renderFor(p: LivePlayback, t0: number, sec: number, each?: (blockAt: number, index: number) => void) {
  const n = Math.round((sec * SR) / Q);
  const left = new Float32Array(n * Q);
  const right = new Float32Array(n * Q);
  const l = new Float32Array(Q);
  const r = new Float32Array(Q);
  const events = [];
  for (let i = 0; i < n; i++) {
    const at = t0 + (i * Q) / SR;
    each?.(at, i);
    const e = p.render(l, r, Q, at);
    if (e.segment || e.pass !== undefined) events.push({ ...e, blockAt: at });
    left.set(l, i * Q);
    right.set(r, i * Q);
  }
  return { left, right, events };
}

test('a count-in leaves exact silence until the music comes in', () => {
  const x = tone(440, 3);
  const p = new LivePlayback({ left: x, right: x }, SR);
  p.start({ fromSec: 0, speed: 1, startsAt: 0.1, loop: null });
  const { left } = renderFor(p, 0, 0.5);
  const firstSound = left.findIndex((v) => v !== 0);
  expect(firstSound).toBeGreaterThanOrEqual(Math.round(0.1 * SR));
  // SoundTouch's first output frames may be near zero; the music is there within a few milliseconds.
  expect(firstSound).toBeLessThan(Math.round(0.1 * SR) + 0.01 * SR);
});

test('a tempo change is applied in the very next block, keeps the pitch, and joins without a click', () => {
  const x = tone(440, 6);
  const p = new LivePlayback({ left: x, right: x }, SR);
  p.start({ fromSec: 0, speed: 1, startsAt: 0, loop: null });
  const changeAsked = 1.0;
  const { left, events } = renderFor(p, 0, 3, (at) => {
    if (Math.abs(at - changeAsked) < Q / SR / 2) p.requestSpeed(0.7, at);
  });
  expect(events).toHaveLength(1);
  const seg = events[0]!.segment!;
  expect(seg.speed).toBe(0.7);
  // Asked at the start of a block, heard from that block: no waiting for queued audio.
  expect(seg.at - seg.requestedAt).toBeLessThan(Q / SR + 1e-9);
  // The musical position carries on: one second in at 1× is one second of the recording.
  expect(seg.from).toBeCloseTo(seg.at, 6);
  const changeFrame = Math.round(seg.at * SR);
  expect(Math.abs(zeroCrossingFrequency(left, SR, changeFrame + 4000, left.length - 2000) - 440) / 440).toBeLessThan(
    0.01,
  );
  // No jump between samples at the join larger than the tone's own largest step (0.5 × 2π × 440 / SR ≈ 0.031).
  const ownStep = 0.5 * ((2 * Math.PI * 440) / SR);
  let joinJump = 0;
  for (let i = changeFrame - 512; i < changeFrame + 1024; i++)
    joinJump = Math.max(joinJump, Math.abs(left[i]! - left[i - 1]!));
  expect(joinJump).toBeLessThan(ownStep * 1.2);
});

test("across tempo changes the music's attacks meet the click, which follows the main thread's copy of the timeline", () => {
  const { x, hits } = hitsOverBed(20, SR);
  const p = new LivePlayback({ left: x, right: x }, SR);
  const first = p.start({ fromSec: 0, speed: 1, startsAt: 0, loop: null });
  const mirror = new PlaybackMap(first.at, first.from, first.speed);
  const plan = new Map([
    [Math.round((2.03 * SR) / Q), 0.75],
    [Math.round((6.51 * SR) / Q), 1.3],
  ]);
  const { left, events } = renderFor(p, 0, 11, (at, i) => {
    const speed = plan.get(i);
    if (speed) p.requestSpeed(speed, at);
  });
  for (const e of events) if (e.segment) mirror.addSegment(e.segment);
  expect(events.filter((e) => e.segment)).toHaveLength(2);
  // Where the player puts each click: the hit's place on the timeline, moved by the stretch's known offset.
  const clicks = hits
    .map((t) => mirror.contextTime(t)!)
    .map((t) => t + heardOffsetSec(mirror.speedAt(t)))
    .filter((t) => t > 0.2 && t < 10.8);
  const heard = attackTimes(left, SR);
  const errors = clicks.map((c) => Math.min(...heard.map((h) => Math.abs(h - c))));
  expect(clicks.length).toBeGreaterThan(20);
  // Every hit is heard, within 25 ms of its click (beyond ~20–30 ms two onsets are heard as a flam: common
  // practice), and half within 10 ms.
  expect(Math.max(...errors)).toBeLessThan(0.025);
  expect([...errors].sort((a, b) => a - b)[Math.floor(errors.length / 2)]!).toBeLessThan(0.01);
});

test('a loop reports each pass once, when the timeline crosses the end of the passage', () => {
  const x = tone(220, 5);
  const p = new LivePlayback({ left: x, right: x }, SR);
  p.start({ fromSec: 1, speed: 1, startsAt: 0, loop: { start: 1, end: 2 } });
  const { events } = renderFor(p, 0, 3.5);
  const passes = events.filter((e) => e.pass !== undefined);
  expect(passes.map((e) => e.pass)).toEqual([1, 2, 3]);
  // Reported by the block in which the end is crossed: within one block of 1 s, 2 s and 3 s.
  passes.forEach((e, i) => expect(Math.abs(e.blockAt + Q / SR - (i + 1))).toBeLessThanOrEqual(Q / SR + 1e-9));
});

test('stopped, it renders silence', () => {
  const x = tone(440, 1);
  const p = new LivePlayback({ left: x, right: x }, SR);
  p.warmUp();
  expect(p.active).toBe(false);
  const { left } = renderFor(p, 0, 0.1);
  expect(left.every((v) => v === 0)).toBe(true);
});

// The phase vocoder (the player's default method) through the same LivePlayback: across tempo changes and a loop,
// with no click offset at all.
describe('with the phase vocoder', () => {
  let make: MakeStretcher;
  beforeAll(async () => {
    make = await stretcherMaker('phase-vocoder', SR);
  });

  test("across tempo changes the music's attacks meet the unshifted click", () => {
    const { x, hits } = hitsOverBed(20, SR);
    const p = new LivePlayback({ left: x, right: x }, SR, make);
    const first = p.start({ fromSec: 0, speed: 1, startsAt: 0, loop: null });
    const mirror = new PlaybackMap(first.at, first.from, first.speed);
    const plan = new Map([
      [Math.round((2.03 * SR) / Q), 0.6],
      [Math.round((6.51 * SR) / Q), 1.7],
    ]);
    const { left, events } = renderFor(p, 0, 11, (at, i) => {
      const speed = plan.get(i);
      if (speed) p.requestSpeed(speed, at);
    });
    for (const e of events) if (e.segment) mirror.addSegment(e.segment);
    expect(events.filter((e) => e.segment)).toHaveLength(2);
    const clicks = hits
      .map((t) => mirror.contextTime(t)!)
      .map((t) => t + heardOffsetFor('phase-vocoder', mirror.speedAt(t)))
      .filter((t) => t > 0.2 && t < 10.8);
    const heard = attackTimes(left, SR);
    const errors = clicks.map((c) => Math.min(...heard.map((h) => Math.abs(h - c))));
    expect(clicks.length).toBeGreaterThan(20);
    // Tighter than overlap-add's 25 ms above: within 10 ms each (bench: 2 ms at steady tempos).
    expect(Math.max(...errors)).toBeLessThan(0.01);
  });

  test('a start and a tempo change are heard at full level at once, and the change joins without a click', () => {
    const x = tone(440, 6);
    const p = new LivePlayback({ left: x, right: x }, SR, make);
    p.start({ fromSec: 0.5, speed: 1, startsAt: 0, loop: null });
    const { left, events } = renderFor(p, 0, 3, (at, i) => {
      if (i === 400) p.requestSpeed(0.7, at);
    });
    expect(events).toHaveLength(1);
    const peak = (from: number) => left.subarray(from, from + 441).reduce((m, v) => Math.max(m, Math.abs(v)), 0);
    const change = 400 * Q;
    // The tone's amplitude is 0.5: within 5 % of it over the first 10 ms, and over the 10 ms after the change.
    expect(peak(0)).toBeGreaterThan(0.475);
    expect(peak(change)).toBeGreaterThan(0.475);
    expect(peak(change + 441)).toBeGreaterThan(0.475);
    const ownStep = 0.5 * ((2 * Math.PI * 440) / SR);
    let jump = 0;
    for (let i = 1; i < change + 4096; i++) jump = Math.max(jump, Math.abs(left[i]! - left[i - 1]!));
    expect(jump).toBeLessThan(ownStep * 1.2);
  });

  test('a loop comes round with each pass reported once, and keeps the pitch', () => {
    const x = tone(220, 5);
    const p = new LivePlayback({ left: x, right: x }, SR, make);
    p.start({ fromSec: 1, speed: 0.8, startsAt: 0, loop: { start: 1, end: 2 } });
    const { left, events } = renderFor(p, 0, 3.9);
    expect(events.filter((e) => e.pass !== undefined).map((e) => e.pass)).toEqual([1, 2, 3]);
    expect(Math.abs(zeroCrossingFrequency(left, SR, 4000, left.length - 2000) / 220 - 1)).toBeLessThan(0.01);
  });
});
