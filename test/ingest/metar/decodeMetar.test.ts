/**
 * The general METAR/SPECI decoder's own entry points (src/ingest/metar/decodeMetar.ts): the empty
 * report, reset for reuse, decoding a range of a line, lite mode, trend and wind-shear groups, issue
 * columns, station interning. The published example reports M1–M11 and the body-group edge cases are
 * checked through decodeMetar in test/ingest/metar.test.ts and are not repeated.
 */
import { test } from 'uvu';
import * as assert from 'uvu/assert';
import { assertClose } from '../../helpers/assert.js';
import {
  decodeInto,
  decodeMetar,
  internStation,
  isParseIssue,
  knownStation,
  newMetarReport,
  resetReport,
  unknown,
  type DecodeRef,
  type MetarReport,
} from '../../../src/ingest/metar/decodeMetar.js';
import { WX } from '../../../src/ingest/types.js';

const REF: DecodeRef = { year: 2024, month: 3, file: 'decode.txt', line: 7 };
const M1 =
  'METAR KABC 121755Z AUTO 21016G24KT 180V240 1SM R11/P6000FT -RA BR BKN015 OVC025 06/04 A2990 RMK AO2 PK WND 20032/25 WSHFT 1715 VIS 3/4V1 1/2 VIS 3/4 RWY11 RAB07 CIG 013V017 CIG 017 RWY11 PRESFR SLP125 P0003 60009 T00640036 10066 21012 58033 TSNO $';

function dec(text: string): MetarReport {
  const r = decodeMetar(text, REF);
  if (isParseIssue(r)) throw new Error(r.message);
  return r;
}

/** Field-by-field equality, NaN equal to NaN. */
function assertSameReport(a: MetarReport, b: MetarReport, what: string): void {
  for (const k of Object.keys(b) as (keyof MetarReport)[]) {
    const x = a[k];
    const y = b[k];
    if (typeof y === 'number') assert.ok(Object.is(x, y) || (Number.isNaN(x) && Number.isNaN(y)), `${what}: ${k} ${String(x)} vs ${y}`);
    else assert.equal(x, y, `${what}: ${k}`);
  }
}

test('newMetarReport() has every value missing', () => {
  const r = newMetarReport();
  // constructed: the NaN rule of the module (NaN = missing), no flags, no lists
  for (const [k, v] of Object.entries(r)) {
    if (typeof v === 'number' && k !== 'weather' && k !== 'pressureTrend' && k !== 'pressureTendencyCode') assert.ok(Number.isNaN(v), k);
    if (Array.isArray(v)) assert.is(v.length, 0, k);
    if (typeof v === 'boolean') assert.is(v, false, k);
  }
  assert.is(r.weather, 0);
  assert.is(r.pressureTrend, 0);
  assert.is(r.pressureTendencyCode, -1);
  assert.is(r.type, 'METAR');
  assert.is(r.station, '');
});

test('resetReport(r) after a full report gives the empty report again', () => {
  const r = dec(M1);
  // constructed: M1 fills most fields (check-values M1)
  assert.is(r.station, 'KABC');
  assert.ok(r.remarks.length > 0 && r.sky.length > 0 && r.rvr.length > 0 && r.weatherCodes.length > 0);
  const handedOut = r.remarks;
  resetReport(r);
  assertSameReport(r, newMetarReport(), 'reset');
  // constructed: the remarks array handed out with the report is not emptied under its holder
  assert.ok(handedOut.length > 0);
});

test('decodeInto(r, s, start, end) decodes a range of a line and returns null', () => {
  const line = `202403121755 ${M1} trailing`;
  const start = line.indexOf('METAR');
  const r = newMetarReport();
  // constructed: the report between the stamp and the trailing word decodes as M1 alone
  assert.is(decodeInto(r, line, start, start + M1.length, REF, false), null);
  assertSameReport(r, dec(M1), 'range');
});

test('decodeInto(…, lite) keeps no weather codes, layers or RVR, but the same values', () => {
  const full = dec(M1);
  const lite = newMetarReport();
  assert.is(decodeInto(lite, M1, 0, M1.length, REF, true), null);
  // check-values M1: -RA BR, BKN015 OVC025, R11/P6000FT (kept only outside lite mode)
  assert.equal(full.weatherCodes, ['-RA', 'BR']);
  assert.equal(full.rvr, ['R11/P6000FT']);
  assert.equal(full.sky.map((l) => [l.cover, l.heightFt]), [['BKN', 1500], ['OVC', 2500]]);
  assert.equal([lite.weatherCodes, lite.sky, lite.rvr], [[], [], []]);
  // constructed: everything else agrees
  assert.is(lite.weather, full.weather);
  for (const k of ['windDirDeg', 'windSpeedMs', 'gustMs', 'visibilityM', 'temperatureC', 'dewpointC', 'altimeterHpa', 'seaLevelPressureHpa', 'precip1hMm', 'peakWindMs'] as const)
    assert.is(lite[k], full[k], k);
});

