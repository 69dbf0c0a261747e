/**
 * Output writers for a verification: one flat record per forecast (hit or false alarm) and per missed
 * passage, as CSV and JSON, and a table for people. Pure functions: result in, text out.
 *
 * Record contract (CSV header order, JSON key order; times ISO 8601 UTC; missing = empty cell / null):
 * station, kind (forecast kind; for a miss the observed kind; empty for a forecast of any front),
 * forecast_time, issued_time, lead_hours, observed_time, observed_kind, error_min (forecast − observed,
 * positive = forecast late), outcome (`hit`, `false-alarm`, `miss`).
 */
import { DateTime } from 'luxon';
import { CAUTION } from '../report/caution.js';
import { alignColumns, csvCell, isoUtc, roundOrNull, type RecordValue } from '../report/format.js';
import type { ForecastPassage } from './forecasts.js';
import type { VerifiedPair, VerifyResult, VerifyScores } from './verify.js';
import { MS_PER_HOUR } from '../physics/constants.js';

export const VERIFY_COLUMNS = ['station', 'kind', 'forecast_time', 'issued_time', 'lead_hours', 'observed_time', 'observed_kind', 'error_min', 'outcome'] as const;
export type VerifyColumn = (typeof VERIFY_COLUMNS)[number];
export type VerifyRecord = Record<VerifyColumn, RecordValue>;

/** The sign convention, as printed in the table header. */
export const TIMING_CONVENTION = 'timing error = forecast − observed, minutes; positive = forecast late, negative = forecast early';

function forecastPart(f: ForecastPassage) {
  return {
    station: f.station,
    kind: f.kind ?? '',
    forecast_time: isoUtc(f.forecastMs),
    issued_time: isoUtc(f.issuedMs),
    lead_hours: roundOrNull((f.forecastMs - f.issuedMs) / MS_PER_HOUR, 1),
  };
}

/**
 * Records in station, then time order (forecast time; observed time for misses): every hit and false
 * alarm, then the misses interleaved by time.
 */
export function verificationRecords(r: VerifyResult): VerifyRecord[] {
  const rows: { t: number; rec: VerifyRecord }[] = [];
  for (const p of r.pairs) {
    rows.push({
      t: p.forecast.forecastMs,
      rec: { ...forecastPart(p.forecast), observed_time: isoUtc(p.event.timeMs), observed_kind: p.event.kind, error_min: roundOrNull(p.errorMin, 0), outcome: 'hit' },
    });
  }
  for (const f of r.falseAlarms) rows.push({ t: f.forecastMs, rec: { ...forecastPart(f), observed_time: null, observed_kind: null, error_min: null, outcome: 'false-alarm' } });
  for (const e of r.misses) {
    rows.push({
      t: e.timeMs,
      rec: { station: e.station, kind: e.kind, forecast_time: null, issued_time: null, lead_hours: null, observed_time: isoUtc(e.timeMs), observed_kind: e.kind, error_min: null, outcome: 'miss' },
    });
  }
  rows.sort((a, b) => {
    const sa = String(a.rec.station);
    const sb = String(b.rec.station);
    return sa < sb ? -1 : sa > sb ? 1 : a.t - b.t;
  });
  return rows.map((x) => x.rec);
}

/** Records as CSV (RFC 4180 quoting, LF line ends, as eventsToCsv). */
export function verificationToCsv(r: VerifyResult): string {
  const lines = [VERIFY_COLUMNS.join(',')];
  for (const rec of verificationRecords(r)) lines.push(VERIFY_COLUMNS.map((c) => csvCell(rec[c])).join(','));
  return lines.join('\n') + '\n';
}

/** Records as one JSON array, one record per line. */
export function verificationToJson(r: VerifyResult): string {
  const recs = verificationRecords(r);
  if (recs.length === 0) return '[]\n';
  return '[\n' + recs.map((x) => '  ' + JSON.stringify(x)).join(',\n') + '\n]\n';
}

function num(x: number, digits: number, signed = false): string {
  const v = roundOrNull(x, digits);
  if (v === null) return '-';
  const s = v.toFixed(digits);
  return signed && v > 0 ? '+' + s : s;
}

const clock = (ms: number) => (Number.isFinite(ms) ? DateTime.fromMillis(ms, { zone: 'utc' }).toFormat('yyyy-MM-dd HH:mm') : '-');

function scoreCells(s: VerifyScores): string[] {
  return [
    String(s.hits),
    Number.isNaN(s.misses) ? '-' : String(s.misses),
    String(s.falseAlarms),
    num(s.pod, 2),
    num(s.far, 2),
    num(s.csi, 2),
    num(s.bias, 2),
    num(s.timingErrorMeanMin, 0, true),
    num(s.timingErrorMedianMin, 0, true),
    num(s.timingErrorMaeMin, 0),
    num(s.p90AbsMin, 0),
    `${s.nLate}/${s.nEarly}`,
  ];
}

