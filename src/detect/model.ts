/**
 * The fitted classifier: multinomial logistic regression (softmax regression; e.g. Hastie, Tibshirani
 * & Friedman 2009, The Elements of Statistical Learning, §4.4) over the measured features of a
 * candidate, its hand-written signature scores (classify.ts) and its lasting air-mass change
 * (airmass.ts). Its parameters are data (modelParams.ts), fitted on the tuning part of the real
 * development set (labels are the project's own judgement, by eye) by `npm run fit:model`, so that a
 * probability means the observed frequency of that kind among candidates like it.
 */
import type { Features } from './features.js';
import type { AirMassChange } from './airmass.js';
import type { Classification } from './classify.js';

/** The kinds the model tells apart; `none` is "not a boundary passage". */
export const MODEL_CLASSES = ['none', 'cold-front', 'warm-front', 'outflow-boundary', 'sea-breeze-front'] as const;
export type ModelClass = (typeof MODEL_CLASSES)[number];

export interface ModelParams {
  classes: readonly string[];
  features: readonly string[];
  /** weights[k][j]: class k, feature j; the last column is the intercept. */
  weights: readonly (readonly number[])[];
  /**
   * Event-level calibration per kind (Platt 1999): confidence = 1 / (1 + exp(−(a + b·logit(p)))), with p
   * the candidate's class probability; fitted on the detections of the tuning part, so that a confidence
   * is the observed frequency of such a detection matching a labelled passage of its kind.
   */
  calibration?: Readonly<Record<string, readonly [number, number]>>;
}

/**
 * Evidence of a cold front that came with a storm's outflow (decideKind); detect.ts keeps such a passage an
 * outflow when a cold front of its own follows within hours (the lasting cold air is that front's).
 */
export const ARRIVED_WITH_STORM = '+ a colder, drier air mass stays behind: a front that arrived with the storm, not its outflow alone';

/** Candidates whose best boundary class is less probable than this are not passages (common practice, no source). */
export const MIN_CLASS_PROBABILITY = 0.1;

/** Platt scaling of a class probability with (a, b); identity without calibration. */
export function calibrate(p: number, ab: readonly [number, number] | undefined): number {
  if (!ab) return p;
  const q = Math.min(1 - 1e-6, Math.max(1e-6, p));
  const z = ab[0] + ab[1] * Math.log(q / (1 - q));
  return 1 / (1 + Math.exp(-z));
}

/**
 * Platt scaling applied twice is one Platt scaling (Platt 1999 form):
 * σ(a2 + b2·logit σ(a1 + b1·x)) = σ((a2 + b2·a1) + b2·b1·x).
 * @example composeCalibration([-1, 1], [0.5, 2]) // [-1.5, 2]
 */
export function composeCalibration(first: readonly [number, number], second: readonly [number, number]): [number, number] {
  return [second[0] + second[1] * first[0], second[1] * first[1]];
}

/** Clamp to ±limit and map NaN to 0 (the missing indicators carry the absence). */
const c = (x: number, limit = 3) => (Number.isNaN(x) ? 0 : x > limit ? limit : x < -limit ? -limit : x);
const miss = (x: number) => (Number.isNaN(x) ? 1 : 0);

/** Names of the model's inputs, in order (documentation and the parameter file's check). */
export const FEATURE_NAMES = [
  'score_cold', 'score_warm', 'score_outflow', 'score_sea_breeze', 'score_occluded', 'score_dryline', 'score_shift',
  'temp_adj_change', 'temp_change', 'dewpoint_change', 'theta_e_change',
  'turn_front_sense', 'turn_abs', 'turn_missing', 'speed_before', 'speed_after', 'gust_max',
  'pressure_fall_before', 'pressure_rise_3h', 'pressure_rise_6h', 'pressure_missing',
  'recovery', 'abrupt_change',
  'temp_day', 'dewpoint_day', 'theta_e_day', 'day_missing', 'temp_adj_lasting', 'dewpoint_lasting', 'theta_e_lasting',
  'solar_sin', 'solar_cos', 'daytime', 'convective_near', 'precip_near', 'season_winter',
  'temp_adj_change_long', 'dewpoint_change_long', 'turn_long_front_sense', 'onset_delay', 'depression_before',
  'temp_daily_mean', 'dewpoint_daily_mean', 'daily_missing', 'cooling_x_daily', 'turn_x_speed',
  'summer_x_cooling', 'summer_x_recovery', 'summer_x_temp_daily', 'convective_x_cooling', 'daytime_x_cooling',
] as const;

