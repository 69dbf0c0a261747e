/**
 * GeoJSON output checked against the rules of RFC 7946 (The GeoJSON Format, IETF 2016), a validator written here
 * from the RFC's text: §3.3 one FeatureCollection with a `features` array; §3.2 each Feature has `geometry` and a
 * `properties` object; §3.1.1 positions are arrays of 2 or 3 JSON numbers, longitude first; §4 WGS 84 degrees
 * (longitude in [-180, 180], latitude in [-90, 90]); §3.1.4 a LineString has at least 2 positions; §3.1.6 polygon
 * rings are closed and exterior rings counterclockwise (right-hand rule); §3.1.9 no line crosses the antimeridian.
 * Also the fitted-front geometry: the destination formula (Williams, Aviation Formulary) and the fitted times.
 */
import { test } from 'uvu';
import * as assert from 'uvu/assert';
import { toGeoJson } from '../../src/report/geojson.js';
import { arrivalsAt, parsePoint, parsePointsFile } from '../../src/report/arrivals.js';
import { destinationPoint, fittedPassageMs, isochrone } from '../../src/network/fittedTime.js';
import { projectLocalKm } from '../../src/physics/geo.js';
import type { FrontTrack, StationMeta } from '../../src/model/index.js';
import { sampleEvent } from './sampleEvent.js';

type Json = any; // eslint-disable-line @typescript-eslint/no-explicit-any

/** Problems under RFC 7946 (empty when valid). */
function rfc7946Problems(doc: Json): string[] {
  const p: string[] = [];
  const position = (c: Json, where: string) => {
    if (!Array.isArray(c) || c.length < 2 || c.length > 3 || !c.every((x: unknown) => typeof x === 'number' && Number.isFinite(x))) return void p.push(`${where}: position must be 2-3 numbers`);
    if (c[0] < -180 || c[0] > 180) p.push(`${where}: longitude ${c[0]} outside [-180, 180] (longitude first, §3.1.1)`);
    if (c[1] < -90 || c[1] > 90) p.push(`${where}: latitude ${c[1]} outside [-90, 90]`);
  };
  const line = (cs: Json, where: string) => {
    if (!Array.isArray(cs) || cs.length < 2) return void p.push(`${where}: LineString needs ≥ 2 positions (§3.1.4)`);
    cs.forEach((c: Json, i: number) => position(c, `${where}[${i}]`));
    for (let i = 1; i < cs.length; i++) if (Math.abs(cs[i][0] - cs[i - 1][0]) > 180) p.push(`${where}: crosses the antimeridian (§3.1.9)`);
  };
  const ring = (cs: Json, where: string, exterior: boolean) => {
    line(cs, where);
    const a = cs[0], b = cs[cs.length - 1];
    if (cs.length < 4 || a[0] !== b[0] || a[1] !== b[1]) p.push(`${where}: ring not closed (§3.1.6)`);
    let area2 = 0;
    for (let i = 1; i < cs.length; i++) area2 += (cs[i - 1][0] * cs[i][1] - cs[i][0] * cs[i - 1][1]);
    if (exterior ? area2 < 0 : area2 > 0) p.push(`${where}: ${exterior ? 'exterior' : 'hole'} ring orientation breaks the right-hand rule (§3.1.6)`);
  };
  if (doc.type !== 'FeatureCollection' || !Array.isArray(doc.features)) return ['not a FeatureCollection (§3.3)'];
  doc.features.forEach((f: Json, i: number) => {
    const w = `feature ${i}`;
    if (f.type !== 'Feature' || typeof f.properties !== 'object' || !('geometry' in f)) return void p.push(`${w}: not a Feature (§3.2)`);
    const g = f.geometry;
    if (g.type === 'Point') position(g.coordinates, w);
    else if (g.type === 'LineString') line(g.coordinates, w);
    else if (g.type === 'MultiLineString') g.coordinates.forEach((l: Json, j: number) => line(l, `${w}.${j}`));
    else if (g.type === 'Polygon') g.coordinates.forEach((r: Json, j: number) => ring(r, `${w}.${j}`, j === 0));
    else p.push(`${w}: unexpected geometry ${g.type}`);
    for (const [k, v] of Object.entries(f.properties)) if (typeof v === 'string' && /^-?\d+(\.\d+)?$/.test(v) && k !== 'station' && k !== 'point') p.push(`${w}: property ${k} is a number written as a string`);
  });
  return p;
}

