/**
 * What `fropa inspect` reports: per input file how it was read (format, counts, rejections by reason,
 * units, column mapping, notes) and, for the stations found in it, period, cadence, duplicates,
 * observer remarks, QC flags and metadata. Pure: built from the loader's reports and series.
 */
import type { FileReport, ParseIssue, StationSeries } from '../model/index.js';
import { medianCadenceMinutes } from '../series/series.js';
import type { QcSummary } from '../qc/qc.js';
import { isoUtc, roundOrNull } from './format.js';

/** One station's details as inspect shows them (snake_case: this is also the JSON shape). */
export interface InspectStation {
  station: string;
  name: string | null;
  first: string | null;
  last: string | null;
  reports: number;
  median_cadence_min: number | null;
  /** Reports dropped or merged because another report of the station had the same time (all kinds below). */
  duplicates: number;
  /** Of these: repeats with the same values (counted, not listed). */
  identical_duplicates: number;
  /** Of these: reports replaced by their correction (COR). */
  corrections: number;
  /** Of these: reports with different values at the same time, each with the rule that chose the kept one. */
  conflicts: InspectConflict[];
  observer_remarks: number;
  /** Flag counts keyed `field:test`. */
  qc_flags: Record<string, number>;
  qc_total: number;
  lat: number | null;
  lon: number | null;
  elevation_m: number | null;
  /** Files the station's observations came from (including reports dropped as duplicates). */
  files: string[];
}

/** Two reports of one station and time with different values: which was kept and why (SeriesBuilder.build). */
export interface InspectConflict {
  time: string;
  kept_file: string;
  kept_line: number;
  dropped_file: string;
  dropped_line: number;
  /** The rule that chose: `correction`, `more values`, `report type` or `values tie-break`. */
  reason: string;
}

/** One input file as inspect shows it (also the JSON shape; one object per file). */
export interface InspectFile {
  file: string;
  format: string;
  lines: number;
  parsed: number;
  rejected: number;
  rejected_by_reason: Record<string, number>;
  units: Record<string, string>;
  columns: Record<string, string>;
  notes: string[];
  /** What the reader assumed rather than read (units by convention, UTC by convention, zone, ids from the file name). */
  assumed: string[];
  /** Which rule gave the station ids (station column, METAR text, file name or its leading token), when known. */
  station_id_rule: string | null;
  /** The first issues kept by the reader (all are counted in `rejected_by_reason`). */
  issues: ParseIssue[];
  /** Stations with at least one observation from this file. */
  stations: string[];
  station_details: InspectStation[];
}

/** Details for one series. */
export function inspectStation(s: StationSeries, qc?: QcSummary): InspectStation {
  const m = s.meta;
  return {
    station: s.station,
    name: m?.name ?? null,
    first: s.length ? isoUtc(s.timeMs[0]!) : null,
    last: s.length ? isoUtc(s.timeMs[s.length - 1]!) : null,
    reports: s.length,
    median_cadence_min: roundOrNull(medianCadenceMinutes(s.timeMs), 1),
    duplicates: s.duplicates.length,
    identical_duplicates: s.duplicates.filter((d) => d.action === 'identical-dropped').length,
    corrections: s.duplicates.filter((d) => d.action === 'correction-replaced').length,
    conflicts: s.duplicates
      .filter((d) => d.action === 'conflict-resolved')
      .map((d) => ({ time: isoUtc(d.timeMs) ?? '', kept_file: d.file, kept_line: d.keptLine, dropped_file: d.droppedFile, dropped_line: d.droppedLine, reason: d.reason ?? '' })),
    observer_remarks: s.remarks.length,
    qc_flags: { ...(qc?.flagged ?? {}) },
    qc_total: qc?.total ?? 0,
    lat: roundOrNull(m?.latDeg ?? NaN, 4),
    lon: roundOrNull(m?.lonDeg ?? NaN, 4),
    elevation_m: roundOrNull(m?.elevationM ?? NaN, 1),
    // also the files whose reports were all dropped as duplicates of reports in other files
    files: [...new Set([...s.files, ...s.duplicates.map((d) => d.droppedFile)])],
  };
}

