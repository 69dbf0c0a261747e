/**
 * Output writers for detected passages: one flat record per event (the output contract), and CSV,
 * NDJSON, JSON and a table for people built from it. Pure functions: text in, text out.
 *
 * Contract: snake_case keys in the order of EVENT_COLUMNS; times ISO 8601 UTC `YYYY-MM-DDTHH:MM:SSZ`;
 * missing numbers (NaN) are `null` in JSON and empty cells in CSV; evidence is an array in JSON and
 * one cell joined with `; ` in CSV, its `+`/`−` marks written as `held:`/`failed:` there; CSV text cells that a
 * spreadsheet would execute are neutralised (csvCell).
 */
import { DateTime } from 'luxon';
import type { OperatorFields, PassageEvent } from '../model/index.js';
import { KMH_MS, KNOT_MS, MPH_MS } from '../physics/constants.js';
import { CAUTION } from './caution.js';

/** Output columns, in contract order (CSV header, JSON key order). */
export const EVENT_COLUMNS = [
  'station',
  'kind',
  'time',
  'time_earliest',
  'time_latest',
  'time_basis',
  'wind_shift_time',
  'change_start_time',
  'confidence',
  'temp_change_c',
  'dewpoint_change_c',
  'theta_e_change_k',
  'pressure_min_hpa',
  'pressure_min_time',
  'pressure_rise_3h_hpa',
  'wind_before_deg',
  'wind_after_deg',
  'wind_turn_deg',
  'wind_speed_after_ms',
  'gust_max_ms',
  'precip_near',
  'zone_start',
  'zone_end',
  'zone_hours',
  'zone_depth_km',
  'gradient_k_per_100km',
  'observer_fropa_time',
  'evidence',
  'temp_before_c',
  'temp_after_c',
  'dewpoint_before_c',
  'dewpoint_after_c',
  'temp_min_6h_c',
  'temp_min_12h_c',
  'freeze_time',
  'precip_before_6h',
  'precip_types',
  'precip_heavy',
  'wind_speed_before_ms',
  'pressure_source',
  'visibility_before_m',
  'visibility_after_m',
  'ceiling_before_ft',
  'ceiling_after_ft',
  'precip_intensity',
] as const;
export type EventColumn = (typeof EVENT_COLUMNS)[number];
export type RecordValue = string | number | boolean | null | string[];
/** One event as a record: the contract columns, and the wind-unit and runway columns when asked for (recordColumns). */
export type EventRecord = Record<EventColumn, RecordValue> & Record<string, RecordValue>;

/** Wind units for tables and CSV (JSON keeps m/s), with the factor to m/s (NIST SP 811 via physics/constants.ts) and the key suffix. */
export const WIND_UNITS = {
  kt: { ms: KNOT_MS, suffix: 'kt' },
  'm/s': { ms: 1, suffix: 'ms' },
  mph: { ms: MPH_MS, suffix: 'mph' },
  'km/h': { ms: KMH_MS, suffix: 'kmh' },
} as const;
export type WindUnit = keyof typeof WIND_UNITS;

/** What the writers add to the contract columns. */
export interface RecordOptions {
  /** Unit of the extra wind columns (`wind_speed_before_kt`, …) and the runway columns; m/s when absent. JSON always uses m/s. */
  windUnit?: WindUnit;
}

/** The runway designators the events carry, in order of first appearance. */
function runwaysOf(events: readonly PassageEvent[]): string[] {
  const seen: string[] = [];
  for (const e of events) for (const r of e.operator?.runways ?? []) if (!seen.includes(r.runway)) seen.push(r.runway);
  return seen;
}

/**
 * The columns of a set of events: EVENT_COLUMNS, then (unit other than m/s) `wind_speed_before_U`,
 * `wind_speed_after_U`, `gust_max_U`, then per runway `rwy_R_crosswind_before_U`, `rwy_R_tailwind_before_U`,
 * `rwy_R_crosswind_after_U`, `rwy_R_tailwind_after_U` (U the unit suffix: kt, ms, mph, kmh).
 */
