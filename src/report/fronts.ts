/**
 * Output writers for fronts tracked across a network: one record per front (CSV, JSON) and a table for
 * people. Pure functions. Times ISO 8601 UTC; directions are where the front moves toward, degrees true.
 */
import type { FrontTrack, PassageEvent } from '../model/index.js';
import { CAUTION } from './caution.js';
import { alignColumns, csvCell, eventToRecord, eventsToTable, isoUtc, roundOrNull, type RecordValue, type TableOptions } from './format.js';

export const FRONT_COLUMNS = [
  'front',
  'kind',
  'stations',
  'first_passage',
  'last_passage',
  'speed_kmh',
  'toward_deg',
  'rms_residual_min',
  'trend',
  'strength_change_c_per_100km',
  'zone_change_km_per_100km',
  'frontogenesis_k_per_100km_per_3h',
  'passages',
  'expected',
] as const;
export type FrontColumn = (typeof FRONT_COLUMNS)[number];

/** One front as a flat record; `passages` and `expected` list `STATION@time`. */
export function trackToRecord(t: FrontTrack): Record<FrontColumn, RecordValue> {
  return {
    front: t.id,
    kind: t.kind,
    stations: t.members.length,
    first_passage: isoUtc(t.members[0]!.event.timeMs),
    last_passage: isoUtc(t.members[t.members.length - 1]!.event.timeMs),
    speed_kmh: roundOrNull(t.speedKmh, 1),
    toward_deg: roundOrNull(t.directionDeg, 0),
    rms_residual_min: roundOrNull(t.rmsResidualMin, 0),
    trend: t.trend,
    strength_change_c_per_100km: roundOrNull(t.strengthSlopeCPer100km, 2),
    zone_change_km_per_100km: roundOrNull(t.zoneSlopeKmPer100km, 1),
    frontogenesis_k_per_100km_per_3h: roundOrNull(t.frontogenesisKPer100kmPer3h ?? NaN, 2),
    passages: t.members.map((m) => `${m.station}@${isoUtc(m.event.timeMs)}`),
    expected: t.expected.map((x) => `${x.station}@${isoUtc(x.timeMs)}`),
  };
}

export function tracksToCsv(tracks: readonly FrontTrack[]): string {
  const lines = [FRONT_COLUMNS.join(',')];
  for (const t of tracks) {
    const r = trackToRecord(t);
    lines.push(FRONT_COLUMNS.map((c) => csvCell(r[c])).join(','));
  }
  return lines.join('\n') + '\n';
}

/** Fronts as newline-delimited JSON: one record object per line. */
export function tracksToNdjson(tracks: readonly FrontTrack[]): string {
  return tracks.map((t) => JSON.stringify(trackToRecord(t)) + '\n').join('');
}

/**
 * Events and fronts together: JSON `{"events": [...], "fronts": [...]}`, or NDJSON lines each with a leading
 * `"record": "event"` or `"record": "front"` key (events first).
 */
export function eventsAndTracksToJson(events: readonly PassageEvent[], tracks: readonly FrontTrack[], ndjson = false): string {
  if (ndjson) {
    return [
      ...events.map((e) => JSON.stringify({ record: 'event', ...eventToRecord(e) })),
      ...tracks.map((t) => JSON.stringify({ record: 'front', ...trackToRecord(t) })),
    ].map((l) => l + '\n').join('');
  }
  const ev = events.map((e) => '    ' + JSON.stringify(eventToRecord(e))).join(',\n');
  const fr = tracks.map((t) => '    ' + JSON.stringify(trackToRecord(t))).join(',\n');
  return `{\n  "events": [${ev ? '\n' + ev + '\n  ' : ''}],\n  "fronts": [${fr ? '\n' + fr + '\n  ' : ''}]\n}\n`;
}

export function tracksToJson(tracks: readonly FrontTrack[]): string {
  if (tracks.length === 0) return '[]\n';
  return '[\n' + tracks.map((t) => '  ' + JSON.stringify(trackToRecord(t))).join(',\n') + '\n]\n';
}

const signed = (x: number) => (Number.isFinite(x) ? (x >= 0 ? '+' : '') + x.toFixed(2) : '-');
const compass = (deg: number) => ['N', 'NE', 'E', 'SE', 'S', 'SW', 'W', 'NW'][Math.round((((deg % 360) + 360) % 360) / 45) % 8]!;

/** A table of the fronts for people, with a heading line. Empty string when there are none. */
export function tracksToTable(tracks: readonly FrontTrack[]): string {
  if (tracks.length === 0) return '';
  const header = ['front', 'stations', 'first (UTC)', 'last (UTC)', 'speed km/h', 'toward', 'fit ± min', 'trend', 'ΔT °C/100 km', 'F K/100 km/3 h'];
  const rows = tracks.map((t) => [
    t.id,
    String(t.members.length),
    (isoUtc(t.members[0]!.event.timeMs) ?? '').slice(0, 16).replace('T', ' '),
    (isoUtc(t.members[t.members.length - 1]!.event.timeMs) ?? '').slice(0, 16).replace('T', ' '),
    t.speedKmh.toFixed(0),
    `${t.directionDeg.toFixed(0)}° ${compass(t.directionDeg)}`,
    t.rmsResidualMin.toFixed(0),
    t.trend,
    signed(t.strengthSlopeCPer100km),
    signed(t.frontogenesisKPer100kmPer3h ?? NaN),
  ]);
  const right = [false, true, false, false, true, false, true, false, true, true];
  return ['Fronts across the network (passage times fitted as a moving straight front):', ...alignColumns(header, rows, right)].join('\n') + '\n';
}

/**
 * The passages table with the fronts table spliced in before its closing caution line (as `fropa detect` prints
 * it). Without fronts it is `eventsToTable` alone.
 */
export function passagesToTable(events: readonly PassageEvent[], tracks: readonly FrontTrack[], opts: TableOptions = {}): string {
  const table = eventsToTable(events, opts);
  const network = tracksToTable(tracks);
  if (!network) return table;
  const at = table.lastIndexOf(CAUTION);
  return at < 0 ? table + '\n' + network : table.slice(0, at) + '\n' + network + table.slice(at);
}
