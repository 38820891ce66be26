// The practice log as numbers: ISO 8601 weeks in the player's local time, a week's minutes, songs and tempo
// gained, the points of the tempo-over-days chart, and the day of a session logged later.
import {
  dayNumber,
  dayOf,
  dayText,
  isoWeekOf,
  localDay,
  loggedLater,
  parseDay,
  practisedAtOf,
  previousWeek,
  tempoOverDays,
  weekStart,
  weekSummary,
  type LoggedSession,
} from '@/audio/practice/practice-log';

describe('ISO 8601 weeks', () => {
  // The worked examples of dates near the turn of the year listed with ISO 8601's week date (Wikipedia, "ISO
  // week date", Examples table; quoted from memory): a week belongs to the year of its Thursday.
  test.each([
    ['2005-01-01', 2004, 53],
    ['2005-01-02', 2004, 53],
    ['2005-12-31', 2005, 52],
    ['2007-01-01', 2007, 1],
    ['2007-12-30', 2007, 52],
    ['2007-12-31', 2008, 1],
    ['2008-01-01', 2008, 1],
    ['2008-12-28', 2008, 52],
    ['2008-12-29', 2009, 1],
    ['2009-12-31', 2009, 53],
    ['2010-01-01', 2009, 53],
    ['2010-01-03', 2009, 53],
    ['2010-01-04', 2010, 1],
  ])('%s is week %i-W%i', (date, year, week) => {
    const [y, m, d] = date.split('-').map(Number) as [number, number, number];
    expect(isoWeekOf({ year: y, month: m, day: d })).toEqual({ year, week });
  });

  test('each week starts on its Monday, and the week before the first of a year is the last of the one before', () => {
    // 2008-12-29 was a Monday and starts 2009-W01 (same table); 2009 had 53 weeks.
    expect(dayOf(weekStart({ year: 2009, week: 1 }))).toEqual({ year: 2008, month: 12, day: 29 });
    expect(previousWeek({ year: 2010, week: 1 })).toEqual({ year: 2009, week: 53 });
    // 2026-11-30 is a Monday (the calendar): week 49 of 2026, as 2026-01-01 was a Thursday (week 1 = 29 Dec 2025).
    expect(dayOf(weekStart({ year: 2026, week: 49 }))).toEqual({ year: 2026, month: 11, day: 30 });
  });

  test('the day is the player’s local day: late Sunday in UTC is already Monday in Berlin', () => {
    const at = '2026-11-29T23:30:00Z';
    expect(isoWeekOf(localDay(at, 0))).toEqual({ year: 2026, week: 48 });
    expect(isoWeekOf(localDay(at, 60))).toEqual({ year: 2026, week: 49 }); // CET, UTC+1
    expect(isoWeekOf(localDay('2026-11-30T03:00:00Z', -300))).toEqual({ year: 2026, week: 48 }); // EST, UTC−5
  });
});

const entry = (over: Partial<LoggedSession>): LoggedSession => ({
  songId: 'reel',
  passageId: null,
  passage: null,
  startBpm: 90,
  reachedBpm: 90,
  clean: true,
  minutes: 10,
  createdAt: '2026-12-01T18:00:00Z',
  ...over,
});

describe('a week of the log (worked examples, by hand)', () => {
  const w49 = { year: 2026, week: 49 }; // Monday 30 Nov – Sunday 6 Dec 2026
  const log: LoggedSession[] = [
    // Before the week: the reel's best clean tempo was 92 (a faster 95 was not clean).
    entry({ reachedBpm: 92, createdAt: '2026-11-25T18:00:00Z', minutes: 30 }),
    entry({ reachedBpm: 95, clean: false, createdAt: '2026-11-26T18:00:00Z', minutes: 20 }),
    // In the week: the reel at 94 then 96 clean, 100 not clean → gained 92 → 96.
    entry({ reachedBpm: 94, createdAt: '2026-11-30T08:00:00Z', minutes: 12.5 }),
    entry({ reachedBpm: 96, createdAt: '2026-12-02T08:00:00Z', minutes: 20 }),
    entry({ reachedBpm: 100, clean: false, createdAt: '2026-12-03T08:00:00Z', minutes: 15 }),
    // A passage of the reel, new this week: started at 70, clean at 76 → gained 70 → 76.
    entry({
      passageId: 'p1',
      passage: 'B part',
      startBpm: 70,
      reachedBpm: 72,
      createdAt: '2026-12-01T08:00:00Z',
      minutes: 5.2,
    }),
    entry({
      passageId: 'p1',
      passage: 'B part',
      startBpm: 72,
      reachedBpm: 76,
      createdAt: '2026-12-04T08:00:00Z',
      minutes: 6.1,
    }),
    // Another song, slower clean than it started: no gain, but its minutes and the song count.
    entry({ songId: 'waltz', startBpm: 120, reachedBpm: 118, createdAt: '2026-12-06T20:00:00Z', minutes: 9.3 }),
    // After the week (Monday 7 Dec): not counted.
    entry({ reachedBpm: 104, createdAt: '2026-12-07T08:00:00Z', minutes: 40 }),
  ];

  test('minutes, entries and songs add up to the hand count', () => {
    const s = weekSummary(log, w49, 0);
    // 12.5 + 20 + 15 + 5.2 + 6.1 + 9.3 = 68.1 minutes over 6 entries of 2 songs.
    expect(s).toMatchObject({ entries: 6, minutes: 68.1, songs: 2 });
    expect(dayOf(s.from)).toEqual({ year: 2026, month: 11, day: 30 });
    expect(dayOf(s.to)).toEqual({ year: 2026, month: 12, day: 6 });
  });

  test('tempo gained runs from the best clean tempo before the week, or where a new passage started', () => {
    const { gains } = weekSummary(log, w49, 0);
    expect(gains).toEqual([
      { songId: 'reel', passageId: null, passage: null, fromBpm: 92, toBpm: 96 },
      { songId: 'reel', passageId: 'p1', passage: 'B part', fromBpm: 70, toBpm: 76 },
    ]);
  });

  test('the week edge moves with the player’s time zone', () => {
    // Sunday 6 Dec 20:00 UTC is Monday 7 Dec 05:00 at UTC+9 (Tokyo): the waltz leaves week 49 there.
    const tokyo = weekSummary(log, w49, 9 * 60);
    expect(tokyo.songs).toBe(1);
    expect(tokyo.minutes).toBe(58.8);
  });

  test('an empty week is zero everywhere', () => {
    expect(weekSummary(log, { year: 2026, week: 40 }, 0)).toMatchObject({
      entries: 0,
      minutes: 0,
      songs: 0,
      gains: [],
    });
  });
});

