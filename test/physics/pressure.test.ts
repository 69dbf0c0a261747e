import { test } from 'uvu';
import * as assert from 'uvu/assert';
import fc from 'fast-check';
import { assertAllClose, assertClose } from '../helpers/assert.js';
import {
  ALTIMETER_K, altimeterFromStationPressureHpa, decodePressureTendencyGroup, hpaToInHg, inHgToHpa, pressureChangeFromTendencyHpa,
  pressureTendencySeries, seaLevelPressureHpa, stationPressureFromAltimeterHpa, tendencyCharacteristic,
} from '../../src/physics/pressure.js';
import { FOOT_M, MS_PER_HOUR, MS_PER_MINUTE } from '../../src/physics/constants.js';

test('inHgToHpa / hpaToInHg: 29.92 inHg = 1013.2075 hPa, 1013.25 hPa = 29.92126 inHg, 30.00 inHg = 1015.9166 hPa (conventional inHg, NIST SP 811 B.8)', () => {
  assertClose(inHgToHpa(29.92), 1013.2075, 1e-4);
  assertClose(hpaToInHg(1013.25), 29.92126, 1e-5);
  assertClose(inHgToHpa(30.0), 1015.9166, 1e-4);
  // PRESRR/PRESFR thresholds (AFMAN 15-111 Att. 3): 0.06 inHg = 2.031833 hPa, 0.02 inHg = 0.677278 hPa
  assertClose(inHgToHpa(0.06), 2.031833, 1e-6);
  assertClose(inHgToHpa(0.02), 0.677278, 1e-6);
});

test('ALTIMETER_K = p0^n a/T0 = 8.4228807e-5 with T0 = 288 K (compact NWS form as in NCAR DART, NOAA-COAMPS)', () => {
  assertClose(ALTIMETER_K, 8.4228807e-5, 1e-12);
});

test('altimeterFromStationPressureHpa: NWS wxcalc formula example 30.36 inHg at 100 ft → 30.46072921 inHg (published forum reproduction)', () => {
  assertClose(hpaToInHg(altimeterFromStationPressureHpa(inHgToHpa(30.36), 100 * FOOT_M)), 30.46072921, 1e-6);
});

// Computed from Smithsonian1951 eqs. 1 and 3 (python double precision), tol 1e-4 hPa; coded = rounded down to 0.01 inHg (AFMAN 15-111 §13.4).
const ALT: [number, number, number, string][] = [
  [1013.25, 0, 1012.95, 'A2991'],
  [1000, 0, 999.7, 'A2952'],
  [1000, 300, 1035.8822, 'A3058'],
  [965, 365.76, 1007.6997, 'A2975'],
  [850, 1500, 1018.1176, 'A3006'],
  [840, 1609.3, 1019.673, 'A3011'],
];

test('altimeterFromStationPressureHpa reproduces the computed table and its rounded-down A groups', () => {
  for (const [p, h, a, coded] of ALT) {
    const got = altimeterFromStationPressureHpa(p, h);
    assertClose(got, a, 1e-4, 0, `${p}@${h}`);
    assert.is(`A${Math.floor(hpaToInHg(got) * 100).toString().padStart(4, '0')}`, coded);
  }
});

test('stationPressureFromAltimeterHpa: A2992 at 0 m → 1013.5075, at 1000 m → 898.962; A3000 at 305 m → 980.017; A2961 at 1088 m → 879.964 hPa', () => {
  assertClose(stationPressureFromAltimeterHpa(inHgToHpa(29.92), 0), 1013.5075, 1e-4);
  assertClose(stationPressureFromAltimeterHpa(inHgToHpa(29.92), 1000), 898.962, 1e-3);
  assertClose(stationPressureFromAltimeterHpa(inHgToHpa(30.0), 305), 980.017, 1e-3);
  assertClose(stationPressureFromAltimeterHpa(inHgToHpa(29.61), 1088), 879.964, 1e-3);
});

