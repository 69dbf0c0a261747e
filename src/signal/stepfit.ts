/**
 * Local step statistics for timing a change precisely around a candidate passage: the mean difference
 * across a given index (`stepFit`), the best single split in a window (`bestStepIn`, least-squares /
 * standardised CUSUM, [Page1954] flavour) and the rank-based Pettitt statistic (`pettittTest`,
 * [Pettitt1979]).
 */
import { robustNoiseSigma } from './noise.js';

export interface StepFit {
  /** First index of the "after" window. */
  index: number;
  /** Means of the valid samples before and after, units of the values. */
  meanBefore: number;
  meanAfter: number;
  /** meanAfter − meanBefore. */
  change: number;
  /** Valid samples used on each side. */
  countBefore: number;
  countAfter: number;
  /** Noise standard deviation used. */
  sigma: number;
  /** change / (σ·√(1/nBefore + 1/nAfter)); NaN when a side is empty or σ is not positive. */
  t: number;
}

/**
 * Difference of means across index i: after = values[i … i+windowAfter−1], before =
 * values[i−windowBefore … i−1], with a t-like statistic change/(σ√(1/n₁ + 1/n₂)) (two-sample z test with
 * known σ; textbook). σ defaults to robustNoiseSigma over the two windows together (noise.ts).
 * NaN rule: NaN samples inside the windows are skipped; windows are clipped to the series.
 * @example stepFit([0, 0, 0, 1, 1, 1], 3, 3, 3, 0.5).change // 1 (t = 1/(0.5·√(2/3)) ≈ 2.449)
 */
export function stepFit(
  values: ArrayLike<number>,
  i: number,
  windowBefore: number,
  windowAfter: number,
  sigma?: number,
): StepFit {
  if (!Number.isInteger(i) || !Number.isInteger(windowBefore) || !Number.isInteger(windowAfter))
    throw new TypeError('stepFit requires integer index and windows');
  if (windowBefore < 1 || windowAfter < 1) throw new RangeError('stepFit windows must be ≥ 1');
  const lo = Math.max(0, i - windowBefore);
  const hi = Math.min(values.length, i + windowAfter);
  let sb = 0;
  let nb = 0;
  for (let k = lo; k < Math.min(i, values.length); k++) {
    const v = values[k]!;
    if (!Number.isNaN(v)) {
      sb += v;
      nb++;
    }
  }
  let sa = 0;
  let na = 0;
  for (let k = Math.max(i, 0); k < hi; k++) {
    const v = values[k]!;
    if (!Number.isNaN(v)) {
      sa += v;
      na++;
    }
  }
  const s = sigma ?? localSigma(values, lo, i, hi);
  const meanBefore = nb > 0 ? sb / nb : NaN;
  const meanAfter = na > 0 ? sa / na : NaN;
  const change = meanAfter - meanBefore;
  const t = nb > 0 && na > 0 && s > 0 ? change / (s * Math.sqrt(1 / nb + 1 / na)) : NaN;
  return { index: i, meanBefore, meanAfter, change, countBefore: nb, countAfter: na, sigma: s, t };
}

/** Noise σ from the windows before and after i separately (so the step itself is not a difference). */
function localSigma(values: ArrayLike<number>, lo: number, i: number, hi: number): number {
  const before = robustNoiseSigma(values, lo, i);
  const after = robustNoiseSigma(values, i, hi);
  if (Number.isNaN(before)) return after;
  if (Number.isNaN(after)) return before;
  return Math.sqrt(0.5 * (before * before + after * after));
}

export interface BestStep {
  /** First index of the new level (the sample after the split); −1 when no split was possible. */
  index: number;
  /** Mean after − mean before, units of the values. */
  size: number;
  meanBefore: number;
  meanAfter: number;
  /** max_k |Z_k|, Z_k = (mean after − mean before)/(σ√(1/n₁ + 1/n₂)). */
  score: number;
  /** Noise standard deviation used. */
  sigma: number;
}

/**
 * Best single mean split in values[lo … hi−1]: the k maximising the standardised two-sample statistic
 * |Z_k| = |x̄_after − x̄_before| / (σ√(1/n₁ + 1/n₂)), which equals |S_k|/(σ√(n₁n₂/n)) with S_k the cumulative
 * sum of deviations from the window mean — the least-squares (Gaussian likelihood-ratio) split, the
 * CUSUM statistic of [Page1954] in its retrospective two-sided form. Each side keeps at least `minSeg`
 * valid samples. σ defaults to robustNoiseSigma of the window (noise.ts); the location does not depend on σ.
 * NaN rule: NaN samples are skipped (they count on neither side); the reported index is a valid sample.
 * @example bestStepIn([0, 0, 0, 0, 3, 3, 3], 0, 7, 1).index // 4
 */
