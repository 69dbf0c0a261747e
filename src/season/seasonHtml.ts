/**
 * The season section of the HTML report (`fropa report --season`): the network's passages by kind and calendar
 * month, and by hour of the day (UTC, and local mean solar time where station longitudes are known), as inline SVG
 * bar charts with their numbers in tables. Pure: a summary in, HTML text out.
 */
import { BOUNDARY_KINDS } from '../model/index.js';
import { barFigure, type BarChartInput } from '../report/html/barChartSvg.js';
import { escapeXml } from '../report/html/escape.js';
import { kindClass } from '../report/html/palette.js';
import type { ReportSection } from '../report/html/reportHtml.js';
import type { SeasonSummary } from './season.js';

const MONTHS = ['Jan', 'Feb', 'Mar', 'Apr', 'May', 'Jun', 'Jul', 'Aug', 'Sep', 'Oct', 'Nov', 'Dec'];
const HOURS = Array.from({ length: 24 }, (_, h) => String(h).padStart(2, '0'));

/**
 * The season section: passages by kind and month (stacked by kind, in the kinds' report colours) and passages by
 * hour of the day. Months are those of the UTC date of each passage (season.ts).
 */
export function seasonSection(s: SeasonSummary): ReportSection {
  const net = s.network;
  const kinds = BOUNDARY_KINDS.filter((k) => net.byKindMonth[k].some((n) => n > 0));
  const byMonth: BarChartInput = {
    id: 'season-months',
    title: 'Passages by kind and month',
    categories: MONTHS,
    series: kinds.map((k) => ({ label: k, cls: kindClass(k), values: net.byKindMonth[k] })),
    yLabel: 'passages',
  };
  const hourUtc: BarChartInput = {
    id: 'season-hours-utc',
    title: 'Passages by hour of the day (UTC)',
    categories: HOURS,
    series: [{ label: 'passages', cls: 'b-count', values: net.hourUtc }],
    yLabel: 'passages',
    labelEvery: 3,
  };
  const solarCounted = net.hourSolar.reduce((a, b) => a + b, 0);
  const hourSolar: BarChartInput = { ...hourUtc, id: 'season-hours-solar', title: 'Passages by hour of local mean solar time', series: [{ label: 'passages', cls: 'b-count', values: net.hourSolar }] };
  const span = Number.isFinite(s.sinceMs) || Number.isFinite(s.untilMs) ? ` from ${iso(s.sinceMs)} to ${iso(s.untilMs)}` : '';
  let html = `<p>${net.passages} passage${net.passages === 1 ? '' : 's'} at ${s.stations.length} station${s.stations.length === 1 ? '' : 's'}${escapeXml(span)}; ${s.fronts.fronts} front${s.fronts.fronts === 1 ? '' : 's'} tracked across the network. Counts as in <code>fropa season</code>.</p>`;
  html += barFigure(byMonth, 'month', 'Each bar is one calendar month (UTC date of the passage), stacked by kind in the colours the passage charts give the kinds.');
  html += barFigure(hourUtc, 'hour (UTC)', 'Bar hh holds the passages from hh:00 to hh:59 UTC.');
  if (solarCounted > 0) html += barFigure(hourSolar, 'hour (solar)', `Local mean solar time = UTC + longitude / 15 h (${solarCounted} passages at stations with a known longitude).`);
  return { id: 'season', title: 'Season', html };
}

function iso(ms: number): string {
  return Number.isFinite(ms) ? new Date(ms).toISOString().slice(0, 16).replace('T', ' ') + ' UTC' : '…';
}