test('property: altimeter ↔ station pressure round trip (abs 1e-9 hPa)', () => {
  fc.assert(
    fc.property(fc.double({ min: 500, max: 1100, noNaN: true }), fc.double({ min: -100, max: 3500, noNaN: true }), (p, h) =>
      Math.abs(stationPressureFromAltimeterHpa(altimeterFromStationPressureHpa(p, h), h) - p) < 1e-9),
  );
});

test('ISA consistency: ISA station pressures at 300/1000/1500 m give A within 0.35 hPa of 1013.25 and SLP within 0.05 hPa (USSA1976)', () => {
  for (const h of [300, 1000, 1500]) {
    const p = 1013.25 * Math.pow(1 - (0.0065 * h) / 288.15, 5.25588); // USSA1976 troposphere
    assertClose(altimeterFromStationPressureHpa(p, h), 1013.25, 0.35, 0, `A at ${h}`);
    assertClose(seaLevelPressureHpa(p, h, 15 - 0.0065 * h), 1013.25, 0.05, 0, `SLP at ${h}`);
  }
});

test('seaLevelPressureHpa: zero elevation is the identity; humidity term raises T_mv and lowers the reduction', () => {
  assert.is(seaLevelPressureHpa(1000, 0, 10), 1000);
  assert.ok(seaLevelPressureHpa(900, 1000, 10, 10) < seaLevelPressureHpa(900, 1000, 10, 0));
  // hand check: exp(g0 H / (R_d T_mv)) with T_mv = 283.15 + 3.25 K, H = 1000 m
  assertClose(seaLevelPressureHpa(900, 1000, 10), 900 * Math.exp((9.80665 * 1000) / (287.04749 * 286.4)), 1e-3);
  assert.ok(Number.isNaN(seaLevelPressureHpa(NaN, 100, 10)));
});

test('pressureTendencySeries picks the report closest to t − window within the tolerance, skipping NaN pressures', () => {
  const m = MS_PER_MINUTE;
  const t = [0, 20 * m, 55 * m, 60 * m, 80 * m, 115 * m, 200 * m];
  const p = [1000, 1000.5, NaN, 1001, 1001.2, 1002, 1003];
  const d = pressureTendencySeries(t, p, MS_PER_HOUR);
  // i=3 (60 min): target 0 → report 0 exactly → +1.0; i=4 (80): target 20 → +0.7;
  // i=5 (115): target 55 has NaN; nearest finite within 10 min: 60 (5 min) → +1.0; i=6 (200): target 140, none within 10 min → NaN
  assertAllClose(d, [NaN, NaN, NaN, 1.0, 0.7, 1.0, NaN], 1e-12);
  // a wider tolerance accepts 115 min for t = 200 min (target 140, 25 min away)
  assertClose(pressureTendencySeries(t, p, MS_PER_HOUR, 30 * m)[6]!, 1.0, 1e-12);
  // ties take the earlier report: target 40 min is 20 min from both 20 and 60 min
  const tie = pressureTendencySeries([20 * m, 60 * m, 100 * m], [1, 2, 4], MS_PER_HOUR, 20 * m);
  assertClose(tie[2]!, 3, 1e-12);
  assert.throws(() => pressureTendencySeries([0], [1, 2], MS_PER_HOUR), RangeError);
  assert.throws(() => pressureTendencySeries([0], [1], 0), RangeError);
});

