import { test } from 'uvu';
import * as assert from 'uvu/assert';
import { assertClose } from '../helpers/assert.js';
import {
  mixingRatio, mixingRatioFromDewpoint, mixingRatioFromRelativeHumidity, mixingRatioFromSpecificHumidity,
  specificHumidityFromMixingRatio, vaporPressureFromMixingRatio, virtualTemperatureFromDewpointK, virtualTemperatureK,
} from '../../src/physics/humidity.js';
import { saturationVaporPressureHpa } from '../../src/physics/vapor.js';

test('mixingRatio(25, 1000) matches MetPy doc example: 15.9476131 g/kg', () => {
  assertClose(1000 * mixingRatio(25, 1000), 15.9476131, 1e-7);
});

test('vaporPressureFromMixingRatio(0.018, 988) matches MetPy v1.4 doc example: 27.789371 hPa', () => {
  assertClose(vaporPressureFromMixingRatio(0.018, 988), 27.789371, 1e-6);
});

test('mixingRatioFromRelativeHumidity(28.1, 0.65, 1000) matches MetPy v1.6 doc example (WMO-No. 8 eq. 4.A.16): 15.7646969 g/kg', () => {
  assertClose(1000 * mixingRatioFromRelativeHumidity(28.1, 0.65, 1000), 15.7646969, 1e-7);
  // MetPy v1.4 used w = RH·w_s instead: 15.9828362 g/kg — the two conventions differ by ~1.4 % here
  const ws = mixingRatio(saturationVaporPressureHpa(28.1), 1000);
  assertClose(1000 * 0.65 * ws, 15.9828362, 1e-7, 0, 'RH·w_s convention');
});

test('relative humidity from mixing ratio: MetPy v1.6 doc example (WMO eq. 4.A.15) 67.1277085 % and v1.5 (w/w_s) 66.1763544 %', () => {
  // RH = e/e_s with e from the mixing ratio (WMO eq. 4.A.15); r = 0.018, p = 1013.25 hPa, T = 30 °C
  const e = vaporPressureFromMixingRatio(0.018, 1013.25);
  assertClose((100 * e) / saturationVaporPressureHpa(30), 67.1277085, 1e-7, 0, 'e/e_s');
  assertClose((100 * 0.018) / mixingRatio(saturationVaporPressureHpa(30), 1013.25), 66.1763544, 1e-7, 0, 'w/w_s');
});

test('mixingRatioFromDewpoint(18, 850) = 15.46755 g/kg (Bolton eq. 10, ε = 0.6219569; MetPy θ_E worked example intermediate)', () => {
  assertClose(1000 * mixingRatioFromDewpoint(18, 850), 15.46755, 1e-5);
});

test('specific humidity ↔ mixing ratio round trip (definitions q = r/(1+r))', () => {
  for (const r of [0, 0.001, 0.01, 0.03]) assertClose(mixingRatioFromSpecificHumidity(specificHumidityFromMixingRatio(r)), r, 1e-15);
  assertClose(specificHumidityFromMixingRatio(0.01), 0.01 / 1.01, 1e-15);
});

test('virtualTemperatureK: dry air gives T; T_v ≈ T (1 + 0.608 q) (WallaceHobbs2006 approximation, within 0.05 K for r ≤ 0.02)', () => {
  assertClose(virtualTemperatureK(20, 0), 293.15, 1e-12);
  for (const r of [0.005, 0.01, 0.02]) assertClose(virtualTemperatureK(25, r), 298.15 * (1 + 0.608 * specificHumidityFromMixingRatio(r)), 0.05, 0, `r=${r}`);
  assertClose(virtualTemperatureFromDewpointK(25, 18, 980), virtualTemperatureK(25, mixingRatioFromDewpoint(18, 980)), 1e-12);
});

test('undefined physics → NaN: e ≥ p, e < 0, r < 0, q ≥ 1, NaN inputs', () => {
  assert.ok(Number.isNaN(mixingRatio(1000, 1000)));
  assert.ok(Number.isNaN(mixingRatio(-1, 1000)));
  assert.ok(Number.isNaN(mixingRatio(NaN, 1000)));
  assert.ok(Number.isNaN(mixingRatio(10, NaN)));
  assert.ok(Number.isNaN(vaporPressureFromMixingRatio(-0.1, 1000)));
  assert.ok(Number.isNaN(mixingRatioFromSpecificHumidity(1)));
  assert.ok(Number.isNaN(mixingRatioFromDewpoint(NaN, 1000)));
  assert.ok(Number.isNaN(virtualTemperatureK(NaN, 0.01)));
});

test.run();
