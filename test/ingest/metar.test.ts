/**
 * decodeMetar / metarToObservation: published example reports M1–M11 (sources named per case) and
 * edge cases of the body groups (WMO-No. 306 FM 15/16; FMH-1 ch. 12; FAA AIM "Key to METAR").
 */
import { test } from 'uvu';
import * as assert from 'uvu/assert';
import { assertClose } from '../helpers/assert.js';
import {
  decodeMetar,
  isParseIssue,
  metarToObservation,
  looksLikeMetar,
  weatherFlags,
  type MetarReport,
} from '../../src/ingest/metar.js';
import { HPA_PER_INHG, KNOT_MS, STATUTE_MILE_M } from '../../src/physics/constants.js';
import { WX, type Observation, type ParseIssue } from '../../src/model/index.js';
import { readFileSync } from 'node:fs';
import { readMetarText } from '../../src/ingest/metar.js';

const REF = { year: 2024, month: 3, file: 'test.txt', line: 1 };
const kt = (v: number) => v * KNOT_MS;

function dec(text: string, ref = REF): MetarReport {
  const r = decodeMetar(text, ref);
  if (isParseIssue(r)) throw new Error(`unexpected issue ${r.reason}: ${r.message}`);
  return r;
}
function fail(text: string): ParseIssue {
  const r = decodeMetar(text, REF);
  assert.ok(isParseIssue(r), `expected an issue for "${text}"`);
  return r as ParseIssue;
}

test('HPA_PER_INHG is the conventional inch of mercury', () => {
  // NIST SP 811 (2008) App. B.8: inch of mercury, conventional = 3.386 389 E+03 Pa
  assertClose(HPA_PER_INHG, 33.86389, 5e-6);
  // 29.92 inHg = 1013.2075 hPa (0.0254 m × 13595.1 kg/m³ × 9.80665 m/s², computed)
  assertClose(29.92 * HPA_PER_INHG, 1013.2075, 1e-4);
});

test('decodeMetar M1: NWS/FAA "Key to decode a METAR" card example', () => {
  const r = dec(
    'METAR KABC 121755Z AUTO 21016G24KT 180V240 1SM R11/P6000FT -RA BR BKN015 OVC025 06/04 A2990 RMK AO2 PK WND 20032/25 WSHFT 1715 VIS 3/4V1 1/2 VIS 3/4 RWY11 RAB07 CIG 013V017 CIG 017 RWY11 PRESFR SLP125 P0003 60009 T00640036 10066 21012 58033 TSNO $',
  );
  // NWS/FAA METAR key card: every value below is printed in its decode column
  assert.is(r.type, 'METAR');
  assert.is(r.station, 'KABC');
  assert.is(r.timeMs, Date.UTC(2024, 2, 12, 17, 55));
  assert.ok(r.auto);
  assert.is(r.windDirDeg, 210);
  assertClose(r.windSpeedMs, kt(16), 1e-12);
  assertClose(r.gustMs, kt(24), 1e-12);
  assert.is(r.windVarFromDeg, 180);
  assert.is(r.windVarToDeg, 240);
  assertClose(r.visibilityM, STATUTE_MILE_M, 1e-9, 0, '1SM');
  assert.equal(r.rvr, ['R11/P6000FT']);
  assert.equal(r.weatherCodes, ['-RA', 'BR']);
  assert.is(r.weather, WX.RAIN | WX.PRECIP | WX.LIGHT);
  assert.equal(r.sky, [
    { cover: 'BKN', heightFt: 1500 },
    { cover: 'OVC', heightFt: 2500 },
  ]);
  // body 06/04, T group 6.4 / 3.6 preferred
  assertClose(r.temperatureC, 6.4, 1e-12);
  assertClose(r.dewpointC, 3.6, 1e-12);
  assert.ok(r.tempFromRemarks);
  assertClose(r.altimeterHpa, 1012.53, 0.005, 0, 'A2990 = 29.90 inHg');
  assert.is(r.stationType, 'AO2');
  assert.is(r.peakWindDirDeg, 200);
  assertClose(r.peakWindMs, kt(32), 1e-12);
  assert.is(r.peakWindTimeMs, Date.UTC(2024, 2, 12, 17, 25));
  assert.is(r.remarks.length, 1);
  assert.is(r.remarks[0]!.label, 'WSHFT');
  assert.is(r.remarks[0]!.frontal, false);
  assert.is(r.remarks[0]!.shiftTimeMs, Date.UTC(2024, 2, 12, 17, 15));
  assert.is(r.pressureTrend, -1);
  assertClose(r.seaLevelPressureHpa, 1012.5, 1e-9);
  assertClose(r.precip1hMm, 0.03 * 25.4, 1e-12);
  assertClose(r.precip3or6hMm, 0.09 * 25.4, 1e-12);
  assertClose(r.tempMax6hC, 6.6, 1e-12);
  assertClose(r.tempMin6hC, -1.2, 1e-12);
  assert.is(r.pressureTendencyCode, 8);
  assertClose(r.pressureTendency3hHpa, -3.3, 1e-12);
  assert.ok(r.maintenance);
  assert.equal(r.unknownGroups, []);
});

