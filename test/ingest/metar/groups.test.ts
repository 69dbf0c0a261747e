/**
 * METAR/SPECI group decoders on bytes (src/ingest/metar/groups.ts), one group at a time, with the
 * published encode/decode examples of WMO-No. 306 FM 15, ICAO Annex 3, FMH-1 ch. 12, the FAA AIM and
 * AFMAN 15-111 (as collected in shared/check-values.md (the folder beside the checkout) §6; M1–M11 are its example reports).
 */
import { test } from 'uvu';
import * as assert from 'uvu/assert';
import { assertClose } from '../../helpers/assert.js';
import {
  beginEnd,
  compassSuffix,
  dg,
  digits,
  hhmm,
  isWord,
  k3,
  kw,
  peakWind,
  pressureGroup,
  remarkTimeMs,
  signedTenths,
  skyGroup,
  slashes,
  statuteMiles,
  tempGroup,
  windGroup,
} from '../../../src/ingest/metar/groups.js';
import { asciiBytes } from '../../../src/ingest/metar/ascii.js';
import { newMetarReport, type MetarReport } from '../../../src/ingest/metar/decodeMetar.js';
import { HPA_PER_INHG as INHG_HPA, KMH_MS, KNOT_MS, STATUTE_MILE_M } from '../../../src/physics/constants.js';
import { WX } from '../../../src/ingest/types.js';

const kt = (v: number) => v * KNOT_MS;

/** Run a group decoder on the whole of `g` with a fresh report. */
function on(g: string, decode: (u: Uint8Array, a: number, b: number, r: MetarReport) => boolean): [boolean, MetarReport] {
  const r = newMetarReport();
  return [decode(asciiBytes(g), 0, g.length, r), r];
}
const wind = (g: string) => on(g, windGroup);
const temp = (g: string) => on(g, tempGroup);
const sky = (g: string, lite = false) => on(g, (u, a, b, r) => skyGroup(u, a, b, r, lite));
const pressure = (g: string) => on(g, pressureGroup);
const miles = (g: string) => statuteMiles(asciiBytes(g), 0, g.length);
const be = (g: string) => beginEnd(asciiBytes(g), 0, g.length);

test('dg, digits, slashes, isWord, k3/kw: the byte primitives', () => {
  const u = asciiBytes('0129/A//');
  // constructed: expected by construction
  assert.is(dg(u, 2), 2);
  assert.ok(dg(u, 4) < 0 && dg(u, 4) + 9 * 111 < 0, 'a non-digit drives any 3-digit sum negative');
  assert.is(digits(u, 0, 4), 129);
  assert.is(digits(u, 0, 5), -1);
  assert.is(digits(u, 2, 2), -1);
  assert.ok(slashes(u, 6, 8));
  assert.ok(!slashes(u, 4, 6));
  assert.ok(!slashes(u, 6, 6));
  const w = asciiBytes('RMK AUTO');
  assert.ok(isWord(w, 0, 3, 'RMK'));
  assert.ok(!isWord(w, 0, 4, 'RMK'));
  assert.ok(isWord(w, 4, 8, 'AUTO'));
  assert.is(k3(w, 0), kw('RMK'));
  assert.ok(k3(w, 4) !== kw('RMK'));
});

test('windGroup() dddffKT and dddffGfmfmKT (check-values 6.2: 13008KT, 08032G45KT)', () => {
  // WMO-No. 306 FM 15 / AIM: 130° 8 kt, no gust
  let [ok, r] = wind('13008KT');
  assert.ok(ok);
  assert.is(r.windDirDeg, 130);
  assertClose(r.windSpeedMs, kt(8), 1e-12);
  assert.ok(Number.isNaN(r.gustMs));
  // AIM: 080° 32 kt gusting 45 kt
  [ok, r] = wind('08032G45KT');
  assert.ok(ok);
  assert.is(r.windDirDeg, 80);
  assertClose(r.windSpeedMs, kt(32), 1e-12);
  assertClose(r.gustMs, kt(45), 1e-12);
  // AIM: 3-digit US speeds, 210° 103 kt gusting 130 kt
  [ok, r] = wind('210103G130KT');
  assert.ok(ok);
  assertClose(r.windSpeedMs, kt(103), 1e-12);
  assertClose(r.gustMs, kt(130), 1e-12);
  // constructed: 360° is north, allowed; 370° is no direction
  assert.is(wind('36010KT')[1].windDirDeg, 360);
  assert.is(wind('37010KT')[0], false);
});

