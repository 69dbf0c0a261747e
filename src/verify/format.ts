/**
 * Output writers for a verification: one flat record per forecast of every issue (hit or false alarm)
 * and per passage an issue missed, as CSV and JSON, and a table for people. Pure functions: result in,
 * text out.
 *
 * Record contract (CSV header order, JSON key order; times ISO 8601 UTC; missing = empty cell / null):
 * station, kind (forecast kind; for a miss the observed kind; empty for a forecast of any front),
 * forecast_time, issued_time (of the issue; also for a miss), lead_hours (forecast − issued; for a miss
 * observed − issued), observed_time, observed_kind, error_min (forecast − observed, positive = forecast
 * late), outcome (`hit`, `false-alarm`, `miss`), then source (forecast file or series path), valid_from,
 * valid_to (the issue's valid window; empty when it covers only ±window around its forecasts), lead_bin,
 * headline (true when the record counts in the headline: the latest issue before the passage).
 */
import { DateTime } from 'luxon';
import { CAUTION } from '../report/caution.js';
import { alignColumns, csvCell, isoUtc, roundOrNull, type RecordValue } from '../report/format.js';
import type { Interval } from './bootstrap.js';
import { CI_SCORES, type CiScore, type VerifiedOutcome, type VerifiedPair, type VerifyResult, type VerifyScores } from './verify.js';

export const VERIFY_COLUMNS = [
  'station', 'kind', 'forecast_time', 'issued_time', 'lead_hours', 'observed_time', 'observed_kind', 'error_min', 'outcome',
  'source', 'valid_from', 'valid_to', 'lead_bin', 'headline',
] as const;
export type VerifyColumn = (typeof VERIFY_COLUMNS)[number];
export type VerifyRecord = Record<VerifyColumn, RecordValue>;

/** The sign convention, as printed in the table header. */
export const TIMING_CONVENTION = 'timing error = forecast − observed, minutes; positive = forecast late, negative = forecast early';

function outcomeRecord(o: VerifiedOutcome): VerifyRecord {
  return {
    station: o.station,
    kind: o.forecast ? (o.forecast.kind ?? '') : o.kind,
    forecast_time: o.forecast ? isoUtc(o.forecast.forecastMs) : null,
    issued_time: isoUtc(o.issuedMs),
    lead_hours: roundOrNull(o.leadHours, 1),
    observed_time: o.event ? isoUtc(o.event.timeMs) : null,
    observed_kind: o.event ? o.event.kind : null,
    error_min: roundOrNull(o.errorMin, 0),
    outcome: o.outcome,
    source: o.source,
    valid_from: isoUtc(o.validFromMs),
    valid_to: isoUtc(o.validToMs),
    lead_bin: o.leadBin,
    headline: o.headline,
  };
}