test('decodeMetar M2/M3: PHTO ASOS reports with server-decoded values (public gist of the aviation weather data server)', () => {
  const ref = { ...REF, month: 1 };
  const m2 = dec('PHTO 311953Z 04008KT 10SM SCT029 BKN040 BKN049 27/19 A3016 RMK AO2 SLP210 T02670194', ref);
  assert.is(m2.windDirDeg, 40);
  assertClose(m2.windSpeedMs, kt(8), 1e-12);
  assertClose(m2.visibilityM, 10 * STATUTE_MILE_M, 1e-9);
  assertClose(m2.temperatureC, 26.7, 1e-12); // server temp_c 26.7
  assertClose(m2.dewpointC, 19.4, 1e-12); // server dewpoint_c 19.4
  assertClose(m2.seaLevelPressureHpa, 1021.0, 1e-9); // server 1021.0
  assertClose(m2.altimeterHpa / HPA_PER_INHG, 30.159449, 0.005); // server altim_in_hg, hPa round-trip artefact
  const m3 = dec('PHTO 311853Z 34005KT 10SM SCT048 BKN055 26/20 A3016 RMK AO2 RAE1756 SLP210 P0000 T02560200', ref);
  // P0000 = trace (FMH-1 §12.7.2(a)); stored as 0 mm and flagged
  assert.is(m3.precip1hMm, 0);
  assert.ok(m3.precipTrace);
  assertClose(m3.temperatureC, 25.6, 1e-12);
  assertClose(m3.dewpointC, 20.0, 1e-12);
  assert.equal(m3.unknownGroups, []);
});

test('decodeMetar M4: KSFO report from a public mailing-list post', () => {
  const r = dec('KSFO 240156Z 26016G22KT 9SM BKN012 13/08 A3006 RMK AO2 PK WND 26027/0109 SLP179 T01280083');
  assert.is(r.windDirDeg, 260);
  assertClose(r.gustMs, kt(22), 1e-12);
  assertClose(r.visibilityM, 9 * STATUTE_MILE_M, 1e-9);
  assert.equal(r.sky, [{ cover: 'BKN', heightFt: 1200 }]);
  assertClose(r.temperatureC, 12.8, 1e-12);
  assertClose(r.dewpointC, 8.3, 1e-12);
  assertClose(r.altimeterHpa, 1017.95, 0.005);
  assert.is(r.peakWindDirDeg, 260);
  assertClose(r.peakWindMs, kt(27), 1e-12);
  assert.is(r.peakWindTimeMs, Date.UTC(2024, 2, 24, 1, 9));
  assertClose(r.seaLevelPressureHpa, 1017.9, 1e-9);
});

test('decodeMetar M5: KCLM hourly series (public decoding page)', () => {
  const a = dec('KCLM 302053Z AUTO 35003KT 10SM OVC100 13/10 A2984 RMK AO2 SLP106 T01330100 55004');
  assertClose(a.temperatureC, 13.3, 1e-12);
  assertClose(a.dewpointC, 10.0, 1e-12);
  assertClose(a.seaLevelPressureHpa, 1010.6, 1e-9);
  assert.is(a.pressureTendencyCode, 5);
  assertClose(a.pressureTendency3hHpa, -0.4, 1e-12); // WMO code table 0200: a = 5 → same or lower
  const b = dec('KCLM 302353Z AUTO 27013G20KT 10SM -RA OVC095 11/09 A2984 RMK AO2 RAE21B40 SLP104 P0000 60000 T01110089 10139 20111 55002');
  assert.is(b.windDirDeg, 270);
  assertClose(b.gustMs, kt(20), 1e-12);
  assert.ok(b.precipTrace);
  assert.is(b.precip3or6hMm, 0);
  assertClose(b.temperatureC, 11.1, 1e-12);
  assertClose(b.dewpointC, 8.9, 1e-12);
  assertClose(b.tempMax6hC, 13.9, 1e-12);
  assertClose(b.tempMin6hC, 11.1, 1e-12);
  assertClose(b.pressureTendency3hHpa, -0.2, 1e-12);
  assert.equal(b.unknownGroups, []);
});