test('windGroup() calm 00000KT and variable VRB04KT (ICAO Annex 3 §4.1.5.2)', () => {
  // ICAO Annex 3 §4.1.5.2: < 1 kt → calm 00000KT (direction 0, speed 0)
  let [ok, r] = wind('00000KT');
  assert.ok(ok);
  assert.is(r.windDirDeg, 0);
  assert.is(r.windSpeedMs, 0);
  // ICAO Annex 3 §4.1.5.2 / FMH-1 §5.4.2: VRB, no direction
  [ok, r] = wind('VRB04KT');
  assert.ok(ok);
  assert.ok(Number.isNaN(r.windDirDeg));
  assert.is(r.windVariable, true);
  assertClose(r.windSpeedMs, kt(4), 1e-12);
});

test('windGroup() units MPS and KMH, and the P (above) bound (ICAO Annex 3 §4.1.5.2)', () => {
  // check-values M9: 330° 7 m/s
  let [ok, r] = wind('33007MPS');
  assert.ok(ok);
  assert.is(r.windSpeedMs, 7);
  // WMO-No. 306 FM 15 (KMH in older editions, from memory): 36 km/h = 10 m/s
  [ok, r] = wind('27036KMH');
  assert.ok(ok);
  assertClose(r.windSpeedMs, 36 * KMH_MS, 1e-12);
  assertClose(r.windSpeedMs, 10, 1e-12);
  // ICAO Annex 3 §4.1.5.2: ≥ 100 kt → P99KT, ≥ 50 m/s → P49MPS; stored as the bound 100 kt / 50 m/s
  assertClose(wind('240P99KT')[1].windSpeedMs, kt(100), 1e-12);
  assert.is(wind('240P49MPS')[1].windSpeedMs, 50);
  assertClose(wind('24080GP99KT')[1].gustMs, kt(100), 1e-12);
});

test('windGroup() missing parts and non-wind groups', () => {
  // WMO-No. 306 FM 15: solidi for elements not available (automatic stations)
  let [ok, r] = wind('/////KT');
  assert.ok(ok);
  assert.ok(Number.isNaN(r.windDirDeg) && Number.isNaN(r.windSpeedMs));
  [ok, r] = wind('13008G//KT');
  assert.ok(ok);
  assert.ok(Number.isNaN(r.gustMs));
  // constructed: no unit, too short, letters in the speed, a 1-digit speed: not wind groups
  for (const g of ['13008', '1308KT', '130AAKT', '1300008KT', 'R11/P6000FT', '9999']) assert.is(wind(g)[0], false, g);
});

test('statuteMiles() reads the FMH-1 §12.6.6 / AIM forms (check-values 6.2: 1SM, 7SM, 15SM, 1/2SM, M1/4SM)', () => {
  // AIM / FMH-1 §12.6.6: whole miles and fractions
  assert.is(miles('1SM'), 1);
  assert.is(miles('7SM'), 7);
  assert.is(miles('15SM'), 15);
  assert.is(miles('1/2SM'), 0.5);
  assert.is(miles('5/16SM'), 5 / 16);
  // FMH-1 §12.6.6: M = less than (the bound is kept), P = more than
  assert.is(miles('M1/4SM'), 0.25);
  assert.is(miles('P6SM'), 6);
  // constructed: the fused "1 1/2" form written without its blank, 11/2SM, is 1.5
  assert.is(miles('11/2SM'), 1.5);
  // constructed: malformed
  assert.ok(Number.isNaN(miles('ASM')));
  assert.ok(Number.isNaN(miles('1/0SM')));
  // constructed: times STATUTE_MILE_M, 1 SM = 1609.344 m (check-values M1)
  assertClose(miles('1SM') * STATUTE_MILE_M, 1609.344, 1e-9);
});

test('tempGroup() T\'T\'/T\'dT\'d with M for minus (check-values 6.2: 03/M01, 06/04, M02/M02)', () => {
  // AFMAN 15-111 Att. 3 rmk 30: 2.6 / −1.5 °C → 03/M01
  let [ok, r] = temp('03/M01');
  assert.ok(ok);
  assert.is(r.temperatureC, 3);
  assert.is(r.dewpointC, -1);
  // check-values M1 and M6
  assert.equal([temp('06/04')[1].temperatureC, temp('06/04')[1].dewpointC], [6, 4]);
  assert.equal([temp('M02/M02')[1].temperatureC, temp('M02/M02')[1].dewpointC], [-2, -2]);
  // FMH-1 rule (from memory): values in (−0.5, 0) are written M00; constructed: read as 0
  assert.is(temp('M00/M01')[1].temperatureC, 0);
});

