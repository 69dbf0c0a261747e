/**
 * Verification of forecast passage times against observed (detected) passages: one-to-one matching
 * within a window, contingency scores (Wilks 2011 ch. 8: POD, FAR, CSI, frequency bias) and timing-error
 * statistics, overall, per station and per lead time.
 *
 * Rules (fropa's; common practice, no source):
 * - **Timing error** = forecast time − observed time, minutes; positive = forecast late (the passage came
 *   before the forecast time), negative = early.
 * - **Kinds are strict**: a forecast of kind K matches only an observed passage of kind K; a `cold-front`
 *   forecast never matches an observed `occluded-front`. A forecast with no kind (null) matches any of
 *   the verified kinds (by default ANY_FRONT_KINDS), after the typed forecasts have been matched. A false
 *   alarm with an observed passage of another kind within the window is listed in `kindMismatches`
 *   (the forecaster got the time but not the kind); it still counts as a false alarm, and that passage,
 *   unless matched otherwise, as a miss.
 * - **Matching**: at the same station, |error| ≤ window (inclusive), nearest pairs first, one-to-one
 *   (matchOneToOne). Two forecasts of one passage (e.g. from successive issues) give one hit and one
 *   false alarm: verify one issue per passage.
 * - **Misses** are observed passages of the verified kinds at a station with forecasts, within the
 *   period the forecasts cover there: from the first forecast time − window to the last + window.
 *   Stations without forecasts, and passages outside that period, are not verified.
 * - **Lead time** = forecast time − issued time, hours, binned 0–12, 12–24, 24–48, 48+ h (a bin holds
 *   [lo, hi)); `unknown` without an issued time. A miss has no forecast, hence no lead time: lead-time
 *   bins count hits and false alarms only, and their POD, CSI and bias are NaN.
 */
import type { BoundaryKind, PassageEvent } from '../model/index.js';
import { csi, far, frequencyBias, matchOneToOne, pod, type Timed } from './contingency.js';
import { ANY_FRONT_KINDS, type ForecastPassage } from './forecasts.js';
import { quantile } from './quantile.js';
import { MS_PER_HOUR, MS_PER_MINUTE } from '../physics/constants.js';

export interface VerifyOptions {
  /** Matching window, hours either side (default 6). */
  windowHours?: number;
  /** Verify only these kinds (forecasts and observed passages of other kinds are left out). */
  kinds?: readonly BoundaryKind[] | ReadonlySet<BoundaryKind>;
}

export interface VerifiedPair {
  forecast: ForecastPassage;
  event: PassageEvent;
  /** Forecast − observed, minutes; positive = forecast late. */
  errorMin: number;
}

export interface VerifyScores {
  hits: number;
  misses: number;
  falseAlarms: number;
  pod: number;
  far: number;
  csi: number;
  bias: number;
  /** Mean of forecast − observed over hits, minutes (positive = late on average). */
  timingErrorMeanMin: number;
  timingErrorMedianMin: number;
  /** Mean absolute error, minutes. */
  timingErrorMaeMin: number;
  /** 90th percentile of |error|, minutes (Hyndman & Fan type 7). */
  p90AbsMin: number;
  /** Hits with the forecast after the observed passage (error > 0). */
  nLate: number;
  /** Hits with the forecast before the observed passage (error < 0). */
  nEarly: number;
}

export const LEAD_BINS = ['0-12h', '12-24h', '24-48h', '48h+', 'unknown'] as const;
export type LeadBin = (typeof LEAD_BINS)[number];

export interface VerifyResult {
  pairs: VerifiedPair[];
  misses: PassageEvent[];
  falseAlarms: ForecastPassage[];
  /** False alarms with an observed passage of another kind within the window (nearest). */
  kindMismatches: VerifiedPair[];
  /** Forecasts left out because their kind is not among `kinds`. */
  excluded: ForecastPassage[];
  byStation: Map<string, VerifyScores>;
  byLeadTime: Map<LeadBin, VerifyScores>;
  scores: VerifyScores;
  windowHours: number;
  /** Kinds verified (observed passages of these kinds can be misses). */
  kinds: BoundaryKind[];
}

