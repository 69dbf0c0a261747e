import { test } from 'uvu';
import * as assert from 'uvu/assert';
import { assertClose } from '../helpers/assert.js';
import {
  MAGNUS_AERK1996, MAGNUS_BOLTON1980, MAGNUS_WMO2008, MAGNUS_WMO2008_ICE,
  saturationVaporPressureAerkHpa, saturationVaporPressureHpa, saturationVaporPressureIceHpa,
  saturationVaporPressureMagnusHpa, saturationVaporPressureMurphyKoopHpa,
} from '../../src/physics/vapor.js';

test('saturationVaporPressureHpa(25) matches MetPy v1.5 doc example (Bolton1980 eq. 10): 31.6742944 hPa', () => {
  assertClose(saturationVaporPressureHpa(25), 31.6742944, 1e-6);
});

// Table rows [t °C, Bolton eq. 10, AERK, WMO-No. 8 Annex 4.B, Murphy-Koop eq. 10]: values computed from the
// published formulas (independent python double-precision evaluation), printed to 4 (5 for MK) decimals.
// Tolerance: display rounding, 5e-5 hPa (5e-6 for Murphy-Koop).
const TABLE: [number, number, number, number, number][] = [
  [-40, 0.1896, 0.1897, 0.1902, 0.18912],
  [-30, 0.5104, 0.5106, 0.5117, 0.50936],
  [-20, 1.2574, 1.2578, 1.2597, 1.25504],
  [-10, 2.8677, 2.8677, 2.8703, 2.86453],
  [0, 6.112, 6.1094, 6.112, 6.11213],
  [10, 12.2717, 12.2602, 12.2603, 12.28257],
  [20, 23.3695, 23.3344, 23.326, 23.39399],
  [25, 31.6743, 31.6174, 31.6006, 31.69937],
  [30, 42.4558, 42.3665, 42.3372, 42.46814],
  [40, 73.949, 73.7472, 73.6746, 73.84306],
];

test('Magnus forms and Murphy-Koop eq. 10 reproduce the computed table (Bolton1980, AlduchovEskridge1996, WMO-No. 8, MurphyKoop2005)', () => {
  for (const [t, b, a, w, mk] of TABLE) {
    assertClose(saturationVaporPressureHpa(t), b, 5e-5, 0, `Bolton ${t}`);
    assertClose(saturationVaporPressureMagnusHpa(t, MAGNUS_BOLTON1980), b, 5e-5, 0, `Bolton set ${t}`);
    assertClose(saturationVaporPressureAerkHpa(t), a, 5e-5, 0, `AERK ${t}`);
    assertClose(saturationVaporPressureMagnusHpa(t, MAGNUS_AERK1996), a, 5e-5, 0, `AERK set ${t}`);
    assertClose(saturationVaporPressureMagnusHpa(t, MAGNUS_WMO2008), w, 5e-5, 0, `WMO ${t}`);
    assertClose(saturationVaporPressureMurphyKoopHpa(t), mk, 5e-6, 0, `MK ${t}`);
  }
});

test('every Magnus set stays within 0.6 % of Murphy-Koop over −40…40 °C (sanity bound)', () => {
  for (let t = -40; t <= 40; t += 0.5) {
    const ref = saturationVaporPressureMurphyKoopHpa(t);
    for (const k of [MAGNUS_BOLTON1980, MAGNUS_AERK1996, MAGNUS_WMO2008]) {
      const rel = Math.abs(saturationVaporPressureMagnusHpa(t, k) / ref - 1);
      assert.ok(rel < 0.006, `${k.source} at ${t}: ${rel}`);
    }
  }
});

test('saturationVaporPressureMurphyKoopHpa(0.01) equals the triple-point pressure 611.657 Pa (Wexler 1976)', () => {
  assertClose(saturationVaporPressureMurphyKoopHpa(0.01), 6.11657, 5e-5);
});

test('saturationVaporPressureIceHpa (MurphyKoop2005 eq. 7) meets the liquid curve at the triple point and stays below it when colder', () => {
  // MurphyKoop2005: both formulations give 611.657 Pa at 273.16 K
  assertClose(saturationVaporPressureIceHpa(0.01), 6.11657, 5e-5, 0, 'triple point');
  for (let t = -40; t < 0; t += 5) assert.ok(saturationVaporPressureIceHpa(t) < saturationVaporPressureMurphyKoopHpa(t), `ice < water at ${t}`);
  // WMO-No. 8 (2008) Annex 4.B ice Magnus form agrees with Murphy-Koop within 0.5 % over −40…0 °C (their stated accuracies)
  for (let t = -40; t <= 0; t += 5) {
    const rel = Math.abs(saturationVaporPressureMagnusHpa(t, MAGNUS_WMO2008_ICE) / saturationVaporPressureIceHpa(t) - 1);
    assert.ok(rel < 0.005, `ice Magnus vs MK at ${t}: ${rel}`);
  }
});

test('NaN in → NaN out', () => {
  assert.ok(Number.isNaN(saturationVaporPressureHpa(NaN)));
  assert.ok(Number.isNaN(saturationVaporPressureIceHpa(NaN)));
  assert.ok(Number.isNaN(saturationVaporPressureMurphyKoopHpa(NaN)));
  assert.ok(Number.isNaN(saturationVaporPressureAerkHpa(NaN)));
});

test.run();
