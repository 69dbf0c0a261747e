import { test } from 'uvu';
import * as assert from 'uvu/assert';
import { assertClose } from '../helpers/assert.js';
import * as C from '../../src/physics/constants.js';

test('RD, RV, EPSILON, KAPPA derive from CODATA2018 R and MetPy molar masses', () => {
  // MetPy constants: R_d = 287.04749 J/kg/K, ε = 0.6219569100577033 (MetPy molecular_weight_ratio default)
  assertClose(C.RD, 287.04749, 1e-5, 0, 'RD');
  assertClose(C.RV, 461.52311, 1e-5, 0, 'RV');
  assertClose(C.EPSILON, 0.6219569100577033, 1e-15, 0, 'EPSILON');
  // κ = R_d/c_p with c_p = 3.5 R_d → exactly 2/7 (MetPy convention)
  assertClose(C.KAPPA, 2 / 7, 1e-15, 0, 'KAPPA');
  assertClose(C.CP_D, 1004.6662, 1e-4, 0, 'CP_D');
});

test('HPA_PER_INHG matches NIST SP 811 App. B.8 (3.386 389 E+03 Pa) to its printed digits', () => {
  assertClose(C.HPA_PER_INHG * 100, 3386.389, 5e-4, 0, 'Pa per inHg');
});

test('EARTH_MEAN_RADIUS_M is the IUGG R1 = (2a + b)/3 for WGS84 (6371008.771 m)', () => {
  assertClose(C.EARTH_MEAN_RADIUS_M, 6371008.771, 1e-3);
});

test('KNOT_MS is 1852/3600 m/s exactly (international nautical mile 1852 m)', () => {
  assert.is(C.KNOT_MS, 1852 / 3600);
  assertClose(10 * C.KNOT_MS, 5.144444444, 1e-9); // 10 kt = 5.144444 m/s
});

test.run();
