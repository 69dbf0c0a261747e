/**
 * Verification of forecast passage times against observed (detected) passages: optimal one-to-one
 * matching per forecast issue, contingency scores (Wilks 2011 ch. 8: POD, FAR, CSI, frequency bias),
 * timing-error statistics and bootstrap confidence intervals, per station, kind, source and lead time.
 *
 * Rules (fropa's; common practice, no source, unless a source is named):
 * - **Timing error** = forecast time − observed time, minutes; positive = forecast late (the passage came
 *   before the forecast time), negative = early.
 * - **Issues**: forecasts of one source (file or forecast series) at one station with the same issued
 *   time are one issue (no issued time: all such forecasts at the station form one issue). Each issue
 *   is verified on its own, so two issues of one passage give two hits (one per issue), never a hit and
 *   a false alarm.
 * - **Valid window** (the period an issue covers; an observed passage there that the issue did not
 *   forecast is its miss): the forecast's `valid_from` … `valid_to`, else issued … issued + validHours
 *   (`--valid-hours`); such a window covers every verified kind. Without either, a forecast covers only
 *   ±window around its own time and only the kinds it can match (a miss is then a passage next to a
 *   forecast that went elsewhere). A window never starts before the issued time. Extra coverage periods
 *   without forecasts (a forecast series with no passage) are given as `coverage`.
 * - **Matching** within an issue: a forecast and an observed passage at the same station are compatible
 *   when their kinds are (strict: a `cold-front` forecast never matches an observed `occluded-front`; a
 *   forecast without kind matches any of ANY_FRONT_KINDS that is verified) and |error| ≤ window
 *   (inclusive). Among compatible pairs, the matching with the most pairs and then the least total
 *   |error| (matchOptimal: Kuhn 1955 / Munkres 1957). Unmatched forecasts are false alarms.
 * - **Headline**: for each observed passage, the outcome in the latest issue issued at or before it
 *   that covers (or matched) it; for each false alarm, counted when its issue is the latest at or before
 *   the forecast time covering that time. Each verified passage counts once in the headline.
 * - **Lead time** = forecast − issued (hits, false alarms) or observed − issued (misses), hours, binned
 *   0–12, 12–24, 24–48, 48+ h ([lo, hi)); `unknown` without an issued time. Lead bins count every issue.
 * - **Confidence intervals**: percentile bootstrap over the headline's verified passages (bootstrap.ts),
 *   seeded, so the output is deterministic.
 */
import type { BoundaryKind, PassageEvent } from '../model/index.js';
import { matchOptimal } from './assignment.js';
import { bootstrapIntervals, type BootstrapOptions, type Interval } from './bootstrap.js';
import { csi, far, frequencyBias, pod } from './contingency.js';
import { ANY_FRONT_KINDS, type ForecastPassage } from './forecasts.js';
import { quantile } from './quantile.js';
import { MS_PER_HOUR, MS_PER_MINUTE } from '../physics/constants.js';


/** A period a source covers at a station without (or besides) forecast passages, e.g. a forecast series. */
export interface CoveragePeriod {
  source: string;
  station: string;
  fromMs: number;
  toMs: number;
  /** Issued time of the covering forecast; NaN or absent when unknown. */
  issuedMs?: number;
}

export interface VerifyOptions {
  /** Matching window, hours either side (default 6). */
  windowHours?: number;
  /** Verify only these kinds (forecasts and observed passages of other kinds are left out). */
  kinds?: readonly BoundaryKind[] | ReadonlySet<BoundaryKind>;
  /** Hours an issue covers from its issued time, for forecasts without valid_from/valid_to. */
  validHours?: number;
  /** Periods covered without forecast passages (see the module comment). */
  coverage?: readonly CoveragePeriod[];
  /** Bootstrap settings of the headline intervals; false for none. */
  bootstrap?: BootstrapOptions | false;
}

export interface VerifiedPair {
  forecast: ForecastPassage;
  event: PassageEvent;
  /** Forecast − observed, minutes; positive = forecast late. */
  errorMin: number;
}

export type OutcomeKind = 'hit' | 'false-alarm' | 'miss';

