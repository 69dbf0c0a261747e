/**
 * One stacked time-series panel of a station as an SVG string: temperature and dew point (°C), pressure
 * (hPa), wind direction (dots) and wind speed with gusts (m/s), over [t0, t1] UTC, with every passage in the
 * window drawn as a vertical line at its time, a band over its timing window (time_earliest → time_latest)
 * and a lighter band over its transition zone (zone_start → zone_end), labelled with the kind.
 */
import type { PassageEvent, SeriesField, StationSeries } from '../../model/index.js';
import { chartLine, windowRange } from './chartLine.js';
import { escapeXml } from './escape.js';
import { px } from './linePath.js';
import { kindClass } from './palette.js';
import { pressureSource } from '../operatorFields.js';
import type { PressureSource } from '../../model/index.js';
import { linearScale, niceTicks, paddedDomain } from './scale.js';
import { timeAxisSvg, utcMinute } from './timeAxis.js';

export const PANEL_WIDTH = 960;
const LEFT = 58;
const RIGHT = 14;
const TOP = 40; // room for passage labels
const ROW_H = 78;
const ROW_GAP = 22;
const AXIS_H = 24;

interface RowLine {
  field: SeriesField;
  cls: string;
  name: string;
  dots?: boolean;
}

interface RowSpec {
  title: string;
  lines: RowLine[];
  /** Fixed domain (wind direction), else padded from the data. */
  domain?: [number, number];
  /** Wind direction: values below this are drawn 360° higher (see windDirectionCut). */
  unwrapFrom?: number;
  minSpan: number;
  ticks?: [number, string][];
}

/** The series field of each pressure source (station pressure also when derived from the altimeter setting). */
const SOURCE_FIELD: Record<Exclude<PressureSource, 'none'>, SeriesField> = {
  station: 'stationPressureHpa',
  'station-from-altimeter': 'stationPressureHpa',
  altimeter: 'altimeterHpa',
  'sea-level': 'seaLevelPressureHpa',
};

/**
 * Which pressure to draw: the one detection measured the events on (operatorFields.ts pressureSource: station
 * pressure, which every report with an altimeter setting has once derived, else the altimeter setting, else
 * sea-level pressure, which SPECI reports lack), so the chart shows the pressure the tables give; when that
 * field has nothing in the window, the first of station, altimeter, sea-level that has. Null when none has.
 */
export function pressureField(s: StationSeries, from: number, to: number): SeriesField | null {
  const src = pressureSource(s);
  const first = src === 'none' ? [] : [SOURCE_FIELD[src]];
  for (const f of [...first, 'stationPressureHpa', 'altimeterHpa', 'seaLevelPressureHpa'] as const) {
    for (let i = from; i < to; i++) if (Number.isFinite(s[f][i]!)) return f;
  }
  return null;
}

/** How the chart names the pressure it draws. */
export function pressureName(s: StationSeries, f: SeriesField): string {
  if (f === 'stationPressureHpa') return pressureSource(s) === 'station-from-altimeter' ? 'station pressure, from the altimeter setting' : 'station pressure';
  return f === 'altimeterHpa' ? 'altimeter setting' : 'sea-level pressure';
}

/**
 * Where to cut the compass circle for the wind-direction row: at 0° (N at the top and bottom edges) unless more
 * directions in the window lie within 45° of north than within 45° of south, then at 180° (N in the middle), so
 * northerly winds do not jump between the top and bottom edges.
 */
export function windDirectionCut(dirDeg: ArrayLike<number>, from: number, to: number): 0 | 180 {
  let north = 0;
  let south = 0;
  for (let i = from; i < to; i++) {
    const d = dirDeg[i]!;
    if (!Number.isFinite(d)) continue;
    if (d <= 45 || d >= 315) north++;
    else if (d >= 135 && d <= 225) south++;
  }
  return north > south ? 180 : 0;
}