/** Records of every issue's outcomes, in station, then time order (forecast time; observed time for misses). */
export function verificationRecords(r: VerifyResult): VerifyRecord[] {
  return r.outcomes.map(outcomeRecord);
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

const SCORE_FIELDS: [string, keyof VerifyScores, number][] = [
  ['hits', 'hits', 0], ['misses', 'misses', 0], ['false_alarms', 'falseAlarms', 0], ['pod', 'pod', 3], ['far', 'far', 3], ['csi', 'csi', 3], ['bias', 'bias', 3],
  ['error_mean_min', 'timingErrorMeanMin', 1], ['error_median_min', 'timingErrorMedianMin', 1], ['error_mae_min', 'timingErrorMaeMin', 1],
  ['error_rmse_min', 'timingErrorRmseMin', 1], ['error_p90_abs_min', 'p90AbsMin', 1], ['n_late', 'nLate', 0], ['n_early', 'nEarly', 0],
];
const CI_FIELD: Record<CiScore, string> = {
  pod: 'pod', far: 'far', csi: 'csi', bias: 'bias', timingErrorMeanMin: 'error_mean_min', timingErrorMedianMin: 'error_median_min',
  timingErrorMaeMin: 'error_mae_min', timingErrorRmseMin: 'error_rmse_min', p90AbsMin: 'error_p90_abs_min',
};

/** Columns of the scores CSV (`--format scores`). */
export const SCORE_COLUMNS = ['group', 'key', ...SCORE_FIELDS.map((f) => f[0]), ...CI_SCORES.flatMap((k) => [`${CI_FIELD[k]}_lo`, `${CI_FIELD[k]}_hi`])];

/**
 * Scores as CSV, one row per group: `all` (headline, with the bootstrap interval ends `*_lo`, `*_hi`),
 * `station`, `kind`, `source` (headline), `lead` (every issue). Missing = empty cell.
 */
export function verificationScoresToCsv(r: VerifyResult): string {
  const lines = [SCORE_COLUMNS.join(',')];
  const row = (group: string, key: string, sc: VerifyScores, iv?: Record<CiScore, Interval>) => {
    const cells: RecordValue[] = [group, key, ...SCORE_FIELDS.map(([, k, d]) => roundOrNull(sc[k], d))];
    for (const k of CI_SCORES) {
      const d = SCORE_FIELDS.find((f) => f[1] === k)![2];
      cells.push(iv ? roundOrNull(iv[k].lo, d) : null, iv ? roundOrNull(iv[k].hi, d) : null);
    }
    lines.push(cells.map(csvCell).join(','));
  };
  row('all', 'all', r.scores, r.intervals);
  for (const [k, sc] of r.byStation) row('station', k, sc);
  for (const [k, sc] of r.byKind) row('kind', k, sc);
  for (const [k, sc] of r.bySource) row('source', k, sc);
  for (const [k, sc] of r.byLeadTime) row('lead', k, sc);
  return lines.join('\n') + '\n';
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
    String(s.misses),
    String(s.falseAlarms),
    num(s.pod, 2),
    num(s.far, 2),
    num(s.csi, 2),
    num(s.bias, 2),
    num(s.timingErrorMeanMin, 0, true),
    num(s.timingErrorMedianMin, 0, true),
    num(s.timingErrorMaeMin, 0),
    num(s.timingErrorRmseMin, 0),
    num(s.p90AbsMin, 0),
    `${s.nLate}/${s.nEarly}`,
  ];
}

const SCORE_HEADER = ['hits', 'misses', 'false al.', 'POD', 'FAR', 'CSI', 'bias', 'mean min', 'median min', 'MAE min', 'RMSE min', 'p90 |err|', 'late/early'];

const CI_LABEL: Record<CiScore, [string, number, boolean]> = {
  pod: ['POD', 2, false],
  far: ['FAR', 2, false],
  csi: ['CSI', 2, false],
  bias: ['bias', 2, false],
  timingErrorMeanMin: ['mean', 0, true],
  timingErrorMedianMin: ['median', 0, true],
  timingErrorMaeMin: ['MAE', 0, false],
  timingErrorRmseMin: ['RMSE', 0, false],
  p90AbsMin: ['p90 |err|', 0, false],
};

/** `POD 0.99 [0.97, 1.00]`-style cells of the headline scores with their intervals. */
function ciCells(s: VerifyScores, iv: Record<CiScore, Interval>): string[] {
  return CI_SCORES.map((k) => {
    const [label, d, signed] = CI_LABEL[k];
    return `${label} ${num(s[k], d, signed)} [${num(iv[k].lo, d, signed)}, ${num(iv[k].hi, d, signed)}]${d === 0 ? ' min' : ''}`;
  });
}

export interface VerifyTableContext {
  /** Forecast file name(s) shown in the header. */
  forecastFile?: string;
  /** Observed passages detected (all kinds, all stations). */
  observedCount?: number;
  /** Forecast lines rejected, by file (shown in the header). */
  rejected?: readonly { file: string; rejected: number; byReason: Record<string, number> }[];
}

/**
 * A table for people: a header line with the window, kinds and the sign convention; headline scores
 * (latest issue before the passage) per station and overall, with bootstrap intervals; per kind and per
 * source; every issue by lead-time bin; the list of every outcome; near misses of another kind; the
 * caution as the last line.
 */
