/**
 * Detection of boundary passages at one station:
 * 1. put the QC-clean series on a regular grid (grid.ts), diurnally adjusting temperature;
 * 2. find change points with PELT [Killick2012] in the wind (u and v together), the adjusted
 *    temperature, the dew point, θe and pressure (piecewise-linear cost: troughs are kinks);
 * 3. measure each change point's surroundings (features.ts) and classify it (classify.ts);
 * 4. keep the strongest candidate within ±3 h, time it on the raw reports (timing.ts), re-measure at
 *    that time, and add the transition zone, zone depth and observer remarks.
 */
import type { PassageEvent, StationSeries } from '../model/index.js';
import { medianCadenceMinutes } from '../series/series.js';
import { pelt, peltMulti } from '../signal/pelt.js';
import { buildGrid, type DetectGrid } from './grid.js';
import { lowerBound, measure, rawColumns, type Features, type RawColumns } from './features.js';
import { classify, type Classification } from './classify.js';
import { airMassChange } from './airmass.js';
import { ARRIVED_WITH_STORM, decideKind, modelInputs, type ModelParams } from './model.js';
import { MODEL_PARAMS } from './modelParams.js';
import { inferSeaBreezeSector } from './seaBreeze.js';
import type { StationMeta } from '../ingest/types.js';
import { changeStart, windSplit, type SplitTime } from './timing.js';
import { runningMean, meanIn } from './window.js';
import type { DetectOptions } from './types.js';
import { MS_PER_HOUR, MS_PER_MINUTE } from '../physics/constants.js';

/** Candidates closer than this before timing are one change (the strongest is kept). common practice, no source. */
const SUPPRESS_MS = 1 * MS_PER_HOUR;
/**
 * Default confidence floor. A confidence is calibrated to the frequency with which such a detection matches a
 * labelled passage of its kind (two passes of Platt scaling on the tuning part, bench/real/fit.ts), so 0.5
 * keeps the passages more likely right than wrong. common practice, no source, for taking 0.5.
 */
export const DEFAULT_MIN_CONFIDENCE = 0.5;
/**
 * Without the model (no wind reported, or no parameters) a confidence is a signature score, not a calibrated
 * frequency; those scores were tuned to keep passages from 0.4, so their floor is the calibrated floor × 0.8
 * (0.5 → 0.4). common practice, no source.
 */
const SIGNATURE_FLOOR_SCALE = 0.8;

interface Candidate {
  index: number;
  f: Features;
  c: Classification;
  timing?: SplitTime;
  /** How the leading edge was placed, in words. */
  basis?: string;
  timeBasis?: PassageEvent['timeBasis'];
  windTiming?: SplitTime | null;
  changeTiming?: SplitTime | null;
  prefrontalShiftMs?: number;
}

/** Change-point indices on the grid from every channel, sorted and de-duplicated. */
export function changePointCandidates(g: DetectGrid): number[] {
  const perH = MS_PER_HOUR / g.stepMs;
  const minSegment = Math.max(2, Math.round(perH / 2));
  const maxSegment = Math.round(72 * perH);
  const set = new Set<number>();
  const add = (cps: ArrayLike<number>) => {
    for (let i = 0; i < cps.length; i++) set.add(cps[i]!);
  };
  const opts = { minSegment, maxSegment, penalty: 'mbic' as const };
  add(peltMulti([g.uMs, g.vMs], { ...opts, cost: 'mean' }).changePoints);
  add(pelt(g.tAdjC, { ...opts, cost: 'mean' }).changePoints);
  add(pelt(g.tdC, { ...opts, cost: 'mean' }).changePoints);
  add(pelt(g.thetaEK, { ...opts, cost: 'mean' }).changePoints);
  if (g.pressureKind !== 'none') add(pelt(g.pHpa, { ...opts, cost: 'linear', minSegment: Math.max(3, minSegment) }).changePoints);
  return [...set].sort((a, b) => a - b);
}