/**
 * Lead-time bin of a forecast: [0, 12), [12, 24), [24, 48), [48, ∞) hours; `unknown` when the issued
 * time is missing.
 * @example leadBin(Date.UTC(2026, 2, 2, 12), Date.UTC(2026, 2, 1, 12)) // '24-48h'
 */
export function leadBin(forecastMs: number, issuedMs: number): LeadBin {
  const h = (forecastMs - issuedMs) / MS_PER_HOUR;
  if (!Number.isFinite(h)) return 'unknown';
  return h < 12 ? '0-12h' : h < 24 ? '12-24h' : h < 48 ? '24-48h' : '48h+';
}

/**
 * Contingency and timing scores from counts and the hits' timing errors (minutes, forecast − observed).
 * @example scoresOf(2, 1, 1, [30, -10]).timingErrorMeanMin // 10
 */
export function scoresOf(hits: number, misses: number, falseAlarms: number, errorsMin: readonly number[]): VerifyScores {
  const c = { hits, misses, falseAlarms };
  const abs = errorsMin.map(Math.abs);
  const mean = (a: readonly number[]) => (a.length ? a.reduce((s, x) => s + x, 0) / a.length : NaN);
  return {
    hits,
    misses,
    falseAlarms,
    pod: pod(c),
    far: far(c),
    csi: csi(c),
    bias: frequencyBias(c),
    timingErrorMeanMin: mean(errorsMin),
    timingErrorMedianMin: quantile(errorsMin, 0.5),
    timingErrorMaeMin: mean(abs),
    p90AbsMin: quantile(abs, 0.9),
    nLate: errorsMin.filter((e) => e > 0).length,
    nEarly: errorsMin.filter((e) => e < 0).length,
  };
}

/**
 * Verify forecast passages against observed passages (see the module comment for the rules).
 * Deterministic: results are in station, then time order.
 * @example // a cold front observed at station A at t = 0, forecast for t = +30 min:
 * verifyForecasts([{ station: 'A', kind: 'cold-front', forecastMs: 1_800_000, issuedMs: NaN, file: 'f', line: 2 }], [eventAtA0]).pairs[0].errorMin // 30 (late)
 */
