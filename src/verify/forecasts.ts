/**
 * Forecast passage list (CSV) → ForecastPassage records, with a ParseIssue for every line not used.
 *
 * Columns (header names matched trimmed, case-insensitively; extra columns ignored; comma, tab,
 * semicolon or pipe): `station` (also `id`, `station_id`, `icao`, `stid`), `forecast_time` (also
 * `forecast`, `valid_time`, `time`), optional `kind` (also `type`, `front`), optional `issued_time` (also
 * `issued`, `issue_time`, `init_time`), optional `valid_from` and `valid_to` (also `valid_start`, `valid_end`,
 * `valid_until`): the period the issue covers, within which an observed passage not forecast is a miss.
 * Times as the observation readers read them (ISO 8601 with `Z` or
 * an offset; naive times need a zone or offset, see src/ingest/time.ts). An empty or absent kind, or
 * `any`, means any front kind (cold, warm or occluded front). Station ids are resolved through the
 * stations index (aliases, US ICAO prefix), so a forecast for `CDR` verifies against station `XCDR`
 * when the stations file lists the alias.
 */
import Papa from 'papaparse';
import { BOUNDARY_KINDS, addIssue, newFileReport, type BoundaryKind, type FileReport } from '../model/index.js';
import { parseTime, type TimeOptions } from '../ingest/time.js';
import { resolveStation, type StationIndex } from '../ingest/stations.js';

/** One forecast passage at a station. */
export interface ForecastPassage {
  /** Canonical station id (stations-file id when known). */
  station: string;
  /** Forecast kind; null = any front kind. */
  kind: BoundaryKind | null;
  /** Forecast passage time, epoch ms UTC. */
  forecastMs: number;
  /** When the forecast was issued, epoch ms UTC; NaN when not given. */
  issuedMs: number;
  /** Start of the period the issue covers, epoch ms UTC; NaN or absent when not given. */
  validFromMs?: number;
  /** End of the period the issue covers, epoch ms UTC; NaN or absent when not given. */
  validToMs?: number;
  /** Where the forecast comes from (the forecast file, or a forecast series path); default `file`. */
  source?: string;
  file: string;
  /** 1-based line of the forecast in `file`. */
  line: number;
}

export interface ForecastReadOptions extends TimeOptions {
  /** Stations index for resolving ids and aliases. */
  stations?: StationIndex;
  /**
   * Canonical ids of stations that have observations. When this or a non-empty index is given, a
   * forecast for a station found in neither is rejected (`unknown-station`).
   */
  observedStations?: ReadonlySet<string>;
  /**
   * Observation period per canonical station id, [first, last] epoch ms. A forecast passage time
   * outside its station's period cannot be verified and is rejected (`outside-observations`).
   */
  observedSpans?: ReadonlyMap<string, readonly [number, number]>;
}

type ForecastColumn = 'station' | 'kind' | 'forecast' | 'issued' | 'validFrom' | 'validTo';

const NAMES: Record<string, ForecastColumn> = {
  station: 'station', id: 'station', station_id: 'station', stationid: 'station', icao: 'station', stid: 'station', site: 'station',
  kind: 'kind', type: 'kind', front: 'kind', front_kind: 'kind', boundary: 'kind',
  forecast_time: 'forecast', forecast: 'forecast', valid_time: 'forecast', valid: 'forecast', time: 'forecast', passage_time: 'forecast',
  issued_time: 'issued', issued: 'issued', issue_time: 'issued', init_time: 'issued', issued_at: 'issued',
  valid_from: 'validFrom', valid_start: 'validFrom', valid_to: 'validTo', valid_end: 'validTo', valid_until: 'validTo',
};

/** Short kind names forecasters write, besides the full BOUNDARY_KINDS names. */
const KIND_ALIASES: Record<string, BoundaryKind | null> = {
  cold: 'cold-front', warm: 'warm-front', occluded: 'occluded-front', occlusion: 'occluded-front',
  cold_front: 'cold-front', warm_front: 'warm-front', occluded_front: 'occluded-front',
  any: null, front: null, '': null,
};

/** Kinds an untyped forecast (kind null) may verify against. */
export const ANY_FRONT_KINDS: readonly BoundaryKind[] = ['cold-front', 'warm-front', 'occluded-front'];