/**
 * The station's metadata for classification: a stations file's `coastal`/`sea_bearing_deg` win; without
 * them, a sea-breeze sector inferred from the station's own record (seaBreeze.ts) marks it coastal.
 */
export function classificationMeta(series: StationSeries, g: DetectGrid): StationMeta | undefined {
  const meta = series.meta;
  if (meta?.coastal !== undefined) return meta;
  const sector = inferSeaBreezeSector(g, meta?.lonDeg);
  if (!sector) return meta;
  return { ...(meta ?? { id: series.station, aliases: [], latDeg: NaN, lonDeg: NaN, elevationM: NaN }), coastal: true, seaBearingDeg: sector.seaBearingDeg };
}

/** Largest finite value of `v` at report times in [fromMs, toMs]; NaN when none. */
function maxIn(t: Float64Array, v: Float64Array, fromMs: number, toMs: number): number {
  let m = NaN;
  for (let k = lowerBound(t, fromMs); k < t.length && t[k]! <= toMs; k++) if (v[k]! === v[k]! && !(v[k]! <= m)) m = v[k]!;
  return m;
}

/** Value of `v` at the report at or just after `tMs`; NaN when missing. */
function valueAt(t: Float64Array, v: Float64Array, tMs: number): number {
  const k = lowerBound(t, tMs);
  return k < t.length ? v[k]! : NaN;
}

/** Does the record hold any wind direction at all? */
function hasWind(series: StationSeries): boolean {
  for (let i = 0; i < series.length; i++) if (series.windDirDeg[i]! === series.windDirDeg[i]!) return true;
  return false;
}

/** One change-point candidate with the model's inputs, for fitting the model (bench/real/fit.ts). */
export interface ModelCandidate {
  station: string;
  timeMs: number;
  inputs: Float64Array;
  handKind: string;
}

/** What every candidate of a station is measured against: the grid, the raw columns and their 15-min means. */
function stationContext(series: StationSeries) {
  const g = buildGrid(series, medianCadenceMinutes(series.timeMs));
  if (!g) return null;
  const hemisphere: 1 | -1 = (series.meta?.latDeg ?? 1) < 0 ? -1 : 1;
  const perH = MS_PER_HOUR / g.stepMs;
  return {
    g,
    hemisphere,
    raw: rawColumns(series),
    perH,
    tSmooth: runningMean(g.tAdjC, Math.max(1, Math.round(perH / 4))),
    tRawSmooth: runningMean(g.tC, Math.max(1, Math.round(perH / 4))),
  };
}

/** Every change-point candidate of a station with its model inputs (no model applied, nothing dropped). */
export function modelCandidates(series: StationSeries): ModelCandidate[] {
  const ctx = stationContext(series);
  if (!ctx) return [];
  const { g, hemisphere, raw, tSmooth, tRawSmooth } = ctx;
  const meta = classificationMeta(series, g);
  return changePointCandidates(g).map((i) => {
    const f = measure(g, series, raw, i, tSmooth, tRawSmooth);
    const hand = classify(f, meta, hemisphere);
    return { station: series.station, timeMs: f.timeMs, inputs: modelInputs(f, airMassChange(g, i), hand, hemisphere), handKind: hand.kind };
  });
}

/** Nearest grid index to a time. */
function gridIndex(g: DetectGrid, tMs: number): number {
  return Math.max(0, Math.min(g.n - 1, Math.round((tMs - g.timeMs[0]!) / g.stepMs)));
}

/**
 * Check detection options: `frontSpeedKmh` must be a finite speed above 0 km/h, `minConfidence` a number from 0
 * to 1. Throws RangeError naming the field (never a silent NaN downstream).
 * @example checkDetectOptions({ frontSpeedKmh: 0 }) // throws RangeError
 */
