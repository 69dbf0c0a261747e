/**
 * Overview strip of one station over the whole period: temperature only (thinned to the pixel width), with
 * a tick at each passage (linked to its panel) and the panel windows shaded.
 */
import type { PassageEvent, StationSeries } from '../../model/index.js';
import { chartLine, windowRange } from './chartLine.js';
import { escapeXml } from './escape.js';
import { px } from './linePath.js';
import { kindClass } from './palette.js';
import { linearScale, niceTicks, paddedDomain } from './scale.js';
import { timeAxisSvg, utcMinute } from './timeAxis.js';

export interface OverviewInput {
  series: StationSeries;
  events: readonly PassageEvent[];
  t0: number;
  t1: number;
  id: string;
  gapMs: number;
  /** Panel windows with the element id each passage tick links to. */
  windows?: readonly { t0: number; t1: number; href: string }[];
  width?: number;
}

/** The overview strip as an `<svg>` string. */
export function overviewSvg(o: OverviewInput): string {
  const width = o.width ?? 960;
  const left = 58, right = 14, top = 22, bottom = 78, height = 100;
  const s = o.series;
  const x = linearScale(o.t0, o.t1, left, width - right);
  const [from, to] = windowRange(s.timeMs, o.t0, o.t1);
  const vals: number[] = [];
  for (let i = from; i < to; i++) if (!s.qc.temperatureC[i]) vals.push(s.temperatureC[i]!);
  let [d0, d1] = paddedDomain(vals, 6);
  if (!Number.isFinite(d0)) [d0, d1] = [0, 10];
  const y = linearScale(d0, d1, bottom, top);
  const axis = timeAxisSvg({ x, t0: o.t0, t1: o.t1, top, bottom, labelY: height - 6, maxTicks: Math.floor((width - left - right) / 60) });
  let body = axis.grid;
  for (const w of o.windows ?? []) {
    const a = Math.max(w.t0, o.t0), b = Math.min(w.t1, o.t1);
    if (b > a) body += `<rect class="win" x="${px(x(a))}" y="${px(top)}" width="${px(x(b) - x(a))}" height="${px(bottom - top)}"/>`;
  }
  let yl = '';
  for (const v of niceTicks(d0, d1, 3)) yl += `<text x="${px(left - 4)}" y="${px(y(v))}" dy="0.32em" text-anchor="end">${v}</text>`;
  body += `<g class="y-labels">${yl}</g><rect class="frame" x="${px(left)}" y="${px(top)}" width="${px(width - left - right)}" height="${px(bottom - top)}"/>`;
  body += `<text class="row-title" x="${px(left)}" y="${px(top - 6)}">Temperature, °C, whole period; ticks mark passages (select one to go to its chart)</text>`;
  const line = chartLine({ timeMs: s.timeMs, values: s.temperatureC, qc: s.qc.temperatureC, from, to, x, y, gapMs: o.gapMs }, [top, bottom]);
  body += `<g clip-path="url(#${o.id}-clip)"><path class="temp" d="${line.path}"/></g>`;
  if (line.flagged) body += `<path class="flagged" d="${line.flagged}"/>`;
  for (const e of o.events) {
    if (e.timeMs < o.t0 || e.timeMs > o.t1) continue;
    const xx = px(x(e.timeMs));
    const tick = `<path class="pass ${kindClass(e.kind)}" d="M${xx},${px(top)}V${px(bottom)}"><title>${escapeXml(`${e.kind} ${utcMinute(e.timeMs)} UTC`)}</title></path>`;
    const w = o.windows?.find((w) => e.timeMs >= w.t0 && e.timeMs <= w.t1);
    body += w ? `<a href="#${escapeXml(w.href)}">${tick}</a>` : tick;
  }
  body += axis.labels;
  const n = o.events.filter((e) => e.timeMs >= o.t0 && e.timeMs <= o.t1).length;
  const title = `${s.station}: temperature from ${utcMinute(o.t0)} to ${utcMinute(o.t1)} UTC with ${n} passage${n === 1 ? '' : 's'} marked`;
  return (
    `<svg class="overview" xmlns="http://www.w3.org/2000/svg" viewBox="0 0 ${width} ${height}" width="${width}" height="${height}" role="img" aria-labelledby="${o.id}-t">` +
    `<title id="${o.id}-t">${escapeXml(title)}</title>` +
    `<defs><clipPath id="${o.id}-clip"><rect x="${px(left)}" y="0" width="${px(width - left - right)}" height="${height}"/></clipPath></defs>` +
    body +
    '</svg>'
  );
}
