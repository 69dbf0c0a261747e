/**
 * PELT: exact optimal partitioning of a series into segments, with inequality pruning.
 *
 * Minimises Σ_segments [C(segment)] + m·β over all segmentations (m = number of change points) by the
 * recursion F(t) = min_{τ<t} [F(τ) + C(y_{τ+1:t}) + β], F(0) = −β, pruning a candidate τ for ever once
 * F(τ) + C(y_{τ+1:t}) + K > F(t) [Killick2012] (the PELT pruning condition). K = 0 is valid for every cost
 * here (each is a negative log-likelihood maximised over its segment parameters, so splitting a segment
 * never raises its cost; the MBIC length term is also superadditive, see below).
 *
 * Costs (all on the −2·log-likelihood scale, constants dropped; σ is the noise standard deviation):
 * - `mean`    normal, change in mean, known variance: C = Σ(y − ȳ)² / σ².
 * - `meanvar` normal, change in mean and variance: C = m·ln(σ̂²_seg/σ² + f), σ̂²_seg = Σ(y − ȳ)²/m,
 *             with a floor f (default 0.01, i.e. a segment is never treated as more than 10× quieter than
 *             the series noise — common practice, no source; it keeps whole-degree METAR runs of identical
 *             values from having zero variance). Adding f inside the logarithm keeps C superadditive
 *             (Jensen), so pruning stays exact.
 * - `linear`  normal, piecewise-linear trend (change in level and slope, continuity not required):
 *             C = Σ(y − a − b·x)² / σ² with x the sample index — for pressure kinks (the V of a trough).
 *
 * Penalties (β per change point; p = parameters per segment per channel: mean 1, meanvar 2, linear 2;
 * d = channels; n = number of valid samples):
 * - `bic`   β = (p·d + 1)·ln n [Schwarz1978; the location counts as one parameter]. For one channel and
 *           `mean` this is 2 ln n.
 * - `mbic`  (default) β = (p·d + 2)·ln n plus a length term p·d·ln(n_j/n) added to each segment's cost.
 *           For one channel and `mean` this is 3·ln n + Σ ln(n_j/n), the −2× scale of the modified BIC of
 *           [ZhangSiegmund2007] (penalty (3/2)k·ln n + ½Σ ln(l_i/n) on the log-likelihood scale); the
 *           extension to p·d > 1 is ours. ln(a/n) + ln(b/n) ≤ ln((a+b)/n) for a, b ≤ n, so K = 0 holds.
 * - a number: β itself, no length term.
 *
 * NaN rule: a sample is missing when any channel is NaN; missing samples are skipped (the series is
 * compressed to its valid samples, costs and penalties count valid samples only, the linear cost uses
 * the true sample index as x). A change found after a gap is reported at the first valid sample after
 * the gap; the gap shows as `segments[k].end < segments[k+1].start`.
 *
 * Speed: each step costs O(d) per surviving candidate, and candidates inside the current segment are never
 * pruned, so the total is about n × (typical segment length): O(n) when changes keep arriving (the
 * linear-cost case of [Killick2012]), tending to O(n²) on long stretches without any change (pure noise).
 * `maxSegment` bounds the work but forces a boundary at least every maxSegment samples; for long quiet
 * records prefer analysing overlapping windows. All sums come from cumulative arrays (Float64Array).
 */
import { robustNoiseSigma } from './noise.js';

export type PeltCost = 'mean' | 'meanvar' | 'linear';
export type PeltPenalty = 'bic' | 'mbic' | number;

export interface PeltOptions {
  /** Segment model (default `mean`). */
  cost?: PeltCost;
  /** `mbic` (default), `bic`, or β per change point on the −2·log-likelihood scale. */
  penalty?: PeltPenalty;
  /** Minimum valid samples per segment (default 2 for `mean`, 3 for `meanvar` and `linear`). */
  minSegment?: number;
  /**
   * Maximum valid samples per segment (default Infinity = exact unconstrained optimum). A finite value
   * bounds the run time but forces a boundary at least this often (spurious ones in quiet stretches).
   */
  maxSegment?: number;
  /** Noise standard deviation, units of the values (default: robustNoiseSigma of the series). */
  sigma?: number;
  /** `meanvar` only: variance floor as a fraction of σ² (default 0.01). */
  varianceFloorFraction?: number;
}

export interface PeltMultiOptions extends Omit<PeltOptions, 'sigma'> {
  /** Noise standard deviation per channel (default: robustNoiseSigma of each channel). */
  sigma?: ArrayLike<number>;
}

