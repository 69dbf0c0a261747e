import { test } from 'uvu';
import * as assert from 'uvu/assert';
import { planeGradient } from '../../src/network/gradient.js';
import { petterssenFrontogenesis, PER_M_PER_S_TO_PER_100KM_PER_3H } from '../../src/network/frontogenesis.js';
import { projectLocalKm } from '../../src/physics/geo.js';
import { withFrontogenesis, standardPressureHpa, valueAt } from '../../src/network/frontogenesis.js';
import { trackFronts } from '../../src/network/track.js';
import { allocSeries, type PassageEvent, type StationMeta } from '../../src/model/index.js';
import { windFromComponents } from '../../src/physics/wind.js';
import { assertClose } from '../helpers/assert.js';

// Petterssen 2-D kinematic frontogenesis, worked cases computed from the published expanded form
// (Bluestein 1993 vol. II p. 242) and checked against the resolved form F = ½|∇θ|(D cos 2β − δ)
// (Bluestein 1993 pp. 248–253); 45° gradients use exactly (1/√2)·1e-5 K/m. Cases A–H: [ux, uy, vx, vy (s⁻¹)], [θx, θy (K/m)], F (K m⁻¹ s⁻¹). Tolerance 1e-18.
const cases: [string, number[], number[], number][] = [
  ['A pure deformation, isentropes along the dilatation axis', [1e-5, 0, 0, -1e-5], [0, -1e-5], 1.0e-10],
  ['B same flow, isentropes at 45°', [1e-5, 0, 0, -1e-5], [-Math.SQRT1_2 * 1e-5, -Math.SQRT1_2 * 1e-5], 0],
  ['C same flow, isentropes along the contraction axis (frontolysis)', [1e-5, 0, 0, -1e-5], [-1e-5, 0], -1.0e-10],
  ['D pure convergence', [-1e-5, 0, 0, -1e-5], [0, -1e-5], 1.0e-10],
  ['E solid rotation', [0, -1e-5, 1e-5, 0], [0, -1e-5], 0],
  ['F shear, gradient across the flow', [0, 1e-5, 0, 0], [0, -1e-5], 0],
  ['G shear, gradient at 45°', [0, 1e-5, 0, 0], [-Math.SQRT1_2 * 1e-5, Math.SQRT1_2 * 1e-5], 5.0e-11],
  ['H general', [2e-5, 1e-5, -0.5e-5, -1e-5], [-3e-5, -4e-5], -1.6e-10],
];
for (const [name, [ux, uy, vx, vy], [tx, ty], want] of cases) {
  test(`petterssenFrontogenesis() case ${name} (Petterssen 1936; Bluestein 1993)`, () => {
    const r = petterssenFrontogenesis({ thetaX: tx!, thetaY: ty!, ux: ux!, uy: uy!, vx: vx!, vy: vy! });
    assertClose(r.fKPerMPerS, want, 1e-18);
    // resolved form: ½|∇θ|(D cos 2β − δ), β the angle between isentropes and the dilatation axis
    const e = ux! - vy!, s = vx! + uy!;
    const psi = 0.5 * Math.atan2(s, e); // dilatation axis
    const iso = Math.atan2(-tx!, ty!); // isentropes are perpendicular to ∇θ
    const beta = iso - psi;
    assertClose(0.5 * Math.hypot(tx!, ty!) * (Math.hypot(e, s) * Math.cos(2 * beta) - (ux! + vy!)), want, 1e-18, 0, 'resolved form');
  });
}

test('K m⁻¹ s⁻¹ to K per 100 km per 3 h is 1.08e9 (10⁵ m × 10 800 s)', () => {
  assert.is(PER_M_PER_S_TO_PER_100KM_PER_3H, 1.08e9);
  assertClose(petterssenFrontogenesis({ thetaX: 0, thetaY: -1e-5, ux: 1e-5, uy: 0, vx: 0, vy: -1e-5 }).fKPer100kmPer3h, 0.108, 1e-12);
});

// Least-squares plane gradient (Davies-Jones 1993; Bellamy 1949 for three stations). Worked examples
// computed from the normal equations: a plane T = 20 − 0.030x − 0.050y sampled at five stations is recovered
// exactly; with errors (+0.3, −0.2, +0.1, −0.4, +0.2) the fit is b = −0.034371828, c = −0.051991035 °C/km.
const X = [0, 100, 30, 80, -40];
const Y = [0, 10, 90, 70, 50];
test('planeGradient() recovers an exact plane', () => {
  const g = planeGradient(X, Y, [20.0, 16.5, 14.6, 14.1, 18.7]);
  assertClose(g.dfdxPerKm, -0.03, 1e-9);
  assertClose(g.dfdyPerKm, -0.05, 1e-9);
});

test('planeGradient() with observation errors matches the normal-equation solution', () => {
  const g = planeGradient(X, Y, [20.3, 16.3, 14.7, 13.7, 18.9]);
  assertClose(g.dfdxPerKm, -0.034371828, 1e-9);
  assertClose(g.dfdyPerKm, -0.051991035, 1e-9);
  assertClose(Math.hypot(g.dfdxPerKm, g.dfdyPerKm) * 100, 6.2326, 1e-4);
});

test('planeGradient() on three stations equals the Bellamy triangle formula', () => {
  const g = planeGradient(X.slice(0, 3), Y.slice(0, 3), [20.3, 16.3, 14.7]);
  assertClose(g.dfdxPerKm, -0.0349425287, 1e-9);
  assertClose(g.dfdyPerKm, -0.0505747126, 1e-9);
});

