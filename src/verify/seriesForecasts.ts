/**
 * Forecast passages from forecast point series (e.g. model output at a station): the passages the same
 * detector found in the forecast series become ForecastPassage records, and each station's series span
 * (clipped to the observations) becomes a coverage period, so forecast and observed passages are
 * measured with one yardstick. Pure: detected events and spans in, forecasts, coverage and a report out.
 */
import { addIssue, newFileReport, type FileReport, type PassageEvent, type StationSeries } from '../model/index.js';
import type { ForecastPassage } from './forecasts.js';
import type { CoveragePeriod } from './verify.js';

/** One forecast series at a station: its span and the file it was read from. */
export interface ForecastSeriesSpan {
  station: string;
  firstMs: number;
  lastMs: number;
  /** File the series came from (for messages). */
  file: string;
  /** File and 1-based line of the report nearest a time (for messages); default: `file`, line 1. */
  sourceAt?: (timeMs: number) => { file: string; line: number };
}

/**
 * Spans of loaded series, with the source line of the report nearest a time (binary search).
 * @example seriesSpans([]) // []
 */
export function seriesSpans(series: readonly StationSeries[]): ForecastSeriesSpan[] {
  return series
    .filter((s) => s.length > 0)
    .map((s) => {
      const at = (t: number) => {
        let lo = 0;
        let hi = s.length - 1;
        while (lo < hi) {
          const mid = (lo + hi) >> 1;
          if (s.timeMs[mid]! < t) lo = mid + 1;
          else hi = mid;
        }
        if (lo > 0 && Math.abs(s.timeMs[lo - 1]! - t) <= Math.abs(s.timeMs[lo]! - t)) lo--;
        return { file: s.files[s.fileIndex[lo]!] ?? s.station, line: s.line[lo]! };
      };
      return { station: s.station, firstMs: s.timeMs[0]!, lastMs: s.timeMs[s.length - 1]!, file: s.files[s.fileIndex[0]!] ?? s.station, sourceAt: at };
    });
}

/**
 * Turn the passages detected in forecast series into forecasts and coverage periods. A series at a
 * station without observations is reported (`unknown-station`) and left out; a detected passage
 * outside the observed period of its station is reported (`outside-observations`) and left out. The
 * issued time is unknown (lead bin `unknown`); the kind is the detected kind.
 * @example seriesForecasts([], [{ station: 'A', firstMs: 0, lastMs: 10, file: 's.csv' }], new Map([['A', [0, 5]]]), 'model').coverage[0].toMs // 5
 */
export function seriesForecasts(
  events: readonly PassageEvent[],
  spans: readonly ForecastSeriesSpan[],
  observedSpans: ReadonlyMap<string, readonly [number, number]>,
  source: string,
): { forecasts: ForecastPassage[]; coverage: CoveragePeriod[]; report: FileReport } {
  const report = newFileReport(source, 'forecast-series');
  const coverage: CoveragePeriod[] = [];
  const clip = new Map<string, [number, number, ForecastSeriesSpan]>();
  for (const s of [...spans].sort((a, b) => (a.station < b.station ? -1 : a.station > b.station ? 1 : 0))) {
    const obs = observedSpans.get(s.station);
    report.lines++;
    const where = s.sourceAt?.(s.firstMs) ?? { file: s.file, line: 1 };
    if (!obs) {
      addIssue(report, { ...where, reason: 'unknown-station', message: `forecast series for station ${s.station} has no observations to verify against; check the id` });
      continue;
    }
    const fromMs = Math.max(s.firstMs, obs[0]);
    const toMs = Math.min(s.lastMs, obs[1]);
    if (!(fromMs <= toMs)) {
      addIssue(report, { ...where, reason: 'outside-observations', message: `forecast series for ${s.station} does not overlap its observations` });
      continue;
    }
    report.parsed++;
    clip.set(s.station, [fromMs, toMs, s]);
    coverage.push({ source, station: s.station, fromMs, toMs });
  }
  const forecasts: ForecastPassage[] = [];
  const sorted = [...events].sort((a, b) => (a.station < b.station ? -1 : a.station > b.station ? 1 : a.timeMs - b.timeMs));
  for (const e of sorted) {
    const c = clip.get(e.station);
    if (!c) continue;
    report.lines++;
    const where = c[2].sourceAt?.(e.timeMs) ?? { file: c[2].file, line: 1 };
    if (e.timeMs < c[0] || e.timeMs > c[1]) {
      addIssue(report, { ...where, reason: 'outside-observations', message: `forecast ${e.kind} at ${e.station} ${new Date(e.timeMs).toISOString()} lies outside the observed period; not verified` });
      continue;
    }
    report.parsed++;
    forecasts.push({ station: e.station, kind: e.kind, forecastMs: e.timeMs, issuedMs: NaN, validFromMs: c[0], validToMs: c[1], source, ...where });
  }
  return { forecasts, coverage, report };
}
