/**
 * SVG path data from coordinates, built as strings: numbers rounded to one decimal (a tenth of a pixel),
 * gaps as a new `M` (moveto) the way d3-shape's `line.defined` splits a line (written here; no d3 package).
 */

/**
 * A pixel coordinate as short text: rounded half up to one decimal, no trailing `.0`, never `-0`.
 * @example px(12.345) // '12.3'
 * @example px(-0.04) // '0'
 */
export function px(x: number): string {
  const r = Math.round(x * 10) / 10;
  return r === 0 ? '0' : String(r);
}

export interface LinePathOptions {
  /** Whether point i is drawn; default: both coordinates finite. */
  defined?: (i: number) => boolean;
  /** Start a new subpath at point i even when i − 1 was drawn (a time gap in the reports). */
  breakBefore?: (i: number) => boolean;
  /** Draw a point with no drawn neighbour as a zero-length segment (`h0`) so that round caps show it. Default true. */
  isolatedDots?: boolean;
}

/**
 * Path data `M x,y L x,y …` through the defined points; each run of defined points is a subpath, so a missing
 * value or a break leaves a gap (a new `M`). Coordinates go through {@link px}.
 * Empty string when no point is defined.
 * @example linePath([0, 10, 20, 30], [5, NaN, 7, 8]) // 'M0,5h0M20,7L30,8'
 */
export function linePath(xs: ArrayLike<number>, ys: ArrayLike<number>, opts: LinePathOptions = {}): string {
  const n = Math.min(xs.length, ys.length);
  const defined = opts.defined ?? ((i: number) => Number.isFinite(xs[i]!) && Number.isFinite(ys[i]!));
  const dots = opts.isolatedDots ?? true;
  let out = '';
  let run = 0; // points in the current subpath
  for (let i = 0; i < n; i++) {
    if (!defined(i)) {
      if (run === 1 && dots) out += 'h0';
      run = 0;
      continue;
    }
    if (run > 0 && opts.breakBefore?.(i)) {
      if (run === 1 && dots) out += 'h0';
      run = 0;
    }
    out += (run === 0 ? 'M' : 'L') + px(xs[i]!) + ',' + px(ys[i]!);
    run++;
  }
  if (run === 1 && dots) out += 'h0';
  return out;
}

/**
 * Path data of dots: `M x,y h0` per defined point (zero-length segments; with `stroke-linecap: round` each
 * shows as a dot of the stroke width). Far shorter than one `<circle>` per point.
 * @example dotsPath([1, 2], [3, NaN]) // 'M1,3h0'
 */
export function dotsPath(xs: ArrayLike<number>, ys: ArrayLike<number>, defined?: (i: number) => boolean): string {
  const n = Math.min(xs.length, ys.length);
  const ok = defined ?? ((i: number) => Number.isFinite(xs[i]!) && Number.isFinite(ys[i]!));
  let out = '';
  for (let i = 0; i < n; i++) if (ok(i)) out += 'M' + px(xs[i]!) + ',' + px(ys[i]!) + 'h0';
  return out;
}

/**
 * Path data of small crosses (× of half-size `r`) at the points, for values flagged by quality control.
 * @example crossesPath([10], [20], 2) // 'M8,18l4,4m0,-4l-4,4'
 */
export function crossesPath(xs: ArrayLike<number>, ys: ArrayLike<number>, r = 3): string {
  let out = '';
  const d = px(2 * r);
  for (let i = 0; i < Math.min(xs.length, ys.length); i++) {
    if (!Number.isFinite(xs[i]!) || !Number.isFinite(ys[i]!)) continue;
    out += `M${px(xs[i]! - r)},${px(ys[i]! - r)}l${d},${d}m0,-${d}l-${d},${d}`;
  }
  return out;
}