export function checkDetectOptions(opts: DetectOptions): void {
  const fs = opts.frontSpeedKmh;
  if (fs !== undefined && !(Number.isFinite(fs) && fs > 0)) throw new RangeError(`frontSpeedKmh must be a speed in km/h above 0, got ${fs}`);
  const mc = opts.minConfidence;
  if (mc !== undefined && !(mc >= 0 && mc <= 1)) throw new RangeError(`minConfidence must be a number from 0 to 1, got ${mc}`);
}

/**
 * Detect every boundary passage at one station. Pure: same series and options → same events.
 * Throws RangeError for bad options (see checkDetectOptions).
 */
export function detectStation(series: StationSeries, opts: DetectOptions = {}): PassageEvent[] {
  checkDetectOptions(opts);
  const ctx = stationContext(series);
  if (!ctx) return [];
  const { g, hemisphere, raw, tSmooth, tRawSmooth } = ctx;

  // The model was fitted on stations that report wind; a record without any wind direction is judged by
  // the signatures alone (which have a temperature-and-moisture path for it).
  const params = !hasWind(series) ? null : opts.model === undefined ? MODEL_PARAMS : opts.model;
  // Signature scores are not calibrated frequencies: their floor is the one they were tuned with.
  const minConfidence = (opts.minConfidence ?? DEFAULT_MIN_CONFIDENCE) * (params ? 1 : SIGNATURE_FLOOR_SCALE);
  const meta = classificationMeta(series, g);
  const evaluate = (i: number): Candidate => {
    const f = measure(g, series, raw, i, tSmooth, tRawSmooth);
    const hand = classify(f, meta, hemisphere);
    if (!params) return { index: i, f, c: hand };
    const a = airMassChange(g, i);
    const d = decideKind(modelInputs(f, a, hand, hemisphere), a, hand, params, f);
    // Evidence in the words of the chosen kind; the model's lines after it.
    const words = d.kind === hand.kind ? hand : classify(f, meta, hemisphere, d.kind);
    const extra = d.evidence.slice(hand.evidence.length);
    return { index: i, f, c: { ...d, evidence: [...words.evidence, ...extra] } };
  };
  // 1–3: candidates from change points, measured and classified.
  const cands = changePointCandidates(g)
    .map(evaluate)
    .filter((c) => c.c.confidence >= minConfidence * 0.8);
  // 4: strongest first, suppress close neighbours (within an hour: the same change seen by several
  // channels); farther ones are timed too, because timing can move or weaken the stronger one.
  cands.sort((a, b) => b.c.confidence - a.c.confidence || a.index - b.index);
  const kept: Candidate[] = [];
  for (const c of cands) {
    if (kept.some((k) => Math.abs(k.f.timeMs - c.f.timeMs) < SUPPRESS_MS)) continue;
    kept.push(c);
  }
  // Time each on the raw reports, then re-measure there.
  const events: PassageEvent[] = [];
  for (const c0 of kept) {
    const c = retime(c0, g, series, raw, evaluate);
    if (c.c.confidence < minConfidence) continue;
    events.push(toEvent(series, c, opts));
  }
  const out = markPrefrontalTroughs(suppressAfterTiming(events));
  attachRemarks(series, out);
  return out;
}

/**
 * After timing, candidates can meet: keep the stronger of two within 2 h; drop a thermal event that lies
 * inside the transition zone of a stronger one of the same sign; drop a second cold front within 9 h
 * behind a stronger one unless it has its own veer and pressure trough (continued cold advection is not
 * a new front). Rules: common practice, no source.
 */
