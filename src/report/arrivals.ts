/**
 * Arrivals at points of interest: the fitted passage time of each tracked front at each named point, with an
 * interval from the fit, always marked as an estimate. Pure: points and tracks in, records and text out.
 */
import type { FrontTrack } from '../model/index.js';
import { crossTrackKm, fittedPassageMs } from '../network/fittedTime.js';
import { projectLocalKm } from '../physics/geo.js';
import { alignColumns, csvCell, isoUtc, roundOrNull, type RecordValue } from './format.js';

/** A point of interest. */
export interface PointOfInterest {
  name: string;
  latDeg: number;
  lonDeg: number;
}

/** One front's estimated arrival at one point. */
export interface Arrival {
  point: PointOfInterest;
  front: string;
  kind: string;
  /** Fitted passage time, epoch ms UTC. */
  timeMs: number;
  /** Half-width of the interval, minutes: max(2 × the fit's RMS residual, 30 min). */
  halfWidthMin: number;
  /** The point lies outside the stations that fixed the fit (beyond their span along the motion, or more than 50 km beyond their span across it). */
  extrapolated: boolean;
}

/** Smallest half-width of an arrival interval, minutes (common practice, no source: a 3-station fit has no residual). */
export const MIN_ARRIVAL_HALF_WIDTH_MIN = 30;

/**
 * Parse `LAT,LON[,NAME]` (decimal degrees, north and east positive). Throws RangeError naming the bad text.
 * @example parsePoint('41.88,-87.63,Loop') // { name: 'Loop', latDeg: 41.88, lonDeg: -87.63 }
 */
export function parsePoint(spec: string): PointOfInterest {
  const parts = spec.split(',').map((s) => s.trim());
  const lat = Number(parts[0]);
  const lon = Number(parts[1]);
  if (parts.length < 2 || parts[0] === '' || parts[1] === '' || !(Math.abs(lat) <= 90) || !(Math.abs(lon) <= 180)) {
    throw new RangeError(`"${spec}": expected LAT,LON[,NAME] in decimal degrees, latitude -90 to 90, longitude -180 to 180`);
  }
  const name = parts.slice(2).join(',').trim() || `${lat},${lon}`;
  return { name, latDeg: lat, lonDeg: lon };
}

/**
 * Points file: CSV with a header naming `lat`, `lon` (or `latitude`, `longitude`) and optionally `name`; other
 * columns ignored; `#` lines and blank lines skipped. Throws RangeError with the line number of a bad row.
 */
export function parsePointsFile(text: string, file: string): PointOfInterest[] {
  const lines = text.split(/\r?\n/);
  let header: string[] | null = null;
  const out: PointOfInterest[] = [];
  lines.forEach((raw, i) => {
    const line = raw.trim();
    if (!line || line.startsWith('#')) return;
    const cells = line.split(',').map((c) => c.trim());
    if (!header) {
      header = cells.map((c) => c.toLowerCase());
      if (!header.some((h) => h === 'lat' || h === 'latitude') || !header.some((h) => h === 'lon' || h === 'longitude')) {
        throw new RangeError(`${file}:${i + 1}: the header must name lat and lon columns (and optionally name)`);
      }
      return;
    }
    const col = (...names: string[]) => cells[header!.findIndex((h) => names.includes(h))] ?? '';
    try {
      const p = parsePoint(`${col('lat', 'latitude')},${col('lon', 'longitude')}`);
      const name = col('name');
      out.push(name ? { ...p, name } : p);
    } catch (e) {
      throw new RangeError(`${file}:${i + 1}: ${(e as Error).message}`);
    }
  });
  return out;
}

/** Each front's fitted arrival at each point (points in the given order, fronts in track order). */
export function arrivalsAt(points: readonly PointOfInterest[], tracks: readonly FrontTrack[]): Arrival[] {
  const out: Arrival[] = [];
  for (const p of points) {
    for (const t of tracks) {
      const timeMs = fittedPassageMs(t, p.latDeg, p.lonDeg);
      if (!Number.isFinite(timeMs)) continue;
      const along = t.members.map((m) => m.alongKm);
      const proj = projectLocalKm([{ latDeg: p.latDeg, lonDeg: p.lonDeg }], t.origin);
      const ux = Math.sin((t.directionDeg * Math.PI) / 180);
      const uy = Math.cos((t.directionDeg * Math.PI) / 180);
      const a = proj.xKm[0]! * ux + proj.yKm[0]! * uy;
      const cross = t.members.map((m) => m.xKm * uy - m.yKm * ux);
      const c = crossTrackKm(t, p.latDeg, p.lonDeg);
      const extrapolated = a < Math.min(...along) || a > Math.max(...along) || c < Math.min(...cross) - 50 || c > Math.max(...cross) + 50;
      out.push({ point: p, front: t.id, kind: t.kind, timeMs, halfWidthMin: Math.max(2 * t.rmsResidualMin, MIN_ARRIVAL_HALF_WIDTH_MIN), extrapolated });
    }
  }
  return out;
}

export const ARRIVAL_COLUMNS = ['point', 'lat', 'lon', 'front', 'kind', 'time', 'time_earliest', 'time_latest', 'half_width_min', 'extrapolated', 'basis'] as const;

/** One arrival as a flat record; `basis` is always `estimate from the front's fit`. */
export function arrivalToRecord(a: Arrival): Record<(typeof ARRIVAL_COLUMNS)[number], RecordValue> {
  return {
    point: a.point.name,
    lat: roundOrNull(a.point.latDeg, 5),
    lon: roundOrNull(a.point.lonDeg, 5),
    front: a.front,
    kind: a.kind,
    time: isoUtc(a.timeMs),
    time_earliest: isoUtc(a.timeMs - a.halfWidthMin * 60000),
    time_latest: isoUtc(a.timeMs + a.halfWidthMin * 60000),
    half_width_min: roundOrNull(a.halfWidthMin, 0),
    extrapolated: a.extrapolated,
    basis: "estimate from the front's fit",
  };
}

export function arrivalsToCsv(arrivals: readonly Arrival[]): string {
  return [ARRIVAL_COLUMNS.join(','), ...arrivals.map((a) => { const r = arrivalToRecord(a); return ARRIVAL_COLUMNS.map((c) => csvCell(r[c])).join(','); })].join('\n') + '\n';
}

export function arrivalsToJson(arrivals: readonly Arrival[], ndjson = false): string {
  const recs = arrivals.map((a) => JSON.stringify(arrivalToRecord(a)));
  if (ndjson) return recs.map((r) => r + '\n').join('');
  return recs.length ? '[\n' + recs.map((r) => '  ' + r).join(',\n') + '\n]\n' : '[]\n';
}

/** The arrivals as a table for people, headed as estimates (the caller adds the caution); empty string when there are none. */
export function arrivalsToTable(arrivals: readonly Arrival[]): string {
  if (!arrivals.length) return '';
  const header = ['point', 'front', 'estimated (UTC)', '± min', 'note'];
  const rows = arrivals.map((a) => [a.point.name, a.front, (isoUtc(a.timeMs) ?? '').slice(0, 16).replace('T', ' '), String(Math.round(a.halfWidthMin)), a.extrapolated ? 'extrapolated beyond the stations' : '']);
  return ['Estimated arrivals at points (from each front fitted as a straight line moving at constant speed; not observed):', ...alignColumns(header, rows, [false, false, false, true, false])].join('\n') + '\n';
}
