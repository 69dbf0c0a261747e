/** Unit factors (src/physics/constants.ts, used by the METAR and CSV readers) against their exact definitions. */
import { test } from 'uvu';
import { assertClose } from '../helpers/assert.js';
import {
  FOOT_M,
  INCH_MM,
  HPA_PER_INHG as INHG_HPA,
  KMH_MS,
  KNOT_MS,
  MERCURY_DENSITY_KG_M3 as MERCURY_DENSITY_CONVENTIONAL,
  NAUTICAL_MILE_M,
  G0 as STANDARD_GRAVITY,
  STATUTE_MILE_M,
} from '../../src/physics/constants.js';

test('NAUTICAL_MILE_M and KNOT_MS are the international nautical mile and knot', () => {
  // NIST SP 811 (2008) App. B.8: nautical mile 1852 m exactly
  assertClose(NAUTICAL_MILE_M, 1852, 0);
  // NIST SP 811 (2008) App. B.8: knot 5.144 444 E-01 m/s (= 1852/3600 exactly)
  assertClose(KNOT_MS, 0.5144444444444445, 1e-16);
  // check-values 5 (computed): 10 kt = 5.144444 m/s, 34 kt = 17.491111 m/s, 64 kt = 32.924444 m/s
  assertClose(10 * KNOT_MS, 5.144444, 5e-7);
  assertClose(34 * KNOT_MS, 17.491111, 5e-7);
  assertClose(64 * KNOT_MS, 32.924444, 5e-7);
  // check-values 5 (computed): 1 kt = 1.852 km/h exactly
  assertClose(KNOT_MS / KMH_MS, 1.852, 1e-12);
});

test('KMH_MS is 1/3.6 m/s', () => {
  // SI: 1 km/h = 1000 m / 3600 s
  assertClose(KMH_MS, 1000 / 3600, 1e-16);
  // check-values 5 (computed): 100 km/h = 53.995680 kt
  assertClose((100 * KMH_MS) / KNOT_MS, 53.99568, 5e-6);
});

test('FOOT_M, STATUTE_MILE_M and INCH_MM are the 1959 international units', () => {
  // 1959 international yard and pound agreement: 1 ft = 0.3048 m, 1 in = 25.4 mm exactly
  assertClose(FOOT_M, 0.3048, 0);
  assertClose(INCH_MM, 25.4, 0);
  // NIST SP 811 (2008) App. B.8: statute mile 1609.344 m exactly
  assertClose(STATUTE_MILE_M, 1609.344, 1e-9);
  // check-values 5 (computed): 1 mph = 0.44704 m/s exactly
  assertClose(STATUTE_MILE_M / 3600, 0.44704, 1e-15);
});

test('INHG_HPA is derived from the conventional mercury density and standard gravity', () => {
  // CGPM 1901 (via NIST SP 811 App. B.8): g_n = 9.80665 m/s² exactly
  assertClose(STANDARD_GRAVITY, 9.80665, 0);
  // NIST SP 811 (2008) App. B.8 note on conventional mercury units: 13 595.1 kg/m³
  assertClose(MERCURY_DENSITY_CONVENTIONAL, 13595.1, 0);
  // constructed: 0.0254 m × 13595.1 kg/m³ × 9.80665 m/s² / 100 Pa per hPa = 33.8638864 hPa
  assertClose(INHG_HPA, 33.8638864, 5e-8);
  // check-values 5 (computed): 0.06 inHg = 2.031833 hPa, 0.02 inHg = 0.677278 hPa (FMH-1 PRESRR/PRESFR thresholds)
  assertClose(0.06 * INHG_HPA, 2.031833, 5e-7);
  assertClose(0.02 * INHG_HPA, 0.677278, 5e-7);
});

test.run();
