/**
 * METAR remarks (FMH-1 ch. 12 §12.7; encode examples from AFMAN 15-111 Attachment 3 and the FAA AIM;
 * WMO-No. 306 code table 0200 for the 3-h tendency).
 */
import { test } from 'uvu';
import * as assert from 'uvu/assert';
import { assertClose } from '../../helpers/assert.js';
import { decodeMetar, isParseIssue, type MetarReport } from '../../../src/ingest/metar.js';
import { KNOT_MS } from '../../../src/physics/constants.js';
import { WX } from '../../../src/model/index.js';
import { decodeRemarks } from '../../../src/ingest/metar/remarks.js';
import { newMetarReport } from '../../../src/ingest/metar/decodeMetar.js';
import { asciiBytes } from '../../../src/ingest/metar/ascii.js';

const REF = { year: 2020, month: 2, file: 'rmk.txt', line: 3 };
/** A body with whole-degree 10/05 and the given remarks, at 2020-02-07 19:55Z. */
function rmk(remarks: string, time = '071955Z'): MetarReport {
  const r = decodeMetar(`KXYZ ${time} 18010KT 10SM CLR 10/05 A3000 RMK AO2 ${remarks}`, REF);
  if (isParseIssue(r)) throw new Error(r.message);
  return r;
}

test('T group is preferred over the body temperature (AFMAN 15-111 Att. 3 rmk: 2.6 / −1.5 °C → T00261015)', () => {
  const r = rmk('T00261015');
  assertClose(r.temperatureC, 2.6, 1e-12);
  assertClose(r.dewpointC, -1.5, 1e-12);
  assert.ok(r.tempFromRemarks);
  const body = rmk('SLP125');
  assert.is(body.temperatureC, 10);
  assert.is(body.tempFromRemarks, false);
  const tOnly = rmk('T0078'); // real KJFK 2020-01-04 14:59 (temperature only)
  assertClose(tOnly.temperatureC, 7.8, 1e-12);
  assert.is(tOnly.dewpointC, 5); // body dew point kept
});

test('SLPppp decoding convention (Plymouth State WxP: ≥ 500 → 9xx.x else 10xx.x; AFMAN 998.2 → SLP982)', () => {
  assertClose(rmk('SLP982').seaLevelPressureHpa, 998.2, 1e-9);
  assertClose(rmk('SLP125').seaLevelPressureHpa, 1012.5, 1e-9);
  assertClose(rmk('SLP862').seaLevelPressureHpa, 986.2, 1e-9);
  assertClose(rmk('SLP500').seaLevelPressureHpa, 950.0, 1e-9);
  assertClose(rmk('SLP499').seaLevelPressureHpa, 1049.9, 1e-9);
  const no = rmk('SLPNO');
  assert.ok(Number.isNaN(no.seaLevelPressureHpa));
  assert.equal(no.unknownGroups, []);
});

test('5appp signed by WMO-No. 306 code table 0200 (examples: 52032 +3.2, 58033 −3.3, 53016 +1.6, 55004 −0.4)', () => {
  const rows: [string, number, number][] = [
    ['52032', 2, 3.2], // AFMAN: steady increase of 3.2 hPa
    ['58033', 8, -3.3], // NWS key card M1
    ['53016', 3, 1.6],
    ['55004', 5, -0.4],
    ['50010', 0, 1.0], // a = 0: higher or same
    ['51005', 1, 0.5],
    ['54000', 4, 0], // a = 4: steady
    ['56012', 6, -1.2],
    ['57020', 7, -2.0],
  ];
  for (const [g, a, v] of rows) {
    const r = rmk(g);
    assert.is(r.pressureTendencyCode, a, g);
    assertClose(r.pressureTendency3hHpa, v, 1e-12, 0, g);
  }
  assert.equal(rmk('59012').unknownGroups, ['59012']); // a = 9 is not in code table 0200
  // WMO-No. 306 code table 0200: a = 4 is "the same as 3 h ago"; with ppp ≠ 000 the group contradicts itself
  // and the sign is unknown, so the change is NaN (our documented rule); the characteristic is kept.
  const odd = rmk('54003');
  assert.is(odd.pressureTendencyCode, 4);
  assert.ok(Number.isNaN(odd.pressureTendency3hHpa), '54003');
});

test('6-h max/min 1snTTT / 2snTTT (AFMAN 15-111 Att. 3: −2.1 → 11021, 14.2 → 10142, −0.1 → 21001, 1.2 → 20012)', () => {
  assertClose(rmk('11021').tempMax6hC, -2.1, 1e-12);
  assertClose(rmk('10142').tempMax6hC, 14.2, 1e-12);
  assertClose(rmk('21001').tempMin6hC, -0.1, 1e-12);
  assertClose(rmk('20012').tempMin6hC, 1.2, 1e-12);
  // 24-h max/min (AFMAN: 10.0 / −1.5 → 401001015) is recognised, not stored
  assert.equal(rmk('401001015').unknownGroups, []);
});