export function suppressAfterTiming(events: PassageEvent[]): PassageEvent[] {
  // A warm front's rise is spread over hours; of two candidates, the one with the veer is the passage.
  const strength = (e: PassageEvent) => e.confidence + (e.kind === 'warm-front' ? 0.3 * Math.min(1, Math.max(0, (Math.abs(e.windTurnDeg) - 20) / 40)) : 0);
  const byStrength = events.slice().sort((a, b) => strength(b) - strength(a) || a.timeMs - b.timeMs);
  const kept: PassageEvent[] = [];
  const thermalSign = (e: PassageEvent) => (e.kind === 'cold-front' || e.kind === 'outflow-boundary' ? -1 : e.kind === 'warm-front' ? 1 : 0);
  // When a kept cold front's temperature fall starts (NaN when unknown).
  const fallOf = (k: PassageEvent) => (Number.isFinite(k.changeStartTimeMs) ? k.changeStartTimeMs : k.timeBasis === 'temperature-change' ? k.timeMs : NaN);
  for (const e of byStrength) {
    // Two cold-front candidates within 4 h (of each other, or of the kept one's temperature fall) are one
    // passage seen at the wind shift and at the fall: keep the stronger, timed at the wind shift nearest its
    // fall, from 3 h before to 2 h after it (FMH-1 times a passage at the wind shift; a dew-point crash or a
    // small veer hours ahead of the fall is not the front's shift), with both times reported.
    const twin = kept.find((k) => {
      if (k.kind !== 'cold-front' || e.kind !== 'cold-front' || withStorm(k) || withStorm(e)) return false;
      const fall = fallOf(k);
      return Math.abs(k.timeMs - e.timeMs) < 4 * MS_PER_HOUR || Math.abs(fall - e.timeMs) < 4 * MS_PER_HOUR;
    });
    if (twin) {
      const fall = fallOf(twin);
      const offset = e.timeMs - fall;
      const nearer = twin.timeBasis !== 'wind-shift' || Math.abs(offset) < Math.abs(twin.timeMs - fall);
      if (e.timeBasis === 'wind-shift' && Number.isFinite(fall) && offset >= -3 * MS_PER_HOUR && offset <= 2 * MS_PER_HOUR && nearer) {
        Object.assign(twin, {
          timeMs: e.timeMs, timeEarliestMs: e.timeEarliestMs, timeLatestMs: e.timeLatestMs, windShiftTimeMs: e.windShiftTimeMs, timeBasis: 'wind-shift', zoneStartMs: e.timeMs,
          windBeforeDeg: e.windBeforeDeg, windAfterDeg: e.windAfterDeg, windTurnDeg: e.windTurnDeg,
        });
        twin.changeStartTimeMs = fall;
        twin.zoneHours = Number.isNaN(twin.zoneEndMs) ? NaN : (twin.zoneEndMs - twin.timeMs) / MS_PER_HOUR;
        twin.evidence = [...twin.evidence.filter((x) => !x.startsWith('timed at')), `timed at the wind shift, between the reports at ${hhmm(e.timeEarliestMs)} and ${hhmm(e.timeLatestMs)} UTC (placed at the first report with the new wind); the temperature fall starts at ${hhmm(fall)} UTC`];
      }
      continue;
    }
    const clash = kept.some((k) => {
      if (Math.abs(k.timeMs - e.timeMs) < 2 * MS_PER_HOUR) return true;
      if ((k.kind === 'warm-front' || k.kind === 'dryline') && e.kind === k.kind && Math.abs(k.timeMs - e.timeMs) < 6 * MS_PER_HOUR) return true;
      const sameSign = k.kind === e.kind && thermalSign(k) !== 0;
      if (sameSign && e.timeMs > k.timeMs && e.timeMs <= (Number.isNaN(k.zoneEndMs) ? k.timeMs : k.zoneEndMs) + MS_PER_HOUR) return true;
      if (k.kind === 'cold-front' && e.kind === 'cold-front' && e.timeMs > k.timeMs && e.timeMs - k.timeMs < 9 * MS_PER_HOUR) {
        return !(e.windTurnDeg * Math.sign(k.windTurnDeg || 1) >= 30 && e.pressureRise3hHpa > 0.5);
      }
      return false;
    });
    if (!clash) kept.push(e);
  }
  return kept.sort((a, b) => a.timeMs - b.timeMs);
}

