/**
 * Writers of the season summary: a long CSV (`scope, measure, bin, value`: one number per row, easy to
 * pivot), JSON, and a plain-text table per scope.
 */
import { BOUNDARY_KINDS } from '../model/index.js';
import { csvCell, roundOrNull } from '../report/format.js';
import { SECTORS, SEASON_MEASURES, type Distribution, type SeasonGroup, type SeasonSummary } from './season.js';

const MONTHS = ['Jan', 'Feb', 'Mar', 'Apr', 'May', 'Jun', 'Jul', 'Aug', 'Sep', 'Oct', 'Nov', 'Dec'];
const STATS = ['n', 'missing', 'min', 'p10', 'p25', 'median', 'p75', 'p90', 'max', 'mean'] as const;
const MEASURE_NAMES: Record<(typeof SEASON_MEASURES)[number], string> = {
  tempChangeC: 'temp_change_c',
  zoneHours: 'zone_hours',
  pressureRise3hHpa: 'pressure_rise_3h_hpa',
  gustMaxMs: 'gust_max_ms',
};

function groupRows(g: SeasonGroup): [string, string, string, number | null][] {
  const rows: [string, string, string, number | null][] = [[g.scope, 'passages', 'all', g.passages]];
  for (const k of BOUNDARY_KINDS) g.byKindMonth[k].forEach((n, m) => rows.push([g.scope, `passages_${k}`, String(m + 1).padStart(2, '0'), n]));
  g.hourUtc.forEach((n, h) => rows.push([g.scope, 'hour_utc', String(h).padStart(2, '0'), n]));
  g.hourSolar.forEach((n, h) => rows.push([g.scope, 'hour_solar', String(h).padStart(2, '0'), n]));
  for (const m of SEASON_MEASURES) for (const s of STATS) rows.push([g.scope, MEASURE_NAMES[m], s, roundOrNull(g.distributions[m][s], 2)]);
  return rows;
}

/** Long CSV: header `scope,measure,bin,value`; the network first, then each station; then the fronts. */
export function seasonToCsv(s: SeasonSummary): string {
  const rows = [...groupRows(s.network), ...s.stations.flatMap(groupRows)];
  rows.push(['network', 'fronts', 'all', s.fronts.fronts]);
  for (const st of STATS) rows.push(['network', 'front_speed_kmh', st, roundOrNull(s.fronts.speedKmh[st], 1)]);
  s.fronts.towardSector.forEach((n, i) => rows.push(['network', 'front_toward', SECTORS[i]!, n]));
  return ['scope,measure,bin,value', ...rows.map((r) => r.map((c) => csvCell(c)).join(','))].join('\n') + '\n';
}

/** JSON of the whole summary (non-finite statistics as null; the period as ISO times or null when open). */
export function seasonToJson(s: SeasonSummary): string {
  const iso = (t: number) => (Number.isFinite(t) ? new Date(t).toISOString() : null);
  return JSON.stringify({ ...s, sinceMs: undefined, untilMs: undefined, since: iso(s.sinceMs), until: iso(s.untilMs) }, (_k, v) => (typeof v === 'number' && !Number.isFinite(v) ? null : v), 2) + '\n';
}

const cell = (x: number, d = 1) => (Number.isFinite(x) ? x.toFixed(d) : '-');

function distLine(name: string, d: Distribution, unit: string): string {
  return `  ${name.padEnd(22)} n ${String(d.n).padStart(4)}  p10 ${cell(d.p10).padStart(6)}  median ${cell(d.median).padStart(6)}  p90 ${cell(d.p90).padStart(6)}  min ${cell(d.min).padStart(6)}  max ${cell(d.max).padStart(6)} ${unit}`;
}

function groupTable(g: SeasonGroup): string[] {
  const lines = [`${g.scope}: ${g.passages} passage${g.passages === 1 ? '' : 's'}`];
  const kinds = BOUNDARY_KINDS.filter((k) => g.byKindMonth[k].some((n) => n > 0));
  if (kinds.length) {
    lines.push(`  ${'kind'.padEnd(18)}${MONTHS.map((m) => m.padStart(5)).join('')}`);
    for (const k of kinds) lines.push(`  ${k.padEnd(18)}${g.byKindMonth[k].map((n) => String(n).padStart(5)).join('')}`);
  }
  lines.push(`  hour UTC    ${g.hourUtc.map((n) => String(n).padStart(3)).join('')}`);
  lines.push(`  hour solar  ${g.hourSolar.map((n) => String(n).padStart(3)).join('')}`);
  lines.push(distLine('temperature change', g.distributions.tempChangeC, '°C'));
  lines.push(distLine('zone', g.distributions.zoneHours, 'h'));
  lines.push(distLine('pressure rise in 3 h', g.distributions.pressureRise3hHpa, 'hPa'));
  lines.push(distLine('peak gust', g.distributions.gustMaxMs, 'm/s'));
  return lines;
}

/** Plain-text tables: the network, the fronts, then each station. Hours are 00…23 left to right. */
export function seasonToTable(s: SeasonSummary): string {
  const iso = (t: number) => (Number.isFinite(t) ? new Date(t).toISOString().slice(0, 16) + 'Z' : 'open');
  const lines = [`Season ${iso(s.sinceMs)} – ${iso(s.untilMs)}`, `  hours: ${Array.from({ length: 24 }, (_, h) => String(h).padStart(3)).join('')}`, '', ...groupTable(s.network)];
  lines.push(`  fronts tracked: ${s.fronts.fronts}; speed median ${cell(s.fronts.speedKmh.median)} km/h (p10 ${cell(s.fronts.speedKmh.p10)}, p90 ${cell(s.fronts.speedKmh.p90)}); moving toward ${SECTORS.map((d, i) => `${d} ${s.fronts.towardSector[i]}`).join(', ')}`);
  for (const g of s.stations) lines.push('', ...groupTable(g));
  return lines.join('\n') + '\n';
}
