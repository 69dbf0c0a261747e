/**
 * Petterssen's two-dimensional kinematic frontogenesis function: the rate at which horizontal motion
 * changes |∇θ| following the flow (Petterssen 1936; Bluestein 1993, vol. II, pp. 248–253):
 *   F = −(1/|∇θ|) [ θx² ∂u/∂x + θx θy (∂u/∂y + ∂v/∂x) + θy² ∂v/∂y ]
 * equivalently F = ½|∇θ|(D cos 2β − δ), with D the total deformation, δ the divergence and β the angle
 * between the isentropes and the axis of dilatation. F > 0 is frontogenesis (the gradient tightens), F < 0
 * frontolysis. Gradients come from station planes (gradient.ts).
 */
import type { FrontTrack, StationMeta, StationSeries } from '../model/index.js';
import { cleanColumn } from '../qc/qc.js';
import { projectLocalKm } from '../physics/geo.js';
import { potentialTemperatureK } from '../physics/theta.js';
import { windComponents } from '../physics/wind.js';
import { planeGradient } from './gradient.js';
import { MS_PER_HOUR } from '../physics/constants.js';
import { median } from '../signal/median.js';

/** K m⁻¹ s⁻¹ → K per 100 km per 3 h (10⁵ m × 10 800 s). */
export const PER_M_PER_S_TO_PER_100KM_PER_3H = 1e5 * 10800;

export interface KinematicGradients {
  /** ∂θ/∂x, ∂θ/∂y in K/m. */
  thetaX: number;
  thetaY: number;
  /** ∂u/∂x, ∂u/∂y, ∂v/∂x, ∂v/∂y in s⁻¹. */
  ux: number;
  uy: number;
  vx: number;
  vy: number;
}

export interface Frontogenesis {
  /** F in K m⁻¹ s⁻¹ (NaN when |∇θ| = 0 or any input is missing). */
  fKPerMPerS: number;
  /** F in K (100 km)⁻¹ (3 h)⁻¹. */
  fKPer100kmPer3h: number;
  /** |∇θ| in K per 100 km. */
  gradientKPer100km: number;
  /** Total deformation D = √(E² + S²), divergence δ, vorticity ζ, s⁻¹. */
  deformation: number;
  divergence: number;
  vorticity: number;
}

/**
 * Petterssen 2-D frontogenesis from gradients (expanded form; Bluestein1993 vol. II p. 242 and pp. 248–253).
 * Units: K/m and s⁻¹ in, K m⁻¹ s⁻¹ out. NaN in → NaN out; |∇θ| = 0 → NaN (no front to sharpen).
 * @example petterssenFrontogenesis({ thetaX: 0, thetaY: -1e-5, ux: 1e-5, uy: 0, vx: 0, vy: -1e-5 }).fKPerMPerS // 1e-10
 */
export function petterssenFrontogenesis(g: KinematicGradients): Frontogenesis {
  const { thetaX: tx, thetaY: ty, ux, uy, vx, vy } = g;
  const mag = Math.hypot(tx, ty);
  const f = mag > 0 ? -(tx * tx * ux + tx * ty * (uy + vx) + ty * ty * vy) / mag : NaN;
  const e = ux - vy;
  const s = vx + uy;
  return {
    fKPerMPerS: f,
    fKPer100kmPer3h: f * PER_M_PER_S_TO_PER_100KM_PER_3H,
    gradientKPer100km: mag * 1e5,
    deformation: Math.hypot(e, s),
    divergence: ux + vy,
    vorticity: vx - uy,
  };
}

/** Pressure of the ICAO standard atmosphere at height z (m), hPa: 1013.25 (1 − 2.25577e-5 z)^5.25588 (ICAO Doc 7488). */
export function standardPressureHpa(elevationM: number): number {
  return 1013.25 * Math.pow(1 - 2.25577e-5 * elevationM, 5.25588);
}

/** Value of a column at time t: linear between the reports around t when they are at most 90 min apart, else the nearest report within 30 min; NaN otherwise. */
export function valueAt(timeMs: ArrayLike<number>, v: ArrayLike<number>, t: number): number {
  let lo = 0, hi = timeMs.length;
  while (lo < hi) {
    const m = (lo + hi) >> 1;
    if (timeMs[m]! < t) lo = m + 1;
    else hi = m;
  }
  let a = lo - 1;
  while (a >= 0 && !Number.isFinite(v[a]!)) a--;
  let b = lo;
  while (b < v.length && !Number.isFinite(v[b]!)) b++;
  const ta = a >= 0 ? timeMs[a]! : NaN;
  const tb = b < v.length ? timeMs[b]! : NaN;
  if (a >= 0 && b < v.length && tb - ta <= 1.5 * MS_PER_HOUR) return tb === ta ? v[a]! : v[a]! + ((v[b]! - v[a]!) * (t - ta)) / (tb - ta);
  if (a >= 0 && t - ta <= 0.5 * MS_PER_HOUR) return v[a]!;
  if (b < v.length && tb - t <= 0.5 * MS_PER_HOUR) return v[b]!;
  return NaN;
}

/** What frontogenesis needs of a station: its position and, per report, θ and the wind components. */
export interface StationFields {
  meta: StationMeta;
  timeMs: Float64Array;
  thetaK: Float64Array;
  uMs: Float64Array;
  vMs: Float64Array;
}

