/**
 * Archives people download, read without options: Environment and Climate Change Canada hourly CSV, Iowa
 * Environmental Mesonet (IEM) ASOS downloads with their options, NCEI Local Climatological Data (raw, with
 * `REM`). Samples are written from each archive's published column description (named beside each test);
 * values are invented.
 */
import { test } from 'uvu';
import * as assert from 'uvu/assert';
import { mkdtempSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { readCsvText } from '../../src/ingest/csv.js';
import { ecccProvince, ecccWeatherFlags } from '../../src/ingest/eccc.js';
import { WX } from '../../src/model/index.js';
import { loadPaths } from '../../src/pipeline.js';
import { ECCC_HEADER } from '../helpers/archives.js';
import { REALSKILL_DIR, realskillTest } from '../helpers/realdata.js';

const iso = (ms: number) => new Date(ms).toISOString();

// ECCC "Hourly data" bulk CSV (climate.weather.gc.ca, the column list of its technical documentation, from memory):
// every cell quoted, units in brackets, wind direction in tens of degrees, station pressure in kPa, time LST.
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
  // without a zone the LST rows take the standard time of the zone at the station's coordinates (Ottawa:
  // America/Toronto, UTC−5 standard, IANA tz database) ...
  const z = readCsvText(text, 'e.csv', {});
  assert.equal(z.report.rejectedByReason, {});
  assert.is(iso(z.observations[0]!.timeMs), '2023-07-01T05:00:00.000Z');
  // ... and without coordinates either they are counted as needing one, never dropped
  const noPos = readCsvText(text.replaceAll('"-75.72","45.38"', '"",""'), 'e.csv', {});
  assert.equal(noPos.report.rejectedByReason, { 'needs-zone': 2 });
});

const ecccRowAt = (id: string, dt: string, weather: string) =>
  `"-63.51","44.88","INVENTED FIELD","${id}","${dt}","${dt.slice(0, 4)}","${dt.slice(5, 7)}","${dt.slice(8, 10)}","${dt.slice(11)}","12.0","","8.0","","77","","","","18","","20","","","","100.50","","","","","","${weather}"`;

test('ECCC hourly CSV without --tz: LST offset from the Climate ID province where it keeps one standard time', () => {
  // Climate ID 8202250 (invented station, prefix 82 = Nova Scotia, from memory of the ECCC station inventory);
  // Nova Scotia keeps Atlantic Standard Time, UTC−4 (IANA tz database, America/Halifax); LST all year, so July too
  const text = [ECCC_HEADER, ecccRowAt('8202250', '2023-07-01 00:00', 'Rain'), ecccRowAt('8202250', '2023-07-01 01:00', 'NA')].join('\n') + '\n';
  const r = readCsvText(text, 'en_climate_hourly_NS_8202250_07-2023_P1H.csv', {});
  assert.is(r.report.parsed, 2);
  assert.is(iso(r.observations[0]!.timeMs), '2023-07-01T04:00:00.000Z');
  assert.ok(r.report.assumed?.includes('standard time from the ECCC Climate ID province'));
  assert.ok(r.report.notes.some((n) => n === 'Climate ID 8202250: Nova Scotia, LST read as UTC−4'), r.report.notes.join('\n'));
  // an offset given wins over the province (UTC−5 given: 05:00 UTC)
  assert.is(iso(readCsvText(text, 'e.csv', { offsetMinutes: -300 }).observations[0]!.timeMs), '2023-07-01T05:00:00.000Z');
  // Ontario (prefix 6) keeps Eastern and Central standard time: the zone comes from the coordinates, and these
  // (Nova Scotia's: America/Halifax, UTC−4) give none of Ontario's standard times, so its rows still need a zone
  const on = readCsvText([ECCC_HEADER, ecccRowAt('6105978', '2023-07-01 00:00', '')].join('\n') + '\n', 'e.csv', {});
  assert.equal(on.report.rejectedByReason, { 'needs-zone': 1 });
  assert.ok(
    on.report.notes.includes(
      "station 6105978: zone UTC−4 (standard time of America/Halifax, from the station's coordinates) refused: Ontario keeps UTC−5 and UTC−6 (check the sign of the longitude, 44.88, -63.51); its rows need --utc-offset MINUTES or --tz ZONE",
    ),
    on.report.notes.join('\n'),
  );
});

