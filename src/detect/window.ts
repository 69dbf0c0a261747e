/** Small window statistics over grid arrays (indices clamped; NaN ignored). */

/** Mean of finite values in [lo, hi) (clamped); NaN when fewer than `minCount` (default 1). */
export function meanIn(v: ArrayLike<number>, lo: number, hi: number, minCount = 1): number {
  lo = Math.max(0, Math.floor(lo));
  hi = Math.min(v.length, Math.ceil(hi));
  let s = 0;
  let k = 0;
  for (let i = lo; i < hi; i++) {
    const x = v[i]!;
    if (x === x) {
      s += x;
      k++;
    }
  }
  return k >= minCount && k > 0 ? s / k : NaN;
}

/** Index of the minimum (or maximum with sign −1) finite value in [lo, hi); −1 when none. */
export function argExtremeIn(v: ArrayLike<number>, lo: number, hi: number, sign = 1): number {
  lo = Math.max(0, Math.floor(lo));
  hi = Math.min(v.length, Math.ceil(hi));
  let best = -1;
  let bv = Infinity;
  for (let i = lo; i < hi; i++) {
    const x = v[i]! * sign;
    if (x === x && x < bv) {
      bv = x;
      best = i;
    }
  }
  return best;
}

/** Centred running mean over `half` samples each side (NaN ignored; NaN where the window is empty). */
export function runningMean(v: ArrayLike<number>, half: number): Float64Array {
  const n = v.length;
  const out = new Float64Array(n);
  const cs = new Float64Array(n + 1);
  const ck = new Float64Array(n + 1);
  for (let i = 0; i < n; i++) {
    const x = v[i]!;
    const ok = x === x;
    cs[i + 1] = cs[i]! + (ok ? x : 0);
    ck[i + 1] = ck[i]! + (ok ? 1 : 0);
  }
  for (let i = 0; i < n; i++) {
    const a = Math.max(0, i - half);
    const b = Math.min(n, i + half + 1);
    const k = ck[b]! - ck[a]!;
    out[i] = k ? (cs[b]! - cs[a]!) / k : NaN;
  }
  return out;
}

/** Value at index i, or NaN outside the array. */
export function at(v: ArrayLike<number>, i: number): number {
  return i >= 0 && i < v.length ? v[Math.round(i)]! : NaN;
}