/** θ (from temperature and station pressure, or the standard-atmosphere pressure at the station height) and u, v per report. */
export function fieldsOf(s: StationSeries, meta: StationMeta): StationFields {
  const t = cleanColumn(s, 'temperatureC');
  const p = cleanColumn(s, 'stationPressureHpa');
  const d = cleanColumn(s, 'windDirDeg');
  const w = cleanColumn(s, 'windSpeedMs');
  const pStd = standardPressureHpa(Number.isFinite(meta.elevationM) ? meta.elevationM : 0);
  const n = s.length;
  const thetaK = new Float64Array(n), uMs = new Float64Array(n), vMs = new Float64Array(n);
  for (let i = 0; i < n; i++) {
    thetaK[i] = potentialTemperatureK(t[i]!, Number.isFinite(p[i]!) ? p[i]! : pStd);
    const c = windComponents(w[i] === 0 ? 0 : d[i]!, w[i]!);
    uMs[i] = c.uMs;
    vMs[i] = c.vMs;
  }
  return { meta, timeMs: s.timeMs, thetaK, uMs, vMs };
}

/**
 * Petterssen frontogenesis at each passage of each track: at the passage time, θ and wind at the station and
 * its `neighbours` nearest stations of the network (least-squares planes, gradient.ts) give ∇θ and ∇v; the
 * track gets the median over its passages. Returns new tracks (inputs unchanged).
 */
export function withFrontogenesis(tracks: readonly FrontTrack[], series: readonly StationSeries[], neighbours = 4): FrontTrack[] {
  const fields: StationFields[] = [];
  for (const s of series) if (s.meta && Number.isFinite(s.meta.latDeg)) fields.push(fieldsOf(s, s.meta));
  return withFrontogenesisFields(tracks, fields, neighbours);
}

/** A station's fields kept out of memory (a file of a streamed run), loaded when frontogenesis needs them. */
export interface StationFieldsRef {
  meta: StationMeta;
  load: () => StationFields;
}

/**
 * {@link withFrontogenesis} from the stations' fields (as kept by shard outputs) instead of their series. Fields
 * given as references are loaded one station at a time: every value needed of a station is read while it is loaded.
 */
export function withFrontogenesisFields(tracks: readonly FrontTrack[], fields: readonly (StationFields | StationFieldsRef)[], neighbours = 4): FrontTrack[] {
  type Any = StationFields | StationFieldsRef;
  const byId = new Map<string, Any>();
  for (const f of fields) byId.set(f.meta.id, f);
  // The neighbourhood of a station (and its projection) is the same for all its passages: computed once.
  const nearOf = new Map<Any, { near: Any[]; proj: { xKm: Float64Array; yKm: Float64Array } }>();
  const neighbourhood = (here: Any) => {
    let got = nearOf.get(here);
    if (!got) {
      const others = [...byId.values()].filter((f) => f !== here);
      const dist = (f: Any) => Math.hypot(f.meta.latDeg - here.meta.latDeg, (f.meta.lonDeg - here.meta.lonDeg) * Math.cos((here.meta.latDeg * Math.PI) / 180));
      const near = [here, ...others.sort((a, b) => dist(a) - dist(b) || a.meta.id.localeCompare(b.meta.id)).slice(0, neighbours)];
      got = { near, proj: projectLocalKm(near.map((f) => f.meta), here.meta) };
      nearOf.set(here, got);
    }
    return got;
  };
  // 1. What is needed: θ, u, v of each neighbour at the time of each member (slot q of `values`, three each).
  const asked = new Map<Any, number[]>();
  let slots = 0;
  const plan = tracks.map((t) =>
    t.members.map((m) => {
      const here = byId.get(m.station);
      if (!here) return null;
      const { near, proj } = neighbourhood(here);
      const first = slots;
      for (const f of near) {
        let list = asked.get(f);
        if (!list) asked.set(f, (list = []));
        list.push(slots++, m.event.timeMs);
      }
      return { first, n: near.length, proj };
    }),
  );
  // 2. The values, station by station.
  const values = new Float64Array(slots * 3);
  for (const [f, list] of asked) {
    const x = 'load' in f ? f.load() : f;
    for (let k = 0; k < list.length; k += 2) {
      const q = list[k]!, t = list[k + 1]!;
      values[q * 3] = valueAt(x.timeMs, x.thetaK, t);
      values[q * 3 + 1] = valueAt(x.timeMs, x.uMs, t);
      values[q * 3 + 2] = valueAt(x.timeMs, x.vMs, t);
    }
  }
  return tracks.map((t, ti) => {
    const members = t.members.map((m, mi) => {
      const p = plan[ti]![mi];
      if (!p) return { ...m, frontogenesisKPer100kmPer3h: NaN };
      const at = (c: number) => Array.from({ length: p.n }, (_, k) => values[(p.first + k) * 3 + c]!);
      const th = planeGradient(p.proj.xKm, p.proj.yKm, at(0));
      const u = planeGradient(p.proj.xKm, p.proj.yKm, at(1));
      const v = planeGradient(p.proj.xKm, p.proj.yKm, at(2));
      // per km → per m
      const f = petterssenFrontogenesis({ thetaX: th.dfdxPerKm / 1000, thetaY: th.dfdyPerKm / 1000, ux: u.dfdxPerKm / 1000, uy: u.dfdyPerKm / 1000, vx: v.dfdxPerKm / 1000, vy: v.dfdyPerKm / 1000 });
      return { ...m, frontogenesisKPer100kmPer3h: f.fKPer100kmPer3h };
    });
    const finite = members.map((m) => m.frontogenesisKPer100kmPer3h).filter(Number.isFinite);
    return { ...t, members, frontogenesisKPer100kmPer3h: median(finite) };
  });
}
