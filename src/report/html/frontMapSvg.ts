/**
 * A small map of one front tracked across a network: stations as points with their ids, the fitted front
 * position every 3 h (isochrones: lines perpendicular to the motion, t = t0 + s·x), an arrow for the motion,
 * and at each station the observed passage time (bold) or, where none was detected, the fitted time (grey,
 * in brackets). Equirectangular projection about the front's origin (the network centre), north up; under them, when
 * given, land, coastlines, country and state borders (geography.ts) projected the same way with d3-geo, a graticule
 * and a scale bar. Station labels are placed where they do not collide with each other or with the stations.
 */
import type { FrontTrack, StationMeta } from '../../model/index.js';
import { geoEquirectangular, geoGraticule, geoPath, geoTransform, type GeoStream } from 'd3-geo';
import { projectLocalKm } from '../../physics/geo.js';
import { EARTH_MEAN_RADIUS_M } from '../../physics/constants.js';
import type { Geography } from './geography.js';
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
  /** Land, coastlines and borders to draw under the front (none when absent). */
  geography?: Geography;
}

/** A "nice" scale-bar length, km: the largest of 1, 2, 5 × 10^k not above `maxKm`. */
export function niceKm(maxKm: number): number {
  const p = 10 ** Math.floor(Math.log10(maxKm));
  for (const m of [5, 2, 1]) if (m * p <= maxKm) return m * p;
  return p;
}

interface Box {
  x0: number;
  y0: number;
  x1: number;
  y1: number;
}
const overlap = (a: Box, b: Box) => a.x0 < b.x1 && b.x0 < a.x1 && a.y0 < b.y1 && b.y0 < a.y1;

/**
 * Place each label (text of `rows` rows, ~6 px per character, 11 px per row) at the first of right, left, above,
 * below its point, then right or left shifted up or down by one and two label heights, that stays inside [0, W] × [0, H] and overlaps no placed label and no point; the last candidate
 * that stays inside when all collide (greedy placement, common practice, no source). Returns the anchor, x and y
 * of the first row for each label.
 */