/**
 * A wind shift with a pressure trough and little temperature change, followed within 1–8 h by a cold
 * front at the same station, is a prefrontal trough (Schultz2005), not an occluded front; a drying without
 * cooling 1–7 h ahead of a cold front's fall is the front's dry leading edge, not a dryline or a second
 * front. Both are kept as unclassified wind shifts, and the evidence says why.
 */
export function markPrefrontalTroughs(events: PassageEvent[]): PassageEvent[] {
  return events.map((e) => {
    // A storm's outflow ahead of a cold front (a squall line in the warm sector) is followed by the front's own
    // passage: the lasting cold air behind it is that front's, so the storm's passage stays an outflow.
    if (e.kind === 'cold-front' && withStorm(e)) {
      const front = events.find((c) => c !== e && c.kind === 'cold-front' && !withStorm(c) && c.timeMs - e.timeMs >= 0.5 * MS_PER_HOUR && c.timeMs - e.timeMs <= 8 * MS_PER_HOUR);
      if (front) {
        const lead = ((front.timeMs - e.timeMs) / MS_PER_HOUR).toFixed(1);
        return { ...e, kind: 'outflow-boundary', evidence: [...e.evidence.filter((x) => x !== ARRIVED_WITH_STORM), `+ the cold front follows ${lead} h later: the storm's outflow ahead of it`] };
      }
    }
    // A drying without cooling up to 7 h ahead of a cold front's fall is the front's dry leading edge (a
    // dew-point crash in the westerlies ahead of the cold air), neither a second front nor a dryline; a
    // dryline overtaken later by a cold front stays a dryline. common practice, no source, for the 7 h.
    if (e.kind === 'dryline' || (e.kind === 'cold-front' && !(e.tempChangeC < -1))) {
      const front = events.find((c) => c !== e && c.kind === 'cold-front' && c.tempChangeC <= -3 && c.timeMs - e.timeMs >= MS_PER_HOUR && c.timeMs - e.timeMs <= 7 * MS_PER_HOUR);
      if (front) {
        const lead = ((front.timeMs - e.timeMs) / MS_PER_HOUR).toFixed(1);
        return { ...e, kind: 'wind-shift', evidence: [...e.evidence, `+ the cold front's temperature fall follows ${lead} h later: drying ahead of the front, not a front of its own`] };
      }
    }
    if (e.kind !== 'occluded-front' && e.kind !== 'wind-shift') return e;
    const front = events.find((c) => c.kind === 'cold-front' && c.timeMs - e.timeMs >= MS_PER_HOUR && c.timeMs - e.timeMs <= 8 * MS_PER_HOUR);
    if (!front) return e;
    const lead = ((front.timeMs - e.timeMs) / MS_PER_HOUR).toFixed(1);
    return { ...e, kind: 'wind-shift', evidence: [...e.evidence, `+ cold front follows ${lead} h later: prefrontal trough (wind shift and trough ahead of the front)`] };
  });
}

