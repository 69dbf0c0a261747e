/**
 * Stations list (CSV) → StationMeta, and an index that resolves the ids files use to one canonical id.
 *
 * Columns (names matched trimmed, case-insensitively): `id` (also station, icao, station_id, stid),
 * `lat`/`latitude`, `lon`/`lng`/`longitude`, `elevation_m` (also elevation, elev, elev_m; `elevation_ft`
 * / `elev_ft` in feet are converted, NIST SP 811 B.8: 1 ft = 0.3048 m), optional `name`, `alias`/`aliases`
 * (several separated by `;` or `|`), `coastal` (true/false/1/0/yes/no/y/n), `sea_bearing_deg`, `tz` (also
 * time_zone, timezone: the IANA zone of the station's naive local times, for CSV files that give none).
 * Empty lat/lon/elevation cells are NaN (a station may be listed without coordinates).
 */
import Papa from 'papaparse';
import { addIssue, newFileReport, type FileReport, type StationMeta } from '../model/index.js';
import { FOOT_M } from '../physics/constants.js';
import { isKnownZone } from './time.js';

type StationColumn = 'id' | 'lat' | 'lon' | 'elevationM' | 'elevationFt' | 'name' | 'alias' | 'coastal' | 'seaBearing' | 'timeZone';

const NAMES: Record<string, StationColumn> = {
  id: 'id', station: 'id', icao: 'id', station_id: 'id', stid: 'id', stationid: 'id', icao_id: 'id',
  lat: 'lat', latitude: 'lat', lat_deg: 'lat',
  lon: 'lon', lng: 'lon', long: 'lon', longitude: 'lon', lon_deg: 'lon',
  elevation_m: 'elevationM', elevation: 'elevationM', elev: 'elevationM', elev_m: 'elevationM', height_m: 'elevationM', altitude_m: 'elevationM',
  elevation_ft: 'elevationFt', elev_ft: 'elevationFt',
  name: 'name', station_name: 'name',
  alias: 'alias', aliases: 'alias', alt_id: 'alias', other_ids: 'alias',
  coastal: 'coastal', is_coastal: 'coastal',
  sea_bearing_deg: 'seaBearing', sea_bearing: 'seaBearing', sea_direction_deg: 'seaBearing',
  tz: 'timeZone', time_zone: 'timeZone', timezone: 'timeZone',
};

function columnsOf(headers: readonly string[]): Partial<Record<StationColumn, number>> {
  const out: Partial<Record<StationColumn, number>> = {};
  headers.forEach((h, i) => {
    const k = NAMES[h.trim().replace(/^\uFEFF/, '').toLowerCase()];
    if (k && out[k] === undefined) out[k] = i;
  });
  return out;
}

/**
 * True when the headers look like a stations list: an id column, lat and lon, and no time column.
 * @example looksLikeStationsFile(['id', 'alias', 'name', 'lat', 'lon', 'elevation_m']) // true
 */
export function looksLikeStationsFile(headers: readonly string[]): boolean {
  const c = columnsOf(headers);
  const timeLike = headers.some((h) => /^(valid|date|time|datetime|timestamp|time_hour|obs_time|date_time)$/i.test(h.trim()));
  return c.id !== undefined && c.lat !== undefined && c.lon !== undefined && !timeLike;
}

function parseBool(text: string): boolean | undefined | null {
  const t = text.trim().toLowerCase();
  if (t === '') return undefined;
  if (['true', '1', 'yes', 'y', 't'].includes(t)) return true;
  if (['false', '0', 'no', 'n', 'f'].includes(t)) return false;
  return null;
}

/**
 * Read a stations CSV. Rows without an id, with a duplicate id, or with fewer fields than the header are
 * rejected; a bad number (or lat/lon out of range) becomes NaN and is noted.
 * @example readStationsText('id,lat,lon,elevation_m\nKJFK,40.639,-73.762,3.4\n', 's.csv').stations[0].elevationM // 3.4
 */
