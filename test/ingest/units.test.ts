import { test } from 'uvu';
import * as assert from 'uvu/assert';
import fc from 'fast-check';
import { assertClose } from '../helpers/assert.js';
import {
  converter,
  fromCanonical,
  inferUnit,
  parseUnitName,
  toCanonical,
  unitFromHeader,
  UNIT_NAMES,
  type UnitName, conversionOf } from '../../src/ingest/units.js';
import { KNOT_MS, MPH_MS } from '../../src/physics/constants.js';

// NIST SP 811 (2008 ed.) Appendix B.8: exact definitions (ft, in, mi, nmi) and the conventional inHg.
test('unit factors equal the NIST SP 811 Appendix B.8 definitions', () => {
  assert.is(toCanonical(1, 'ft'), 0.3048); // 1 ft = 0.3048 m exactly
  assert.is(toCanonical(1, 'in'), 25.4); // 1 in = 0.0254 m = 25.4 mm exactly
  assert.is(KNOT_MS, 1852 / 3600); // 1 kn = 1852 m / 3600 s
  assert.is(MPH_MS, 1609.344 / 3600); // statute mile 1609.344 m
  assertClose(MPH_MS, 0.44704, 1e-15); // so 1 mph = 0.44704 m/s exactly
  assertClose(toCanonical(1, 'km/h'), 1 / 3.6, 1e-16); // SI
  assertClose(toCanonical(1, 'inHg'), 33.8638864, 1e-8); // inch of mercury, conventional: 0.0254 m × 13595.1 kg/m³ × g0 (NIST SP 811 B.8 prints 3.386 389 E+03 Pa)
  assert.is(toCanonical(1, 'kPa'), 10);
  assert.is(toCanonical(101325, 'Pa'), 1013.25);
});

// Worked values computed from the exact definitions (°C = (°F − 32)/1.8; K − 273.15; kt = 1852/3600 m/s).
const rows: [number, UnitName, number, number, string][] = [
  [32, 'degF', 0, 1e-12, 'SI °F definition'],
  [98.6, 'degF', 37, 1e-12, 'SI °F definition'],
  [-40, 'degF', -40, 1e-12, 'SI °F definition'],
  [50, 'degF', 10, 1e-12, 'SI °F definition'],
  [0, 'degF', -17.77777777777778, 1e-12, 'SI °F definition'],
  [273.15, 'K', 0, 1e-12, 'SI kelvin'],
  [10, 'kt', 5.144444444444445, 1e-12, 'NIST SP 811 B.8 knot'],
  [34, 'kt', 17.49111111111111, 1e-12, 'NIST SP 811 B.8 knot (gale threshold)'],
  [64, 'kt', 32.92444444444444, 1e-12, 'NIST SP 811 B.8 knot'],
  [25, 'mph', 11.176, 1e-12, 'NIST SP 811 B.8 mile per hour'],
  [100, 'km/h', 27.77777777777778, 1e-12, 'SI'],
  [29.92, 'inHg', 1013.20748119, 1e-8, 'conventional inHg 0.0254 m × 13595.1 kg/m³ × g0, computed'],
  [30.0, 'inHg', 1015.91659210, 1e-8, 'conventional inHg 0.0254 m × 13595.1 kg/m³ × g0, computed'],
  [0.06, 'inHg', 2.03183318, 1e-8, 'conventional inHg 0.0254 m × 13595.1 kg/m³ × g0, computed'],
  [1200, 'ft', 365.76, 1e-12, 'NIST SP 811 B.8 foot'],
];
for (const [v, unit, expected, tol, source] of rows) {
  test(`toCanonical(${v}, '${unit}') = ${expected} (${source})`, () => {
    assertClose(toCanonical(v, unit), expected, tol);
    assertClose(converter(unit)(v), expected, tol);
    assertClose(fromCanonical(expected, unit), v, 1e-9, 0, 'inverse');
  });
}

