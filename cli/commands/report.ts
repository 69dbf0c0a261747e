/** `fropa report <paths...>`: detect passages and track fronts as `detect` does, then write one self-contained HTML page. */
import { loadPaths } from '../../src/pipeline.js';
import type { StationMeta } from '../../src/model/index.js';
import { analyseSeries } from '../../src/pipeline.js';
import { CAUTION } from '../../src/report/caution.js';
import { reportHtml } from '../../src/report/html/reportHtml.js';
import { ArgumentError, STDIN_TOKEN, inputArgs, resolveLoadOptions, writeOutput, type CliIo } from '../options.js';
import { utcMinute } from '../../src/report/html/timeAxis.js';
import { detectOptions, parseKinds } from './detect.js';
import { noDataMessage } from './inspect.js';

/**
 * `--from`/`--to`: an ISO 8601 date or date-time; without an offset it is UTC. A date alone is its 00:00 UTC
 * (for `--to`, the end of that day). Throws ArgumentError.
 */
export function parseReportTime(v: unknown, name: string, endOfDay = false): number | undefined {
  if (v === undefined) return undefined;
  const s = String(Array.isArray(v) ? v[v.length - 1] : v).trim();
  const m = /^(\d{4})-(\d{2})-(\d{2})(?:[T ](\d{2}):(\d{2})(?::(\d{2}))?)?\s*(Z|[+-]\d{2}:?\d{2})?$/i.exec(s);
  if (!m) throw new ArgumentError(`${name} "${s}" must be an ISO date or time, e.g. 2026-03-02 or 2026-03-02T06:00Z`);
  const [, y, mo, d, hh, mi, ss, off] = m;
  let t = Date.UTC(+y!, +mo! - 1, +d!, hh ? +hh : 0, mi ? +mi : 0, ss ? +ss : 0);
  const check = new Date(t);
  if (check.getUTCMonth() !== +mo! - 1 || check.getUTCDate() !== +d! || (hh !== undefined && (+hh > 23 || +mi! > 59))) {
    throw new ArgumentError(`${name} "${s}" is not a valid date or time`);
  }
  if (off && off.toUpperCase() !== 'Z') {
    const sign = off[0] === '-' ? -1 : 1;
    const digits = off.slice(1).replace(':', '');
    t -= sign * (+digits.slice(0, 2) * 60 + +digits.slice(2)) * 60000;
  }
  if (endOfDay && hh === undefined) t += 24 * 3_600_000 - 60000;
  return t;
}

/** `--station A --station B,C` → set of ids (null when absent). */
function parseStations(v: unknown): Set<string> | null {
  if (v === undefined) return null;
  const ids = (Array.isArray(v) ? v : [v]).flatMap((s) => String(s).split(',')).map((s) => s.trim()).filter(Boolean);
  if (!ids.length) throw new ArgumentError('--station needs a station id, e.g. --station XAVN');
  return new Set(ids);
}

/** Run report; returns the exit code (1 when no station has data). */
export async function run(raw: Record<string, unknown>, io: CliIo): Promise<number> {
  const args = inputArgs(raw);
  const kinds = parseKinds(raw.kinds);
  const dopts = detectOptions(raw);
  const fromMs = parseReportTime(raw.from, '--from');
  const toMs = parseReportTime(raw.to, '--to', true);
  if (fromMs !== undefined && toMs !== undefined && !(toMs > fromMs)) throw new ArgumentError('--to must be later than --from');
  const wanted = parseStations(raw.station);
  const opts = await resolveLoadOptions(args, io);
  const result = loadPaths(args.paths, opts);
  if (result.series.length === 0) {
    io.stderr(noDataMessage(args.paths, result.reports));
    return 1;
  }
  if (wanted) {
    const known = new Set(result.series.map((s) => s.station));
    const unknown = [...wanted].filter((id) => !known.has(id));
    if (unknown.length) throw new ArgumentError(`--station: no data for ${unknown.join(', ')}; stations read: ${[...known].sort().join(', ')}`);
  }
  const shownSeries = result.series.filter((s) => (!wanted || wanted.has(s.station)) && s.length > 0);
  const first = Math.min(...shownSeries.map((s) => s.timeMs[0]!));
  const last = Math.max(...shownSeries.map((s) => s.timeMs[s.length - 1]!));
  if ((fromMs !== undefined && fromMs > last) || (toMs !== undefined && toMs < first)) {
    io.stderr(`fropa: no observations between ${fromMs !== undefined ? utcMinute(fromMs) : 'the start'} and ${toMs !== undefined ? utcMinute(toMs) : 'the end'} UTC; the data run from ${utcMinute(first)} to ${utcMinute(last)} UTC\n`);
    return 1;
  }
  // Detection and tracking on all the data (context outside the period helps), as in `fropa detect`.
  const { events, tracks } = analyseSeries(result.series, { ...dopts, network: raw.network !== false, kinds });
  const series = [...result.series].filter((s) => !wanted || wanted.has(s.station)).sort((a, b) => (a.station < b.station ? -1 : a.station > b.station ? 1 : 0));
  const files = result.reports
    .filter((f) => f.format !== 'skipped' && f.format !== 'stations')
    .map((f) => ({ file: f.file, format: f.format, parsed: f.parsed, rejected: f.rejected }));
  const metas = result.series.map((s) => s.meta).filter((m): m is StationMeta => m !== undefined);
  const html = reportHtml({ series, events, tracks, stations: metas, files, fromMs, toMs, caution: CAUTION });
  const rawOut = raw.out as string | undefined;
  const out = rawOut === undefined ? 'report.html' : rawOut;
  await writeOutput(html, out, io);
  if (out !== '-' && out !== STDIN_TOKEN) {
    const n = events.filter((e) => series.some((s) => s.station === e.station) && (fromMs === undefined || e.timeMs >= fromMs) && (toMs === undefined || e.timeMs <= toMs)).length;
    io.stdout(`wrote ${out} (${(Buffer.byteLength(html) / 1024).toFixed(0)} KiB): ${series.length} station${series.length === 1 ? '' : 's'}, ${n} passage${n === 1 ? '' : 's'}\n${CAUTION}\n`);
  }
  return 0;
}