export function readStationsText(text: string, file: string): { stations: StationMeta[]; report: FileReport } {
  const report = newFileReport(file, 'stations');
  const stations: StationMeta[] = [];
  const rows = Papa.parse<string[]>(text.replace(/^\uFEFF/, ''), { header: false, skipEmptyLines: 'greedy', delimitersToGuess: [',', '\t', ';', '|'] }).data;
  if (rows.length === 0) {
    addIssue(report, { file, line: 1, reason: 'empty', message: 'the stations file is empty' });
    return { stations, report };
  }
  const headers = rows[0]!;
  report.lines = rows.length;
  const c = columnsOf(headers);
  report.columns = {};
  for (const [k, i] of Object.entries(c)) report.columns[headers[i]!.trim()] = k;
  if (c.id === undefined) {
    for (let r = 1; r < rows.length; r++) addIssue(report, { file, line: r + 1, reason: 'no-id-column', message: `no id column among: ${headers.join(', ')}; name one "id"` });
    return { stations, report };
  }
  const seen = new Set<string>();
  const badNotes = new Map<string, number>();
  const num = (cell: string | undefined, what: string, line: number, lo: number, hi: number): number => {
    if (cell === undefined) return NaN;
    const t = cell.trim();
    if (t === '' || /^(m|na|nan|null)$/i.test(t)) return NaN;
    const v = Number(t);
    if (!Number.isFinite(v) || v < lo || v > hi) {
      badNotes.set(what, (badNotes.get(what) ?? 0) + 1);
      if (badNotes.get(what) === 1) report.notes.push(`bad ${what} "${t}" at line ${line}; read as missing`);
      return NaN;
    }
    return v;
  };
  for (let r = 1; r < rows.length; r++) {
    const row = rows[r]!;
    const line = r + 1;
    if (row.length < headers.length) {
      addIssue(report, { file, line, reason: 'truncated', message: `line has ${row.length} of ${headers.length} fields` });
      continue;
    }
    const id = row[c.id]!.trim();
    if (id === '') {
      addIssue(report, { file, line, reason: 'no-id', message: 'the id cell is empty' });
      continue;
    }
    if (seen.has(id.toUpperCase())) {
      addIssue(report, { file, line, reason: 'duplicate-station', message: `station ${id} is listed twice; the first entry is kept`, group: id });
      continue;
    }
    seen.add(id.toUpperCase());
    let elevationM = num(c.elevationM !== undefined ? row[c.elevationM] : undefined, 'elevation', line, -500, 9000);
    if (Number.isNaN(elevationM) && c.elevationFt !== undefined) elevationM = num(row[c.elevationFt], 'elevation_ft', line, -1600, 29600) * FOOT_M;
    const s: StationMeta = {
      id,
      aliases: c.alias !== undefined ? row[c.alias]!.split(/[;|]/).map((a) => a.trim()).filter((a) => a !== '' && a.toUpperCase() !== id.toUpperCase()) : [],
      latDeg: num(c.lat !== undefined ? row[c.lat] : undefined, 'latitude', line, -90, 90),
      lonDeg: num(c.lon !== undefined ? row[c.lon] : undefined, 'longitude', line, -180, 360),
      elevationM,
    };
    if (c.name !== undefined && row[c.name]!.trim() !== '') s.name = row[c.name]!.trim();
    if (c.coastal !== undefined) {
      const b = parseBool(row[c.coastal]!);
      if (b === null) report.notes.push(`coastal value "${row[c.coastal]}" at line ${line} is not true/false; ignored`);
      else if (b !== undefined) s.coastal = b;
    }
    if (c.seaBearing !== undefined) {
      const v = num(row[c.seaBearing], 'sea_bearing_deg', line, 0, 360);
      if (!Number.isNaN(v)) s.seaBearingDeg = v;
    }
    if (c.timeZone !== undefined) {
      const z = row[c.timeZone]!.trim();
      if (z !== '' && isKnownZone(z)) s.timeZone = z;
      else if (z !== '') report.notes.push(`time zone "${z}" at line ${line} is not an IANA zone name (e.g. America/Toronto); ignored`);
    }
    stations.push(s);
    report.parsed++;
  }
  return { stations, report };
}

/** Lookup tables built from a stations list. Keys are upper-case. */
export interface StationIndex {
  byId: Map<string, StationMeta>;
  /** alias → canonical id; an alias shared by two stations maps to null (ambiguous). */
  byAlias: Map<string, string | null>;
}

export interface ResolvedStation {
  /** Canonical id (the stations-file id), or the input trimmed when unknown. */
  id: string;
  meta?: StationMeta;
  /** How it was found: exact id, listed alias, US ICAO prefix (`K`/`P` + 3-letter id), or not found. */
  via: 'id' | 'alias' | 'icao-prefix' | 'unknown' | 'ambiguous';
}

