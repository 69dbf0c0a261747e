/**
 * Lasting air-mass change around a candidate passage. A synoptic front replaces the air mass for half a
 * day or more; an outflow, a shower, a sea breeze or evening cooling does not (Sanders1999 on the
 * frontal contrast; Wakimoto1982 on outflow recovery; common practice, no source, for the windows).
 * The comparison that removes the diurnal cycle without a model is the same solar hours a day earlier:
 * the air 6–12 h after the candidate against the air 18–12 h before it.
 */
import type { DetectGrid } from './grid.js';
import { meanIn } from './window.js';
import { MS_PER_HOUR } from '../physics/constants.js';


export interface AirMassChange {
  /** Temperature 6–12 h after minus the same hours one day earlier (°C). */
  tempDayC: number;
  /** Dew point 6–12 h after minus the same hours one day earlier (°C). */
  dewpointDayC: number;
  /** θe 6–12 h after minus the same hours one day earlier (K). */
  thetaEDayK: number;
  /** Diurnally adjusted temperature 4–10 h after minus the 3 h before (°C). */
  tempAdjLastingC: number;
  /** Dew point 4–10 h after minus the 3 h before (°C). */
  dewpointLastingC: number;
  /** θe 4–10 h after minus the 3 h before (K). */
  thetaELastingK: number;
  /** Pressure 6 h after minus at the candidate (hPa); NaN without pressure. */
  pressureRise6hHpa: number;
  /** Mean temperature over the 24 h from 2 h after minus over the 24 h before (°C): a whole diurnal cycle each side, so the cycle cancels. */
  tempDailyMeanC: number;
  /** The same for the dew point (°C). */
  dewpointDailyMeanC: number;
}

/** Measure the lasting change at grid index i. NaN where a window has no data. */
export function airMassChange(g: DetectGrid, i: number): AirMassChange {
  const perH = MS_PER_HOUR / g.stepMs;
  const after = (v: Float64Array) => meanIn(v, i + 6 * perH, i + 12 * perH);
  const dayBefore = (v: Float64Array) => meanIn(v, i - 18 * perH, i - 12 * perH);
  const lasting = (v: Float64Array) => meanIn(v, i + 4 * perH, i + 10 * perH) - meanIn(v, i - 3 * perH, i);
  return {
    tempDayC: after(g.tC) - dayBefore(g.tC),
    dewpointDayC: after(g.tdC) - dayBefore(g.tdC),
    thetaEDayK: after(g.thetaEK) - dayBefore(g.thetaEK),
    tempAdjLastingC: lasting(g.tAdjC),
    dewpointLastingC: lasting(g.tdC),
    thetaELastingK: lasting(g.thetaEK),
    pressureRise6hHpa: meanIn(g.pHpa, i + 5.5 * perH, i + 6.5 * perH) - meanIn(g.pHpa, i - 0.25 * perH, i + 0.25 * perH),
    tempDailyMeanC: dailyMeanChange(g.tC, i, perH),
    dewpointDailyMeanC: dailyMeanChange(g.tdC, i, perH),
  };
}

/** Mean over [i + 2 h, i + 26 h) minus mean over [i − 24 h, i); NaN when either side has under half its samples. */
function dailyMeanChange(v: Float64Array, i: number, perH: number): number {
  const half = 12 * perH;
  return meanIn(v, i + 2 * perH, i + 26 * perH, half) - meanIn(v, i - 24 * perH, i, half);
}