/** One verified item of one issue: a forecast (hit or false alarm) or an observed passage it missed. */
export interface VerifiedOutcome {
  outcome: OutcomeKind;
  source: string;
  station: string;
  /** Observed kind for hits and misses; forecast kind for false alarms (null = any front). */
  kind: BoundaryKind | null;
  forecast: ForecastPassage | null;
  event: PassageEvent | null;
  /** Issued time of the issue, epoch ms; NaN when unknown. */
  issuedMs: number;
  /** Forecast − issued (hit, false alarm) or observed − issued (miss), hours; NaN when unknown. */
  leadHours: number;
  leadBin: LeadBin;
  /** Forecast − observed, minutes (hits); NaN otherwise. */
  errorMin: number;
  /** Counted in the headline (latest issue before the passage). */
  headline: boolean;
  /** The issue's valid window, epoch ms (NaN when it covers only ±window around its forecasts). */
  validFromMs: number;
  validToMs: number;
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
  /** Root-mean-square error, minutes. */
  timingErrorRmseMin: number;
  /** 90th percentile of |error|, minutes (Hyndman & Fan type 7). */
  p90AbsMin: number;
  /** Hits with the forecast after the observed passage (error > 0). */
  nLate: number;
  /** Hits with the forecast before the observed passage (error < 0). */
  nEarly: number;
}

/** Scores that carry a headline confidence interval. */
export const CI_SCORES = ['pod', 'far', 'csi', 'bias', 'timingErrorMeanMin', 'timingErrorMedianMin', 'timingErrorMaeMin', 'timingErrorRmseMin', 'p90AbsMin'] as const;
export type CiScore = (typeof CI_SCORES)[number];

export const LEAD_BINS = ['0-12h', '12-24h', '24-48h', '48h+', 'unknown'] as const;
export type LeadBin = (typeof LEAD_BINS)[number];

export interface VerifyResult {
  /** Every outcome of every issue, in station, time, source, issued order. */
  outcomes: VerifiedOutcome[];
  /** Headline hits, misses and false alarms (latest issue before the passage). */
  pairs: VerifiedPair[];
  misses: PassageEvent[];
  falseAlarms: ForecastPassage[];
  /** Headline false alarms with an observed passage of another kind within the window (nearest). */
  kindMismatches: VerifiedPair[];
  /** Forecasts left out because their kind is not among `kinds`. */
  excluded: ForecastPassage[];
  /** Headline scores per station, kind (`any` for false alarms of any front), source. */
  byStation: Map<string, VerifyScores>;
  byKind: Map<string, VerifyScores>;
  bySource: Map<string, VerifyScores>;
  /** Every issue's outcomes by lead-time bin. */
  byLeadTime: Map<LeadBin, VerifyScores>;
  /** Headline scores, overall. */
  scores: VerifyScores;
  /** Percentile bootstrap intervals of the headline scores (absent with bootstrap: false). */
  intervals?: Record<CiScore, Interval>;
  bootstrap?: Required<BootstrapOptions>;
  /** Number of issues verified. */
  issueCount: number;
  windowHours: number;
  validHours?: number;
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

const mean = (a: readonly number[]) => (a.length ? a.reduce((s, x) => s + x, 0) / a.length : NaN);

/**
 * Contingency scores (Wilks 2011 ch. 8) and timing statistics from counts and the hits' timing errors
 * (minutes, forecast − observed): mean, median and 90th percentile of |error| (Hyndman & Fan 1996
 * type 7), MAE and RMSE (Wilks 2011 ch. 8, continuous scores).
 * @example scoresOf(2, 1, 1, [30, -10]).timingErrorMeanMin // 10
 */
export function scoresOf(hits: number, misses: number, falseAlarms: number, errorsMin: readonly number[]): VerifyScores {
  const c = { hits, misses, falseAlarms };
  const abs = errorsMin.map(Math.abs);
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
    timingErrorRmseMin: Math.sqrt(mean(errorsMin.map((e) => e * e))),
    p90AbsMin: quantile(abs, 0.9),
    nLate: errorsMin.filter((e) => e > 0).length,
    nEarly: errorsMin.filter((e) => e < 0).length,
  };
}

/** Scores of a list of outcomes. @example scoresOfOutcomes([]).hits // 0 */
export function scoresOfOutcomes(list: readonly VerifiedOutcome[]): VerifyScores {
  let h = 0;
  let m = 0;
  let f = 0;
  const errs: number[] = [];
  for (const o of list) {
    if (o.outcome === 'hit') (h++, errs.push(o.errorMin));
    else if (o.outcome === 'miss') m++;
    else f++;
  }
  return scoresOf(h, m, f, errs);
}

