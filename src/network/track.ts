/**
 * Tracking a front across a station network: which station passages belong to one front, and how the
 * front moves. A straight front moving steadily passes station i (position x_i, local east/north km) at
 * t_i = t0 + s·x_i; the slowness vector s gives the speed 1/|s| and the direction of motion s/|s|
 * (the plane-wave or "time-of-arrival" fit used for fronts and squall lines across mesonets).
 * Grouping is a deterministic consensus search (every triplet of passages at three stations proposes a
 * plane; the proposal explaining most stations within the tolerance wins; Fischler & Bolles 1981, RANSAC,
 * made exhaustive), refined by iteratively reweighted least squares with Huber weights (Huber 1964) so
 * that one misdetected station does not bend the fit.
 * Strength along the track: the temperature change regressed on the along-track distance; growing change
 * is strengthening (frontogenesis), shrinking change with a widening zone is weakening (frontolysis).
 */
import type { BoundaryKind, FrontTrack, PassageEvent, StationMeta, StrengthTrend, TrackMember } from '../model/index.js';
import { projectLocalKm } from '../physics/geo.js';
import { stationGraph, type StationSpan } from './neighbours.js';
export { networksOf, type StationSpan } from './neighbours.js';

/** @deprecated Re-exported for old import paths; import from src/model/. */
export type { FrontTrack, StrengthTrend, TrackMember } from '../model/track.js';
import { MS_PER_HOUR } from '../physics/constants.js';
import { leastSquaresPlane, PLANE_DEGENERATE_RATIO } from './leastSquaresPlane.js';

export interface TrackOptions {
  /** Kinds to track (default cold, warm and occluded fronts, drylines). */
  kinds?: readonly BoundaryKind[];
  /** Largest residual of a member, minutes (default 90). */
  toleranceMin?: number;
  /** Plausible front speeds, km/h (default 5–120). */
  minSpeedKmh?: number;
  maxSpeedKmh?: number;
  /** Stations farther apart than this are separate networks (default 800 km). */
  linkKm?: number;
  /** Fewest stations for a track (default 3: a plane needs three). */
  minStations?: number;
  /** Nearest stations each station is linked to (default 12). */
  neighbours?: number;
  /** When each station reported (first and last observation); stations that never reported at the same time are never linked. */
  spans?: ReadonlyMap<string, StationSpan>;
}

interface Point {
  e: PassageEvent;
  station: number;
  x: number;
  y: number;
  t: number; // hours since the group's reference time
}

interface Plane {
  t0: number;
  sx: number;
  sy: number;
}

/**
 * Least-squares plane t = t0 + sx·x + sy·y (t in h, x and y in km, slowness sx, sy in h/km) with optional weights,
 * by `leastSquaresPlane` (its missing-value and collinearity rules); null when degenerate.
 */
export function fitPlane(pts: readonly { x: number; y: number; t: number }[], w?: readonly number[]): Plane | null {
  const n = pts.length;
  const x = new Float64Array(n), y = new Float64Array(n), t = new Float64Array(n);
  for (let i = 0; i < n; i++) {
    x[i] = pts[i]!.x;
    y[i] = pts[i]!.y;
    t[i] = pts[i]!.t;
  }
  const p = leastSquaresPlane(x, y, t, w);
  if (Number.isNaN(p.dfdx)) return null;
  return { t0: p.mean - p.dfdx * p.meanX - p.dfdy * p.meanY, sx: p.dfdx, sy: p.dfdy };
}

/** Speed (km/h) and direction of motion (degrees true) from a slowness vector in h/km. */
export function motionFromSlowness(sx: number, sy: number): { speedKmh: number; directionDeg: number } {
  const m = Math.hypot(sx, sy);
  const dir = ((Math.atan2(sx, sy) * 180) / Math.PI + 360) % 360;
  return { speedKmh: m > 0 ? 1 / m : Infinity, directionDeg: dir };
}