test('decodeInto() skips trend forecasts after BECMG or TEMPO up to RMK (WMO-No. 306 FM 15 §15.14)', () => {
  const r = dec('METAR EGLL 121250Z 24015KT 9999 FEW012 12/08 Q1003 TEMPO 3000 SHRA BKN008 RMK AO2 SLP125');
  // WMO-No. 306 FM 15 §15.14 (from memory): the trend is a forecast, not the observed state
  assert.is(r.visibilityM, 10000);
  assert.is(r.weather, 0);
  assert.equal(r.sky.map((l) => l.cover), ['FEW']);
  assert.equal(r.unknownGroups, []);
  // constructed: remarks after the trend are still read
  assertClose(r.seaLevelPressureHpa, 1012.5, 1e-9);
  assert.is(dec('METAR EGLL 121250Z 24015KT 9999 FEW012 12/08 Q1003 BECMG 4000 -RA').visibilityM, 10000);
});

test('decodeInto() passes over recent weather and wind shear groups without counting them as present weather', () => {
  const r = dec('METAR EDDF 121250Z 24015KT 9999 FEW012 12/08 Q1003 RETSRA WS R25L');
  // WMO-No. 306 FM 15 §15.13 (from memory): REw'w' recent weather and WS wind shear are supplementary information
  assert.is(r.weather, 0);
  assert.equal(r.weatherCodes, []);
  assert.equal(r.unknownGroups, []);
  assert.is(r.qnhHpa, 1003);
});

test('decodeInto() reads remarks given without RMK when they start with AO1/AO2 or SLP', () => {
  // constructed: a real-archive habit (remarks without the RMK keyword); the groups are the FMH-1 §12.7 ones
  const a = dec('KXYZ 151300Z 27010KT 10SM CLR 01/M01 A3010 AO2 SLP199 T00101010');
  assert.is(a.stationType, 'AO2');
  assertClose(a.seaLevelPressureHpa, 1019.9, 1e-9);
  assertClose(a.temperatureC, 1.0, 1e-12);
  const b = dec('KXYZ 151300Z 27010KT 10SM CLR 01/M01 A3010 SLP199');
  assertClose(b.seaLevelPressureHpa, 1019.9, 1e-9);
});

test('decodeInto() issues give 1-based columns on the line, with column0 for the text offset', () => {
  const line = 'xx KXYZ 322550Z 24015KT';
  const r = newMetarReport();
  const is = decodeInto(r, line, 3, line.length, { ...REF, column0: 3 }, false)!;
  // constructed: the bad time group starts at index 8 of the line (column 9)
  assert.is(is.reason, 'bad-time');
  assert.is(is.group, '322550Z');
  assert.is(is.column, 9);
  assert.is(is.file, 'decode.txt');
  assert.is(is.line, 7);
  // constructed: a day the month lacks names the month and the remedy
  const feb = decodeInto(newMetarReport(), 'KXYZ 301200Z 24015KT', 0, 20, { ...REF, month: 2 }, false)!;
  assert.is(feb.reason, 'bad-time');
  assert.match(feb.message, /2024-02.*--month/);
});

test('decodeInto() stops at the "=" end mark (WMO-No. 306 FM 15: end of report)', () => {
  const r = dec('METAR EGLL 121250Z 24015KT= 9999 Q1003');
  // WMO-No. 306 (from memory): "=" ends the report; constructed: what follows is not read
  assert.ok(Number.isNaN(r.visibilityM));
  assert.ok(Number.isNaN(r.qnhHpa));
  assert.equal(r.unknownGroups, []);
});

test('unknown(r, s, a, b) keeps the group text in order', () => {
  const r = newMetarReport();
  unknown(r, 'AB CD EF', 3, 5);
  unknown(r, 'AB CD EF', 0, 2);
  // constructed: expected by construction
  assert.equal(r.unknownGroups, ['CD', 'AB']);
});

test('internStation() and knownStation() keep one string per station key', () => {
  // constructed: a key above 37^5, so it cannot collide with a real 3–5 character id
  const key = 900_000_000;
  assert.is(knownStation(key), undefined);
  const id = internStation('..QZZQ..', 2, 6, key);
  assert.is(id, 'QZZQ');
  assert.is(knownStation(key), 'QZZQ');
  // constructed: a second call with the same key returns the first string, whatever the text
  assert.is(internStation('QXXQ', 0, 4, key), 'QZZQ');
  // constructed: decoded reports share the interned id
  assert.is(dec('KSFO 240156Z 26016KT').station, 'KSFO');
});

test('decodeInto() reads CB in a sky group and lightning remarks into WX.CONVECTIVE', () => {
  // WMO-No. 306 FM 15: CB appended to a cloud group; FMH-1 §12.7.1 LTG remarks
  assert.is(dec('METAR EGLL 121250Z 24015KT 9999 SCT025CB 12/08 Q1003').weather & WX.CONVECTIVE, WX.CONVECTIVE);
  assert.is(dec('KXYZ 151300Z 27010KT 10SM CLR 01/M01 A3010 RMK AO2 LTG DSNT W').weather & WX.CONVECTIVE, WX.CONVECTIVE);
});

test.run();
