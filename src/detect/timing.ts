/**
 * Timing a passage on the raw reports: the wind shift as the split of the reports that best separates
 * the mean wind vector before from after (a two-sample change point in u/v, least squares), and the start
 * of the sharp temperature change. Times fall between two reports: `earliest` is the last report before,
 * `latest` the first report after, and the estimate is their midpoint.
 */
import { windComponents, windFromComponents, signedTurnDeg } from '../physics/wind.js';
import type { RawColumns } from './features.js';
import { lowerBound } from './features.js';
import { MS_PER_HOUR, MS_PER_MINUTE } from '../physics/constants.js';

export interface SplitTime {
  timeMs: number;
  earliestMs: number;
  latestMs: number;
  turnDeg: number;
  /** Between-group sum of squares of the split, (m/s)². */
  strength: number;
  /** Mean wind direction of the reports before / after the split (degrees true; NaN for a thermal change). */
  beforeDeg?: number;
  afterDeg?: number;
}

/**
 * Best wind split among reports within ±`searchMs` of `aroundMs`, each side averaged over up to `sideMs`.
 * Returns null when no split turns the wind by at least `minTurnDeg`.
 */
export function windSplit(timeMs: Float64Array, raw: RawColumns, aroundMs: number, searchMs = 2 * MS_PER_HOUR, sideMs = 1.5 * MS_PER_HOUR, minTurnDeg = 30): SplitTime | null {
  const lo = lowerBound(timeMs, aroundMs - searchMs - sideMs);
  const hi = lowerBound(timeMs, aroundMs + searchMs + sideMs);
  const idx: number[] = [];
  const us: number[] = [];
  const vs: number[] = [];
  for (let k = lo; k < hi; k++) {
    const s = raw.spd[k]!;
    if (Number.isNaN(s)) continue;
    const c = windComponents(s === 0 ? 0 : raw.dir[k]!, s);
    if (Number.isNaN(c.uMs)) continue;
    idx.push(k);
    us.push(c.uMs);
    vs.push(c.vMs);
  }
  const m = idx.length;
  if (m < 4) return null;
  let best: SplitTime | null = null;
  let bestScore = 0;
  let a = 0;
  let b = 0;
  for (let j = 1; j < m; j++) {
    const tj = timeMs[idx[j]!]!;
    if (Math.abs(tj - aroundMs) > searchMs) continue;
    while (a < j && timeMs[idx[a]!]! < tj - sideMs) a++;
    while (b < m && timeMs[idx[b]!]! < tj + sideMs) b++;
    const nb = j - a;
    const na = b - j;
    if (nb < 1 || na < 2) continue;
    let ub = 0, vb = 0, ua = 0, va = 0;
    for (let q = a; q < j; q++) { ub += us[q]!; vb += vs[q]!; }
    for (let q = j; q < b; q++) { ua += us[q]!; va += vs[q]!; }
    ub /= nb; vb /= nb; ua /= na; va /= na;
    const score = ((nb * na) / (nb + na)) * ((ua - ub) ** 2 + (va - vb) ** 2);
    if (score > bestScore) {
      const wb = windFromComponents(ub, vb);
      const wa = windFromComponents(ua, va);
      const turn = wb.speedMs > 0.5 && wa.speedMs > 0.5 ? signedTurnDeg(wb.dirDeg, wa.dirDeg) : NaN;
      if (Math.abs(turn) >= minTurnDeg) {
        bestScore = score;
        // The shift began at the first report that had turned a tenth of the way (and more than the reports' direction resolution) from the wind well
        // before it (FMH-1 §5.4.6 reports the time a shift began); for an abrupt shift that is the split.
        let k = j;
        while (k - 1 > 0) {
          const tk = timeMs[idx[k - 1]!]!;
          let ur = 0, vr = 0, nr = 0;
          for (let q = k - 2; q >= 0 && timeMs[idx[q]!]! >= tk - 2 * MS_PER_HOUR; q--) {
            if (timeMs[idx[q]!]! > tk - 0.5 * MS_PER_HOUR) continue;
            ur += us[q]!; vr += vs[q]!; nr++;
          }
          if (nr === 0) break;
          const ref = windFromComponents(ur / nr, vr / nr);
          const kd = idx[k - 1]!;
          if (!(raw.spd[kd]! > 0) || !(ref.speedMs > 0.5)) break;
          const part = signedTurnDeg(ref.dirDeg, raw.dir[kd]!);
          // A tenth of the turn, and more than one step of the reports' direction resolution (noise).
          // Between sparse reports (over 20 min apart) a third of the turn: drift is not yet the shift.
          const need = timeMs[idx[k]!]! - timeMs[kd]! > 20 * MS_PER_MINUTE ? 0.3 : 0.1;
          if (!(part / turn >= need && Math.abs(part) >= 1.5 * raw.dirResolutionDeg)) break;
          // An abrupt jump into report k means the shift began there, whatever drifted before it.
          const jump = raw.spd[idx[k]!]! > 0 ? signedTurnDeg(raw.dir[kd]!, raw.dir[idx[k]!]!) : NaN;
          // (Only when the reports are close enough to tell: FMH-1 calls a shift abrupt within 15 min.)
          if (jump / turn >= 0.5 && timeMs[idx[k]!]! - timeMs[kd]! <= 20 * MS_PER_MINUTE) break;
          k--;
        }
        const t0 = timeMs[idx[k - 1]!]!;
        const t1 = timeMs[idx[k]!]!;
        // The window brackets the shift: from the last report before the shift began to the first report
        // nearer the new wind than the old one, so the old wind is reported at its start and the new one at
        // its end (a report half-way through the turn is neither).
        const nearer = (q: number): -1 | 0 | 1 => {
          const kq = idx[q]!;
          if (!(raw.spd[kq]! > 0)) return 0;
          const dOld = Math.abs(signedTurnDeg(wb.dirDeg, raw.dir[kq]!));
          const dNew = Math.abs(signedTurnDeg(wa.dirDeg, raw.dir[kq]!));
          return dNew < dOld ? 1 : dOld < dNew ? -1 : 0;
        };
        // Looked for within an hour (or two report intervals) after the split's report: a slow veer beyond
        // that keeps the split's report as the window's end.
        const reach = t1 + Math.max(MS_PER_HOUR, 2 * (t1 - t0));
        let first = -1;
        for (let q = k; q < b && timeMs[idx[q]!]! <= reach; q++) if (nearer(q) === 1) { first = q; break; }
        const earliestMs = t0;
        const latestMs = first >= 0 ? Math.max(timeMs[idx[first]!]!, t1) : t1;
        const began = Math.min(latestMs, Math.max(earliestMs, (t0 + t1) / 2));
        best = { timeMs: began, earliestMs, latestMs, turnDeg: turn, strength: score, beforeDeg: wb.dirDeg, afterDeg: wa.dirDeg };
      }
    }
  }
  return best;
}

/**
 * Start of a temperature change of `changeC` (signed) after a level `levelC`: the last report within
 * [fromMs, toMs] still within 15 % of the change from the level, bracketed by the next report.
 */
export function changeStart(timeMs: Float64Array, values: Float64Array, levelC: number, changeC: number, fromMs: number, toMs: number): SplitTime | null {
  if (!(Math.abs(changeC) > 0)) return null;
  const lo = lowerBound(timeMs, fromMs);
  const hi = lowerBound(timeMs, toMs);
  let last = -1;
  let next = -1;
  // Walk back from the end of the change to the last report that had not yet departed.
  for (let k = hi - 1; k >= lo; k--) {
    const v = values[k]!;
    if (Number.isNaN(v)) continue;
    if ((v - levelC) / changeC < 0.15) {
      last = k;
      break;
    }
    next = k;
  }
  if (last < 0 || next < 0) return null;
  const t0 = timeMs[last]!;
  const t1 = timeMs[next]!;
  return { timeMs: (t0 + t1) / 2, earliestMs: t0, latestMs: t1, turnDeg: NaN, strength: 0 };
}
