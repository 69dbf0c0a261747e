/**
 * Event planning for the synthetic generator: cyclone passages (warm front, cold front, occluded
 * front), special fronts (arctic, frontolysis, frontogenesis, prefrontal trough), a dryline, outflow
 * boundaries, sea breezes and clear calm nights, resolved to per-station schedules.
 *
 * Everything here works in "northern-hemisphere-equivalent" space: for a southern group the caller
 * mirrors station y (north) coordinates and wind directions, so one set of physics serves both.
 * Magnitudes are common practice, no source (see the design notes on station signatures).
 */
import type { StationMeta } from '../../src/model/index.js';
import type { Rng } from './random.js';
import { localSolarHour, solarTimeToUtcMs, sunTimes, dayOfYear } from './solarClock.js';
import type { SynthEventPlan, SynthFrontRanges } from './types.js';
import { climateMeanC } from './climateMean.js';

const HOUR = 3_600_000;
const DAY = 86_400_000;

/** A station placed on the local plane (km east / north of the group centre, NH-equivalent). */
export interface PlaneStation {
  meta: StationMeta;
  xKm: number;
  yKm: number;
  /** Onshore wind direction (from), NH-equivalent degrees, for coastal stations. */
  onshoreFromDeg?: number;
}

export type PassageKind = 'cold-front' | 'warm-front' | 'occluded-front';

/** One front passage at one station. Directions NH-equivalent, degrees true. */
export interface Passage {
  kind: PassageKind;
  frontId: string;
  /** Leading edge (start of the wind shift and of the change), epoch ms. */
  timeMs: number;
  /** Signed temperature change °C and time to 90 % of it, hours. */
  dT: number;
  zoneH: number;
  /** Signed dew-point change °C, its lag behind the leading edge, hours. */
  dTd: number;
  dewLagH: number;
  preDir: number;
  postDir: number;
  shiftMin: number;
  preSpeedMs: number;
  postSpeedMs: number;
  troughHpa: number;
  /** Pressure minimum this many minutes before the leading edge. */
  troughLeadMin: number;
  /** > 0: wind shift and pressure trough this many hours ahead of the temperature drop. */
  prefrontalLeadH: number;
  showers: boolean;
  showerMin: number;
  thunder: boolean;
  rainRateMmH: number;
  /** Warm fronts: hours of light precipitation before the leading edge. */
  rainLeadH: number;
  /** Warm fronts: the same cycle's cold front at this station (NaN if none). */
  pairedColdMs: number;
  note?: string;
}

export interface DrylinePass {
  id: string;
  timeMs: number;
  zoneH: number;
  dT: number;
  dTd: number;
  dryDir: number;
  retreatMs: number;
  retreatZoneH: number;
}

export interface OutflowHit {
  timeMs: number;
  dT: number;
  dTd: number;
  jumpHpa: number;
  recoveryH: number;
  fromDir: number;
  gustMs: number;
  rainMmH: number;
  rainMin: number;
}

export interface SeaBreezeDay {
  onsetMs: number;
  endMs: number;
  dT: number;
  dTd: number;
  onshoreDir: number;
  speedMs: number;
}

export interface CalmNight {
  sunsetMs: number;
  sunriseMs: number;
  speedMs: number;
  rangeC: number;
}

export interface StationSchedule {
  station: PlaneStation;
  passages: Passage[];
  drylines: DrylinePass[];
  outflows: OutflowHit[];
  seaBreezes: SeaBreezeDay[];
  calmNights: CalmNight[];
}

/** Network-wide plan parameters shared by all stations of a group. */
export interface GroupPlan {
  schedules: StationSchedule[];
  /** Base sea-level pressure and slow waves (amplitude hPa, period days, phase rad). */
  basePressureHpa: number;
  pressureWaves: { amplitudeHpa: number; periodDays: number; phase: number }[];
  /** Daily cloud base values (one per day from start). */
  dailyCloud: number[];
}

interface FrontSpec {
  id: string;
  kind: PassageKind;
  centerMs: number;
  towardDeg: number;
  speedKmh: number;
  curvature: number;
  dT: [number, number];
  zoneH: [number, number];
  trough: [number, number];
  dTdRatio: [number, number];
  preDir: number;
  postDir: number;
  shiftMin: number;
  preSpeedMs: number;
  postSpeedMs: number;
  prefrontalLeadH: number;
  note?: string;
}