export function bestStepIn(values: ArrayLike<number>, lo: number, hi: number, minSeg = 1, sigma?: number): BestStep {
  if (!Number.isInteger(minSeg) || minSeg < 1) throw new RangeError('bestStepIn minSeg must be an integer ≥ 1');
  lo = Math.max(0, Math.floor(lo));
  hi = Math.min(values.length, Math.floor(hi));
  let total = 0;
  let n = 0;
  for (let k = lo; k < hi; k++) {
    const v = values[k]!;
    if (!Number.isNaN(v)) {
      total += v;
      n++;
    }
  }
  const s = sigma ?? robustNoiseSigma(values, lo, hi);
  const none: BestStep = { index: -1, size: NaN, meanBefore: NaN, meanAfter: NaN, score: NaN, sigma: s };
  if (n < 2 * minSeg) return none;
  const mean = total / n;
  let cusum = 0; // Σ (x − mean) over the valid samples before k
  let nb = 0;
  let sumB = 0;
  let bestStat = -1;
  let bestK = -1;
  let bestNb = 0;
  let bestSumB = 0;
  for (let k = lo; k < hi; k++) {
    const v = values[k]!;
    if (Number.isNaN(v)) continue;
    // Split before k: n₁ = nb valid samples before.
    if (nb >= minSeg && n - nb >= minSeg) {
      const stat = Math.abs(cusum) / Math.sqrt((nb * (n - nb)) / n);
      if (stat > bestStat) {
        bestStat = stat;
        bestK = k;
        bestNb = nb;
        bestSumB = sumB;
      }
    }
    cusum += v - mean;
    sumB += v;
    nb++;
  }
  if (bestK < 0) return none;
  const meanBefore = bestSumB / bestNb;
  const meanAfter = (total - bestSumB) / (n - bestNb);
  const score = s > 0 ? bestStat / s : NaN;
  return { index: bestK, size: meanAfter - meanBefore, meanBefore, meanAfter, score, sigma: s };
}

export interface PettittResult {
  /** First index of the new segment (the published "change at t" is the last index of the old one, 1-based, = index). */
  index: number;
  /** K = max |U_t|. */
  statistic: number;
  /** U_t at the maximum (negative when the later values are larger). */
  u: number;
  /** Approximate two-sided significance p ≈ 2·exp(−6K²/(T³ + T²)), good for p ≤ 0.5 [Pettitt1979]. */
  p: number;
}

/**
 * Pettitt's non-parametric change-point test on values[lo … hi−1] [Pettitt1979]:
 * U_t = Σ_{i≤t} Σ_{j>t} sgn(x_i − x_j), K = max_t |U_t|, p ≈ 2 exp(−6K²/(T³ + T²)). O(T²); meant for
 * windows of up to a few hundred samples. NaN rule: NaN samples are dropped before ranking (T counts
 * valid samples); the index refers to the original series.
 * @example pettittTest(pagesData).statistic // 232 (Pettitt 1979 Table 1 data, change after t = 17)
 */
export function pettittTest(values: ArrayLike<number>, lo = 0, hi = values.length): PettittResult {
  lo = Math.max(0, lo);
  hi = Math.min(values.length, hi);
  const pos: number[] = [];
  for (let k = lo; k < hi; k++) if (!Number.isNaN(values[k]!)) pos.push(k);
  const T = pos.length;
  if (T < 2) return { index: -1, statistic: NaN, u: NaN, p: NaN };
  // U_t = U_{t−1} + Σ_j sgn(x_t − x_j) (the textbook recursion).
  let u = 0;
  let bestAbs = -1;
  let bestU = 0;
  let bestT = -1;
  for (let t = 0; t < T - 1; t++) {
    const xt = values[pos[t]!]!;
    let s = 0;
    for (let j = 0; j < T; j++) s += Math.sign(xt - values[pos[j]!]!);
    u += s;
    if (Math.abs(u) > bestAbs) {
      bestAbs = Math.abs(u);
      bestU = u;
      bestT = t;
    }
  }
  const K = bestAbs;
  const p = Math.min(1, 2 * Math.exp((-6 * K * K) / (T * T * T + T * T)));
  return { index: pos[bestT + 1]!, statistic: K, u: bestU, p };
}