/** One fitted segment (indices into the input series). */
export interface PeltSegment {
  /** Index of the first valid sample of the segment. */
  start: number;
  /** One past the index of the last valid sample of the segment. */
  end: number;
  /** Valid samples in the segment. */
  count: number;
  /** Sample mean, units of the values. */
  mean: number;
  /** Least-squares slope per sample index (`linear` cost only; NaN otherwise). */
  slope: number;
  /** Root-mean-square residual about the fitted mean (or line), units of the values. */
  sd: number;
}

export interface PeltResult {
  /** Index of the first sample of each new segment, ascending. */
  changePoints: Int32Array;
  segments: PeltSegment[];
  /** β used per change point. */
  penalty: number;
  /** Minimised penalised cost (standardised units, constants dropped). */
  cost: number;
  /** Noise standard deviation used. */
  sigma: number;
  /** Valid samples analysed. */
  n: number;
}

export interface PeltMultiSegment {
  start: number;
  end: number;
  count: number;
  /** Per channel. */
  mean: Float64Array;
  slope: Float64Array;
  sd: Float64Array;
}

export interface PeltMultiResult {
  changePoints: Int32Array;
  segments: PeltMultiSegment[];
  penalty: number;
  cost: number;
  sigma: Float64Array;
  n: number;
}

const PARAMS_PER_SEGMENT: Record<PeltCost, number> = { mean: 1, meanvar: 2, linear: 2 };

/**
 * Change points of one series by PELT [Killick2012] — see the module comment for costs, penalties
 * and the NaN rule.
 * @example
 * pelt([0, 0, 0, 0, 0, 5, 5, 5, 5, 5], { sigma: 1 }).changePoints // Int32Array [5]
 */
export function pelt(values: ArrayLike<number>, opts: PeltOptions = {}): PeltResult {
  const sigma = opts.sigma === undefined ? undefined : [opts.sigma];
  const r = peltMulti([values], { ...opts, sigma });
  return {
    changePoints: r.changePoints,
    segments: r.segments.map((s) => ({
      start: s.start,
      end: s.end,
      count: s.count,
      mean: s.mean[0]!,
      slope: s.slope[0]!,
      sd: s.sd[0]!,
    })),
    penalty: r.penalty,
    cost: r.cost,
    sigma: r.sigma[0]!,
    n: r.n,
  };
}

/**
 * Change points common to several channels (e.g. wind u and v) by PELT [Killick2012]: the segment cost is
 * the sum of the channels' costs, each channel standardised by its own noise σ, and all channels change
 * together. See the module comment for costs, penalties and the NaN rule (a sample is missing when any
 * channel is NaN).
 * @example
 * peltMulti([uMs, vMs], { penalty: 'mbic' }).changePoints
 */
