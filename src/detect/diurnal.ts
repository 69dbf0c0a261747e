/**
 * Diurnal adjustment of temperature for detection: subtract the expected diurnal anomaly (the station's
 * own median profile by local solar hour, or the solar-aware fallback for short records; src/signal/diurnal.ts),
 * damped where the air is near saturation. Cloud and rain flatten the diurnal cycle, so a climatological
 * profile would otherwise turn a cloudy morning's small rise into a large "adjusted" fall.
 * The damping (full profile at a dew-point depression of 5 °C or more, none at 1 °C or less, smoothed over
 * 3 h) is common practice, no source.
 */
import { meanDiurnalAnomaly, removeDiurnal } from '../signal/diurnal.js';
import { runningMean } from './window.js';
import { MS_PER_HOUR } from '../physics/constants.js';

export interface DiurnalAdjustment {
  adjusted: Float64Array;
  method: string;
}

/** Temperature minus the damped expected diurnal anomaly on a regular grid. Without a longitude: no adjustment. */
export function diurnalAdjustment(timeMs: Float64Array, tC: Float64Array, tdC: Float64Array, lonDeg: number, latDeg: number): DiurnalAdjustment {
  if (!Number.isFinite(lonDeg) || timeMs.length < 2) return { adjusted: Float64Array.from(tC), method: 'none (no station longitude)' };
  const profile = meanDiurnalAnomaly(timeMs, tC, lonDeg, { latDeg: Number.isFinite(latDeg) ? latDeg : undefined });
  const removed = removeDiurnal(timeMs, tC, profile, lonDeg);
  const stepMs = timeMs[1]! - timeMs[0]!;
  const depression = new Float64Array(tC.length);
  for (let i = 0; i < tC.length; i++) depression[i] = tC[i]! - tdC[i]!;
  const smooth = runningMean(depression, Math.max(1, Math.round((1.5 * MS_PER_HOUR) / stepMs)));
  const adjusted = new Float64Array(tC.length);
  for (let i = 0; i < tC.length; i++) {
    const d = smooth[i]!;
    const damp = Number.isNaN(d) ? 1 : Math.min(1, Math.max(0, (d - 1) / 4));
    adjusted[i] = tC[i]! - damp * (tC[i]! - removed[i]!);
  }
  return { adjusted, method: `${profile.source} profile (range ${profile.range.toFixed(1)} °C), damped near saturation` };
}