/**
 * The input vector of one candidate. `hemisphere` +1 north, −1 south (turns are taken in the
 * cold-front sense of the hemisphere, the season flips with it).
 */
export function modelInputs(f: Features, a: AirMassChange, h: Classification, hemisphere: 1 | -1): Float64Array {
  const s = h.scores;
  const doy = (f.timeMs / 86_400_000) % 365.25;
  const solar = (f.solarHour / 24) * 2 * Math.PI;
  // Warm-season weight in [0, 1]: 1 in midsummer, 0 in midwinter (the season flips south of the equator).
  const summer = (1 - hemisphere * Math.cos((2 * Math.PI * (doy - 15)) / 365.25)) / 2;
  const x = [
    s['cold-front'], s['warm-front'], s['outflow-boundary'], s['sea-breeze-front'], s['occluded-front'], s.dryline, s['wind-shift'],
    c(f.tempAdjChangeC / 5), c(f.tempChangeC / 5), c(f.dewpointChangeC / 5), c(f.thetaEChangeK / 10),
    c((f.turnDeg * hemisphere) / 90), c(Math.abs(f.turnDeg) / 90), miss(f.turnDeg), c(f.speedBeforeMs / 5), c(f.speedAfterMs / 5), c(f.gustMaxMs / 15),
    c(-f.pressureFallBeforeHpa / 2), c(f.pressureRise3hHpa / 2), c(a.pressureRise6hHpa / 3), miss(f.pressureRise3hHpa),
    c(f.recoveryFraction, 1.5), c(f.abruptChangeC / 3),
    c(a.tempDayC / 5), c(a.dewpointDayC / 5), c(a.thetaEDayK / 10), miss(a.tempDayC), c(a.tempAdjLastingC / 5), c(a.dewpointLastingC / 5), c(a.thetaELastingK / 10),
    Number.isNaN(solar) ? 0 : Math.sin(solar), Number.isNaN(solar) ? 0 : Math.cos(solar), f.solarHour >= 9.5 && f.solarHour <= 18.5 ? 1 : 0,
    f.convectiveNear ? 1 : 0, f.precipNear ? 1 : 0, hemisphere * Math.cos((2 * Math.PI * (doy - 15)) / 365.25),
    c(f.tempAdjChangeLongC / 5), c(f.dewpointChangeLongC / 5), c((f.turnLongDeg * hemisphere) / 90), c(f.onsetDelayH / 3), c(f.depressionBeforeC / 5),
    c(a.tempDailyMeanC / 4), c(a.dewpointDailyMeanC / 4), miss(a.tempDailyMeanC), c(f.tempAdjChangeC / 5) * c(a.tempDailyMeanC / 4),
    c((f.turnDeg * hemisphere) / 90) * c(Math.min(f.speedBeforeMs, f.speedAfterMs) / 5),
    summer * c(f.tempAdjChangeC / 5), summer * c(f.recoveryFraction, 1.5), summer * c(a.tempDailyMeanC / 4),
    (f.convectiveNear ? 1 : 0) * c(f.tempAdjChangeC / 5), (f.solarHour >= 9.5 && f.solarHour <= 18.5 ? 1 : 0) * c(f.tempAdjChangeC / 5),
  ];
  return Float64Array.from(x);
}

/** Class probabilities (softmax of the linear scores), in the order of `params.classes`. */
export function predictProbabilities(x: ArrayLike<number>, params: ModelParams): Float64Array {
  const k = params.weights.length;
  const z = new Float64Array(k);
  let max = -Infinity;
  for (let q = 0; q < k; q++) {
    const w = params.weights[q]!;
    let v = w[x.length]!;
    for (let j = 0; j < x.length; j++) v += w[j]! * x[j]!;
    z[q] = v;
    if (v > max) max = v;
  }
  let sum = 0;
  for (let q = 0; q < k; q++) sum += z[q] = Math.exp(z[q]! - max);
  for (let q = 0; q < k; q++) z[q]! /= sum;
  return z;
}

/**
 * Fit softmax regression with an L2 penalty (not on the intercept) by full-batch Adam (Kingma & Ba
 * 2015) from zero weights: deterministic for the same data. `sampleWeight` scales each example's loss.
 */