export function recordColumns(events: readonly PassageEvent[], opts: RecordOptions = {}): string[] {
  const u = WIND_UNITS[opts.windUnit ?? 'm/s'].suffix;
  const cols: string[] = [...EVENT_COLUMNS];
  if (u !== 'ms') cols.push(`wind_speed_before_${u}`, `wind_speed_after_${u}`, `gust_max_${u}`);
  for (const r of runwaysOf(events)) {
    const k = r.toLowerCase();
    cols.push(`rwy_${k}_crosswind_before_${u}`, `rwy_${k}_tailwind_before_${u}`, `rwy_${k}_crosswind_after_${u}`, `rwy_${k}_tailwind_after_${u}`);
  }
  return cols;
}

const NO_OPERATOR: OperatorFields = {
  tempBeforeC: NaN, tempAfterC: NaN, dewpointBeforeC: NaN, dewpointAfterC: NaN, tempMin6hC: NaN, tempMin12hC: NaN,
  freezeTimeMs: NaN, precipBefore6h: false, precipTypes: [], precipHeavy: false, precipIntensity: null, windSpeedBeforeMs: NaN, pressureSource: 'none',
  visibilityBeforeM: NaN, visibilityAfterM: NaN, ceilingBeforeFt: NaN, ceilingAfterFt: NaN,
};

/**
 * A ceiling for output: whole feet, `none` for no ceiling (+Infinity), null when not known.
 * @example ceilingValue(Infinity) // 'none'
 */
export function ceilingValue(ft: number): number | string | null {
  return ft === Infinity ? 'none' : roundOrNull(ft, 0);
}

/**
 * Epoch ms → `YYYY-MM-DDTHH:MM:SSZ` (ISO 8601 UTC, no fraction); null when not finite.
 * @example isoUtc(Date.UTC(2026, 2, 4, 12, 35)) // '2026-03-04T12:35:00Z'
 */
export function isoUtc(ms: number): string | null {
  if (!Number.isFinite(ms)) return null;
  const d = new Date(ms);
  if (Number.isNaN(d.getTime())) return null;
  return d.toISOString().slice(0, 19) + 'Z';
}

/**
 * Round half away from zero to `digits` decimals; null when not finite; never −0.
 * @example roundOrNull(-0.25, 1) // -0.3
 */
export function roundOrNull(x: number, digits: number): number | null {
  if (!Number.isFinite(x)) return null;
  const f = 10 ** digits;
  const r = (Math.sign(x) * Math.round(Math.abs(x) * f)) / f;
  return r === 0 ? 0 : r;
}

/**
 * One event as a flat record with the contract's snake_case keys, in contract order. Rounding:
 * 0.1 for °C, K, hPa, m/s, hours, km and K/100 km; whole degrees for wind; 0.01 for confidence; whole metres for
 * visibility and whole feet for ceiling (`none`: no ceiling).
 */
