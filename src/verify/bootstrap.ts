/**
 * Seeded bootstrap confidence intervals for verification scores (pure, deterministic).
 *
 * The percentile interval of the nonparametric bootstrap (Efron & Tibshirani 1993, An Introduction to
 * the Bootstrap, ch. 13; Wilks 2011 sec. 5.3.5; section numbers from memory): resample the n units with
 * replacement B times, recompute the statistic, take the α/2 and 1 − α/2 quantiles of the replicates
 * (Hyndman & Fan 1996 type 7). The units here are verified passages (hits, misses, false alarms), so
 * contingency scores and timing errors are resampled together.
 */
import { quantile } from './quantile.js';

/**
 * Deterministic PRNG in [0, 1): mulberry32 (a public-domain 32-bit generator; common practice, no
 * published source). Same seed, same sequence on every platform.
 * @example const r = mulberry32(1); r() === mulberry32(1)() // true
 */
export function mulberry32(seed: number): () => number {
  let a = seed >>> 0;
  return () => {
    a = (a + 0x6d2b79f5) >>> 0;
    let t = a;
    t = Math.imul(t ^ (t >>> 15), t | 1);
    t ^= t + Math.imul(t ^ (t >>> 7), t | 61);
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296;
  };
}

export interface BootstrapOptions {
  /** Replicates B (default 1000). */
  resamples?: number;
  /** Seed of the generator (default 1). */
  seed?: number;
  /** Coverage 1 − α (default 0.95). */
  level?: number;
}

/** A confidence interval [lo, hi]; NaN ends when the statistic is undefined in too many replicates. */
export interface Interval {
  lo: number;
  hi: number;
}

/**
 * Percentile bootstrap intervals of several statistics of the same units, from one set of resamples
 * (Efron & Tibshirani 1993 ch. 13). `statistics` maps a sample to the named values, once per replicate. Replicates where a statistic is NaN (e.g. POD without observed
 * passages) are left out for that statistic; if more than half are NaN its interval is NaN.
 * @example bootstrapIntervals([1, 2, 3, 4], ['mean'], (xs) => ({ mean: xs.reduce((s, x) => s + x, 0) / xs.length })).mean // ≈ { lo: 1.75, hi: 3.25 }
 */
export function bootstrapIntervals<T, K extends string>(
  units: readonly T[],
  keys: readonly K[],
  statistics: (sample: readonly T[]) => Record<K, number>,
  opts: BootstrapOptions = {},
): Record<K, Interval> {
  const B = opts.resamples ?? 1000;
  const level = opts.level ?? 0.95;
  if (!(Number.isInteger(B) && B >= 1)) throw new RangeError('bootstrap resamples must be an integer >= 1');
  if (!(level > 0 && level < 1)) throw new RangeError('bootstrap level must lie in (0, 1)');
  const reps = new Map<K, number[]>(keys.map((k) => [k, []]));
  const n = units.length;
  const out = {} as Record<K, Interval>;
  if (n === 0) {
    for (const k of keys) out[k] = { lo: NaN, hi: NaN };
    return out;
  }
  const rnd = mulberry32(opts.seed ?? 1);
  const sample: T[] = new Array(n);
  for (let b = 0; b < B; b++) {
    for (let i = 0; i < n; i++) sample[i] = units[Math.floor(rnd() * n)]!;
    const v = statistics(sample);
    for (const k of keys) reps.get(k)!.push(v[k]);
  }
  const a = (1 - level) / 2;
  for (const k of keys) {
    const r = reps.get(k)!.filter((x) => !Number.isNaN(x));
    out[k] = r.length * 2 < B ? { lo: NaN, hi: NaN } : { lo: quantile(r, a), hi: quantile(r, 1 - a) };
  }
  return out;
}