/**
 * Parse a kind cell: a BOUNDARY_KINDS name or a short alias (case-insensitive); null = any front kind;
 * undefined = not a kind.
 * @example parseForecastKind('Cold') // 'cold-front'
 */
export function parseForecastKind(text: string): BoundaryKind | null | undefined {
  const t = text.trim().toLowerCase();
  if ((BOUNDARY_KINDS as readonly string[]).includes(t)) return t as BoundaryKind;
  return t in KIND_ALIASES ? KIND_ALIASES[t]! : undefined;
}

/**
 * Read a forecast passage CSV. Every data line is parsed or rejected with file, line, reason and a
 * remedy: `missing-column` (no station or forecast_time column: every line), `truncated`, `no-station`,
 * `unknown-station`, `ambiguous-station`, `bad-kind`, `naive-time` (a time without zone or offset, and no
 * zone given), `bad-forecast-time`, `bad-issued-time`, `issued-after-forecast`, `bad-valid-time`
 * (unreadable, or valid_to before valid_from), `outside-observations` (with `observedSpans`),
 * `duplicate` (same station, kind, forecast and issued time as an earlier line, which is kept). An
 * empty issued_time cell leaves the lead time unknown; empty valid cells leave the period to the caller.
 * @example readForecastsText('station,kind,forecast_time,issued_time\nXAVN,cold-front,2026-03-02T14:07Z,2026-03-01T09:00Z\n', 'f.csv').forecasts[0].forecastMs // Date.UTC(2026, 2, 2, 14, 7)
 */
