import { test } from 'uvu';
import * as assert from 'uvu/assert';
import * as SunCalc from 'suncalc';
import { assertClose } from '../helpers/assert.js';
import { isDaylight, julianDate, refractionCorrectionDeg, solarHour, solarPosition, solarTimeMs, sunEquatorial, sunTimes } from '../../src/physics/sun.js';

const S = 1000;
const hms = (y: number, mo: number, d: number, h: number, mi: number, s: number) => Date.UTC(y, mo - 1, d, h, mi, s);

test('julianDate: J2000.0 = 2451545.0 at 2000-01-01T12:00Z (Meeus1998 ch. 7)', () => {
  assert.is(julianDate(Date.UTC(2000, 0, 1, 12)), 2451545);
});

test('sunEquatorial reproduces Meeus1998 Example 25.a (1992 Oct 13.0 TD): α = 13h13m31.4s, δ = −7°47′06″', () => {
  const s = sunEquatorial(Date.UTC(1992, 9, 13)); // JDE 2448908.5 (UT used for TD; the example is in TD)
  assertClose(s.julianCentury, -0.072183436, 1e-9, 0, 'T');
  assertClose(s.trueLongitudeDeg, 199 + 54 / 60 + 36 / 3600, 1 / 3600, 0, 'true longitude 199°54′36″');
  assertClose(s.rightAscensionDeg, (13 + 13 / 60 + 31.4 / 3600) * 15, (0.1 / 3600) * 15, 0, 'α ± 0.1 s');
  assertClose(s.declinationDeg, -(7 + 47 / 60 + 6 / 3600), 0.5 / 3600, 0, 'δ ± 0.5″');
});

// Computed cases from the NOAA/Meeus equations (independent python implementation), which suncalc 2.0.2 matches
// to ±2 s and ±0.002°: tolerance ±5 s and ±0.005° (elevation refracted).
const CASES = [
  { name: 'Norman OK 2021-06-21', lat: 35.2226, lon: -97.4395, day: hms(2021, 6, 21, 12, 0, 0),
    rise: hms(2021, 6, 21, 11, 15, 38), noon: hms(2021, 6, 21, 18, 31, 40), set: hms(2021, 6, 22, 1, 47, 42),
    at: hms(2021, 6, 21, 18, 0, 0), elev: 76.3576, geom: 76.3536 },
  { name: 'Chicago 2020-12-21', lat: 41.9786, lon: -87.9048, day: hms(2020, 12, 21, 12, 0, 0),
    rise: hms(2020, 12, 21, 13, 16, 30), noon: hms(2020, 12, 21, 17, 50, 3), set: hms(2020, 12, 21, 22, 23, 36),
    at: hms(2020, 12, 21, 18, 0, 0), elev: 24.5795, geom: 24.5444 },
  { name: '0N 0E 2021-03-20', lat: 0, lon: 0, day: hms(2021, 3, 20, 12, 0, 0),
    rise: hms(2021, 3, 20, 6, 4, 6), noon: hms(2021, 3, 20, 12, 7, 22), set: hms(2021, 3, 20, 18, 10, 37),
    at: hms(2021, 3, 20, 12, 0, 0), elev: 88.156, geom: NaN },
];

test('sunTimes and solarPosition match the NOAA/Meeus computed cases (±5 s, ±0.005°)', () => {
  for (const c of CASES) {
    const t = sunTimes(c.day, c.lat, c.lon);
    assert.is(t.kind, 'normal');
    assertClose(t.sunriseMs, c.rise, 5 * S, 0, `${c.name} sunrise`);
    assertClose(t.solarNoonMs, c.noon, 5 * S, 0, `${c.name} noon`);
    assertClose(t.sunsetMs, c.set, 5 * S, 0, `${c.name} sunset`);
    const p = solarPosition(c.at, c.lat, c.lon);
    assertClose(p.elevationDeg, c.elev, 0.005, 0, `${c.name} elevation`);
    if (!Number.isNaN(c.geom)) assertClose(p.geometricElevationDeg, c.geom, 0.005, 0, `${c.name} geometric`);
  }
  // geometric sanity: at solar noon elevation ≈ 90° − |φ − δ| (Norman: 78.2°)
  const n = solarPosition(CASES[0]!.noon, 35.2226, -97.4395);
  assertClose(n.geometricElevationDeg, 90 - Math.abs(35.2226 - n.declinationDeg), 0.01, 0, 'noon elevation');
  assertClose(n.elevationDeg, 78.217, 0.005, 0, 'Norman noon 78.217°');
});

