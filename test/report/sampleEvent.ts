/** An invented passage event for writer checks (not an observation). */
import type { PassageEvent } from '../../src/model/index.js';

export function sampleEvent(over: Partial<PassageEvent> = {}): PassageEvent {
  const t = Date.UTC(2026, 2, 4, 12, 35);
  return {
    station: 'KXYZ',
    kind: 'cold-front',
    timeMs: t,
    timeEarliestMs: t - 20 * 60000,
    timeLatestMs: t + 20 * 60000,
    confidence: 0.8765,
    tempChangeC: -6.04,
    dewpointChangeC: -4.96,
    thetaEChangeK: -12.35,
    pressureMinHpa: 998.26,
    pressureMinTimeMs: t - 30 * 60000,
    pressureRise3hHpa: 3.14,
    windBeforeDeg: 205.4,
    windAfterDeg: 292.6,
    windTurnDeg: 87.2,
    windSpeedAfterMs: 9.26,
    gustMaxMs: 17.5,
    precipNear: true,
    zoneStartMs: t,
    zoneEndMs: t + 2.5 * 3600000,
    zoneHours: 2.5,
    zoneDepthKm: 90.04,
    gradientKPer100km: 6.71,
    observerFropaTimeMs: NaN,
    windShiftTimeMs: NaN,
    changeStartTimeMs: NaN,
    timeBasis: 'change-point',
    evidence: ['+ wind veered 87°', '− no pressure "kink", weak'],
    ...over,
  };
}
