/**
 * The single-pass byte decoder (src/ingest/metar/byteMetar.ts) on the published example reports of
 * shared/check-values.md (the folder beside the checkout) §6.4 (M2–M5 real, M8–M10 constructed): decoded values, agreement with the
 * general decoder in lite mode, and the forms it leaves to the general decoder. Line-by-line agreement on
 * whole corpora is checked in test/ingest/metar-fastpath.test.ts.
 */
import { test } from 'uvu';
import * as assert from 'uvu/assert';
import { assertClose } from '../../helpers/assert.js';
import { decodeBytesInto } from '../../../src/ingest/metar/byteMetar.js';
import { decodeInto, newMetarReport, type MetarReport } from '../../../src/ingest/metar/decodeMetar.js';
import { HPA_PER_INHG as INHG_HPA, INCH_MM, KNOT_MS, STATUTE_MILE_M } from '../../../src/physics/constants.js';
import { WX } from '../../../src/ingest/types.js';

const REF = { year: 2024, month: 3, file: 'bytes.txt', line: 1 };
const kt = (v: number) => v * KNOT_MS;
const bytes = (s: string) => new TextEncoder().encode(s);

/** Decode a whole line with the byte decoder; null when it gives up. */
function fast(line: string): MetarReport | null {
  const r = newMetarReport();
  const u = bytes(line);
  return decodeBytesInto(r, u, 0, u.length, REF) ? r : null;
}

