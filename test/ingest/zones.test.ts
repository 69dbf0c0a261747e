/**
 * The zone of local-standard-time files from the station's coordinates (src/ingest/zones.ts): the lookup against the
 * IANA tz database's own principal locations, standard offsets in both hemispheres, the order of the zone rules, and
 * samples of the archives that write local standard time (values and stations invented; layouts named beside each).
 */
import { test } from 'uvu';
import * as assert from 'uvu/assert';
import { mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { readCsvText } from '../../src/ingest/csv.js';
import { standardOffsetMinutes } from '../../src/ingest/time.js';
import { utcOffsetLabel, zoneAtCoordinates } from '../../src/ingest/zones.js';
import { loadPaths } from '../../src/pipeline.js';
import { cli, put, tempDir } from '../cli/io.js';
import { ECCC_HEADER } from '../helpers/archives.js';
import { REALDATA_DIR, REALSKILL_DIR, realskillTest } from '../helpers/realdata.js';

const iso = (ms: number) => new Date(ms).toISOString();

test('zoneAtCoordinates at the principal location the IANA tz database gives each zone returns that zone', () => {
  // IANA tz database, zone1970.tab (release 2025b, as installed by Debian's tzdata): column 2, ISO 6709 ±DDMM±DDDMM
  // or ±DDMMSS±DDDMMSS, written here in decimal degrees
  const cases: [zone: string, latDeg: number, lonDeg: number][] = [
    ['America/Toronto', 43 + 39 / 60, -(79 + 23 / 60)], // +4339-07923
    ['America/Vancouver', 49 + 16 / 60, -(123 + 7 / 60)], // +4916-12307
    ['America/Winnipeg', 49 + 53 / 60, -(97 + 9 / 60)], // +4953-09709
    ['America/Regina', 50 + 24 / 60, -(104 + 39 / 60)], // +5024-10439
    ['America/Edmonton', 53 + 33 / 60, -(113 + 28 / 60)], // +5333-11328
    ['America/Halifax', 44 + 39 / 60, -(63 + 36 / 60)], // +4439-06336
    ['America/St_Johns', 47 + 34 / 60, -(52 + 43 / 60)], // +4734-05243
    ['America/New_York', 40 + 42 / 60 + 51 / 3600, -(74 + 0 / 60 + 23 / 3600)], // +404251-0740023
    ['America/Chicago', 41 + 51 / 60, -(87 + 39 / 60)], // +415100-0873900
    ['America/Denver', 39 + 44 / 60 + 21 / 3600, -(104 + 59 / 60 + 3 / 3600)], // +394421-1045903
    ['America/Phoenix', 33 + 26 / 60 + 54 / 3600, -(112 + 4 / 60 + 24 / 3600)], // +332654-1120424
    ['America/Los_Angeles', 34 + 3 / 60 + 8 / 3600, -(118 + 14 / 60 + 34 / 3600)], // +340308-1181434
    ['Australia/Sydney', -(33 + 52 / 60), 151 + 13 / 60], // -3352+15113
    ['Australia/Lord_Howe', -(31 + 33 / 60), 159 + 5 / 60], // -3133+15905
    ['America/Santiago', -(33 + 27 / 60), -(70 + 40 / 60)], // -3327-07040
    ['Pacific/Auckland', -(36 + 52 / 60), 174 + 46 / 60], // -3652+17446
    ['Asia/Kathmandu', 27 + 43 / 60, 85 + 19 / 60], // +2743+08519
  ];
  for (const [zone, lat, lon] of cases) {
    const z = zoneAtCoordinates(lat, lon, 2023);
    assert.ok(!('error' in z) && z.zone === zone, `${zone}: ${JSON.stringify(z)}`);
  }
});

test('standard offsets: the smaller of the 1 January and 1 July offsets, in both hemispheres', () => {
  // offsets of the IANA tz database (from memory of its northamerica, southamerica, australasia and asia files)
  assert.is(standardOffsetMinutes('America/Toronto', 2023), -300); // EST; EDT −4 in July is daylight time
  assert.is(standardOffsetMinutes('America/St_Johns', 2023), -210); // NST −3:30
  assert.is(standardOffsetMinutes('America/Regina', 2023), -360); // CST all year, no daylight saving
  assert.is(standardOffsetMinutes('Australia/Sydney', 2023), 600); // AEST +10; AEDT +11 is the January offset
  assert.is(standardOffsetMinutes('America/Santiago', 2023), -240); // −4; −3 is Chile's summer (January) time
  assert.is(standardOffsetMinutes('Australia/Lord_Howe', 2023), 630); // +10:30, a half-hour daylight shift to +11
  assert.is(standardOffsetMinutes('Asia/Kathmandu', 2023), 345); // +5:45
  assert.is(utcOffsetLabel(-210), 'UTC−3:30');
  assert.is(utcOffsetLabel(345), 'UTC+5:45');
});

test('no zone where the lookup has only longitude to go by, nor for placeholder or impossible coordinates (common practice, no source)', () => {
  // mid-Pacific and mid-Atlantic: open sea, where only nautical zones (Etc/GMT±N) exist
  assert.ok('error' in zoneAtCoordinates(30, -140, 2023));
  assert.ok('error' in zoneAtCoordinates(40, -40, 2023));
  assert.ok('error' in zoneAtCoordinates(0, 0, 2023));
  assert.ok('error' in zoneAtCoordinates(91, 10, 2023));
  assert.ok('error' in zoneAtCoordinates(NaN, 10, 2023));
  // a point within 25 km of a zone of another standard time is said to be near a boundary (the Eastern/Central
  // line in northwestern Ontario runs near 90° W: IANA zone.tab "Central - ON (west)")
  const z = zoneAtCoordinates(48.5, -90.0, 2023);
  assert.ok(!('error' in z) && z.near !== null, JSON.stringify(z));
});

// ECCC hourly CSV (test/helpers/archives.ts). Stations invented.
const eccc = (lon: string, lat: string, name: string, id: string, dt: string) =>
  `"${lon}","${lat}","${name}","${id}","${dt}","${dt.slice(0, 4)}","${dt.slice(5, 7)}","${dt.slice(8, 10)}","${dt.slice(11)}","21.4","","12.1","","55","","0.0","","25","","17","","24.1","","99.12","","","","","","NA"`;
const ecccFile = (...rows: string[]) => [ECCC_HEADER, ...rows].join('\n') + '\n';

test('ECCC hourly CSV of an Ontario station without --tz: LST is the standard time of the zone at its coordinates', () => {
  // invented station (Climate ID prefix 6 = Ontario) near London, Ontario: America/Toronto, EST = UTC−5 in January
  // and July alike (LST never shifts for daylight saving; ECCC documentation, "LST")
  const text = ecccFile(eccc('-81.15', '43.03', 'INVENTED HARBOUR', '6144499', '2023-01-15 00:00'), eccc('-81.15', '43.03', 'INVENTED HARBOUR', '6144499', '2023-07-01 00:00'));
  const r = readCsvText(text, 'en_climate_hourly_ON_6144499_2023_P1H.csv', {});
  assert.equal(r.report.rejectedByReason, {});
  assert.is(iso(r.observations[0]!.timeMs), '2023-01-15T05:00:00.000Z');
  assert.is(iso(r.observations[1]!.timeMs), '2023-07-01T05:00:00.000Z');
  assert.ok(r.report.notes.includes("station 6144499: zone UTC−5 (standard time of America/Toronto, from the station's coordinates), 43.03, -81.15"), r.report.notes.join('\n'));
  assert.ok(r.report.assumed?.includes("zone from the station's coordinates (UTC−5, America/Toronto)"));
  // --utc-offset and --tz win over the coordinates
  assert.is(iso(readCsvText(text, 'e.csv', { offsetMinutes: -360 }).observations[1]!.timeMs), '2023-07-01T06:00:00.000Z');
  assert.is(iso(readCsvText(text, 'e.csv', { zone: 'America/Winnipeg' }).observations[1]!.timeMs), '2023-07-01T06:00:00.000Z');
});

test('ECCC hourly CSV of British Columbia stations: Pacific on the coast side, Mountain in the east Kootenays', () => {
  // invented stations (prefix 1 = British Columbia) near Kamloops (America/Vancouver, PST UTC−8) and near Cranbrook
  // (America/Edmonton, MST UTC−7: IANA zone.tab "Mountain - AB, BC(E)"); both standard times are BC's
  const text = ecccFile(eccc('-120.44', '50.70', 'INVENTED RIVER FLATS', '1120999', '2023-07-01 00:00'), eccc('-115.78', '49.61', 'INVENTED BENCH', '1152999', '2023-07-01 00:00'));
  const r = readCsvText(text, 'bc.csv', {});
  assert.equal(r.report.rejectedByReason, {});
  assert.is(iso(r.observations[0]!.timeMs), '2023-07-01T08:00:00.000Z');
  assert.is(iso(r.observations[1]!.timeMs), '2023-07-01T07:00:00.000Z');
  assert.ok(r.report.notes.includes("station 1152999: zone UTC−7 (standard time of America/Edmonton, from the station's coordinates), 49.61, -115.78"), r.report.notes.join('\n'));
  // a longitude that lost its sign lands in Asia: refused, none of BC's standard times; the rows need a zone
  const bad = readCsvText(ecccFile(eccc('120.44', '50.70', 'INVENTED RIVER FLATS', '1120999', '2023-07-01 00:00')), 'bc.csv', {});
  assert.equal(bad.report.rejectedByReason, { 'needs-zone': 1 });
  assert.ok(bad.report.notes.some((n) => n.startsWith('station 1120999: zone UTC+8') && n.includes('refused: British Columbia keeps UTC−8 and UTC−7')), bad.report.notes.join('\n'));
});

test('the order of the zone rules: stations-file tz, then the Climate ID province, then the coordinates', () => {
  // a Nova Scotia Climate ID (prefix 82: Atlantic Standard Time, UTC−4) at Ontario coordinates: the province decides
  const ns = readCsvText(ecccFile(eccc('-81.15', '43.03', 'INVENTED COVE', '8202999', '2023-07-01 00:00')), 'ns.csv', {});
  assert.is(iso(ns.observations[0]!.timeMs), '2023-07-01T04:00:00.000Z');
  assert.ok(!ns.report.notes.some((n) => n.includes('from the station')));
  // a stations-file tz wins over the coordinates (America/Winnipeg: CST UTC−6)
  const dir = mkdtempSync(join(tmpdir(), 'fropa-zones-'));
  writeFileSync(join(dir, 'stations.csv'), 'id,lat,lon,tz\n6144499,43.03,-81.15,America/Winnipeg\n');
  writeFileSync(join(dir, 'on.csv'), ecccFile(eccc('-81.15', '43.03', 'INVENTED HARBOUR', '6144499', '2023-07-01 00:00')));
  const r = loadPaths([dir]);
  assert.is(iso(r.series[0]!.timeMs[0]!), '2023-07-01T06:00:00.000Z');
  rmSync(dir, { recursive: true });
});

test('coordinates from the stations file when the file has none; a southern-hemisphere zone reads its winter standard time', () => {
  // a generic file whose time column says LST (invented station XSYD near Sydney: AEST UTC+10 all year; AEDT +11
  // in January is daylight time, not standard: IANA tz database, australasia, from memory)
  const dir = mkdtempSync(join(tmpdir(), 'fropa-zones-'));
  writeFileSync(join(dir, 'stations.csv'), 'id,lat,lon\nXSYD,-33.95,151.18\n');
  writeFileSync(join(dir, 'XSYD.csv'), 'time (LST),temp_c\n2023-01-15 12:00,28\n2023-07-15 12:00,16\n');
  const r = loadPaths([dir]);
  const s = r.series.find((x) => x.station === 'XSYD')!;
  assert.is(iso(s.timeMs[0]!), '2023-01-15T02:00:00.000Z');
  assert.is(iso(s.timeMs[1]!), '2023-07-15T02:00:00.000Z');
  const rep = r.reports.find((x) => x.file.endsWith('XSYD.csv'))!;
  assert.ok(rep.notes.includes("station XSYD: zone UTC+10 (standard time of Australia/Sydney, from the station's coordinates in the stations file), -33.95, 151.18"), rep.notes.join('\n'));
  rmSync(dir, { recursive: true });
});

test('never for times UTC by convention, nor for naive times that may keep daylight saving, nor from longitude alone', () => {
  // IEM `valid` is UTC (IEM ASOS download page, from memory): the coordinates change nothing
  const iem = readCsvText('station,valid,tmpf,lat,lon\nXIEM,2023-07-01 00:00,70,43.03,-81.15\n', 'iem.csv', {});
  assert.is(iso(iem.observations[0]!.timeMs), '2023-07-01T00:00:00.000Z');
  // a naive local time that does not say LST: still needs a zone (it may keep daylight saving, or be UTC)
  const naive = readCsvText('station,time,temp_c,lat,lon\nXNAI,2023-07-01 00:00,20,43.03,-81.15\n', 'n.csv', {});
  assert.equal(naive.report.rejectedByReason, { 'needs-zone': 1 });
  // longitude without latitude: no zone
  const lonOnly = readCsvText('station,time (LST),temp_c,lon\nXLON,2023-07-01 00:00,20,-81.15\n', 'l.csv', {});
  assert.equal(lonOnly.report.rejectedByReason, { 'needs-zone': 1 });
});

// NCEI LCD CSV (LCD documentation, from memory): STATION, DATE (local standard time), LATITUDE, LONGITUDE, ELEVATION,
// NAME, REPORT_TYPE, SOURCE, Hourly* columns in °F, mph, inHg; every cell quoted. Stations and values invented.
test('NCEI LCD file of a state with two zones (Florida): each station in the standard time of the zone at its coordinates', () => {
  const h = '"STATION","DATE","LATITUDE","LONGITUDE","ELEVATION","NAME","REPORT_TYPE","SOURCE","HourlyDewPointTemperature","HourlyDryBulbTemperature","HourlyStationPressure","HourlyWindDirection","HourlyWindSpeed"';
  const row = (id: string, lat: string, lon: string, name: string, date: string) => `"${id}","${date}","${lat}","${lon}","30.5","${name}","FM-15","7","70","84","29.95","200","9"`;
  const text =
    [
      h,
      // near Pensacola (Central: America/Chicago, CST UTC−6) and near Tallahassee (Eastern: America/New_York, EST UTC−5)
      row('99999900001', '30.47', '-87.19', 'INVENTED GULF FIELD, FL US', '2019-07-01T00:53:00'),
      row('99999900002', '30.39', '-84.35', 'INVENTED PINE FIELD, FL US', '2019-07-01T00:53:00'),
    ].join('\n') + '\n';
  const r = readCsvText(text, 'lcd_fl.csv', {});
  assert.equal(r.report.rejectedByReason, {});
  assert.is(iso(r.observations[0]!.timeMs), '2019-07-01T06:53:00.000Z');
  assert.is(iso(r.observations[1]!.timeMs), '2019-07-01T05:53:00.000Z');
  assert.ok(r.report.notes.includes("station 99999900002: zone UTC−5 (standard time of America/New_York, from the station's coordinates), 30.39, -84.35"), r.report.notes.join('\n'));
});

test('NCEI LCD file with a stations-file tz: local standard time all year, never daylight time', () => {
  // LCD documentation (from memory): DATE is local standard time; America/Chicago standard time is CST, UTC−6
  const h = 'STATION,DATE,REPORT_TYPE,SOURCE,HourlyDryBulbTemperature,HourlyWindDirection,HourlyWindSpeed';
  const r = readCsvText(`${h}\n99999900003,2019-07-01T00:53:00,FM-15,7,84,200,9\n`, 'lcd.csv', { stationZone: () => 'America/Chicago' });
  assert.is(iso(r.observations[0]!.timeMs), '2019-07-01T06:53:00.000Z');
});

// Real LCD file reduced to a few columns (../shared/realskill/README.md: DATE local standard time all year, ORD
// UTC−6), no coordinates in it: the stations file's KORD (alias ORD; ../shared/realdata/stations.csv) gives them
realskillTest(test, 'ORD_2019_LCD_localstd.csv')('real reduced LCD file: zone from the stations file\'s coordinates = --utc-offset −360; --tz reads standard time', () => {
  const f = REALSKILL_DIR + 'ORD_2019_LCD_localstd.csv';
  const byCoordinates = loadPaths([f], { stationsFile: REALDATA_DIR + 'stations.csv' }).series.find((s) => s.station === 'KORD')!;
  const byOffset = loadPaths([f], { offsetMinutes: -360 }).series[0]!;
  assert.is(byCoordinates.length, byOffset.length);
  assert.equal([...byCoordinates.timeMs], [...byOffset.timeMs]);
  // --tz America/Chicago: CST all year too (no daylight time in July), the same instants
  const byZone = loadPaths([f], { zone: 'America/Chicago' }).series[0]!;
  assert.equal([...byZone.timeMs], [...byOffset.timeMs]);
});

test('inspect says which rule gave the zone, and the summary line names it', async () => {
  const dir = tempDir();
  const f = put(dir, 'on.csv', ecccFile(eccc('-81.15', '43.03', 'INVENTED HARBOUR', '6144499', '2023-07-01 00:00'), eccc('-81.15', '43.03', 'INVENTED HARBOUR', '6144499', '2023-07-01 01:00')));
  const ins = await cli(['inspect', f]);
  assert.is(ins.code, 0, ins.stderr);
  assert.match(ins.stdout, "station 6144499: zone UTC−5 (standard time of America/Toronto, from the station's coordinates), 43.03, -81.15");
  const last = ins.stdout.trimEnd().split('\n').pop()!;
  assert.match(last, "zone from the station's coordinates (UTC−5, America/Toronto) (1 file)");
});

test.run();