const logUniform = (rng: Rng, lo: number, hi: number) => Math.exp(rng.uniform(Math.log(lo), Math.log(hi)));

/** Project a station on a front moving toward `towardDeg`: along-motion s and along-front a, km. */
function project(st: PlaneStation, towardDeg: number): { s: number; a: number } {
  const b = (towardDeg * Math.PI) / 180;
  return { s: st.xKm * Math.sin(b) + st.yKm * Math.cos(b), a: st.xKm * Math.cos(b) - st.yKm * Math.sin(b) };
}

/** Front passage time at a station, epoch ms. */
function frontTime(spec: FrontSpec, st: PlaneStation): number {
  const { s, a } = project(st, spec.towardDeg);
  return spec.centerMs + (s / spec.speedKmh + spec.curvature * (a / 100) ** 2) * HOUR;
}

function alongParam(spec: FrontSpec, stations: PlaneStation[], st: PlaneStation): number {
  const ss = stations.map((x) => project(x, spec.towardDeg).s);
  const lo = Math.min(...ss);
  const hi = Math.max(...ss);
  if (hi - lo < 1) return 0.5;
  return (project(st, spec.towardDeg).s - lo) / (hi - lo);
}

const lerp = (a: number, b: number, p: number) => a + (b - a) * p;

function coldSpec(rng: Rng, id: string, centerMs: number, role: string, r: SynthFrontRanges = {}): FrontSpec {
  const [shiftLo, shiftHi] = r.coldShiftMin ?? [30, 90];
  const base: FrontSpec = {
    id,
    kind: 'cold-front',
    centerMs,
    towardDeg: rng.uniform(95, 135),
    speedKmh: rng.uniform(25, 50),
    curvature: rng.uniform(-0.3, 0.6),
    dT: [0, 0],
    zoneH: [0, 0],
    trough: [0, 0],
    dTdRatio: [0.8, 1.4],
    preDir: rng.uniform(190, 225),
    postDir: NaN,
    shiftMin: NaN,
    preSpeedMs: NaN,
    postSpeedMs: NaN,
    prefrontalLeadH: 0,
  };
  // Drawn in the standard order (post direction, shift, speeds), so the default ranges give the standard numbers.
  base.postDir = r.coldVeerDeg ? base.preDir + rng.uniform(r.coldVeerDeg[0], r.coldVeerDeg[1]) : rng.uniform(280, 320);
  base.shiftMin = rng.chance(r.coldSharpShiftProbability ?? 0.6) ? 5 : rng.uniform(shiftLo, shiftHi);
  base.preSpeedMs = rng.uniform(6, 9);
  base.postSpeedMs = rng.uniform(8, 12);
  const [dLo, dHi] = r.coldContrastC ?? [4, 10];
  const dT = rng.uniform(dLo, dHi);
  const z = logUniform(rng, 0.5, 4);
  const d = rng.uniform(4, 9);
  base.dT = [-dT, -dT * rng.uniform(0.85, 1.15)];
  base.zoneH = [z, z * rng.uniform(0.8, 1.25)];
  base.trough = [d, d * rng.uniform(0.85, 1.15)];
  if (role === 'arctic') {
    const a = rng.uniform(13, 16);
    base.speedKmh = rng.uniform(45, 55);
    base.towardDeg = rng.uniform(120, 150);
    base.dT = [-a, -a * rng.uniform(0.95, 1.05)];
    base.zoneH = [rng.uniform(1.5, 2.5), rng.uniform(1.5, 2.5)];
    base.trough = [rng.uniform(10, 13), rng.uniform(10, 13)];
    base.postDir = rng.uniform(330, 350);
    base.postSpeedMs = rng.uniform(12, 15);
    base.dTdRatio = [1.0, 1.2];
    base.shiftMin = 5;
    base.note = 'arctic';
  } else if (role === 'frontolysis') {
    base.dT = [-rng.uniform(8, 10), -rng.uniform(2.5, 3.5)];
    base.zoneH = [rng.uniform(0.7, 1.2), rng.uniform(5, 6)];
    base.trough = [rng.uniform(7, 9), rng.uniform(3, 4)];
    base.note = 'frontolysis';
  } else if (role === 'frontogenesis') {
    base.dT = [-rng.uniform(2.8, 3.5), -rng.uniform(9, 11)];
    base.zoneH = [rng.uniform(3.5, 4.5), rng.uniform(0.6, 0.8)];
    base.trough = [rng.uniform(3.5, 4.5), rng.uniform(7, 9)];
    base.note = 'frontogenesis';
  } else if (role === 'prefrontal') {
    base.prefrontalLeadH = rng.uniform(2.5, 4);
    base.note = 'prefrontal trough ahead';
  }
  return base;
}

