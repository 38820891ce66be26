// The practice log read as numbers: which ISO 8601 week an entry falls in (Monday first, in the player's local
// time), what a week adds up to (minutes, songs, tempo gained) and the points of a tempo-over-days chart.

export interface LoggedSession {
  songId: string;
  passageId: string | null;
  passage: string | null;
  startBpm: number;
  reachedBpm: number;
  clean: boolean;
  minutes: number;
  createdAt: string;
}

/** A calendar day; month 1–12. */
export interface Day {
  year: number;
  month: number;
  day: number;
}

export interface IsoWeek {
  /** The week-numbering year, which differs from the calendar year around 1 January. */
  year: number;
  week: number;
}

const DAY_MS = 86_400_000;

/** The calendar day of an instant at a UTC offset in minutes (east positive); by default the reader's own. */
export function localDay(at: string | Date, utcOffsetMinutes?: number): Day {
  const d = typeof at === 'string' ? new Date(at) : at;
  const offset = utcOffsetMinutes ?? -d.getTimezoneOffset();
  const shifted = new Date(d.getTime() + offset * 60_000);
  return { year: shifted.getUTCFullYear(), month: shifted.getUTCMonth() + 1, day: shifted.getUTCDate() };
}

/** Days since 1970-01-01 of a calendar day (no time zone involved: a day is a day). */
export const dayNumber = (d: Day) => Date.UTC(d.year, d.month - 1, d.day) / DAY_MS;
export const dayOf = (n: number): Day => {
  const d = new Date(n * DAY_MS);
  return { year: d.getUTCFullYear(), month: d.getUTCMonth() + 1, day: d.getUTCDate() };
};

/** "2026-11-30" (ISO 8601, as a date field holds it) → that day; null for other text or a day no calendar has. */
export function parseDay(text: string): Day | null {
  const m = /^\s*(\d{4})-(\d{1,2})-(\d{1,2})\s*$/.exec(text);
  if (!m) return null;
  const d = { year: Number(m[1]), month: Number(m[2]), day: Number(m[3]) };
  const back = dayOf(dayNumber(d));
  return back.year === d.year && back.month === d.month && back.day === d.day ? d : null;
}

/** A day as ISO 8601 text ("2026-11-30"). */
export const dayText = (d: Day) =>
  `${String(d.year).padStart(4, '0')}-${String(d.month).padStart(2, '0')}-${String(d.day).padStart(2, '0')}`;

/**
 * When a session logged by hand on `day` is sent as played: nothing for today (the server's now), else noon of
 * that day in the reader's time zone — the middle of the day, so it stays that day across a daylight-saving
 * change, and the charts and weeks, which read the day in the same zone, place it there.
 */
export function practisedAtOf(day: Day, now = new Date()): string | undefined {
  if (dayNumber(day) === dayNumber(localDay(now))) return undefined;
  return new Date(day.year, day.month - 1, day.day, 12).toISOString();
}

/**
 * Whether an entry was logged after the day it counts on (typed in later): the log then shows its day, not a
 * time of day nobody gave. An entry dated now was played and logged at the same instant; one dated to an
 * earlier day sits at its noon, at least twelve hours before it was logged; an hour tells them apart.
 */
export const loggedLater = (e: { createdAt: string; loggedAt: string }) =>
  Date.parse(e.loggedAt) - Date.parse(e.createdAt) > 3_600_000;

/**
 * ISO 8601 week of a day: weeks run Monday to Sunday and week 1 is the one holding the year's first Thursday,
 * so a week belongs to the year its Thursday falls in.
 */
export function isoWeekOf(d: Day): IsoWeek {
  const n = dayNumber(d);
  // 1970-01-01 was a Thursday: weekday 1 (Monday) … 7 (Sunday).
  const weekday = ((((n + 3) % 7) + 7) % 7) + 1;
  const thursday = dayOf(n + 4 - weekday);
  const firstOfYear = dayNumber({ year: thursday.year, month: 1, day: 1 });
  return { year: thursday.year, week: Math.floor((n + 4 - weekday - firstOfYear) / 7) + 1 };
}

