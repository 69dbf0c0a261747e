/**
 * The period and stations a report shows: ISO 8601 bounds, the stations asked for, and the passages inside.
 * Pure; bad values throw UsageError with a message that names the option (`label`) and shows an example.
 */
import { UsageError, type PassageEvent, type StationSeries } from '../model/index.js';
import { utcMinute } from './html/timeAxis.js';

const HOUR_MS = 3_600_000;
const MINUTE_MS = 60_000;

/**
 * An ISO 8601 date or date-time, epoch ms UTC: `2026-03-02`, `2026-03-02T06:00Z`, `2026-03-02 06:00:30+01:00`.
 * Without an offset it is UTC. A date alone is its 00:00 UTC, or with `endOfDay` the last minute of that day
 * (23:59). Throws UsageError naming `label` for text that is not such a date or not a valid calendar date.
 * @example parsePeriodTime('2026-03-02', '--to', true) // Date.UTC(2026, 2, 2, 23, 59)
 */
export function parsePeriodTime(text: string, label: string, endOfDay = false): number {
  const s = text.trim();
  const m = /^(\d{4})-(\d{2})-(\d{2})(?:[T ](\d{2}):(\d{2})(?::(\d{2}))?)?\s*(Z|[+-]\d{2}:?\d{2})?$/i.exec(s);
  if (!m) throw new UsageError(`${label} "${s}" must be an ISO date or time, e.g. 2026-03-02 or 2026-03-02T06:00Z`);
  const [, y, mo, d, hh, mi, ss, off] = m;
  let t = Date.UTC(+y!, +mo! - 1, +d!, hh ? +hh : 0, mi ? +mi : 0, ss ? +ss : 0);
  const check = new Date(t);
  if (check.getUTCMonth() !== +mo! - 1 || check.getUTCDate() !== +d! || (hh !== undefined && (+hh > 23 || +mi! > 59))) {
    throw new UsageError(`${label} "${s}" is not a valid date or time`);
  }
  if (off && off.toUpperCase() !== 'Z') {
    const sign = off[0] === '-' ? -1 : 1;
    const digits = off.slice(1).replace(':', '');
    t -= sign * (+digits.slice(0, 2) * 60 + +digits.slice(2)) * MINUTE_MS;
  }
  if (endOfDay && hh === undefined) t += 24 * HOUR_MS - MINUTE_MS;
  return t;
}

/**
 * The series of the wanted stations (all when `wanted` is null), sorted by id. Throws UsageError (`--station: …`)
 * naming any wanted station without data and the stations that were read.
 */
export function selectStations(series: readonly StationSeries[], wanted: ReadonlySet<string> | null): StationSeries[] {
  if (wanted) {
    const known = new Set(series.map((s) => s.station));
    const unknown = [...wanted].filter((id) => !known.has(id));
    if (unknown.length) throw new UsageError(`--station: no data for ${unknown.join(', ')}; stations read: ${[...known].sort().join(', ')}`);
  }
  return series.filter((s) => !wanted || wanted.has(s.station)).sort((a, b) => (a.station < b.station ? -1 : a.station > b.station ? 1 : 0));
}

/**
 * Why the period [fromMs, toMs] shows nothing of these series (the text of the message), or null when it overlaps
 * their data. Empty series are ignored; undefined bounds are open.
 */
export function periodOutsideData(series: readonly StationSeries[], fromMs: number | undefined, toMs: number | undefined): string | null {
  const shown = series.filter((s) => s.length > 0);
  const first = Math.min(...shown.map((s) => s.timeMs[0]!));
  const last = Math.max(...shown.map((s) => s.timeMs[s.length - 1]!));
  if ((fromMs !== undefined && fromMs > last) || (toMs !== undefined && toMs < first)) {
    return `no observations between ${fromMs !== undefined ? utcMinute(fromMs) : 'the start'} and ${toMs !== undefined ? utcMinute(toMs) : 'the end'} UTC; the data run from ${utcMinute(first)} to ${utcMinute(last)} UTC`;
  }
  return null;
}

/** The passages at these series' stations within [fromMs, toMs] (bounds inclusive; undefined bounds are open). */
export function eventsInPeriod(events: readonly PassageEvent[], series: readonly StationSeries[], fromMs?: number, toMs?: number): PassageEvent[] {
  const stations = new Set(series.map((s) => s.station));
  return events.filter((e) => stations.has(e.station) && (fromMs === undefined || e.timeMs >= fromMs) && (toMs === undefined || e.timeMs <= toMs));
}
