/** Time ticks and the time axis of the report's charts, UTC. */
import { escapeXml } from './escape.js';
import { px } from './linePath.js';

const HOUR = 3_600_000;
/** Tick steps tried, hours: whole hours that divide a day, then days and weeks. */
const STEPS_H = [1, 2, 3, 6, 12, 24, 48, 96, 168, 336];
const MONTHS = ['Jan', 'Feb', 'Mar', 'Apr', 'May', 'Jun', 'Jul', 'Aug', 'Sep', 'Oct', 'Nov', 'Dec'];

/**
 * Tick times (epoch ms) at whole UTC hours, the smallest step from 1 h up to 2 weeks that gives at most
 * `maxTicks` ticks in [t0, t1]. Steps of a day or more fall on 00 UTC (multi-day steps count days since
 * 1970-01-01, so the ticks do not depend on the window).
 * @example timeTicks(Date.UTC(2026, 2, 1, 0), Date.UTC(2026, 2, 1, 12), 5).map((t) => new Date(t).getUTCHours()) // [0, 3, 6, 9, 12]
 */
export function timeTicks(t0: number, t1: number, maxTicks: number): number[] {
  if (!(t1 > t0) || !(maxTicks >= 1)) return [];
  for (const h of STEPS_H) {
    const step = h * HOUR;
    const first = Math.ceil(t0 / step) * step;
    const n = Math.floor((t1 - first) / step) + 1;
    if (n <= maxTicks || h === STEPS_H[STEPS_H.length - 1]) {
      const out: number[] = [];
      for (let t = first; t <= t1; t += step) out.push(t);
      return out;
    }
  }
  return [];
}

/**
 * Tick label: `HH:MM` for ticks within a day; the date (`2 Mar`) at 00 UTC, and on its own for steps of a day
 * or more.
 * @example timeLabel(Date.UTC(2026, 2, 2, 6), 3 * 3_600_000) // '06:00'
 * @example timeLabel(Date.UTC(2026, 2, 2, 0), 3 * 3_600_000) // '2 Mar'
 */
export function timeLabel(t: number, stepMs: number): string {
  const d = new Date(t);
  const hh = d.getUTCHours();
  const mm = d.getUTCMinutes();
  if ((hh === 0 && mm === 0) || stepMs >= 24 * HOUR) return `${d.getUTCDate()} ${MONTHS[d.getUTCMonth()]}`;
  return `${String(hh).padStart(2, '0')}:${String(mm).padStart(2, '0')}`;
}

/**
 * `YYYY-MM-DD HH:MM` UTC (no seconds), '' when not finite.
 * @example utcMinute(Date.UTC(2026, 2, 2, 14, 21, 30)) // '2026-03-02 14:21'
 */
export function utcMinute(ms: number): string {
  if (!Number.isFinite(ms)) return '';
  return new Date(ms).toISOString().slice(0, 16).replace('T', ' ');
}

export interface TimeAxisLayout {
  /** Time → x pixel. */
  x: (t: number) => number;
  t0: number;
  t1: number;
  /** Top and bottom of the grid lines, px. */
  top: number;
  bottom: number;
  /** Baseline of the tick labels, px. */
  labelY: number;
  maxTicks: number;
}

/**
 * SVG of a time axis: light vertical grid lines from `top` to `bottom` (darker at 00 UTC) and tick labels
 * below. Returns the grid (drawn first) and the labels separately.
 */
export function timeAxisSvg(a: TimeAxisLayout): { grid: string; labels: string } {
  const ticks = timeTicks(a.t0, a.t1, a.maxTicks);
  const step = ticks.length > 1 ? ticks[1]! - ticks[0]! : 24 * HOUR;
  let day = '';
  let other = '';
  let labels = '';
  for (const t of ticks) {
    const x = px(a.x(t));
    const seg = `M${x},${px(a.top)}V${px(a.bottom)}`;
    if (t % (24 * HOUR) === 0) day += seg;
    else other += seg;
    labels += `<text x="${x}" y="${px(a.labelY)}" text-anchor="middle">${escapeXml(timeLabel(t, step))}</text>`;
  }
  const grid = (other ? `<path class="grid" d="${other}"/>` : '') + (day ? `<path class="grid day" d="${day}"/>` : '');
  return { grid, labels: `<g class="tick-labels">${labels}</g>` };
}
