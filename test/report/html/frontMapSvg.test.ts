/**
 * Front map: line clipping (Liang & Barsky 1984, parametric form) and isochrones perpendicular to the motion
 * (t = t0 + s·x, so the front at one time is the line s·x = const).
 */
import { test } from 'uvu';
import * as assert from 'uvu/assert';
import { clipLine, frontMapSvg, niceKm, placeLabels } from '../../../src/report/html/frontMapSvg.js';
import { loadGeography } from '../../../src/report/html/geography.js';
import type { FrontTrack, StationMeta } from '../../../src/model/index.js';
import { H, T0, passage } from './fixture.js';

test('clipLine: a horizontal line through a box, a line missing it, a diagonal', () => {
  assert.equal(clipLine(0, 0, 1, 0, -5, -1, 5, 1), [-5, 0, 5, 0]);
  assert.is(clipLine(0, 10, 1, 0, -5, -1, 5, 1), null);
  const d = clipLine(0, 0, 1, 1, -2, -2, 2, 2)!;
  assert.equal(d, [-2, -2, 2, 2]);
});

const meta = (id: string, latDeg: number, lonDeg: number): StationMeta => ({ id, aliases: [], latDeg, lonDeg, elevationM: 0 });

test('frontMapSvg: a front moving east has north–south isochrones; stations labelled, ids escaped', () => {
  const stations = [meta('A<1>', 45, -96), meta('B', 45.5, -95), meta('C', 44.5, -94)];
  const track: FrontTrack = {
    id: 'cold-front 2026-03-02',
    kind: 'cold-front',
    members: stations.map((s, i) => ({ station: s.id, event: passage(s.id, T0 + (10 + 2 * i) * H), xKm: 0, yKm: 0, residualMin: 0, alongKm: 0 })),
    t0Ms: T0 + 12 * H,
    speedKmh: 20,
    directionDeg: 90,
    rmsResidualMin: 5,
    strengthSlopeCPer100km: 0,
    zoneSlopeKmPer100km: 0,
    trend: 'steady',
    expected: [],
    origin: { latDeg: 45, lonDeg: -95 },
  };
  const svg = frontMapSvg({ track, stations, id: 'm0' });
  const iso = svg.match(/<path class="iso k-cold-front" d="([^"]+)"/)![1]!;
  const segs = [...iso.matchAll(/M([-\d.]+),([-\d.]+)L([-\d.]+),([-\d.]+)/g)];
  assert.ok(segs.length >= 3, `${segs.length} isochrones`);
  for (const m of segs) assert.ok(Math.abs(Number(m[1]) - Number(m[3])) <= 0.1, `vertical: ${m[0]}`);
  // later isochrones lie further east (motion toward 90°)
  const xs = segs.map((m) => Number(m[1]));
  for (let i = 1; i < xs.length; i++) assert.ok(xs[i]! > xs[i - 1]!);
  assert.match(svg, '>A&lt;1&gt;</text>');
  assert.match(svg, '>10:00</text>');
  assert.match(svg, '20 km/h toward 90°');
});

test('frontMapSvg with geography: land, US state borders and a graticule clipped to the map; a scale bar', () => {
  // Natural Earth / US Census boundaries: the South Dakota-Minnesota border runs near 96.5° W between 45° and 46° N
  const stations = [meta('A', 45, -98), meta('B', 45.5, -95), meta('C', 44.5, -94)];
  const track: FrontTrack = {
    id: 'f', kind: 'cold-front', members: stations.map((s, i) => ({ station: s.id, event: passage(s.id, T0 + i * H), xKm: 0, yKm: 0, residualMin: 0, alongKm: 0 })),
    t0Ms: T0, speedKmh: 30, directionDeg: 90, rmsResidualMin: 0, strengthSlopeCPer100km: 0, zoneSlopeKmPer100km: 0, trend: 'steady', expected: [], origin: { latDeg: 45, lonDeg: -96 },
  };
  const svg = frontMapSvg({ track, stations, id: 'g', geography: loadGeography() });
  for (const cls of ['land', 'graticule', 'border state']) assert.match(svg, `<path class="${cls}" d="M`);
  const W = 340, Hh = 280;
  for (const m of svg.matchAll(/<path class="(?:land|border state|graticule)" d="([^"]+)"/g)) {
    for (const [, x, y] of m[1]!.matchAll(/(-?[\d.]+),(-?[\d.]+)/g)) assert.ok(Number(x) >= -0.5 && Number(x) <= W + 0.5 && Number(y) >= -0.5 && Number(y) <= Hh, `${x},${y} outside the map`);
  }
  assert.match(svg, /<text class="map-caption"[^>]*>\d+ km<\/text>/);
  // deterministic: the same bytes twice
  assert.is(frontMapSvg({ track, stations, id: 'g', geography: loadGeography() }), svg);
});

test('niceKm: 1-2-5 steps (common practice, no source); placeLabels: crowded stations get labels that do not overlap', () => {
  assert.is(niceKm(130), 100);
  assert.is(niceKm(260), 200);
  assert.is(niceKm(49), 20);
  const pts = [{ x: 100, y: 100 }, { x: 104, y: 100 }, { x: 100, y: 104 }, { x: 300, y: 200 }].map((p) => ({ ...p, width: 30, rows: 2 }));
  const placed = placeLabels(pts, 340, 264);
  const boxes = placed.map((p, i) => {
    const w = pts[i]!.width;
    const x0 = p.anchor === 'start' ? p.x : p.anchor === 'end' ? p.x - w : p.x - w / 2;
    return { x0, x1: x0 + w, y0: p.y - 9, y1: p.y - 9 + 22 };
  });
  for (let i = 0; i < boxes.length; i++) for (let j = i + 1; j < boxes.length; j++) {
    const a = boxes[i]!, b = boxes[j]!;
    assert.ok(!(a.x0 < b.x1 && b.x0 < a.x1 && a.y0 < b.y1 && b.y0 < a.y1), `labels ${i} and ${j} overlap`);
  }
});

test.run();
