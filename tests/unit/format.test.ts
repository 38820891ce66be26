// How numbers read on screen. Worked examples by hand; the notations are common practice: durations as
// minutes:seconds (m:ss, as players and track lists show them), tempos in BPM to a tenth at most, and English
// count nouns singular for exactly one ("1 repetition"), plural otherwise, zero included ("0 repetitions").
import {
  formatBpm,
  formatDayNumber,
  formatMinutes,
  formatOffsetMs,
  formatClock,
  formatDate,
  formatDateTime,
  formatDuration,
  parseClock,
  barsFit,
  plural,
  tenth,
  whose,
} from '@/shared/format';

describe('tenth', () => {
  test('rounds to one decimal place', () => {
    // 124 × 0.75 = 93 exactly; 123.456 → 123.5; 0.7 × 131 = 91.7 (91.69999… in binary floating point).
    expect(tenth(124 * 0.75)).toBe(93);
    expect(tenth(123.456)).toBe(123.5);
    expect(tenth(0.7 * 131)).toBe(91.7);
    expect(tenth(99.94)).toBe(99.9);
  });
});

describe('formatBpm', () => {
  test('whole tempos without decimals, others to one decimal place', () => {
    expect(formatBpm(124)).toBe('124');
    expect(formatBpm(92.5)).toBe('92.5');
    expect(formatBpm(tenth(123.456))).toBe('123.5');
  });
});

describe('formatDuration', () => {
  test('whole seconds as m:ss', () => {
    expect(formatDuration(0)).toBe('0:00');
    expect(formatDuration(7)).toBe('0:07');
    // 187 s = 3 × 60 + 7.
    expect(formatDuration(187)).toBe('3:07');
    // 12.4 s rounds to 12; 12.5 rounds up to 13.
    expect(formatDuration(12.4)).toBe('0:12');
    expect(formatDuration(12.5)).toBe('0:13');
  });
  test('a length just short of a minute reads as the next minute, never as 0:60', () => {
    expect(formatDuration(59.6)).toBe('1:00');
    // 1199.7 s rounds to 1200 s = 20:00 (the longest upload allowed is 20 minutes).
    expect(formatDuration(1199.7)).toBe('20:00');
  });
});

describe('formatClock', () => {
  test('a place to a tenth of a second as m:ss.s', () => {
    expect(formatClock(0)).toBe('0:00.0');
    expect(formatClock(2.5)).toBe('0:02.5');
    // 62.5 s = 1 × 60 + 2.5.
    expect(formatClock(62.5)).toBe('1:02.5');
    expect(formatClock(3.04)).toBe('0:03.0');
    expect(formatClock(3.06)).toBe('0:03.1');
  });
  test('just short of a minute reads as the next minute, never as 0:60.0', () => {
    expect(formatClock(59.96)).toBe('1:00.0');
    expect(formatClock(59.94)).toBe('0:59.9');
  });
});

describe('plural', () => {
  test('singular for exactly one, plural otherwise', () => {
    expect(plural(1, 'repetition')).toBe('1 repetition');
    expect(plural(3, 'repetition')).toBe('3 repetitions');
    expect(plural(0, 'repetition')).toBe('0 repetitions');
    expect(plural(1, 'beat')).toBe('1 beat');
    expect(plural(2, 'take')).toBe('2 takes');
  });
  test('an irregular plural is given', () => {
    expect(plural(2, 'child', 'children')).toBe('2 children');
    expect(plural(1, 'child', 'children')).toBe('1 child');
  });
  test('the counts the screens and messages show read right at one', () => {
    expect(plural(1, 'dotted quarter')).toBe('1 dotted quarter');
    expect(plural(1, 'bar')).toBe('1 bar');
    expect(plural(1, 'minute')).toBe('1 minute');
    expect(plural(7, 'day')).toBe('7 days');
  });
});

describe('barsFit', () => {
  test('the verb agrees with the count, to a tenth', () => {
    expect(barsFit(1)).toBe('1 bar fits');
    expect(barsFit(2)).toBe('2 bars fit');
    expect(barsFit(2.5)).toBe('2.5 bars fit');
    expect(barsFit(0.5)).toBe('0.5 bars fit');
  });
});

describe('formatDate and formatDateTime', () => {
  // The orders and month names are the CLDR locale data's, through Intl (ECMA-402); the same instant reads
  // day-month in British English and month-day in American English.
  const at = new Date(Date.UTC(2026, 11, 2, 14, 5));
  test('dates in the locale asked for', () => {
    expect(formatDate(at, 'en-GB')).toMatch(/^2 Dec 2026$/);
    expect(formatDate(at, 'en-US')).toMatch(/^Dec 2, 2026$/);
    expect(formatDate(at.toISOString(), 'de-DE')).toMatch(/^02\.12\.2026$/);
  });
  test('a time of day in the locale’s clock', () => {
    expect(formatDateTime(at, 'en-US')).toMatch(/\d{1,2}:05\s?[AP]M$/);
    expect(formatDateTime(at, 'de-DE')).toMatch(/^02\.12\.2026, \d{2}:05$/);
  });
});

test('whose: one’s own things are "your", someone else’s carry their first name', () => {
  const ilya = { id: 'u1', name: 'Ilya Brandt' };
  expect(whose('take', ilya, 'u1')).toBe('Your take');
  expect(whose('take', ilya, 'u2')).toBe('Ilya’s take');
  expect(whose('song', { id: 'u3', name: 'Tomás Reyes' }, 'u2')).toBe('Tomás’s song');
});

test('a moment typed as m:ss, m:ss.s or plain seconds (worked examples by hand)', () => {
  expect(parseClock('0:42')).toBe(42);
  expect(parseClock('1:05.5')).toBe(65.5);
  expect(parseClock('42')).toBe(42);
  expect(parseClock('3:30,0')).toBe(210);
  expect(parseClock('1:75')).toBeNull();
  expect(parseClock('soon')).toBeNull();
});

test('practice minutes: a tenth under ten, whole minutes up to two hours, then hours and minutes (by hand)', () => {
  expect(formatMinutes(0.1)).toBe('0.1 min');
  expect(formatMinutes(5)).toBe('5 min');
  expect(formatMinutes(9.96)).toBe('10 min');
  expect(formatMinutes(31)).toBe('31 min');
  expect(formatMinutes(68.1)).toBe('68 min');
  expect(formatMinutes(119.6)).toBe('2 h 00 min');
  expect(formatMinutes(125)).toBe('2 h 05 min');
});

test('a day number reads as that calendar day whatever the reader’s zone (day 20789 is 2026-12-02)', () => {
  // Date.UTC(2026, 11, 2) / 86 400 000 = 20789; 12:00 of that day is 20789.5 and still 2 December.
  expect(formatDayNumber(20789, 'en-GB')).toBe('2 Dec');
  expect(formatDayNumber(20789.5, 'en-US')).toBe('Dec 2');
});

describe('formatOffsetMs', () => {
  test('early reads with a true minus sign, late with a plus, whole milliseconds', () => {
    expect(formatOffsetMs(-12.4)).toBe('−12 ms');
    expect(formatOffsetMs(8.6)).toBe('+9 ms');
    expect(formatOffsetMs(0.3)).toBe('0 ms');
    expect(formatOffsetMs(-0.4)).toBe('0 ms');
  });
});