test('decodeMetar M6: KBIL report (public decoding page, illustrative)', () => {
  const r = dec('KBIL 162256Z 29017G27KT 10SM FEW070 SCT085 BKN110 M02/M02 A2961 RMK AO2 PK WND 29027/2250 WSHFT 2241 SLP205 70033 T10171022 11006 21017 53016');
  assertClose(r.temperatureC, -1.7, 1e-12);
  assertClose(r.dewpointC, -2.2, 1e-12);
  assert.is(r.peakWindTimeMs, Date.UTC(2024, 2, 16, 22, 50));
  assertClose(r.peakWindMs, kt(27), 1e-12);
  assert.is(r.remarks[0]!.label, 'WSHFT');
  assert.is(r.remarks[0]!.shiftTimeMs, Date.UTC(2024, 2, 16, 22, 41));
  assertClose(r.seaLevelPressureHpa, 1020.5, 1e-9);
  assertClose(r.precip24hMm, 0.33 * 25.4, 1e-12);
  assertClose(r.tempMax6hC, -0.6, 1e-12);
  assertClose(r.tempMin6hC, -1.7, 1e-12);
  assertClose(r.pressureTendency3hHpa, 1.6, 1e-12);
  assertClose(r.altimeterHpa, 1002.71, 0.005);
});

test('decodeMetar M7: AIM and AFMAN 15-111 §7.2 wind groups', () => {
  const w = (g: string) => dec(`KXYZ 011200Z ${g} 10SM CLR 10/05 A3000`);
  // FAA AIM Key to METAR / AFMAN 15-111 §7.2 examples
  let r = w('13008KT');
  assert.is(r.windDirDeg, 130);
  assertClose(r.windSpeedMs, kt(8), 1e-12);
  r = w('08032G45KT');
  assertClose(r.gustMs, kt(45), 1e-12);
  r = w('VRB04KT');
  assert.ok(Number.isNaN(r.windDirDeg));
  assert.ok(r.windVariable);
  assertClose(r.windSpeedMs, kt(4), 1e-12);
  r = w('00000KT'); // calm: direction 0, speed 0 (Observation convention)
  assert.is(r.windDirDeg, 0);
  assert.is(r.windSpeedMs, 0);
  r = w('210103G130KT'); // AIM: speeds >= 100 kt in three digits
  assert.is(r.windDirDeg, 210);
  assertClose(r.windSpeedMs, kt(103), 1e-12);
  assertClose(r.gustMs, kt(130), 1e-12);
  r = dec('KXYZ 011200Z 32012G22KT 280V350 10SM CLR 10/05 A3000'); // AIM variable direction
  assert.is(r.windVarFromDeg, 280);
  assert.is(r.windVarToDeg, 350);
  r = dec('KXYZ 011200Z 36012KT 330V030 10SM CLR 10/05 A3000'); // training guide: across north
  assert.is(r.windVarFromDeg, 330);
  assert.is(r.windVarToDeg, 30);
});

test('decodeMetar M8: constructed WMO report (CB, NOSIG, Q group)', () => {
  const r = dec('METAR EGLL 121250Z 24015G28KT 200V280 6000 -SHRA FEW012 SCT025CB 12/08 Q1003 NOSIG');
  // decoded per WMO-No. 306 FM 15 rules (check-values §6.2)
  assert.is(r.windDirDeg, 240);
  assertClose(r.gustMs, kt(28), 1e-12);
  assert.is(r.windVarFromDeg, 200);
  assert.is(r.visibilityM, 6000);
  assert.is(r.weather, WX.SHOWER | WX.RAIN | WX.PRECIP | WX.CONVECTIVE | WX.LIGHT);
  assert.equal(r.sky, [
    { cover: 'FEW', heightFt: 1200 },
    { cover: 'SCT', heightFt: 2500, cloudType: 'CB' },
  ]);
  assert.is(r.temperatureC, 12);
  assert.is(r.dewpointC, 8);
  assert.is(r.tempFromRemarks, false);
  assert.is(r.qnhHpa, 1003);
  assert.ok(Number.isNaN(r.altimeterHpa));
  assert.equal(r.unknownGroups, []);
  assert.is(metarToObservation(r, 'f', 1).altimeterHpa, 1003); // QNH stands in for the altimeter setting
});