test('tendencyCharacteristic follows the wording of WMO-No. 306 code table 0200 for each code', () => {
  const cases: [number[], number, string][] = [
    [[1010, 1011.5, 1010.6], 0, 'increasing then decreasing; higher'],
    [[1010, 1011.2, 1010.0], 0, 'increasing then decreasing; same'],
    [[1010, 1011.5, 1011.5], 1, 'increasing then steady; higher'],
    [[1010, 1011.5, 1011.8], 1, 'increasing then increasing more slowly'],
    [[1010, 1011, 1012, 1013], 2, 'increasing steadily'],
    [[1010, 1009.5, 1010.5], 3, 'decreasing then increasing; higher'],
    [[1010, 1010, 1011], 3, 'steady then increasing'],
    [[1010, 1010.3, 1011.5], 3, 'increasing then increasing more rapidly'],
    [[1010, 1010.05, 1010, 1010.05], 4, 'steady; same'],
    [[1010, 1008.8, 1010], 5, 'decreasing then increasing; same'],
    [[1010, 1008.5, 1009.4], 5, 'decreasing then increasing; lower'],
    [[1010, 1008.5, 1008.5], 6, 'decreasing then steady; lower'],
    [[1010, 1008.5, 1008.2], 6, 'decreasing then decreasing more slowly'],
    [[1013, 1012, 1011, 1010], 7, 'decreasing steadily'],
    [[1010, 1010, 1009], 8, 'steady then decreasing'],
    [[1010, 1010.5, 1009], 8, 'increasing then decreasing; lower'],
    [[1010, 1009.7, 1008.5], 8, 'decreasing then decreasing more rapidly'],
  ];
  for (const [v, a, why] of cases) assert.is(tendencyCharacteristic(v), a, why);
  assert.ok(Number.isNaN(tendencyCharacteristic([1010])));
  assert.is(tendencyCharacteristic([1010, NaN, 1011, 1012]), 2, 'NaN dropped');
});

test('pressureChangeFromTendencyHpa(a, ppp): sign from WMO-No. 306 code table 0200', () => {
  const rows: [number, number, number, string][] = [
    [2, 32, 3.2, 'WMO-No. 306 table 0200: a = 2 increasing, higher'],
    [8, 33, -3.3, 'WMO-No. 306 table 0200: a = 8, lower'],
    [0, 10, 1.0, 'WMO-No. 306 table 0200: a = 0 same or higher'],
    [5, 4, -0.4, 'WMO-No. 306 table 0200: a = 5 same or lower'],
    [4, 0, 0, 'WMO-No. 306 table 0200: a = 4 steady, the same'],
    [7, 0, 0, 'ppp = 000 is no change whatever a says'],
  ];
  for (const [a, ppp, v, source] of rows) assertClose(pressureChangeFromTendencyHpa(a, ppp), v, 1e-12, 0, source);
  assert.ok(Object.is(pressureChangeFromTendencyHpa(7, 0), 0), 'never −0');
  // a = 4 with ppp ≠ 000 contradicts table 0200 ("the same"): sign unknown → NaN (our rule, documented)
  assert.ok(Number.isNaN(pressureChangeFromTendencyHpa(4, 3)));
  assert.ok(Number.isNaN(pressureChangeFromTendencyHpa(9, 3)), 'a = 9 not in the table');
  assert.ok(Number.isNaN(pressureChangeFromTendencyHpa(2, NaN)));
});

test('decodePressureTendencyGroup: FMH-1 / AFMAN 15-111 examples 52032 → +3.2, 58033 → −3.3, 53016 → +1.6, 55004 → −0.4', () => {
  assert.equal(decodePressureTendencyGroup('52032'), { characteristic: 2, changeHpa: 3.2 });
  assert.equal(decodePressureTendencyGroup('58033'), { characteristic: 8, changeHpa: -3.3 });
  assert.equal(decodePressureTendencyGroup('53016'), { characteristic: 3, changeHpa: 1.6 });
  assert.equal(decodePressureTendencyGroup('55004'), { characteristic: 5, changeHpa: -0.4 });
  assert.equal(decodePressureTendencyGroup('54000'), { characteristic: 4, changeHpa: 0 });
  assert.ok(Number.isNaN(decodePressureTendencyGroup('54003')!.changeHpa));
  assert.is(decodePressureTendencyGroup('59012'), null);
  assert.is(decodePressureTendencyGroup('5201'), null);
  assert.is(decodePressureTendencyGroup('6////'), null);
});

test('NaN and undefined physics → NaN', () => {
  assert.ok(Number.isNaN(altimeterFromStationPressureHpa(NaN, 100)));
  assert.ok(Number.isNaN(altimeterFromStationPressureHpa(0.2, 100)));
  assert.ok(Number.isNaN(altimeterFromStationPressureHpa(1000, NaN)));
  assert.ok(Number.isNaN(stationPressureFromAltimeterHpa(NaN, 100)));
  assert.ok(Number.isNaN(inHgToHpa(NaN)));
});

test.run();