/** Robust refit (Huber weights, k = 1.345 × scale; Huber1964) over the points; returns the plane and weights. */
function robustFit(pts: Point[], scaleH: number): { plane: Plane; weights: number[] } | null {
  let w = pts.map(() => 1);
  let plane = fitPlane(pts, w);
  for (let it = 0; it < 10 && plane; it++) {
    const k = 1.345 * scaleH;
    w = pts.map((p) => {
      const r = Math.abs(p.t - (plane!.t0 + plane!.sx * p.x + plane!.sy * p.y));
      return r <= k ? 1 : k / r;
    });
    const next = fitPlane(pts, w);
    if (!next) break;
    plane = next;
  }
  return plane ? { plane, weights: w } : null;
}

/** Ordinary least-squares slope of y on x (NaN with fewer than 3 finite pairs or no spread). */
function slope(xs: number[], ys: number[]): { slope: number; t: number } {
  const pts = xs.map((x, i) => [x, ys[i]!] as const).filter(([x, y]) => Number.isFinite(x) && Number.isFinite(y));
  const n = pts.length;
  if (n < 3) return { slope: NaN, t: NaN };
  const mx = pts.reduce((s, p) => s + p[0], 0) / n;
  const my = pts.reduce((s, p) => s + p[1], 0) / n;
  let sxx = 0, sxy = 0;
  for (const [x, y] of pts) {
    sxx += (x - mx) ** 2;
    sxy += (x - mx) * (y - my);
  }
  if (!(sxx > 0)) return { slope: NaN, t: NaN };
  const b = sxy / sxx;
  let sse = 0;
  for (const [x, y] of pts) sse += (y - my - b * (x - mx)) ** 2;
  const se = Math.sqrt(sse / Math.max(1, n - 2) / sxx);
  return { slope: b, t: se > 0 ? b / se : b === 0 ? 0 : Infinity };
}

/**
 * Along-track strength: slope of |ΔT| (half diurnally adjusted, see below) and of zone depth against along-track distance.
 * Strengthening when |ΔT| grows by more than 0.5 °C per 100 km with t ≥ 2 and by 40 % of its mean across
 * the track; weakening when it shrinks likewise (or the zone widens by more than 20 km per 100 km with
 * t ≥ 2 while |ΔT| does not grow). Thresholds: common practice, no source.
 */
export function strengthTrend(members: readonly TrackMember[], speedKmh: number, kind: BoundaryKind = 'cold-front'): { trend: StrengthTrend; dT: number; dZone: number } {
  // Warm fronts change too gradually, and occluded fronts too little, for a station's change to measure
  // the front's strength; drylines are measured by their dew-point fall.
  if (kind !== 'cold-front' && kind !== 'dryline') return { trend: 'unknown', dT: NaN, dZone: NaN };
  const a = members.map((m) => m.alongKm);
  // The front crosses a network in hours, and the time of day alone would make it look stronger by night
  // and weaker by day; a station's median diurnal cycle overstates the cycle of a cloudy frontal day. So
  // the size is the mean of the observed and the diurnally adjusted change (half the expected diurnal
  // change removed). common practice, no source.
  const size = members.map((m) =>
    kind === 'dryline' ? Math.abs(m.event.dewpointChangeC) : Math.abs((m.event.tempChangeC + (m.event.tempChangeAdjustedC ?? m.event.tempChangeC)) / 2),
  );
  const s = slope(a, size);
  const z = slope(a, members.map((m) => m.event.zoneHours * speedKmh));
  const dT = s.slope * 100;
  const dZone = z.slope * 100;
  if (!Number.isFinite(dT)) return { trend: 'unknown', dT, dZone };
  // Change across the track relative to the mean size: a trend must matter, not only be significant.
  const span = Math.max(...a) - Math.min(...a);
  const meanSize = size.reduce((p, q) => p + q, 0) / size.length;
  const relative = meanSize > 0 ? (s.slope * span) / meanSize : 0;
  if (dT > 0.5 && s.t >= 2 && relative >= 0.4) return { trend: 'strengthening', dT, dZone };
  if ((dT < -0.5 && s.t <= -2 && relative <= -0.4) || (dZone > 20 && z.t >= 2 && dT <= 0)) return { trend: 'weakening', dT, dZone };
  return { trend: 'steady', dT, dZone };
}

