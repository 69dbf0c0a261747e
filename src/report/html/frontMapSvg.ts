/**
 * A small map of one front tracked across a network: stations as points with their ids, the fitted front
 * position every 3 h (isochrones: lines perpendicular to the motion, t = t0 + s·x), an arrow for the motion,
 * and at each station the observed passage time (bold) or, where none was detected, the fitted time (grey,
 * in brackets). Equirectangular projection about the front's origin (the network centre), north up.
 */
import type { FrontTrack, StationMeta } from '../../model/index.js';
import { projectLocalKm } from '../../physics/geo.js';
import { escapeXml } from './escape.js';
import { px } from './linePath.js';
import { kindClass } from './palette.js';
import { utcMinute } from './timeAxis.js';

const HOUR = 3_600_000;

/**
 * Clip the infinite line through point (px0, py0) with direction (dx, dy) to the rectangle
 * [x0, x1] × [y0, y1] (Liang & Barsky 1984 parametric clipping). Null when it misses the rectangle.
 * @example clipLine(0, 0, 1, 0, -5, -1, 5, 1) // [-5, 0, 5, 0]
 */
export function clipLine(px0: number, py0: number, dx: number, dy: number, x0: number, y0: number, x1: number, y1: number): [number, number, number, number] | null {
  let lo = -Infinity, hi = Infinity;
  const edges: [number, number][] = [
    [-dx, px0 - x0],
    [dx, x1 - px0],
    [-dy, py0 - y0],
    [dy, y1 - py0],
  ];
  for (const [p, q] of edges) {
    if (p === 0) {
      if (q < 0) return null;
      continue;
    }
    const r = q / p;
    if (p < 0) lo = Math.max(lo, r);
    else hi = Math.min(hi, r);
  }
  if (!(lo <= hi) || !Number.isFinite(lo) || !Number.isFinite(hi)) return null;
  return [px0 + lo * dx, py0 + lo * dy, px0 + hi * dx, py0 + hi * dy];
}

export interface FrontMapInput {
  track: FrontTrack;
  /** Stations of the front's network (members and the others). */
  stations: readonly StationMeta[];
  id: string;
  width?: number;
  height?: number;
  /** Isochrone spacing, hours (default 3). */
  stepHours?: number;
}