export function verificationToTable(r: VerifyResult, ctx: VerifyTableContext = {}): string {
  const out: string[] = [];
  const nF = r.outcomes.filter((o) => o.outcome !== 'miss').length;
  const nS = r.byStation.size;
  out.push(
    `Forecast verification: ${nF} forecast${nF === 1 ? '' : 's'} in ${r.issueCount} issue${r.issueCount === 1 ? '' : 's'}${ctx.forecastFile ? ` (${ctx.forecastFile})` : ''} at ${nS} station${nS === 1 ? '' : 's'}` +
      `${ctx.observedCount !== undefined ? ` against ${ctx.observedCount} observed passages` : ''}; window ±${r.windowHours} h; ` +
      `valid window ${r.validHours !== undefined ? `issued + ${r.validHours} h unless given` : 'as given, else ±window around each forecast'}; kinds ${r.kinds.join(', ') || '-'}`,
  );
  out.push(`Sign: ${TIMING_CONVENTION}; POD, FAR (false-alarm ratio), CSI, bias per Wilks (2011) ch. 8`);
  out.push('Matching: per issue and station, compatible kinds within the window, most pairs then least total |error| (Kuhn 1955 / Munkres 1957)');
  for (const rj of ctx.rejected ?? []) {
    if (rj.rejected) out.push(`${rj.file}: ${rj.rejected} forecast line${rj.rejected === 1 ? '' : 's'} rejected (${Object.entries(rj.byReason).map(([k, n]) => `${k} ${n}`).join(', ')})`);
  }
  if (r.excluded.length) out.push(`${r.excluded.length} forecast${r.excluded.length === 1 ? '' : 's'} of other kinds left out (--kinds)`);
  out.push('');
  const right = [false, ...SCORE_HEADER.map(() => true)];
  const table = (title: string, name: string, rows: [string, VerifyScores][], total?: VerifyScores) => {
    if (!rows.length) return;
    out.push(title);
    const cells = rows.map(([k, sc]) => [k, ...scoreCells(sc)]);
    if (total) cells.push(['all', ...scoreCells(total)]);
    const t = alignColumns([name, ...SCORE_HEADER], cells, right);
    out.push(...(total ? [...t.slice(0, -1), t[1]!, t[t.length - 1]!] : t), '');
  };
  table('Headline (latest issue before each passage), by station:', 'station', [...r.byStation.entries()], r.scores);
  if (r.intervals && r.bootstrap) {
    out.push(
      `${Math.round(r.bootstrap.level * 100)}% bootstrap intervals (percentile, ${r.bootstrap.resamples} resamples of the ${r.scores.hits + r.scores.misses + r.scores.falseAlarms} headline passages, seed ${r.bootstrap.seed}; Efron & Tibshirani 1993):`,
    );
    out.push('  ' + ciCells(r.scores, r.intervals).join('; '), '');
  }
  table('Headline by kind:', 'kind', [...r.byKind.entries()]);
  if (r.bySource.size > 1) table('Headline by source:', 'source', [...r.bySource.entries()]);
  table('Every issue by lead time (forecast − issued; a miss: observed − issued):', 'lead', [...r.byLeadTime.entries()]);
  const listRows: string[][] = [];
  for (const o of r.outcomes) {
    const f = o.forecast;
    listRows.push([
      o.station,
      f ? (f.kind ?? 'any') : (o.kind ?? ''),
      clock(f?.forecastMs ?? NaN),
      clock(o.issuedMs),
      num(o.leadHours, 1),
      clock(o.event?.timeMs ?? NaN),
      o.event?.kind ?? '',
      num(o.errorMin, 0, true),
      o.outcome === 'false-alarm' ? 'false alarm' : o.outcome,
      o.headline ? '*' : '',
    ]);
  }
  if (listRows.length) {
    out.push('Every outcome (* = counted in the headline):');
    out.push(
      ...alignColumns(['station', 'forecast kind', 'forecast (UTC)', 'issued (UTC)', 'lead h', 'observed (UTC)', 'observed kind', 'error min', 'outcome', 'headline'], listRows, [
        false, false, false, false, true, false, false, true, false, false,
      ]),
      '',
    );
  }
  if (r.kindMismatches.length) {
    out.push('Headline false alarms with a passage of another kind within the window (kinds are strict; counted as false alarms):');
    for (const p of r.kindMismatches) out.push(`  ${mismatchLine(p)}`);
    out.push('');
  }
  out.push(CAUTION);
  return out.join('\n') + '\n';
}

function mismatchLine(p: VerifiedPair): string {
  return `${p.forecast.station} ${p.forecast.kind} forecast ${clock(p.forecast.forecastMs)}: observed ${p.event.kind} at ${clock(p.event.timeMs)} (${num(p.errorMin, 0, true)} min)`;
}
