/**
 * Calendar arithmetic for METAR dating (src/ingest/metar/calendar.ts). A report carries day, hour and
 * minute only (WMO-No. 306 FM 15 group YYGGggZ), so the year and month come from outside. File-name
 * dates and the archive-mode year end are checked in test/ingest/metar-calendar.test.ts.
 */
import { test } from 'uvu';
import * as assert from 'uvu/assert';
import {
  archiveStampInto,
  civilFromDays,
  daysFromCivil,
  daysInMonth,
  parseMonthOption,
  reportTimeMs,
  type ArchiveStamp,
} from '../../../src/ingest/metar/calendar.js';
import { asciiBytes } from '../../../src/ingest/metar/ascii.js';

const DAY = 86_400_000;

test('daysInMonth() follows the Gregorian leap-year rule', () => {
  // Gregorian calendar (Inter gravissimas, 1582): leap every 4th year, not centuries, but every 4th century
  assert.is(daysInMonth(2024, 2), 29);
  assert.is(daysInMonth(2023, 2), 28);
  assert.is(daysInMonth(1900, 2), 28);
  assert.is(daysInMonth(2000, 2), 29);
  assert.is(daysInMonth(2100, 2), 28);
  // Gregorian calendar: 30 days have September, April, June and November
  assert.equal([4, 6, 9, 11].map((m) => daysInMonth(2024, m)), [30, 30, 30, 30]);
  assert.equal([1, 3, 5, 7, 8, 10, 12].map((m) => daysInMonth(2024, m)), [31, 31, 31, 31, 31, 31, 31]);
});

test('daysFromCivil() counts days since 1970-01-01 (Hinnant days_from_civil)', () => {
  // constructed: the epoch is day 0; the doc example 2000-03-01 is day 11017
  assert.is(daysFromCivil(1970, 1, 1), 0);
  assert.is(daysFromCivil(2000, 3, 1), 11017);
  // ECMAScript Date.UTC (ECMA-262 §21.4.1.1 time values) as the reference, across leap days and before 1970
  for (const [y, m, d] of [[1969, 12, 31], [2024, 2, 29], [2024, 3, 1], [1900, 3, 1], [1600, 2, 29], [2100, 12, 31]] as const)
    assert.is(daysFromCivil(y, m, d), Date.UTC(y, m - 1, d) / DAY, `${y}-${m}-${d}`);
});

test('civilFromDays() inverts daysFromCivil (Hinnant civil_from_days)', () => {
  const out: [number, number, number] = [0, 0, 0];
  // constructed: expected by construction
  civilFromDays(0, out);
  assert.equal(out, [1970, 1, 1]);
  civilFromDays(11017, out);
  assert.equal(out, [2000, 3, 1]);
  civilFromDays(-1, out);
  assert.equal(out, [1969, 12, 31]);
  // constructed: a round trip over every day of 1999–2001 (a leap century year in the middle)
  for (let z = daysFromCivil(1999, 1, 1); z <= daysFromCivil(2001, 12, 31); z++) {
    civilFromDays(z, out);
    assert.is(daysFromCivil(out[0], out[1], out[2]), z);
  }
});

test('reportTimeMs() nearest mode places the report day within ±15 days of the reference', () => {
  const ref = { year: 2024, month: 3, refDay: 2, refMode: 'nearest' as const };
  // common practice, no source (MonthRef.refMode doc): day 28 next to 2 March is 28 February (4 days back)
  assert.is(reportTimeMs(28, 6, 0, ref), Date.UTC(2024, 1, 28, 6, 0));
  // common practice, no source: day 16 is 14 days ahead, still March
  assert.is(reportTimeMs(16, 6, 0, ref), Date.UTC(2024, 2, 16, 6, 0));
  // common practice, no source: day 18 is 16 days ahead in March but 13 days back in February
  assert.is(reportTimeMs(18, 6, 0, ref), Date.UTC(2024, 1, 18, 6, 0));
  // common practice, no source: a CSV time just after midnight on the 1st, report of the 31st
  assert.is(reportTimeMs(31, 23, 59, { year: 2020, month: 1, refDay: 1, refMode: 'nearest' }), Date.UTC(2019, 11, 31, 23, 59));
});

