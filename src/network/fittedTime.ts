/**
 * What a tracked front's plane-wave fit (track.ts: t = t0 + s·x, the slowness s along the motion) says away from
 * its stations: the fitted passage time at any point, and the front's fitted position at a given time (an isochrone,
 * the line where t is constant). Pure; positions in the track's own local projection (projectLocalKm about
 * `track.origin`, azimuthal equidistant).
 */
import type { FrontTrack } from '../model/index.js';
import { projectLocalKm } from '../physics/geo.js';
import { EARTH_MEAN_RADIUS_M, MS_PER_HOUR } from '../physics/constants.js';

const DEG = Math.PI / 180;

/** Unit vector of the motion (east, north) of a track. */
function motionUnit(t: FrontTrack): { ux: number; uy: number } {
  return { ux: Math.sin(t.directionDeg * DEG), uy: Math.cos(t.directionDeg * DEG) };
}

/**
 * Fitted passage time of a front at a point, epoch ms UTC: t0 + (distance along the motion from the origin) / speed,
 * the same plane track.ts fits (its `expected` times are this at the network's other stations). NaN for a NaN
 * position or a non-positive speed.
 */
export function fittedPassageMs(t: FrontTrack, latDeg: number, lonDeg: number): number {
  if (!(t.speedKmh > 0)) return NaN;
  const p = projectLocalKm([{ latDeg, lonDeg }], t.origin);
  const { ux, uy } = motionUnit(t);
  return t.t0Ms + ((p.xKm[0]! * ux + p.yKm[0]! * uy) / t.speedKmh) * MS_PER_HOUR;
}

/**
 * Point at distance `km` along bearing `bearingDeg` from an origin on a sphere of the mean Earth radius (the
 * great-circle destination formula, Williams, "Aviation Formulary" v1.47, "Lat/lon given radial and distance";
 * the inverse of the azimuthal-equidistant projection on the sphere, within about 0.3 % of the ellipsoidal one).
 * @example destinationPoint({ latDeg: 0, lonDeg: 0 }, 90, 111.195) // ≈ { latDeg: 0, lonDeg: 1 }
 */
export function destinationPoint(o: { latDeg: number; lonDeg: number }, bearingDeg: number, km: number): { latDeg: number; lonDeg: number } {
  const d = km / (EARTH_MEAN_RADIUS_M / 1000);
  const f1 = o.latDeg * DEG;
  const b = bearingDeg * DEG;
  const f2 = Math.asin(Math.sin(f1) * Math.cos(d) + Math.cos(f1) * Math.sin(d) * Math.cos(b));
  const l2 = o.lonDeg * DEG + Math.atan2(Math.sin(b) * Math.sin(d) * Math.cos(f1), Math.cos(d) - Math.sin(f1) * Math.sin(f2));
  const lon = ((((l2 / DEG + 180) % 360) + 360) % 360) - 180;
  return { latDeg: f2 / DEG, lonDeg: lon };
}

/**
 * The front's fitted position at `timeMs`: `n` points (≥ 2) on the straight line where the fitted passage time is
 * `timeMs`, from `crossFromKm` to `crossToKm` across the motion (positive = to the right of the motion), as
 * latitude/longitude. Empty for a non-positive speed.
 */
export function isochrone(t: FrontTrack, timeMs: number, crossFromKm: number, crossToKm: number, n = 9): { latDeg: number; lonDeg: number }[] {
  if (!(t.speedKmh > 0) || n < 2) return [];
  const { ux, uy } = motionUnit(t);
  const along = ((timeMs - t.t0Ms) / MS_PER_HOUR) * t.speedKmh;
  const out: { latDeg: number; lonDeg: number }[] = [];
  for (let i = 0; i < n; i++) {
    const c = crossFromKm + ((crossToKm - crossFromKm) * i) / (n - 1);
    // right of the motion (ux, uy) is (uy, −ux)
    const x = along * ux + c * uy;
    const y = along * uy - c * ux;
    out.push(destinationPoint(t.origin, Math.atan2(x, y) / DEG, Math.hypot(x, y)));
  }
  return out;
}

/** Across-motion coordinate, km (positive to the right of the motion), of a point in the track's projection. */
export function crossTrackKm(t: FrontTrack, latDeg: number, lonDeg: number): number {
  const p = projectLocalKm([{ latDeg, lonDeg }], t.origin);
  const { ux, uy } = motionUnit(t);
  return p.xKm[0]! * uy - p.yKm[0]! * ux;
}
