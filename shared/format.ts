// How numbers read on screen, in one place for the client and the server alike: tempos, clock times, counts.
import { round } from '@/audio/analysis/numbers';

/** Rounded to one decimal place: tempos are set and shown to a tenth of a BPM, no finer. */
export const tenth = (x: number) => round(x, 1);

/** Whole tempos without decimals, others to one decimal place ("124", "92.5"). */
export const formatBpm = (bpm: number) => (Number.isInteger(bpm) ? String(bpm) : bpm.toFixed(1));

/** A length in whole seconds as m:ss ("3:07"), as a recording's duration is listed. */
export function formatDuration(sec: number): string {
  // Rounded before splitting, so 59.6 s reads 1:00 rather than 0:60.
  const whole = Math.round(sec);
  return `${Math.floor(whole / 60)}:${String(whole % 60).padStart(2, '0')}`;
}

/** A place in a recording to a tenth of a second as m:ss.s ("1:02.5"), as the playhead and passages read. */
export function formatClock(sec: number): string {
  // Rounded before splitting, so 59.96 s reads 1:00.0 rather than 0:60.0.
  const tenths = Math.round(sec * 10);
  return `${Math.floor(tenths / 600)}:${((tenths % 600) / 10).toFixed(1).padStart(4, '0')}`;
}

/** A count with its noun: "1 repetition", "3 repetitions" (`many` for nouns whose plural is not noun + s). */
export const plural = (n: number, one: string, many = `${one}s`) => `${n} ${n === 1 ? one : many}`;

/** Bars that fit a time, to a tenth, with the verb agreeing: "1 bar fits", "2.5 bars fit". */
export const barsFit = (n: number) => (n === 1 ? '1 bar fits' : `${Number.isInteger(n) ? n : n.toFixed(1)} bars fit`);

/** A date in the reader's locale and time zone ("2 Dec 2026", "Dec 2, 2026"): Intl chooses the order and words. */
export const formatDate = (iso: string | Date, locale?: string) =>
  new Intl.DateTimeFormat(locale, { dateStyle: 'medium' }).format(typeof iso === 'string' ? new Date(iso) : iso);

/** A date with its time of day in the reader's locale ("2 Dec 2026, 14:05" or "Dec 2, 2026, 2:05 PM"). */
export const formatDateTime = (iso: string | Date, locale?: string) =>
  new Intl.DateTimeFormat(locale, { dateStyle: 'medium', timeStyle: 'short' }).format(
    typeof iso === 'string' ? new Date(iso) : iso,
  );

/**
 * Whose something is, as a label: "Your take" for one's own, "Ilya’s take" for someone else's (first name, an
 * apostrophe and s: common practice in English, names ending in s included).
 */
export function whose(thing: string, owner: { id: string; name: string }, meId: string | undefined): string {
  if (owner.id === meId) return `Your ${thing}`;
  const first = owner.name.trim().split(/\s+/)[0] || 'Someone';
  return `${first}’s ${thing}`;
}

/** "0:42", "1:05.5" or "42" (seconds) → seconds; null for anything else. */
export function parseClock(text: string): number | null {
  const m = /^\s*(?:(\d+):)?(\d+(?:[.,]\d+)?)\s*$/.exec(text);
  if (!m) return null;
  const seconds = Number(m[2]!.replace(',', '.'));
  if (m[1] !== undefined && seconds >= 60) return null;
  return Number(m[1] ?? 0) * 60 + seconds;
}

/** A calendar day given as days since 1970-01-01 ("2 Dec", "Dec 2"): the day number is already the reader's
 * local day, so it is read in UTC to stay that day. */
export const formatDayNumber = (day: number, locale?: string) =>
  new Intl.DateTimeFormat(locale, { day: 'numeric', month: 'short', timeZone: 'UTC' }).format(
    new Date(Math.floor(day) * 86_400_000),
  );

/** Minutes of practice: a tenth under ten minutes ("0.5 min", so a short run is not "0 min"), whole minutes up to
 * two hours ("45 min"), then hours and minutes ("2 h 05 min"). */
export function formatMinutes(minutes: number): string {
  const t = tenth(minutes);
  if (t < 10) return `${Number.isInteger(t) ? t : t.toFixed(1)} min`;
  const whole = Math.round(minutes);
  if (whole < 120) return `${whole} min`;
  return `${Math.floor(whole / 60)} h ${String(whole % 60).padStart(2, '0')} min`;
}

/** A beat's offset from the click: "+8 ms" late, "−12 ms" early (a true minus sign), "0 ms" on it. */
export function formatOffsetMs(ms: number): string {
  const r = Math.round(ms);
  if (r === 0) return '0 ms';
  return `${r > 0 ? '+' : '−'}${Math.abs(r)} ms`;
}