export function readForecastsText(text: string, file: string, opts: ForecastReadOptions = {}): { forecasts: ForecastPassage[]; report: FileReport } {
  const report = newFileReport(file, 'forecasts');
  const forecasts: ForecastPassage[] = [];
  const rows = Papa.parse<string[]>(text.replace(/^\uFEFF/, ''), { header: false, delimitersToGuess: [',', '\t', ';', '|'] }).data;
  // Keep 1-based file line numbers: Papa keeps blank lines as [''] rows when skipEmptyLines is off.
  const isBlank = (r: string[]) => r.length === 0 || (r.length === 1 && r[0]!.trim() === '');
  const headerAt = rows.findIndex((r) => !isBlank(r));
  if (headerAt < 0) {
    addIssue(report, { file, line: 1, reason: 'empty', message: 'the forecast file is empty; expected a header station,kind,forecast_time,issued_time' });
    return { forecasts, report };
  }
  const headers = rows[headerAt]!;
  report.lines = 1;
  const col: Partial<Record<ForecastColumn, number>> = {};
  headers.forEach((h, i) => {
    const k = NAMES[h.trim().replace(/^\uFEFF/, '').toLowerCase()];
    if (k && col[k] === undefined) col[k] = i;
  });
  report.columns = {};
  for (const [k, i] of Object.entries(col)) report.columns[headers[i]!.trim()] = k;
  const missing = [col.station === undefined ? 'station' : '', col.forecast === undefined ? 'forecast_time' : ''].filter(Boolean);
  if (col.issued === undefined) report.notes.push('no issued_time column: lead times are unknown');
  if (col.kind === undefined) report.notes.push('no kind column: every forecast is for any front kind');
  const index = opts.stations;
  const checkKnown = (index !== undefined && index.byId.size > 0) || opts.observedStations !== undefined;
  const need = Math.max(col.station ?? 0, col.forecast ?? 0, col.kind ?? 0, col.issued ?? 0) + 1;
  const seen = new Map<string, number>();
  const timeReason = (e: { error: string }, other: string) => (e.error === 'needs-zone' ? 'naive-time' : other);
  for (let r = headerAt + 1; r < rows.length; r++) {
    const row = rows[r]!;
    if (isBlank(row)) continue;
    const line = r + 1;
    report.lines++;
    const reject = (reason: string, message: string, group?: string, column?: number) => {
      addIssue(report, { file, line, reason, message, ...(group !== undefined ? { group } : {}), ...(column !== undefined ? { column: column + 1 } : {}) });
    };
    if (missing.length) {
      reject('missing-column', `no ${missing.join(' or ')} column among: ${headers.map((h) => h.trim()).join(', ')}; name them station, kind, forecast_time, issued_time`);
      continue;
    }
    if (row.length < need) {
      reject('truncated', `line has ${row.length} fields, the ${need}th is needed`);
      continue;
    }
    const rawId = row[col.station!]!.trim();
    if (rawId === '') {
      reject('no-station', 'the station cell is empty', undefined, col.station);
      continue;
    }
    let station = rawId;
    if (index) {
      const res = resolveStation(index, rawId);
      if (res.via === 'ambiguous') {
        reject('ambiguous-station', `station "${rawId}" is an alias of more than one station in the stations file; use the full id`, rawId, col.station);
        continue;
      }
      station = res.id;
    }
    if (checkKnown && !(index?.byId.has(station.toUpperCase()) || opts.observedStations?.has(station))) {
      reject('unknown-station', `station "${rawId}" is not in the stations file nor in the observations; check the id or add it as an alias in stations.csv`, rawId, col.station);
      continue;
    }
    let kind: BoundaryKind | null = null;
    if (col.kind !== undefined) {
      const k = parseForecastKind(row[col.kind]!);
      if (k === undefined) {
        reject('bad-kind', `kind "${row[col.kind]!.trim()}" is not known; use one of ${BOUNDARY_KINDS.join(', ')}, or leave it empty for any front`, row[col.kind]!.trim(), col.kind);
        continue;
      }
      kind = k;
    }
    const ft = parseTime(row[col.forecast!]!.trim(), opts);
    if (!('ms' in ft)) {
      reject(timeReason(ft, 'bad-forecast-time'), `forecast_time: ${ft.message}`, row[col.forecast!]!.trim(), col.forecast);
      continue;
    }
    let issuedMs = NaN;
    if (col.issued !== undefined && row[col.issued]!.trim() !== '') {
      const it = parseTime(row[col.issued]!.trim(), opts);
      if (!('ms' in it)) {
        reject(timeReason(it, 'bad-issued-time'), `issued_time: ${it.message}; or leave the cell empty`, row[col.issued]!.trim(), col.issued);
        continue;
      }
      if (it.ms > ft.ms) {
        reject('issued-after-forecast', `issued_time ${row[col.issued]!.trim()} is after the forecast passage time; swapped columns?`, row[col.issued]!.trim(), col.issued);
        continue;
      }
      issuedMs = it.ms;
    }
    const valid: number[] = [NaN, NaN];
    let badValid = false;
    for (const [n, c] of [[0, col.validFrom], [1, col.validTo]] as const) {
      const cell = c === undefined ? '' : (row[c] ?? '').trim();
      if (cell === '') continue;
      const vt = parseTime(cell, opts);
      if (!('ms' in vt)) {
        reject(timeReason(vt, 'bad-valid-time'), `${n === 0 ? 'valid_from' : 'valid_to'}: ${vt.message}; or leave the cell empty`, cell, c);
        badValid = true;
        break;
      }
      valid[n] = vt.ms;
    }
    if (badValid) continue;
    if (valid[0]! > valid[1]!) {
      reject('bad-valid-time', 'valid_to is before valid_from; swapped columns?', row[col.validTo!]!.trim(), col.validTo);
      continue;
    }
    const span = opts.observedSpans?.get(station);
    if (opts.observedSpans && (!span || ft.ms < span[0] || ft.ms > span[1])) {
      const iso = (t: number) => new Date(t).toISOString().slice(0, 16) + 'Z';
      reject(
        'outside-observations',
        span
          ? `forecast_time ${row[col.forecast!]!.trim()} is outside the observations of ${station} (${iso(span[0])} to ${iso(span[1])}); it cannot be verified`
          : `station ${station} has no observations to verify against`,
        row[col.forecast!]!.trim(),
        col.forecast,
      );
      continue;
    }
    const dupKey = `${station}\u0000${kind ?? ''}\u0000${ft.ms}\u0000${issuedMs}`;
    const first = seen.get(dupKey);
    if (first !== undefined) {
      reject('duplicate', `same station, kind, forecast_time and issued_time as line ${first}; the first is kept`, rawId, col.station);
      continue;
    }
    seen.set(dupKey, line);
    forecasts.push({ station, kind, forecastMs: ft.ms, issuedMs, validFromMs: valid[0]!, validToMs: valid[1]!, source: file, file, line });
    report.parsed++;
  }
  return { forecasts, report };
}
