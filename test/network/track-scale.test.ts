import { test } from 'uvu';
import * as assert from 'uvu/assert';
import { fitPlane, motionFromSlowness, trackFronts } from '../../src/network/track.js';
import { networksOf, stationGraph } from '../../src/network/neighbours.js';
import type { PassageEvent, StationMeta } from '../../src/model/index.js';
import { projectLocalKm, stationDistanceKm } from '../../src/physics/geo.js';
import { mulberry32 } from '../helpers/random.js';

const HOUR = 3_600_000;

function event(station: string, timeMs: number): PassageEvent {
  return {
    station, kind: 'cold-front', timeMs, timeEarliestMs: timeMs, timeLatestMs: timeMs, confidence: 1, tempChangeC: -5,
    dewpointChangeC: NaN, thetaEChangeK: NaN, pressureMinHpa: NaN, pressureMinTimeMs: NaN, pressureRise3hHpa: NaN,
    windBeforeDeg: NaN, windAfterDeg: NaN, windTurnDeg: NaN, windSpeedAfterMs: NaN, gustMaxMs: NaN, precipNear: false,
    zoneStartMs: timeMs, zoneEndMs: timeMs + HOUR, zoneHours: 1, zoneDepthKm: NaN, gradientKPer100km: NaN,
    observerFropaTimeMs: NaN, windShiftTimeMs: NaN, changeStartTimeMs: NaN, timeBasis: 'change-point', evidence: [],
  };
}

// Analytic construction: the neighbour grid must give exactly the pairs a brute-force all-pairs geodesic
// check gives (Karney2013 distances through stationDistanceKm), for random stations.
test('stationGraph() networks equal the all-pairs geodesic components; neighbours are the nearest linked stations', () => {
  const r = mulberry32(12);
  const stations: StationMeta[] = Array.from({ length: 150 }, (_, i) => ({ id: `S${i}`, aliases: [], elevationM: 0, latDeg: 30 + r() * 25, lonDeg: -120 + r() * 50 }));
  const link = 300;
  const g = stationGraph(stations, link, 5);
  // Brute force: union of all pairs within the link distance.
  const comp = stations.map((_, i) => i);
  const find = (a: number): number => (comp[a] === a ? a : (comp[a] = find(comp[a]!)));
  for (let i = 0; i < stations.length; i++)
    for (let j = i + 1; j < stations.length; j++) {
      const a = stations[i]!, b = stations[j]!;
      if (stationDistanceKm(a.latDeg, a.lonDeg, b.latDeg, b.lonDeg) <= link) comp[Math.max(find(i), find(j))] = Math.min(find(i), find(j));
    }
  for (let i = 0; i < stations.length; i++)
    for (let j = 0; j < stations.length; j++) assert.is(g.network[i] === g.network[j], find(i) === find(j), `${i}–${j}`);
  for (let i = 0; i < stations.length; i++) {
    const a = stations[i]!;
    const d = stations.map((b, j) => ({ j, km: j === i ? Infinity : stationDistanceKm(a.latDeg, a.lonDeg, b.latDeg, b.lonDeg) })).filter((x) => x.km <= link).sort((p, q) => p.km - q.km);
    assert.equal([...g.neighbours[i]!].sort(), d.slice(0, 5).map((x) => x.j).sort(), `neighbours of ${i}`);
  }
});

/**
 * The exhaustive consensus search the tracker had before its neighbourhood structure, written out plainly as
 * the reference: every triplet of passages at three stations within the network's crossing time proposes a
 * plane; the proposal with most stations (then least rss) wins; repeat on the unused passages.
 */