export function peltMulti(channels: ArrayLike<number>[], opts: PeltMultiOptions = {}): PeltMultiResult {
  const d = channels.length;
  if (d === 0) throw new RangeError('peltMulti requires at least one channel');
  const len = channels[0]!.length;
  for (const ch of channels) if (ch.length !== len) throw new RangeError('peltMulti requires channels of equal length');
  const costKind = opts.cost ?? 'mean';
  if (!(costKind in PARAMS_PER_SEGMENT)) throw new RangeError(`pelt cost must be mean, meanvar or linear, got ${costKind}`);
  const minSeg = opts.minSegment ?? (costKind === 'mean' ? 2 : 3);
  if (!Number.isInteger(minSeg) || minSeg < 1) throw new RangeError('pelt minSegment must be an integer ≥ 1');
  const maxSeg = opts.maxSegment ?? Infinity;
  if (!(maxSeg >= 2 * minSeg)) throw new RangeError('pelt maxSegment must be at least 2·minSegment');
  const floorFrac = opts.varianceFloorFraction ?? 0.01;
  if (!(floorFrac > 0)) throw new RangeError('pelt varianceFloorFraction must be > 0');
  if (opts.sigma !== undefined && opts.sigma.length !== d) throw new RangeError('peltMulti sigma needs one value per channel');

  // Valid samples: every channel finite.
  const idx = new Int32Array(len);
  let n = 0;
  for (let i = 0; i < len; i++) {
    let ok = true;
    for (let c = 0; c < d; c++) if (Number.isNaN(channels[c]![i]!)) ok = false;
    if (ok) idx[n++] = i;
  }

  // Per-channel reference (median) and noise scale; work on standardised values (y − ref)/σ.
  const sigma = new Float64Array(d);
  const ref = new Float64Array(d);
  const scale = new Float64Array(d); // σ actually used (1 when σ is 0 or undefined)
  for (let c = 0; c < d; c++) {
    const ch = channels[c]!;
    const s = opts.sigma !== undefined ? opts.sigma[c]! : robustNoiseSigma(ch);
    if (opts.sigma !== undefined && !(s > 0)) throw new RangeError('pelt sigma must be > 0');
    sigma[c] = s;
    scale[c] = s > 0 ? s : 1;
    const tmp = new Float64Array(n);
    for (let k = 0; k < n; k++) tmp[k] = ch[idx[k]!]!;
    tmp.sort();
    ref[c] = n === 0 ? 0 : tmp[n >> 1]!;
  }

  const linear = costKind === 'linear';
  const meanvar = costKind === 'meanvar';
  // Cumulative sums over valid samples, interleaved by channel: S1[k·d + c] = Σ_{j<k} y_j(c), etc.
  const S1 = new Float64Array((n + 1) * d);
  const S2 = new Float64Array((n + 1) * d);
  const SXY = new Float64Array(linear ? (n + 1) * d : 0);
  const x0 = n > 0 ? idx[0]! : 0;
  for (let c = 0; c < d; c++) {
    const ch = channels[c]!;
    const r = ref[c]!;
    const inv = 1 / scale[c]!;
    let a = 0;
    let b = 0;
    let e = 0;
    for (let k = 0; k < n; k++) {
      const y = (ch[idx[k]!]! - r) * inv;
      a += y;
      b += y * y;
      S1[(k + 1) * d + c] = a;
      S2[(k + 1) * d + c] = b;
      if (linear) {
        e += (idx[k]! - x0) * y;
        SXY[(k + 1) * d + c] = e;
      }
    }
  }
  // Integer positions x relative to the first valid sample: prefix sums are exact integers while
  // Σx² < 2^53 (n up to about 2.5e5).
  const X1 = new Float64Array(linear ? n + 1 : 0);
  const X2 = new Float64Array(linear ? n + 1 : 0);
  if (linear) {
    for (let k = 0; k < n; k++) {
      const x = idx[k]! - x0;
      X1[k + 1] = X1[k]! + x;
      X2[k + 1] = X2[k]! + x * x;
    }
  }

  const p = PARAMS_PER_SEGMENT[costKind] * d;
  const pen = opts.penalty ?? 'mbic';
  const logN = Math.log(Math.max(n, 2));
  let beta: number;
  let lengthCoef = 0;
  if (pen === 'bic') beta = (p + 1) * logN;
  else if (pen === 'mbic') {
    beta = (p + 2) * logN;
    lengthCoef = p;
  } else if (typeof pen === 'number' && pen >= 0 && Number.isFinite(pen)) beta = pen;
  else throw new RangeError('pelt penalty must be bic, mbic or a finite number ≥ 0');
  // Length term per segment length m (MBIC), tabulated.
  const lengthTerm = new Float64Array(n + 1);
  if (lengthCoef !== 0) for (let m = 1; m <= n; m++) lengthTerm[m] = lengthCoef * Math.log(m / n);

  /** Residual sum of squares (standardised) of channel c on compressed segment [a, b). */
  const sse = (c: number, a: number, b: number): number => {
    const m = b - a;
    const s1 = S1[b * d + c]! - S1[a * d + c]!;
    const s2 = S2[b * d + c]! - S2[a * d + c]!;
    let r = s2 - (s1 * s1) / m;
    if (linear && m > 1) {
      const xa = idx[a]! - x0;
      const sx1 = X1[b]! - X1[a]!;
      const sX = sx1 - m * xa;
      const sXX = X2[b]! - X2[a]! - 2 * xa * sx1 + m * xa * xa;
      const cxx = sXX - (sX * sX) / m;
      if (cxx > 0) {
        const sXy = SXY[b * d + c]! - SXY[a * d + c]! - xa * s1;
        const cxy = sXy - (sX * s1) / m;
        r -= (cxy * cxy) / cxx;
      }
    }
    return r > 0 ? r : 0;
  };

  // PELT recursion over compressed positions 0..n (position t = first t valid samples).
  const F = new Float64Array(n + 1).fill(Infinity);
  const last = new Int32Array(n + 1).fill(-1);
  F[0] = -beta;
  const R = new Int32Array(n + 1);
  const vals = new Float64Array(n + 1);
  // killAt[i]: step after which candidate R[i] is dropped (a pruning found at step t takes effect after
  // t + minSeg − 1); kept parallel to R so that both are scanned sequentially.
  const killAt = new Int32Array(n + 1);
  let rn = 0;

  const fastMean = d === 1 && costKind === 'mean';
  for (let T = minSeg; T <= n; T++) {
    const cand = T - minSeg;
    if ((cand === 0 || cand >= minSeg) && F[cand]! < Infinity) {
      killAt[rn] = 0x7fffffff;
      R[rn++] = cand;
    }
    // F(τ) + C(τ, T) for every candidate; one tight loop per cost model.
    let best = Infinity;
    let arg = -1;
    if (fastMean) {
      const a1 = S1[T]!;
      const a2 = S2[T]!;
      for (let i = 0; i < rn; i++) {
        const tau = R[i]!;
        const m = T - tau;
        const s1 = a1 - S1[tau]!;
        let r = a2 - S2[tau]! - (s1 * s1) / m;
        if (r < 0) r = 0;
        const v = F[tau]! + r + lengthTerm[m]!;
        vals[i] = v;
        if (v < best) {
          best = v;
          arg = tau;
        }
      }
    } else {
      for (let i = 0; i < rn; i++) {
        const tau = R[i]!;
        const m = T - tau;
        let v = F[tau]! + lengthTerm[m]!;
        if (meanvar) {
          for (let c = 0; c < d; c++) {
            const s1 = S1[T * d + c]! - S1[tau * d + c]!;
            let r = S2[T * d + c]! - S2[tau * d + c]! - (s1 * s1) / m;
            if (r < 0) r = 0;
            v += m * Math.log(r / m + floorFrac);
          }
        } else if (linear) {
          for (let c = 0; c < d; c++) v += sse(c, tau, T);
        } else {
          for (let c = 0; c < d; c++) {
            const s1 = S1[T * d + c]! - S1[tau * d + c]!;
            const r = S2[T * d + c]! - S2[tau * d + c]! - (s1 * s1) / m;
            if (r > 0) v += r;
          }
        }
        vals[i] = v;
        if (v < best) {
          best = v;
          arg = tau;
        }
      }
    }
    if (arg < 0) continue;
    const FT = best + beta;
    F[T] = FT;
    last[T] = arg;
    // Prune [Killick2012]: if F(τ) + C(τ, T) > F(T), τ can never be the optimal last change
    // for any end T' at which T itself is a legal last change, i.e. T' ≥ T + minSeg; so τ is dropped
    // after step T + minSeg − 1. (With minSeg = 1 this is the textbook rule.)
    const kill = T + minSeg - 1;
    let w = 0;
    for (let i = 0; i < rn; i++) {
      const tau = R[i]!;
      let k = killAt[i]!;
      if (vals[i]! > FT && k > kill) k = kill;
      if (k <= T || T + 1 - tau > maxSeg) continue;
      killAt[w] = k;
      R[w++] = tau;
    }
    rn = w;
  }

  // Backtrack.
  const cpsC: number[] = [];
  if (n > 0 && last[n]! >= 0) {
    let t = n;
    while (t > 0) {
      const tau = last[t]!;
      if (tau > 0) cpsC.push(tau);
      t = tau;
    }
    cpsC.reverse();
  }
  const bounds = n > 0 ? [0, ...cpsC, n] : [];
  const segments: PeltMultiSegment[] = [];
  for (let k = 0; k + 1 < bounds.length; k++) {
    const a = bounds[k]!;
    const b = bounds[k + 1]!;
    const m = b - a;
    const mean = new Float64Array(d);
    const slope = new Float64Array(d).fill(NaN);
    const sd = new Float64Array(d);
    for (let c = 0; c < d; c++) {
      const s1 = S1[b * d + c]! - S1[a * d + c]!;
      mean[c] = (s1 / m) * scale[c]! + ref[c]!;
      sd[c] = Math.sqrt(sse(c, a, b) / m) * scale[c]!;
      if (linear) {
        const xa = idx[a]! - x0;
        const sx1 = X1[b]! - X1[a]!;
        const sX = sx1 - m * xa;
        const cxx = X2[b]! - X2[a]! - 2 * xa * sx1 + m * xa * xa - (sX * sX) / m;
        const cxy = SXY[b * d + c]! - SXY[a * d + c]! - xa * s1 - (sX * s1) / m;
        slope[c] = cxx > 0 ? (cxy / cxx) * scale[c]! : NaN;
      }
    }
    segments.push({ start: idx[a]!, end: idx[b - 1]! + 1, count: m, mean, slope, sd });
  }
  return {
    changePoints: Int32Array.from(cpsC, (c) => idx[c]!),
    segments,
    penalty: beta,
    cost: n > 0 ? F[n]! : 0,
    sigma,
    n,
  };
}
