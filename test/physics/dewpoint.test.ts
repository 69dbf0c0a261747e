import { test } from 'uvu';
import * as assert from 'uvu/assert';
import fc from 'fast-check';
import { assertClose } from '../helpers/assert.js';
import {
  dewpointFromRelativeHumidity, dewpointFromVaporPressure, relativeHumidityFromDewpoint, vaporPressureFromDewpointHpa,
} from '../../src/physics/dewpoint.js';
import { MAGNUS_AERK1996, MAGNUS_BOLTON1980, MAGNUS_WMO2008 } from '../../src/physics/vapor.js';

test('relativeHumidityFromDewpoint(25, 12) matches MetPy v1.4 doc example (Bolton): 44.2484765 %', () => {
  assertClose(100 * relativeHumidityFromDewpoint(25, 12), 44.2484765, 1e-6);
});

test('dewpointFromVaporPressure(22) matches MetPy doc example (Bolton inverse): 19.0291018 °C', () => {
  assertClose(dewpointFromVaporPressure(22), 19.0291018, 1e-6);
  // Bolton1980 eq. 11, t = (243.5 ln e − 440.8)/(19.48 − ln e), the same inverse with rounded constants: 19.029205
  const l = Math.log(22);
  assertClose((243.5 * l - 440.8) / (19.48 - l), dewpointFromVaporPressure(22), 2e-4, 0, 'eq. 11');
});

test('relativeHumidityFromDewpoint with WMO-No. 8 Annex 4.B coefficients matches the R IDPmisc hr() example', () => {
  // IDPmisc Rd example hr(T = c(20,30,40), Td = c(0,20,30)) → 26.20257, 55.09561, 57.46519 % (printed to 5 decimals)
  const cases: [number, number, number][] = [[20, 0, 26.20257], [30, 20, 55.09561], [40, 30, 57.46519]];
  for (const [t, td, rh] of cases) assertClose(100 * relativeHumidityFromDewpoint(t, td, MAGNUS_WMO2008), rh, 5e-6, 0, `${t}/${td}`);
});

// Grid computed from the published Magnus inverses (python double precision), tol abs 1e-4.
const RH_GRID: [number, number, number, number, number][] = [
  // T, Td, Bolton, AERK, WMO (RH %)
  [20, 10, 52.5117, 52.5413, 52.5608],
  [25, 12, 44.2485, 44.2818, 44.3023],
  [30, 20, 55.0443, 55.0775, 55.0956],
  [0, -5, 69.043, 69.0589, 69.0747],
  [-10, -15, 66.8171, 66.8293, 66.8468],
  [35, 5, 15.4879, 15.5149, 15.5312],
];
const TD_GRID: [number, number, number, number, number][] = [
  // T, RH, Bolton, AERK, WMO (Td °C)
  [10, 0.5, 0.0537, 0.0467, 0.0409],
  [20, 0.5, 9.2701, 9.2611, 9.2552],
  [25, 0.6, 16.7054, 16.6977, 16.6931],
  [30, 0.8, 26.1749, 26.1709, 26.1688],
  [0, 0.9, -1.4433, -1.4442, -1.4451],
  [-10, 0.7, -14.4339, -14.4359, -14.4387],
  [20, 1.0, 20, 20, 20],
];

test('RH(T, Td) and Td(T, RH) grids for Bolton1980, AlduchovEskridge1996 and WMO-No. 8 coefficient sets', () => {
  const sets = [MAGNUS_BOLTON1980, MAGNUS_AERK1996, MAGNUS_WMO2008];
  for (const [t, td, ...rh] of RH_GRID) sets.forEach((k, i) => assertClose(100 * relativeHumidityFromDewpoint(t, td, k), rh[i]!, 1e-4, 0, `${k.source} RH ${t}/${td}`));
  for (const [t, u, ...td] of TD_GRID) sets.forEach((k, i) => assertClose(dewpointFromRelativeHumidity(t, u, k), td[i]!, 1e-4, 0, `${k.source} Td ${t}/${u}`));
});

test('vaporPressureFromDewpointHpa(Td) is e_s(Td) and round-trips with dewpointFromVaporPressure', () => {
  assertClose(vaporPressureFromDewpointHpa(0), 6.112, 1e-12);
  assertClose(dewpointFromVaporPressure(vaporPressureFromDewpointHpa(-7.3)), -7.3, 1e-9);
});

test('property: Td(T, RH(T, Td)) == Td and RH(T, T) == 1 (algebraic inverse)', () => {
  fc.assert(
    fc.property(fc.double({ min: -40, max: 45, noNaN: true }), fc.double({ min: 0, max: 40, noNaN: true }), (t, dep) => {
      const td = t - dep;
      const back = dewpointFromRelativeHumidity(t, relativeHumidityFromDewpoint(t, td));
      return Math.abs(back - td) < 1e-9 && Math.abs(relativeHumidityFromDewpoint(t, t) - 1) < 1e-15;
    }),
  );
});

test('property: coefficient sets differ by < 0.1 °C in Td and < 0.1 %RH for −10…35 °C', () => {
  fc.assert(
    fc.property(fc.double({ min: -10, max: 35, noNaN: true }), fc.double({ min: 0.05, max: 1, noNaN: true }), (t, u) => {
      const a = dewpointFromRelativeHumidity(t, u, MAGNUS_BOLTON1980);
      const b = dewpointFromRelativeHumidity(t, u, MAGNUS_AERK1996);
      const c = dewpointFromRelativeHumidity(t, u, MAGNUS_WMO2008);
      const td = a;
      const r1 = relativeHumidityFromDewpoint(t, td, MAGNUS_BOLTON1980);
      const r2 = relativeHumidityFromDewpoint(t, td, MAGNUS_WMO2008);
      return Math.abs(a - b) < 0.1 && Math.abs(a - c) < 0.1 && Math.abs(r1 - r2) < 0.001;
    }),
  );
});

test('undefined physics → NaN: RH ≤ 0, e ≤ 0, NaN inputs', () => {
  assert.ok(Number.isNaN(dewpointFromRelativeHumidity(20, 0)));
  assert.ok(Number.isNaN(dewpointFromRelativeHumidity(20, -0.1)));
  assert.ok(Number.isNaN(dewpointFromRelativeHumidity(20, NaN)));
  assert.ok(Number.isNaN(dewpointFromRelativeHumidity(NaN, 0.5)));
  assert.ok(Number.isNaN(dewpointFromVaporPressure(0)));
  assert.ok(Number.isNaN(dewpointFromVaporPressure(NaN)));
  assert.ok(Number.isNaN(relativeHumidityFromDewpoint(NaN, 3)));
  assert.ok(Number.isNaN(relativeHumidityFromDewpoint(3, NaN)));
});

test.run();
