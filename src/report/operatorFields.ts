/**
 * The fields operators act on, computed from a station's series around one detected passage: levels before and
 * after, the lowest temperature and the first freeze after, precipitation before and its type near the passage,
 * wind speed before, which pressure was used, and runway cross- and tailwind components. Pure: (series, event) →
 * fields; applied once per event by src/pipeline.ts after detection.
 */
import { WX, type OperatorFields, type PassageEvent, type PrecipIntensity, type PrecipType, type PressureSource, type RunwayComponents, type StationSeries } from '../model/index.js';
import { cleanColumn } from '../qc/qc.js';
import { choosePressure } from '../detect/grid.js';
import { lowerBound } from '../detect/features.js';
import { median } from '../signal/median.js';
import { stationPressureFromAltimeterHpa } from '../physics/pressure.js';
import { detectStation } from '../detect/detect.js';
import type { DetectOptions } from '../detect/types.js';

const HOUR_MS = 3_600_000;
const DEG = Math.PI / 180;

/** A runway direction to resolve winds on: its designator and heading, degrees. */
export interface RunwayHeading {
  runway: string;
  headingDeg: number;
}

/**
 * Crosswind and tailwind components of a wind on a runway heading, m/s: crosswind = V·sin(θ), headwind = V·cos(θ)
 * with θ the angle from the runway heading to the direction the wind blows from (FAA-H-8083-25B, Pilot's Handbook of
 * Aeronautical Knowledge, ch. 11, crosswind component chart). Crosswind positive from the right; tailwind = −headwind.
 * NaN in, NaN out. Calm (speed 0) gives 0 and 0.
 * @example windOnRunway(270, 10, 270) // { crosswindMs: 0, tailwindMs: -10 } (straight down the runway, a headwind)
 */
export function windOnRunway(windFromDeg: number, speedMs: number, headingDeg: number): { crosswindMs: number; tailwindMs: number } {
  if (speedMs === 0) return { crosswindMs: 0, tailwindMs: 0 };
  const theta = (windFromDeg - headingDeg) * DEG;
  const cross = speedMs * Math.sin(theta);
  const head = speedMs * Math.cos(theta);
  const clean = (x: number) => (Math.abs(x) < 1e-9 ? 0 : x);
  return { crosswindMs: clean(cross), tailwindMs: clean(-head) };
}

/** Median of the clean values at indices [a, b) with time in [fromMs, toMs) (NaN ignored; NaN when none). */
function medianIn(t: Float64Array, v: Float64Array, fromMs: number, toMs: number, a: number, b: number): number {
  const xs: number[] = [];
  for (let i = a; i < b; i++) if (t[i]! >= fromMs && t[i]! < toMs && !Number.isNaN(v[i]!)) xs.push(v[i]!);
  return median(xs);
}

/**
 * Lower median of the clean values at indices [a, b) with time in [fromMs, toMs): the middle report, the lower of
 * the two middle ones for an even count (a reported value, and the more cautious one for visibility and ceiling;
 * common practice, no source). NaN ignored; +Infinity (no ceiling) is a value; NaN when none.
 */
function lowerMedianIn(t: Float64Array, v: Float64Array, fromMs: number, toMs: number, a: number, b: number): number {
  const xs: number[] = [];
  for (let i = a; i < b; i++) if (t[i]! >= fromMs && t[i]! < toMs && !Number.isNaN(v[i]!)) xs.push(v[i]!);
  if (!xs.length) return NaN;
  xs.sort((x, y) => x - y);
  return xs[(xs.length - 1) >> 1]!;
}

/** Minimum of the clean values at indices [a, b) with time in (fromMs, toMs] (NaN when none). */
function minIn(t: Float64Array, v: Float64Array, fromMs: number, toMs: number, a: number, b: number): number {
  let m = NaN;
  for (let i = a; i < b; i++) if (t[i]! > fromMs && t[i]! <= toMs && !(v[i]! >= m)) m = Number.isNaN(v[i]!) ? m : v[i]!;
  return m;
}

