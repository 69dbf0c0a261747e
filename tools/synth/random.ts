/**
 * Small seeded pseudo-random generator for synthetic data (not for cryptography).
 * mulberry32: a 32-bit generator by Tommy Ettinger (public domain, 2017); period 2^32.
 */

/** A seeded random stream. All draws are deterministic for a given seed. */
export interface Rng {
  /** Uniform in [0, 1). */
  next(): number;
  /** Uniform in [lo, hi). */
  uniform(lo: number, hi: number): number;
  /** Integer uniform in [lo, hi] (both inclusive). */
  int(lo: number, hi: number): number;
  /** Standard normal (Box–Muller), mean 0, sd 1. */
  normal(): number;
  /** True with probability p. */
  chance(p: number): boolean;
  /** One element of a non-empty array. */
  pick<T>(items: readonly T[]): T;
  /** A new independent stream derived from this one and a label. */
  fork(label: string): Rng;
}

/** 32-bit string hash (FNV-1a), used to derive child seeds from labels. */
export function hashString(text: string): number {
  let h = 0x811c9dc5;
  for (let i = 0; i < text.length; i++) {
    h ^= text.charCodeAt(i);
    h = Math.imul(h, 0x01000193) >>> 0;
  }
  return h >>> 0;
}

/**
 * Make a seeded stream (mulberry32).
 * @example const r = makeRng(42); r.next(); // same value on every run
 */
export function makeRng(seed: number): Rng {
  if (!Number.isFinite(seed)) throw new RangeError('makeRng requires a finite seed');
  let state = seed >>> 0;
  let spare = NaN;
  const next = (): number => {
    state = (state + 0x6d2b79f5) >>> 0;
    let t = state;
    t = Math.imul(t ^ (t >>> 15), t | 1);
    t ^= t + Math.imul(t ^ (t >>> 7), t | 61);
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296;
  };
  const rng: Rng = {
    next,
    uniform: (lo, hi) => lo + (hi - lo) * next(),
    int: (lo, hi) => lo + Math.floor((hi - lo + 1) * next()),
    normal: () => {
      if (!Number.isNaN(spare)) {
        const s = spare;
        spare = NaN;
        return s;
      }
      let u = next();
      while (u <= 1e-12) u = next();
      const v = next();
      const r = Math.sqrt(-2 * Math.log(u));
      spare = r * Math.sin(2 * Math.PI * v);
      return r * Math.cos(2 * Math.PI * v);
    },
    chance: (p) => next() < p,
    pick: (items) => {
      if (items.length === 0) throw new RangeError('pick requires a non-empty array');
      return items[Math.floor(next() * items.length)]!;
    },
    fork: (label) => makeRng((hashString(label) ^ Math.floor(next() * 4294967296)) >>> 0),
  };
  return rng;
}
