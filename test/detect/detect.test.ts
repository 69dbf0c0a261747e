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

/** Local solar hour → UTC offset for the north station (lon −95°): solar = UTC − 6.33 h. */
const day8 = 8 * 24;

// common practice, no source (signature from the literature: warm front — gradual rise of temperature and
// dew point over hours, wind veering from E–SE to S–SW, pressure falling ahead and levelling after)
test('detectStation() calls a gradual warm-air arrival with an E→S veer a warm front', () => {
  const fh = day8 + 16; // 09:40 local solar time
  const s = makeSeries({
    days: 12, stepMin: 5, meta: north,
    at: (t) => {
      const x = t / HOUR - fh;
      const k = Math.round(t / 60000);
      return {
        t: 8 + diurnal(t, north.lonDeg, 2) + 7 * ramp(x, -1, 3) + noise(k, 0.2),
        td: 5 + 7 * ramp(x, -1, 3) + noise(k + 7, 0.2),
        dir: 110 + 80 * ramp(x, 0, 1.5),
        spd: 5,
        p: 1012 - 3 * ramp(x, -6, 0) + noise(k + 3, 0.05),
      };
    },
  });
  const ev = detectStation(s).filter((e) => e.kind === 'warm-front');
  assert.is(ev.length, 1, JSON.stringify(detectStation(s).map((e) => [e.kind, new Date(e.timeMs).toISOString(), e.confidence])));
  assert.ok(Math.abs(ev[0]!.timeMs - (T0 + fh * HOUR)) <= 60 * 60_000);
});

// Wakimoto (1982): gust front — abrupt fall, pressure jump (mesohigh), strong gusts, recovery within hours;
// the wind goes back afterwards. Must not be called a cold front.
test('detectStation() calls a gust front with a pressure jump and recovery an outflow boundary, not a cold front', () => {
  const fh = day8 + 23; // 16:40 local solar time
  const s = makeSeries({
    days: 12, stepMin: 5, meta: north,
    at: (t) => {
      const x = t / HOUR - fh;
      const k = Math.round(t / 60000);
      const cold = x < 0 ? 0 : x < 0.25 ? x / 0.25 : Math.max(0, 1 - (x - 0.25) / 2);
      return {
        t: 26 + diurnal(t, north.lonDeg, 5) - 7 * cold + noise(k, 0.2),
        td: 16 + noise(k + 7, 0.2),
        dir: x > 0 && x < 1 ? 290 : 170,
        spd: x > 0 && x < 0.5 ? 14 : 4,
        p: 1008 + 2.5 * cold + noise(k + 3, 0.05),
      };
    },
  });
  s.weather.fill(0);
  const all = detectStation(s);
  const near = all.filter((e) => Math.abs(e.timeMs - (T0 + fh * HOUR)) <= 2 * HOUR);
  assert.ok(near.some((e) => e.kind === 'outflow-boundary'), JSON.stringify(near.map((e) => [e.kind, e.confidence])));
  assert.ok(!near.some((e) => e.kind === 'cold-front'));
});

// Schaefer (1986): dryline — by day the dew point falls sharply while the temperature holds or rises, the
// wind veers to SW–W, little pressure signal; at night the dryline retreats west and the moist air returns
// (its diurnal motion, Schaefer 1986, from memory), here 8–10 h after passage.
test('detectStation() calls a daytime dew-point collapse with a veer to the west a dryline', () => {
  const fh = day8 + 20; // 13:40 local solar time
  const s = makeSeries({
    days: 12, stepMin: 5, meta: north,
    at: (t) => {
      const x = t / HOUR - fh;
      const k = Math.round(t / 60000);
      return {
        t: 28 + diurnal(t, north.lonDeg, 5) + 1.5 * ramp(x, 0, 1) + noise(k, 0.2),
        td: 18 - 14 * ramp(x, 0, 1) + 14 * ramp(x, 8, 10) + noise(k + 7, 0.2),
        dir: 170 + 75 * ramp(x, 0, 0.5) - 75 * ramp(x, 8, 9),
        spd: 7,
        p: 1005 + noise(k + 3, 0.05),
      };
    },
  });
  const ev = detectStation(s).filter((e) => Math.abs(e.timeMs - (T0 + fh * HOUR)) <= 2 * HOUR);
  assert.ok(ev.some((e) => e.kind === 'dryline'), JSON.stringify(ev.map((e) => [e.kind, e.confidence])));
});

// Miller et al. (2003): sea-breeze front — coastal station, late morning, wind turns onshore, a small fall
// of temperature with a dew-point rise.
test('detectStation() calls a late-morning onshore turn at a coastal station a sea-breeze front', () => {
  const coast = { id: 'QCST', aliases: [], latDeg: 42, lonDeg: -95, elevationM: 5, coastal: true, seaBearingDeg: 90 };
  const fh = day8 + 17.5; // 11:10 local solar time
  const s = makeSeries({
    days: 12, stepMin: 5, meta: coast,
    at: (t) => {
      const x = t / HOUR - fh;
      const k = Math.round(t / 60000);
      return {
        t: 20 + diurnal(t, coast.lonDeg, 4) - 3 * ramp(x, 0, 0.5) + noise(k, 0.2),
        td: 10 + 3 * ramp(x, 0, 0.5) + noise(k + 7, 0.2),
        dir: x >= 0 && x < 7 ? 95 : 260,
        spd: 5,
        p: 1015 + noise(k + 3, 0.05),
      };
    },
  });
  const ev = detectStation(s).filter((e) => Math.abs(e.timeMs - (T0 + fh * HOUR)) <= 2 * HOUR);
  assert.ok(ev.some((e) => e.kind === 'sea-breeze-front'), JSON.stringify(ev.map((e) => [e.kind, e.confidence])));
  assert.ok(!ev.some((e) => e.kind === 'cold-front'));
});

// Occluded front or trough: a wind shift and a pressure minimum with little change of temperature or θe.
test('detectStation() calls a shift and trough without an air-mass change an occluded front', () => {
  const fh = day8 + 2;
  const s = makeSeries({
    days: 12, stepMin: 60, meta: north,
    at: (t) => {
      const x = t / HOUR - fh;
      const k = Math.round(t / 60000);
      return {
        t: 10 + diurnal(t, north.lonDeg, 3) + noise(k, 0.2),
        td: 6 + noise(k + 7, 0.2),
        dir: x < 0 ? 170 : 260,
        spd: 7,
        p: 1004 - 1.0 * Math.max(0, 4 - Math.abs(x)) + noise(k + 3, 0.05),
      };
    },
  });
  const ev = detectStation(s).filter((e) => Math.abs(e.timeMs - (T0 + fh * HOUR)) <= 2 * HOUR);
  assert.ok(ev.some((e) => e.kind === 'occluded-front'), JSON.stringify(ev.map((e) => [e.kind, e.confidence, e.evidence])));
});

test.run();