/** The Monday that starts an ISO week, as a day number. */
export function weekStart(w: IsoWeek): number {
  const jan4 = dayNumber({ year: w.year, month: 1, day: 4 }); // 4 January is always in week 1
  const weekday = ((((jan4 + 3) % 7) + 7) % 7) + 1;
  return jan4 - (weekday - 1) + (w.week - 1) * 7;
}

export const sameWeek = (a: IsoWeek, b: IsoWeek) => a.year === b.year && a.week === b.week;

/** The week before `w`. */
export const previousWeek = (w: IsoWeek): IsoWeek => isoWeekOf(dayOf(weekStart(w) - 7));

/** What was practised: a saved passage, else the words given for a loop, else the whole piece. */
export const targetKey = (e: Pick<LoggedSession, 'songId' | 'passageId' | 'passage'>) =>
  `${e.songId}/${e.passageId ?? (e.passage ? `loop:${e.passage}` : 'whole')}`;

export interface TempoGain {
  songId: string;
  passageId: string | null;
  passage: string | null;
  fromBpm: number;
  toBpm: number;
}

export interface WeekSummary {
  week: IsoWeek;
  /** Day numbers of its Monday and Sunday. */
  from: number;
  to: number;
  entries: number;
  minutes: number;
  songs: number;
  /** Per song or passage that went faster this week: from its best clean tempo before the week (or, new this
   * week, the tempo its first session started at) to its best clean tempo in the week. */
  gains: TempoGain[];
}

/** The sum of a week of the log; `utcOffsetMinutes` as in `localDay`. */
export function weekSummary(log: LoggedSession[], week: IsoWeek, utcOffsetMinutes?: number): WeekSummary {
  const from = weekStart(week);
  const dayOfEntry = (e: LoggedSession) => dayNumber(localDay(e.createdAt, utcOffsetMinutes));
  const inWeek = log.filter((e) => {
    const n = dayOfEntry(e);
    return n >= from && n < from + 7;
  });
  const before = log.filter((e) => dayOfEntry(e) < from);
  const bestClean = (entries: LoggedSession[], key: string) =>
    entries
      .filter((e) => e.clean && targetKey(e) === key)
      .reduce<number | null>((m, e) => Math.max(m ?? 0, e.reachedBpm), null);
  const gains: TempoGain[] = [];
  const keys = [...new Set(inWeek.map(targetKey))];
  for (const key of keys) {
    const best = bestClean(inWeek, key);
    if (best === null) continue;
    const first = inWeek
      .filter((e) => targetKey(e) === key)
      .reduce((a, b) => (Date.parse(b.createdAt) < Date.parse(a.createdAt) ? b : a));
    const fromBpm = bestClean(before, key) ?? first.startBpm;
    if (best > fromBpm)
      gains.push({ songId: first.songId, passageId: first.passageId, passage: first.passage, fromBpm, toBpm: best });
  }
  return {
    week,
    from,
    to: from + 6,
    entries: inWeek.length,
    // Minutes are logged to a tenth; the sum is kept to a tenth so 0.1 + 0.2 reads 0.3.
    minutes: Math.round(inWeek.reduce((s, e) => s + e.minutes, 0) * 10) / 10,
    songs: new Set(inWeek.map((e) => e.songId)).size,
    gains,
  };
}

export interface TempoPoint {
  /** Days since 1970-01-01 in local time, with the time of day as a fraction. */
  x: number;
  y: number;
  clean: boolean;
}

/** Each session's reached tempo at its local day and time, oldest first (the log arrives newest first). */
export function tempoOverDays(log: LoggedSession[], utcOffsetMinutes?: number): TempoPoint[] {
  return log
    .map((e) => {
      const at = new Date(e.createdAt);
      const offset = utcOffsetMinutes ?? -at.getTimezoneOffset();
      return { x: (at.getTime() + offset * 60_000) / DAY_MS, y: e.reachedBpm, clean: e.clean };
    })
    .sort((a, b) => a.x - b.x);
}