// Oklahoma triangle (OKC, TUL, LAW; coordinates from the NCEI station history; temperatures invented test
// inputs), local equirectangular plane about the centroid: |∇T| = 6.656 °C/100 km toward 294.1°, tolerance 1 %.
test('planeGradient() on a lat/lon triangle through the local projection', () => {
  const st = [
    { latDeg: 35.3931, lonDeg: -97.6007 },
    { latDeg: 36.1984, lonDeg: -95.8881 },
    { latDeg: 34.5677, lonDeg: -98.4166 },
  ];
  const p = projectLocalKm(st, undefined, 'equirectangular');
  const g = planeGradient(p.xKm, p.yKm, [25, 18, 27]);
  assertClose(Math.hypot(g.dfdxPerKm, g.dfdyPerKm) * 100, 6.656, 0, 0.01);
  const toward = ((Math.atan2(g.dfdxPerKm, g.dfdyPerKm) * 180) / Math.PI + 360) % 360;
  assertClose(toward, 294.1, 1);
});

test('planeGradient() needs three non-collinear finite values', () => {
  assert.ok(Number.isNaN(planeGradient([0, 1], [0, 1], [1, 2]).dfdxPerKm));
  assert.ok(Number.isNaN(planeGradient([0, 1, 2], [0, 1, 2], [1, 2, 3]).dfdxPerKm));
  assert.is(planeGradient([0, 100, 30, 5], [0, 10, 90, 5], [20, 16.7, 14.6, NaN]).n, 3);
});

// ICAO Doc 7488 standard atmosphere: 1013.25 hPa at sea level, about 898.7 hPa at 1000 m (from memory, tol 0.1).
test('standardPressureHpa() follows the ICAO standard atmosphere', () => {
  assertClose(standardPressureHpa(0), 1013.25, 1e-9);
  assertClose(standardPressureHpa(1000), 898.75, 0.1);
});

test('valueAt() interpolates between close reports and refuses long gaps', () => {
  const t = [0, 3_600_000, 4 * 3_600_000];
  assertClose(valueAt(t, [0, 10, 40], 1_800_000), 5, 1e-12);
  assert.ok(Number.isNaN(valueAt(t, [0, 10, 40], 2.5 * 3_600_000)));
  assertClose(valueAt(t, [0, 10, 40], 3.9 * 3_600_000), 40, 0);
});

// Analytic construction (invented stations, a small network so the local planes are exact to < 1 %):
// θ = 283.15 K − 1e-5 K/m · y and the pure deformation u = αx, v = −αy (α = 1e-5 s⁻¹) at 1000 hPa is
// case A above: F = +1.0e-10 K m⁻¹ s⁻¹ = +0.108 K per 100 km per 3 h at every station.
test('withFrontogenesis() recovers Petterssen F from station reports of linear fields', () => {
  const metas: StationMeta[] = [];
  for (let i = 0; i < 3; i++) for (let j = 0; j < 2; j++) metas.push({ id: `QF${i}${j}`, aliases: [], latDeg: 44 + j * 0.4, lonDeg: -95 + i * 0.5, elevationM: 100 });
  const proj = projectLocalKm(metas);
  const t0 = Date.UTC(2026, 3, 1, 12);
  const series = metas.map((m, k) => {
    const s = allocSeries(m.id, 24, m);
    const x = proj.xKm[k]! * 1000, y = proj.yKm[k]! * 1000;
    const w = windFromComponents(1e-5 * x, -1e-5 * y);
    for (let i = 0; i < 24; i++) {
      s.timeMs[i] = t0 + (i - 6) * 3_600_000;
      s.temperatureC[i] = 10 - 1e-5 * y;
      s.stationPressureHpa[i] = 1000;
      s.windDirDeg[i] = w.dirDeg;
      s.windSpeedMs[i] = w.speedMs;
    }
    return s;
  });
  const ev = (station: string): PassageEvent => ({
    station, kind: 'cold-front', timeMs: t0, timeEarliestMs: t0, timeLatestMs: t0, confidence: 1, tempChangeC: -5, dewpointChangeC: NaN,
    thetaEChangeK: NaN, pressureMinHpa: NaN, pressureMinTimeMs: NaN, pressureRise3hHpa: NaN, windBeforeDeg: NaN, windAfterDeg: NaN,
    windTurnDeg: NaN, windSpeedAfterMs: NaN, gustMaxMs: NaN, precipNear: false, zoneStartMs: t0, zoneEndMs: t0, zoneHours: 1,
    zoneDepthKm: NaN, gradientKPer100km: NaN, observerFropaTimeMs: NaN, windShiftTimeMs: NaN, changeStartTimeMs: NaN, timeBasis: 'change-point', evidence: [],
  });
  // Passage times of a front moving east at 30 km/h, so that the stations form one track.
  const events = metas.map((m, k) => ({ ...ev(m.id), timeMs: t0 + (proj.xKm[k]! / 30) * 3_600_000 }));
  const tracks = trackFronts(events, metas);
  assert.is(tracks.length, 1);
  const [t] = withFrontogenesis(tracks, series);
  assertClose(t!.frontogenesisKPer100kmPer3h!, 0.108, 0, 0.01);
  for (const m of t!.members) assertClose(m.frontogenesisKPer100kmPer3h!, 0.108, 0, 0.02, m.station);
});

test.run();
