/**
 * Plant data faults in synthetic series (mutates the given series, as the name says):
 * gaps of hours (all fields missing), a stuck temperature sensor, single-sample spikes.
 * Faults are kept at least 3 h away from planted passages and decoys so they test robustness, not luck.
 */
import type { Rng } from './random.js';
import type { FaultRecord, SynthFaultPlan, SynthSeries, TruthEvent } from './types.js';

const HOUR = 3_600_000;

function nearTruth(truth: readonly TruthEvent[], station: string, t0: number, t1: number, marginMs: number): boolean {
  return truth.some((e) => e.station === station && e.timeMs - marginMs <= t1 && (e.zoneEndMs ?? e.timeMs) + marginMs >= t0);
}

/** Apply gaps, stuck sensors and spikes; returns what was planted. */
export function applyFaultsInPlace(series: SynthSeries[], truth: readonly TruthEvent[], plan: SynthFaultPlan, rng: Rng): FaultRecord[] {
  const out: FaultRecord[] = [];
  if (series.length === 0) return out;
  const place = (kind: FaultRecord['kind'], minH: number, maxH: number, margin: number): { s: SynthSeries; i0: number; i1: number } | undefined => {
    for (let attempt = 0; attempt < 200; attempt++) {
      const s = rng.pick(series);
      if (s.length < 10) continue;
      const step = s.timeMs[1]! - s.timeMs[0]!;
      const len = Math.max(1, Math.round((rng.uniform(minH, maxH) * HOUR) / step));
      const i0 = rng.int(1, Math.max(1, s.length - len - 2));
      const i1 = Math.min(s.length - 1, i0 + len - 1);
      if (nearTruth(truth, s.station, s.timeMs[i0]!, s.timeMs[i1]!, margin)) continue;
      if (out.some((f) => f.station === s.station && f.startMs <= s.timeMs[i1]! + 6 * HOUR && f.endMs >= s.timeMs[i0]! - 6 * HOUR)) continue;
      out.push({ station: s.station, kind, startMs: s.timeMs[i0]!, endMs: s.timeMs[i1]! });
      return { s, i0, i1 };
    }
    return undefined;
  };
  for (let k = 0; k < (plan.gaps ?? 3); k++) {
    const g = place('gap', 1, 6, 3 * HOUR);
    if (!g) continue;
    for (let i = g.i0; i <= g.i1; i++) {
      g.s.temperatureC[i] = NaN;
      g.s.dewpointC[i] = NaN;
      g.s.windDirDeg[i] = NaN;
      g.s.windSpeedMs[i] = NaN;
      g.s.gustMs[i] = NaN;
      g.s.stationPressureHpa[i] = NaN;
      g.s.seaLevelPressureHpa[i] = NaN;
      g.s.precipMm[i] = NaN;
      g.s.weather[i] = 0;
    }
  }
  for (let k = 0; k < (plan.stuck ?? 1); k++) {
    const g = place('stuck', 6, 12, 3 * HOUR);
    if (!g) continue;
    out[out.length - 1]!.field = 'temperatureC';
    const v = g.s.temperatureC[g.i0]!;
    for (let i = g.i0; i <= g.i1; i++) {
      g.s.temperatureC[i] = v;
      if (g.s.dewpointC[i]! > v) g.s.dewpointC[i] = v;
    }
  }
  for (let k = 0; k < (plan.spikes ?? 4); k++) {
    const g = place('spike', 0, 0, HOUR);
    if (!g) continue;
    const which = rng.int(0, 2);
    const i = g.i0;
    if (which === 0) {
      g.s.temperatureC[i] = Math.round((g.s.temperatureC[i]! + (rng.chance(0.5) ? 1 : -1) * rng.uniform(8, 12)) * 10) / 10;
      g.s.dewpointC[i] = Math.min(g.s.dewpointC[i]!, g.s.temperatureC[i]!);
      out[out.length - 1]!.field = 'temperatureC';
    } else if (which === 1) {
      const d = (rng.chance(0.5) ? 1 : -1) * rng.uniform(15, 25);
      g.s.seaLevelPressureHpa[i] = Math.round((g.s.seaLevelPressureHpa[i]! + d) * 10) / 10;
      g.s.stationPressureHpa[i] = Math.round((g.s.stationPressureHpa[i]! + d) * 10) / 10;
      out[out.length - 1]!.field = 'pressure';
    } else {
      g.s.dewpointC[i] = Math.round((g.s.dewpointC[i]! - rng.uniform(12, 20)) * 10) / 10;
      out[out.length - 1]!.field = 'dewpointC';
    }
  }
  out.sort((a, b) => a.startMs - b.startMs);
  return out;
}