const stations: StationMeta[] = [
  { id: 'XAAA', aliases: [], latDeg: 45, lonDeg: -100, elevationM: 500 },
  { id: 'XBBB', aliases: [], latDeg: 45, lonDeg: -98, elevationM: 500 },
  { id: 'XCCC', aliases: [], latDeg: 44, lonDeg: -99, elevationM: 500 },
];
const t0 = Date.UTC(2026, 2, 4, 12);
/** Constructed track: a front moving due east at 40 km/h through an origin at 45° N 99° W. */
function track(origin = { latDeg: 45, lonDeg: -99 }): FrontTrack {
  const proj = projectLocalKm(stations, origin);
  const members = stations.map((s, i) => {
    const timeMs = t0 + (proj.xKm[i]! / 40) * 3600000;
    return { station: s.id, event: sampleEvent({ station: s.id, timeMs }), xKm: proj.xKm[i]!, yKm: proj.yKm[i]!, residualMin: 0, alongKm: proj.xKm[i]! };
  }).sort((a, b) => a.event.timeMs - b.event.timeMs);
  return { id: 'cold-front 2026-03-04', kind: 'cold-front', members, t0Ms: t0, speedKmh: 40, directionDeg: 90, rmsResidualMin: 4, strengthSlopeCPer100km: 0.1, zoneSlopeKmPer100km: 0, trend: 'steady', expected: [], origin };
}

test('destinationPoint: 1° of longitude at the equator is 111.195 km on the mean-radius sphere (2πR/360, R = 6371.0088 km)', () => {
  const p = destinationPoint({ latDeg: 0, lonDeg: 0 }, 90, (2 * Math.PI * 6371.0088) / 360);
  assert.ok(Math.abs(p.lonDeg - 1) < 1e-6 && Math.abs(p.latDeg) < 1e-9, JSON.stringify(p));
  // round trip with the ellipsoidal azimuthal-equidistant projection (Karney2013) within 0.5 % at 200 km
  const q = destinationPoint({ latDeg: 45, lonDeg: -99 }, 30, 200);
  const back = projectLocalKm([q], { latDeg: 45, lonDeg: -99 });
  assert.ok(Math.abs(Math.hypot(back.xKm[0]!, back.yKm[0]!) - 200) < 1, String(Math.hypot(back.xKm[0]!, back.yKm[0]!)));
});

test('fittedPassageMs at a member station is its passage time (exact plane, constructed); isochrones lie where the fit says', () => {
  const t = track();
  for (const m of t.members) {
    const s = stations.find((x) => x.id === m.station)!;
    assert.ok(Math.abs(fittedPassageMs(t, s.latDeg, s.lonDeg) - m.event.timeMs) < 1000, m.station);
  }
  for (const p of isochrone(t, t0 + 3600000, -100, 100)) assert.ok(Math.abs(fittedPassageMs(t, p.latDeg, p.lonDeg) - (t0 + 3600000)) < 60000, JSON.stringify(p));
});

