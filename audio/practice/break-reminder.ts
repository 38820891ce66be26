// When to suggest a break: after 45 minutes of continuous practice. Continuous means playing with no pause of
// 5 minutes or more; a pause that long is a break, and the count starts again. Pure state over times in ms.

/** Practice time after which a break is suggested (common practice in advice on musicians' overuse injuries:
 * a short break at least every 45–60 minutes; from memory, a health professional's advice comes first). */
export const BREAK_AFTER_MS = 45 * 60_000;
/** A pause at least this long counts as a break (from memory: the usual advice is a break of about 5 minutes). */
export const BREAK_GAP_MS = 5 * 60_000;

export interface PracticeStretch {
  /** When the current stretch of continuous practice began; null before any playing. */
  since: number | null;
  playing: boolean;
  /** When playing last stopped. */
  stoppedAt: number | null;
}

export const noStretch: PracticeStretch = { since: null, playing: false, stoppedAt: null };

const onBreak = (s: PracticeStretch, now: number) =>
  s.since === null || (!s.playing && s.stoppedAt !== null && now - s.stoppedAt >= BREAK_GAP_MS);

export function started(s: PracticeStretch, now: number): PracticeStretch {
  if (s.playing) return s;
  return { since: onBreak(s, now) ? now : s.since, playing: true, stoppedAt: null };
}

export function stopped(s: PracticeStretch, now: number): PracticeStretch {
  return s.playing ? { ...s, playing: false, stoppedAt: now } : s;
}

/** How long the player has been practising without a break, pauses under 5 minutes included. */
export function continuousMs(s: PracticeStretch, now: number): number {
  return onBreak(s, now) ? 0 : now - s.since!;
}

/** Milliseconds until a break is due while playing (0 once due); null while paused (nothing can come due). */
export function breakDueIn(s: PracticeStretch, now: number): number | null {
  if (!s.playing) return null;
  return Math.max(0, BREAK_AFTER_MS - continuousMs(s, now));
}

/** "Not now": the next suggestion comes after another 45 minutes. */
export const snoozed = (s: PracticeStretch, now: number): PracticeStretch => ({ ...s, since: now });
