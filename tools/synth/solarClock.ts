/**
 * Approximate solar clock for the synthetic generator: local solar hour, sunrise and sunset.
 * Good to a few minutes, which is ample for shaping a diurnal cycle; not for astronomy.
 *
 * Not the same formulas as src/physics/sun.ts, so kept apart: this clock uses local MEAN solar time (no equation of
 * time) and the Cooper declination with the geometric horizon, while physics/sun.ts gives apparent solar time and
 * NOAAsolar rise/set at zenith 90.833°. Switching would shift the generated diurnal cycles by up to ~16 min and change
 * the demo data, which must regenerate byte-identically.
 */

const DAY_MS = 86_400_000;

/** Day of year, 1-based, UTC. @example dayOfYear(Date.UTC(2026, 0, 1)) // 1 */
export function dayOfYear(timeMs: number): number {
  const d = new Date(timeMs);
  return Math.floor((timeMs - Date.UTC(d.getUTCFullYear(), 0, 1)) / DAY_MS) + 1;
}

/**
 * Local mean solar hour in [0, 24): UTC hour + longitude/15 (equation of time ignored, ≤ 16 min).
 * @example localSolarHour(Date.UTC(2026, 2, 1, 18), -90) // 12
 */
export function localSolarHour(timeMs: number, lonDeg: number): number {
  const h = ((timeMs % DAY_MS) + DAY_MS) % DAY_MS / 3_600_000 + lonDeg / 15;
  return ((h % 24) + 24) % 24;
}

/**
 * Solar declination, degrees, Cooper (1969) approximation δ = 23.45 sin(360 (284 + n)/365).
 * Cooper, P. I., 1969: Solar Energy 12, 333–346 (from memory).
 * @example solarDeclinationDeg(172) // ≈ 23.45
 */
export function solarDeclinationDeg(dayOfYearN: number): number {
  return 23.45 * Math.sin((2 * Math.PI * (284 + dayOfYearN)) / 365);
}

/**
 * Sunrise and sunset in local solar hours from the sunset hour angle cos H0 = −tan φ tan δ
 * (refraction ignored). Polar day/night clamp to 0/24.
 * @example sunTimes(80, 43) // ≈ { sunriseH: 6, sunsetH: 18 }
 */
export function sunTimes(dayOfYearN: number, latDeg: number): { sunriseH: number; sunsetH: number } {
  const d = (solarDeclinationDeg(dayOfYearN) * Math.PI) / 180;
  const p = (latDeg * Math.PI) / 180;
  const c = Math.max(-1, Math.min(1, -Math.tan(p) * Math.tan(d)));
  const h0 = (Math.acos(c) * 180) / Math.PI / 15;
  return { sunriseH: 12 - h0, sunsetH: 12 + h0 };
}

/**
 * UTC epoch ms of a given local solar hour on the local solar day containing `timeMs`.
 * @example solarTimeToUtcMs(Date.UTC(2026, 2, 1, 18), -90, 6) // 2026-03-01T12:00Z
 */
export function solarTimeToUtcMs(timeMs: number, lonDeg: number, solarHour: number): number {
  const h = localSolarHour(timeMs, lonDeg);
  return timeMs + (solarHour - h) * 3_600_000;
}
