// The player's break suggestion over (fake) time: due after 45 minutes of practice with pauses under 5 minutes,
// not after a real break, and 45 minutes again after "not now" (common practice in advice on musicians' overuse
// injuries; from memory).
import { act, renderHook } from '@testing-library/react';
import { useBreakReminder } from '@/components/audition/useBreakReminder';

const min = 60_000;

beforeEach(() => {
  jest.useFakeTimers();
  jest.setSystemTime(new Date('2026-12-02T09:00:00Z'));
});
afterEach(() => jest.useRealTimers());

const advance = (ms: number) =>
  act(() => {
    jest.advanceTimersByTime(ms);
  });

test('45 minutes of playing with a short pause brings the suggestion; not a minute before', () => {
  const { result, rerender } = renderHook(({ playing }) => useBreakReminder(playing), {
    initialProps: { playing: true },
  });
  advance(20 * min);
  rerender({ playing: false });
  advance(4 * min); // a pause under 5 minutes: the same stretch of practice
  rerender({ playing: true });
  advance(20 * min); // 44 minutes since the start
  expect(result.current.due).toBe(false);
  advance(1 * min);
  expect(result.current.due).toBe(true);
});

test('a pause of 5 minutes is a break: the next 45 minutes start after it', () => {
  const { result, rerender } = renderHook(({ playing }) => useBreakReminder(playing), {
    initialProps: { playing: true },
  });
  advance(40 * min);
  rerender({ playing: false });
  advance(5 * min);
  rerender({ playing: true });
  advance(44 * min);
  expect(result.current.due).toBe(false);
  advance(1 * min);
  expect(result.current.due).toBe(true);
});

test('while paused it never comes due; "not now" waits another 45 minutes of practice', () => {
  const { result, rerender } = renderHook(({ playing }) => useBreakReminder(playing), {
    initialProps: { playing: true },
  });
  advance(30 * min);
  rerender({ playing: false });
  advance(3 * min);
  expect(result.current.due).toBe(false);
  rerender({ playing: true });
  advance(12 * min);
  expect(result.current.due).toBe(true);
  act(() => result.current.dismiss());
  expect(result.current.due).toBe(false);
  advance(44 * min);
  expect(result.current.due).toBe(false);
  advance(1 * min);
  expect(result.current.due).toBe(true);
});