/** What the operator fields read of one station, prepared once for all its events: the clean columns and the pressure used. */
interface StationColumns {
  s: StationSeries;
  T: Float64Array;
  Td: Float64Array;
  V: Float64Array;
  P: Float64Array;
  vis: Float64Array;
  cig: Float64Array;
  pressureSource: PressureSource;
  /** Times in non-decreasing order (as series are built), so a time window is one index range found by binary search. */
  sorted: boolean;
}

function stationColumns(s: StationSeries): StationColumns {
  const t = s.timeMs;
  let sorted = true;
  for (let i = 1; i < s.length && sorted; i++) if (!(t[i]! >= t[i - 1]!)) sorted = false;
  if (s.length > 0 && Number.isNaN(t[0]!)) sorted = false;
  return {
    s,
    T: cleanColumn(s, 'temperatureC'),
    Td: cleanColumn(s, 'dewpointC'),
    V: cleanColumn(s, 'windSpeedMs'),
    P: cleanColumn(s, 'precipMm'),
    vis: cleanColumn(s, 'visibilityM'),
    cig: cleanColumn(s, 'ceilingFt'),
    pressureSource: pressureSource(s),
    sorted,
  };
}

/**
 * Indices [a, b) holding every time in [fromMs, toMs] of a sorted series (the whole series when it is not
 * sorted or a bound is not finite); callers still test each time against their window's own ends, so a
 * wider range only costs time (the upper end is the first time at or past toMs + 1 ms, past every time ≤ toMs).
 */
function indexRange(c: StationColumns, fromMs: number, toMs: number): [number, number] {
  if (!c.sorted || !Number.isFinite(fromMs) || !Number.isFinite(toMs)) return [0, c.s.length];
  const t = c.s.length === c.s.timeMs.length ? c.s.timeMs : c.s.timeMs.subarray(0, c.s.length);
  return [lowerBound(t, fromMs), lowerBound(t, toMs + 1)];
}

/**
 * Which pressure detection measured the event's pressure fields on: the column detect/grid.ts chooses, and for
 * station pressure whether most values were derived from the altimeter setting (series/deriveStationPressure.ts
 * fills missing station pressure that way; a value equal to that inversion within 0.005 hPa counts as derived).
 */
export function pressureSource(s: StationSeries): PressureSource {
  const kind = choosePressure(s).kind;
  if (kind !== 'station') return kind;
  const elev = s.meta?.elevationM;
  if (elev === undefined || Number.isNaN(elev)) return 'station';
  let derived = 0;
  let n = 0;
  for (let i = 0; i < s.length; i++) {
    const p = s.stationPressureHpa[i]!;
    if (Number.isNaN(p)) continue;
    n++;
    const a = s.altimeterHpa[i]!;
    if (!Number.isNaN(a) && Math.abs(stationPressureFromAltimeterHpa(a, elev) - p) < 0.005) derived++;
  }
  return n > 0 && derived * 2 > n ? 'station-from-altimeter' : 'station';
}

/**
 * Precipitation types in a WX flag set (WMO-No. 306 code table 4678: RA, DZ, SN, FZRA, FZDZ, PL, GR/GS, TS). `FZ` with
 * rain or drizzle names the freezing form only; freezing fog (FZFG) alone names none.
 * @example precipTypesOf(WX.RAIN | WX.FREEZING | WX.PRECIP) // ['freezing-rain']
 */
export function precipTypesOf(flags: number): PrecipType[] {
  const out: PrecipType[] = [];
  const fz = (flags & WX.FREEZING) !== 0;
  if (flags & WX.RAIN && !fz) out.push('rain');
  if (flags & WX.DRIZZLE && !fz) out.push('drizzle');
  if (flags & WX.SNOW) out.push('snow');
  if (flags & WX.RAIN && fz) out.push('freezing-rain');
  if (flags & WX.DRIZZLE && fz) out.push('freezing-drizzle');
  if (flags & WX.ICE_PELLETS) out.push('ice-pellets');
  if (flags & WX.HAIL) out.push('hail');
  if (flags & WX.THUNDER) out.push('thunder');
  return out;
}

