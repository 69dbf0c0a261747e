import { test } from 'uvu';
import * as assert from 'uvu/assert';
import { detectStation } from '../../src/detect/detect.js';
import { makeSeries, ramp, diurnal, noise, HOUR, T0 } from './synthetic-cases.js';

const north = { id: 'QNRT', aliases: [], latDeg: 42, lonDeg: -95, elevationM: 300 };
const south = { id: 'QSTH', aliases: [], latDeg: -34, lonDeg: 150, elevationM: 50 };

/** A textbook cold front at hour `fh` of day 8: pressure V, veer SSW→WNW, temperature and dew point fall behind. */
function coldFront(meta: typeof north, veerSign: 1 | -1, stepMin: number, fh = 8 * 24 + 14) {
  return makeSeries({
    days: 12,
    stepMin,
    meta,
    at: (t) => {
      const h = t / HOUR;
      const x = h - fh;
      const k = Math.round(t / 60000);
      return {
        t: 18 + diurnal(t, meta.lonDeg, 4) - 10 * ramp(x, 0, 3) + noise(k, 0.2),
        td: 12 - 9 * ramp(x, 0.3, 3) + noise(k + 7, 0.2),
        dir: x < 0 ? 200 : 200 + veerSign * 90,
        spd: x < 0 ? 6 : 8,
        p: 1012 - 0.8 * Math.max(0, 6 - Math.abs(x)) + (x > 0 ? 0.6 * Math.min(x, 6) : 0) + noise(k + 3, 0.05),
      };
    },
  });
}

// common practice, no source: a textbook cold front (veer, pressure minimum then rise, T and Td fall) is found at the shift
test('detectStation() finds a textbook cold front at the wind shift (hourly reports)', () => {
  const s = coldFront(north, 1, 60);
  const ev = detectStation(s).filter((e) => e.kind === 'cold-front');
  assert.is(ev.length, 1, JSON.stringify(detectStation(s).map((e) => [e.kind, new Date(e.timeMs).toISOString(), e.confidence])));
  const truth = T0 + (8 * 24 + 14) * HOUR;
  assert.ok(Math.abs(ev[0]!.timeMs - truth) <= 45 * 60_000, `time ${new Date(ev[0]!.timeMs).toISOString()}`);
  assert.ok(ev[0]!.windTurnDeg > 45, 'veering');
  // 10 °C frontal fall less the morning's diurnal warming (passage at 07:40 local solar time)
  assert.ok(ev[0]!.tempChangeC < -4, `ΔT ${ev[0]!.tempChangeC}`);
  assert.ok(ev[0]!.timeEarliestMs <= truth + 30 * 60_000 && ev[0]!.timeLatestMs >= truth - 30 * 60_000);
});

test('detectStation() times a cold front within 15 min on 5-minute data', () => {
  const s = coldFront(north, 1, 5);
  const ev = detectStation(s).filter((e) => e.kind === 'cold-front');
  assert.is(ev.length, 1);
  const truth = T0 + (8 * 24 + 14) * HOUR;
  assert.ok(Math.abs(ev[0]!.timeMs - truth) <= 15 * 60_000, `time ${new Date(ev[0]!.timeMs).toISOString()}`);
  assert.ok(ev[0]!.zoneHours > 1.5 && ev[0]!.zoneHours < 3.5, `zone ${ev[0]!.zoneHours}`);
});

// common practice, no source: a cold front backs in the southern hemisphere (mirror image of the northern veer)
test('detectStation() calls a backing front in the southern hemisphere a cold front', () => {
  const s = coldFront(south, -1, 60);
  const ev = detectStation(s).filter((e) => e.kind === 'cold-front');
  assert.is(ev.length, 1);
  assert.ok(ev[0]!.windTurnDeg < -45, 'backing');
});

// common practice, no source: evening radiative cooling with calm wind, steady dew point and no pressure kink is not a front
test('detectStation() does not call a clear calm night with a 10 °C fall a front', () => {
  const s = makeSeries({
    days: 12,
    stepMin: 60,
    meta: north,
    at: (t) => {
      const k = Math.round(t / 60000);
      return { t: 12 + diurnal(t, north.lonDeg, 5) + noise(k, 0.2), td: 2 + noise(k + 1, 0.2), dir: 180, spd: 0.5 + Math.abs(noise(k + 2, 0.4)), p: 1020 + noise(k + 3, 0.05) };
    },
  });
  const fronts = detectStation(s).filter((e) => e.kind.endsWith('-front') || e.kind === 'dryline');
  assert.is(fronts.length, 0, JSON.stringify(fronts.map((e) => [e.kind, new Date(e.timeMs).toISOString(), e.confidence])));
});

test.run();