test('sunTimes agrees with the suncalc 2.0.2 README table for Kyiv, 24 Aug 2026 (EEST = UTC+3; README truncates to minutes)', () => {
  // README: sunrise 05:59, solarNoon 13:00, sunset 19:59 local → 02:59, 10:00, 16:59 UTC (minutes truncated)
  const t = sunTimes(hms(2026, 8, 24, 10, 0, 0), 50.45, 30.52);
  const minuteOf = (ms: number) => Math.floor(ms / 60000) * 60000;
  assert.is(minuteOf(t.sunriseMs), hms(2026, 8, 24, 2, 59, 0));
  assert.is(minuteOf(t.solarNoonMs), hms(2026, 8, 24, 10, 0, 0));
  assert.is(minuteOf(t.sunsetMs), hms(2026, 8, 24, 16, 59, 0));
  // suncalc 2.0.2 seconds (library output): 02:59:48.8 / 10:00:19.8 / 16:59:48.2 — within ±5 s
  assertClose(t.sunriseMs, hms(2026, 8, 24, 2, 59, 48) + 800, 5 * S);
  assertClose(t.sunsetMs, hms(2026, 8, 24, 16, 59, 48) + 200, 5 * S);
});

test('cross-check with the installed suncalc 2.x (refraction-corrected altitude, azimuth clockwise from north)', () => {
  // suncalc 2.x follows the same NOAA/Meeus-style equations; tolerances measured over a year at 6 latitudes:
  // noon, sunrise and sunset 15 s, apparent elevation 0.02°, azimuth 0.05° (Sun between 5° and 60° elevation).
  for (const lat of [-35, 0, 20, 35.2, 50, 60]) {
    for (const lon of [-97.4, 0, 30.5, 120]) {
      for (let d = 0; d < 365; d += 37) {
        const day = Date.UTC(2021, 0, 1, 12) + d * 86400000 - (lon / 15) * 3600000;
        const ours = sunTimes(day, lat, lon);
        const ref = SunCalc.getTimes(new Date(day), lat, lon);
        const where = `${lat},${lon} day ${d}`;
        assertClose(ours.solarNoonMs, ref.solarNoon.getTime(), 15 * S, 0, `noon ${where}`);
        assertClose(ours.sunriseMs, ref.sunrise!.getTime(), 15 * S, 0, `sunrise ${where}`);
        assertClose(ours.sunsetMs, ref.sunset!.getTime(), 15 * S, 0, `sunset ${where}`);
        for (let h = -6; h <= 6; h += 2) {
          const tm = ours.solarNoonMs + h * 3600000;
          const p = solarPosition(tm, lat, lon);
          const q = SunCalc.getPosition(new Date(tm), lat, lon);
          if (p.elevationDeg > 1) assertClose(p.elevationDeg, q.altitude, 0.02, 0, `elevation ${where} h${h}`);
          if (p.elevationDeg > 5 && p.elevationDeg < 60) {
            const da = Math.abs(p.azimuthDeg - q.azimuth);
            assert.ok(Math.min(da, 360 - da) < 0.05, `azimuth ${where} h${h}: ${p.azimuthDeg} vs ${q.azimuth}`);
          }
        }
      }
    }
  }
});

test('azimuth convention: clockwise from north; morning Sun in the east, afternoon in the west (NH)', () => {
  const am = solarPosition(hms(2021, 6, 21, 14, 0, 0), 35.2226, -97.4395);
  const pm = solarPosition(hms(2021, 6, 21, 23, 0, 0), 35.2226, -97.4395);
  assert.ok(am.azimuthDeg > 45 && am.azimuthDeg < 135, `am ${am.azimuthDeg}`);
  assert.ok(pm.azimuthDeg > 225 && pm.azimuthDeg < 315, `pm ${pm.azimuthDeg}`);
  assert.ok(am.hourAngleDeg < 0 && pm.hourAngleDeg > 0);
});