function warmSpec(rng: Rng, id: string, centerMs: number, r: SynthFrontRanges = {}): FrontSpec {
  const range = (v: [number, number] | undefined, lo: number, hi: number) => (v ? rng.uniform(v[0], v[1]) : rng.uniform(lo, hi));
  const dT = range(r.warmContrastC, 3, 7);
  const z = range(r.warmZoneH, 2.5, 6);
  const d = rng.uniform(2, 5);
  const spec: FrontSpec = {
    id,
    kind: 'warm-front',
    centerMs,
    towardDeg: rng.uniform(20, 70),
    speedKmh: rng.uniform(15, 30),
    curvature: rng.uniform(-0.2, 0.3),
    dT: [dT, dT * rng.uniform(0.85, 1.15)],
    zoneH: [z, z * rng.uniform(0.8, 1.2)],
    trough: [d, d],
    dTdRatio: r.warmDewRatio ?? [1.1, 1.6],
    preDir: NaN,
    postDir: NaN,
    shiftMin: NaN,
    preSpeedMs: NaN,
    postSpeedMs: NaN,
    prefrontalLeadH: 0,
  };
  // Drawn in the standard order, so the default ranges give the standard numbers.
  spec.preDir = range(r.warmPreDirDeg, 95, 140);
  spec.postDir = r.warmVeerDeg ? spec.preDir + rng.uniform(r.warmVeerDeg[0], r.warmVeerDeg[1]) : rng.uniform(180, 215);
  spec.shiftMin = range(r.warmShiftMin, 60, 150);
  spec.preSpeedMs = rng.uniform(4, 6);
  spec.postSpeedMs = rng.uniform(5.5, 8);
  return spec;
}

function occludedSpec(rng: Rng, id: string, centerMs: number): FrontSpec {
  const d = rng.uniform(5, 9);
  return {
    id,
    kind: 'occluded-front',
    centerMs,
    towardDeg: rng.uniform(60, 110),
    speedKmh: rng.uniform(30, 45),
    curvature: 0,
    dT: [rng.uniform(-1, 1), rng.uniform(-1, 1)],
    zoneH: [1, 1],
    trough: [d, d],
    dTdRatio: [0, 0],
    preDir: rng.uniform(150, 180),
    postDir: rng.uniform(250, 290),
    shiftMin: rng.uniform(15, 45),
    preSpeedMs: rng.uniform(5, 8),
    postSpeedMs: rng.uniform(7, 10),
    prefrontalLeadH: 0,
    note: 'occluded',
  };
}