export function eventToRecord(e: PassageEvent, opts: RecordOptions = {}): EventRecord {
  const o = e.operator ?? NO_OPERATOR;
  const unit = WIND_UNITS[opts.windUnit ?? 'm/s'];
  const w = (ms: number) => roundOrNull(ms / unit.ms, 1);
  const rec: EventRecord = {
    station: e.station,
    kind: e.kind,
    time: isoUtc(e.timeMs),
    time_earliest: isoUtc(e.timeEarliestMs),
    time_latest: isoUtc(e.timeLatestMs),
    time_basis: e.timeBasis,
    wind_shift_time: isoUtc(e.windShiftTimeMs),
    change_start_time: isoUtc(e.changeStartTimeMs),
    confidence: roundOrNull(e.confidence, 2),
    temp_change_c: roundOrNull(e.tempChangeC, 1),
    dewpoint_change_c: roundOrNull(e.dewpointChangeC, 1),
    theta_e_change_k: roundOrNull(e.thetaEChangeK, 1),
    pressure_min_hpa: roundOrNull(e.pressureMinHpa, 1),
    pressure_min_time: isoUtc(e.pressureMinTimeMs),
    pressure_rise_3h_hpa: roundOrNull(e.pressureRise3hHpa, 1),
    wind_before_deg: roundOrNull(e.windBeforeDeg, 0),
    wind_after_deg: roundOrNull(e.windAfterDeg, 0),
    wind_turn_deg: roundOrNull(e.windTurnDeg, 0),
    wind_speed_after_ms: roundOrNull(e.windSpeedAfterMs, 1),
    gust_max_ms: roundOrNull(e.gustMaxMs, 1),
    precip_near: e.precipNear,
    zone_start: isoUtc(e.zoneStartMs),
    zone_end: isoUtc(e.zoneEndMs),
    zone_hours: roundOrNull(e.zoneHours, 1),
    zone_depth_km: roundOrNull(e.zoneDepthKm, 1),
    gradient_k_per_100km: roundOrNull(e.gradientKPer100km, 1),
    observer_fropa_time: isoUtc(e.observerFropaTimeMs),
    evidence: [...e.evidence],
    temp_before_c: roundOrNull(o.tempBeforeC, 1),
    temp_after_c: roundOrNull(o.tempAfterC, 1),
    dewpoint_before_c: roundOrNull(o.dewpointBeforeC, 1),
    dewpoint_after_c: roundOrNull(o.dewpointAfterC, 1),
    temp_min_6h_c: roundOrNull(o.tempMin6hC, 1),
    temp_min_12h_c: roundOrNull(o.tempMin12hC, 1),
    freeze_time: isoUtc(o.freezeTimeMs),
    precip_before_6h: e.operator ? o.precipBefore6h : null,
    precip_types: [...o.precipTypes],
    precip_heavy: e.operator ? o.precipHeavy : null,
    wind_speed_before_ms: roundOrNull(o.windSpeedBeforeMs, 1),
    pressure_source: e.operator ? o.pressureSource : null,
    visibility_before_m: roundOrNull(o.visibilityBeforeM, 0),
    visibility_after_m: roundOrNull(o.visibilityAfterM, 0),
    ceiling_before_ft: ceilingValue(o.ceilingBeforeFt),
    ceiling_after_ft: ceilingValue(o.ceilingAfterFt),
    precip_intensity: o.precipIntensity,
  };
  if (unit.suffix !== 'ms') {
    rec[`wind_speed_before_${unit.suffix}`] = w(o.windSpeedBeforeMs);
    rec[`wind_speed_after_${unit.suffix}`] = w(e.windSpeedAfterMs);
    rec[`gust_max_${unit.suffix}`] = w(e.gustMaxMs);
  }
  for (const r of o.runways ?? []) {
    const k = `rwy_${r.runway.toLowerCase()}`;
    rec[`${k}_crosswind_before_${unit.suffix}`] = w(r.crosswindBeforeMs);
    rec[`${k}_tailwind_before_${unit.suffix}`] = w(r.tailwindBeforeMs);
    rec[`${k}_crosswind_after_${unit.suffix}`] = w(r.crosswindAfterMs);
    rec[`${k}_tailwind_after_${unit.suffix}`] = w(r.tailwindAfterMs);
  }
  return rec;
}

/** A cell text a spreadsheet reads as a plain number (left as it is, so negative numbers stay numbers). */
const PLAIN_NUMBER = /^[+-]?(\d+(\.\d*)?|\.\d+)([eE][+-]?\d+)?$/;
/** First characters that make a spreadsheet treat a cell as a formula (OWASP "CSV Injection": = + - @ tab CR). */
const FORMULA_START = /^[=+\-@\t\r]/;

/**
 * Neutralise a text cell that a spreadsheet would execute: a cell starting with `=`, `+`, `-`, `@`, tab or CR gets a
 * leading `'` (the prefix the OWASP "CSV Injection" guidance recommends); plain numbers (`-3.5`, `+2`) are left as
 * they are.
 * @example neutraliseFormula('=HYPERLINK("x")') // "'=HYPERLINK(\"x\")"
 */
export function neutraliseFormula(s: string): string {
  return FORMULA_START.test(s) && !PLAIN_NUMBER.test(s) ? `'${s}` : s;
}