function exhaustiveMembers(events: PassageEvent[], stations: StationMeta[]): string[][] {
  const proj = projectLocalKm(stations);
  const idx = new Map(stations.map((s, i) => [s.id, i]));
  const pts = events.map((e) => ({ e, station: idx.get(e.station)!, x: proj.xKm[idx.get(e.station)!]!, y: proj.yKm[idx.get(e.station)!]!, t: 0 })).sort((a, b) => a.e.timeMs - b.e.timeMs || a.station - b.station);
  const ref = pts[0]!.e.timeMs;
  for (const p of pts) p.t = (p.e.timeMs - ref) / HOUR;
  const tol = 1.5;
  const used = new Uint8Array(pts.length);
  const out: string[][] = [];
  for (;;) {
    let best: { members: number[]; rss: number } | null = null;
    for (let a = 0; a < pts.length; a++)
      for (let b = a + 1; b < pts.length; b++)
        for (let c = b + 1; c < pts.length; c++) {
          if (used[a] || used[b] || used[c]) continue;
          const [pa, pb, pc] = [pts[a]!, pts[b]!, pts[c]!];
          if (pa.station === pb.station || pa.station === pc.station || pb.station === pc.station) continue;
          const plane = fitPlane([pa, pb, pc]);
          if (!plane) continue;
          const v = motionFromSlowness(plane.sx, plane.sy).speedKmh;
          if (!(v >= 5 && v <= 120)) continue;
          const byStation = new Map<number, { k: number; r: number }>();
          pts.forEach((p, k) => {
            if (used[k]) return;
            const r = Math.abs(p.t - (plane.t0 + plane.sx * p.x + plane.sy * p.y));
            if (r > tol) return;
            const prev = byStation.get(p.station);
            if (!prev || r < prev.r) byStation.set(p.station, { k, r });
          });
          const members = [...byStation.values()].map((m) => m.k).sort((u, w) => u - w);
          const rss = [...byStation.values()].reduce((s, m) => s + m.r * m.r, 0);
          if (members.length < 3) continue;
          if (!best || members.length > best.members.length || (members.length === best.members.length && rss < best.rss)) best = { members, rss };
        }
    if (!best) break;
    for (const k of best.members) used[k] = 1;
    out.push(best.members.map((k) => `${pts[k]!.e.station}@${pts[k]!.e.timeMs}`).sort());
  }
  return out.sort();
}

// Reference: the exhaustive search above (the documented method: Fischler & Bolles 1981 consensus, made
// exhaustive). On networks of at most 13 stations every station neighbours every other, so the fronts found
// must be the same passages; checked on random invented networks with fronts, misdetections and decoys.
test('trackFronts() on small networks finds the same fronts as the exhaustive triplet search', () => {
  for (let seed = 1; seed <= 12; seed++) {
    const r = mulberry32(seed);
    const n = 4 + Math.floor(r() * 9);
    const stations: StationMeta[] = Array.from({ length: n }, (_, i) => ({ id: `N${i}`, aliases: [], elevationM: 0, latDeg: 40 + r() * 4, lonDeg: -95 + r() * 6 }));
    const proj = projectLocalKm(stations);
    const events: PassageEvent[] = [];
    for (let f = 0; f < 4; f++) {
      const dir = r() * 2 * Math.PI, speed = 15 + r() * 50, t0 = Date.UTC(2026, 0, 1) + f * 40 * HOUR;
      stations.forEach((s, i) => {
        if (r() < 0.15) return; // missed at this station
        const along = proj.xKm[i]! * Math.sin(dir) + proj.yKm[i]! * Math.cos(dir);
        const noise = (r() - 0.5) * 1.2 * HOUR + (r() < 0.1 ? 6 * HOUR : 0);
        events.push(event(s.id, Math.round(t0 + (along / speed) * HOUR + noise)));
      });
    }
    for (let d = 0; d < 3; d++) events.push(event(stations[Math.floor(r() * n)]!.id, Date.UTC(2026, 0, 1) + Math.floor(r() * 160) * HOUR));
    if (events.length < 3) continue;
    const got = trackFronts(events, stations).map((t) => t.members.map((m) => `${m.station}@${m.event.timeMs}`).sort()).sort();
    assert.equal(got, exhaustiveMembers(events, stations), `seed ${seed}`);
  }
});