/** The map as an `<svg>` string. */
export function frontMapSvg(m: FrontMapInput): string {
  const W = m.width ?? 340, H = m.height ?? 280, pad = 34;
  const t = m.track;
  const stepMs = (m.stepHours ?? 3) * HOUR;
  const proj = projectLocalKm(m.stations, t.origin, 'equirectangular');
  let xmin = Infinity, xmax = -Infinity, ymin = Infinity, ymax = -Infinity;
  for (let i = 0; i < m.stations.length; i++) {
    xmin = Math.min(xmin, proj.xKm[i]!); xmax = Math.max(xmax, proj.xKm[i]!);
    ymin = Math.min(ymin, proj.yKm[i]!); ymax = Math.max(ymax, proj.yKm[i]!);
  }
  const spanX = Math.max(xmax - xmin, 50), spanY = Math.max(ymax - ymin, 50);
  const scale = Math.min((W - 2 * pad) / spanX, (H - 16 - 2 * pad) / spanY);
  const cx = (xmin + xmax) / 2, cy = (ymin + ymax) / 2;
  const X = (xk: number) => W / 2 + (xk - cx) * scale;
  const Y = (yk: number) => (H - 16) / 2 + 4 - (yk - cy) * scale;
  // Map bounds in km (the drawable rectangle).
  const bx0 = cx - (W / 2 - 6) / scale, bx1 = cx + (W / 2 - 6) / scale;
  const by0 = cy - ((H - 16) / 2 - 6) / scale, by1 = cy + ((H - 16) / 2 - 6) / scale;

  const dir = (t.directionDeg * Math.PI) / 180;
  const ux = Math.sin(dir), uy = Math.cos(dir); // unit vector of motion (east, north)
  const times = t.members.map((mm) => mm.event.timeMs).concat(t.expected.map((e) => e.timeMs));
  const tFirst = Math.min(...times), tLast = Math.max(...times);
  let iso = '';
  let isoLabels = '';
  const k = kindClass(t.kind);
  for (let tt = Math.ceil((tFirst - stepMs) / stepMs) * stepMs; tt <= tLast + stepMs; tt += stepMs) {
    const along = ((tt - t.t0Ms) / HOUR) * t.speedKmh; // km along the motion from the origin
    const seg = clipLine(along * ux, along * uy, -uy, ux, bx0, by0, bx1, by1);
    if (!seg) continue;
    iso += `M${px(X(seg[0]))},${px(Y(seg[1]))}L${px(X(seg[2]))},${px(Y(seg[3]))}`;
    // Label at the end lying further up (or right) on the map.
    const [lx, ly] = Y(seg[1]) < Y(seg[3]) || (Y(seg[1]) === Y(seg[3]) && X(seg[0]) > X(seg[2])) ? [X(seg[0]), Y(seg[1])] : [X(seg[2]), Y(seg[3])];
    const d = new Date(tt);
    const lab = `${String(d.getUTCHours()).padStart(2, '0')}Z${d.getUTCHours() === 0 ? ` ${d.getUTCDate()}/${d.getUTCMonth() + 1}` : ''}`;
    const anchor = lx > W - 40 ? 'end' : lx < 40 ? 'start' : 'middle';
    const tx = anchor === 'end' ? W - 3 : anchor === 'start' ? 3 : lx;
    isoLabels += `<text class="iso-label" x="${px(tx)}" y="${px(Math.min(Math.max(ly + (ly < 12 ? 9 : -2), 10), H - 20))}" text-anchor="${anchor}">${escapeXml(lab)}</text>`;
  }
  let pts = '';
  let labels = '';
  const memberBy = new Map(t.members.map((mm) => [mm.station, mm]));
  const expectedBy = new Map(t.expected.map((e) => [e.station, e.timeMs]));
  m.stations.forEach((s, i) => {
    const sx = X(proj.xKm[i]!), sy = Y(proj.yKm[i]!);
    const mem = memberBy.get(s.id);
    pts += `M${px(sx)},${px(sy)}h0`;
    const when = mem ? utcMinute(mem.event.timeMs).slice(11) : expectedBy.has(s.id) ? `(${utcMinute(expectedBy.get(s.id)!).slice(11)})` : '';
    const anchor = sx > W - 70 ? 'end' : 'start';
    const dx = anchor === 'end' ? -5 : 5;
    labels += `<text class="stn-id" x="${px(sx + dx)}" y="${px(sy - 3)}" text-anchor="${anchor}">${escapeXml(s.id)}</text>`;
    if (when) labels += `<text class="${mem ? 'arr' : 'arr expected'}" x="${px(sx + dx)}" y="${px(sy + 9)}" text-anchor="${anchor}">${escapeXml(when)}</text>`;
  });
  // Motion arrow in the lower-left corner.
  const ax = 30, ay = H - 46, L = 18;
  const tipX = ax + L * ux, tipY = ay - L * uy;
  const head = (a: number) => `L${px(tipX - 6 * Math.sin(dir + a))},${px(tipY + 6 * Math.cos(dir + a))}`;
  const arrow = `<path class="arrow" d="M${px(ax - L * ux)},${px(ay + L * uy)}L${px(tipX)},${px(tipY)}${head(0.5)}M${px(tipX)},${px(tipY)}${head(-0.5)}"/>`;
  const caption = `${Math.round(t.speedKmh)} km/h toward ${Math.round(t.directionDeg)}°`;
  const title = `Map of ${t.id}: ${t.members.length} stations passed from ${utcMinute(tFirst)} to ${utcMinute(tLast)} UTC, ${caption}; lines show the fitted front position every ${m.stepHours ?? 3} h`;
  return (
    `<svg class="map" xmlns="http://www.w3.org/2000/svg" viewBox="0 0 ${W} ${H}" width="${W}" height="${H}" role="img" aria-labelledby="${m.id}-t">` +
    `<title id="${m.id}-t">${escapeXml(title)}</title>` +
    `<rect class="frame" x="0.5" y="0.5" width="${W - 1}" height="${H - 17}"/>` +
    (iso ? `<path class="iso ${k}" d="${iso}"/>` : '') +
    isoLabels +
    `<path class="stn" d="${pts}"/>` +
    labels +
    arrow +
    `<text class="map-caption" x="4" y="${H - 4}">${escapeXml(caption)}</text>` +
    '</svg>'
  );
}
