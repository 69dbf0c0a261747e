/** Seasonal climate for the synthetic generator. */
import { dayOfYear } from './solarClock.js';

/**
 * Seasonal mean temperature at sea level, °C, for a mid-latitude continental site: annual mean and
 * amplitude fall/rise with |latitude|; coldest about 17 January (NH). Common practice, no source.
 */
export function climateMeanC(timeMs: number, latDeg: number): number {
  const a = Math.abs(latDeg);
  const annual = 30 - 0.45 * a;
  const amp = Math.max(3, 0.35 * a);
  let doy = dayOfYear(timeMs);
  if (latDeg < 0) doy += 182;
  return annual - amp * Math.cos((2 * Math.PI * (doy - 17)) / 365);
}