/** Combine file reports and series into one record per file, stations attached to the files they came from. */
export function buildInspect(reports: readonly FileReport[], series: readonly StationSeries[], qc: ReadonlyMap<string, QcSummary>): InspectFile[] {
  return inspectFiles(reports, series.map((s) => inspectStation(s, qc.get(s.station))));
}

/** {@link buildInspect} from the stations' details (as a streamed run keeps them instead of the series). */
export function inspectFiles(reports: readonly FileReport[], details: readonly InspectStation[]): InspectFile[] {
  return reports.map((r) => {
    const here = details.filter((d) => d.files.includes(r.file));
    return {
      file: r.file,
      format: r.format,
      lines: r.lines,
      parsed: r.parsed,
      rejected: r.rejected,
      rejected_by_reason: { ...r.rejectedByReason },
      units: { ...r.units },
      columns: { ...(r.columns ?? {}) },
      notes: [...r.notes],
      station_id_rule: r.stationIdRule ?? null,
      assumed: [...(r.assumed ?? [])],
      issues: r.issues.map((i) => ({ ...i })),
      stations: here.map((d) => d.station),
      station_details: here,
    };
  });
}

/** `file:line: reason: message` */
export function issueLine(i: ParseIssue): string {
  return `${i.file}:${i.line}: ${i.reason}: ${i.message}`;
}

/** `time: kept file:line over file:line (reason)` */
export function conflictLine(c: InspectConflict): string {
  const dropped = c.dropped_file === c.kept_file ? `line ${c.dropped_line}` : `${c.dropped_file}:${c.dropped_line}`;
  return `${c.time}: kept ${c.kept_file}:${c.kept_line} over ${dropped} (${c.reason})`;
}

function coordinates(d: InspectStation): string {
  if (d.lat === null || d.lon === null) return 'no coordinates';
  const lat = `${Math.abs(d.lat).toFixed(3)}°${d.lat < 0 ? 'S' : 'N'}`;
  const lon = `${Math.abs(d.lon).toFixed(3)}°${d.lon < 0 ? 'W' : 'E'}`;
  return `${lat} ${lon}${d.elevation_m === null ? '' : `, ${d.elevation_m} m`}`;
}

const counts = (rec: Record<string, number>) =>
  Object.entries(rec)
    .sort((a, b) => b[1] - a[1] || (a[0] < b[0] ? -1 : 1))
    .map(([k, n]) => `${k} ${n}`)
    .join(', ');

/** Inspect records as text for people: one block per file, then one block per station, then a count line. */
export function inspectToTable(files: readonly InspectFile[], maxIssues = 5): string {
  const out: string[] = [];
  const row = (label: string, value: string) => out.push(`  ${label.padEnd(10)} ${value}`);
  const more = (value: string) => out.push(`  ${''.padEnd(10)} ${value}`);
  for (const f of files) {
    out.push(f.file);
    row('format', f.format);
    row('lines', `${f.lines} (parsed ${f.parsed}, rejected ${f.rejected})`);
    if (f.rejected > 0) {
      row('rejected', counts(f.rejected_by_reason));
      const shown = f.issues.slice(0, maxIssues);
      for (const i of shown) more(issueLine(i));
      if (shown.length > 0 && f.rejected > shown.length) more(`… ${f.rejected - shown.length} more`);
    }
    const units = Object.entries(f.units).map(([k, u]) => `${k} ${u}`);
    if (units.length) row('units', units.join(', '));
    const cols = Object.entries(f.columns).map(([h, field]) => `${h}→${field}`);
    if (cols.length) row('columns', cols.join(', '));
    f.notes.forEach((n, i) => (i === 0 ? row('notes', n) : more(n)));
    if (f.stations.length) row('stations', f.stations.join(', '));
    if (f.station_id_rule) row('ids from', f.station_id_rule);
    out.push('');
  }
  const seen = new Map<string, InspectStation>();
  for (const f of files) for (const d of f.station_details) if (!seen.has(d.station)) seen.set(d.station, d);
  for (const d of [...seen.values()].sort((a, b) => (a.station < b.station ? -1 : a.station > b.station ? 1 : 0))) {
    out.push(`station ${d.station}${d.name ? ` (${d.name})` : ''}`);
    row('where', coordinates(d));
    row('period', `${d.first ?? '-'} to ${d.last ?? '-'}`);
    row('reports', `${d.reports}, median cadence ${d.median_cadence_min ?? '-'} min, ${d.duplicates} duplicate time(s), ${d.observer_remarks} observer remark(s)`);
    if (d.conflicts.length) {
      row('conflicts', `${d.conflicts.length} time(s) with differing reports (kept by rule, the other's values fill its gaps):`);
      for (const c of d.conflicts.slice(0, maxIssues)) more(conflictLine(c));
      if (d.conflicts.length > maxIssues) more(`… ${d.conflicts.length - maxIssues} more (--format json lists all)`);
    }
    row('qc flags', d.qc_total === 0 ? 'none' : counts(d.qc_flags));
    out.push('');
  }
  out.push(summaryLine(files));
  return out.join('\n') + '\n';
}

