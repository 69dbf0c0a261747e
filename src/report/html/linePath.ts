/**
 * SVG path data from coordinates: lines and dots through d3-shape's `line` generator (curveLinear, `defined` for the
 * gaps, numbers rounded to one decimal by `digits(1)`, a tenth of a pixel), and the crosses of flagged values.
 */
import { line } from 'd3-shape';

/**
 * A pixel coordinate as short text: rounded half up to one decimal, no trailing `.0`, never `-0` (the rounding
 * d3-path applies with `digits(1)`).
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
  /**
   * Draw a point with no drawn neighbour (d3-shape writes it `M x,y Z`, a zero-length subpath that round caps show as
   * a dot). Default true; false leaves such points out.
   */
  isolatedDots?: boolean;
}

/** Index −1 separates subpaths in the data handed to the generator. */
const BREAK = -1;

/** d3-shape line over point indices into xs, ys; BREAK leaves a gap. */
function indexLine(xs: ArrayLike<number>, ys: ArrayLike<number>) {
  return line<number>()
    .x((i) => xs[i]!)
    .y((i) => ys[i]!)
    .defined((i) => i !== BREAK)
    .digits(1);
}

/**
 * Path data `M x,y L x,y …` through the defined points (d3-shape `line`); each run of defined points is a subpath,
 * so a missing value or a break leaves a gap (a new `M`); a lone point is `M x,y Z`. Empty string when no point is
 * defined.
 * @example linePath([0, 10, 20, 30], [5, NaN, 7, 8]) // 'M0,5ZM20,7L30,8'
 */
export function linePath(xs: ArrayLike<number>, ys: ArrayLike<number>, opts: LinePathOptions = {}): string {
  const n = Math.min(xs.length, ys.length);
  const defined = opts.defined ?? ((i: number) => Number.isFinite(xs[i]!) && Number.isFinite(ys[i]!));
  const dots = opts.isolatedDots ?? true;
  // runs of drawn points, BREAK between runs
  const data: number[] = [];
  let run: number[] = [];
  const close = () => {
    if (run.length > 1 || (run.length === 1 && dots)) {
      if (data.length) data.push(BREAK);
      data.push(...run);
    }
    run = [];
  };
  for (let i = 0; i < n; i++) {
    if (!defined(i)) {
      close();
      continue;
    }
    if (run.length > 0 && opts.breakBefore?.(i)) close();
    run.push(i);
  }
  close();
  return indexLine(xs, ys)(data) ?? '';
}

/**
 * Path data of dots: `M x,y Z` per defined point (zero-length subpaths from d3-shape `line`; with
 * `stroke-linecap: round` each shows as a dot of the stroke width). Far shorter than one `<circle>` per point.
 * @example dotsPath([1, 2], [3, NaN]) // 'M1,3Z'
 */
export function dotsPath(xs: ArrayLike<number>, ys: ArrayLike<number>, defined?: (i: number) => boolean): string {
  const n = Math.min(xs.length, ys.length);
  const ok = defined ?? ((i: number) => Number.isFinite(xs[i]!) && Number.isFinite(ys[i]!));
  const data: number[] = [];
  for (let i = 0; i < n; i++) if (ok(i)) data.push(i, BREAK);
  return indexLine(xs, ys)(data) ?? '';
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