export function placeLabels(points: readonly { x: number; y: number; width: number; rows: number }[], W: number, H: number): { anchor: 'start' | 'end' | 'middle'; x: number; y: number }[] {
  const placed: Box[] = points.map((p) => ({ x0: p.x - 2.5, y0: p.y - 2.5, x1: p.x + 2.5, y1: p.y + 2.5 }));
  return points.map((p) => {
    const h = p.rows * 11;
    const side = (anchor: 'start' | 'end', dy: number) => {
      const x0 = anchor === 'start' ? p.x + 5 : p.x - 5 - p.width;
      return { anchor, x: anchor === 'start' ? p.x + 5 : p.x - 5, y: p.y - 3 + dy, box: { x0, y0: p.y - 12 + dy, x1: x0 + p.width, y1: p.y - 12 + dy + h } };
    };
    const cands: { anchor: 'start' | 'end' | 'middle'; x: number; y: number; box: Box }[] = [
      side('start', 0),
      side('end', 0),
      { anchor: 'middle', x: p.x, y: p.y - 6 - (h - 11), box: { x0: p.x - p.width / 2, y0: p.y - 15 - (h - 11), x1: p.x + p.width / 2, y1: p.y - 4 } },
      { anchor: 'middle', x: p.x, y: p.y + 14, box: { x0: p.x - p.width / 2, y0: p.y + 5, x1: p.x + p.width / 2, y1: p.y + 5 + h } },
      // further out, shifted up and down by one and two label heights
      ...[-1, 1, -2, 2].flatMap((k) => [side('start', k * (h + 2)), side('end', k * (h + 2))]),
    ];
    const inside = cands.filter((c) => c.box.x0 >= 0 && c.box.x1 <= W && c.box.y0 >= 0 && c.box.y1 <= H);
    const pick = inside.find((c) => !placed.some((b) => overlap(b, c.box))) ?? inside[0] ?? cands[0]!;
    placed.push(pick.box);
    return { anchor: pick.anchor, x: pick.x, y: pick.y };
  });
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

  const geo = m.geography ? geographySvg(m.geography, t.origin, { X, Y, bx0, bx1, by0, by1 }) : '';
  // Scale bar (lower right): a nice length of at most a third of the width.
  const barKm = niceKm((W / 3) / scale);
  const barPx = barKm * scale;
  const scaleBar = `<path class="scalebar" d="M${px(W - 8 - barPx)},${px(H - 24)}v-4V${px(H - 24)}H${px(W - 8)}v-4"/><text class="map-caption" x="${px(W - 8)}" y="${px(H - 30)}" text-anchor="end">${barKm} km</text>`;

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
  const spots = m.stations.map((s, i) => {
    const mem = memberBy.get(s.id);
    const when = mem ? utcMinute(mem.event.timeMs).slice(11) : expectedBy.has(s.id) ? `(${utcMinute(expectedBy.get(s.id)!).slice(11)})` : '';
    return { s, mem, when, x: X(proj.xKm[i]!), y: Y(proj.yKm[i]!), width: 6 * Math.max(s.id.length, when.length), rows: when ? 2 : 1 };
  });
  const places = placeLabels(spots, W, H - 16);
  spots.forEach((p, i) => {
    const { anchor, x, y } = places[i]!;
    pts += `M${px(p.x)},${px(p.y)}h0`;
    labels += `<text class="stn-id" x="${px(x)}" y="${px(y)}" text-anchor="${anchor}">${escapeXml(p.s.id)}</text>`;
    if (p.when) labels += `<text class="${p.mem ? 'arr' : 'arr expected'}" x="${px(x)}" y="${px(y + 12)}" text-anchor="${anchor}">${escapeXml(p.when)}</text>`;
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
    geo +
    scaleBar +
    (iso ? `<path class="iso ${k}" d="${iso}"/>` : '') +
    isoLabels +
    `<path class="stn" d="${pts}"/>` +
    labels +
    arrow +
    `<text class="map-caption" x="4" y="${H - 4}">${escapeXml(caption)}</text>` +
    '</svg>'
  );
}

/**
 * Land, coastlines, borders and a graticule projected like the map: x = R cos φ0 (λ − λ0), y = R (φ − φ0) km
 * (equirectangular about the origin, the projection of projectLocalKm 'equirectangular'), as d3-geo's
 * equirectangular projection rotated to λ0 followed by a scaling of x by cos φ0, clipped to the map rectangle
 * (d3-geo clipExtent). Paths rounded to 0.1 px.
 */
function geographySvg(g: Geography, origin: { latDeg: number; lonDeg: number }, f: { X: (xk: number) => number; Y: (yk: number) => number; bx0: number; bx1: number; by0: number; by1: number }): string {
  const rKm = EARTH_MEAN_RADIUS_M / 1000;
  const c0 = Math.cos((origin.latDeg * Math.PI) / 180);
  // d3: u = R·λ' (rad), v = −R·φ (rad) with λ' the longitude east of λ0.
  const base = geoEquirectangular().rotate([-origin.lonDeg, 0]).scale(rKm).translate([0, 0]).precision(0.1);
  const yOff = rKm * ((origin.latDeg * Math.PI) / 180);
  base.clipExtent([
    [f.bx0 / c0, -(f.by1 + yOff)],
    [f.bx1 / c0, -(f.by0 + yOff)],
  ]);
  const toMap = geoTransform({
    point(this: { stream: GeoStream }, u: number, v: number) {
      this.stream.point(f.X(u * c0), f.Y(-v - yOff));
    },
  });
  const projection = { stream: (out: GeoStream) => base.stream(toMap.stream(out)) };
  const path = geoPath(projection).digits(1);
  const spanDeg = Math.max((f.by1 - f.by0) / 111, (f.bx1 - f.bx0) / (111 * c0));
  const step = spanDeg > 20 ? 10 : spanDeg > 8 ? 5 : spanDeg > 4 ? 2 : 1;
  const grat = path(geoGraticule().step([step, step])()) ?? '';
  const land = path(g.land) ?? '';
  const countries = path(g.countryBorders) ?? '';
  const states = path(g.stateBorders) ?? '';
  return (
    (land ? `<path class="land" d="${land}"/>` : '') +
    (grat ? `<path class="graticule" d="${grat}"/>` : '') +
    (states ? `<path class="border state" d="${states}"/>` : '') +
    (countries ? `<path class="border country" d="${countries}"/>` : '')
  );
}