/**
 * Group passages into fronts and fit their motion. Pure and deterministic: the same events and stations
 * give the same tracks, whatever their order. Events at stations without coordinates are left out.
 *
 * Cost about linear in stations and passages: stations are linked to their `neighbours` nearest stations
 * (neighbours.ts); a proposal is a triplet of passages at a station and two of its neighbours whose times
 * a front of plausible speed could join, scored by the passages near its plane at that station and its
 * neighbours; the best proposal of all (most stations, then least squared residual, then the first in time)
 * is taken, grown from station to neighbouring station while passages lie within the tolerance of its
 * plane, refitted and removed, and the next best taken. Each passage keeps only its own best proposal in a
 * priority queue, re-scored lazily when its turn comes (a score only worsens as passages are used, so this
 * takes the same proposals as re-scoring everything after each front). On a network of at most
 * `neighbours` + 1 stations every station is every other's neighbour and the search is the exhaustive one.
 * Stations whose data do not overlap in time are never linked (`spans`), so two regions observed in
 * different years never share a front, a network or an expected passage.
 */
export function trackFronts(events: readonly PassageEvent[], stations: readonly StationMeta[], opts: TrackOptions = {}): FrontTrack[] {
  const kinds = opts.kinds ?? (['cold-front', 'warm-front', 'occluded-front', 'dryline'] as const);
  const tolH = (opts.toleranceMin ?? 90) / 60;
  const minSpeed = opts.minSpeedKmh ?? 5;
  const maxSpeed = opts.maxSpeedKmh ?? 120;
  const minStations = opts.minStations ?? 3;
  const located = stations.filter((s) => Number.isFinite(s.latDeg) && Number.isFinite(s.lonDeg));
  const graph = stationGraph(located, opts.linkKm ?? 800, opts.neighbours ?? 12, opts.spans);
  const nets: number[][] = Array.from({ length: graph.networks }, () => []);
  for (let i = 0; i < located.length; i++) nets[graph.network[i]!]!.push(i);
  const eventsByStation = new Map<string, PassageEvent[]>();
  for (const e of events) {
    const list = eventsByStation.get(e.station);
    if (list) list.push(e);
    else eventsByStation.set(e.station, [e]);
  }
  const tracks: FrontTrack[] = [];
  for (const members of nets) {
    if (members.length < minStations) continue;
    const net = members.map((i) => located[i]!);
    const local = new Map(members.map((g, i) => [g, i]));
    const nb = members.map((g) => Array.from(graph.neighbours[g]!, (j) => local.get(j)!));
    const proj = projectLocalKm(net);
    for (const kind of kinds) {
      const pts: Point[] = [];
      net.forEach((s, i) => {
        for (const e of eventsByStation.get(s.id) ?? []) if (e.kind === kind) pts.push({ e, station: i, x: proj.xKm[i]!, y: proj.yKm[i]!, t: 0 });
      });
      pts.sort((a, b) => a.e.timeMs - b.e.timeMs || a.station - b.station);
      if (pts.length < minStations) continue;
      const ref = pts[0]!.e.timeMs;
      for (const p of pts) p.t = (p.e.timeMs - ref) / MS_PER_HOUR;
      const search = new TrackSearch(pts, net.length, proj.xKm, proj.yKm, nb, tolH, minSpeed, maxSpeed, minStations);
      for (const found of search.run()) {
        const memberPts = found.members.map((k) => pts[k]!);
        const fit = robustFit(memberPts, Math.max(tolH / 3, 0.25));
        const plane = fit?.plane ?? found.plane;
        tracks.push(buildTrack(kind, memberPts, plane, ref, net, proj, expectedStations(found.members, pts, nb, net.length), opts.spans));
      }
    }
  }
  tracks.sort((a, b) => a.t0Ms - b.t0Ms || a.kind.localeCompare(b.kind));
  const counter = new Map<string, number>();
  for (const t of tracks) {
    const day = new Date(t.t0Ms).toISOString().slice(0, 10);
    const key = `${t.kind} ${day}`;
    const n = (counter.get(key) ?? 0) + 1;
    counter.set(key, n);
    t.id = `${key}${n > 1 ? ` #${n}` : ''}`;
  }
  return tracks;
}

