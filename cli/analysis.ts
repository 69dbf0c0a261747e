/**
 * What `detect`, `report` and `season` share around the analysis: the `--jobs` value, the run of the
 * analysis with progress, and how station failures are reported and turned into an exit status:
 * 0 every station analysed; 3 some stations failed (each named on standard error with its reason, then a
 * summary line) while others gave results; 1 nothing usable remains (every station failed).
 */
import { analyseSeriesParallel, defaultJobs, UsageError, type Analysis, type ParallelAnalyseOptions, type StationFailure, type StationSeries } from '../src/index.js';
import type { CliIo } from './options.js';

/** Exit status when some stations failed and were skipped while others gave results. */
export const EXIT_SOME_FAILED = 3;

/** `--jobs N`: a whole number of at least 1 (default: the number of cores). */
export function parseJobs(v: unknown): number {
  if (v === undefined) return defaultJobs();
  const x = Number(Array.isArray(v) ? v[v.length - 1] : v);
  if (!(Number.isInteger(x) && x >= 1 && x <= 1024)) throw new UsageError('--jobs must be a whole number from 1 to 1024 (worker threads for detection)');
  return x;
}

/** A progress bar of detection: `start` once the stations and rows are known, then one `onStation` per station. */
export interface ProgressBar {
  start: (stations: number, rows: number, files: number) => void;
  onStation: (done: number, total: number, rows: number) => void;
  stop: () => void;
}

/**
 * A progress bar of detection on `io.progress` (a terminal; cli-progress): stations done, rows, rate and time
 * left. Null (silent) when there is no terminal, under --quiet or CI.
 */
export async function progressBar(io: CliIo, quiet: boolean): Promise<ProgressBar | null> {
  if (!io.progress || quiet || process.env.CI) return null;
  const { SingleBar } = (await import('cli-progress')).default;
  let bar: InstanceType<typeof SingleBar> | null = null;
  let t0 = Date.now();
  let rows = 0;
  return {
    start: (stations, totalRows, files) => {
      bar = new SingleBar({
        stream: io.progress,
        format: `detect {bar} {value}/{total} stations | {rowsDone}/${totalRows.toLocaleString('en-US')} rows of ${files} files | {rate} rows/s | {eta_formatted} left`,
        barCompleteChar: '#',
        barIncompleteChar: '.',
        hideCursor: true,
        clearOnComplete: true,
        etaBuffer: 50,
      });
      t0 = Date.now();
      bar.start(stations, 0, { rowsDone: '0', rate: '-' });
    },
    onStation: (done, _total, n) => {
      rows += n;
      const sec = (Date.now() - t0) / 1000;
      bar?.update(done, { rowsDone: rows.toLocaleString('en-US'), rate: sec > 0 ? Math.round(rows / sec).toLocaleString('en-US') : '-' });
    },
    stop: () => bar?.stop(),
  };
}

/** Run the analysis (with a progress bar on a terminal); station failures are written to standard error (always, also under --quiet). */
export async function runAnalysis(series: readonly StationSeries[], opts: ParallelAnalyseOptions, io: CliIo, progress?: { files: number; quiet: boolean }): Promise<Analysis> {
  const bar = progress ? await progressBar(io, progress.quiet) : null;
  bar?.start(series.length, series.reduce((a, s) => a + s.length, 0), progress!.files);
  let a: Analysis;
  try {
    a = await analyseSeriesParallel(series, bar ? { ...opts, onStation: bar.onStation } : opts);
  } finally {
    bar?.stop();
  }
  reportFailures(a.failures, io);
  return a;
}

/** Each failed station on standard error (always, also under --quiet). */
export function reportFailures(failures: readonly StationFailure[], io: CliIo): void {
  for (const f of failures) io.stderr(`fropa: station ${f.station} skipped: ${f.reason}\n`);
}

/** One line summing up the failures (empty string when none). */
export function failureSummary(failures: readonly StationFailure[], stations: number): string {
  if (failures.length === 0) return '';
  const ids = failures.slice(0, 10).map((f) => f.station).join(', ');
  const more = failures.length > 10 ? `, … (${failures.length - 10} more)` : '';
  return `fropa: ${failures.length} of ${stations} station${stations === 1 ? '' : 's'} failed and ${failures.length === 1 ? 'was' : 'were'} skipped (${ids}${more}); the results cover the other stations (exit status ${EXIT_SOME_FAILED})\n`;
}

/**
 * The exit status after an analysis: 1 when every station failed (after writing that nothing usable
 * remains), 3 when some failed (after the summary line), else 0.
 */
export function analysisStatus(a: Analysis, stations: number, io: CliIo): number {
  if (a.failures.length === 0) return 0;
  if (a.failures.length >= stations) {
    io.stderr(`fropa: detection failed at every station (${stations}); nothing usable remains\n`);
    return 1;
  }
  io.stderr(failureSummary(a.failures, stations));
  return EXIT_SOME_FAILED;
}
