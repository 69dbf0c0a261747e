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
import { projectLocalKm, stationDistanceKm } from '../physics/geo.js';

/** @deprecated Re-exported for old import paths; import from src/model/. */
export type { FrontTrack, StrengthTrend, TrackMember } from '../model/track.js';
import { MS_PER_HOUR } from '../physics/constants.js';
import { leastSquaresPlane } from './leastSquaresPlane.js';

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

/** Stations grouped into networks: connected components of the graph with edges shorter than `linkKm`. */
export function networksOf(stations: readonly StationMeta[], linkKm: number): StationMeta[][] {
  const n = stations.length;
  const comp = new Int32Array(n).fill(-1);
  let c = 0;
  for (let i = 0; i < n; i++) {
    if (comp[i] !== -1) continue;
    const stack = [i];
    comp[i] = c;
    while (stack.length) {
      const a = stack.pop()!;
      for (let b = 0; b < n; b++) {
        if (comp[b] !== -1) continue;
        const sa = stations[a]!, sb = stations[b]!;
        if (stationDistanceKm(sa.latDeg, sa.lonDeg, sb.latDeg, sb.lonDeg) <= linkKm) {
          comp[b] = c;
          stack.push(b);
        }
      }
    }
    c++;
  }
  const out: StationMeta[][] = Array.from({ length: c }, () => []);
  for (let i = 0; i < n; i++) out[comp[i]!]!.push(stations[i]!);
  return out;
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
 * give the same tracks. Events at stations without coordinates are left out.
 */
export function trackFronts(events: readonly PassageEvent[], stations: readonly StationMeta[], opts: TrackOptions = {}): FrontTrack[] {
  const kinds = opts.kinds ?? (['cold-front', 'warm-front', 'occluded-front', 'dryline'] as const);
  const tolH = (opts.toleranceMin ?? 90) / 60;
  const minSpeed = opts.minSpeedKmh ?? 5;
  const maxSpeed = opts.maxSpeedKmh ?? 120;
  const minStations = opts.minStations ?? 3;
  const located = stations.filter((s) => Number.isFinite(s.latDeg) && Number.isFinite(s.lonDeg));
  const tracks: FrontTrack[] = [];
  for (const net of networksOf(located, opts.linkKm ?? 800)) {
    if (net.length < minStations) continue;
    const proj = projectLocalKm(net);
    const index = new Map(net.map((s, i) => [s.id, i]));
    for (const kind of kinds) {
      const pts: Point[] = events
        .filter((e) => e.kind === kind && index.has(e.station))
        .map((e) => {
          const i = index.get(e.station)!;
          return { e, station: i, x: proj.xKm[i]!, y: proj.yKm[i]!, t: 0 };
        })
        .sort((a, b) => a.e.timeMs - b.e.timeMs || a.station - b.station);
      if (pts.length < minStations) continue;
      const ref = pts[0]!.e.timeMs;
      for (const p of pts) p.t = (p.e.timeMs - ref) / MS_PER_HOUR;
      // Largest plausible spread of passage times over this network.
      let diameter = 0;
      for (let i = 0; i < net.length; i++) for (let j = i + 1; j < net.length; j++) diameter = Math.max(diameter, Math.hypot(proj.xKm[i]! - proj.xKm[j]!, proj.yKm[i]! - proj.yKm[j]!));
      const spanH = diameter / minSpeed + tolH;
      const used = new Uint8Array(pts.length);
      for (;;) {
        let best: { members: number[]; plane: Plane; rss: number } | null = null;
        for (let a = 0; a < pts.length; a++) {
          if (used[a]) continue;
          for (let b = a + 1; b < pts.length && pts[b]!.t - pts[a]!.t <= spanH; b++) {
            if (used[b] || pts[b]!.station === pts[a]!.station) continue;
            for (let c = b + 1; c < pts.length && pts[c]!.t - pts[a]!.t <= spanH; c++) {
              if (used[c] || pts[c]!.station === pts[a]!.station || pts[c]!.station === pts[b]!.station) continue;
              const plane = fitPlane([pts[a]!, pts[b]!, pts[c]!]);
              if (!plane) continue;
              const { speedKmh } = motionFromSlowness(plane.sx, plane.sy);
              if (!(speedKmh >= minSpeed && speedKmh <= maxSpeed)) continue;
              // Consensus: at each station, the unused passage nearest the plane within the tolerance.
              const members: number[] = [];
              let rss = 0;
              const byStation = new Map<number, { k: number; r: number }>();
              for (let k = 0; k < pts.length; k++) {
                if (used[k]) continue;
                const p = pts[k]!;
                const r = Math.abs(p.t - (plane.t0 + plane.sx * p.x + plane.sy * p.y));
                if (r > tolH) continue;
                const prev = byStation.get(p.station);
                if (!prev || r < prev.r) byStation.set(p.station, { k, r });
              }
              for (const { k, r } of byStation.values()) {
                members.push(k);
                rss += r * r;
              }
              if (members.length < minStations) continue;
              if (!best || members.length > best.members.length || (members.length === best.members.length && rss < best.rss)) {
                best = { members: members.sort((u, v) => u - v), plane, rss };
              }
            }
          }
        }
        if (!best) break;
        const memberPts = best.members.map((k) => pts[k]!);
        const fit = robustFit(memberPts, Math.max(tolH / 3, 0.25));
        const plane = fit?.plane ?? best.plane;
        for (const k of best.members) used[k] = 1;
        tracks.push(buildTrack(kind, memberPts, plane, ref, net, proj, tolH));
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

function buildTrack(
  kind: BoundaryKind,
  pts: Point[],
  plane: Plane,
  refMs: number,
  net: StationMeta[],
  proj: { xKm: Float64Array; yKm: Float64Array; origin: { latDeg: number; lonDeg: number } },
  tolH: number,
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
  const have = new Set(members.map((m) => m.station));
  const expected = net
    .map((s, i) => ({ s, i }))
    .filter(({ s }) => !have.has(s.id))
    .map(({ s, i }) => ({ station: s.id, timeMs: refMs + (plane.t0 + plane.sx * proj.xKm[i]! + plane.sy * proj.yKm[i]!) * MS_PER_HOUR }));
  void tolH;
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
