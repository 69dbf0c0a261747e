import { test } from 'uvu';
import * as assert from 'uvu/assert';
import fc from 'fast-check';
import { assertAllClose, assertClose } from '../helpers/assert.js';
import {
  angularDifferenceDeg, circularStatsDeg, fmh1Gust, fmh1WindShifts, gustFactor, isFmh1WindShift, normalizeDirectionDeg,
  signedTurnDeg, uvToWind, vectorMeanWind, windComponents, windFromComponents, windToUV,
} from '../../src/physics/wind.js';
import { KNOT_MS, MS_PER_MINUTE } from '../../src/physics/constants.js';

const kt = (x: number) => x * KNOT_MS;
const min = (x: number) => x * MS_PER_MINUTE;

test('windComponents follows the meteorological convention (u = −s sin d, v = −s cos d; WMO "direction from")', () => {
  // a north wind (from 360/0°) blows southward: v < 0; a west wind (270°) blows eastward: u > 0
  const north = windComponents(0, 10);
  assertClose(north.uMs, 0, 1e-12); assertClose(north.vMs, -10, 1e-12);
  const west = windComponents(270, 10);
  assertClose(west.uMs, 10, 1e-12); assertClose(west.vMs, 0, 1e-12);
  const sw = windComponents(225, Math.SQRT2);
  assertClose(sw.uMs, 1, 1e-12); assertClose(sw.vMs, 1, 1e-12);
  assert.equal(windFromComponents(0, -5), { dirDeg: 0, speedMs: 5 });
  assertClose(windFromComponents(10, 0).dirDeg, 270, 1e-12);
  assertClose(windFromComponents(-1, -1).dirDeg, 45, 1e-12);
});

test('calm rule: speed 0 → (0, 0) even with NaN direction; zero vector → direction NaN, speed 0', () => {
  assert.equal(windComponents(NaN, 0), { uMs: 0, vMs: 0 });
  const w = windFromComponents(0, 0);
  assert.ok(Number.isNaN(w.dirDeg)); assert.is(w.speedMs, 0);
  assert.ok(Number.isNaN(windComponents(NaN, 5).uMs), 'variable direction with wind → NaN');
  assert.ok(Number.isNaN(windComponents(90, NaN).vMs));
});

test('windToUV / uvToWind typed-array variants match the scalar functions and fill outputs', () => {
  const dir = new Float64Array([0, 90, 180, 270, NaN, 45]);
  const spd = new Float64Array([5, 5, 5, 5, 0, NaN]);
  const uOut = new Float64Array(6);
  const vOut = new Float64Array(6);
  const { u, v } = windToUV(dir, spd, uOut, vOut);
  assert.is(u, uOut); assert.is(v, vOut);
  assertAllClose(u, [0, -5, 0, 5, 0, NaN], 1e-12);
  assertAllClose(v, [-5, 0, 5, 0, 0, NaN], 1e-12);
  const back = uvToWind(u, v);
  assertAllClose(back.dirDeg, [0, 90, 180, 270, NaN, NaN], 1e-9);
  assertAllClose(back.speedMs, [5, 5, 5, 5, 0, NaN], 1e-12);
  assert.throws(() => windToUV([1, 2], [1]), RangeError);
  assert.throws(() => windToUV([1], [1], new Float64Array(2)), RangeError);
});

test('property: u/v round trip recovers direction and speed', () => {
  fc.assert(
    fc.property(fc.double({ min: 0, max: 359.999, noNaN: true }), fc.double({ min: 0.01, max: 80, noNaN: true }), (d, s) => {
      const { uMs, vMs } = windComponents(d, s);
      const w = windFromComponents(uMs, vMs);
      return angularDifferenceDeg(w.dirDeg, d) < 1e-9 && Math.abs(w.speedMs - s) < 1e-9;
    }),
  );
});

test('signedTurnDeg and angularDifferenceDeg: range (−180, 180], veer positive, across north', () => {
  assert.is(signedTurnDeg(350, 30), 40);
  assert.is(signedTurnDeg(30, 350), -40);
  assert.is(signedTurnDeg(200, 300), 100); // SW → NW veer (NH cold front)
  assert.is(signedTurnDeg(0, 180), 180);
  assert.is(signedTurnDeg(180, 0), 180);
  assert.is(signedTurnDeg(90, 90), 0);
  assert.is(signedTurnDeg(10, 370), 0);
  assert.is(angularDifferenceDeg(340, 30), 50);
  assert.is(angularDifferenceDeg(350, 30), 40);
  assert.is(normalizeDirectionDeg(360), 0);
  assert.is(normalizeDirectionDeg(-90), 270);
  assert.ok(Number.isNaN(signedTurnDeg(NaN, 10)));
});