function rowSpecs(s: StationSeries, from: number, to: number): RowSpec[] {
  const pf = pressureField(s, from, to);
  const rows: RowSpec[] = [
    {
      title: 'Temperature (solid) and dew point (dashed), °C',
      lines: [
        { field: 'temperatureC', cls: 'temp', name: 'temperature' },
        { field: 'dewpointC', cls: 'dew', name: 'dew point' },
      ],
      minSpan: 6,
    },
  ];
  if (pf) rows.push({ title: `Pressure (${pressureName(s, pf)}), hPa`, lines: [{ field: pf, cls: 'pres', name: pressureName(s, pf) }], minSpan: 4 });
  const cut = windDirectionCut(s.windDirDeg, from, to);
  rows.push(
    {
      title: 'Wind direction (dots), degrees true, direction the wind blows from',
      lines: [{ field: 'windDirDeg', cls: 'wdir', name: 'wind direction', dots: true }],
      domain: cut === 0 ? [0, 360] : [180, 540],
      minSpan: 360,
      ticks: cut === 0 ? [[0, 'N 0'], [90, 'E 90'], [180, 'S 180'], [270, 'W 270'], [360, 'N 360']] : [[180, 'S 180'], [270, 'W 270'], [360, 'N 0'], [450, 'E 90'], [540, 'S 180']],
      unwrapFrom: cut,
    },
    {
      title: 'Wind speed (solid) and gust (dotted), m/s',
      lines: [
        { field: 'windSpeedMs', cls: 'wspd', name: 'wind speed' },
        { field: 'gustMs', cls: 'gust', name: 'gust' },
      ],
      minSpan: 6,
    },
  );
  // Rows with nothing to show in the window are left out (and named in the description).
  return rows.filter((r) => r.lines.some((l) => hasFinite(s[l.field], from, to)));
}

function hasFinite(v: ArrayLike<number>, from: number, to: number): boolean {
  for (let i = from; i < to; i++) if (Number.isFinite(v[i]!)) return true;
  return false;
}

export interface PanelInput {
  series: StationSeries;
  /** Passages of this station (those touching the window are drawn). */
  events: readonly PassageEvent[];
  t0: number;
  t1: number;
  /** Document-unique id prefix for the clip path and title elements. */
  id: string;
  /** A line in the time series longer than this between reports is broken, ms. */
  gapMs: number;
  width?: number;
}

/** Height of a panel with `rows` rows, px. */
export function panelHeight(rows: number): number {
  return TOP + rows * ROW_H + (rows - 1) * ROW_GAP + AXIS_H;
}

/** x pixel of time t in a panel over [t0, t1] of the given width. */
export function panelX(t0: number, t1: number, width = PANEL_WIDTH): (t: number) => number {
  return linearScale(t0, t1, LEFT, width - RIGHT);
}

