/**
 * Distances and azimuths between stations on the WGS84 ellipsoid, network centroid, local east/north projection.
 *
 * References:
 * - Karney2013: Karney, C. F. F., 2013: Algorithms for geodesics. J. Geodesy 87, 43–55,
 *   doi:10.1007/s00190-012-0578-z — implemented by the npm package `geographiclib-geodesic` (used here).
 * - Snyder1987: Snyder, J. P., 1987: Map Projections — A Working Manual. USGS Prof. Paper 1395
 *   (azimuthal equidistant projection: distance and azimuth from the centre are true).
 */
import geodesic from 'geographiclib-geodesic';
import { EARTH_MEAN_RADIUS_M } from './constants.js';

const WGS84 = geodesic.Geodesic.WGS84;
const DEG = Math.PI / 180;

/** Result of {@link geodesicInverse}. */
export interface GeodesicInverse {
  /** Ellipsoidal distance, m. */
  distanceM: number;
  /** Azimuth of the geodesic at point 1 (initial bearing), degrees clockwise from north, [0, 360). */
  azimuth1Deg: number;
  /** Forward azimuth of the geodesic at point 2, degrees [0, 360). */
  azimuth2Deg: number;
}

function to360(a: number): number {
  const r = a % 360;
  return r < 0 ? r + 360 : r;
}

/**
 * Inverse geodesic problem on WGS84 (Karney2013 via geographiclib-geodesic): distance and azimuths between two
 * points. Accurate to about 15 nm. Coincident points: distance 0, azimuths as returned by the library.
 * Units: degrees → m, degrees. Any NaN → NaN fields.
 * @example geodesicInverse(-41.32, 174.81, 40.96, -5.5).distanceM // 19959679.267 (Wellington → Salamanca)
 */
export function geodesicInverse(lat1Deg: number, lon1Deg: number, lat2Deg: number, lon2Deg: number): GeodesicInverse {
  if (Number.isNaN(lat1Deg + lon1Deg + lat2Deg + lon2Deg)) return { distanceM: NaN, azimuth1Deg: NaN, azimuth2Deg: NaN };
  if (Math.abs(lat1Deg) > 90 || Math.abs(lat2Deg) > 90) throw new RangeError('geodesicInverse requires latitudes within ±90°');
  const r = WGS84.Inverse(lat1Deg, lon1Deg, lat2Deg, lon2Deg);
  return { distanceM: r.s12 ?? NaN, azimuth1Deg: to360(r.azi1 ?? NaN), azimuth2Deg: to360(r.azi2 ?? NaN) };
}

/**
 * Ellipsoidal distance between two stations, km ({@link geodesicInverse}). NaN in → NaN.
 * @example stationDistanceKm(35.3931, -97.6007, 36.1984, -95.8881) // ≈ 178.742
 */
export function stationDistanceKm(lat1Deg: number, lon1Deg: number, lat2Deg: number, lon2Deg: number): number {
  return geodesicInverse(lat1Deg, lon1Deg, lat2Deg, lon2Deg).distanceM / 1000;
}

/**
 * Great-circle (haversine) distance on a sphere of radius R (default IUGG mean radius 6371008.8 m), m.
 * Differs from the ellipsoidal distance by up to about 0.3 % (≈0.5 % worst case); for comparison and
 * cheap screening only. NaN in → NaN.
 * @example haversineDistanceM(0, 0, 0, 1) // ≈ 111195.08
 */
export function haversineDistanceM(lat1Deg: number, lon1Deg: number, lat2Deg: number, lon2Deg: number, radiusM: number = EARTH_MEAN_RADIUS_M): number {
  const p1 = lat1Deg * DEG;
  const p2 = lat2Deg * DEG;
  const dp = p2 - p1;
  const dl = (lon2Deg - lon1Deg) * DEG;
  const h = Math.sin(dp / 2) ** 2 + Math.cos(p1) * Math.cos(p2) * Math.sin(dl / 2) ** 2;
  return 2 * radiusM * Math.asin(Math.min(1, Math.sqrt(h)));
}

/** A position in degrees. */
export interface LatLon {
  latDeg: number;
  lonDeg: number;
}