/** Place the leading edge on the raw reports (wind shift, or the start of the sharp change) and re-measure. */
function retime(c: Candidate, g: DetectGrid, s: StationSeries, raw: RawColumns, evaluate: (i: number) => Candidate): Candidate {
  const kind = c.c.kind;
  const f = c.f;
  const wind = windSplit(s.timeMs, raw, f.timeMs);
  let start: SplitTime | null = null;
  const thermal = kind === 'cold-front' || kind === 'warm-front' || kind === 'outflow-boundary' || kind === 'sea-breeze-front';
  if (thermal && !Number.isNaN(f.zoneEndMs)) {
    const level = meanIn(raw.tC, lowerBound(s.timeMs, f.timeMs - 2 * MS_PER_HOUR), lowerBound(s.timeMs, f.timeMs - 0.25 * MS_PER_HOUR));
    start = changeStart(s.timeMs, raw.tC, Number.isNaN(level) ? meanIn(g.tC, f.index - MS_PER_HOUR / g.stepMs, f.index) : level, f.tempChangeC, f.timeMs - 3 * MS_PER_HOUR, f.zoneEndMs + 1);
  } else if (kind === 'dryline') {
    const level = meanIn(g.tdC, f.index - MS_PER_HOUR / g.stepMs, f.index + 1);
    start = changeStart(s.timeMs, raw.tdC, level, f.dewpointDropMaxC, f.timeMs - 3 * MS_PER_HOUR, f.timeMs + 3 * MS_PER_HOUR);
  }
  let chosen: SplitTime | null = null;
  let prefrontal: number | undefined;
  if (wind && start) {
    // FMH-1 times a passage at the wind shift (the time it began). A shift more than 3 h ahead of a cold
    // front's temperature fall is a prefrontal trough (Schultz2005): the front is timed at the fall and the
    // shift is reported beside it. common practice, no source, for the 3 h.
    const lead = start.timeMs - wind.timeMs;
    // A shift followed by warming before the fall is a shift in the warm sector, not the front's.
    const warmsBetween = lead > 0 && maxIn(s.timeMs, raw.tC, wind.latestMs, start.timeMs) - valueAt(s.timeMs, raw.tC, wind.earliestMs) > 0.5;
    if (kind === 'cold-front' && (lead > 3 * MS_PER_HOUR || (lead > 1.5 * MS_PER_HOUR && warmsBetween))) {
      chosen = start;
      prefrontal = wind.timeMs;
    } else chosen = Math.abs(lead) <= 3 * MS_PER_HOUR ? wind : start;
  } else chosen = wind ?? start;
  if (!chosen) return c;
  const basis = chosen === wind ? 'timed at the wind shift' : kind === 'dryline' ? 'timed at the start of the dew-point fall' : 'timed at the start of the temperature change';
  const i = gridIndex(g, chosen.timeMs);
  const again = evaluate(i);
  // Keep the re-measured classification unless it lost the passage altogether.
  const better = again.c.confidence >= 0.7 * c.c.confidence ? again : { ...c };
  better.timing = chosen;
  better.basis = basis;
  better.timeBasis = chosen === wind ? 'wind-shift' : kind === 'dryline' ? 'dew-point-change' : 'temperature-change';
  better.windTiming = wind;
  better.changeTiming = start;
  if (prefrontal !== undefined) better.prefrontalShiftMs = prefrontal;
  return better;
}

const hhmm = (ms: number) => new Date(ms).toISOString().slice(11, 16);

/** A cold front that decideKind took from a storm's outflow because a colder, drier air mass followed. */
const withStorm = (e: PassageEvent) => e.evidence.includes(ARRIVED_WITH_STORM);

