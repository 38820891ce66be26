// The gentle break suggestion of the player: it follows playing and pausing (audio/practice/break-reminder.ts)
// and comes due after 45 minutes of continuous practice, pauses under 5 minutes included.
import { useEffect, useRef, useState } from 'react';
import {
  breakDueIn,
  noStretch,
  snoozed,
  started,
  stopped,
  type PracticeStretch,
} from '@/audio/practice/break-reminder';

export function useBreakReminder(playing: boolean) {
  const stretch = useRef<PracticeStretch>(noStretch);
  const [due, setDue] = useState(false);
  // Only a change between playing and paused moves the stretch; the timer is set for when a break comes due.
  const [tick, setTick] = useState(0);
  useEffect(() => {
    const now = Date.now();
    stretch.current = playing ? started(stretch.current, now) : stopped(stretch.current, now);
    const wait = breakDueIn(stretch.current, now);
    if (wait === null) return;
    const timer = setTimeout(() => setDue(true), wait);
    return () => clearTimeout(timer);
  }, [playing, tick]);
  return {
    due,
    /** "Not now": the next suggestion comes after another 45 minutes of practice. */
    dismiss: () => {
      stretch.current = snoozed(stretch.current, Date.now());
      setDue(false);
      setTick((t) => t + 1);
    },
  };
}