function passageAt(spec: FrontSpec, stations: PlaneStation[], st: PlaneStation, rng: Rng): Passage {
  const p = alongParam(spec, stations, st);
  const jit = rng.uniform(0.92, 1.08);
  const dT = lerp(spec.dT[0], spec.dT[1], p) * (spec.kind === 'occluded-front' ? 1 : jit);
  const zoneH = Math.exp(lerp(Math.log(spec.zoneH[0]), Math.log(spec.zoneH[1]), p)) * rng.uniform(0.92, 1.08);
  let dTd: number;
  if (spec.kind === 'occluded-front') dTd = -rng.uniform(0.5, 2.5);
  else dTd = dT * rng.uniform(spec.dTdRatio[0], spec.dTdRatio[1]);
  const cold = spec.kind === 'cold-front';
  return {
    kind: spec.kind,
    frontId: spec.id,
    timeMs: Math.round(frontTime(spec, st) / 60000) * 60000,
    dT,
    zoneH: spec.kind === 'occluded-front' ? 1 : zoneH,
    dTd,
    dewLagH: cold && rng.chance(0.3) ? rng.uniform(0.3, 1.2) : 0,
    preDir: spec.preDir + rng.uniform(-8, 8),
    postDir: spec.postDir + rng.uniform(-8, 8),
    shiftMin: spec.shiftMin <= 5 ? 5 : Math.max(20, spec.shiftMin + rng.uniform(-15, 15)),
    preSpeedMs: spec.preSpeedMs * rng.uniform(0.9, 1.1),
    postSpeedMs: spec.postSpeedMs * rng.uniform(0.9, 1.1),
    troughHpa: lerp(spec.trough[0], spec.trough[1], p) * rng.uniform(0.9, 1.1),
    troughLeadMin: cold || spec.kind === 'occluded-front' ? rng.uniform(0, 15) : 0,
    prefrontalLeadH: spec.prefrontalLeadH > 0 ? spec.prefrontalLeadH * rng.uniform(0.9, 1.1) : 0,
    showers: cold ? rng.chance(0.75) : spec.kind === 'occluded-front' ? rng.chance(0.5) : false,
    showerMin: rng.uniform(30, 110),
    thunder: cold && rng.chance(0.3),
    rainRateMmH: cold ? rng.uniform(1, 6) : rng.uniform(0.3, 1.5),
    rainLeadH: spec.kind === 'warm-front' ? rng.uniform(3, 8) : 0,
    pairedColdMs: NaN,
    note: spec.note,
  };
}

/** True when any scheduled event at the station lies in [t0, t1]. */
export function stationBusy(s: StationSchedule, t0: number, t1: number): boolean {
  for (const p of s.passages) {
    const a = p.timeMs - p.prefrontalLeadH * HOUR;
    const b = p.timeMs + p.zoneH * HOUR;
    if (b >= t0 && a <= t1) return true;
  }
  for (const d of s.drylines) if (d.retreatMs + 2 * HOUR >= t0 && d.timeMs <= t1) return true;
  for (const o of s.outflows) if (o.timeMs + o.recoveryH * HOUR >= t0 && o.timeMs <= t1) return true;
  for (const b of s.seaBreezes) if (b.endMs + 2 * HOUR >= t0 && b.onsetMs - 1 * HOUR <= t1) return true;
  for (const n of s.calmNights) if (n.sunriseMs + 2 * HOUR >= t0 && n.sunsetMs - 3 * HOUR <= t1) return true;
  return false;
}

/** Pick k distinct indices from [lo, hi) not in `taken`. */
function pickIndices(rng: Rng, lo: number, hi: number, k: number, taken: Set<number>): number[] {
  const free: number[] = [];
  for (let i = Math.max(0, lo); i < hi; i++) if (!taken.has(i)) free.push(i);
  const out: number[] = [];
  while (out.length < k && free.length > 0) {
    const j = Math.floor(rng.next() * free.length);
    out.push(free[j]!);
    taken.add(free[j]!);
    free.splice(j, 1);
  }
  return out;
}

/**
 * Plan all events for one hemisphere group of stations.
 * @param stations stations on the NH-equivalent plane
 * @param idPrefix prefix for front ids (e.g. `N` or `S`)
 */
