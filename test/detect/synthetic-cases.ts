/**
 * Hand-built station series for detection checks (analytic constructions, not observations).
 * Hourly or 5-minute reports with a small diurnal cycle, so the detector's diurnal handling is exercised.
 */
import { allocSeries, type StationMeta, type StationSeries } from '../../src/model/index.js';

export const HOUR = 3_600_000;
export const T0 = Date.UTC(2026, 2, 1, 0, 0);

export interface CaseSpec {
  days: number;
  stepMin: number;
  meta: StationMeta;
  /** Values at time t (ms since T0). */
  at: (tMs: number) => { t: number; td: number; dir: number; spd: number; p: number };
}

export function makeSeries(spec: CaseSpec): StationSeries {
  const n = Math.floor((spec.days * 24 * 60) / spec.stepMin);
  const s = allocSeries(spec.meta.id, n, spec.meta);
  for (let i = 0; i < n; i++) {
    const dt = i * spec.stepMin * 60_000;
    const v = spec.at(dt);
    s.timeMs[i] = T0 + dt;
    s.temperatureC[i] = Math.round(v.t * 10) / 10;
    s.dewpointC[i] = Math.round(v.td * 10) / 10;
    s.windDirDeg[i] = v.spd < 0.3 ? 0 : Math.round((((v.dir % 360) + 360) % 360) / 10) * 10;
    s.windSpeedMs[i] = Math.round(v.spd * 10) / 10;
    s.stationPressureHpa[i] = Math.round(v.p * 10) / 10;
    s.line[i] = i + 1;
  }
  s.files.push('synthetic');
  return s;
}

/** Smooth step 0 → 1 over [a, b] (hours). */
export function ramp(xH: number, aH: number, bH: number): number {
  if (xH <= aH) return 0;
  if (xH >= bH) return 1;
  return (xH - aH) / (bH - aH);
}

/** Diurnal temperature anomaly for local solar hour h: max mid-afternoon, min near sunrise (amplitude a). */
export function diurnal(tMs: number, lonDeg: number, a: number): number {
  const h = (((tMs + T0) / HOUR + lonDeg / 15) % 24 + 24) % 24;
  return a * Math.cos(((h - 15) / 24) * 2 * Math.PI);
}

/** Deterministic small noise. */
export function noise(i: number, amp: number): number {
  const x = Math.sin(i * 12.9898) * 43758.5453;
  return (x - Math.floor(x) - 0.5) * 2 * amp;
}