export function fitSoftmax(
  X: readonly Float64Array[],
  y: readonly number[],
  nClasses: number,
  opts: { l2?: number; iterations?: number; learningRate?: number; sampleWeight?: readonly number[] } = {},
): number[][] {
  const l2 = opts.l2 ?? 1e-3;
  const iters = opts.iterations ?? 600;
  const lr = opts.learningRate ?? 0.05;
  const n = X.length;
  const d = X[0]!.length + 1;
  const W = Array.from({ length: nClasses }, () => new Float64Array(d));
  const m = Array.from({ length: nClasses }, () => new Float64Array(d));
  const v = Array.from({ length: nClasses }, () => new Float64Array(d));
  const grad = Array.from({ length: nClasses }, () => new Float64Array(d));
  const p = new Float64Array(nClasses);
  const sw = opts.sampleWeight;
  const totalW = sw ? sw.reduce((a, b) => a + b, 0) : n;
  for (let it = 1; it <= iters; it++) {
    for (const g of grad) g.fill(0);
    for (let i = 0; i < n; i++) {
      const x = X[i]!;
      let max = -Infinity;
      for (let q = 0; q < nClasses; q++) {
        const w = W[q]!;
        let z = w[d - 1]!;
        for (let j = 0; j < d - 1; j++) z += w[j]! * x[j]!;
        p[q] = z;
        if (z > max) max = z;
      }
      let sum = 0;
      for (let q = 0; q < nClasses; q++) sum += p[q] = Math.exp(p[q]! - max);
      const wi = sw ? sw[i]! : 1;
      for (let q = 0; q < nClasses; q++) {
        const r = wi * (p[q]! / sum - (y[i] === q ? 1 : 0));
        const g = grad[q]!;
        for (let j = 0; j < d - 1; j++) g[j]! += r * x[j]!;
        g[d - 1]! += r;
      }
    }
    for (let q = 0; q < nClasses; q++) {
      const g = grad[q]!, w = W[q]!, mq = m[q]!, vq = v[q]!;
      for (let j = 0; j < d; j++) {
        const gj = g[j]! / totalW + (j < d - 1 ? l2 * w[j]! : 0);
        mq[j] = 0.9 * mq[j]! + 0.1 * gj;
        vq[j] = 0.999 * vq[j]! + 0.001 * gj * gj;
        const mh = mq[j]! / (1 - 0.9 ** it);
        const vh = vq[j]! / (1 - 0.999 ** it);
        w[j]! -= (lr * mh) / (Math.sqrt(vh) + 1e-8);
      }
    }
  }
  return W.map((w) => Array.from(w, (x) => Math.round(x * 1e6) / 1e6));
}

/**
 * The model's decision for one candidate, with the hand classification's evidence kept truthful:
 * the kind is the most probable boundary class when its probability reaches MIN_CLASS_PROBABILITY, and
 * the confidence its calibrated value; otherwise `none`, which becomes an unclassified wind shift when the FMH-1-style
 * shift score holds, and is dropped (confidence 0) otherwise. Kinds the real set has too few cases of
 * to fit (occluded fronts, drylines) keep their hand signature, gated by the model's belief that a
 * boundary passed and, for drylines, by the absence of a lasting cooling or drying (a dew-point crash
 * followed by cold or lastingly dry air is a front's leading edge, not a dryline). A hand dryline that
 * fails the gate falls to the model's kind.
 */
