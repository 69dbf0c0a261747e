/**
 * GeoJSON (RFC 7946) of a run: stations as Points with their passages, each passage as a Point, each tracked front's
 * fitted position at each whole hour of its passages as a LineString (isochrones) carrying its motion, trend and
 * frontogenesis, and estimated arrivals at points of interest as Points. Pure: text out.
 *
 * RFC 7946 rules kept: one FeatureCollection; positions [longitude, latitude] in WGS 84 decimal degrees (§3.1.1,
 * §4); numbers as JSON numbers, never strings; longitudes in [-180, 180], and a line that would cross the
 * antimeridian is split into a MultiLineString (§3.1.9); no polygons are written (so the right-hand rule of §3.1.6
 * has nothing to apply to); coordinates rounded to 5 decimals (about 1 m; §11.2 on precision).
 */
import type { FrontTrack, PassageEvent, StationMeta } from '../model/index.js';
import { crossTrackKm, isochrone } from '../network/fittedTime.js';
import { arrivalToRecord, type Arrival } from './arrivals.js';
import { eventToRecord, isoUtc, roundOrNull } from './format.js';
import { trackToRecord } from './fronts.js';

const HOUR_MS = 3_600_000;
/** How far an isochrone reaches beyond the outermost stations of its front, across the motion, km (common practice, no source). */
export const ISOCHRONE_MARGIN_KM = 50;

type Position = [number, number];
type Geometry = { type: 'Point'; coordinates: Position } | { type: 'LineString'; coordinates: Position[] } | { type: 'MultiLineString'; coordinates: Position[][] };
interface Feature {
  type: 'Feature';
  geometry: Geometry;
  properties: Record<string, unknown>;
}

const pos = (latDeg: number, lonDeg: number): Position => [roundOrNull(lonDeg, 5)!, roundOrNull(latDeg, 5)!];

/** A line as a LineString, or split where consecutive longitudes jump by more than 180° (RFC 7946 §3.1.9). */
function lineGeometry(pts: readonly Position[]): Geometry {
  const parts: Position[][] = [[pts[0]!]];
  for (let i = 1; i < pts.length; i++) {
    const a = pts[i - 1]!;
    const b = pts[i]!;
    if (Math.abs(b[0] - a[0]) > 180) {
      // the crossing latitude by linear interpolation in unwrapped longitude
      const east = a[0] > 0 ? 180 : -180;
      const bu = b[0] + (east > 0 ? 360 : -360);
      const f = (east - a[0]) / (bu - a[0]);
      const lat = roundOrNull(a[1] + f * (b[1] - a[1]), 5)!;
      parts[parts.length - 1]!.push([east, lat]);
      parts.push([[-east, lat]]);
    }
    parts[parts.length - 1]!.push(b);
  }
  return parts.length === 1 ? { type: 'LineString', coordinates: parts[0]! } : { type: 'MultiLineString', coordinates: parts };
}

export interface GeoJsonInput {
  events: readonly PassageEvent[];
  tracks: readonly FrontTrack[];
  stations: readonly StationMeta[];
  arrivals?: readonly Arrival[];
}

/** The run as one RFC 7946 FeatureCollection (text, one feature per line, LF endings). */
export function toGeoJson(input: GeoJsonInput): string {
  const features: Feature[] = [];
  const meta = new Map(input.stations.map((s) => [s.id, s]));
  const byStation = new Map<string, PassageEvent[]>();
  for (const e of input.events) (byStation.get(e.station) ?? byStation.set(e.station, []).get(e.station)!).push(e);
  for (const s of [...input.stations].sort((a, b) => (a.id < b.id ? -1 : a.id > b.id ? 1 : 0))) {
    if (!Number.isFinite(s.latDeg) || !Number.isFinite(s.lonDeg)) continue;
    const evs = byStation.get(s.id) ?? [];
    features.push({
      type: 'Feature',
      geometry: { type: 'Point', coordinates: pos(s.latDeg, s.lonDeg) },
      properties: { feature: 'station', station: s.id, name: s.name ?? null, elevation_m: roundOrNull(s.elevationM, 1), passages: evs.length, passage_list: evs.map((e) => `${e.kind}@${isoUtc(e.timeMs)}`) },
    });
  }
  for (const e of input.events) {
    const s = meta.get(e.station);
    if (!s || !Number.isFinite(s.latDeg) || !Number.isFinite(s.lonDeg)) continue;
    features.push({ type: 'Feature', geometry: { type: 'Point', coordinates: pos(s.latDeg, s.lonDeg) }, properties: { feature: 'passage', ...eventToRecord(e) } });
  }
  for (const t of input.tracks) {
    const pts = t.members.map((m) => meta.get(m.station)).filter((m): m is StationMeta => m !== undefined);
    if (!pts.length || !(t.speedKmh > 0)) continue;
    const cross = pts.map((p) => crossTrackKm(t, p.latDeg, p.lonDeg));
    const from = Math.min(...cross) - ISOCHRONE_MARGIN_KM;
    const to = Math.max(...cross) + ISOCHRONE_MARGIN_KM;
    const first = Math.floor(t.members[0]!.event.timeMs / HOUR_MS) * HOUR_MS;
    const last = Math.ceil(t.members[t.members.length - 1]!.event.timeMs / HOUR_MS) * HOUR_MS;
    const rec = trackToRecord(t);
    for (let h = first; h <= last; h += HOUR_MS) {
      const line = isochrone(t, h, from, to).map((p) => pos(p.latDeg, p.lonDeg));
      if (line.length < 2) continue;
      features.push({
        type: 'Feature',
        geometry: lineGeometry(line),
        properties: {
          feature: 'isochrone',
          front: t.id,
          kind: t.kind,
          time: isoUtc(h),
          speed_kmh: rec.speed_kmh,
          toward_deg: rec.toward_deg,
          rms_residual_min: rec.rms_residual_min,
          trend: rec.trend,
          strength_change_c_per_100km: rec.strength_change_c_per_100km,
          frontogenesis_k_per_100km_per_3h: rec.frontogenesis_k_per_100km_per_3h,
          stations: rec.stations,
          basis: "fitted position (straight front at constant speed)",
        },
      });
    }
  }
  for (const a of input.arrivals ?? []) {
    features.push({ type: 'Feature', geometry: { type: 'Point', coordinates: pos(a.point.latDeg, a.point.lonDeg) }, properties: { feature: 'arrival', ...arrivalToRecord(a) } });
  }
  return '{"type":"FeatureCollection","features":[\n' + features.map((f) => JSON.stringify(f)).join(',\n') + '\n]}\n';
}