test('fromCanonical() inverts toCanonical() for every unit (round trip)', () => {
  for (const u of UNIT_NAMES) for (const v of [-12.5, 0, 3.3, 1013.25]) assertClose(fromCanonical(toCanonical(v, u), u), v, 1e-9, 1e-12, u);
  assert.ok(Number.isNaN(toCanonical(NaN, 'degF')));
});

test('parseUnitName() accepts common spellings and rejects unknown ones', () => {
  assert.is(parseUnitName('knots'), 'kt');
  assert.is(parseUnitName('°F'), 'degF');
  assert.is(parseUnitName('mb'), 'hPa');
  assert.is(parseUnitName('in Hg'), 'inHg');
  assert.is(parseUnitName('furlongs'), null);
});

test('unitFromHeader() reads IEM names, bracketed units and suffixes', () => {
  // Iowa Environmental Mesonet ASOS download column names
  assert.is(unitFromHeader(' tmpf '), 'degF');
  assert.is(unitFromHeader(' tmpc '), 'degC');
  assert.is(unitFromHeader('sknt'), 'kt');
  assert.is(unitFromHeader('alti'), 'inHg');
  assert.is(unitFromHeader('p01i'), 'in');
  assert.is(unitFromHeader('p01m'), 'mm');
  assert.is(unitFromHeader('Temperature (degF)'), 'degF');
  assert.is(unitFromHeader('Air temp [°C]'), 'degC');
  assert.is(unitFromHeader('temp_F'), 'degF');
  assert.is(unitFromHeader('wind_kt'), 'kt');
  assert.is(unitFromHeader('wind speed (m/s)'), 'm/s');
  assert.is(unitFromHeader('windmph'), 'mph');
  assert.is(unitFromHeader('pressure_inHg'), 'inHg');
  assert.is(unitFromHeader('stn_pres_kPa'), 'kPa');
  assert.is(unitFromHeader('elevation_m'), 'm');
  assert.is(unitFromHeader('temperature'), null);
  assert.is(unitFromHeader('wind_dir'), null);
});

// Plausible-range rules: common practice, no source.
test('inferUnit() tells °F, K and °C apart from the values', () => {
  assert.is(inferUnit('temperature', [50, 55, 61, 48]).unit, 'degF');
  assert.is(inferUnit('temperature', [280, 285, 290]).unit, 'K');
  const c = inferUnit('temperature', [5, 10, 12]);
  assert.is(c.unit, 'degC');
  assert.ok(c.ambiguous);
  assert.is(inferUnit('dewpoint', [20, 30, 65]).unit, 'degF'); // max above 60 impossible in °C
});

test('inferUnit() tells inHg, kPa, hPa and Pa apart', () => {
  assert.is(inferUnit('altimeter', [29.9, 30.1, 29.7]).unit, 'inHg');
  assert.is(inferUnit('stationPressure', [24.6, 24.8]).unit, 'inHg'); // a 1600 m station
  assert.is(inferUnit('seaLevelPressure', [101.3, 100.9]).unit, 'kPa');
  assert.is(inferUnit('seaLevelPressure', [1013.2, 1009.8]).unit, 'hPa');
  assert.is(inferUnit('stationPressure', [84000, 85000]).unit, 'Pa');
});

test('inferUnit() says speed is ambiguous and defaults to m/s', () => {
  const r = inferUnit('windSpeed', [5, 10, 20]);
  assert.is(r.unit, 'm/s');
  assert.ok(r.ambiguous);
  assert.match(r.why, /cannot be told/);
});

// conversionOf is the data form of converter (NIST SP 811 factors in the module): the two must agree bit for bit.
test('conversionOf(unit) applied by op equals converter(unit) exactly, every unit', () => {
  const apply = (c: ReturnType<typeof conversionOf>, v: number) => (c.op === 0 ? v : c.op === 1 ? (v - 32) / 1.8 : c.op === 2 ? v - c.k : c.op === 3 ? v * c.k : v / c.k);
  for (const u of UNIT_NAMES) {
    const f = converter(u);
    const c = conversionOf(u);
    fc.assert(fc.property(fc.double({ noNaN: false }), (v) => Object.is(apply(c, v), f(v))), { numRuns: 300, seed: 11 });
  }
});

test.run();