export function decideKind(x: ArrayLike<number>, a: AirMassChange, h: Classification, params: ModelParams, f?: Features): Classification {
  const p = predictProbabilities(x, params);
  const probOf = (k: string) => {
    const q = params.classes.indexOf(k);
    return q >= 0 ? p[q]! : 0;
  };
  // The most probable boundary class (the candidates are many and most are nothing: "none" is left out of
  // the argmax and judged through the class probability and its calibration instead).
  let best = 1;
  for (let q = 2; q < p.length; q++) if (p[q]! > p[best]!) best = q;
  const pNone = probOf('none');
  let kind = p[best]! >= MIN_CLASS_PROBABILITY ? (params.classes[best] as string) : 'none';
  let confidence = kind === 'none' ? 0 : calibrate(p[best]!, params.calibration?.[kind]);
  const evidence = h.evidence.slice();
  // Behind a dryline the air is dry but not colder (Schaefer1986): a dew-point crash followed by a lasting
  // fall of temperature, or of the 24-h mean temperature, is a cold front's leading edge.
  const lastingCold = a.tempDayC < -2 || a.tempAdjLastingC < -2 || a.tempDailyMeanC < -1.5;
  // A dryline leaves dry air behind it (Schaefer1986: a sharp moisture boundary between moist air and
  // dry continental air, from memory) with moist air ahead (a dew point of 10 °C or more) and the temperature
  // level or rising; a dew-point fall that leaves
  // the air still moist (above 5 °C; common practice, no source) is a front's drying, which the model judges.
  const dryBehind = f !== undefined && f.dewpointBeforeC >= 10 && f.dewpointBeforeC + f.dewpointDropMaxC <= 5 && f.tempChangeC >= -1;
  // A dryline retreats in the evening as the moist air flows back (Schaefer1986, from memory), so 6–12 h
  // after it the dew point is back near the same hours a day earlier; 8 °C drier then is a new, dry air
  // mass, and the dew-point crash was a cold front's leading edge. common practice, no source, for the 8 °C.
  const newAirMass = a.dewpointDayC < -8;
  if (h.kind === 'dryline' && h.scores.dryline >= 0.4 && dryBehind && !newAirMass && pNone < 0.9) {
    kind = 'dryline';
    confidence = calibrate(Math.min(h.scores.dryline, 1 - 0.5 * pNone), params.calibration?.dryline);
  } else if (h.kind === 'occluded-front' && h.scores['occluded-front'] >= 0.4 && !(Math.abs(a.tempDayC) >= 2) && !(Math.abs(a.tempDailyMeanC) >= 2)) {
    // A wind shift and trough without a lasting change of air mass: the model has too few occlusions to
    // know them; the signature decides, weighed by the model's belief that something passed.
    kind = 'occluded-front';
    confidence = calibrate(Math.min(h.scores['occluded-front'], 1 - 0.5 * pNone), params.calibration?.['occluded-front']);
  } else if (kind === 'cold-front' && h.kind === 'outflow-boundary' && (h.scores['outflow-boundary'] >= 0.5 || (h.scores['outflow-boundary'] >= 0.4 && !lastingCold))) {
    // An abrupt cooling with the outflow's signature (jump, gusts, recovery or the wind going back) is an
    // outflow boundary (Wakimoto1982), however much it looks like a front's leading edge; a weaker
    // signature counts when no lasting change of air mass follows (a squall line ahead of a front is
    // an outflow, and the front behind it its own passage).
    kind = 'outflow-boundary';
    const signature = Math.min(h.scores['outflow-boundary'], 1 - 0.5 * pNone);
    confidence = Math.max(calibrate(Math.min(1, probOf('cold-front') + probOf('outflow-boundary')), params.calibration?.['outflow-boundary']), signature);
  } else if (kind === 'none') {
    if (h.scores['wind-shift'] >= 0.35) {
      kind = 'wind-shift';
      confidence = calibrate(Math.min(h.scores['wind-shift'], 1 - Math.max(...Array.from(p).slice(1))), params.calibration?.['wind-shift']);
    } else confidence = 0;
  }
  // A storm's outflow leaves rain-cooled but moist air that is gone within hours (Wakimoto1982); a passage that
  // leaves a colder and drier air mass half a day later than the same hours the day before is a front that
  // arrived with, or under, the storm. common practice, no source, for the 3 °C and 2 °C.
  if (kind === 'outflow-boundary' && a.tempDayC <= -3 && a.dewpointDayC <= -2) {
    kind = 'cold-front';
    confidence = calibrate(Math.min(1, probOf('cold-front') + probOf('outflow-boundary')), params.calibration?.['cold-front']);
    evidence.push(ARRIVED_WITH_STORM);
  }
  if (!Number.isNaN(a.tempDayC)) {
    const f1 = (v: number) => v.toFixed(1);
    const lasting = kind === 'cold-front' ? a.tempDayC < -1 || a.dewpointDayC < -2 : kind === 'warm-front' ? a.tempDayC > 1 || a.dewpointDayC > 1 : Math.abs(a.tempDayC) < 2;
    evidence.push(`${lasting ? '+' : '−'} 6–12 h later the air is ${f1(a.tempDayC)} °C, dew point ${f1(a.dewpointDayC)} °C against the same hours a day earlier`);
  }
  evidence.push(`model: ${params.classes.map((k, q) => `${k} ${p[q]!.toFixed(2)}`).join(', ')}`);
  return { kind: kind as Classification['kind'], confidence, evidence, scores: h.scores };
}