/** Stations next to a front: the members' neighbours that are not members themselves (network-local indices, ascending). */
function expectedStations(members: readonly number[], pts: readonly Point[], nb: readonly (readonly number[])[], n: number): number[] {
  const have = new Uint8Array(n);
  for (const k of members) have[pts[k]!.station] = 1;
  const near = new Uint8Array(n);
  for (const k of members) for (const j of nb[pts[k]!.station]!) if (!have[j]) near[j] = 1;
  const out: number[] = [];
  for (let i = 0; i < n; i++) if (near[i]) out.push(i);
  return out;
}

interface Proposal {
  members: number[];
  plane: Plane;
  rss: number;
}

/** Max-heap order of proposals: more stations, then smaller rss, then the earlier seed passage. */
function better(countA: number, rssA: number, seedA: number, countB: number, rssB: number, seedB: number): boolean {
  return countA !== countB ? countA > countB : rssA !== rssB ? rssA < rssB : seedA < seedB;
}

/**
 * The greedy consensus search of {@link trackFronts} over one kind in one network, on columnar arrays:
 * passage times, stations and coordinates in typed arrays, each station's passages as one slice of a
 * flat index (compressed rows), its neighbours likewise, and no allocation in the proposal loop.
 */
class TrackSearch {
  private readonly used: Uint8Array;
  /** Passage k: hours since the reference time, station, position (km). */
  private readonly pt: Float64Array;
  private readonly ps: Int32Array;
  /** Station positions, km. */
  private readonly stX: Float64Array;
  private readonly stY: Float64Array;
  /** Passages of station s, in time order: indices atK[atStart[s] … atStart[s + 1]) into pts, their times atT. */
  private readonly atStart: Int32Array;
  private readonly atK: Int32Array;
  private readonly atT: Float64Array;
  /** Neighbours of station s: nbList[nbStart[s] … nbStart[s + 1]); nbLimitH: the largest time a front slower than minSpeed takes to reach each. */
  private readonly nbStart: Int32Array;
  private readonly nbList: Int32Array;
  private readonly nbLimitH: Float64Array;
  /** Candidate passages of the proposal being built (reused). */
  private cands: Int32Array;
  /** Result of {@link nearest}: the passage and its residual (h). */
  private nearK = -1;
  private nearR = Infinity;
  /** Result of {@link score} and {@link bestScore}: count and squared residuals; the best plane. */
  private scoreRss = 0;
  private bestCount = 0;
  private bestRss = 0;
  private bestT0 = 0;
  private bestSx = 0;
  private bestSy = 0;
  constructor(
    private readonly pts: readonly Point[],
    stations: number,
    xKm: ArrayLike<number>,
    yKm: ArrayLike<number>,
    private readonly nb: readonly (readonly number[])[],
    private readonly tolH: number,
    private readonly minSpeed: number,
    private readonly maxSpeed: number,
    private readonly minStations: number,
  ) {
    const n = pts.length;
    this.used = new Uint8Array(n);
    this.pt = new Float64Array(n);
    this.ps = new Int32Array(n);
    this.stX = Float64Array.from({ length: stations }, (_, s) => xKm[s]!);
    this.stY = Float64Array.from({ length: stations }, (_, s) => yKm[s]!);
    this.atStart = new Int32Array(stations + 1);
    for (let k = 0; k < n; k++) {
      this.pt[k] = pts[k]!.t;
      this.ps[k] = pts[k]!.station;
      this.atStart[pts[k]!.station + 1]!++;
    }
    for (let s = 0; s < stations; s++) this.atStart[s + 1]! += this.atStart[s]!;
    this.atK = new Int32Array(n);
    this.atT = new Float64Array(n);
    const fill = this.atStart.slice(0, stations);
    for (let k = 0; k < n; k++) {
      const q = fill[this.ps[k]!]!++;
      this.atK[q] = k;
      this.atT[q] = this.pt[k]!;
    }
    this.nbStart = new Int32Array(stations + 1);
    for (let s = 0; s < stations; s++) this.nbStart[s + 1] = this.nbStart[s]! + nb[s]!.length;
    this.nbList = new Int32Array(this.nbStart[stations]!);
    this.nbLimitH = new Float64Array(this.nbStart[stations]!);
    let cap = 0;
    for (let s = 0; s < stations; s++) {
      let here = 0;
      nb[s]!.forEach((j, q) => {
        this.nbList[this.nbStart[s]! + q] = j;
        this.nbLimitH[this.nbStart[s]! + q] = Math.hypot(this.stX[j]! - this.stX[s]!, this.stY[j]! - this.stY[s]!) / minSpeed + 1e-9;
        here += this.atStart[j + 1]! - this.atStart[j]!;
      });
      cap = Math.max(cap, here);
    }
    this.cands = new Int32Array(cap);
  }