function toEvent(s: StationSeries, c: Candidate, opts: DetectOptions): PassageEvent {
  const f = c.f;
  // A passage timed at the wind shift is placed at the first report with the new wind (the shift began
  // between the last report with the old wind and that one: `windShiftTimeMs` estimates when, FMH-1 §5.4.6).
  // For a warm front that is also where the station enters the warm air: its temperature contrast lies
  // ahead of it, on the cold side (Petterssen 1956, from memory), so the rise comes before the front.
  const byWind = c.timeBasis === 'wind-shift' && c.timing !== undefined;
  const timeMs = byWind ? c.timing!.latestMs : c.timing?.timeMs ?? f.timeMs;
  const evidence = [...c.c.evidence];
  if (c.basis) evidence.push(`${c.basis}, between the reports at ${hhmm(c.timing!.earliestMs)} and ${hhmm(c.timing!.latestMs)} UTC${byWind ? ' (placed at the first report with the new wind)' : ''}`);
  if (c.prefrontalShiftMs !== undefined) {
    evidence.push(`+ wind shift ${((timeMs - c.prefrontalShiftMs) / MS_PER_HOUR).toFixed(1)} h ahead of the temperature fall: prefrontal trough; the front is placed at the fall`);
  }
  // Moisture boundaries: the zone is where the dew point changes, not the temperature.
  const rawZoneEnd = c.c.kind === 'dryline' && !Number.isNaN(f.moistureZoneEndMs) ? f.moistureZoneEndMs : f.zoneEndMs;
  const zoneEndMs = Math.max(rawZoneEnd, timeMs);
  const zoneHours = Number.isNaN(rawZoneEnd) ? NaN : (zoneEndMs - timeMs) / MS_PER_HOUR;
  const speed = opts.frontSpeedKmh;
  const zoneDepthKm = speed !== undefined && speed > 0 && !Number.isNaN(zoneHours) ? zoneHours * speed : NaN;
  const gradient = zoneDepthKm > 0 ? (Math.abs(f.tempChangeC) / zoneDepthKm) * 100 : NaN;
  return {
    station: s.station,
    kind: c.c.kind,
    timeMs,
    timeEarliestMs: c.timing?.earliestMs ?? timeMs - 0.5 * MS_PER_HOUR,
    timeLatestMs: c.timing?.latestMs ?? timeMs + 0.5 * MS_PER_HOUR,
    confidence: Math.round(c.c.confidence * 100) / 100,
    tempChangeC: f.tempChangeC,
    tempChangeAdjustedC: f.frontalChangeAdjC,
    dewpointChangeC: f.dewpointChangeC,
    thetaEChangeK: f.thetaEChangeK,
    pressureMinHpa: f.pressureMinHpa,
    pressureMinTimeMs: f.pressureMinTimeMs,
    pressureRise3hHpa: f.pressureRise3hHpa,
    // The winds either side of the timed shift (the split's means), so the window and the winds agree.
    windBeforeDeg: byWind && Number.isFinite(c.timing!.beforeDeg) ? c.timing!.beforeDeg! : f.windBeforeDeg,
    windAfterDeg: byWind && Number.isFinite(c.timing!.afterDeg) ? c.timing!.afterDeg! : f.windAfterDeg,
    windTurnDeg: byWind && Number.isFinite(c.timing!.turnDeg) ? c.timing!.turnDeg : f.turnDeg,
    windSpeedAfterMs: f.speedAfterMs,
    gustMaxMs: f.gustMaxMs,
    precipNear: f.precipNear,
    zoneStartMs: timeMs,
    zoneEndMs: Number.isNaN(rawZoneEnd) ? NaN : zoneEndMs,
    zoneHours,
    zoneDepthKm,
    gradientKPer100km: gradient,
    observerFropaTimeMs: NaN,
    windShiftTimeMs: c.windTiming ? c.windTiming.timeMs : NaN,
    changeStartTimeMs: c.changeTiming ? c.changeTiming.timeMs : NaN,
    timeBasis: c.timeBasis ?? 'change-point',
    evidence,
  };
}

/**
 * Observer remarks (WSHFT / FROPA) are reported beside the nearest detection within 3 h, never used to
 * detect: FMH-1 remarks are labels for validation.
 */
function attachRemarks(s: StationSeries, events: PassageEvent[]): void {
  // The same remark often repeats in the next report or two (seen in real archives): once is enough.
  const seen = new Set<string>();
  for (const r of s.remarks) {
    const t = Number.isNaN(r.shiftTimeMs) ? r.reportTimeMs : r.shiftTimeMs;
    const key = `${r.label}@${t}`;
    if (seen.has(key)) continue;
    seen.add(key);
    let best: PassageEvent | undefined;
    for (const e of events) if (Math.abs(e.timeMs - t) <= 3 * MS_PER_HOUR && (!best || Math.abs(e.timeMs - t) < Math.abs(best.timeMs - t))) best = e;
    if (!best) continue;
    if (Number.isNaN(best.observerFropaTimeMs) || r.frontal) {
      best.observerFropaTimeMs = t;
      best.evidence.push(`observer remark ${r.label}${Number.isNaN(r.shiftTimeMs) ? '' : ' (shift began ' + new Date(r.shiftTimeMs).toISOString().slice(11, 16) + 'Z)'}`);
    }
  }
}
