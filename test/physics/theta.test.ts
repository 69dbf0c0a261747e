import { test } from 'uvu';
import * as assert from 'uvu/assert';
import { assertAllClose, assertClose } from '../helpers/assert.js';
import {
  equivalentPotentialTemperatureBolton43K, equivalentPotentialTemperatureK, lclTemperatureFromRelativeHumidityK,
  lclTemperatureFromVaporPressureK, lclTemperatureK, potentialTemperatureK, thetaESeries,
} from '../../src/physics/theta.js';
import { mixingRatioFromDewpoint } from '../../src/physics/humidity.js';
import { relativeHumidityFromDewpoint } from '../../src/physics/dewpoint.js';
import { saturationVaporPressureHpa } from '../../src/physics/vapor.js';

test('potentialTemperatureK(273 K, 800 hPa) matches MetPy v1.3+ doc example (κ = 2/7): 290.972015 K', () => {
  assertClose(potentialTemperatureK(273 - 273.15, 800), 290.972015, 1e-6);
});

test('potentialTemperatureK: Poisson values θ(1000, 20) = 293.15 K, θ(850, 20) = 307.0831 K, θ(500, −20) = 308.5933 K', () => {
  // computed from θ = T (1000/p)^(2/7)
  assertClose(potentialTemperatureK(20, 1000), 293.15, 1e-12);
  assertClose(potentialTemperatureK(20, 850), 307.0831, 1e-4);
  assertClose(potentialTemperatureK(-20, 500), 308.5933, 1e-4);
  // Bolton's κ = 0.2854 changes θ(850, 20 °C) by only ~0.01 K
  assertClose(potentialTemperatureK(20, 850, 0.2854), 307.0831, 0.02);
});

test('equivalentPotentialTemperatureK(20 °C, 18 °C, 850 hPa) matches MetPy v1.4 doc example (Bolton1980 eqs. 15, 24, 39): 353.937994 K', () => {
  assertClose(lclTemperatureK(20, 18), 290.67777, 1e-5, 0, 'T_L eq. 15');
  assertClose(equivalentPotentialTemperatureK(20, 18, 850), 353.937994, 1e-6);
});

test('equivalentPotentialTemperatureBolton43K(20, 18, 850) = 353.8917 K (Bolton1980 eq. 43, ε = 0.622), within 0.05 K of eq. 39', () => {
  assertClose(equivalentPotentialTemperatureBolton43K(20, 18, 850), 353.8917, 1e-4);
  assert.ok(Math.abs(equivalentPotentialTemperatureBolton43K(20, 18, 850) - equivalentPotentialTemperatureK(20, 18, 850)) < 0.05);
});

// Frontal-context cases computed from the Bolton1980 formulas (Bolton SVP, κ = 2/7, ε = 0.6219569; eq. 43 with
// ε = 0.622), python double precision; tol 1e-3 K and 1e-3 g/kg.
const CASES: [string, number, number, number, number, number, number, number, number][] = [
  // name, p, T, Td, θ, θE eq. 39, θE eq. 43, T_L, r g/kg
  ['pre-cold-front', 980, 25, 18, 299.876, 339.228, 339.213, 289.519, 13.372],
  ['post-cold-front', 985, 12, 5, 286.384, 302.215, 302.253, 276.627, 5.556],
  ['dryline moist side', 900, 30, 18, 312.414, 357.666, 357.624, 288.391, 14.588],
  ['dryline dry side', 898, 34, 2, 316.738, 332.79, 332.814, 268.738, 4.927],
];

test('θ, θ_E (eqs. 39 and 43), T_L, r for frontal-context cases', () => {
  for (const [name, p, t, td, th, the39, the43, tl, r] of CASES) {
    assertClose(potentialTemperatureK(t, p), th, 1e-3, 0, `${name} θ`);
    assertClose(equivalentPotentialTemperatureK(t, td, p), the39, 1e-3, 0, `${name} θE39`);
    assertClose(equivalentPotentialTemperatureBolton43K(t, td, p), the43, 1e-3, 0, `${name} θE43`);
    assertClose(lclTemperatureK(t, td), tl, 1e-3, 0, `${name} T_L`);
    assertClose(1000 * mixingRatioFromDewpoint(td, p), r, 1e-3, 0, `${name} r`);
  }
  // dryline discriminator: θ rises into the dry side while θ_E falls by ~25 K
  assert.ok(potentialTemperatureK(34, 898) > potentialTemperatureK(30, 900));
  assert.ok(equivalentPotentialTemperatureK(30, 18, 900) - equivalentPotentialTemperatureK(34, 2, 898) > 20);
});

test('Bolton1980 eqs. 21 and 22 agree with eq. 15 within 0.1 K (Bolton states ~0.1 K accuracy for each, from memory)', () => {
  for (const [t, td] of [[20, 18], [25, 18], [12, 5], [34, 2], [0, -10], [30, 10]] as const) {
    const tl15 = lclTemperatureK(t, td);
    assertClose(lclTemperatureFromVaporPressureK(t, saturationVaporPressureHpa(td)), tl15, 0.1, 0, `eq. 21 ${t}/${td}`);
    assertClose(lclTemperatureFromRelativeHumidityK(t, relativeHumidityFromDewpoint(t, td)), tl15, 0.1, 0, `eq. 22 ${t}/${td}`);
  }
  // saturated air: T_L = T (eq. 22 exactly with U = 100 %; eq. 15 to < 0.01 K)
  assertClose(lclTemperatureFromRelativeHumidityK(15, 1), 288.15, 1e-9);
  assertClose(lclTemperatureK(15, 15), 288.15, 1e-2);
});

test('thetaESeries matches the scalar function element-wise, propagates NaN, fills `out`', () => {
  const t = [25, 12, NaN, 34];
  const td = [18, 5, 10, 2];
  const p = [980, 985, 990, NaN];
  const out = new Float64Array(4);
  const res = thetaESeries(t, td, p, out);
  assert.is(res, out);
  assertAllClose(res.subarray(0, 2), [339.228, 302.215], 1e-3);
  assert.ok(Number.isNaN(res[2]!) && Number.isNaN(res[3]!));
  assertClose(thetaESeries(new Float64Array([20]), new Float64Array([18]), new Float64Array([850]))[0]!, 353.937994, 1e-6);
  assert.throws(() => thetaESeries([1, 2], [1], [1, 2]), RangeError);
  assert.throws(() => thetaESeries([1], [1], [1], new Float64Array(2)), RangeError);
});

test('NaN and undefined physics → NaN', () => {
  assert.ok(Number.isNaN(potentialTemperatureK(NaN, 900)));
  assert.ok(Number.isNaN(potentialTemperatureK(10, 0)));
  assert.ok(Number.isNaN(lclTemperatureK(NaN, 3)));
  assert.ok(Number.isNaN(lclTemperatureFromVaporPressureK(10, 0)));
  assert.ok(Number.isNaN(lclTemperatureFromRelativeHumidityK(10, 0)));
  assert.ok(Number.isNaN(equivalentPotentialTemperatureK(20, NaN, 900)));
  assert.ok(Number.isNaN(equivalentPotentialTemperatureBolton43K(20, 10, NaN)));
});

test.run();