  /** Every front, best first. */
  *run(): Generator<Proposal> {
    const heap = new SeedHeap();
    // A score depends only on which passages are used, so a score computed since the last front was taken is current.
    let epoch = 0;
    for (let a = 0; a < this.pts.length; a++) if (this.bestScore(a)) heap.push(a, this.bestCount, this.bestRss, epoch);
    for (;;) {
      const top = heap.pop();
      if (!top) return;
      if (this.used[top.seed]) continue;
      if (top.epoch !== epoch) {
        if (!this.bestScore(top.seed)) continue;
        if (this.bestCount !== top.count || this.bestRss !== top.rss) {
          heap.push(top.seed, this.bestCount, this.bestRss, epoch);
          continue;
        }
      } else this.bestScore(top.seed);
      const plane: Plane = { t0: this.bestT0, sx: this.bestSx, sy: this.bestSy };
      const best = this.consensus(this.ps[top.seed]!, plane);
      const members = this.grow({ ...best, plane });
      for (const k of members) this.used[k] = 1;
      epoch++;
      yield { members, plane, rss: best.rss };
    }
  }

  /** The unused passage at a station nearest the plane within the tolerance (the earlier on ties): sets nearK (or -1) and nearR, returns nearK. */
  private nearest(station: number, t0: number, sx: number, sy: number): number {
    const start = this.atStart[station]!, end = this.atStart[station + 1]!;
    let k = -1, r = Infinity;
    if (start < end) {
      const tau = t0 + sx * this.stX[station]! + sy * this.stY[station]!;
      const low = tau - this.tolH, high = tau + this.tolH;
      const atT = this.atT;
      let lo = start, hi = end;
      while (lo < hi) {
        const m = (lo + hi) >> 1;
        if (atT[m]! < low) lo = m + 1;
        else hi = m;
      }
      for (let q = lo; q < end; q++) {
        const t = atT[q]!;
        if (t > high) break;
        const idx = this.atK[q]!;
        if (this.used[idx]) continue;
        const d = Math.abs(t - tau);
        if (d <= this.tolH && d < r) {
          k = idx;
          r = d;
        }
      }
    }
    this.nearK = k;
    this.nearR = r;
    return k;
  }

  /** Consensus of a plane over a station and its neighbours: members (ascending) and their squared residuals. */
  private consensus(station: number, plane: Plane): { members: number[]; rss: number } {
    const members: number[] = [];
    let rss = 0;
    const s0 = this.nbStart[station]!, s1 = this.nbStart[station + 1]!;
    for (let q = s0 - 1; q < s1; q++) {
      if (this.nearest(q < s0 ? station : this.nbList[q]!, plane.t0, plane.sx, plane.sy) < 0) continue;
      members.push(this.nearK);
      rss += this.nearR * this.nearR;
    }
    return { members: members.sort((u, v) => u - v), rss };
  }