const SCORE_HEADER = ['hits', 'misses', 'false al.', 'POD', 'FAR', 'CSI', 'bias', 'mean min', 'median min', 'MAE min', 'p90 |err|', 'late/early'];

export interface VerifyTableContext {
  /** Forecast file name and count of forecasts read. */
  forecastFile?: string;
  /** Observed passages detected (all kinds, all stations). */
  observedCount?: number;
}

/**
 * A table for people: a header line with the window, kinds and the sign convention; scores per
 * station and overall; scores per lead-time bin; the list of hits, false alarms and misses; near
 * misses of another kind; the caution as the last line.
 */
export function verificationToTable(r: VerifyResult, ctx: VerifyTableContext = {}): string {
  const out: string[] = [];
  const nF = r.pairs.length + r.falseAlarms.length;
  out.push(
    `Forecast verification: ${nF} forecast${nF === 1 ? '' : 's'}${ctx.forecastFile ? ` (${ctx.forecastFile})` : ''} at ${r.byStation.size} station${r.byStation.size === 1 ? '' : 's'}` +
      `${ctx.observedCount !== undefined ? ` against ${ctx.observedCount} observed passages` : ''}; window ±${r.windowHours} h; kinds ${r.kinds.join(', ') || '-'}`,
  );
  out.push(`Sign: ${TIMING_CONVENTION}; POD, FAR (false-alarm ratio), CSI, bias per Wilks (2011) ch. 8`);
  if (r.excluded.length) out.push(`${r.excluded.length} forecast${r.excluded.length === 1 ? '' : 's'} of other kinds left out (--kinds)`);
  out.push('');
  const right = [false, ...SCORE_HEADER.map(() => true)];
  const stationRows = [...r.byStation.entries()].map(([s, sc]) => [s, ...scoreCells(sc)]);
  stationRows.push(['all', ...scoreCells(r.scores)]);
  const st = alignColumns(['station', ...SCORE_HEADER], stationRows, right);
  out.push(...st.slice(0, -1), st[1]!, st[st.length - 1]!, '');
  if (r.byLeadTime.size) {
    const lt = [...r.byLeadTime.entries()].map(([b, sc]) => [b, ...scoreCells(sc)]);
    out.push('By lead time (forecast − issued; a miss has no lead time, so POD, CSI and bias are not defined per bin):');
    const header = ['lead', ...SCORE_HEADER];
    const keep = [0, 1, 3, 5, 8, 9, 10, 11, 12];
    out.push(...alignColumns(keep.map((i) => header[i]!), lt.map((row) => keep.map((i) => row[i]!)), keep.map((i) => right[i]!)), '');
  }
  const listRows: string[][] = [];
  const line = (p: { station: string; kind: string; f: number; i: number; o: number; ok: string; err: number; outcome: string }) =>
    listRows.push([p.station, p.kind, clock(p.f), clock(p.i), num((p.f - p.i) / MS_PER_HOUR, 1), clock(p.o), p.ok, num(p.err, 0, true), p.outcome]);
  const recs: { t: number; s: string; fn: () => void }[] = [];
  for (const p of r.pairs) {
    recs.push({ t: p.forecast.forecastMs, s: p.forecast.station, fn: () => line({ station: p.forecast.station, kind: p.forecast.kind ?? 'any', f: p.forecast.forecastMs, i: p.forecast.issuedMs, o: p.event.timeMs, ok: p.event.kind, err: p.errorMin, outcome: 'hit' }) });
  }
  for (const f of r.falseAlarms) recs.push({ t: f.forecastMs, s: f.station, fn: () => line({ station: f.station, kind: f.kind ?? 'any', f: f.forecastMs, i: f.issuedMs, o: NaN, ok: '', err: NaN, outcome: 'false alarm' }) });
  for (const e of r.misses) recs.push({ t: e.timeMs, s: e.station, fn: () => line({ station: e.station, kind: e.kind, f: NaN, i: NaN, o: e.timeMs, ok: e.kind, err: NaN, outcome: 'miss' }) });
  recs.sort((a, b) => (a.s < b.s ? -1 : a.s > b.s ? 1 : a.t - b.t)).forEach((x) => x.fn());
  if (listRows.length) {
    out.push(
      ...alignColumns(['station', 'forecast kind', 'forecast (UTC)', 'issued (UTC)', 'lead h', 'observed (UTC)', 'observed kind', 'error min', 'outcome'], listRows, [
        false, false, false, false, true, false, false, true, false,
      ]),
      '',
    );
  }
  if (r.kindMismatches.length) {
    out.push('False alarms with a passage of another kind within the window (kinds are strict; counted as false alarms):');
    for (const p of r.kindMismatches) out.push(`  ${mismatchLine(p)}`);
    out.push('');
  }
  out.push(CAUTION);
  return out.join('\n') + '\n';
}

function mismatchLine(p: VerifiedPair): string {
  return `${p.forecast.station} ${p.forecast.kind} forecast ${clock(p.forecast.forecastMs)}: observed ${p.event.kind} at ${clock(p.event.timeMs)} (${num(p.errorMin, 0, true)} min)`;
}