test('tempGroup() missing dew point 10/// (UK AIP GEN 3.5.10) and 02/ (US Navy); all missing /////', () => {
  // UK AIP GEN 3.5.10: dew point missing → 10///
  let [ok, r] = temp('10///');
  assert.ok(ok);
  assert.is(r.temperatureC, 10);
  assert.ok(Number.isNaN(r.dewpointC));
  // US Navy practice (check-values 6.2): 02/
  [ok, r] = temp('02/');
  assert.ok(ok);
  assert.is(r.temperatureC, 2);
  assert.ok(Number.isNaN(r.dewpointC));
  // WMO-No. 306 FM 15: solidi when not available
  [ok, r] = temp('/////');
  assert.ok(ok);
  assert.ok(Number.isNaN(r.temperatureC) && Number.isNaN(r.dewpointC));
  // constructed: visibility fractions and 1-digit halves are not temperature groups
  for (const g of ['1/2SM', 'M1/4SM', '1/2', '3/04', '103/04', 'MM/01']) assert.is(temp(g)[0], false, g);
});

test('skyGroup() cover and height in hundreds of feet (check-values M1: BKN015 OVC025; M8: SCT025CB)', () => {
  // WMO-No. 306 FM 15 / FMH-1 §12.6.9: hhh in hundreds of feet
  let [ok, r] = sky('BKN015');
  assert.ok(ok);
  assert.equal(r.sky, [{ cover: 'BKN', heightFt: 1500 }]);
  // WMO-No. 306 FM 15: CB appended; constructed: CB marks the report convective
  [ok, r] = sky('SCT025CB');
  assert.ok(ok);
  assert.equal(r.sky, [{ cover: 'SCT', heightFt: 2500, cloudType: 'CB' }]);
  assert.is(r.weather & WX.CONVECTIVE, WX.CONVECTIVE);
  // WMO-No. 306 FM 15: TCU appended (no convective flag)
  [ok, r] = sky('FEW030TCU');
  assert.equal(r.sky, [{ cover: 'FEW', heightFt: 3000, cloudType: 'TCU' }]);
  assert.is(r.weather, 0);
  // WMO-No. 306 FM 15: vertical visibility VVhhh (check-values M9 style: 400 ft)
  assert.equal(sky('VV004')[1].sky, [{ cover: 'VV', heightFt: 400 }]);
});

test('skyGroup() clear-sky words, solidi, lite mode and refusals', () => {
  // FMH-1 §12.6.9 / WMO-No. 306 FM 15: CLR, SKC, NSC, NCD carry no height
  for (const w of ['CLR', 'SKC', 'NSC', 'NCD']) {
    const [ok, r] = sky(w);
    assert.ok(ok, w);
    assert.is(r.sky[0]!.cover, w);
    assert.ok(Number.isNaN(r.sky[0]!.heightFt));
  }
  // WMO-No. 306 FM 15: solidi from automatic stations (cover or height not observable)
  assert.equal(sky('//////')[1].sky.map((l) => l.cover), ['///']);
  assert.ok(Number.isNaN(sky('BKN///')[1].sky[0]!.heightFt));
  assert.equal(sky('BKN015///')[1].sky[0]!.cloudType, '///');
  // constructed: lite mode recognises the group but keeps no layer list
  const [ok, r] = sky('OVC025', true);
  assert.ok(ok);
  assert.is(r.sky.length, 0);
  // constructed: not sky groups
  for (const g of ['BKN15', 'BKN015XX', 'ABC015', 'CAVOK', 'VV', 'RMK']) assert.is(sky(g)[0], false, g);
});

test('compassSuffix() accepts the eight points and NDV', () => {
  const c = (g: string) => compassSuffix(asciiBytes(g), 0, g.length);
  // WMO-No. 306 FM 15 (directional visibility VNVNVNVNDv; NDV no directional variation)
  for (const g of ['N', 'NE', 'E', 'SE', 'S', 'SW', 'W', 'NW', 'NDV']) assert.ok(c(g), g);
  // constructed: not compass points
  for (const g of ['', 'X', 'EN', 'NN', 'NNE', 'NDX']) assert.ok(!c(g), g);
});

test('pressureGroup() QNH in whole hPa and the US altimeter in hundredths of inHg', () => {
  // check-values 6.2 (ENM Toulouse): Q1013, Q0995; M8: Q1003
  assert.is(pressure('Q1013')[1].qnhHpa, 1013);
  assert.is(pressure('Q0995')[1].qnhHpa, 995);
  // check-values M1: A2990 = 29.90 inHg = 1012.53 hPa
  assertClose(pressure('A2990')[1].altimeterHpa, 1012.53, 0.005);
  // check-values M11: A3002 = 30.02 inHg = 1016.59 hPa
  assertClose(pressure('A3002')[1].altimeterHpa, 1016.59, 0.005);
  // constructed: exactly hundredths × INHG_HPA
  assertClose(pressure('A2999')[1].altimeterHpa, 29.99 * INHG_HPA, 1e-9);
  // WMO-No. 306 FM 15: Q//// when not available
  const [ok, r] = pressure('Q////');
  assert.ok(ok);
  assert.ok(Number.isNaN(r.qnhHpa));
  // constructed: wrong length or letters
  for (const g of ['Q101', 'Q10133', 'A29A0']) assert.is(pressure(g)[0], false, g);
});

