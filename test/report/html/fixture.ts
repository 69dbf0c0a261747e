/** Invented small series and passage for the report tests (not physics checks). */
import { allocSeries, type PassageEvent, type StationSeries } from '../../../src/model/index.js';

export const H = 3_600_000;
export const T0 = Date.UTC(2026, 2, 2, 0, 0);

/** 48 h of 10-min reports: warm and southerly, then at 12:00 a 6 °C fall, a veer to the north-west and a pressure trough. */
export function smallSeries(station = 'XTST'): StationSeries {
  const n = 48 * 6 + 1;
  const s = allocSeries(station, n, { id: station, aliases: [], name: 'Test <site> & co', latDeg: 45, lonDeg: -95, elevationM: 300 });
  for (let i = 0; i < n; i++) {
    const t = T0 + i * 600_000;
    s.timeMs[i] = t;
    const after = t >= T0 + 12 * H;
    s.temperatureC[i] = after ? 4 : 10;
    s.dewpointC[i] = after ? -2 : 5;
    s.windDirDeg[i] = after ? 300 : 190;
    s.windSpeedMs[i] = after ? 9 : 5;
    s.seaLevelPressureHpa[i] = 1010 - 4 * Math.exp(-(((t - T0 - 12 * H) / (6 * H)) ** 2));
  }
  return s;
}

export function passage(station = 'XTST', timeMs = T0 + 12 * H, kind: PassageEvent['kind'] = 'cold-front'): PassageEvent {
  return {
    station,
    kind,
    timeMs,
    timeEarliestMs: timeMs - 600_000,
    timeLatestMs: timeMs,
    confidence: 0.9,
    tempChangeC: -6,
    dewpointChangeC: -7,
    thetaEChangeK: -15,
    pressureMinHpa: 1006,
    pressureMinTimeMs: timeMs,
    pressureRise3hHpa: 2,
    windBeforeDeg: 190,
    windAfterDeg: 300,
    windTurnDeg: 110,
    windSpeedAfterMs: 9,
    gustMaxMs: NaN,
    precipNear: false,
    zoneStartMs: timeMs,
    zoneEndMs: timeMs + 2 * H,
    zoneHours: 2,
    zoneDepthKm: NaN,
    gradientKPer100km: NaN,
    observerFropaTimeMs: NaN, windShiftTimeMs: NaN, changeStartTimeMs: NaN, timeBasis: 'change-point',
    evidence: ['+ wind 190° → 300° (veering 110°)', '− pressure rise <1 hPa & "small"'],
  };
}
