/**
 * Archives people download, read without options: Environment and Climate Change Canada hourly CSV, Iowa
 * Environmental Mesonet (IEM) ASOS downloads with their options, NCEI Local Climatological Data (raw, with
 * `REM`). Samples are written from each archive's published column description (named beside each test);
 * values are invented.
 */
import { test } from 'uvu';
import * as assert from 'uvu/assert';
import { readFileSync } from 'node:fs';
import { readCsvText } from '../../src/ingest/csv.js';
import { loadPaths } from '../../src/pipeline.js';
import { REALSKILL_DIR, realskillTest } from '../helpers/realdata.js';

const iso = (ms: number) => new Date(ms).toISOString();

// ECCC "Hourly data" bulk CSV (climate.weather.gc.ca, the column list of its technical documentation, from memory):
// every cell quoted, units in brackets, wind direction in tens of degrees, station pressure in kPa, time LST.
const ECCC_HEADER =
  '"Longitude (x)","Latitude (y)","Station Name","Climate ID","Date/Time (LST)","Year","Month","Day","Time (LST)","Temp (°C)","Temp Flag","Dew Point Temp (°C)","Dew Point Temp Flag","Rel Hum (%)","Rel Hum Flag","Precip. Amount (mm)","Precip. Amount Flag","Wind Dir (10s deg)","Wind Dir Flag","Wind Spd (km/h)","Wind Spd Flag","Visibility (km)","Visibility Flag","Stn Press (kPa)","Stn Press Flag","Hmdx","Hmdx Flag","Wind Chill","Wind Chill Flag","Weather"';
const ecccRow = (dt: string, t: string, wd: string, ws: string, p: string) =>
  `"-75.72","45.38","OTTAWA CDA RCS","6105978","${dt}","${dt.slice(0, 4)}","${dt.slice(5, 7)}","${dt.slice(8, 10)}","${dt.slice(11)}","${t}","","-0.4","","94","","0.0","","${wd}","","${ws}","","","","${p}","","","","","","NA"`;

test('ECCC hourly CSV: bracketed units, tens of degrees, kPa, LST as standard time all year', () => {
  const text = [ECCC_HEADER, ecccRow('2023-07-01 00:00', '20.5', '27', '36', '99.80'), ecccRow('2023-07-01 01:00', '', '', '', '')].join('\n') + '\n';
  const r = readCsvText(text, 'en_climate_hourly_ON_6105978_07-2023_P1H.csv', { zone: 'America/Toronto' });
  assert.is(r.report.parsed, 2);
  const o = r.observations[0]!;
  assert.is(o.station, '6105978'); // Climate ID
  // LST = local standard time: EST = UTC−5 even in July (ECCC documentation: "LST", no daylight saving)
  assert.is(iso(o.timeMs), '2023-07-01T05:00:00.000Z');
  assert.is(o.windDirDeg, 270); // 27 tens of degrees
  assert.ok(Math.abs(o.windSpeedMs - 10) < 1e-12); // 36 km/h = 10 m/s (SI)
  assert.is(o.stationPressureHpa, 998); // 99.80 kPa = 998.0 hPa
  assert.is(o.temperatureC, 20.5);
  assert.is(o.latDeg, 45.38);
  assert.ok(Number.isNaN(r.observations[1]!.temperatureC)); // empty = missing
  assert.ok(r.report.notes.some((n) => n.includes('local standard time all year')));
  // without a zone the LST rows are counted as needing one, never dropped
  const z = readCsvText(text, 'e.csv', {});
  assert.equal(z.report.rejectedByReason, { 'needs-zone': 2 });
});

// IEM ASOS download (mesonet.agron.iastate.edu/request/download.phtml, its option list, from memory): `valid` UTC
// by default, `M` or `null` for missing, wind as `sknt` (knots) or `sped` (mph), with or without `metar`.
test('IEM download: sped in mph, gust_mph, null and M missing, valid UTC', () => {
  const csv = 'station,valid,tmpc,dwpc,relh,feel,drct,sped,mslp,p01m,gust_mph\nSUT,2013-06-01 18:15,30.00,22.00,62.1,95.0,200.00,10.00,null,0.00,null\nSUT,2013-06-01 18:35,M,M,M,M,M,M,M,M,M\n';
  const r = readCsvText(csv, 'SUT.csv', {});
  assert.is(r.report.parsed, 2);
  assert.is(r.report.units.windSpeed, 'mph');
  assert.ok(Math.abs(r.observations[0]!.windSpeedMs - 4.4704) < 1e-12); // 10 mph × 0.44704 (NIST SP 811 B.8)
  assert.ok(Number.isNaN(r.observations[0]!.seaLevelPressureHpa));
  assert.ok(Number.isNaN(r.observations[0]!.gustMs));
  assert.is(iso(r.observations[0]!.timeMs), '2013-06-01T18:15:00.000Z');
  const k = readCsvText('station,valid,tmpf,sknt,drct\nORD,2019-01-01 00:51,30,10,270\n', 'o.csv', {});
  assert.ok(Math.abs(k.observations[0]!.windSpeedMs - 5.144444444444445) < 1e-12); // 10 kt × 1852/3600
});