/**
 * The one-line summary of a load that `inspect` ends with and `detect`, `verify` and `report` print on standard
 * error: files, lines parsed, rejected (by reason), stations, then what was assumed rather than read (with the
 * number of files) and the duplicate times resolved (how many had differing values).
 * @example summaryLine(files) // '2 file(s), 120 line(s) parsed, 1 rejected (bad-time 1), 2 station(s); assumed: units by convention (2 files); 3 duplicate time(s)'
 */
export function summaryLine(files: readonly InspectFile[]): string {
  const parsed = files.reduce((a, f) => a + f.parsed, 0);
  const rejected = files.reduce((a, f) => a + f.rejected, 0);
  const reasons: Record<string, number> = {};
  for (const f of files) for (const [k, n] of Object.entries(f.rejected_by_reason)) reasons[k] = (reasons[k] ?? 0) + n;
  const stations = new Map<string, InspectStation>();
  for (const f of files) for (const d of f.station_details) if (!stations.has(d.station)) stations.set(d.station, d);
  const assumed = new Map<string, number>();
  for (const f of files) for (const a of f.assumed ?? []) assumed.set(a, (assumed.get(a) ?? 0) + 1);
  const dups = [...stations.values()].reduce((a, d) => a + d.duplicates, 0);
  const conflicts = [...stations.values()].reduce((a, d) => a + d.conflicts.length, 0);
  let line = `${files.length} file(s), ${parsed} line(s) parsed, ${rejected} rejected${rejected > 0 ? ` (${counts(reasons)})` : ''}, ${stations.size} station(s)`;
  const zoneless = reasons['needs-zone'] ?? 0;
  if (zoneless > 0) line += `; ${zoneless} line(s) have local times and no zone: give --tz ZONE or --utc-offset MINUTES, or a stations file with the station's tz (for local standard time, its lat and lon will do)`;
  if (assumed.size) line += `; assumed: ${[...assumed].map(([a, n]) => `${a} (${n} file${n === 1 ? '' : 's'})`).join(', ')}`;
  if (dups > 0) line += `; ${dups} duplicate time(s)${conflicts > 0 ? ` (${conflicts} with differing values, resolved by rule: inspect lists them)` : ''}`;
  return line;
}

/** `fropa: no usable data in …` plus the first issues and notes that say why, each naming its file. */
export function noDataMessage(paths: readonly string[], reports: readonly FileReport[]): string {
  const lines = [`fropa: no usable data in ${paths.join(', ')}`];
  for (const r of reports) {
    if (r.format === 'stations') continue;
    const reasons = Object.entries(r.rejectedByReason).map(([k, n]) => `${k} ${n}`);
    lines.push(`  ${r.file}: ${r.format}, ${r.parsed} parsed, ${r.rejected} rejected${reasons.length ? ` (${reasons.join(', ')})` : ''}${r.issues.length === 0 && r.notes.length ? `; ${r.notes[0]}` : ''}`);
    for (const i of r.issues.slice(0, 3)) lines.push(`  ${issueLine(i)}`);
  }
  return lines.join('\n') + '\n';
}