/** The panel as an `<svg>` element string (accessible name from `<title>`, description in `<desc>`). */
export function panelSvg(p: PanelInput): string {
  const s = p.series;
  const width = p.width ?? PANEL_WIDTH;
  const [from, to] = windowRange(s.timeMs, p.t0, p.t1);
  const rows = rowSpecs(s, from, to);
  const height = panelHeight(Math.max(rows.length, 1));
  const x = panelX(p.t0, p.t1, width);
  const plotBottom = height - AXIS_H;
  const clipId = `${p.id}-clip`;
  const events = p.events.filter((e) => overlaps(e, p.t0, p.t1));

  const title = `${s.station}: observations from ${utcMinute(p.t0)} to ${utcMinute(p.t1)} UTC`;
  const missingRows = ['temperature', 'pressure', 'wind'].filter((w) => !rows.some((r) => r.title.toLowerCase().startsWith(w)));
  let flaggedTotal = 0;

  let body = '';
  const axis = timeAxisSvg({ x, t0: p.t0, t1: p.t1, top: TOP, bottom: plotBottom, labelY: height - 8, maxTicks: Math.floor((width - LEFT - RIGHT) / 70) });
  body += axis.grid;
  body += passageBands(events, x, p.t0, p.t1, TOP, plotBottom);

  rows.forEach((r, k) => {
    const top = TOP + k * (ROW_H + ROW_GAP);
    const bottom = top + ROW_H;
    let domain = r.domain;
    if (!domain) {
      const vals: number[] = [];
      for (const l of r.lines) for (let i = from; i < to; i++) if (!s.qc[l.field][i]) vals.push(s[l.field][i]!);
      domain = paddedDomain(vals, r.minSpan);
      if (!Number.isFinite(domain[0])) {
        const raw: number[] = [];
        for (const l of r.lines) for (let i = from; i < to; i++) raw.push(s[l.field][i]!);
        domain = paddedDomain(raw, r.minSpan);
      }
    }
    const y = linearScale(domain[0], domain[1], bottom, top);
    let values = niceTicks(domain[0], domain[1], 4);
    if (values.length < 3) values = niceTicks(domain[0], domain[1], 8);
    const ticks: [number, string][] = r.ticks ?? values.map((v) => [v, String(v)]);
    let tickSvg = '';
    let gridY = '';
    for (const [v, label] of ticks) {
      const yy = px(y(v));
      gridY += `M${px(LEFT)},${yy}H${px(width - RIGHT)}`;
      tickSvg += `<text x="${px(LEFT - 4)}" y="${yy}" dy="0.32em" text-anchor="end">${escapeXml(label)}</text>`;
    }
    body += `<g class="row"><text class="row-title" x="${px(LEFT)}" y="${px(top - 6)}">${escapeXml(r.title)}</text>`;
    body += `<path class="grid" d="${gridY}"/><rect class="frame" x="${px(LEFT)}" y="${px(top)}" width="${px(width - LEFT - RIGHT)}" height="${px(ROW_H)}"/>`;
    body += `<g class="y-labels">${tickSvg}</g>`;
    let flagged = '';
    body += `<g clip-path="url(#${clipId})">`;
    for (const l of r.lines) {
      let values: Float64Array = s[l.field];
      if (r.unwrapFrom) {
        const cut = r.unwrapFrom;
        values = Float64Array.from(values, (v) => (v < cut ? v + 360 : v));
      }
      const line = chartLine({ timeMs: s.timeMs, values, qc: s.qc[l.field], from, to, x, y, gapMs: p.gapMs, dots: l.dots }, [top, bottom]);
      if (line.path) body += `<path class="${l.cls}" d="${line.path}"/>`;
      flagged += line.flagged;
      flaggedTotal += line.flaggedCount;
    }
    body += '</g>';
    if (flagged) body += `<path class="flagged" d="${flagged}"/>`;
    body += '</g>';
  });
  if (rows.length === 0) body += `<text x="${px(width / 2)}" y="${px(TOP + ROW_H / 2)}" text-anchor="middle">no observations in this period</text>`;

  body += passageLines(events, x, p.t0, p.t1, TOP, plotBottom);
  body += axis.labels;

  const desc =
    `Stacked charts against time (UTC): ${rows.map((r) => r.title).join('; ') || 'none'}.` +
    (missingRows.length ? ` Not reported in this period: ${missingRows.join(', ')}.` : '') +
    (events.length
      ? ` Passages: ${events.map((e) => `${e.kind} at ${utcMinute(e.timeMs)} UTC (window ${utcMinute(e.timeEarliestMs)} to ${utcMinute(e.timeLatestMs)}, zone to ${utcMinute(e.zoneEndMs) || 'unknown'})`).join('; ')}.`
      : ' No passage in this period.') +
    (flaggedTotal ? ` ${flaggedTotal} value${flaggedTotal === 1 ? '' : 's'} flagged by quality control drawn as crosses.` : '');

  return (
    `<svg class="panel" xmlns="http://www.w3.org/2000/svg" viewBox="0 0 ${width} ${height}" width="${width}" height="${height}" role="img" aria-labelledby="${p.id}-t ${p.id}-d">` +
    `<title id="${p.id}-t">${escapeXml(title)}</title><desc id="${p.id}-d">${escapeXml(desc)}</desc>` +
    `<defs><clipPath id="${clipId}"><rect x="${px(LEFT)}" y="0" width="${px(width - LEFT - RIGHT)}" height="${px(height)}"/></clipPath></defs>` +
    body +
    '</svg>'
  );
}