export function planGroup(stations: PlaneStation[], startMs: number, endMs: number, plan: SynthEventPlan, rng: Rng, idPrefix: string): GroupPlan {
  const schedules: StationSchedule[] = stations.map((station) => ({ station, passages: [], drylines: [], outflows: [], seaBreezes: [], calmNights: [] }));
  const cycleDays = plan.cycleDays ?? [3.5, 6];
  const pWarm = plan.warmFrontProbability ?? 0.6;

  // 1. Cyclone passage times at the network centre.
  const cycles: number[] = [];
  let t = startMs + rng.uniform(1.5, 2.5) * DAY;
  while (t < endMs - 1.5 * DAY) {
    cycles.push(t);
    t += rng.uniform(cycleDays[0], cycleDays[1]) * DAY;
  }
  const nc = cycles.length;
  const roles = new Array<string>(nc).fill('');
  const taken = new Set<number>();
  const assign = (role: string, lo: number, hi: number, k: number) => {
    for (const i of pickIndices(rng, lo, hi, k, taken)) roles[i] = role;
  };
  if (plan.arctic ?? true) assign('arctic', 0, Math.max(1, Math.ceil(nc * 0.45)), 1);
  assign('dryline', Math.floor(nc * 0.5), nc, plan.drylines ?? 1);
  if (plan.frontolysis ?? true) assign('frontolysis', 0, nc, 1);
  if (plan.frontogenesis ?? true) assign('frontogenesis', 0, nc, 1);
  assign('occluded', 0, nc, plan.occluded ?? 1);
  assign('prefrontal', 0, nc, plan.prefrontalTroughs ?? 2);

  const frontRng = rng.fork('fronts');
  let nCold = 0;
  let nWarm = 0;
  let nOcc = 0;
  const drylineCycles: { warmEnd: number[]; coldAt: number[]; center: number }[] = [];
  for (let i = 0; i < nc; i++) {
    const role = roles[i]!;
    const center = cycles[i]!;
    if (role === 'occluded') {
      const spec = occludedSpec(frontRng, `${idPrefix}OF${String(++nOcc).padStart(2, '0')}`, center);
      for (const s of schedules) s.passages.push(passageAt(spec, stations, s.station, frontRng));
      continue;
    }
    const cspec = coldSpec(frontRng, `${idPrefix}CF${String(++nCold).padStart(2, '0')}`, center, role, plan.fronts);
    const colds = schedules.map((s) => passageAt(cspec, stations, s.station, frontRng));
    const wantWarm = role === 'dryline' || (role !== 'arctic' && frontRng.chance(pWarm));
    if (wantWarm) {
      let gapH = role === 'dryline' ? frontRng.uniform(40, 46) : frontRng.uniform(16, 28);
      const wspec = warmSpec(frontRng, `${idPrefix}WF${String(nWarm + 1).padStart(2, '0')}`, center - gapH * HOUR, plan.fronts);
      // Keep every station's warm sector at least 8 h long.
      let deficit = 0;
      for (let k = 0; k < schedules.length; k++) {
        const tw = frontTime(wspec, schedules[k]!.station);
        deficit = Math.max(deficit, 8 * HOUR - (colds[k]!.timeMs - tw));
      }
      wspec.centerMs -= deficit;
      gapH += deficit / HOUR;
      const warms = schedules.map((s) => passageAt(wspec, stations, s.station, frontRng));
      // Drop the warm front if it would run into the previous cycle's cold air too soon.
      const ok = warms.every((w, k) => {
        const prev = schedules[k]!.passages[schedules[k]!.passages.length - 1];
        return !prev || w.timeMs - w.rainLeadH * HOUR - prev.timeMs > 20 * HOUR;
      });
      if (ok) {
        nWarm++;
        warms.forEach((w, k) => {
          w.pairedColdMs = colds[k]!.timeMs;
          schedules[k]!.passages.push(w);
        });
        if (role === 'dryline') drylineCycles.push({ warmEnd: warms.map((w) => w.timeMs + w.zoneH * HOUR), coldAt: colds.map((c) => c.timeMs), center: center - (gapH / 2) * HOUR });
      }
    }
    colds.forEach((c, k) => schedules[k]!.passages.push(c));
  }
  for (const s of schedules) s.passages.sort((a, b) => a.timeMs - b.timeMs);

  const lonC = stations.reduce((a, s) => a + s.meta.lonDeg, 0) / stations.length;
  const xs = stations.map((s) => s.xKm);
  const xMin = Math.min(...xs);
  const xMax = Math.max(...xs);

  // 2. Dryline: moves east from the western edge late morning, stalls mid-afternoon, retreats at night.
  const dryRng = rng.fork('dryline');
  drylineCycles.forEach((dc, j) => {
    const width = Math.max(50, xMax - xMin);
    const t11 = solarTimeToUtcMs(dc.center, lonC, 11);
    const xStart = xMin - dryRng.uniform(10, 40);
    const v = Math.min(45, Math.max(15, (0.5 * width + 25) / 5.5));
    const xStop = xStart + v * 5.5;
    const vr = dryRng.uniform(40, 60);
    const t19 = t11 + 8 * HOUR;
    const dryDir = dryRng.uniform(240, 262);
    schedules.forEach((s, k) => {
      const x = s.station.xKm;
      if (x > xStop - 5) return;
      const tp = t11 + ((x - xStart) / v) * HOUR;
      const tr = t19 + ((xStop - x) / vr) * HOUR;
      if (tp < dc.warmEnd[k]! + 2 * HOUR || tr > dc.coldAt[k]! - 3 * HOUR) return;
      s.drylines.push({
        id: `${idPrefix}DL${String(j + 1).padStart(2, '0')}`,
        timeMs: Math.round(tp / 60000) * 60000,
        zoneH: dryRng.uniform(0.5, 1.5),
        dT: dryRng.uniform(1, 3),
        dTd: -dryRng.uniform(11, 16),
        dryDir: dryDir + dryRng.uniform(-6, 6),
        retreatMs: Math.round(tr / 60000) * 60000,
        retreatZoneH: dryRng.uniform(1, 2),
      });
    });
  });

  // 3. Outflow boundaries: warm-sector afternoons/evenings, one station plus maybe its neighbour.
  const outRng = rng.fork('outflow');
  const nOut = plan.outflows ?? 1;
  let placed = 0;
  for (let attempt = 0; attempt < 400 && placed < nOut; attempt++) {
    const k = outRng.int(0, schedules.length - 1);
    const s = schedules[k]!;
    const colds = s.passages.filter((p) => p.kind === 'cold-front' && p.timeMs > startMs + 2 * DAY);
    if (colds.length === 0) break;
    const c = attempt < 300 ? colds[Math.floor(colds.length * (0.4 + 0.6 * outRng.next()))]! : outRng.pick(colds);
    const t0 = c.timeMs - outRng.uniform(4, 10) * HOUR;
    const h = localSolarHour(t0, s.station.meta.lonDeg);
    if (h < 14 || h > 22) continue;
    if (stationBusy(s, t0 - 5 * HOUR, t0 + 5 * HOUR)) continue;
    const hit: OutflowHit = {
      timeMs: Math.round(t0 / 60000) * 60000,
      dT: -outRng.uniform(4.5, 8),
      dTd: outRng.uniform(-1, 2),
      jumpHpa: outRng.uniform(1.5, 4),
      recoveryH: outRng.uniform(1, 3),
      fromDir: outRng.uniform(250, 340),
      gustMs: outRng.uniform(19, 28),
      rainMmH: outRng.uniform(15, 40),
      rainMin: outRng.uniform(15, 40),
    };
    s.outflows.push(hit);
    placed++;
    // Neighbour within 150 km gets a weaker hit later.
    let best = -1;
    let bestD = Infinity;
    schedules.forEach((o, j) => {
      if (j === k) return;
      const d = Math.hypot(o.station.xKm - s.station.xKm, o.station.yKm - s.station.yKm);
      if (d < bestD) {
        bestD = d;
        best = j;
      }
    });
    if (best >= 0 && bestD < 150 && outRng.chance(0.7)) {
      const o = schedules[best]!;
      const t1 = hit.timeMs + (bestD / outRng.uniform(35, 50)) * HOUR;
      if (!stationBusy(o, t1 - 5 * HOUR, t1 + 5 * HOUR)) {
        o.outflows.push({ ...hit, timeMs: Math.round(t1 / 60000) * 60000, dT: hit.dT * 0.75, jumpHpa: hit.jumpHpa * 0.7, gustMs: hit.gustMs * 0.85 });
      }
    }
  }

  // 4. Clear calm nights over most of the network (post-frontal highs preferred).
  const nightRng = rng.fork('nights');
  const nNights = plan.calmNights ?? 4;
  const candidates: { t: number; score: number }[] = [];
  for (let day = startMs + DAY; day < endMs - DAY; day += DAY) {
    const noon = solarTimeToUtcMs(day, lonC, 12);
    let free = 0;
    let postFrontal = false;
    for (const s of schedules) {
      const { sunriseH, sunsetH } = sunTimes(dayOfYear(noon), s.station.meta.latDeg);
      const ss = solarTimeToUtcMs(noon, s.station.meta.lonDeg, sunsetH);
      const sr = solarTimeToUtcMs(noon, s.station.meta.lonDeg, sunriseH) + DAY;
      if (!stationBusy(s, ss - 10 * HOUR, sr + 10 * HOUR)) free++;
      if (s.passages.some((p) => p.kind === 'cold-front' && ss - p.timeMs > 18 * HOUR && ss - p.timeMs < 60 * HOUR)) postFrontal = true;
    }
    if (free >= Math.ceil(0.7 * schedules.length)) candidates.push({ t: noon, score: (postFrontal ? 1 : 0) + nightRng.next() * 0.9 });
  }
  candidates.sort((a, b) => b.score - a.score);
  const chosen: number[] = [];
  for (const c of candidates) {
    if (chosen.length >= nNights) break;
    if (chosen.some((t0) => Math.abs(t0 - c.t) < 2 * DAY)) continue;
    chosen.push(c.t);
  }
  for (const noon of chosen) {
    const speed = nightRng.uniform(0, 1.0);
    const range = nightRng.uniform(12.5, 15);
    for (const s of schedules) {
      const { sunriseH, sunsetH } = sunTimes(dayOfYear(noon), s.station.meta.latDeg);
      const ss = solarTimeToUtcMs(noon, s.station.meta.lonDeg, sunsetH);
      const sr = solarTimeToUtcMs(noon, s.station.meta.lonDeg, sunriseH) + DAY;
      if (stationBusy(s, ss - 10 * HOUR, sr + 10 * HOUR)) continue;
      s.calmNights.push({ sunsetMs: ss, sunriseMs: sr, speedMs: speed + nightRng.uniform(0, 0.3), rangeC: range + nightRng.uniform(-0.5, 0.5) });
    }
  }

  // 5. Sea breezes at coastal stations on quiet sunny days.
  const seaRng = rng.fork('sea');
  for (const s of schedules) {
    if (s.station.onshoreFromDeg === undefined) continue;
    const days: number[] = [];
    for (let day = startMs + DAY; day < endMs - DAY; day += DAY) days.push(solarTimeToUtcMs(day, s.station.meta.lonDeg, 0));
    let n = 0;
    const maxDays = plan.seaBreezeDays ?? 6;
    const order = days.map((d) => ({ d, r: seaRng.next() })).sort((a, b) => a.r - b.r);
    for (const { d } of order) {
      if (n >= maxDays) break;
      const onset = d + seaRng.uniform(10.5, 12.5) * HOUR;
      const end = d + seaRng.uniform(17.5, 19.5) * HOUR;
      if (stationBusy(s, onset - 8 * HOUR, end + 8 * HOUR)) continue;
      // Land must be warm enough for a sea breeze to form (common practice, no source).
      if (climateMeanC(onset, s.station.meta.latDeg) - 0.0065 * (s.station.meta.elevationM || 0) < 5) continue;
      const sinceCold = s.passages.filter((p) => p.timeMs < onset).map((p) => onset - p.timeMs);
      if (sinceCold.length > 0 && Math.min(...sinceCold) < 24 * HOUR) continue;
      const next = s.passages.find((p) => p.timeMs > end);
      if (next && next.timeMs - (next.rainLeadH + 10) * HOUR < end) continue;
      s.seaBreezes.push({
        onsetMs: Math.round(onset / 60000) * 60000,
        endMs: Math.round(end / 60000) * 60000,
        dT: -seaRng.uniform(1.5, 5),
        dTd: seaRng.uniform(1, 4),
        onshoreDir: s.station.onshoreFromDeg + seaRng.uniform(-20, 20),
        speedMs: seaRng.uniform(4, 6),
      });
      n++;
    }
    s.seaBreezes.sort((a, b) => a.onsetMs - b.onsetMs);
  }

  const presRng = rng.fork('pressure');
  const nDays = Math.ceil((endMs - startMs) / DAY) + 3;
  const cloudRng = rng.fork('cloud');
  return {
    schedules,
    basePressureHpa: presRng.uniform(1013, 1018),
    pressureWaves: [0, 1].map(() => ({ amplitudeHpa: presRng.uniform(1, 2.5), periodDays: presRng.uniform(3, 7), phase: presRng.uniform(0, 2 * Math.PI) })),
    dailyCloud: Array.from({ length: nDays }, () => cloudRng.uniform(0.05, 0.75)),
  };
}