test('toGeoJson: valid under RFC 7946, longitude first, numbers as numbers, hourly isochrones with motion and trend', () => {
  const t = track();
  const events = t.members.map((m) => m.event);
  const arrivals = arrivalsAt([parsePoint('44.5,-97.5,Town')], [t]);
  const doc = JSON.parse(toGeoJson({ events, tracks: [t], stations, arrivals }));
  assert.equal(rfc7946Problems(doc), []);
  const st = doc.features.find((f: Json) => f.properties.station === 'XAAA' && f.properties.feature === 'station');
  assert.equal(st.geometry.coordinates, [-100, 45]); // [lon, lat]
  const iso = doc.features.filter((f: Json) => f.properties.feature === 'isochrone');
  assert.ok(iso.length >= 3, String(iso.length));
  assert.is(iso[0].properties.speed_kmh, 40);
  assert.is(iso[0].properties.toward_deg, 90);
  assert.is(iso[0].properties.trend, 'steady');
  const arr = doc.features.find((f: Json) => f.properties.feature === 'arrival');
  assert.is(arr.properties.basis, "estimate from the front's fit");
  assert.is(typeof arr.properties.half_width_min, 'number');
});

test('toGeoJson: a front across the antimeridian is split into a MultiLineString (RFC 7946 §3.1.9)', () => {
  const far: StationMeta[] = [
    { id: 'XAAA', aliases: [], latDeg: 0, lonDeg: 179.5, elevationM: 0 },
    { id: 'XBBB', aliases: [], latDeg: 1, lonDeg: 179.8, elevationM: 0 },
    { id: 'XCCC', aliases: [], latDeg: -1, lonDeg: 179.9, elevationM: 0 },
  ];
  const t = { ...track({ latDeg: 0, lonDeg: 179.8 }), directionDeg: 90 };
  t.members = t.members.map((m, i) => ({ ...m, station: far[i]!.id }));
  const doc = JSON.parse(toGeoJson({ events: [], tracks: [{ ...t, directionDeg: 0 }], stations: far }));
  assert.equal(rfc7946Problems(doc), []);
  assert.ok(doc.features.some((f: Json) => f.geometry.type === 'MultiLineString'));
});

test('the validator itself rejects latitude-first, string numbers and a clockwise exterior ring', () => {
  const bad = { type: 'FeatureCollection', features: [
    { type: 'Feature', geometry: { type: 'Point', coordinates: [45, -100] }, properties: {} },
    { type: 'Feature', geometry: { type: 'Point', coordinates: [1, 2] }, properties: { speed_kmh: '40' } },
    { type: 'Feature', geometry: { type: 'Polygon', coordinates: [[[0, 0], [0, 1], [1, 1], [1, 0], [0, 0]]] }, properties: {} },
  ] };
  assert.is(rfc7946Problems(bad).length, 3);
});

test('points: --at LAT,LON[,NAME] and a points file with line numbers in errors', () => {
  assert.equal(parsePoint('41.88,-87.63,Loop'), { name: 'Loop', latDeg: 41.88, lonDeg: -87.63 });
  assert.throws(() => parsePoint('-87.63'), /LAT,LON/);
  assert.throws(() => parsePoint('95,10'), /latitude -90 to 90/);
  assert.equal(parsePointsFile('# mine\nname,lat,lon\nA,1,2\n\nB,3,4\n', 'p.csv').map((p) => p.name), ['A', 'B']);
  assert.throws(() => parsePointsFile('name,lat,lon\nA,x,2\n', 'p.csv'), /p\.csv:2:/);
  assert.throws(() => parsePointsFile('name,y\n', 'p.csv'), /p\.csv:1: the header/);
});

test('arrivalsAt: estimate with max(2 × RMS, 30 min) half-width; a point beyond the stations is marked extrapolated', () => {
  const t = track();
  const [inside, beyond] = arrivalsAt([parsePoint('44.7,-99,Mid'), parsePoint('45,-90,East')], [t]);
  assert.is(inside!.halfWidthMin, 30);
  assert.is(inside!.extrapolated, false);
  assert.is(beyond!.extrapolated, true);
  // constructed: 9° of longitude at 45° N ≈ 708 km east of the origin → about 17.7 h at 40 km/h
  assert.ok(Math.abs((beyond!.timeMs - t0) / 3600000 - 17.7) < 0.2, String((beyond!.timeMs - t0) / 3600000));
});

test.run();