interface Cover {
  fromMs: number;
  toMs: number;
  /** null = every verified kind. */
  kinds: ReadonlySet<BoundaryKind> | null;
}

interface Issue {
  source: string;
  station: string;
  issuedMs: number;
  order: number;
  forecasts: ForecastPassage[];
  cover: Cover[];
  explicit: boolean;
}

const finite = (x: number | undefined): x is number => x !== undefined && Number.isFinite(x);

/**
 * Verify forecast passages against observed passages (see the module comment for the rules).
 * Deterministic: outcomes are in station, then time order; the bootstrap is seeded.
 * @example // a cold front observed at station A at t = 0, forecast for t = +30 min:
 * verifyForecasts([{ station: 'A', kind: 'cold-front', forecastMs: 1_800_000, issuedMs: NaN, file: 'f', line: 2 }], [eventAtA0]).pairs[0].errorMin // 30 (late)
 */
export function verifyForecasts(forecasts: readonly ForecastPassage[], events: readonly PassageEvent[], opts: VerifyOptions = {}): VerifyResult {
  const windowHours = opts.windowHours ?? 6;
  if (!(windowHours > 0 && Number.isFinite(windowHours))) throw new RangeError('verifyForecasts requires windowHours > 0');
  const validHours = opts.validHours;
  if (validHours !== undefined && !(validHours > 0 && Number.isFinite(validHours))) throw new RangeError('verifyForecasts requires validHours > 0');
  const windowMs = windowHours * MS_PER_HOUR;
  const only = opts.kinds ? new Set(opts.kinds) : null;
  const used = forecasts.filter((f) => !only || f.kind === null || only.has(f.kind));
  const excluded = forecasts.filter((f) => only && f.kind !== null && !only.has(f.kind));
  // Verified kinds: the ones asked for, else those forecast (any front kind for untyped forecasts).
  const kindSet = new Set<BoundaryKind>(only ?? []);
  if (!only) for (const f of used) for (const k of f.kind === null ? ANY_FRONT_KINDS : [f.kind]) kindSet.add(k);
  const kinds = [...kindSet].sort();
  const canMatch = (f: ForecastPassage, k: BoundaryKind) => kindSet.has(k) && (f.kind === null ? ANY_FRONT_KINDS.includes(k) : f.kind === k);
  const sourceOf = (f: ForecastPassage) => f.source ?? f.file;

  // Issues: source × station × issued time, in first-appearance order.
  const issues = new Map<string, Issue>();
  const issueOf = (source: string, station: string, issuedMs: number) => {
    const key = `${source}\u0000${station}\u0000${Number.isFinite(issuedMs) ? issuedMs : '?'}`;
    let is = issues.get(key);
    if (!is) issues.set(key, (is = { source, station, issuedMs: Number.isFinite(issuedMs) ? issuedMs : NaN, order: issues.size, forecasts: [], cover: [], explicit: false }));
    return is;
  };
  for (const f of used) {
    const is = issueOf(sourceOf(f), f.station, f.issuedMs);
    is.forecasts.push(f);
    const from = finite(f.validFromMs) ? f.validFromMs : finite(f.issuedMs) && validHours !== undefined ? f.issuedMs : NaN;
    const to = finite(f.validToMs) ? f.validToMs : finite(from) && validHours !== undefined ? from + validHours * MS_PER_HOUR : NaN;
    if (finite(from) && finite(to)) {
      is.cover.push({ fromMs: finite(f.issuedMs) ? Math.max(from, f.issuedMs) : from, toMs: to, kinds: null });
      is.explicit = true;
    } else {
      const ks = new Set(ANY_FRONT_KINDS.concat(kinds).filter((k) => canMatch(f, k)));
      is.cover.push({ fromMs: finite(f.issuedMs) ? Math.max(f.forecastMs - windowMs, f.issuedMs) : f.forecastMs - windowMs, toMs: f.forecastMs + windowMs, kinds: ks });
    }
  }
  for (const c of opts.coverage ?? []) {
    const is = issueOf(c.source, c.station, c.issuedMs ?? NaN);
    is.cover.push({ fromMs: finite(c.issuedMs) ? Math.max(c.fromMs, c.issuedMs) : c.fromMs, toMs: c.toMs, kinds: null });
    is.explicit = true;
  }
  const covers = (is: Issue, t: number, k: BoundaryKind) => is.cover.some((c) => t >= c.fromMs && t <= c.toMs && (c.kinds === null || c.kinds.has(k)));

  const evByStation = new Map<string, PassageEvent[]>();
  for (const e of events) {
    if (!kindSet.has(e.kind)) continue;
    let a = evByStation.get(e.station);
    if (!a) evByStation.set(e.station, (a = []));
    a.push(e);
  }
  for (const a of evByStation.values()) a.sort((x, y) => x.timeMs - y.timeMs);

  const outcomes: VerifiedOutcome[] = [];
  const perIssue = new Map<Issue, VerifiedOutcome[]>();
  for (const is of issues.values()) {
    const lo = Math.min(...is.cover.map((c) => c.fromMs), ...is.forecasts.map((f) => f.forecastMs)) - windowMs;
    const hi = Math.max(...is.cover.map((c) => c.toMs), ...is.forecasts.map((f) => f.forecastMs)) + windowMs;
    const obs = (evByStation.get(is.station) ?? []).filter((e) => e.timeMs >= lo && e.timeMs <= hi);
    const fcs = [...is.forecasts].sort((a, b) => a.forecastMs - b.forecastMs || a.line - b.line);
    const m = matchOptimal(
      obs.map((e) => e.timeMs),
      fcs.map((f) => f.forecastMs),
      windowMs,
      (i, j) => canMatch(fcs[j]!, obs[i]!.kind),
    );
    const vFrom = is.explicit ? Math.min(...is.cover.filter((c) => c.kinds === null).map((c) => c.fromMs)) : NaN;
    const vTo = is.explicit ? Math.max(...is.cover.filter((c) => c.kinds === null).map((c) => c.toMs)) : NaN;
    const base = { source: is.source, station: is.station, issuedMs: is.issuedMs, headline: false, validFromMs: vFrom, validToMs: vTo };
    const lead = (t: number) => (t - is.issuedMs) / MS_PER_HOUR;
    const list: VerifiedOutcome[] = [];
    for (const [i, j] of m.pairs) {
      const f = fcs[j]!;
      const e = obs[i]!;
      list.push({ ...base, outcome: 'hit', kind: e.kind, forecast: f, event: e, leadHours: lead(f.forecastMs), leadBin: leadBin(f.forecastMs, is.issuedMs), errorMin: (f.forecastMs - e.timeMs) / MS_PER_MINUTE });
    }
    for (const j of m.unmatchedForecasts) {
      const f = fcs[j]!;
      list.push({ ...base, outcome: 'false-alarm', kind: f.kind, forecast: f, event: null, leadHours: lead(f.forecastMs), leadBin: leadBin(f.forecastMs, is.issuedMs), errorMin: NaN });
    }
    for (const i of m.unmatchedObserved) {
      const e = obs[i]!;
      if (!covers(is, e.timeMs, e.kind)) continue;
      list.push({ ...base, outcome: 'miss', kind: e.kind, forecast: null, event: e, leadHours: lead(e.timeMs), leadBin: leadBin(e.timeMs, is.issuedMs), errorMin: NaN });
    }
    perIssue.set(is, list);
    for (const x of list) outcomes.push(x);
  }

  // Headline: per source and station, the latest issue at or before the passage (or forecast) time.
  const groups = new Map<string, Issue[]>();
  for (const is of issues.values()) {
    const k = `${is.source}\u0000${is.station}`;
    (groups.get(k) ?? groups.set(k, []).get(k)!).push(is);
  }
  const later = (a: Issue, b: Issue) => {
    const ia = Number.isNaN(a.issuedMs) ? -Infinity : a.issuedMs;
    const ib = Number.isNaN(b.issuedMs) ? -Infinity : b.issuedMs;
    return ia > ib || (ia === ib && a.order < b.order);
  };
  const before = (is: Issue, t: number) => Number.isNaN(is.issuedMs) || is.issuedMs <= t;
  for (const group of groups.values()) {
    const byEvent = new Map<PassageEvent, { is: Issue; o: VerifiedOutcome }>();
    for (const is of group) {
      for (const o of perIssue.get(is)!) {
        if (o.event === null || !before(is, o.event.timeMs)) continue;
        const cur = byEvent.get(o.event);
        if (!cur || later(is, cur.is)) byEvent.set(o.event, { is, o });
      }
    }
    for (const { o } of byEvent.values()) o.headline = true;
    for (const is of group) {
      for (const o of perIssue.get(is)!) {
        if (o.outcome !== 'false-alarm') continue;
        const f = o.forecast!;
        const ks = ANY_FRONT_KINDS.concat(kinds).filter((k) => canMatch(f, k));
        let gov: Issue | undefined;
        for (const other of group) {
          if (!before(other, f.forecastMs)) continue;
          if (other !== is && !ks.some((k) => covers(other, f.forecastMs, k))) continue;
          if (!gov || later(other, gov)) gov = other;
        }
        o.headline = gov === is;
      }
    }
  }
  const tOf = (o: VerifiedOutcome) => o.forecast?.forecastMs ?? o.event!.timeMs;
  const cmp = (a: string, b: string) => (a < b ? -1 : a > b ? 1 : 0);
  outcomes.sort(
    (a, b) =>
      cmp(a.station, b.station) ||
      tOf(a) - tOf(b) ||
      cmp(a.source, b.source) ||
      (Number.isNaN(a.issuedMs) ? -Infinity : a.issuedMs) - (Number.isNaN(b.issuedMs) ? -Infinity : b.issuedMs) ||
      (a.forecast?.line ?? 0) - (b.forecast?.line ?? 0),
  );
  const head = outcomes.filter((o) => o.headline);
  const pairs: VerifiedPair[] = head.filter((o) => o.outcome === 'hit').map((o) => ({ forecast: o.forecast!, event: o.event!, errorMin: o.errorMin }));
  const misses = head.filter((o) => o.outcome === 'miss').map((o) => o.event!);
  const falseAlarms = head.filter((o) => o.outcome === 'false-alarm').map((o) => o.forecast!);

  // Near misses of another kind: the nearest observed passage of a different kind within the window.
  const kindMismatches: VerifiedPair[] = [];
  for (const f of falseAlarms) {
    if (f.kind === null) continue;
    let best: PassageEvent | undefined;
    for (const e of events) {
      if (e.station !== f.station || e.kind === f.kind || Math.abs(f.forecastMs - e.timeMs) > windowMs) continue;
      if (!best || Math.abs(f.forecastMs - e.timeMs) < Math.abs(f.forecastMs - best.timeMs)) best = e;
    }
    if (best) kindMismatches.push({ forecast: f, event: best, errorMin: (f.forecastMs - best.timeMs) / MS_PER_MINUTE });
  }

  const groupBy = (list: readonly VerifiedOutcome[], key: (o: VerifiedOutcome) => string, order?: readonly string[]) => {
    const m = new Map<string, VerifiedOutcome[]>();
    for (const o of list) (m.get(key(o)) ?? m.set(key(o), []).get(key(o))!).push(o);
    const keys = order ? order.filter((k) => m.has(k)) : [...m.keys()].sort();
    return new Map(keys.map((k) => [k, scoresOfOutcomes(m.get(k)!)]));
  };
  const stations = [...new Set([...issues.values()].map((is) => is.station))].sort();
  const byStation = groupBy(head, (o) => o.station);
  for (const s of stations) if (!byStation.has(s)) byStation.set(s, scoresOf(0, 0, 0, []));
  const byStationSorted = new Map([...byStation.entries()].sort((a, b) => cmp(a[0], b[0])));
  const byKind = groupBy(head, (o) => o.kind ?? 'any');
  const bySource = groupBy(head, (o) => o.source);
  const byLeadTime = groupBy(outcomes, (o) => o.leadBin, LEAD_BINS) as Map<LeadBin, VerifyScores>;
  const scores = scoresOfOutcomes(head);
  const result: VerifyResult = {
    outcomes, pairs, misses, falseAlarms, kindMismatches, excluded, byStation: byStationSorted, byKind, bySource, byLeadTime, scores,
    issueCount: issues.size, windowHours, kinds, ...(validHours !== undefined ? { validHours } : {}),
  };
  if (opts.bootstrap !== false) {
    const bs = { resamples: opts.bootstrap?.resamples ?? 1000, seed: opts.bootstrap?.seed ?? 1, level: opts.bootstrap?.level ?? 0.95 };
    result.intervals = bootstrapIntervals(head, CI_SCORES, scoresOfOutcomes, bs);
    result.bootstrap = bs;
  }
  return result;
}
