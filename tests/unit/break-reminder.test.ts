// When a break is suggested: after 45 minutes of practice with no pause of 5 minutes or more (common practice
// in advice on musicians' overuse injuries; from memory).
import { breakDueIn, continuousMs, noStretch, snoozed, started, stopped } from '@/audio/practice/break-reminder';

const min = 60_000;

test('short pauses belong to the stretch; a break is due 45 minutes after it began', () => {
  let s = started(noStretch, 0);
  s = stopped(s, 20 * min);
  s = started(s, 24 * min); // a 4-minute pause: still the same stretch
  expect(continuousMs(s, 30 * min)).toBe(30 * min);
  expect(breakDueIn(s, 30 * min)).toBe(15 * min);
  expect(breakDueIn(s, 50 * min)).toBe(0);
});

test('a pause of 5 minutes is a break: the count starts again', () => {
  let s = started(noStretch, 0);
  s = stopped(s, 40 * min);
  expect(continuousMs(s, 44 * min)).toBe(44 * min);
  expect(continuousMs(s, 45 * min)).toBe(0);
  s = started(s, 46 * min);
  expect(breakDueIn(s, 46 * min)).toBe(45 * min);
});

test('while paused nothing comes due; "not now" waits another 45 minutes', () => {
  let s = started(noStretch, 0);
  expect(breakDueIn(stopped(s, 10 * min), 11 * min)).toBeNull();
  s = snoozed(s, 45 * min);
  expect(breakDueIn(s, 46 * min)).toBe(44 * min);
});