  /**
   * The count of {@link consensus} (its rss in scoreRss), or -1 as soon as it can no longer beat `need` stations
   * (more stations, or as many with a smaller rss than `needRss`): the rss only grows as stations are added, so
   * a proposal cut short could not have won.
   */
  private score(station: number, t0: number, sx: number, sy: number, need: number, needRss: number): number {
    let count = 0, rss = 0;
    const s0 = this.nbStart[station]!, s1 = this.nbStart[station + 1]!;
    for (let q = s0 - 1; q < s1; q++) {
      if (this.nearest(q < s0 ? station : this.nbList[q]!, t0, sx, sy) >= 0) {
        count++;
        rss += this.nearR * this.nearR;
      }
      const most = count + (s1 - 1 - q);
      if (most < need || (most === need && !(rss < needRss))) return -1;
    }
    this.scoreRss = rss;
    return count;
  }

  /**
   * Best proposal seeded at passage a (a and two later passages at its neighbours): false when there is none,
   * else true with its count, rss and plane in bestCount, bestRss, bestT0, bestSx, bestSy.
   */
  private bestScore(a: number): boolean {
    if (this.used[a]) return false;
    const pt = this.pt, ps = this.ps, pts = this.pts;
    const sa = ps[a]!, ta = pt[a]!;
    // Later passages at neighbouring stations that a front slower than minSpeed could not join are skipped:
    // on a plane with |s| ≤ 1/minSpeed, |t_b − t_a| ≤ distance / minSpeed.
    const cands = this.cands;
    let nc = 0;
    for (let q = this.nbStart[sa]!; q < this.nbStart[sa + 1]!; q++) {
      const s = this.nbList[q]!, limit = this.nbLimitH[q]!;
      const end = this.atStart[s + 1]!;
      let lo = this.atStart[s]!, hi = end;
      while (lo < hi) {
        const m = (lo + hi) >> 1;
        if (this.atK[m]! <= a) lo = m + 1;
        else hi = m;
      }
      for (let r = lo; r < end; r++) {
        const k = this.atK[r]!;
        if (this.used[k]) continue;
        if (this.atT[r]! - ta > limit) break;
        cands[nc++] = k;
      }
    }
    cands.subarray(0, nc).sort();
    // No proposal yet: one needs minStations stations; then it must beat the best so far.
    let need = this.minStations, needRss = Infinity, found = false;
    const pa = pts[a]!;
    for (let i = 0; i < nc; i++) {
      const b = cands[i]!, pb = pts[b]!;
      for (let j = i + 1; j < nc; j++) {
        const c = cands[j]!;
        if (ps[c] === ps[b]) continue;
        const pc = pts[c]!;
        // {@link fitPlane} of the three points without allocating: the same sums in the same order as
        // `leastSquaresPlane` with unit weights, so the same plane to the last bit.
        const mx = (pa.x + pb.x + pc.x) / 3, my = (pa.y + pb.y + pc.y) / 3, mf = (ta + pt[b]! + pt[c]!) / 3;
        const ax = pa.x - mx, ay = pa.y - my, af = ta - mf;
        const bx = pb.x - mx, by = pb.y - my, bf = pt[b]! - mf;
        const cx = pc.x - mx, cy = pc.y - my, cf = pt[c]! - mf;
        const sxx = ax * ax + bx * bx + cx * cx, sxy = ax * ay + bx * by + cx * cy, syy = ay * ay + by * by + cy * cy;
        const sxf = ax * af + bx * bf + cx * cf, syf = ay * af + by * bf + cy * cf;
        const det = sxx * syy - sxy * sxy;
        if (!(Math.abs(det) > PLANE_DEGENERATE_RATIO * (sxx + syy) * (sxx + syy))) continue;
        const sx = (sxf * syy - syf * sxy) / det, sy = (syf * sxx - sxf * sxy) / det;
        const m = Math.hypot(sx, sy);
        const speedKmh = m > 0 ? 1 / m : Infinity;
        if (!(speedKmh >= this.minSpeed && speedKmh <= this.maxSpeed)) continue;
        const t0 = mf - sx * mx - sy * my;
        const count = this.score(sa, t0, sx, sy, need, needRss);
        if (count < 0) continue;
        if (count > need || (count === need && this.scoreRss < needRss)) {
          need = count;
          needRss = this.scoreRss;
          this.bestT0 = t0;
          this.bestSx = sx;
          this.bestSy = sy;
          found = true;
        }
      }
    }
    this.bestCount = need;
    this.bestRss = needRss;
    return found;
  }