test('property: signedTurnDeg antisymmetry (except ±180) and in range; angularDifferenceDeg symmetric in [0, 180]', () => {
  fc.assert(
    fc.property(fc.double({ min: -720, max: 720, noNaN: true }), fc.double({ min: -720, max: 720, noNaN: true }), (a, b) => {
      const t = signedTurnDeg(a, b);
      const r = signedTurnDeg(b, a);
      const inRange = t > -180 && t <= 180;
      const anti = Math.abs(Math.abs(t) - 180) < 1e-9 || Math.abs(t + r) < 1e-9;
      const d = angularDifferenceDeg(a, b);
      return inRange && anti && d >= 0 && d <= 180 && Math.abs(d - angularDifferenceDeg(b, a)) < 1e-9;
    }),
  );
});

test('circularStatsDeg: hand-computed cases from the MardiaJupp2000 §2.3 definitions', () => {
  // {0°, 90°}: C̄ = S̄ = 0.5, R̄ = √0.5, mean 45°, V = 1 − R̄, std = √(−2 ln R̄) = √(ln 2) rad, ρ̄₂ = 0 → δ = 1/(2·0.5) = 1
  const a = circularStatsDeg([0, 90]);
  assertClose(a.meanDeg, 45, 1e-12);
  assertClose(a.resultantLength, Math.SQRT1_2, 1e-15);
  assertClose(a.circularVariance, 1 - Math.SQRT1_2, 1e-15);
  assertClose(a.circularStdDeg, (Math.sqrt(Math.log(2)) * 180) / Math.PI, 1e-9);
  assertClose(a.dispersion, 1, 1e-12);
  // mean across north is 0°, not 180°
  assertClose(circularStatsDeg([350, 10]).meanDeg % 360, 0, 1e-9);
  // identical directions: R̄ = 1, V = 0, std 0
  const b = circularStatsDeg([123, 123, 123]);
  assertClose(b.resultantLength, 1, 1e-15); assertClose(b.circularStdDeg, 0, 1e-6); assertClose(b.meanDeg, 123, 1e-9);
  // opposite directions: R̄ = 0, mean undefined
  const c = circularStatsDeg([90, 270]);
  assertClose(c.resultantLength, 0, 1e-15); assert.ok(Number.isNaN(c.meanDeg));
  // NaN ignored; empty → n = 0 and NaN
  assert.is(circularStatsDeg([10, NaN, 20]).n, 2);
  const e = circularStatsDeg([NaN]);
  assert.is(e.n, 0); assert.ok(Number.isNaN(e.meanDeg) && Number.isNaN(e.resultantLength));
});

test('circularStatsDeg weighted by speed equals the direction of vectorMeanWind (the u/v mean)', () => {
  fc.assert(
    fc.property(
      fc.array(fc.tuple(fc.double({ min: 0, max: 360, noNaN: true }), fc.double({ min: 0.5, max: 30, noNaN: true })), { minLength: 1, maxLength: 20 }),
      (pairs) => {
        const d = pairs.map((p) => p[0]);
        const s = pairs.map((p) => p[1]);
        const c = circularStatsDeg(d, s);
        const v = vectorMeanWind(d, s);
        if (c.resultantLength < 1e-6) return true;
        const meanSpeed = s.reduce((x, y) => x + y, 0) / s.length;
        return angularDifferenceDeg(c.meanDeg, v.dirDeg) < 1e-6 && Math.abs(v.speedMs - c.resultantLength * meanSpeed) < 1e-9 && Math.abs(v.steadiness - c.resultantLength) < 1e-9;
      },
    ),
  );
  const opp = vectorMeanWind([90, 270], [5, 5]);
  assertClose(opp.speedMs, 0, 1e-12); assert.ok(Number.isNaN(opp.dirDeg)); assertClose(opp.steadiness, 0, 1e-12);
  assert.is(vectorMeanWind([0, NaN], [0, 5]).n, 1, 'calm counts, variable with wind ignored');
});

// FMH-1 §5.4.6 derived cases (directions in degrees, speeds in kt)
test('isFmh1WindShift: FMH-1 §5.4.6 derived table', () => {
  assert.ok(isFmh1WindShift(0, 180, kt(15), min(10), 270, kt(18)), '90° in 10 min at ≥ 10 kt');
  assert.ok(isFmh1WindShift(0, 340, kt(12), min(8), 30, kt(14)), '50° across north');
  assert.not.ok(isFmh1WindShift(0, 350, kt(12), min(8), 30, kt(14)), '40° < 45°');
  assert.not.ok(isFmh1WindShift(0, 180, kt(15), min(5), 215, kt(15)), '35°');
  assert.not.ok(isFmh1WindShift(0, 180, kt(15), min(20), 270, kt(18)), '≥ 15 min');
  assert.not.ok(isFmh1WindShift(0, 180, kt(8), min(10), 270, kt(15)), 'speed < 10 kt at start');
});