/**
 * The strongest precipitation intensity in a WX flag set (WMO-No. 306 code table 4678: `+` heavy, no sign moderate,
 * `-` light), null when the set names none. Heavy needs a precipitation flag, as `precipHeavy` does.
 * @example precipIntensityOf(WX.RAIN | WX.PRECIP | WX.LIGHT | WX.MODERATE) // 'moderate'
 */
export function precipIntensityOf(flags: number): PrecipIntensity | null {
  if (flags & WX.HEAVY && flags & WX.PRECIP) return 'heavy';
  if (flags & WX.MODERATE) return 'moderate';
  if (flags & WX.LIGHT) return 'light';
  return null;
}

/**
 * The operator fields of one event at its station. Windows (common practice, no source): levels before = median
 * over the hour before `timeMs`; after = median 1–3 h after (past the sharpest change); minima over the 6 and 12 h
 * after; first freeze = first clean report ≤ 0 °C within 12 h after; precipitation before = any precipitation flag or
 * amount > 0 in the 6 h before; types, heavy and intensity = present weather within ±1 h; wind speed before = median over the
 * hour before; visibility and ceiling = lower median over the same windows as the temperature levels. Runway components use the wind before/after of the event and the speeds here and in the event.
 */
export function operatorFields(s: StationSeries, e: PassageEvent, runways: readonly RunwayHeading[] = []): OperatorFields {
  return fieldsAt(stationColumns(s), e, runways);
}

/** {@link operatorFields} on a station's prepared columns. */
function fieldsAt(c: StationColumns, e: PassageEvent, runways: readonly RunwayHeading[]): OperatorFields {
  const s = c.s;
  const t = s.timeMs;
  const { T, Td, V, P, vis, cig } = c;
  const t0 = e.timeMs;
  let freezeTimeMs = NaN;
  let before = false;
  let near = 0;
  const [a, b] = indexRange(c, t0 - 6 * HOUR_MS, t0 + 12 * HOUR_MS);
  for (let i = a; i < b; i++) {
    const ti = t[i]!;
    if (Number.isNaN(freezeTimeMs) && ti > t0 && ti <= t0 + 12 * HOUR_MS && T[i]! <= 0) freezeTimeMs = ti;
    if (ti >= t0 - 6 * HOUR_MS && ti < t0 && (s.weather[i]! & WX.PRECIP || P[i]! > 0)) before = true;
    if (ti >= t0 - HOUR_MS && ti <= t0 + HOUR_MS) near |= s.weather[i]!;
  }
  const [ba, bb] = indexRange(c, t0 - HOUR_MS, t0);
  const [aa, ab] = indexRange(c, t0 + HOUR_MS, t0 + 3 * HOUR_MS + 1);
  const [ma, mb] = indexRange(c, t0, t0 + 12 * HOUR_MS);
  const windSpeedBeforeMs = medianIn(t, V, t0 - HOUR_MS, t0, ba, bb);
  const out: OperatorFields = {
    tempBeforeC: medianIn(t, T, t0 - HOUR_MS, t0, ba, bb),
    tempAfterC: medianIn(t, T, t0 + HOUR_MS, t0 + 3 * HOUR_MS + 1, aa, ab),
    dewpointBeforeC: medianIn(t, Td, t0 - HOUR_MS, t0, ba, bb),
    dewpointAfterC: medianIn(t, Td, t0 + HOUR_MS, t0 + 3 * HOUR_MS + 1, aa, ab),
    tempMin6hC: minIn(t, T, t0, t0 + 6 * HOUR_MS, ma, mb),
    tempMin12hC: minIn(t, T, t0, t0 + 12 * HOUR_MS, ma, mb),
    freezeTimeMs,
    precipBefore6h: before,
    precipTypes: precipTypesOf(near),
    precipHeavy: (near & WX.HEAVY) !== 0 && (near & WX.PRECIP) !== 0,
    precipIntensity: precipIntensityOf(near),
    windSpeedBeforeMs,
    visibilityBeforeM: lowerMedianIn(t, vis, t0 - HOUR_MS, t0, ba, bb),
    visibilityAfterM: lowerMedianIn(t, vis, t0 + HOUR_MS, t0 + 3 * HOUR_MS + 1, aa, ab),
    ceilingBeforeFt: lowerMedianIn(t, cig, t0 - HOUR_MS, t0, ba, bb),
    ceilingAfterFt: lowerMedianIn(t, cig, t0 + HOUR_MS, t0 + 3 * HOUR_MS + 1, aa, ab),
    pressureSource: c.pressureSource,
  };
  if (runways.length) {
    out.runways = runways.map((r): RunwayComponents => {
      const b = windOnRunway(e.windBeforeDeg, windSpeedBeforeMs, r.headingDeg);
      const a = windOnRunway(e.windAfterDeg, e.windSpeedAfterMs, r.headingDeg);
      return { runway: r.runway, headingDeg: r.headingDeg, crosswindBeforeMs: b.crosswindMs, tailwindBeforeMs: b.tailwindMs, crosswindAfterMs: a.crosswindMs, tailwindAfterMs: a.tailwindMs };
    });
  }
  return out;
}

