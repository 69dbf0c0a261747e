import { test } from 'uvu';
import geodesic from 'geographiclib-geodesic';
import * as assert from 'uvu/assert';
import { assertClose } from '../helpers/assert.js';
import { geodesicInverse, haversineDistanceM, networkCentroid, projectLocalKm, stationDistanceKm } from '../../src/physics/geo.js';
import { WGS84_A_M } from '../../src/physics/constants.js';

test('geodesicInverse: geographiclib-geodesic README example Wellington → Salamanca "The distance is 19959679.267 m."', () => {
  assert.is(geodesicInverse(-41.32, 174.81, 40.96, -5.5).distanceM.toFixed(3), '19959679.267');
});

test('geodesicInverse: GeographicLib test suite GeodSolve0 (JFK → CDG): azi1 53.47022, azi2 111.59367, s12 5853226 m', () => {
  // node_modules/geographiclib-geodesic/test/geodesictest.js, tolerances as there (0.5e-5°, 0.5 m)
  const r = geodesicInverse(40.6, -73.8, 49.01666667, 2.55);
  assertClose(r.azimuth1Deg, 53.47022, 0.5e-5);
  assertClose(r.azimuth2Deg, 111.59367, 0.5e-5);
  assertClose(r.distanceM, 5853226, 0.5);
});

test('geodesicInverse: GeodTest.dat row 1 as in the GeographicLib test suite (tol 1e-8 m, 1e-13° as there)', () => {
  const r = geodesicInverse(35.60777, -139.44815, -11.17491, -69.95921);
  assertClose(r.azimuth1Deg, 111.098748429560326, 1e-12);
  assertClose(r.azimuth2Deg, 129.289270889708762, 1e-12);
  assertClose(r.distanceM, 8935244.5604818305, 1e-8);
});

test('geodesicInverse: equator 1° = a·π/180 = 111319.4908 m (analytic); meridian 44.5→45.5° N = 111131.777653 m (geographiclib-geodesic 2.2.0)', () => {
  const eq = geodesicInverse(0, 0, 0, 1);
  assertClose(eq.distanceM, (WGS84_A_M * Math.PI) / 180, 1e-6);
  assertClose(eq.azimuth1Deg, 90, 1e-12);
  const mer = geodesicInverse(44.5, 0, 45.5, 0);
  assertClose(mer.distanceM, 111131.777653, 1e-6);
  assertClose(mer.azimuth1Deg, 0, 1e-12);
});

// geographiclib-geodesic 2.2.0 outputs for station pairs (regression oracle, tol 1e-6 m / 1e-9°)
const PAIRS: [string, number, number, number, number, number, number, number][] = [
  ['OKC→TUL', 35.3931, -97.6007, 36.1984, -95.8881, 178742.300382, 59.50900399, 60.510773562],
  ['ORD→MDW', 41.9786, -87.9048, 41.786, -87.7524, 24852.438241, 149.352393426, 149.454136238],
  ['DFW→IAH', 32.8968, -97.038, 29.9844, -95.3414, 360937.954777, 153.013275425, 153.898580434],
];

test('geodesicInverse/stationDistanceKm on station pairs; haversine within 0.3 % (Karney2013 vs sphere)', () => {
  for (const [name, a, b, c, d, s, z1, z2] of PAIRS) {
    const r = geodesicInverse(a, b, c, d);
    assertClose(r.distanceM, s, 1e-6, 0, `${name} s12`);
    assertClose(r.azimuth1Deg, z1, 1e-8, 0, `${name} azi1`);
    assertClose(r.azimuth2Deg, z2, 1e-8, 0, `${name} azi2`);
    assertClose(stationDistanceKm(a, b, c, d), s / 1000, 1e-9, 0, `${name} km`);
    assertClose(haversineDistanceM(a, b, c, d), s, 0, 0.003, `${name} haversine`);
  }
  assertClose(haversineDistanceM(0, 0, 0, 1), 111195.08, 0.01, 0, 'haversine 1° on R = 6371008.8 m');
});

test('azimuths are in [0, 360): westward path', () => {
  const r = geodesicInverse(36.1984, -95.8881, 35.3931, -97.6007);
  assert.ok(r.azimuth1Deg > 180 && r.azimuth1Deg < 360);
});

const OK = [
  { latDeg: 35.3931, lonDeg: -97.6007 }, // OKC (test input)
  { latDeg: 36.1984, lonDeg: -95.8881 }, // TUL
  { latDeg: 34.5677, lonDeg: -98.4166 }, // LAW
];

test('networkCentroid and equirectangular projectLocalKm reproduce the computed Oklahoma triangle (R = 6371.0088 km; tol 1e-3 km)', () => {
  const c = networkCentroid(OK);
  assertClose(c.latDeg, 35.3864, 1e-4); assertClose(c.lonDeg, -97.3018, 1e-4);
  const p = projectLocalKm(OK, undefined, 'equirectangular');
  const want = [[-27.096, 0.745], [128.157, 90.29], [-101.061, -91.035]];
  want.forEach(([x, y], i) => { assertClose(p.xKm[i]!, x!, 1e-3, 0, `x${i}`); assertClose(p.yKm[i]!, y!, 1e-3, 0, `y${i}`); });
});