test('the chart plots each session at its local day, oldest first, whatever order the log comes in', () => {
  const points = tempoOverDays(
    [
      entry({ reachedBpm: 96, createdAt: '2026-12-02T12:00:00Z' }),
      entry({ reachedBpm: 92, clean: false, createdAt: '2026-12-01T00:00:00Z' }),
    ],
    0,
  );
  // x counts days since 1970-01-01; 12:00 is half a day.
  const dec1 = Date.UTC(2026, 11, 1) / 86_400_000;
  expect(points).toEqual([
    { x: dec1, y: 92, clean: false },
    { x: dec1 + 1.5, y: 96, clean: true },
  ]);
});

describe('a session logged later', () => {
  // ISO 8601 calendar dates in the extended format, YYYY-MM-DD; the Gregorian leap-year rule (every fourth
  // year, not centuries unless divisible by 400) decides which 29 Februaries exist — both common practice.
  test.each([
    ['2026-11-30', { year: 2026, month: 11, day: 30 }],
    [' 2026-1-5 ', { year: 2026, month: 1, day: 5 }],
    ['2028-02-29', { year: 2028, month: 2, day: 29 }],
    ['2000-02-29', { year: 2000, month: 2, day: 29 }],
    ['2026-02-29', null],
    ['1900-02-29', null],
    ['2026-04-31', null],
    ['2026-13-01', null],
    ['30/11/2026', null],
    ['yesterday', null],
    ['', null],
  ])('%j reads as %j', (text, day) => {
    expect(parseDay(text)).toEqual(day);
  });

  test('a day is written back as ISO 8601, padded', () => {
    expect(dayText({ year: 2026, month: 1, day: 5 })).toBe('2026-01-05');
    expect(parseDay(dayText({ year: 2026, month: 12, day: 31 }))).toEqual({ year: 2026, month: 12, day: 31 });
  });

  test('today is sent as nothing (the server’s now); an earlier day as its noon, which is that local day', () => {
    // Local times throughout, so the check holds in any time zone the tests run in.
    const now = new Date(2026, 11, 2, 8, 15);
    expect(practisedAtOf({ year: 2026, month: 12, day: 2 }, now)).toBeUndefined();
    expect(practisedAtOf({ year: 2026, month: 12, day: 1 }, now)).toBe(new Date(2026, 11, 1, 12).toISOString());
    // 29 March 2026 is the day Europe's clocks go forward (EU summer time: the last Sunday of March): noon
    // stays on that day wherever the tests run.
    const earlier = practisedAtOf({ year: 2026, month: 3, day: 29 }, now)!;
    expect(localDay(earlier)).toEqual({ year: 2026, month: 3, day: 29 });
    // The chart plots it at noon of that day, and the week counts it in that day's week.
    expect(tempoOverDays([entry({ createdAt: earlier })])[0]!.x).toBeCloseTo(
      dayNumber({ year: 2026, month: 3, day: 29 }) + 0.5,
      9,
    );
    expect(isoWeekOf(localDay(earlier))).toEqual({ year: 2026, week: 13 }); // a Sunday: the end of week 13
  });

  test('an entry logged a day after it was played is told apart from one logged as it was played', () => {
    expect(loggedLater({ createdAt: '2026-12-01T12:00:00Z', loggedAt: '2026-12-02T08:15:00Z' })).toBe(true);
    expect(loggedLater({ createdAt: '2026-12-02T08:15:00Z', loggedAt: '2026-12-02T08:15:00Z' })).toBe(false);
  });
});