test('reportTimeMs() archive mode allows 3 days after the stamp and 25 before', () => {
  const ref = { year: 2024, month: 3, refDay: 10 };
  // common practice, no source (MonthRef doc): day 13 is 3 days after the stamp, same month
  assert.is(reportTimeMs(13, 0, 0, ref), Date.UTC(2024, 2, 13));
  // common practice, no source: day 14 is 4 days after the stamp, so the previous month
  assert.is(reportTimeMs(14, 0, 0, ref), Date.UTC(2024, 1, 14));
});

test('reportTimeMs() adds hour and minute, and its one-entry cache does not leak across references', () => {
  const ref = { year: 2024, month: 7 };
  // constructed: same day, different times
  assert.is(reportTimeMs(4, 17, 54, ref), Date.UTC(2024, 6, 4, 17, 54));
  assert.is(reportTimeMs(4, 18, 0, ref), Date.UTC(2024, 6, 4, 18, 0));
  // WMO-No. 306 FM 15: 2400Z is allowed for midnight at the end of the day (from memory); constructed: the next day 00:00
  assert.is(reportTimeMs(4, 24, 0, ref), Date.UTC(2024, 6, 5, 0, 0));
  // constructed: same day number, another month
  assert.is(reportTimeMs(4, 18, 0, { year: 2024, month: 8 }), Date.UTC(2024, 7, 4, 18, 0));
  // constructed: same day and month, now with a reference day
  assert.is(reportTimeMs(4, 18, 0, { year: 2024, month: 8, refDay: 1 }), Date.UTC(2024, 7, 4, 18, 0));
  assert.is(reportTimeMs(4, 18, 0, { year: 2024, month: 8, refDay: 30, refMode: 'nearest' }), Date.UTC(2024, 8, 4, 18, 0));
});

test('reportTimeMs() without a reference day is NaN for a day the month lacks', () => {
  // Gregorian calendar: no 31 April, no 30 February
  assert.ok(Number.isNaN(reportTimeMs(31, 0, 0, { year: 2024, month: 4 })));
  assert.ok(Number.isNaN(reportTimeMs(30, 0, 0, { year: 2023, month: 2 })));
  assert.is(reportTimeMs(30, 0, 0, { year: 2024, month: 4 }), Date.UTC(2024, 3, 30));
});

test('parseMonthOption() reads YYYY-MM only', () => {
  // constructed: the --month option format
  assert.equal(parseMonthOption('2021-06'), { year: 2021, month: 6 });
  assert.equal(parseMonthOption(' 2021-06 '), { year: 2021, month: 6 });
  for (const s of ['2021-6', '2021-13', '2021-00', '202106', '2021-06-01', '1899-12', '']) assert.is(parseMonthOption(s), null, s);
});

/** Read a stamp at `start` of `line`. */
function stamp(line: string, start = 0): ArchiveStamp | null {
  const out: ArchiveStamp = { year: 0, month: 0, day: 0, next: 0 };
  return archiveStampInto(asciiBytes(line), start, line.length, out) ? out : null;
}

test('archiveStampInto() reads YYYYMMDDHHMM and ISO stamps ahead of a report', () => {
  // constructed: the forms of the function's doc; `next` is where the report starts
  assert.equal(stamp('201912312351 METAR KJFK 312351Z'), { year: 2019, month: 12, day: 31, next: 13 });
  assert.equal(stamp('2020-01-01T00:51:00Z KJFK 010051Z'), { year: 2020, month: 1, day: 1, next: 21 });
  assert.equal(stamp('2020-01-01 01:51 SPECI KJFK'), { year: 2020, month: 1, day: 1, next: 17 });
  assert.equal(stamp('2020-01-01T00:51:00.123Z,KJFK'), { year: 2020, month: 1, day: 1, next: 25 });
  assert.equal(stamp('2020-01-01T00:51\t \tKJFK'), { year: 2020, month: 1, day: 1, next: 19 });
  // constructed: a stamp further into the line
  assert.equal(stamp('xx 201912312351 METAR', 3), { year: 2019, month: 12, day: 31, next: 16 });
});

test('archiveStampInto() refuses reports, bad dates and stamps run into the text', () => {
  // constructed: a bare report, month 13, day 00, no blank after the stamp, too short, ISO without minutes
  for (const line of ['KJFK 010051Z 27010KT', '201913312351 METAR', '201912002351 METAR', '201912312351METAR', '2019123123 M', '2020-01-01T00 KJFK'])
    assert.is(stamp(line), null, line);
});

test.run();
