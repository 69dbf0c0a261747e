/**
 * Stacked bar charts as inline SVG, for the report's summary sections (season, verification): one bar per
 * category, one stacked segment per series, integer count ticks (d3-array `ticks` through scale.ts), a legend and a
 * `<title>` per segment; the same numbers as a table beside the chart (`barTable`) for readers who cannot see it.
 * Pure string builders: the same input gives the same bytes.
 */
import { escapeXml } from './escape.js';
import { px } from './linePath.js';
import { linearScale, niceTicks } from './scale.js';

export interface BarSeries {
  label: string;
  /** CSS class of its segments (a kind class, or one of BAR_CLASSES). */
  cls: string;
  /** One value per category (counts; NaN and negatives draw nothing). */
  values: readonly number[];
}

export interface BarChartInput {
  /** Element id, unique in the page. */
  id: string;
  title: string;
  categories: readonly string[];
  series: readonly BarSeries[];
  /** Words for the value axis. */
  yLabel: string;
  /** Label every n-th category (default 1). */
  labelEvery?: number;
  width?: number;
  height?: number;
}

/** Segment classes for charts that are not by boundary kind, with their styles (fill colour and hatching). */
export const BAR_CLASSES = {
  hit: '#1f5fa8',
  miss: '#b8322a',
  'false-alarm': '#7a5214',
  count: '#455a64',
} as const;

/** Style rules of the bar charts; added to the page only when it has such a chart. */
export function barCss(): string {
  const own = Object.entries(BAR_CLASSES)
    .map(([k, c]) => `rect.bar.b-${k},rect.key.b-${k}{fill:${c};stroke:#fff}`)
    .join('\n');
  return `svg.bars{width:100%;max-width:760px}rect.bar,rect.key{stroke:#fff;stroke-width:0.6}.axis{stroke:#777;stroke-width:1;fill:none}\n${own}\n.b-miss{fill-opacity:0.85}rect.bar.b-false-alarm,rect.key.b-false-alarm{fill-opacity:0.7}`;
}

/**
 * One stacked bar chart. Segments stack in series order from the axis up; an empty chart (all zero) still draws its
 * axes and says so in its title.
 * @example barChartSvg({ id: 'x', title: 'n', categories: ['a'], series: [{ label: 's', cls: 'b-count', values: [2] }], yLabel: 'passages' })
 */
export function barChartSvg(c: BarChartInput): string {
  const W = c.width ?? 720;
  const H = c.height ?? 220;
  const left = 44;
  const right = 8;
  const top = 10;
  const legendH = 18 * Math.ceil(c.series.length / 4);
  const bottom = 34 + legendH;
  const n = c.categories.length;
  const totals = c.categories.map((_, i) => c.series.reduce((a, s) => a + pos(s.values[i]), 0));
  const maxTotal = Math.max(1, ...totals);
  const ticks = niceTicks(0, maxTotal, 4).filter((t) => Number.isInteger(t));
  const yMax = Math.max(maxTotal, ticks[ticks.length - 1] ?? 1);
  const y = linearScale(0, yMax, H - bottom, top);
  const band = (W - left - right) / Math.max(1, n);
  const barW = Math.max(1, band * 0.78);
  const every = Math.max(1, c.labelEvery ?? 1);
  const tid = `${c.id}-t`;
  let s = `<svg class="bars" id="${escapeXml(c.id)}" viewBox="0 0 ${W} ${H}" role="img" aria-labelledby="${escapeXml(tid)}"><title id="${escapeXml(tid)}">${escapeXml(c.title)}${totals.every((t) => t === 0) ? ' (none)' : ''}</title>`;
  for (const t of ticks) s += `<path class="grid" d="M${left},${px(y(t))}H${W - right}"/><text x="${left - 4}" y="${px(y(t))}" dy="0.32em" text-anchor="end">${t}</text>`;
  s += `<text class="row-title" x="${left}" y="${top - 2}" font-size="10">${escapeXml(c.yLabel)}</text>`;
  c.categories.forEach((cat, i) => {
    const x = left + i * band + (band - barW) / 2;
    let base = 0;
    for (const ser of c.series) {
      const v = pos(ser.values[i]);
      if (v === 0) continue;
      const y0 = y(base);
      const y1 = y(base + v);
      s += `<rect class="bar ${escapeXml(ser.cls)}" x="${px(x)}" y="${px(y1)}" width="${px(barW)}" height="${px(y0 - y1)}"><title>${escapeXml(`${cat}: ${ser.label} ${v}`)}</title></rect>`;
      base += v;
    }
    if (i % every === 0) s += `<text x="${px(x + barW / 2)}" y="${H - bottom + 13}" text-anchor="middle">${escapeXml(cat)}</text>`;
  });
  s += `<path class="axis" d="M${left},${top}V${H - bottom}H${W - right}"/>`;
  c.series.forEach((ser, k) => {
    const lx = left + (k % 4) * 170;
    const ly = H - legendH + Math.floor(k / 4) * 18 + 2;
    s += `<rect class="key ${escapeXml(ser.cls)}" x="${lx}" y="${ly}" width="12" height="12"/><text x="${lx + 16}" y="${ly + 6}" dy="0.32em">${escapeXml(ser.label)}</text>`;
  });
  return s + '</svg>';
}

/** The chart's numbers as an HTML table (categories as rows, series as columns, with a total column). */
export function barTable(c: BarChartInput, categoryHeader: string): string {
  const head = `<tr><th scope="col">${escapeXml(categoryHeader)}</th>${c.series.map((s) => `<th scope="col">${escapeXml(s.label)}</th>`).join('')}<th scope="col">total</th></tr>`;
  const rows = c.categories
    .map((cat, i) => {
      const cells = c.series.map((s) => pos(s.values[i]));
      return `<tr><th scope="row">${escapeXml(cat)}</th>${cells.map((v) => `<td class="n">${v}</td>`).join('')}<td class="n">${cells.reduce((a, b) => a + b, 0)}</td></tr>`;
    })
    .join('');
  return `<table><thead>${head}</thead><tbody>${rows}</tbody></table>`;
}

/** A chart in a figure with its caption, and its numbers (barTable) folded beneath it. */
export function barFigure(c: BarChartInput, categoryHeader: string, caption: string): string {
  return `<figure>${barChartSvg(c)}<figcaption>${escapeXml(caption)}</figcaption></figure><details><summary>Numbers of “${escapeXml(c.title)}”</summary>${barTable(c, categoryHeader)}</details>`;
}

/** A count for drawing: NaN and negatives are 0. */
function pos(v: number | undefined): number {
  return v !== undefined && v > 0 ? v : 0;
}