/**
 * Centroid of a station network: arithmetic mean latitude and mean longitude, the longitudes first unwrapped to
 * within ±180° of the first station's (so networks straddling the antimeridian work). Meant for regional networks
 * (a few hundred km); stations with NaN coordinates are ignored. Throws RangeError when no station is usable.
 * @example networkCentroid([{ latDeg: 0, lonDeg: 179 }, { latDeg: 0, lonDeg: -179 }]) // { latDeg: 0, lonDeg: 180 }
 */
export function networkCentroid(stations: readonly LatLon[]): LatLon {
  let slat = 0;
  let slon = 0;
  let n = 0;
  let ref = NaN;
  for (const s of stations) {
    if (Number.isNaN(s.latDeg) || Number.isNaN(s.lonDeg)) continue;
    if (Number.isNaN(ref)) ref = s.lonDeg;
    let d = (s.lonDeg - ref) % 360;
    if (d > 180) d -= 360;
    else if (d < -180) d += 360;
    slat += s.latDeg;
    slon += ref + d;
    n++;
  }
  if (n === 0) throw new RangeError('networkCentroid requires at least one station with coordinates');
  let lon = slon / n;
  lon = ((((lon + 180) % 360) + 360) % 360) - 180;
  if (lon === -180 && slon / n > 0) lon = 180;
  return { latDeg: slat / n, lonDeg: lon };
}

/** Projection method for {@link projectLocalKm}. */
export type LocalProjection = 'azimuthal-equidistant' | 'equirectangular';

/** Result of {@link projectLocalKm}. */
export interface LocalProjectionResult {
  /** East coordinate, km. */
  xKm: Float64Array;
  /** North coordinate, km. */
  yKm: Float64Array;
  origin: LatLon;
}

/**
 * Local east/north coordinates in km about an origin (default: {@link networkCentroid}).
 * - 'azimuthal-equidistant' (default): x = s sin α, y = s cos α with s, α the WGS84 geodesic distance and azimuth
 *   from the origin (Snyder1987 azimuthal equidistant, ellipsoidal via Karney2013). Distances and azimuths from
 *   the origin are exact; distances between other pairs are distorted by roughly (s/R)²/6 — under 0.1 % within
 *   ~500 km of the origin (order-of-magnitude estimate for the spherical case).
 * - 'equirectangular': x = R cos φ0 (λ − λ0), y = R (φ − φ0), R = 6371.0088 km (common practice, no source);
 *   cheaper; the east scale is wrong by about tan φ0 · Δφ away from the origin latitude (≈1 % at 0.8° off at 35° N)
 *   plus up to ~0.3 % from ignoring the flattening.
 * NaN coordinates give NaN outputs. Inputs are not mutated.
 * @example projectLocalKm([{ latDeg: 0, lonDeg: 1 }], { latDeg: 0, lonDeg: 0 }).xKm[0] // ≈ 111.319
 */
export function projectLocalKm(stations: readonly LatLon[], origin?: LatLon, method: LocalProjection = 'azimuthal-equidistant'): LocalProjectionResult {
  const o = origin ?? networkCentroid(stations);
  const n = stations.length;
  const xKm = new Float64Array(n);
  const yKm = new Float64Array(n);
  const rKm = EARTH_MEAN_RADIUS_M / 1000;
  const c0 = Math.cos(o.latDeg * DEG);
  for (let i = 0; i < n; i++) {
    const s = stations[i]!;
    if (method === 'equirectangular') {
      let dl = (s.lonDeg - o.lonDeg) % 360;
      if (dl > 180) dl -= 360;
      else if (dl < -180) dl += 360;
      xKm[i] = rKm * c0 * dl * DEG;
      yKm[i] = rKm * (s.latDeg - o.latDeg) * DEG;
    } else {
      const g = geodesicInverse(o.latDeg, o.lonDeg, s.latDeg, s.lonDeg);
      const a = g.azimuth1Deg * DEG;
      xKm[i] = (g.distanceM / 1000) * Math.sin(a);
      yKm[i] = (g.distanceM / 1000) * Math.cos(a);
    }
  }
  return { xKm, yKm, origin: o };
}