function overlaps(e: PassageEvent, t0: number, t1: number): boolean {
  const a = Math.min(e.timeMs, finiteOr(e.timeEarliestMs, e.timeMs), finiteOr(e.zoneStartMs, e.timeMs));
  const b = Math.max(e.timeMs, finiteOr(e.timeLatestMs, e.timeMs), finiteOr(e.zoneEndMs, e.timeMs));
  return b >= t0 && a <= t1;
}

const finiteOr = (v: number, d: number) => (Number.isFinite(v) ? v : d);

/** A rectangle over [a, b] clipped to [t0, t1]; '' when empty or not finite. */
function band(cls: string, a: number, b: number, x: (t: number) => number, t0: number, t1: number, top: number, bottom: number, label: string): string {
  if (!Number.isFinite(a) || !Number.isFinite(b)) return '';
  const lo = Math.max(Math.min(a, b), t0);
  const hi = Math.min(Math.max(a, b), t1);
  if (!(hi > lo)) return '';
  const x0 = x(lo);
  return `<rect class="${cls}" x="${px(x0)}" y="${px(top)}" width="${px(Math.max(x(hi) - x0, 0.5))}" height="${px(bottom - top)}"><title>${escapeXml(label)}</title></rect>`;
}

/** Transition-zone bands (lighter) and timing-window bands, drawn under the data. */
export function passageBands(events: readonly PassageEvent[], x: (t: number) => number, t0: number, t1: number, top: number, bottom: number): string {
  let out = '';
  for (const e of events) {
    const k = kindClass(e.kind);
    out += band(`zone ${k}`, e.zoneStartMs, e.zoneEndMs, x, t0, t1, top, bottom, `${e.kind} transition zone ${utcMinute(e.zoneStartMs)} to ${utcMinute(e.zoneEndMs)} UTC`);
    out += band(`window ${k}`, e.timeEarliestMs, e.timeLatestMs, x, t0, t1, top, bottom, `${e.kind} timing window ${utcMinute(e.timeEarliestMs)} to ${utcMinute(e.timeLatestMs)} UTC`);
  }
  return out;
}

/** Passage lines and their labels (kind and time), drawn over the data; labels staggered when close. */
export function passageLines(events: readonly PassageEvent[], x: (t: number) => number, t0: number, t1: number, top: number, bottom: number): string {
  let out = '';
  let lastX = -Infinity;
  let level = 0;
  for (const e of [...events].sort((a, b) => a.timeMs - b.timeMs)) {
    if (e.timeMs < t0 || e.timeMs > t1) continue;
    const xx = x(e.timeMs);
    level = xx - lastX < 150 ? (level + 1) % 2 : 0;
    lastX = xx;
    const k = kindClass(e.kind);
    const labelY = top - 26 + level * 12;
    const anchor = xx > x(t1) - 120 ? 'end' : 'start';
    const dx = anchor === 'end' ? -3 : 3;
    out +=
      `<path class="pass ${k}" d="M${px(xx)},${px(labelY + 2)}V${px(bottom)}" data-time="${utcMinute(e.timeMs)}"/>` +
      `<text class="pass-label ${k}" x="${px(xx + dx)}" y="${px(labelY)}" text-anchor="${anchor}">${escapeXml(`${e.kind} ${utcMinute(e.timeMs).slice(11)}`)}</text>`;
  }
  return out;
}