test('PK WND dddff(f)/(hh)mm (AFMAN 15-111 Att. 3 / AIM examples)', () => {
  // AFMAN: PK WND 28045/15 = 280° 45 kt at :15 past the hour
  let r = rmk('PK WND 28045/15');
  assert.is(r.peakWindDirDeg, 280);
  assertClose(r.peakWindMs, 45 * KNOT_MS, 1e-12);
  assert.is(r.peakWindTimeMs, Date.UTC(2020, 1, 7, 19, 15));
  // AIM: PK WND 28045/1955
  r = rmk('PK WND 28045/1955');
  assert.is(r.peakWindTimeMs, Date.UTC(2020, 1, 7, 19, 55));
  // minutes later than the report minute belong to the previous hour; hh later → previous day
  r = rmk('PK WND 18034/58', '010051Z');
  assert.is(r.peakWindTimeMs, Date.UTC(2020, 0, 31, 23, 58));
  // AFMAN: several groups; the strongest is kept
  r = rmk('PK WND 24042/43 25044/19');
  assert.is(r.peakWindDirDeg, 250);
  assertClose(r.peakWindMs, 44 * KNOT_MS, 1e-12);
  r = rmk('PK WND 210103/1950'); // 3-digit speed
  assertClose(r.peakWindMs, 103 * KNOT_MS, 1e-12);
});

test('WSHFT (hh)mm [FROPA] and FROPA remarks → ObserverRemark (FMH-1 §12.7.1; AFMAN Att. 3 rmk 5)', () => {
  // AFMAN: WSHFT 30 FROPA = shift began :30, frontal passage
  let r = rmk('WSHFT 30 FROPA');
  assert.equal(r.remarks, [
    { reportTimeMs: Date.UTC(2020, 1, 7, 19, 55), label: 'FROPA', frontal: true, shiftTimeMs: Date.UTC(2020, 1, 7, 19, 30), file: 'rmk.txt', line: 3 },
  ]);
  r = rmk('WSHFT 1910');
  assert.is(r.remarks[0]!.label, 'WSHFT');
  assert.is(r.remarks[0]!.frontal, false);
  assert.is(r.remarks[0]!.shiftTimeMs, Date.UTC(2020, 1, 7, 19, 10));
  // real KJFK 2019-11-12 13:51: FROPA stands alone in the remarks
  r = rmk('PK WND 31032/1332 SLP080 FROPA P0000 T00780056');
  assert.is(r.remarks.length, 1);
  assert.is(r.remarks[0]!.label, 'FROPA');
  assert.ok(r.remarks[0]!.frontal);
  assert.ok(Number.isNaN(r.remarks[0]!.shiftTimeMs));
  // real KJFK 2020-02-07 14:51: WRM FROPA
  r = rmk('SFC VIS 1 SLP807 WRM FROPA BR SCT000 P0006 60009 T00940094 58053');
  assert.is(r.remarks[0]!.label, 'WRM FROPA');
  assert.equal(r.unknownGroups, []);
  r = rmk('APRNT FROPA');
  assert.is(r.remarks[0]!.label, 'APRNT FROPA');
  assert.ok(r.remarks[0]!.frontal);
  r = rmk('WSHFT'); // time missing
  assert.ok(Number.isNaN(r.remarks[0]!.shiftTimeMs));
});

test('PRESRR / PRESFR → pressureTrend ±1 (FMH-1 §12.7.1; AFMAN Att. 3 rmk 21)', () => {
  assert.is(rmk('PRESRR').pressureTrend, 1);
  assert.is(rmk('PRESFR').pressureTrend, -1);
  assert.is(rmk('SLP125').pressureTrend, 0);
});

test('Prrrr / 6RRRR / 7RRRR in hundredths of an inch (AFMAN Att. 3: P0003 = 0.03 in, 60009 = 0.09 in, 70033 = 0.33 in)', () => {
  let r = rmk('P0003 60009 70033');
  assertClose(r.precip1hMm, 0.762, 1e-12);
  assertClose(r.precip3or6hMm, 2.286, 1e-12);
  assertClose(r.precip24hMm, 8.382, 1e-12);
  assert.not.ok(r.precipTrace);
  r = rmk('P0000');
  assert.is(r.precip1hMm, 0);
  assert.ok(r.precipTrace);
  r = rmk('6////'); // real KORD 2024-02-28 14:51: indeterminate amount
  assert.ok(Number.isNaN(r.precip3or6hMm));
  assert.equal(r.unknownGroups, []);
});