test('decodeMetar M9: constructed MPS + RVR + negative temperatures', () => {
  const r = dec('METAR ULLI 051200Z 33007MPS 0800 R28R/1100U -SN BKN004 OVC015 M05/M07 Q1018');
  assert.is(r.windDirDeg, 330);
  assert.is(r.windSpeedMs, 7); // MPS: already m/s
  assertClose(r.windSpeedMs / KNOT_MS, 13.607, 5e-4); // check-values: 7 m/s = 13.607 kt
  assert.is(r.visibilityM, 800);
  assert.equal(r.rvr, ['R28R/1100U']);
  assert.is(r.weather, WX.SNOW | WX.PRECIP | WX.LIGHT);
  assert.equal(r.sky.map((l) => l.heightFt), [400, 1500]);
  assert.is(r.temperatureC, -5);
  assert.is(r.dewpointC, -7);
  assert.is(r.qnhHpa, 1018);
});

test('decodeMetar M10: constructed calm + CAVOK', () => {
  const r = dec('METAR LFPG 010600Z 00000KT CAVOK 02/M01 Q1025');
  assert.is(r.windDirDeg, 0);
  assert.is(r.windSpeedMs, 0);
  assert.ok(r.cavok);
  assert.is(r.visibilityM, 10000); // CAVOK: visibility 10 km or more (bound stored)
  assert.is(r.temperatureC, 2);
  assert.is(r.dewpointC, -1);
  assert.is(r.qnhHpa, 1025);
});

test('decodeMetar M11: constructed US frontal SPECI', () => {
  const r = dec('SPECI KOKC 041754Z 34025G38KT 10SM BKN030 08/M03 A3002 RMK AO2 PK WND 34038/1752 WSHFT 1741 FROPA PRESRR T00831033');
  assert.is(r.type, 'SPECI');
  assert.is(r.windDirDeg, 340);
  assertClose(r.windSpeedMs, kt(25), 1e-12);
  assertClose(r.gustMs, kt(38), 1e-12);
  assertClose(r.temperatureC, 8.3, 1e-12);
  assertClose(r.dewpointC, -3.3, 1e-12);
  assertClose(r.altimeterHpa, 1016.59, 0.005);
  assert.is(r.peakWindTimeMs, Date.UTC(2024, 2, 4, 17, 52));
  assert.equal(r.remarks, [
    { reportTimeMs: Date.UTC(2024, 2, 4, 17, 54), label: 'FROPA', frontal: true, shiftTimeMs: Date.UTC(2024, 2, 4, 17, 41), file: 'test.txt', line: 1 },
  ]);
  assert.is(r.pressureTrend, 1);
  const o = metarToObservation(r, 'f.txt', 7);
  assert.is(o.source, 'SPECI');
  assert.is(o.remarks!.length, 1);
  assert.is(o.pressureTrend, 1);
  assert.ok(Number.isNaN(o.stationPressureHpa)); // needs elevation; done later
  assert.is(o.line, 7);
});

test('decodeMetar visibility: statute-mile forms (FMH-1 §12.6.6; AIM) and metres (WMO-No. 306 FM 15)', () => {
  const v = (g: string) => dec(`KXYZ 011200Z 18010KT ${g} OVC010 10/05 A3000`).visibilityM;
  assertClose(v('1/2SM'), 0.5 * STATUTE_MILE_M, 1e-9);
  assertClose(v('M1/4SM'), 0.25 * STATUTE_MILE_M, 1e-9); // "less than 1/4": the bound is stored
  assertClose(v('1 1/2SM'), 1.5 * STATUTE_MILE_M, 1e-9);
  assertClose(v('1/16SM'), STATUTE_MILE_M / 16, 1e-9); // real KJFK 2020-01-04
  assertClose(v('15SM'), 15 * STATUTE_MILE_M, 1e-9);
  assertClose(v('P6SM'), 6 * STATUTE_MILE_M, 1e-9);
  assert.is(v('9999'), 10000); // 9999 = 10 km or more
  assert.is(v('0000'), 0);
  assert.is(v('4000NE'), 4000);
  assert.ok(Number.isNaN(v('////')));
});