/**
 * One CSV cell: formula-like text neutralised (neutraliseFormula), then quoted when it holds a comma, double quote,
 * CR or LF, with inner quotes doubled (RFC 4180 §2 rules 6 and 7). null → empty cell; arrays joined with `; `.
 * Numbers and booleans are written as they are.
 * @example csvCell('a "b", c') // '"a ""b"", c"'
 */
export function csvCell(v: RecordValue): string {
  if (v === null) return '';
  const s = Array.isArray(v) ? v.join('; ') : typeof v === 'string' ? neutraliseFormula(v) : String(v);
  const t = Array.isArray(v) ? neutraliseFormula(s) : s;
  return /[",\r\n]/.test(t) ? `"${t.replace(/"/g, '""')}"` : t;
}

/**
 * Evidence lines for a CSV cell: the leading `+ ` / `− ` of each line (criteria that held / failed) become the words
 * `held:` / `failed:`, so no cell begins with a sign a spreadsheet could read as a formula.
 * @example evidenceForCsv(['+ wind veered', '− no trough']) // ['held: wind veered', 'failed: no trough']
 */
export function evidenceForCsv(lines: readonly string[]): string[] {
  return lines.map((l) => (l.startsWith('+ ') ? 'held: ' + l.slice(2) : l.startsWith('− ') || l.startsWith('- ') ? 'failed: ' + l.slice(2) : l));
}

/**
 * Events as CSV: a header row of EVENT_COLUMNS, then one row per event; no comment lines.
 * Quoting follows RFC 4180 §2; lines end in LF (not the CRLF of RFC 4180 §2 rule 1) so that
 * line-based Unix tools see clean last cells; every common CSV reader accepts both.
 */
export function eventsToCsv(events: readonly PassageEvent[], opts: RecordOptions = {}): string {
  const cols = recordColumns(events, opts);
  const lines = [cols.join(',')];
  for (const e of events) {
    const r = eventToRecord(e, opts);
    r.evidence = evidenceForCsv(e.evidence);
    lines.push(cols.map((c) => csvCell(r[c] ?? null)).join(','));
  }
  return lines.join('\n') + '\n';
}

/** Events as newline-delimited JSON: one record object per line (winds in m/s, the unit in each key). */
export function eventsToNdjson(events: readonly PassageEvent[]): string {
  return [...eventsToNdjsonPieces(events)].join('');
}

/** {@link eventsToNdjson} in pieces of `perPiece` lines (for writing a large output without holding it whole). */
export function* eventsToNdjsonPieces(events: readonly PassageEvent[], perPiece = 1000): Generator<string> {
  for (let i = 0; i < events.length; i += perPiece) {
    let piece = '';
    for (const e of events.slice(i, i + perPiece)) piece += JSON.stringify(eventToRecord(e)) + '\n';
    yield piece;
  }
}

/** Events as one JSON array of records (one record per line, for readable diffs; winds in m/s, the unit in each key). */
export function eventsToJson(events: readonly PassageEvent[]): string {
  if (events.length === 0) return '[]\n';
  return '[\n' + events.map((e) => '  ' + JSON.stringify(eventToRecord(e))).join(',\n') + '\n]\n';
}

export interface TableOptions {
  /** IANA zone for the time columns; UTC when absent. */
  zone?: string;
  /** Every station read, so stations without events get a summary line too. */
  stations?: readonly string[];
  /** Unit of the wind speeds, gusts and runway components; m/s when absent. */
  windUnit?: WindUnit;
}

/** Short table labels of the pressure sources. */
const PRESSURE_LABEL: Record<OperatorFields['pressureSource'], string> = {
  station: 'station',
  'station-from-altimeter': 'stn<-alt',
  altimeter: 'altimeter',
  'sea-level': 'sea-level',
  none: '-',
};

/** Pad cells to aligned columns; numeric columns right-aligned. */
export function alignColumns(header: readonly string[], rows: readonly string[][], rightAligned: readonly boolean[]): string[] {
  // (loops, not Math.max(...cells) or [...rows]: a spread of 100,000+ values overflows the call stack)
  const width = header.map((h) => h.length);
  for (const r of rows) for (let i = 0; i < width.length; i++) if (r[i]!.length > width[i]!) width[i] = r[i]!.length;
  const fmt = (cells: readonly string[]) =>
    cells
      .map((c, i) => (rightAligned[i] ? c.padStart(width[i]!) : c.padEnd(width[i]!)))
      .join('  ')
      .trimEnd();
  const out = [fmt(header), fmt(width.map((w) => '-'.repeat(w)))];
  for (const r of rows) out.push(fmt(r));
  return out;
}

function num(x: number, digits: number, signed = false): string {
  const r = roundOrNull(x, digits);
  if (r === null) return '-';
  const s = r.toFixed(digits);
  return signed && r > 0 ? '+' + s : s;
}

/** A ceiling for the table: whole feet, `none` for no ceiling, `-` when not known. */
function cig(ft: number): string {
  return ft === Infinity ? 'none' : num(ft, 0);
}

function clock(ms: number, zone: string | undefined, withDate: boolean): string {
  if (!Number.isFinite(ms)) return '-';
  const d = DateTime.fromMillis(ms, { zone: zone ?? 'utc' });
  return d.toFormat(withDate ? 'yyyy-MM-dd HH:mm' : 'HH:mm');
}

/** Per-station lines (`ID  n events: 2 cold-front, 1 wind-shift`) and a closing count line. */
export function summaryLines(events: readonly PassageEvent[], stations: readonly string[] = []): string[] {
  const byStation = new Map<string, Map<string, number>>();
  for (const s of stations) byStation.set(s, new Map());
  for (const e of events) {
    let m = byStation.get(e.station);
    if (!m) byStation.set(e.station, (m = new Map()));
    m.set(e.kind, (m.get(e.kind) ?? 0) + 1);
  }
  const ids = [...byStation.keys()].sort();
  const w = Math.max(0, ...ids.map((s) => s.length));
  const lines: string[] = [];
  let withEvents = 0;
  for (const id of ids) {
    const m = byStation.get(id)!;
    const n = [...m.values()].reduce((a, b) => a + b, 0);
    if (n > 0) withEvents++;
    const kinds = [...m.entries()].sort((a, b) => b[1] - a[1] || (a[0] < b[0] ? -1 : 1)).map(([k, c]) => `${c} ${k}`);
    lines.push(`${id.padEnd(w)}  ${n === 0 ? 'no passages' : `${n} passage${n === 1 ? '' : 's'}: ${kinds.join(', ')}`}`);
  }
  const total = events.length;
  lines.push(`${total} passage${total === 1 ? '' : 's'} at ${withEvents} of ${ids.length} station${ids.length === 1 ? '' : 's'}`);
  return lines;
}

/**
 * Events as an aligned table for people, units in the headers, then per-station summary lines,
 * a count line and the safety caution as the last line.
 */
export function eventsToTable(events: readonly PassageEvent[], opts: TableOptions = {}): string {
  const zoneName = opts.zone ?? 'UTC';
  const unitName = opts.windUnit ?? 'm/s';
  const perMs = WIND_UNITS[unitName].ms;
  const header = [
    'station',
    'kind',
    `time (${zoneName})`,
    '± min',
    'conf',
    'ΔT °C',
    'ΔTd °C',
    'Δθe K',
    'p min hPa',
    'Δp 3h hPa',
    'wind °',
    'turn °',
    `speed ${unitName}`,
    `gust ${unitName}`,
    'precip',
    'zone h',
    'zone km',
    'observer',
    'T °C',
    'Td °C',
    'Tmin 12h',
    'freeze',
    'wx near',
    'pressure',
    'vis km',
    'ceiling ft',
  ];
  const right = [false, false, false, true, true, true, true, true, true, true, false, true, false, true, false, true, true, false, false, false, true, false, false, false, false, false];
  const rows = events.map((e) => {
    const o = e.operator;
    const pair = (a: number | undefined, b: number | undefined, d: number) =>
      Number.isFinite(a) || Number.isFinite(b) ? `${num(a ?? NaN, d)}→${num(b ?? NaN, d)}` : '-';
    const halfWindowMin = (e.timeLatestMs - e.timeEarliestMs) / 2 / 60000;
    const wind =
      Number.isFinite(e.windBeforeDeg) || Number.isFinite(e.windAfterDeg) ? `${num(e.windBeforeDeg, 0)}→${num(e.windAfterDeg, 0)}` : '-';
    return [
      e.station,
      e.kind,
      clock(e.timeMs, opts.zone, true),
      num(halfWindowMin, 0),
      num(e.confidence, 2),
      num(e.tempChangeC, 1, true),
      num(e.dewpointChangeC, 1, true),
      num(e.thetaEChangeK, 1, true),
      num(e.pressureMinHpa, 1),
      num(e.pressureRise3hHpa, 1, true),
      wind,
      num(e.windTurnDeg, 0, true),
      pair(o ? o.windSpeedBeforeMs / perMs : NaN, e.windSpeedAfterMs / perMs, 0),
      num(e.gustMaxMs / perMs, 1),
      e.precipNear ? (o?.precipBefore6h ? 'yes, before' : 'yes') : o?.precipBefore6h ? 'before' : 'no',
      num(e.zoneHours, 1),
      num(e.zoneDepthKm, 1),
      Number.isFinite(e.observerFropaTimeMs) ? clock(e.observerFropaTimeMs, opts.zone, false) : '',
      pair(o?.tempBeforeC, o?.tempAfterC, 1),
      pair(o?.dewpointBeforeC, o?.dewpointAfterC, 1),
      num(o?.tempMin12hC ?? NaN, 1),
      o && Number.isFinite(o.freezeTimeMs) ? clock(o.freezeTimeMs, opts.zone, false) : '-',
      o && o.precipTypes.length ? (o.precipIntensity ? o.precipIntensity + ' ' : '') + o.precipTypes.join('+') : '-',
      o ? PRESSURE_LABEL[o.pressureSource] : '-',
      pair(o ? o.visibilityBeforeM / 1000 : NaN, o ? o.visibilityAfterM / 1000 : NaN, 1),
      o && (o.ceilingBeforeFt === o.ceilingBeforeFt || o.ceilingAfterFt === o.ceilingAfterFt) ? `${cig(o.ceilingBeforeFt)}→${cig(o.ceilingAfterFt)}` : '-',
    ];
  });
  const runwayLines: string[] = [];
  for (const e of events) {
    for (const r of e.operator?.runways ?? []) {
      const c = (x: number) => num(x / perMs, 0, true);
      runwayLines.push(
        `${e.station}  ${clock(e.timeMs, opts.zone, true)}  rwy ${r.runway} (${r.headingDeg}°): cross ${c(r.crosswindBeforeMs)} → ${c(r.crosswindAfterMs)}, tail ${c(r.tailwindBeforeMs)} → ${c(r.tailwindAfterMs)} ${unitName}`,
      );
    }
  }
  const out: string[] = [];
  // (loops, not push(...lines): a spread of 100,000+ lines overflows the call stack)
  if (rows.length) {
    for (const l of alignColumns(header, rows, right)) out.push(l);
    out.push('');
  } else out.push('no passages found', '');
  if (rows.length) {
    out.push(
      'T, Td: median of the hour before → 1–3 h after; Tmin 12h and freeze (first report ≤ 0 °C): in the 12 h after;',
      'precip "before": in the 6 h before; pressure: the pressure the p columns were measured on (stn<-alt: station pressure from the altimeter setting).',
      'vis, ceiling: lower median of the hour before → 1–3 h after (ceiling: lowest BKN/OVC/VV layer; none: no ceiling).',
      '',
    );
  }
  if (runwayLines.length) {
    out.push(`Runway wind components (${unitName}; cross + from the right; tail − is a headwind), before → after the shift:`);
    for (const l of runwayLines) out.push(l);
    out.push('');
  }
  for (const l of summaryLines(events, opts.stations ?? [])) out.push(l);
  out.push(CAUTION);
  return out.join('\n') + '\n';
}