// Analytic construction: 1,000 invented stations on a 25 × 40 grid (about 0.35° apart, 34–43° N, 100–86° W),
// three straight fronts a week apart moving toward 110° at 36 km/h (10 m/s), each passage ±20 min of the
// plane (uniform), plus a misdetected station per front 5 h late and random decoys. Every front must come
// out as one track over (nearly) every station with speed and direction close to the planted ones.
test('trackFronts() over 1,000 stations: each planted front is one track, speed within 0.3 m/s and direction within 1°', () => {
  const r = mulberry32(2026);
  const stations: StationMeta[] = [];
  for (let i = 0; i < 25; i++) for (let j = 0; j < 40; j++) stations.push({ id: `G${i}-${j}`, aliases: [], elevationM: 0, latDeg: 34 + i * 0.35 + (r() - 0.5) * 0.1, lonDeg: -100 + j * 0.35 + (r() - 0.5) * 0.1 });
  const proj = projectLocalKm(stations);
  const dir = (110 * Math.PI) / 180, speed = 36;
  const events: PassageEvent[] = [];
  for (let f = 0; f < 3; f++) {
    const t0 = Date.UTC(2026, 1, 1) + f * 7 * 24 * HOUR;
    stations.forEach((s, i) => {
      const along = proj.xKm[i]! * Math.sin(dir) + proj.yKm[i]! * Math.cos(dir);
      const late = i === 500 + f ? 5 * HOUR : 0;
      events.push(event(s.id, Math.round(t0 + (along / speed) * HOUR + (r() - 0.5) * (40 / 60) * HOUR + late)));
    });
  }
  for (let d = 0; d < 300; d++) events.push(event(stations[Math.floor(r() * 1000)]!.id, Date.UTC(2026, 1, 1) + Math.floor(r() * 21 * 24) * HOUR));
  const tracks = trackFronts(events, stations).filter((t) => t.members.length >= 100);
  assert.is(tracks.length, 3);
  for (const t of tracks) {
    assert.ok(t.members.length >= 990, `${t.id}: ${t.members.length} members`);
    assert.ok(Math.abs(t.speedKmh - speed) / 3.6 < 0.3, `${t.id}: speed ${t.speedKmh} km/h`);
    assert.ok(Math.abs(t.directionDeg - 110) < 1, `${t.id}: direction ${t.directionDeg}°`);
  }
});

// Construction after the real case the tracker once merged (a 2010 network west of the Great Lakes and a
// 2013 network at New York, about 650 km apart): invented stations, two regions within the link distance whose
// data spans do not overlap. They must be separate networks and a front of one must expect nothing of the other.
test('trackFronts() never links stations whose data do not overlap in time, nor expects a passage where no data were', () => {
  const west: StationMeta[] = [0, 1, 2, 3].map((i) => ({ id: `W${i}`, aliases: [], elevationM: 0, latDeg: 42 + (i % 2) * 1.5, lonDeg: -88 + i * 1.2 }));
  const east: StationMeta[] = [0, 1, 2].map((i) => ({ id: `E${i}`, aliases: [], elevationM: 0, latDeg: 40.7 + (i % 2) * 0.3, lonDeg: -81.5 + i * 0.4 }));
  const all = [...west, ...east];
  const y2010 = { startMs: Date.UTC(2010, 9, 1), endMs: Date.UTC(2010, 10, 1) };
  const y2013 = { startMs: Date.UTC(2013, 0, 1), endMs: Date.UTC(2014, 0, 1) };
  const spans = new Map([...west.map((s) => [s.id, y2010] as const), ...east.map((s) => [s.id, y2013] as const)]);
  assert.is(networksOf(all, 800).length, 1, 'without spans the regions are within the link distance');
  assert.is(networksOf(all, 800, spans).length, 2);
  const t0 = Date.UTC(2010, 9, 26, 10);
  const events = west.map((s, i) => event(s.id, t0 + i * 2 * HOUR));
  const t1 = Date.UTC(2013, 0, 14, 15);
  events.push(...east.map((s, i) => event(s.id, t1 + i * HOUR)));
  const tracks = trackFronts(events, all, { spans });
  assert.is(tracks.length, 2);
  for (const t of tracks) {
    const region = t.members[0]!.station[0];
    assert.ok(t.members.every((m) => m.station[0] === region), t.id);
    assert.ok(t.expected.every((x) => x.station[0] === region), `${t.id} expects ${t.expected.map((x) => x.station).join(', ')}`);
  }
});

test.run();