test('decodeMetar wind units and bounds: KMH, MPS, P99KT, P49MPS (ICAO Annex 3 §4.1.5.2; WMO-No. 306 FM 15)', () => {
  const w = (g: string) => dec(`UXYZ 011200Z ${g} 9999 FEW020 10/05 Q1000`);
  assertClose(w('27036KMH').windSpeedMs, 10, 1e-12); // 36 km/h = 10 m/s exactly
  assert.is(w('18005MPS').windSpeedMs, 5);
  assertClose(w('20008G13MPS').gustMs, 13, 1e-12);
  assertClose(w('270P99KT').windSpeedMs, kt(100), 1e-12); // ≥ 100 kt: lower bound stored
  assert.is(w('090P49MPS').windSpeedMs, 50);
  const m = w('/////KT');
  assert.ok(Number.isNaN(m.windDirDeg) && Number.isNaN(m.windSpeedMs));
});

test('decodeMetar temperature group: M minus, missing dew point (AFMAN 15-111 Att. 3; UK AIP GEN 3.5.10; US Navy)', () => {
  const t = (g: string) => dec(`KXYZ 011200Z 18010KT 10SM CLR ${g} A3000`);
  let r = t('03/M01'); // AFMAN: 2.6 / −1.5 °C → 03/M01
  assert.is(r.temperatureC, 3);
  assert.is(r.dewpointC, -1);
  r = t('M00/M01');
  assert.ok(Object.is(r.temperatureC, 0)); // M00: (−0.5, 0) rounds to 0; no negative zero
  r = t('10/');
  assert.is(r.temperatureC, 10);
  assert.ok(Number.isNaN(r.dewpointC));
  r = t('10///');
  assert.is(r.temperatureC, 10);
  assert.ok(Number.isNaN(r.dewpointC));
  r = t('M05/');
  assert.is(r.temperatureC, -5);
  r = t('M12/M14');
  assert.is(r.dewpointC, -14);
  r = t('/////');
  assert.ok(Number.isNaN(r.temperatureC));
  assert.equal(r.unknownGroups, []);
});

test('decodeMetar modifiers: COR, CCA, AUTO, NIL, "=" end mark', () => {
  assert.ok(dec('METAR COR EGPH 140920Z 25020KT 9999 SCT020 07/02 Q0995').corrected);
  assert.ok(dec('METAR EDDH 141020Z COR 27016G27KT 9999 SCT020 09/04 Q1000').corrected);
  assert.ok(dec('METAR EDDH 141020Z CCA 27016G27KT 9999 SCT020 09/04 Q1000').corrected);
  const a = dec('KXYZ 011200Z AUTO 18010KT 10SM CLR 10/05 A3000 RMK AO2');
  assert.ok(a.auto);
  assert.is(a.stationType, 'AO2');
  const n = dec('METAR EGLL 121250Z NIL=');
  assert.ok(n.nil);
  const e = dec('METAR EGLL 121250Z 24015KT 9999 FEW012 12/08 Q1003=');
  assert.is(e.qnhHpa, 1003);
  assert.equal(e.unknownGroups, []);
});

test('decodeMetar missing and truncated groups are kept as unknown, never thrown (real KORD archive cuts)', () => {
  // NCEI LCD KORD 2024-02-28 01:09Z, cut to BKN1 in the archive
  const r = dec('SPECI KORD 280109Z 12013KT 10SM TS SCT030CB BKN065 BKN1 19/15 A2922 RMK AO2 LTG DSNT ALQDS TSB09 PRESFR');
  assert.equal(r.unknownGroups, ['BKN1']);
  assert.is(r.temperatureC, 19);
  assert.ok((r.weather & WX.CONVECTIVE) !== 0);
  assert.ok((r.weather & WX.THUNDER) !== 0);
  const cut = dec('METAR KORD 280251Z 11007KT 10SM FEW040 12/10 A2921 RMK AO2 SLP890 T01220100 580');
  assert.equal(cut.unknownGroups, ['580']);
  const auto = dec('KXYZ 011200Z AUTO /////KT //// // ////// ///// A////');
  assert.ok(Number.isNaN(auto.windSpeedMs) && Number.isNaN(auto.visibilityM) && Number.isNaN(auto.altimeterHpa));
  assert.equal(auto.unknownGroups, []);
  const cutWind = dec('KXYZ 011200Z 18010K');
  assert.equal(cutWind.unknownGroups, ['18010K']);
  assert.ok(Number.isNaN(cutWind.windSpeedMs));
});