/**
 * Build the lookup index; ids and aliases are compared case-insensitively.
 * @example resolveStation(buildStationIndex([{ id: 'KJFK', aliases: [], latDeg: 40.6, lonDeg: -73.8, elevationM: 3.4 }]), 'JFK').id // 'KJFK'
 */
export function buildStationIndex(stations: readonly StationMeta[]): StationIndex {
  const byId = new Map<string, StationMeta>();
  const byAlias = new Map<string, string | null>();
  for (const s of stations) byId.set(s.id.toUpperCase(), s);
  for (const s of stations) {
    for (const a of s.aliases) {
      const k = a.toUpperCase();
      if (byId.has(k)) continue;
      const prev = byAlias.get(k);
      byAlias.set(k, prev === undefined || prev === s.id ? s.id : null);
    }
  }
  return { byId, byAlias };
}

/**
 * Resolve an id as written in a data file: exact id; else a listed alias; else, for a 3-character US id,
 * the unique station `K`+id or `P`+id (ICAO location indicators for the contiguous US start with K, for
 * Alaska/Hawaii with P — ICAO Doc 7910, from memory). Unknown ids come back trimmed with `via: 'unknown'`.
 */
export function resolveStation(index: StationIndex, id: string): ResolvedStation {
  const t = id.trim();
  const k = t.toUpperCase();
  const exact = index.byId.get(k);
  if (exact) return { id: exact.id, meta: exact, via: 'id' };
  const alias = index.byAlias.get(k);
  if (alias === null) return { id: t, via: 'ambiguous' };
  if (alias !== undefined) return { id: alias, meta: index.byId.get(alias.toUpperCase())!, via: 'alias' };
  if (/^[A-Z0-9]{3}$/.test(k)) {
    const cands = ['K' + k, 'P' + k].map((c) => index.byId.get(c)).filter((s): s is StationMeta => s !== undefined);
    if (cands.length === 1) return { id: cands[0]!.id, meta: cands[0]!, via: 'icao-prefix' };
    if (cands.length > 1) return { id: t, via: 'ambiguous' };
  }
  return { id: t, via: 'unknown' };
}

/** A station id taken from a file name, and the rule that gave it (shown by `inspect`). */
export interface FileNameStation {
  id: string;
  rule: string;
}

/**
 * The station id a file name gives when the file has no station column: the file name without directory and
 * extensions (`.gz` and one more); if that is not a known station, its leading token (split at `_`, `-`, `.`
 * or a blank) when that is a listed id or alias, or resolves by the US ICAO prefix (`ORD_2019_LCD...` → `ORD`
 * → `KORD`); with no match, the leading token when it looks like a station id (3 to 5 letters and digits,
 * starting with a letter: ICAO Doc 7910 indicators are 4 letters, FAA identifiers 3 to 5 characters, from
 * memory), else the whole stem. Ids are resolved later as every other id (resolveStation).
 * @example stationFromFileName(buildStationIndex([{ id: 'KORD', aliases: ['ORD'], latDeg: 42, lonDeg: -88, elevationM: 200 }]), 'data/ORD_2019_LCD_localstd.csv').id // 'ORD'
 */
export function stationFromFileName(index: StationIndex, path: string): FileNameStation {
  const stem = path.replace(/^.*[\\/]/, '').replace(/\.gz$/i, '').replace(/\.[^.]*$/, '');
  const whole = resolveStation(index, stem);
  if (whole.via === 'id' || whole.via === 'alias' || whole.via === 'icao-prefix') return { id: stem, rule: `file name "${stem}"${whole.id !== stem ? ` (${whole.via} of ${whole.id})` : ''}` };
  const token = stem.split(/[_\-. ]+/)[0] ?? '';
  if (token !== '' && token !== stem) {
    const t = resolveStation(index, token);
    if (t.via === 'id' || t.via === 'alias' || t.via === 'icao-prefix') {
      return { id: token, rule: `leading token "${token}" of the file name${t.id !== token ? ` (${t.via === 'alias' ? 'alias' : 'ICAO prefix'} of ${t.id} in the stations file)` : ' (listed in the stations file)'}` };
    }
    if (/^[A-Za-z][A-Za-z0-9]{2,4}$/.test(token)) return { id: token, rule: `leading token "${token}" of the file name (looks like a station id; not in a stations file)` };
  }
  return { id: stem, rule: `file name "${stem}"` };
}
