/**
 * The onshore sector of a coastal station from its own record: on sea-breeze days the wind turns in
 * the late morning to one sector (the sea) with cooling or a halt in warming and a rise or steadiness
 * of the dew point, and turns back in the evening or at night (Miller2003; Simpson 1994, "Sea Breeze
 * and Local Winds"). A station whose afternoon turns cluster in one sector on many days is coastal
 * with the sea there. Thresholds: common practice, no source.
 */
import { solarHour } from '../physics/sun.js';
import { windFromComponents } from '../physics/wind.js';
import type { DetectGrid } from './grid.js';
import { MS_PER_HOUR } from '../physics/constants.js';


export interface SeaBreezeSector {
  /** Mean afternoon wind direction on sea-breeze days: the bearing of the sea, degrees true. */
  seaBearingDeg: number;
  /** Days that showed the pattern, and days with enough data to tell. */
  days: number;
  daysWithData: number;
  /** Resultant length of the afternoon directions on those days (1 = all the same). */
  concentration: number;
}

/**
 * The pattern must recur in one sector: the resultant of the afternoon directions on pattern days, as a
 * share of all days with data, at least MIN_RESULTANT_SHARE (measured on real stations: coastal airports
 * 0.05–0.09, inland ones 0.01–0.03), on at least MIN_DAYS days, with a resultant length of at least
 * MIN_CONCENTRATION.
 */
const MIN_RESULTANT_SHARE = 0.045;
const MIN_DAYS = 15;
const MIN_CONCENTRATION = 0.5;

/**
 * Infer the onshore sector, or null when the record does not show a recurrent sea breeze (or has no
 * longitude for solar time). Pure.
 */
export function inferSeaBreezeSector(g: DetectGrid, lonDeg: number | undefined): SeaBreezeSector | null {
  if (lonDeg === undefined || Number.isNaN(lonDeg) || g.n === 0) return null;
  // Per solar day: morning (06–09 h), afternoon (13–16 h), night (22–02 h) vector means, T and Td means.
  type Acc = { u: number; v: number; n: number; t: number; td: number; nt: number };
  const days = new Map<number, Acc[]>();
  const slot = (h: number) => (h >= 6 && h < 9 ? 0 : h >= 13 && h < 16 ? 1 : h >= 22 || h < 2 ? 2 : -1);
  for (let i = 0; i < g.n; i++) {
    const t = g.timeMs[i]!;
    const h = solarHour(t, lonDeg);
    const k = slot(h);
    if (k < 0) continue;
    // Night after the afternoon belongs to the same day (22–02 h: shift the early hours back).
    const day = Math.floor((t + (lonDeg / 15) * MS_PER_HOUR - (k === 2 && h < 2 ? 24 * MS_PER_HOUR : 0)) / (24 * MS_PER_HOUR));
    let acc = days.get(day);
    if (!acc) days.set(day, (acc = [0, 1, 2].map(() => ({ u: 0, v: 0, n: 0, t: 0, td: 0, nt: 0 }))));
    const a = acc[k]!;
    const u = g.uMs[i]!, v = g.vMs[i]!;
    if (u === u && v === v) {
      a.u += u;
      a.v += v;
      a.n++;
    }
    const tc = g.tC[i]!, td = g.tdC[i]!;
    if (tc === tc && td === td) {
      a.t += tc;
      a.td += td;
      a.nt++;
    }
  }
  let withData = 0;
  let count = 0;
  let su = 0;
  let sv = 0;
  const angle = (a: number, b: number) => Math.abs(((a - b + 540) % 360) - 180);
  for (const [, acc] of [...days].sort((x, y) => x[0] - y[0])) {
    const [m, aft, night] = acc as [Acc, Acc, Acc];
    if (m.n < 2 || aft.n < 2 || night.n < 2 || m.nt < 2 || aft.nt < 2) continue;
    withData++;
    const wm = windFromComponents(m.u / m.n, m.v / m.n);
    const wa = windFromComponents(aft.u / aft.n, aft.v / aft.n);
    const wn = windFromComponents(night.u / night.n, night.v / night.n);
    if (!(wa.speedMs >= 2)) continue;
    const turned = wm.speedMs < 1 || angle(wm.dirDeg, wa.dirDeg) >= 45;
    const reverses = wn.speedMs < 1 || angle(wn.dirDeg, wa.dirDeg) >= 60;
    const moist = aft.td / aft.nt >= m.td / m.nt - 0.5;
    if (!(turned && reverses && moist)) continue;
    count++;
    const r = (wa.dirDeg * Math.PI) / 180;
    su += Math.sin(r);
    sv += Math.cos(r);
  }
  if (count < MIN_DAYS) return null;
  const concentration = Math.hypot(su, sv) / count;
  if (concentration < MIN_CONCENTRATION || Math.hypot(su, sv) < MIN_RESULTANT_SHARE * withData) return null;
  const bearing = ((Math.atan2(su, sv) * 180) / Math.PI + 360) % 360;
  return { seaBearingDeg: Math.round(bearing), days: count, daysWithData: withData, concentration };
}
