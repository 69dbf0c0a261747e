/**
 * The time zone at a station's coordinates, for files whose times are local STANDARD time (ECCC `Date/Time (LST)`,
 * NCEI LCD `DATE`) and that name no zone. Only the standard time is taken from it: such times never shift for
 * daylight saving, so the zone matters only through its standard offset (time.ts: the smaller of its 1 January and
 * 1 July offsets, in either hemisphere).
 *
 * The zone comes from `@photostructure/tz-lookup` (a compact grid of the timezone-boundary-builder polygons, which
 * follow the IANA tz database's zones). Its authors say the grid trades accuracy for size near zone boundaries, so
 * the lookup is repeated at eight points NEAR_KM around the station: when one of them falls in a zone of another
 * standard time, the station is called near a boundary and the caller says so (a stations-file `tz` settles it).
 * Rules (decided here, common practice, no source):
 * - Coordinates out of range, not numbers, or exactly 0°, 0° (the usual placeholder of a missing position) give
 *   no zone.
 * - At sea the lookup gives a nautical zone (`Etc/GMT±N`), which is longitude alone: no zone. Longitude is never
 *   turned into an offset.
 */
import tzLookup from '@photostructure/tz-lookup';
import { standardOffsetMinutes } from './time.js';

/** Distance of the boundary probe points from the station (km). */
export const NEAR_KM = 25;

export interface CoordinateZone {
  /** IANA zone at the station. */
  zone: string;
  /** Its standard offset in the year asked for, minutes east of UTC. */
  standardOffsetMinutes: number;
  /** A zone of another standard time within NEAR_KM, or null. */
  near: { zone: string; standardOffsetMinutes: number } | null;
}

const KM_PER_DEG_LAT = 111.2; // mean length of a degree of latitude, rounded (common practice, no source)

function lookup(latDeg: number, lonDeg: number): string | null {
  try {
    const z = tzLookup(latDeg, lonDeg);
    return /^Etc\//.test(z) ? null : z;
  } catch {
    return null;
  }
}

/**
 * The zone at a point and its standard offset in `year`, or why there is none.
 * @example zoneAtCoordinates(43.65, -79.38, 2023) // { zone: 'America/Toronto', standardOffsetMinutes: -300, near: null }
 */
export function zoneAtCoordinates(latDeg: number, lonDeg: number, year: number): CoordinateZone | { error: string } {
  if (!(Number.isFinite(latDeg) && Number.isFinite(lonDeg) && Math.abs(latDeg) <= 90 && Math.abs(lonDeg) <= 180)) return { error: 'coordinates out of range' };
  if (latDeg === 0 && lonDeg === 0) return { error: '0°, 0° is the usual placeholder of a missing position' };
  const zone = lookup(latDeg, lonDeg);
  if (zone === null) return { error: 'no civil time zone there (open sea: only a nautical zone, which follows longitude)' };
  const off = standardOffsetMinutes(zone, year);
  let near: CoordinateZone['near'] = null;
  const dLat = NEAR_KM / KM_PER_DEG_LAT;
  const dLon = dLat / Math.max(Math.cos((latDeg * Math.PI) / 180), 0.05);
  for (let k = 0; k < 8 && near === null; k++) {
    const a = (k * Math.PI) / 4;
    const lat = Math.max(-90, Math.min(90, latDeg + dLat * Math.cos(a)));
    let lon = lonDeg + dLon * Math.sin(a);
    if (lon > 180) lon -= 360;
    if (lon < -180) lon += 360;
    const z = lookup(lat, lon);
    if (z === null || z === zone) continue;
    const o = standardOffsetMinutes(z, year);
    if (o !== off) near = { zone: z, standardOffsetMinutes: o };
  }
  return { zone, standardOffsetMinutes: off, near };
}

/**
 * `UTC−5`, `UTC+5:45`: an offset in minutes east of UTC as the notes write it.
 * @example utcOffsetLabel(-210) // 'UTC−3:30'
 */
export function utcOffsetLabel(minutes: number): string {
  const a = Math.abs(minutes);
  return `UTC${minutes < 0 ? '−' : '+'}${Math.floor(a / 60)}${a % 60 ? ':' + String(a % 60).padStart(2, '0') : ''}`;
}