/** The general decoder in lite mode (what the byte decoder must match). */
function general(line: string): MetarReport {
  const r = newMetarReport();
  const is = decodeInto(r, line, 0, line.length, REF, true);
  if (is) throw new Error(is.message);
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

const M2 = 'PHTO 311953Z 04008KT 10SM SCT029 BKN040 BKN049 27/19 A3016 RMK AO2 SLP210 T02670194';
const M3 = 'PHTO 311853Z 34005KT 10SM SCT048 BKN055 26/20 A3016 RMK AO2 RAE1756 SLP210 P0000 T02560200';
const M4 = 'KSFO 240156Z 26016G22KT 9SM BKN012 13/08 A3006 RMK AO2 PK WND 26027/0109 SLP179 T01280083';
const M5 = 'KCLM 302053Z AUTO 35003KT 10SM OVC100 13/10 A2984 RMK AO2 SLP106 T01330100 55004';
const M8 = 'METAR EGLL 121250Z 24015G28KT 200V280 6000 -SHRA FEW012 SCT025CB 12/08 Q1003 NOSIG';
const M9 = 'METAR ULLI 051200Z 33007MPS 0800 R28R/1100U -SN BKN004 OVC015 M05/M07 Q1018';
const M10 = 'METAR LFPG 010600Z 00000KT CAVOK 02/M01 Q1025';

test('decodeBytesInto() M2: PHTO ASOS report with server-decoded values', () => {
  const r = fast(M2)!;
  assert.ok(r, 'taken by the byte decoder');
  // check-values M2 (aviation weather data server): wind 040° 8 kt, 10 SM, T 26.7 / Td 19.4 °C, SLP 1021.0 hPa, A 30.16 inHg
  assert.is(r.station, 'PHTO');
  assert.is(r.timeMs, Date.UTC(2024, 2, 31, 19, 53));
  assert.is(r.windDirDeg, 40);
  assertClose(r.windSpeedMs, kt(8), 1e-12);
  assertClose(r.visibilityM, 10 * STATUTE_MILE_M, 1e-9);
  assertClose(r.temperatureC, 26.7, 1e-12);
  assertClose(r.dewpointC, 19.4, 1e-12);
  assert.is(r.tempFromRemarks, true);
  assertClose(r.seaLevelPressureHpa, 1021.0, 1e-9);
  // check-values M2: the server stored 30.159449 inHg (a hPa round trip); compare at 0.005 inHg
  assertClose(r.altimeterHpa / INHG_HPA, 30.16, 0.005);
  assert.is(r.stationType, 'AO2');
});

test('decodeBytesInto() M3: rain ended 17:56Z, hourly precipitation trace', () => {
  const r = fast(M3)!;
  assert.ok(r);
  // check-values M3: T 25.6 / Td 20.0 °C; P0000 = trace (FMH-1 §12.7.2: P0000 for a trace)
  assertClose(r.temperatureC, 25.6, 1e-12);
  assertClose(r.dewpointC, 20.0, 1e-12);
  assert.is(r.precipTrace, true);
  assert.is(r.precip1hMm, 0);
});

test('decodeBytesInto() M4: KSFO gusts and peak wind 260° 27 kt at 01:09Z', () => {
  const r = fast(M4)!;
  assert.ok(r);
  // check-values M4: 260° 16 kt G22; 9 SM; T 12.8 / Td 8.3 °C; A 30.06 inHg = 1017.95 hPa; SLP 1017.9
  assert.is(r.windDirDeg, 260);
  assertClose(r.windSpeedMs, kt(16), 1e-12);
  assertClose(r.gustMs, kt(22), 1e-12);
  assertClose(r.visibilityM, 9 * STATUTE_MILE_M, 1e-9);
  assertClose(r.temperatureC, 12.8, 1e-12);
  assertClose(r.dewpointC, 8.3, 1e-12);
  assertClose(r.altimeterHpa, 1017.95, 0.005);
  assertClose(r.seaLevelPressureHpa, 1017.9, 1e-9);
  assert.is(r.peakWindDirDeg, 260);
  assertClose(r.peakWindMs, kt(27), 1e-12);
  assert.is(r.peakWindTimeMs, Date.UTC(2024, 2, 24, 1, 9));
});

test('decodeBytesInto() M5: KCLM 3-h tendency 55004 = −0.4 hPa (WMO-No. 306 code table 0200)', () => {
  const r = fast(M5)!;
  assert.ok(r);
  // check-values M5: T 13.3 / Td 10.0; SLP 1010.6; a = 5 (decreasing then increasing, lower), −0.4 hPa
  assert.is(r.auto, true);
  assertClose(r.temperatureC, 13.3, 1e-12);
  assertClose(r.dewpointC, 10.0, 1e-12);
  assertClose(r.seaLevelPressureHpa, 1010.6, 1e-9);
  assert.is(r.pressureTendencyCode, 5);
  assertClose(r.pressureTendency3hHpa, -0.4, 1e-12);
});

test('decodeBytesInto() M8: WMO report with variable wind, metres, showers, CB and QNH', () => {
  const r = fast(M8)!;
  assert.ok(r);
  // check-values M8 (constructed): 240° 15 kt G28, variable 200°–280°, 6000 m, -SHRA, SCT025CB, 12/08, Q1003
  assert.is(r.windDirDeg, 240);
  assertClose(r.gustMs, kt(28), 1e-12);
  assert.is(r.windVarFromDeg, 200);
  assert.is(r.windVarToDeg, 280);
  assert.is(r.visibilityM, 6000);
  // WMO-No. 306 code table 4678: -SHRA light rain showers; CB marks convection
  assert.is(r.weather, WX.SHOWER | WX.RAIN | WX.PRECIP | WX.CONVECTIVE | WX.LIGHT);
  assert.is(r.temperatureC, 12);
  assert.is(r.dewpointC, 8);
  assert.is(r.qnhHpa, 1003);
  // constructed: lite mode keeps no weather codes or layers
  assert.equal(r.weatherCodes, []);
  assert.equal(r.sky, []);
});

test('decodeBytesInto() M9 and M10: m/s wind, negative temperatures, calm and CAVOK', () => {
  const r9 = fast(M9)!;
  assert.ok(r9);
  // check-values M9 (constructed): 330° 7 m/s, 800 m, -SN, M05/M07, Q1018
  assert.is(r9.windSpeedMs, 7);
  assert.is(r9.visibilityM, 800);
  assert.is(r9.weather, WX.SNOW | WX.PRECIP | WX.LIGHT); // -SN: light (code table 4678)
  assert.equal([r9.temperatureC, r9.dewpointC], [-5, -7]);
  assert.is(r9.qnhHpa, 1018);
  const r10 = fast(M10)!;
  assert.ok(r10);
  // check-values M10 (constructed): calm 00000KT; CAVOK → visibility 10 km or more (stored as 10000 m)
  assert.equal([r10.windDirDeg, r10.windSpeedMs], [0, 0]);
  assert.is(r10.cavok, true);
  assert.is(r10.visibilityM, 10000);
  assert.equal([r10.temperatureC, r10.dewpointC], [2, -1]);
});

test('decodeBytesInto() reads "1 1/2SM" as one visibility (FMH-1 §12.6.6)', () => {
  const r = fast('KXYZ 151300Z 27010KT 1 1/2SM BR OVC005 01/01 A3010')!;
  assert.ok(r);
  // FMH-1 §12.6.6: whole miles and a fraction separated by a blank
  assertClose(r.visibilityM, 1.5 * STATUTE_MILE_M, 1e-9);
});

test('decodeBytesInto() agrees with decodeInto(…, lite) on every report it takes', () => {
  // constructed: the module's contract (same result as the general decoder in lite mode)
  for (const line of [M2, M3, M4, M5, M8, M9, M10]) assertSameReport(fast(line)!, general(line), line.slice(0, 12));
});

test('decodeBytesInto() reads a range of a longer buffer (after an archive stamp)', () => {
  const line = `202403311953 ${M2}`;
  const r = newMetarReport();
  // constructed: the report starts after the 12-digit stamp and a blank
  assert.ok(decodeBytesInto(r, bytes(line), 13, line.length, REF));
  assertSameReport(r, general(M2), 'offset');
});

test('decodeBytesInto() gives up on forms the general decoder handles (observer remarks, NIL, rare groups)', () => {
  const cases: [string, string][] = [
    // check-values M1: WSHFT, VIS and CIG remarks
    ['METAR KABC 121755Z AUTO 21016G24KT 180V240 1SM R11/P6000FT -RA BR BKN015 OVC025 06/04 A2990 RMK AO2 PK WND 20032/25 WSHFT 1715 VIS 3/4V1 1/2 VIS 3/4 RWY11 RAB07 CIG 013V017 CIG 017 RWY11 PRESFR SLP125 P0003 60009 T00640036 10066 21012 58033 TSNO $', 'M1'],
    // check-values M11: WSHFT … FROPA
    ['SPECI KOKC 041754Z 34025G38KT 10SM BKN030 08/M03 A3002 RMK AO2 PK WND 34038/1752 WSHFT 1741 FROPA PRESRR T00831033', 'M11'],
    ['METAR KXYZ 151300Z NIL', 'NIL'],
    ['KXYZ 151300Z 27010KT M1/4SM FG VV001 01/01 A3010', 'M1/4SM'],
    ['KXYZ 151300Z 27010KT 10SM CLR 01/01 A3010 RMK AO2 60009', '6RRRR'],
    ['KXYZ 151300Z 27010KT 10SM CLR 01/01 A3010 RMK AO2 FROB', 'unknown remark'],
    ['KXYZ 151300Z 27010KT 10SM CLR 01/01 A3010 RMK AO2 ÄÖ', 'non-ASCII byte'],
    ['KXYZ 321300Z 27010KT 10SM CLR 01/01 A3010', 'bad day'],
  ];
  // constructed: the module doc (any group or form it does not handle makes it return false)
  for (const [line, what] of cases) assert.is(fast(line), null, what);
});

test('decodeBytesInto() leaves 7RRRR to the general decoder, which reads hundredths of an inch', () => {
  const line = 'KXYZ 151300Z 27010KT 10SM CLR 01/01 A3010 RMK AO2 70033';
  assert.is(fast(line), null);
  // AFMAN 15-111 Att. 3: 70033 = 0.33 in in 24 h
  assertClose(general(line).precip24hMm, 0.33 * INCH_MM, 1e-9);
});

test.run();