test('refractionCorrectionDeg: ~0.48° at the horizon (NOAA formula; standard 34′ ≈ 0.57° is the rise/set convention), 0 above 85°', () => {
  assertClose(refractionCorrectionDeg(0), 1735 / 3600, 1e-12);
  assert.is(refractionCorrectionDeg(86), 0);
  assert.ok(refractionCorrectionDeg(10) > refractionCorrectionDeg(30));
});

test('polar day and night: 80° N at the June and December solstices', () => {
  const june = sunTimes(Date.UTC(2021, 5, 21), 80, 0);
  assert.is(june.kind, 'polar-day');
  assert.ok(Number.isNaN(june.sunriseMs) && Number.isNaN(june.sunsetMs) && Number.isFinite(june.solarNoonMs));
  assert.is(sunTimes(Date.UTC(2021, 11, 21), 80, 0).kind, 'polar-night');
  assert.ok(isDaylight(Date.UTC(2021, 5, 21, 0), 80, 0), 'midnight sun');
});

test('isDaylight switches at sunrise and sunset; solarHour(t, lon, true) is 12 at solar noon', () => {
  const c = CASES[1]!;
  const t = sunTimes(c.day, c.lat, c.lon);
  assert.not.ok(isDaylight(t.sunriseMs - 60 * S, c.lat, c.lon));
  assert.ok(isDaylight(t.sunriseMs + 60 * S, c.lat, c.lon));
  assert.ok(isDaylight(t.sunsetMs - 60 * S, c.lat, c.lon));
  assert.not.ok(isDaylight(t.sunsetMs + 60 * S, c.lat, c.lon));
  assertClose(solarHour(t.solarNoonMs, c.lon, true), 12, 1 / 3600);
  assertClose(solarHour(CASES[2]!.noon, 0, true), 12, 5 / 3600);
  // 15° of longitude = 1 hour
  assertClose(solarHour(Date.UTC(2021, 2, 20, 6), 90, true) - solarHour(Date.UTC(2021, 2, 20, 6), 75, true), 1, 1e-9);
});

test('solarHour() = UTC hour + lon/15, wrapped to [0, 24) (mean solar time; textbook definition)', () => {
  assertClose(solarHour(Date.UTC(2024, 0, 1, 12), -90), 6, 1e-9);
  assertClose(solarHour(Date.UTC(2024, 0, 1, 2), -90), 20, 1e-9);
  assertClose(solarHour(Date.UTC(2024, 0, 1, 22, 30), 30), 0.5, 1e-9);
  assert.is(solarTimeMs(Date.UTC(2024, 0, 1, 12), -90), Date.UTC(2024, 0, 1, 6));
});

test('solarHour(t, lon, true) − solarHour(t, lon) is the equation of time: about +16.4 min early November, −14.2 min mid February (astronomical almanac values, from memory)', () => {
  const eot = (t: number) => (solarHour(t, 0, true) - solarHour(t, 0)) * 60;
  assertClose(eot(Date.UTC(2024, 10, 3, 12)), 16.4, 0.3);
  assertClose(eot(Date.UTC(2024, 1, 11, 12)), -14.2, 0.3);
});

test('NaN in → NaN out (false for isDaylight)', () => {
  assert.ok(Number.isNaN(solarPosition(NaN, 10, 10).elevationDeg));
  assert.ok(Number.isNaN(solarPosition(0, NaN, 10).elevationDeg));
  assert.ok(Number.isNaN(sunTimes(NaN, 10, 10).sunriseMs));
  assert.ok(Number.isNaN(solarHour(NaN, 0, true)));
  assert.ok(Number.isNaN(solarHour(0, NaN)));
  assert.not.ok(isDaylight(NaN, 10, 10));
});

test.run();