export function verifyForecasts(forecasts: readonly ForecastPassage[], events: readonly PassageEvent[], opts: VerifyOptions = {}): VerifyResult {
  const windowHours = opts.windowHours ?? 6;
  if (!(windowHours > 0 && Number.isFinite(windowHours))) throw new RangeError('verifyForecasts requires windowHours > 0');
  const windowMs = windowHours * MS_PER_HOUR;
  const only = opts.kinds ? new Set(opts.kinds) : null;
  const used = forecasts.filter((f) => !only || f.kind === null || only.has(f.kind));
  const excluded = forecasts.filter((f) => only && f.kind !== null && !only.has(f.kind));
  // Verified kinds: the ones asked for, else those forecast (any front kind for untyped forecasts).
  const kindSet = new Set<BoundaryKind>(only ?? []);
  if (!only) for (const f of used) for (const k of f.kind === null ? ANY_FRONT_KINDS : [f.kind]) kindSet.add(k);
  const kinds = [...kindSet].sort();
  // Coverage: per station, first forecast − window .. last forecast + window.
  const cover = new Map<string, [number, number]>();
  for (const f of used) {
    const c = cover.get(f.station);
    if (!c) cover.set(f.station, [f.forecastMs, f.forecastMs]);
    else {
      c[0] = Math.min(c[0], f.forecastMs);
      c[1] = Math.max(c[1], f.forecastMs);
    }
  }
  const inCover = (e: PassageEvent) => {
    const c = cover.get(e.station);
    return c !== undefined && e.timeMs >= c[0] - windowMs && e.timeMs <= c[1] + windowMs;
  };
  const obs = events.filter((e) => kindSet.has(e.kind) && inCover(e));
  // Pass 1: typed forecasts, same station and same kind (the kind joins the station key).
  const key = (station: string, kind: string) => `${station}\u0000${kind}`;
  const typed = used.filter((f) => f.kind !== null);
  const m1 = matchOneToOne(
    obs.map((e): Timed => ({ station: key(e.station, e.kind), timeMs: e.timeMs })),
    typed.map((f): Timed => ({ station: key(f.station, f.kind!), timeMs: f.forecastMs })),
    windowMs,
  );
  const pairs: VerifiedPair[] = m1.pairs.map(([i, j]) => pair(typed[j]!, obs[i]!));
  // Pass 2: untyped forecasts against the passages still unmatched, any verified kind.
  const left = m1.unmatchedTruth.map((i) => obs[i]!);
  const untyped = used.filter((f) => f.kind === null);
  const m2 = matchOneToOne(
    left.map((e): Timed => ({ station: e.station, timeMs: e.timeMs })),
    untyped.map((f): Timed => ({ station: f.station, timeMs: f.forecastMs })),
    windowMs,
  );
  pairs.push(...m2.pairs.map(([i, j]) => pair(untyped[j]!, left[i]!)));
  const misses = m2.unmatchedTruth.map((i) => left[i]!);
  const falseAlarms = [...m1.unmatchedDetections.map((j) => typed[j]!), ...m2.unmatchedDetections.map((j) => untyped[j]!)];
  // Near misses of another kind: the nearest observed passage of a different kind within the window.
  const kindMismatches: VerifiedPair[] = [];
  for (const f of falseAlarms) {
    if (f.kind === null) continue;
    let best: PassageEvent | undefined;
    for (const e of events) {
      if (e.station !== f.station || e.kind === f.kind || Math.abs(f.forecastMs - e.timeMs) > windowMs) continue;
      if (!best || Math.abs(f.forecastMs - e.timeMs) < Math.abs(f.forecastMs - best.timeMs)) best = e;
    }
    if (best) kindMismatches.push(pair(f, best));
  }
  const byTime = <T>(t: (x: T) => number, s: (x: T) => string) => (a: T, b: T) => (s(a) < s(b) ? -1 : s(a) > s(b) ? 1 : t(a) - t(b));
  pairs.sort(byTime((p) => p.forecast.forecastMs, (p) => p.forecast.station));
  misses.sort(byTime((e) => e.timeMs, (e) => e.station));
  falseAlarms.sort(byTime((f) => f.forecastMs, (f) => f.station));
  kindMismatches.sort(byTime((p) => p.forecast.forecastMs, (p) => p.forecast.station));

  const byStation = new Map<string, VerifyScores>();
  for (const s of [...cover.keys()].sort()) {
    const ps = pairs.filter((p) => p.forecast.station === s);
    byStation.set(
      s,
      scoresOf(ps.length, misses.filter((e) => e.station === s).length, falseAlarms.filter((f) => f.station === s).length, ps.map((p) => p.errorMin)),
    );
  }
  const byLeadTime = new Map<LeadBin, VerifyScores>();
  for (const b of LEAD_BINS) {
    const ps = pairs.filter((p) => leadBin(p.forecast.forecastMs, p.forecast.issuedMs) === b);
    const fa = falseAlarms.filter((f) => leadBin(f.forecastMs, f.issuedMs) === b).length;
    if (ps.length + fa === 0) continue;
    const s = scoresOf(ps.length, 0, fa, ps.map((p) => p.errorMin));
    byLeadTime.set(b, { ...s, misses: NaN, pod: NaN, csi: NaN, bias: NaN });
  }
  const scores = scoresOf(pairs.length, misses.length, falseAlarms.length, pairs.map((p) => p.errorMin));
  return { pairs, misses, falseAlarms, kindMismatches, excluded, byStation, byLeadTime, scores, windowHours, kinds };
}

function pair(forecast: ForecastPassage, event: PassageEvent): VerifiedPair {
  return { forecast, event, errorMin: (forecast.forecastMs - event.timeMs) / MS_PER_MINUTE };
}