test('isFmh1WindShift boundaries: 44° vs 45°, 9 kt vs 10 kt, 14 vs 15 min', () => {
  assert.not.ok(isFmh1WindShift(0, 200, kt(12), min(10), 244, kt(12)), '44°');
  assert.ok(isFmh1WindShift(0, 200, kt(12), min(10), 245, kt(12)), '45° (≥ 45)');
  assert.ok(isFmh1WindShift(0, 20, kt(12), min(10), 335, kt(12)), '45° backing across north');
  assert.not.ok(isFmh1WindShift(0, 200, kt(9), min(10), 260, kt(12)), '9 kt');
  assert.ok(isFmh1WindShift(0, 200, kt(10), min(10), 260, kt(10)), '10 kt (≥ 10)');
  assert.ok(isFmh1WindShift(0, 200, 10 * 0.514444, min(10), 260, kt(12)), '10 kt converted with a rounded factor still counts');
  assert.ok(isFmh1WindShift(0, 200, kt(12), min(14), 260, kt(12)), '14 min (< 15)');
  assert.not.ok(isFmh1WindShift(0, 200, kt(12), min(15), 260, kt(12)), '15 min (not < 15)');
  assert.not.ok(isFmh1WindShift(min(10), 200, kt(12), 0, 260, kt(12)), 'time reversed');
  assert.not.ok(isFmh1WindShift(0, NaN, kt(12), min(5), 260, kt(12)), 'NaN direction');
});

test('fmh1WindShifts on series: time = when the shift began, sustained speed throughout, no double counting', () => {
  // 5-min reports: SW 15 kt steady, then veer to NW in one step at 15 min
  const t = [0, 5, 10, 15, 20, 25].map(min);
  let s = fmh1WindShifts(t, [200, 200, 200, 300, 300, 300], [15, 15, 15, 20, 20, 20].map(kt));
  assert.is(s.length, 1);
  assert.equal(s[0], { startIndex: 2, endIndex: 3, timeMs: min(10), turnDeg: 100 });
  // gradual veer 180 → 240 in 12 min (4-min reports) reaches 45° within 15 min and continues to 300: one shift,
  // end extended to the end of the continuing veer (not two shifts)
  const t2 = [0, 4, 8, 12, 16, 20, 24].map(min);
  s = fmh1WindShifts(t2, [180, 200, 220, 240, 270, 300, 290], [12, 12, 12, 12, 12, 12, 12].map(kt));
  assert.is(s.length, 1);
  assert.equal(s[0], { startIndex: 0, endIndex: 5, timeMs: 0, turnDeg: 120 });
  // a steady 3°/min veer: 48° takes 16 min, at most 36° within < 15 min → no shift
  s = fmh1WindShifts([0, 4, 8, 12, 16].map(min), [180, 192, 204, 216, 228], [12, 12, 12, 12, 12].map(kt));
  assert.is(s.length, 0);
  // a lull below 10 kt in the middle breaks "throughout"
  s = fmh1WindShifts([0, 5, 10].map(min), [180, 220, 270], [kt(15), kt(9), kt(15)]);
  assert.is(s.length, 0);
  // 44° does not count, 45° does (series form)
  assert.is(fmh1WindShifts([0, 5].map(min), [200, 244], [kt(12), kt(12)]).length, 0);
  assert.is(fmh1WindShifts([0, 5].map(min), [200, 245], [kt(12), kt(12)]).length, 1);
  // two separate shifts (veer then back) are both found
  s = fmh1WindShifts([0, 5, 30, 35].map(min), [180, 270, 270, 180], [15, 15, 15, 15].map(kt));
  assert.equal(s.map((x) => x.turnDeg), [90, -90]);
  // KCLM 35003KT → 27013G20KT over 3 h: 80° but slow and first speed < 10 kt → not a shift (published METAR pair)
  assert.is(fmh1WindShifts([0, 180].map(min), [350, 270], [kt(3), kt(13)]).length, 0);
  assert.throws(() => fmh1WindShifts([0], [1, 2], [1]), RangeError);
});

test('fmh1Gust: FMH-1 §5.4.4 peaks vs lulls ≥ 10 kt in the last 10 min', () => {
  const t = [0, 1, 2, 3, 4, 5].map(min);
  assertClose(fmh1Gust(t, [18, 25, 14, 20, 22, 19].map(kt), min(5)).gustMs, kt(25), 1e-12, 0, 'peaks 25, lull 14 → gust 25');
  assert.ok(Number.isNaN(fmh1Gust(t, [18, 22, 14, 20, 22, 19].map(kt), min(5)).gustMs), 'peaks 22, lull 14 → none');
  assertClose(fmh1Gust(t, [15, 24, 14, 20, 22, 19].map(kt), min(5)).gustMs, kt(24), 1e-12, 0, '10 kt exactly → gust');
  assert.ok(Number.isNaN(fmh1Gust(t, [15, 23, 14, 20, 22, 19].map(kt), min(5)).gustMs), '9 kt → none');
  // window (at − 10 min, at]: the lull at t = 0 is outside for at = 10 min
  const r = fmh1Gust([0, 5, 10].map(min), [kt(5), kt(20), kt(18)], min(10));
  assert.ok(Number.isNaN(r.gustMs)); assertClose(r.lullMs, kt(18), 1e-12);
  const empty = fmh1Gust([0], [kt(5)], min(30));
  assert.ok(Number.isNaN(empty.peakMs));
  assertClose(gustFactor(15, 10), 1.5, 1e-15);
  assert.ok(Number.isNaN(gustFactor(15, 0)));
});

test.run();