test('decodeMetar split wind group "04015 KT" as found in a real KJFK archive line', () => {
  const r = dec('KJFK 171251Z 04015 KT 4SM -RA BR BKN008 OVC014 01/01 A2989 RMK SLP122 P0010 T0110011 $');
  assert.is(r.windDirDeg, 40);
  assertClose(r.windSpeedMs, kt(15), 1e-12);
  assert.equal(r.unknownGroups, ['T0110011']); // 7-digit T group is malformed
  assert.is(r.temperatureC, 1);
});

test('decodeMetar rejects lines without station and time', () => {
  assert.is(fail('').reason, 'empty');
  assert.is(fail('hello world').reason, 'not-a-report');
  assert.is(fail('METAR').reason, 'no-station');
  assert.is(fail('METAR 121250Z 24015KT').reason, 'no-station');
  assert.is(fail('METAR EGLL 24015KT 9999').reason, 'no-time');
  const b = fail('METAR EGLL 322550Z 24015KT');
  assert.is(b.reason, 'bad-time');
  assert.is(b.group, '322550Z');
  assert.is(b.column, 12);
  assert.is(fail('EGLL').reason, 'no-time');
});

test('weatherFlags: WMO-No. 306 code table 4678 phenomena → WX bits', () => {
  const f = (g: string) => weatherFlags(g, 0, g.length);
  assert.is(f('+TSRAGR'), WX.HEAVY | WX.THUNDER | WX.RAIN | WX.HAIL | WX.PRECIP);
  assert.is(f('-FZRA'), WX.FREEZING | WX.RAIN | WX.PRECIP | WX.LIGHT);
  assert.is(f('-SHSN'), WX.SHOWER | WX.SNOW | WX.PRECIP | WX.LIGHT);
  assert.is(f('-PLRA'), WX.ICE_PELLETS | WX.RAIN | WX.PRECIP | WX.LIGHT);
  assert.is(f('FG'), WX.FOG);
  assert.is(f('BR'), 0); // mist: known, no flag
  assert.is(f('VCSH'), WX.SHOWER); // vicinity: descriptor only, no precipitation at the station
  assert.is(f('VCTS'), WX.THUNDER);
  assert.is(f('SQ'), WX.SQUALL);
  assert.is(f('BLDU'), WX.DUST);
  assert.is(f('XX'), -1);
  assert.is(f('RAX'), -1);
  assert.is(f('KORD'), -1);
});

test('looksLikeMetar sniffs METAR text but not CSV', () => {
  assert.ok(looksLikeMetar('METAR KORD 270851Z 20014G23KT 10SM SCT014 14/12 A2942\nSPECI KORD 271225Z 20011KT 8SM 13/12 A2938\n'));
  assert.ok(looksLikeMetar('202001010051 METAR KJFK 010051Z 18022G34KT 8SM OVC005 19/19 A2966\n'));
  assert.ok(looksLikeMetar('2024-02-27T08:51:00Z KORD 270851Z 20014G23KT 10SM 14/12 A2942\n'));
  assert.not.ok(looksLikeMetar('station,valid,tmpf\nJFK,2019-11-01 00:24,66.00\n'));
  assert.not.ok(looksLikeMetar(''));
});

// Same reader, two outputs: the reused-object callback must see exactly what the array API returns.
test('readMetarText(onObservation) hands over the same observations as the array API (fixture corpus)', () => {
  const text = readFileSync(new URL('../fixtures/metar-corpus.txt', import.meta.url), 'utf8');
  const a = readMetarText(text, 'corpus.txt', { month: '2024-02' });
  const seen: Observation[] = [];
  let last: Observation | null = null;
  const b = readMetarText(text, 'corpus.txt', {
    month: '2024-02',
    onObservation: (o) => {
      if (last) assert.ok(o === last, 'one reused object');
      last = o;
      const copy = { ...o };
      if (!copy.remarks) copy.remarks = undefined;
      seen.push(copy);
    },
  });
  assert.ok(a.observations.length > 50);
  assert.is(b.observations.length, 0);
  assert.equal(seen, a.observations);
  assert.equal(b.report, a.report);
});

test.run();
