/**
 * One observed variable as SVG path data: the line through values that passed quality control, broken at
 * missing values and at time gaps, and crosses at the values quality control flagged (shown, not hidden).
 */
import { crossesPath, dotsPath, linePath } from './linePath.js';

export interface ChartLineInput {
  timeMs: ArrayLike<number>;
  values: ArrayLike<number>;
  /** QC flags per value (0 = passed); flagged values leave the line and become crosses. */
  qc?: ArrayLike<number>;
  /** Index range to draw, [from, to). */
  from: number;
  to: number;
  x: (t: number) => number;
  y: (v: number) => number;
  /** A step longer than this between consecutive reports breaks the line, ms. */
  gapMs: number;
  /** Dots instead of a line (wind direction). */
  dots?: boolean;
}

export interface ChartLine {
  /** Line (or dots) through the values that passed QC. */
  path: string;
  /** Crosses at flagged values (clamped into `clamp` when given). */
  flagged: string;
  /** Count of flagged values drawn. */
  flaggedCount: number;
}

/**
 * Indices to keep when there are many more points than pixels: per pixel column the first, lowest, highest
 * and last defined point (the M4 aggregation of Jugel et al. 2014, PVLDB 7(10), which keeps the drawn line
 * identical at that width). Returns indices in time order; all of them when `maxPoints` is not exceeded.
 */
export function m4Indices(xs: ArrayLike<number>, ys: ArrayLike<number>, from: number, to: number, maxPoints: number): number[] {
  const out: number[] = [];
  if (to - from <= maxPoints) {
    for (let i = from; i < to; i++) out.push(i);
    return out;
  }
  let col = NaN;
  let first = -1, lo = -1, hi = -1, last = -1;
  const flush = () => {
    if (first < 0) return;
    const k = [...new Set([first, lo, hi, last])].sort((a, b) => a - b);
    out.push(...k);
  };
  for (let i = from; i < to; i++) {
    const y = ys[i]!;
    const c = Math.floor(xs[i]!);
    if (c !== col) {
      flush();
      col = c;
      first = lo = hi = last = -1;
    }
    if (!Number.isFinite(y)) {
      // keep the gap: close this column and mark the missing point
      flush();
      first = lo = hi = last = -1;
      out.push(i);
      continue;
    }
    if (first < 0) first = lo = hi = i;
    if (y < ys[lo]!) lo = i;
    if (y > ys[hi]!) hi = i;
    last = i;
  }
  flush();
  return out;
}

/** Build the line and the flagged-value crosses of one variable over [from, to). */
export function chartLine(c: ChartLineInput, clamp?: [number, number]): ChartLine {
  const idx: number[] = [];
  for (let i = c.from; i < c.to; i++) idx.push(i);
  const xs = idx.map((i) => c.x(c.timeMs[i]!));
  const clean = idx.map((i) => (c.qc && c.qc[i] ? NaN : c.values[i]!));
  const ys = clean.map((v) => (Number.isFinite(v) ? c.y(v) : NaN));
  let path: string;
  if (c.dots) path = dotsPath(xs, ys);
  else {
    // Thin out only when there are more than two points per pixel.
    const width = xs.length ? Math.abs(xs[xs.length - 1]! - xs[0]!) : 0;
    const keep = m4Indices(xs, ys, 0, xs.length, Math.max(64, Math.ceil(2 * width)));
    const kx = keep.map((k) => xs[k]!);
    const ky = keep.map((k) => ys[k]!);
    // Gaps between consecutive reports, counted cumulatively, so a gap anywhere between two kept points breaks the line.
    const gapsUpTo = new Int32Array(idx.length);
    for (let k = 1; k < idx.length; k++) gapsUpTo[k] = gapsUpTo[k - 1]! + (c.timeMs[idx[k]!]! - c.timeMs[idx[k - 1]!]! > c.gapMs ? 1 : 0);
    path = linePath(kx, ky, { breakBefore: (j) => j > 0 && gapsUpTo[keep[j]!]! > gapsUpTo[keep[j - 1]!]! });
  }
  const fx: number[] = [];
  const fy: number[] = [];
  if (c.qc) {
    for (let k = 0; k < idx.length; k++) {
      const i = idx[k]!;
      const v = c.values[i]!;
      if (!c.qc[i] || !Number.isFinite(v)) continue;
      let yy = c.y(v);
      if (clamp) yy = Math.min(Math.max(yy, clamp[0]), clamp[1]);
      fx.push(xs[k]!);
      fy.push(yy);
    }
  }
  return { path, flagged: crossesPath(fx, fy, 3), flaggedCount: fx.length };
}

/**
 * Index range [from, to) of the reports inside [t0, t1] plus one report on each side (so lines reach the
 * edges; the chart clips them). `timeMs` must be sorted ascending.
 * @example windowRange([0, 10, 20, 30, 40], 15, 25) // [1, 4]
 */
export function windowRange(timeMs: ArrayLike<number>, t0: number, t1: number): [number, number] {
  const lowerBound = (t: number) => {
    let lo = 0, hi = timeMs.length;
    while (lo < hi) {
      const mid = (lo + hi) >> 1;
      if (timeMs[mid]! < t) lo = mid + 1;
      else hi = mid;
    }
    return lo;
  };
  const from = Math.max(0, lowerBound(t0) - 1);
  let to = lowerBound(t1);
  while (to < timeMs.length && timeMs[to]! <= t1) to++;
  return [from, Math.min(timeMs.length, to + 1)];
}