test('signedTenths() snTTT with sign digit 0 or 1 (AFMAN 15-111 Att. 3: T00261015)', () => {
  const st = (g: string) => signedTenths(asciiBytes(g), 0);
  // AFMAN 15-111 Att. 3: 0026 = +2.6 °C, 1015 = −1.5 °C
  assertClose(st('0026'), 2.6, 1e-12);
  assertClose(st('1015'), -1.5, 1e-12);
  // check-values M6: T10171022 → −1.7 / −2.2
  assertClose(st('1017'), -1.7, 1e-12);
  // constructed: −0.0 is read as 0
  assert.is(st('1000'), 0);
  // constructed: sign digit 2 or a letter is malformed
  assert.ok(Number.isNaN(st('2026')));
  assert.ok(Number.isNaN(st('00A6')));
});

test('beginEnd() begin and end times of weather (FMH-1 §12.7.1; check-values M1 RAB07, M5 RAE21B40)', () => {
  // FMH-1 §12.7.1 begin/end of precipitation: the forms listed in the decoder's doc
  for (const g of ['RAB07', 'RAE21B40', 'RAE1756', 'FZRAB1155E20', 'RAE34TSE41GRB0157E08', 'RAEMM', '-SNB05']) assert.ok(be(g), g);
  // constructed: no time, a 1- or 3-digit time, an unknown phenomenon
  for (const g of ['RA', 'RAB7', 'RAB075', 'XXB07', 'B07', 'RAB']) assert.ok(!be(g), g);
});

test('hhmm() reads (hh)mm time tokens', () => {
  const h = (g: string) => hhmm(asciiBytes(g), 0, g.length);
  // FMH-1 §12.7.1: minutes only within the hour (PK WND 28045/15), or hhmm (28045/1955)
  assert.equal(h('25'), [-1, 25]);
  assert.equal(h('1955'), [19, 55]);
  // constructed: out of range or wrong length
  for (const g of ['60', '2400', '1260', '123', '12345', 'AB']) assert.is(h(g), null, g);
});

test('remarkTimeMs() places remark times at or before the report (check-values M1: 17:55Z report)', () => {
  const report = Date.UTC(2024, 2, 12, 17, 55);
  // check-values M1: PK WND 20032/25 → 17:25Z; WSHFT 1715 → 17:15Z
  assert.is(remarkTimeMs(report, -1, 25), Date.UTC(2024, 2, 12, 17, 25));
  assert.is(remarkTimeMs(report, 17, 15), Date.UTC(2024, 2, 12, 17, 15));
  // constructed: minute 58 cannot lie ahead of :55, so it is 16:58
  assert.is(remarkTimeMs(report, -1, 58), Date.UTC(2024, 2, 12, 16, 58));
  // constructed: 23:50 in a 00:10Z report is the previous day
  assert.is(remarkTimeMs(Date.UTC(2024, 2, 13, 0, 10), 23, 50), Date.UTC(2024, 2, 12, 23, 50));
  // constructed: bad inputs give NaN
  assert.ok(Number.isNaN(remarkTimeMs(NaN, -1, 10)));
  assert.ok(Number.isNaN(remarkTimeMs(report, -1, 60)));
  assert.ok(Number.isNaN(remarkTimeMs(report, 24, 0)));
});

test('peakWind() dddff(f)/(hh)mm keeps the strongest (check-values M1 20032/25; AFMAN 24042/43 25042/19)', () => {
  const r = newMetarReport();
  r.timeMs = Date.UTC(2024, 2, 12, 17, 55);
  const pk = (g: string) => peakWind(asciiBytes(g), 0, g.length, r);
  // check-values M1: peak wind 200° 32 kt at 17:25Z
  assert.ok(pk('20032/25'));
  assert.is(r.peakWindDirDeg, 200);
  assertClose(r.peakWindMs, kt(32), 1e-12);
  assert.is(r.peakWindTimeMs, Date.UTC(2024, 2, 12, 17, 25));
  // constructed: a weaker second group does not replace it
  assert.ok(pk('25030/19'));
  assert.is(r.peakWindDirDeg, 200);
  // AIM: PK WND 28045/1955 (hhmm form; constructed: placed the day before a 17:55Z report)
  assert.ok(pk('28045/1955'));
  assert.is(r.peakWindDirDeg, 280);
  assert.is(r.peakWindTimeMs, Date.UTC(2024, 2, 11, 19, 55));
  // constructed: 3-digit speed
  assert.ok(pk('310105/50'));
  assertClose(r.peakWindMs, kt(105), 1e-12);
  // constructed: malformed
  for (const g of ['28045', 'ABC45/15', '28045/75', '2804/15', '37045/15']) assert.ok(!pk(g), g);
});

test.run();
