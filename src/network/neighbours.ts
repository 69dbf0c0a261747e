/**
 * The neighbourhood structure of a station network, built in about linear time: stations are binned in a
 * uniform grid over their unit vectors (cells one link distance wide), so each station is compared only
 * with the stations of its own and the 26 adjacent cells, never with all others (the cell-list method of
 * spatial hashing; Bentley & Friedman 1979, "Data structures for range searching", ACM Computing Surveys
 * 11(4)). From it: the networks (connected components of "closer than the link distance and reporting over
 * a common period", by union–find, Tarjan 1975) and each station's k nearest neighbours.
 */
import type { StationMeta } from '../model/index.js';
import { haversineDistanceM, stationDistanceKm } from '../physics/geo.js';
import { EARTH_MEAN_RADIUS_M } from '../physics/constants.js';

/** When a station reported: its first and last observation, epoch ms UTC. */
export interface StationSpan {
  startMs: number;
  endMs: number;
}

/** Neighbourhood of a set of stations (indices into the array given to {@link stationGraph}). */
export interface StationGraph {
  /** Network (component) number of each station; networks are numbered by their first station. */
  network: Int32Array;
  /** Number of networks. */
  networks: number;
  /** Per station: up to k nearest linked stations, nearest first (ties by index). */
  neighbours: Int32Array[];
  /** Per station: distances of `neighbours`, km (spherical, IUGG mean radius). */
  neighbourKm: Float64Array[];
}

const DEG = Math.PI / 180;

/** Two spans share some time (a missing span counts as sharing: stations without data spans link by distance alone). */
export function spansOverlap(a: StationSpan | undefined, b: StationSpan | undefined): boolean {
  if (!a || !b) return true;
  return a.startMs <= b.endMs && b.startMs <= a.endMs;
}

/**
 * Networks and nearest neighbours. Two stations are linked when their ellipsoidal distance (Karney2013 via
 * `stationDistanceKm`) is at most `linkKm` and their spans overlap; screening uses the haversine distance, and
 * the geodesic only decides the pairs within 0.6 % of the threshold (the sphere and the ellipsoid differ by
 * at most about 0.5 %), so the links are exactly the geodesic ones. Neighbours are the `k` nearest linked
 * stations. Stations must have finite coordinates. Pure and deterministic.
 * @example stationGraph([{ id: 'A', aliases: [], latDeg: 0, lonDeg: 0 }, { id: 'B', aliases: [], latDeg: 0, lonDeg: 1 }], 800, 4).networks // 1
 */
export function stationGraph(stations: readonly StationMeta[], linkKm: number, k: number, spans?: ReadonlyMap<string, StationSpan>): StationGraph {
  const n = stations.length;
  const ux = new Float64Array(n), uy = new Float64Array(n), uz = new Float64Array(n);
  for (let i = 0; i < n; i++) {
    const la = stations[i]!.latDeg * DEG, lo = stations[i]!.lonDeg * DEG;
    ux[i] = Math.cos(la) * Math.cos(lo);
    uy[i] = Math.cos(la) * Math.sin(lo);
    uz[i] = Math.sin(la);
  }
  // Cell edge: the chord of the link distance (plus the screening margin), at least a tiny positive size.
  const angle = Math.min(Math.PI, (linkKm * 1.006 * 1000) / EARTH_MEAN_RADIUS_M);
  const cell = Math.max(1e-9, 2 * Math.sin(angle / 2));
  const key = (a: number, b: number, c: number) => `${a},${b},${c}`;
  const cells = new Map<string, number[]>();
  const ci = new Int32Array(n), cj = new Int32Array(n), ck = new Int32Array(n);
  for (let i = 0; i < n; i++) {
    ci[i] = Math.floor(ux[i]! / cell);
    cj[i] = Math.floor(uy[i]! / cell);
    ck[i] = Math.floor(uz[i]! / cell);
    const kk = key(ci[i]!, cj[i]!, ck[i]!);
    const list = cells.get(kk);
    if (list) list.push(i);
    else cells.set(kk, [i]);
  }
  const parent = new Int32Array(n);
  for (let i = 0; i < n; i++) parent[i] = i;
  const find = (a: number): number => {
    while (parent[a] !== a) {
      parent[a] = parent[parent[a]!]!;
      a = parent[a]!;
    }
    return a;
  };
  const neighbours: Int32Array[] = [];
  const neighbourKm: Float64Array[] = [];
  const lo = linkKm * 0.994, hi = linkKm * 1.006;
  for (let i = 0; i < n; i++) {
    const si = stations[i]!;
    const spanI = spans?.get(si.id);
    const near: { j: number; km: number }[] = [];
    for (let a = -1; a <= 1; a++)
      for (let b = -1; b <= 1; b++)
        for (let c = -1; c <= 1; c++) {
          const list = cells.get(key(ci[i]! + a, cj[i]! + b, ck[i]! + c));
          if (!list) continue;
          for (const j of list) {
            if (j === i) continue;
            const sj = stations[j]!;
            const km = haversineDistanceM(si.latDeg, si.lonDeg, sj.latDeg, sj.lonDeg) / 1000;
            if (km > hi) continue;
            if (km > lo && stationDistanceKm(si.latDeg, si.lonDeg, sj.latDeg, sj.lonDeg) > linkKm) continue;
            if (!spansOverlap(spanI, spans?.get(sj.id))) continue;
            near.push({ j, km });
            if (j > i) {
              const ra = find(i), rb = find(j);
              if (ra !== rb) parent[Math.max(ra, rb)] = Math.min(ra, rb);
            }
          }
        }
    near.sort((p, q) => p.km - q.km || p.j - q.j);
    const top = near.slice(0, k);
    neighbours.push(Int32Array.from(top, (p) => p.j));
    neighbourKm.push(Float64Array.from(top, (p) => p.km));
  }
  // Number the networks in the order of their first station.
  const network = new Int32Array(n).fill(-1);
  const number = new Map<number, number>();
  for (let i = 0; i < n; i++) {
    const r = find(i);
    let c = number.get(r);
    if (c === undefined) {
      c = number.size;
      number.set(r, c);
    }
    network[i] = c;
  }
  return { network, networks: number.size, neighbours, neighbourKm };
}

/** Stations grouped into networks (see {@link stationGraph}), in the order of their first station; each network keeps the input order. */
export function networksOf(stations: readonly StationMeta[], linkKm: number, spans?: ReadonlyMap<string, StationSpan>): StationMeta[][] {
  const g = stationGraph(stations, linkKm, 0, spans);
  const out: StationMeta[][] = Array.from({ length: g.networks }, () => []);
  for (let i = 0; i < stations.length; i++) out[g.network[i]!]!.push(stations[i]!);
  return out;
}