  /**
   * Members of a proposal grown breadth-first from station to neighbouring station while passages lie within
   * the tolerance of its plane (ascending). The plane is refitted (least squares) each time the members have
   * grown by half, so a front followed across hundreds of stations is not held to the plane of its first
   * three; a station tried under an older plane is tried again under the new one.
   */
  private grow(p: Proposal): number[] {
    const n = this.stX.length;
    const tried = new Int32Array(n).fill(-1);
    const member = new Uint8Array(n);
    const members = [...p.members];
    let plane = p.plane;
    let version = 0;
    let refitAt = Math.ceil(members.length * 1.5);
    const queue: number[] = [];
    for (const k of members) member[this.ps[k]!] = 1;
    const seed = this.ps[p.members[0]!]!;
    for (const s of this.nb[seed]!) tried[s] = 0;
    for (const k of members) queue.push(this.ps[k]!);
    for (let head = 0; head < queue.length; head++) {
      const s = queue[head]!;
      for (let q = this.nbStart[s]!; q < this.nbStart[s + 1]!; q++) {
        const j = this.nbList[q]!;
        if (member[j] || tried[j] === version) continue;
        tried[j] = version;
        const k = this.nearest(j, plane.t0, plane.sx, plane.sy);
        if (k < 0) continue;
        members.push(k);
        member[j] = 1;
        queue.push(j);
        if (members.length >= refitAt) {
          const next = fitPlane(members.map((m) => this.pts[m]!));
          if (next && motionFromSlowness(next.sx, next.sy).speedKmh >= this.minSpeed) {
            plane = next;
            version++;
            // Stations of the queue so far are visited again under the new plane.
            for (const k2 of members) queue.push(this.ps[k2]!);
          }
          refitAt = Math.ceil(members.length * 1.5);
        }
      }
    }
    return members.sort((u, v) => u - v);
  }
}

/**
 * Binary max-heap of seed passages keyed by their best proposal's score (see {@link better}); each entry
 * also carries the epoch its score was computed in. A seed is in the heap at most once, so the order is total.
 */
