/**
 * The naive rule of thumb, as a fair baseline: a cold front where the temperature falls by ≥ 3 °C
 * within 3 h together with a wind turn of ≥ 45° (common practice, no source). One event per
 * qualifying episode; event time = start of the fall (the warmest report before the fall).
 * Calm or missing winds carry no direction: the rule uses the nearest reported direction with a
 * speed of at least 1 m/s, within 1 h.
 */
import type { StationSeries } from '../src/model/index.js';

export interface NaiveEvent {
  station: string;
  kind: 'cold-front';
  timeMs: number;
  tempChangeC: number;
  windTurnDeg: number;
  zoneHours: number;
}

const HOUR = 3_600_000;

function dirNear(s: StationSeries, i: number, forward: boolean): number {
  const t0 = s.timeMs[i]!;
  for (let k = i; k >= 0 && k < s.length && Math.abs(s.timeMs[k]! - t0) <= HOUR; k += forward ? 1 : -1) {
    const d = s.windDirDeg[k]!;
    if (!Number.isNaN(d) && s.windSpeedMs[k]! >= 1) return d;
  }
  return NaN;
}

/** Apply the naive rule to one station series. */
export function naiveDetect(s: StationSeries, fallC = 3, windowH = 3, turnDeg = 45): NaiveEvent[] {
  const out: NaiveEvent[] = [];
  const n = s.length;
  let blockedUntil = -Infinity;
  for (let i = 0; i < n; i++) {
    const t0 = s.timeMs[i]!;
    if (t0 <= blockedUntil) continue;
    const T0 = s.temperatureC[i]!;
    if (Number.isNaN(T0)) continue;
    const d0 = dirNear(s, i, false);
    if (Number.isNaN(d0)) continue;
    let hit = -1;
    for (let j = i + 1; j < n && s.timeMs[j]! - t0 <= windowH * HOUR; j++) {
      const Tj = s.temperatureC[j]!;
      if (!(T0 - Tj >= fallC)) continue;
      const dj = dirNear(s, j, true);
      if (Number.isNaN(dj)) continue;
      const turn = Math.abs(((((dj - d0) % 360) + 540) % 360) - 180);
      if (turn >= turnDeg) {
        hit = j;
        break;
      }
    }
    if (hit < 0) continue;
    // Start of the fall: the warmest report from i up to the hit.
    let k0 = i;
    for (let k = i; k <= hit; k++) if (s.temperatureC[k]! > s.temperatureC[k0]!) k0 = k;
    const dj = dirNear(s, hit, true);
    out.push({
      station: s.station,
      kind: 'cold-front',
      timeMs: s.timeMs[k0]!,
      tempChangeC: s.temperatureC[hit]! - s.temperatureC[k0]!,
      windTurnDeg: ((((dj - d0) % 360) + 540) % 360) - 180,
      zoneHours: NaN,
    });
    // One event per episode: skip until the window after the hit has passed.
    blockedUntil = s.timeMs[hit]! + windowH * HOUR;
  }
  return out;
}