test('lightning and CB remarks set WX.CONVECTIVE; sensor status, begin/end, $ are recognised (FMH-1 §12.7)', () => {
  // real KORD 2024-02-28 00:51Z remark text
  const r = rmk('LTG DSNT SW-NW RAB00E20 SLP900 OCNL LTGCGIC DSNT W-NW CB DSNT W-NW MOV E P0000 T01940150 $');
  assert.ok((r.weather & WX.CONVECTIVE) !== 0);
  assert.ok(r.maintenance);
  assert.equal(r.unknownGroups, []);
  const s = rmk('RAE34TSE41GRB0157E08 SNE1459B16E41 RAB99RAEMM TSNO PNO FZRANO RVRNO PWINO VISNO RWY06 CHINO');
  assert.equal(s.unknownGroups, []);
  assert.is(s.weather & WX.CONVECTIVE, 0);
  const v = rmk('VIS 3/4V1 1/2 VIS 3/4 RWY11 CIG 013V017 TWR VIS 1 1/4 SNINCR 2/10 4/021 GR 1/2');
  assert.equal(v.unknownGroups, []);
});

test('unknown remark groups are kept and counted', () => {
  const r = rmk('FOO T000010006 BAR123');
  assert.equal(r.unknownGroups, ['FOO', 'T000010006', 'BAR123']);
});

/** decodeRemarks on the blank-separated tokens of `text` from token i0 on, for a report at 2020-02-07 19:55Z. */
function direct(text: string, i0 = 0): MetarReport {
  const starts: number[] = [];
  const ends: number[] = [];
  for (const m of text.matchAll(/\S+/g)) {
    starts.push(m.index!);
    ends.push(m.index! + m[0].length);
  }
  const r = newMetarReport();
  r.timeMs = Date.UTC(2020, 1, 7, 19, 55);
  decodeRemarks(text, asciiBytes(text), Int32Array.from(starts), Int32Array.from(ends), i0, starts.length, r, 'direct.txt', 9, false);
  return r;
}

test('decodeRemarks() called directly reads from token i0 and names file and line in observer remarks', () => {
  // FMH-1 §12.7.1 (AFMAN Att. 3 rmk 5): WSHFT 30 FROPA = shift began :30, frontal
  const r = direct('KXYZ 071955Z RMK AO2 WSHFT 30 FROPA SLP125', 3);
  assert.is(r.stationType, 'AO2');
  assert.equal(r.remarks, [{ reportTimeMs: Date.UTC(2020, 1, 7, 19, 55), label: 'FROPA', frontal: true, shiftTimeMs: Date.UTC(2020, 1, 7, 19, 30), file: 'direct.txt', line: 9 }]);
  assertClose(r.seaLevelPressureHpa, 1012.5, 1e-9);
  // constructed: the body tokens before i0 are not read as remarks
  assert.equal(r.unknownGroups, []);
});

test('decodeRemarks() station types AO1, AO2A and COLD FROPA, CBMAM (FMH-1 §12.7.1)', () => {
  // FMH-1 §12.7.1(a) (from memory): AO1 without, AO2 with a precipitation discriminator; A = augmented
  assert.is(direct('AO1').stationType, 'AO1');
  assert.is(direct('AO2A').stationType, 'AO2A');
  // constructed: COLD FROPA is an observer's frontal remark without a time
  const c = direct('COLD FROPA');
  assert.is(c.remarks[0]!.label, 'COLD FROPA');
  assert.ok(Number.isNaN(c.remarks[0]!.shiftTimeMs));
  // FMH-1 §12.7.1 (from memory): CBMAM cumulonimbus mammatus
  assert.is(direct('CBMAM DSNT S').weather & WX.CONVECTIVE, WX.CONVECTIVE);
});

test('decodeRemarks() recognises additive groups it does not store (8/CLCMCH, 98mmm, 931RRR, I1nnn)', () => {
  // FMH-1 §12.7.2 (from memory): cloud types 8/578, sunshine 98096, snowfall 933021, ice accretion I1001
  assert.equal(direct('8/578 98096 933021 I1001').unknownGroups, []);
});

test('decodeRemarks() reads numbers after VIS/CIG as their values, up to an unknown word', () => {
  // constructed: location words (RWY11, NE) may stand between the values; an unknown word ends the list
  assert.equal(direct('CIG 013V017 RWY11 VIS NE 2 1/2').unknownGroups, []);
  assert.equal(direct('CIG 013 FOO 013V017').unknownGroups, ['FOO', '013V017']);
});

test.run();