/**
 * Parse runway designators `04/22,13/31` (or `09L/27R`, or three-digit headings `043/223`) into runway directions.
 * A two-digit designator is the heading ÷ 10 (ICAO Annex 14 §5.2.2: the magnetic heading to the nearest ten
 * degrees); fropa takes it as degrees true, so give three-digit true headings where the magnetic variation matters.
 * Throws RangeError naming the bad part.
 * @example parseRunways('04/22') // [{ runway: '04', headingDeg: 40 }, { runway: '22', headingDeg: 220 }]
 */
export function parseRunways(spec: string): RunwayHeading[] {
  const out: RunwayHeading[] = [];
  for (const part of spec.split(/[,/\s]+/).filter(Boolean)) {
    const m = /^(\d{2,3})([LCR]?)$/i.exec(part);
    if (!m) throw new RangeError(`runway "${part}": expected a designator such as 04, 22L or a heading such as 043`);
    const n = Number(m[1]);
    const heading = m[1]!.length === 3 ? n : n * 10;
    if (m[1]!.length === 2 ? n < 1 || n > 36 : n < 0 || n >= 360) throw new RangeError(`runway "${part}": designators run 01–36, headings 000–359`);
    out.push({ runway: part.toUpperCase(), headingDeg: heading % 360 === 0 && m[1]!.length === 2 ? 360 : heading });
  }
  if (!out.length) throw new RangeError('runway: name at least one designator, e.g. 04/22');
  return out;
}

/** Events with their operator fields (new objects; the inputs are not changed). Events of a station without a series are returned as they are. */
export function withOperatorFields(events: readonly PassageEvent[], series: readonly StationSeries[], runways: readonly RunwayHeading[] = []): PassageEvent[] {
  const by = new Map(series.map((s) => [s.station, s]));
  // Each station's clean columns and pressure source are prepared once, for all its events.
  const prepared = new Map<string, StationColumns>();
  return events.map((e) => {
    const s = by.get(e.station);
    if (!s) return e;
    let c = prepared.get(e.station);
    if (!c) prepared.set(e.station, (c = stationColumns(s)));
    return { ...e, operator: fieldsAt(c, e, runways) };
  });
}

/**
 * Detect one station's passages and add the operators' fields: the per-station step every path of the
 * main job runs (one thread, the worker pool, shards), so the fields do not depend on how it ran.
 */
export function detectWithOperatorFields(s: StationSeries, opts: DetectOptions & { runways?: readonly RunwayHeading[] }): PassageEvent[] {
  const { runways, ...dopts } = opts;
  return withOperatorFields(detectStation(s, dopts), [s], runways ?? []);
}
