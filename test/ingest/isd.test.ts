/**
 * NCEI global-hourly (ISD) CSV reader. The sample rows are written from the NCEI "Federal Climate Complex Data
 * Documentation for Integrated Surface Data" (ISD format document): the mandatory data section (WND, TMP, DEW,
 * SLP with their scale factors, missing codes and quality codes) and the additional data section (AA1, MA1,
 * OC1); the column list is that of the NCEI global-hourly access CSV. Values are invented.
 */
import { test } from 'uvu';
import * as assert from 'uvu/assert';
import { decodeIsdValue, decodeIsdWind, isdQuality, isIsdHeaders, readIsdText } from '../../src/ingest/isd.js';
import { sniffFormat } from '../../src/ingest/readPaths.js';

const HEADER = '"STATION","DATE","SOURCE","LATITUDE","LONGITUDE","ELEVATION","NAME","REPORT_TYPE","CALL_SIGN","QUALITY_CONTROL","WND","CIG","VIS","TMP","DEW","SLP","AA1","MA1","OC1","REM"';
const row = (date: string, type: string, call: string, wnd: string, tmp: string, dew: string, slp: string, aa1 = '', ma1 = '', oc1 = '') =>
  `"72530094846","${date}","7","41.995","-87.9336","201.8","CHICAGO OHARE INTERNATIONAL AIRPORT, IL US","${type}","${call}","V030","${wnd}","22000,5,9,N","016093,5,N,5","${tmp}","${dew}","${slp}","${aa1}","${ma1}","${oc1}",""`;
const SAMPLE = [
  HEADER,
  row('2019-01-01T00:51:00', 'FM-15', 'KORD ', '290,5,N,0041,5', '+0011,5', '-0006,5', '10162,5', '01,0003,9,5', '10155,5,09918,5', ''),
  row('2019-01-01T01:00:00', 'FM-12', '99999', '999,9,C,0000,5', '+0010,1', '-0007,1', '99999,9'),
  row('2019-01-01T01:51:00', 'FM-16', 'KORD ', '999,9,9,9999,9', '+0500,3', '-0008,5', '10166,5', '06,0010,9,5', '', '0134,5'),
  row('2019-01-01T02:51:00', 'FM-15', 'KORD ', '300,2,N,0051,2', '+9999,9', '-0010,5', '10170,5'),
  row('2019-01-02T00:00:00', 'SOD  ', 'KORD ', '999,9,9,9999,9', '+9999,9', '+9999,9', '99999,9'),
  row('2019-02-30T00:00:00', 'FM-15', 'KORD ', '290,5,N,0041,5', '+0011,5', '-0006,5', '10162,5'),
  '"72530094846","2019-01-01T03:51:00","7"',
].join('\n') + '\n';

test('decodeIsdWind() / decodeIsdValue(): packed fields, scale factors and missing codes (ISD format document)', () => {
  // WND: direction angle (999 = missing), quality, type (C = calm, V = variable, 9 = missing), speed m/s × 10 (9999 = missing), quality
  const w = decodeIsdWind('290,5,N,0041,5');
  assert.is(w.dirDeg, 290);
  assert.is(w.speedMs, 4.1);
  const calm = decodeIsdWind('999,9,C,0000,5');
  assert.ok(Number.isNaN(calm.dirDeg));
  assert.is(calm.speedMs, 0);
  const miss = decodeIsdWind('999,9,9,9999,9');
  assert.ok(Number.isNaN(miss.dirDeg) && Number.isNaN(miss.speedMs));
  // TMP/DEW: signed °C × 10, +9999 missing; SLP hPa × 10, 99999 missing
  assert.equal(decodeIsdValue('-0017,1', 10), { value: -1.7, quality: 'ok' });
  assert.ok(Number.isNaN(decodeIsdValue('+9999,9', 10).value));
  assert.is(decodeIsdValue('10132,1', 10).value, 1013.2);
  assert.ok(Number.isNaN(decodeIsdValue('99999,9', 10).value));
  // quality codes: 2/6 suspect, 3/7 erroneous, 9 missing, 0/1/4/5 passed
  assert.equal(['0', '1', '2', '3', '4', '5', '6', '7', '9', 'A'].map(isdQuality), ['ok', 'ok', 'suspect', 'erroneous', 'ok', 'ok', 'suspect', 'erroneous', 'missing', 'ok']);
});

test('readIsdText(): every line parsed or rejected with a reason; values decoded in canonical units', () => {
  const r = readIsdText(SAMPLE, 'isd.csv');
  assert.is(r.report.lines, 8);
  assert.is(r.report.parsed, 4);
  assert.equal(r.report.rejectedByReason, { 'summary-row': 1, 'bad-time': 1, truncated: 1 });
  assert.is(r.report.parsed + r.report.rejected + 1, r.report.lines); // + the header
  const [a, b, c, d] = r.observations;
  assert.is(a!.station, 'KORD');
  assert.is(a!.source, 'METAR');
  assert.is(new Date(a!.timeMs).toISOString(), '2019-01-01T00:51:00.000Z'); // DATE is UTC (GMT) per the format document
  assert.is(a!.windDirDeg, 290);
  assert.is(a!.windSpeedMs, 4.1);
  assert.is(a!.temperatureC, 1.1);
  assert.is(a!.dewpointC, -0.6);
  assert.is(a!.seaLevelPressureHpa, 1016.2);
  assert.is(a!.altimeterHpa, 1015.5); // MA1: altimeter hPa × 10, station pressure hPa × 10
  assert.is(a!.stationPressureHpa, 991.8);
  assert.is(a!.precipMm, 0.3); // AA1: 1-hour period, 0.3 mm
  assert.is(a!.latDeg, 41.995);
  assert.is(b!.station, '72530094846'); // CALL_SIGN 99999 = none: the STATION id
  assert.is(b!.windSpeedMs, 0); // calm
  assert.ok(Number.isNaN(b!.seaLevelPressureHpa));
  assert.is(c!.source, 'SPECI');
  assert.ok(Number.isNaN(c!.temperatureC)); // quality 3 = erroneous: read as missing, counted
  assert.ok(Number.isNaN(c!.precipMm)); // a 6-hour AA1 is not an hourly amount
  assert.is(c!.gustMs, 13.4); // OC1: gust m/s × 10
  assert.is(d!.windSpeedMs, 5.1); // quality 2 = suspect: kept, counted
  assert.is(r.valueCounts['erroneous:temperatureC'], 1);
  assert.is(r.valueCounts['suspect:windDir'], 1);
  assert.is(r.report.issues.find((i) => i.reason === 'summary-row')!.line, 6);
});

test('sniffFormat() recognises the global-hourly header', () => {
  assert.ok(isIsdHeaders(HEADER.split(',')));
  assert.is(sniffFormat('72530094846.csv', SAMPLE, false), 'isd');
  assert.is(sniffFormat('x.csv', 'station,valid,tmpf\nKORD,2019-01-01 00:51,30\n', false), 'csv');
});

test.run();
