/**
 * Contingency-table verification of discrete events (pure functions): the scores are used by `fropa
 * verify` and the skill benchmark; the greedy matchOneToOne only by the benchmarks (verify matches
 * optimally, assignment.ts). Scores after Wilks (2011), Statistical Methods in the Atmospheric Sciences, 3rd ed.,
 * ch. 8, the 2×2 contingency table (a hits, b false alarms, c misses, d correct negatives):
 * POD (hit rate) = a/(a + c); FAR (false-alarm ratio) = b/(a + b); CSI (threat score) = a/(a + b + c);
 * frequency bias = (a + b)/(a + c). Empty denominators give NaN.
 */

export interface Contingency {
  /** a: events forecast (detected) and observed (planted). */
  hits: number;
  /** b: detected, not observed. */
  falseAlarms: number;
  /** c: observed, not detected. */
  misses: number;
  /** d: neither (not defined for event matching; NaN when unknown). */
  correctNegatives?: number;
}

const ratio = (num: number, den: number) => (den > 0 ? num / den : NaN);

/** Probability of detection a/(a+c), Wilks 2011 ch. 8. @example pod({ hits: 28, falseAlarms: 72, misses: 23 }) // ≈ 0.549 */
export function pod(c: Contingency): number {
  return ratio(c.hits, c.hits + c.misses);
}

/** False-alarm ratio b/(a+b), Wilks 2011 ch. 8. @example far({ hits: 28, falseAlarms: 72, misses: 23 }) // 0.72 */
export function far(c: Contingency): number {
  return ratio(c.falseAlarms, c.hits + c.falseAlarms);
}

/** Critical success index (threat score) a/(a+b+c), Wilks 2011 ch. 8. @example csi({ hits: 28, falseAlarms: 72, misses: 23 }) // ≈ 0.228 */
export function csi(c: Contingency): number {
  return ratio(c.hits, c.hits + c.falseAlarms + c.misses);
}

/** Frequency bias (a+b)/(a+c), Wilks 2011 ch. 8. @example frequencyBias({ hits: 28, falseAlarms: 72, misses: 23 }) // ≈ 1.96 */
export function frequencyBias(c: Contingency): number {
  return ratio(c.hits + c.falseAlarms, c.hits + c.misses);
}

/** Proportion correct (a+d)/n, Wilks 2011 ch. 8; NaN without d. */
export function proportionCorrect(c: Contingency): number {
  const d = c.correctNegatives ?? NaN;
  return ratio(c.hits + d, c.hits + c.falseAlarms + c.misses + d);
}

export interface Timed {
  station: string;
  timeMs: number;
}

export interface MatchResult {
  /** Pairs [truth index, detection index], nearest first. */
  pairs: [number, number][];
  unmatchedTruth: number[];
  unmatchedDetections: number[];
}

/**
 * One-to-one matching of truth (observed events) and detections (or forecasts) at the same station
 * within ±windowMs (inclusive: |Δt| = windowMs matches), nearest pairs first (greedy on |Δt|, ties by
 * truth then detection order). Deterministic. The pairs are the hits a, unmatched truth the misses c and
 * unmatched detections the false alarms b of the Wilks (2011) ch. 8 table. Greedy nearest-first
 * matching is common practice, no source; it is not an optimal assignment (a globally optimal
 * assignment could pair differently when windows overlap).
 * @example matchOneToOne([{station:'A',timeMs:0}], [{station:'A',timeMs:600000}], 3*3600000).pairs // [[0, 0]]
 */
export function matchOneToOne(truth: readonly Timed[], detections: readonly Timed[], windowMs: number): MatchResult {
  if (!(windowMs >= 0)) throw new RangeError('matchOneToOne requires windowMs >= 0');
  const byStation = new Map<string, number[]>();
  detections.forEach((d, j) => {
    let a = byStation.get(d.station);
    if (!a) byStation.set(d.station, (a = []));
    a.push(j);
  });
  const cands: [number, number, number][] = [];
  truth.forEach((t, i) => {
    for (const j of byStation.get(t.station) ?? []) {
      const dt = Math.abs(detections[j]!.timeMs - t.timeMs);
      if (dt <= windowMs) cands.push([dt, i, j]);
    }
  });
  cands.sort((x, y) => x[0] - y[0] || x[1] - y[1] || x[2] - y[2]);
  const usedT = new Uint8Array(truth.length);
  const usedD = new Uint8Array(detections.length);
  const pairs: [number, number][] = [];
  for (const [, i, j] of cands) {
    if (usedT[i] || usedD[j]) continue;
    usedT[i] = 1;
    usedD[j] = 1;
    pairs.push([i, j]);
  }
  const unmatchedTruth: number[] = [];
  const unmatchedDetections: number[] = [];
  usedT.forEach((u, i) => u || unmatchedTruth.push(i));
  usedD.forEach((u, j) => u || unmatchedDetections.push(j));
  return { pairs, unmatchedTruth, unmatchedDetections };
}

/** Kind-specific contingency from a kind-agnostic matching: a hit needs the same kind on both sides. */
export function contingencyForKind(truthKinds: readonly string[], detKinds: readonly string[], m: MatchResult, kind: string): Contingency {
  let hits = 0;
  const hitT = new Set<number>();
  const hitD = new Set<number>();
  for (const [i, j] of m.pairs) {
    if (truthKinds[i] === kind && detKinds[j] === kind) {
      hits++;
      hitT.add(i);
      hitD.add(j);
    }
  }
  let misses = 0;
  truthKinds.forEach((k, i) => k === kind && !hitT.has(i) && misses++);
  let falseAlarms = 0;
  detKinds.forEach((k, j) => k === kind && !hitD.has(j) && falseAlarms++);
  return { hits, misses, falseAlarms };
}