test('azimuthal-equidistant projectLocalKm: distance and azimuth from the origin are exact; pair distances within 0.1 %', () => {
  const p = projectLocalKm(OK);
  for (let i = 0; i < OK.length; i++) {
    const g = geodesicInverse(p.origin.latDeg, p.origin.lonDeg, OK[i]!.latDeg, OK[i]!.lonDeg);
    assertClose(Math.hypot(p.xKm[i]!, p.yKm[i]!), g.distanceM / 1000, 1e-9, 0, `radius ${i}`);
  }
  for (let i = 0; i < OK.length; i++) for (let j = i + 1; j < OK.length; j++) {
    const plane = Math.hypot(p.xKm[i]! - p.xKm[j]!, p.yKm[i]! - p.yKm[j]!);
    assertClose(plane, stationDistanceKm(OK[i]!.latDeg, OK[i]!.lonDeg, OK[j]!.latDeg, OK[j]!.lonDeg), 0, 0.001, `pair ${i}-${j}`);
  }
  // the projected triangle area matches the ellipsoidal geodesic triangle area (GeographicLib PolygonArea oracle)
  const area = (q: { xKm: Float64Array; yKm: Float64Array }) =>
    Math.abs((q.xKm[1]! - q.xKm[0]!) * (q.yKm[2]! - q.yKm[0]!) - (q.xKm[2]! - q.xKm[0]!) * (q.yKm[1]! - q.yKm[0]!)) / 2;
  const pa = new geodesic.PolygonArea.PolygonArea(geodesic.Geodesic.WGS84, false);
  for (const s of OK) pa.AddPoint(s.latDeg, s.lonDeg);
  const trueAreaKm2 = Math.abs(pa.Compute(false, true).area ?? NaN) / 1e6; // 3633.857 km²
  assertClose(area(p), trueAreaKm2, 0, 5e-4, 'AEQD area');
  // this triangle is thin (OKC lies near the TUL–LAW line), so the equirectangular east-scale error (~1 %) inflates
  // its area by ~5 % and any triangle gradient by as much: document the sensitivity
  const eq = projectLocalKm(OK, undefined, 'equirectangular');
  assert.ok(area(eq) / trueAreaKm2 - 1 > 0.04, 'equirectangular area is ~5 % too large here');
  // Bellamy1949 triangle gradient of T = (25, 18, 27 °C): equirectangular reproduces the computed 6.656 °C/100 km;
  // the azimuthal-equidistant coordinates give ≈ 6.962 °C/100 km
  const grad = (q: { xKm: Float64Array; yKm: Float64Array }) => {
    const [x1, x2, x3] = q.xKm; const [y1, y2, y3] = q.yKm; const f = [25, 18, 27];
    const D = (x2! - x1!) * (y3! - y1!) - (x3! - x1!) * (y2! - y1!);
    const gx = ((f[1]! - f[0]!) * (y3! - y1!) - (f[2]! - f[0]!) * (y2! - y1!)) / D;
    const gy = ((x2! - x1!) * (f[2]! - f[0]!) - (x3! - x1!) * (f[1]! - f[0]!)) / D;
    return 100 * Math.hypot(gx, gy);
  };
  assertClose(grad(eq), 6.656, 1e-3, 0, '|∇T| equirectangular');
  assertClose(grad(p), 6.962, 1e-3, 0, '|∇T| azimuthal equidistant');
});

test('networkCentroid across the antimeridian; NaN stations ignored; none → RangeError', () => {
  assert.equal(networkCentroid([{ latDeg: 0, lonDeg: 179 }, { latDeg: 2, lonDeg: -179 }]), { latDeg: 1, lonDeg: 180 });
  assert.equal(networkCentroid([{ latDeg: 10, lonDeg: 20 }, { latDeg: NaN, lonDeg: 5 }]), { latDeg: 10, lonDeg: 20 });
  assert.throws(() => networkCentroid([]), RangeError);
  const p = projectLocalKm([{ latDeg: 0, lonDeg: -179.5 }], { latDeg: 0, lonDeg: 179.5 }, 'equirectangular');
  assertClose(p.xKm[0]!, 111.195, 1e-3, 0, 'wraps across ±180');
});

test('NaN in → NaN out; latitude beyond ±90 → RangeError', () => {
  assert.ok(Number.isNaN(geodesicInverse(NaN, 0, 1, 1).distanceM));
  assert.ok(Number.isNaN(stationDistanceKm(0, 0, 1, NaN)));
  const p = projectLocalKm([{ latDeg: NaN, lonDeg: 0 }], { latDeg: 0, lonDeg: 0 });
  assert.ok(Number.isNaN(p.xKm[0]!) && Number.isNaN(p.yKm[0]!));
  assert.throws(() => geodesicInverse(91, 0, 0, 0), RangeError);
});

test.run();