test('IEM valid is UTC by convention: --tz and --utc-offset do not shift it; mapping the column does', () => {
  const csv = 'station,valid,tmpf,drct,sknt\nORD,2019-01-01 00:51,30,270,10\n';
  const plain = readCsvText(csv, 'o.csv', {});
  const tz = readCsvText(csv, 'o.csv', { zone: 'America/Chicago' });
  const off = readCsvText(csv, 'o.csv', { offsetMinutes: -360 });
  assert.is(iso(plain.observations[0]!.timeMs), '2019-01-01T00:51:00.000Z');
  assert.is(tz.observations[0]!.timeMs, plain.observations[0]!.timeMs);
  assert.is(off.observations[0]!.timeMs, plain.observations[0]!.timeMs);
  assert.ok(tz.report.notes.some((n) => n.includes('--tz not applied')));
  // a local export, said so by mapping the column: CST = UTC−6 (IANA tz database, America/Chicago)
  const local = readCsvText(csv, 'o.csv', { zone: 'America/Chicago', overrides: [{ header: 'valid', field: 'time' }] });
  assert.is(iso(local.observations[0]!.timeMs), '2019-01-01T06:51:00.000Z');
  // a naive generic time column still takes --tz
  assert.is(iso(readCsvText('time,temp_c\n2019-01-01 00:51,1\n', 'g.csv', { zone: 'America/Chicago' }).observations[0]!.timeMs), '2019-01-01T06:51:00.000Z');
});

// NCEI LCD raw export (LCD documentation: STATION, DATE local standard time, REPORT_TYPE, Hourly* columns, REM
// with the METAR text after a `MET` header). Values invented; the REM text follows WMO-No. 306 FM 15 with FMH-1 remarks.
test('NCEI LCD raw form: REM decoded (T group tenths), summary rows rejected, DATE local standard time', () => {
  const h = 'STATION,DATE,REPORT_TYPE,SOURCE,HourlyAltimeterSetting,HourlyDewPointTemperature,HourlyDryBulbTemperature,HourlyPrecipitation,HourlyPresentWeatherType,HourlyRelativeHumidity,HourlySeaLevelPressure,HourlyStationPressure,HourlyWindDirection,HourlyWindGustSpeed,HourlyWindSpeed,REM';
  const rows = [
    '72530094846,2019-01-01T00:51:00,FM-15,7,30.02,30,33,0.00,,89,30.03,29.28,290,,9,MET10301/01/19 00:51:02 METAR KORD 010651Z 29008KT 10SM OVC020 01/M01 A3002 RMK AO2 SLP171 T00061011',
    '72530094846,2019-01-01T23:59:00,SOD  ,6,,,,,,,,,,,,SYN',
  ];
  const r = readCsvText([h, ...rows].join('\n') + '\n', 'lcd.csv', { zone: 'America/Chicago', decodeRawReport: (text) => (text.includes('T00061011') ? { temperatureC: 0.6, dewpointC: -1.1, tempFromRemarks: true } : null) });
  assert.is(r.report.parsed, 1);
  assert.equal(r.report.rejectedByReason, { 'summary-row': 1 });
  const o = r.observations[0]!;
  assert.is(o.source, 'METAR');
  assert.is(o.temperatureC, 0.6); // the T group's tenths replace the whole-°F column (FMH-1 §12.7.1.j, T00061011 = 0.6 / −1.1 °C)
  assert.is(iso(o.timeMs), '2019-01-01T06:51:00.000Z'); // CST = UTC−6, the METAR says 0651Z
});

// Real processed LCD file (../shared/realskill/README.md): DATE local standard time, ORD UTC−6; 12 876 data lines (wc -l).
realskillTest(test, 'ORD_2019_LCD_localstd.csv')('real processed LCD file with --utc-offset −6: every line parsed', () => {
  const f = REALSKILL_DIR + 'ORD_2019_LCD_localstd.csv';
  const r = readCsvText(readFileSync(f, 'utf8'), f, { offsetMinutes: -360 });
  assert.is(r.report.parsed + r.report.rejected, 12876);
  assert.is(r.report.rejected, 0);
  assert.is(iso(r.observations[0]!.timeMs), '2019-01-01T06:00:00.000Z'); // first row 2019-01-01T00:00:00 local standard
});

// Real IEM files (../shared/realskill/README.md): sped and gust_mph in mph, null = missing, UTC; 127 499 data lines (wc -l).
realskillTest(test, 'SUT_2013-2017_iem.csv')('real IEM SUT file: sped read as mph, every line parsed', () => {
  const f = REALSKILL_DIR + 'SUT_2013-2017_iem.csv';
  const { reports, series } = loadPaths([f]);
  assert.is(reports[0]!.parsed + reports[0]!.rejected, 127499);
  assert.is(reports[0]!.units.windSpeed, 'mph');
  assert.is(series.length, 1);
  let speeds = 0;
  for (let i = 0; i < series[0]!.length; i++) if (series[0]!.windSpeedMs[i]! > 0) speeds++;
  assert.ok(speeds > 50000, `non-zero speeds ${speeds}`); // wind was ignored before: now read
});

test.run();