class SeedHeap {
  private seeds: number[] = [];
  private counts: number[] = [];
  private rsss: number[] = [];
  private epochs: number[] = [];
  push(seed: number, count: number, rss: number, epoch: number): void {
    this.seeds.push(seed);
    this.counts.push(count);
    this.rsss.push(rss);
    this.epochs.push(epoch);
    let i = this.seeds.length - 1;
    while (i > 0) {
      const parent = (i - 1) >> 1;
      if (!this.above(i, parent)) break;
      this.swap(i, parent);
      i = parent;
    }
  }
  pop(): { seed: number; count: number; rss: number; epoch: number } | null {
    if (this.seeds.length === 0) return null;
    const top = { seed: this.seeds[0]!, count: this.counts[0]!, rss: this.rsss[0]!, epoch: this.epochs[0]! };
    const last = this.seeds.length - 1;
    this.swap(0, last);
    this.seeds.pop();
    this.counts.pop();
    this.rsss.pop();
    this.epochs.pop();
    let i = 0;
    for (;;) {
      const l = 2 * i + 1, r = l + 1;
      let m = i;
      if (l < this.seeds.length && this.above(l, m)) m = l;
      if (r < this.seeds.length && this.above(r, m)) m = r;
      if (m === i) break;
      this.swap(i, m);
      i = m;
    }
    return top;
  }
  private above(i: number, j: number): boolean {
    return better(this.counts[i]!, this.rsss[i]!, this.seeds[i]!, this.counts[j]!, this.rsss[j]!, this.seeds[j]!);
  }
  private swap(i: number, j: number): void {
    const s = this.seeds[i]!, c = this.counts[i]!, r = this.rsss[i]!, e = this.epochs[i]!;
    this.seeds[i] = this.seeds[j]!;
    this.counts[i] = this.counts[j]!;
    this.rsss[i] = this.rsss[j]!;
    this.epochs[i] = this.epochs[j]!;
    this.seeds[j] = s;
    this.counts[j] = c;
    this.rsss[j] = r;
    this.epochs[j] = e;
  }
}

function buildTrack(
  kind: BoundaryKind,
  pts: Point[],
  plane: Plane,
  refMs: number,
  net: StationMeta[],
  proj: { xKm: Float64Array; yKm: Float64Array; origin: { latDeg: number; lonDeg: number } },
  near: readonly number[],
  spans: ReadonlyMap<string, StationSpan> | undefined,
): FrontTrack {
  const motion = motionFromSlowness(plane.sx, plane.sy);
  const ux = Math.sin((motion.directionDeg * Math.PI) / 180);
  const uy = Math.cos((motion.directionDeg * Math.PI) / 180);
  const members: TrackMember[] = pts.map((p) => ({
    station: p.e.station,
    event: p.e,
    xKm: p.x,
    yKm: p.y,
    residualMin: (p.t - (plane.t0 + plane.sx * p.x + plane.sy * p.y)) * 60,
    alongKm: p.x * ux + p.y * uy,
  }));
  members.sort((a, b) => a.event.timeMs - b.event.timeMs);
  const rms = Math.sqrt(members.reduce((s, m) => s + m.residualMin ** 2, 0) / members.length);
  const st = strengthTrend(members, motion.speedKmh, kind);
  // Fitted times at the neighbouring stations that reported then (a station without data at the time expects nothing).
  const expected = near
    .map((i) => ({ station: net[i]!.id, timeMs: refMs + (plane.t0 + plane.sx * proj.xKm[i]! + plane.sy * proj.yKm[i]!) * MS_PER_HOUR }))
    .filter(({ station, timeMs }) => {
      const span = spans?.get(station);
      return !span || (timeMs >= span.startMs && timeMs <= span.endMs);
    });
  return {
    id: '',
    kind,
    members,
    t0Ms: refMs + plane.t0 * MS_PER_HOUR,
    speedKmh: motion.speedKmh,
    directionDeg: motion.directionDeg,
    rmsResidualMin: rms,
    strengthSlopeCPer100km: st.dT,
    zoneSlopeKmPer100km: st.dZone,
    trend: st.trend,
    expected,
    origin: proj.origin,
  };
}

/**
 * Events with zone depth and cross-front gradient filled from their track's speed (the speed of a
 * plane-wave fit is the speed normal to the front). Events not in a track are returned unchanged.
 */
export function withTrackSpeeds(events: readonly PassageEvent[], tracks: readonly FrontTrack[]): PassageEvent[] {
  const speedOf = new Map<PassageEvent, number>();
  for (const t of tracks) for (const m of t.members) speedOf.set(m.event, t.speedKmh);
  return events.map((e) => {
    const v = speedOf.get(e);
    if (v === undefined || !Number.isFinite(e.zoneHours)) return e;
    const depth = e.zoneHours * v;
    return { ...e, zoneDepthKm: depth, gradientKPer100km: depth > 0 ? (Math.abs(e.tempChangeC) / depth) * 100 : NaN };
  });
}