test('loadPaths: naive CSV times take the zone the stations file gives the station (tz), before the Climate ID rule', () => {
  // invented files; zones and offsets from the IANA tz database (America/Toronto: EST UTC−5, EDT UTC−4)
  const dir = mkdtempSync(join(tmpdir(), 'fropa-zone-'));
  writeFileSync(join(dir, 'stations.csv'), 'id,lat,lon,tz\n6105978,45.38,-75.72,America/Toronto\nXGEN,45,-75,America/Toronto\n');
  writeFileSync(join(dir, 'eccc.csv'), [ECCC_HEADER, ecccRow('2023-07-01 00:00', '20.5', '27', '36', '99.80')].join('\n') + '\n');
  writeFileSync(join(dir, 'XGEN_2023.csv'), 'time,temp_c\n2023-07-01 00:00,20\n');
  const r = loadPaths([dir]);
  const t = (id: string) => iso(r.series.find((s) => s.station === id)!.timeMs[0]!);
  assert.is(t('6105978'), '2023-07-01T05:00:00.000Z'); // LST: Eastern Standard Time all year, UTC−5
  assert.is(t('XGEN'), '2023-07-01T04:00:00.000Z'); // a plain naive time: EDT in July, UTC−4
  const eccc = r.reports.find((x) => x.file.endsWith('eccc.csv'))!;
  assert.ok(eccc.notes.includes("station 6105978: naive times read in America/Toronto standard time (the stations file's tz)"), eccc.notes.join('\n'));
  assert.ok(eccc.assumed?.includes('zone from the stations file'));
  rmSync(dir, { recursive: true });
});

test('ECCC Weather words give the WX flags of the matching METAR groups (code table 4678); unknown words are counted', () => {
  // words from memory of the ECCC historical climate data glossary ("Weather"); groups per WMO-No. 306 code table 4678
  const cases: [string, number][] = [
    ['Rain', WX.RAIN | WX.PRECIP],
    ['Snow Showers', WX.SNOW | WX.SHOWER | WX.PRECIP],
    ['Thunderstorms', WX.THUNDER],
    ['Freezing Rain,Fog', WX.FREEZING | WX.RAIN | WX.PRECIP | WX.FOG],
    ['Heavy Snow', WX.HEAVY | WX.SNOW | WX.PRECIP],
    // intensity only where a word names it (Light, Moderate, Heavy); a bare word carries none
    ['Moderate Rain,Drizzle', WX.RAIN | WX.DRIZZLE | WX.PRECIP | WX.MODERATE],
    ['Light Snow', WX.SNOW | WX.PRECIP | WX.LIGHT],
    ['Light Fog', WX.FOG],
    ['Ice Pellets', WX.ICE_PELLETS | WX.PRECIP],
    ['Mostly Cloudy', 0],
    ['NA', 0],
  ];
  for (const [w, flags] of cases) assert.is(ecccWeatherFlags(w).flags, flags, w);
  assert.equal(ecccWeatherFlags('Rain,Volcanic Glitter').unknown, ['Volcanic Glitter']);
  const rows = [ECCC_HEADER, ecccRowAt('5023222', '2023-01-05 06:00', 'Snow,Blowing Snow'), ecccRowAt('5023222', '2023-01-05 07:00', 'Sparkles')];
  const r = readCsvText(rows.join('\n') + '\n', 'e.csv', {});
  assert.is(r.report.parsed, 2);
  assert.is(r.observations[0]!.weather, WX.SNOW | WX.PRECIP);
  assert.is(r.observations[1]!.weather, 0);
  // Manitoba keeps Central Standard Time, UTC−6 (IANA tz database, America/Winnipeg)
  assert.is(iso(r.observations[0]!.timeMs), '2023-01-05T12:00:00.000Z');
  assert.ok(r.report.notes.some((n) => n.startsWith('unknown-words in weather: 1 value (first at line 3: "Sparkles")')), r.report.notes.join('\n'));
});

test('ecccProvince(id): the province a climate identifier names, its one standard offset or null', () => {
  // prefixes from memory of the ECCC station inventory (module comment of src/ingest/eccc.ts)
  assert.equal(ecccProvince('3031093'), { code: 'AB', name: 'Alberta', standardOffsetMinutes: -420, standardOffsetsMinutes: [-420] });
  // the standard times of a province with several (IANA tz database zone.tab comments: Pacific "BC (most areas)",
  // Mountain "BC(E)" and MST Creston, Dawson Creek, Fort Nelson)
  assert.equal(ecccProvince('1108447')?.standardOffsetsMinutes, [-480, -420]);
  assert.equal(ecccProvince('8300300')?.code, 'PE');
  assert.is(ecccProvince('1108447')?.standardOffsetMinutes, null); // British Columbia: Pacific and Mountain
  assert.is(ecccProvince('9999999'), null);
  assert.is(ecccProvince('ABC'), null);
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
