/**
 * Front map: line clipping (Liang & Barsky 1984, parametric form) and isochrones perpendicular to the motion
 * (t = t0 + s·x, so the front at one time is the line s·x = const).
 */
import { test } from 'uvu';
import * as assert from 'uvu/assert';
import { clipLine, frontMapSvg } from '../../../src/report/html/frontMapSvg.js';
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

test.run();
