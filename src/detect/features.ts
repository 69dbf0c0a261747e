/**
 * Measurements around a candidate passage time on the detection grid: the quantities a forecaster
 * looks at (wind before/after and its turn, temperature, dew point and θe change, pressure trough,
 * jump and rise, gusts, precipitation, recovery) plus the transition zone.
 */
import type { StationSeries } from '../series/series.js';
import { WX } from '../ingest/types.js';
import { cleanColumn } from '../qc/qc.js';
import { fmh1WindShifts, signedTurnDeg, windFromComponents } from '../physics/wind.js';
import type { DetectGrid } from './grid.js';
import { argExtremeIn, at, meanIn } from './window.js';
import { MS_PER_HOUR } from '../physics/constants.js';
import { solarHour as solarHourAt } from '../physics/sun.js';

export interface Features {
  /** Grid index of the anchor (leading edge estimate). */
  index: number;
  timeMs: number;
  windBeforeDeg: number;
  windAfterDeg: number;
  speedBeforeMs: number;
  speedAfterMs: number;
  /** Signed turn, + veering. */
  turnDeg: number;
  /** Observed temperature change to the end of the zone (°C). */
  tempChangeC: number;
  /** Diurnally adjusted temperature change over the steep frontal change (°C). */
  frontalChangeAdjC: number;
  /** Diurnally adjusted temperature change to the extreme within 6 h (°C). */
  tempAdjChangeC: number;
  /** Largest adjusted fall (negative) or rise within 30 min around the anchor. */
  abruptChangeC: number;
  /** Fraction of the adjusted temperature change undone within 3 h after the extreme. */
  recoveryFraction: number;
  dewpointChangeC: number;
  /** Most negative dew-point change to any time within 3 h after (for drylines). */
  dewpointDropMaxC: number;
  thetaEChangeK: number;
  pressureMinHpa: number;
  pressureMinTimeMs: number;
  /** Pressure change in the 3 h before the minimum (negative = falling ahead). */
  pressureFallBeforeHpa: number;
  /** Pressure change in the 3 h after the minimum. */
  pressureRiseAfterHpa: number;
  /** Pressure change from the anchor to 3 h after it. */
  pressureRise3hHpa: number;
  /** Largest 30-min pressure rise near the anchor (mesohigh jump). */
  pressureJumpHpa: number;
  gustMaxMs: number;
  precipNear: boolean;
  convectiveNear: boolean;
  /** The raw reports within 30 min of the anchor hold an FMH-1 §5.4.6 wind shift (`fmh1WindShifts`). */
  fmh1WindShiftNear: boolean;
  /** Local solar hour at the anchor (NaN without longitude). */
  solarHour: number;
  zoneEndMs: number;
  zoneHours: number;
  /** Zone end from the dew-point fall (for drylines and other moisture boundaries), epoch ms. */
  moistureZoneEndMs: number;
  /** Slow (warm-front scale) changes: adjusted temperature and dew point 3–5 h after minus 2 h before; wind turn between 3–0.5 h before and 1.5–4 h after. */
  tempAdjChangeLongC: number;
  dewpointChangeLongC: number;
  turnLongDeg: number;
  windAfterLongDeg: number;
  /** Hours from the anchor until a fifth of the temperature change, or 1 °C if less, is done (large = the change starts later). */
  onsetDelayH: number;
  /** Pressure change over the 3 h before the anchor (hPa). */
  pressureChangeBefore3hHpa: number;
  /** Mean dew point in the hour before (°C). */
  dewpointBeforeC: number;
  /** Mean dew-point depression in the hour before (°C): small under cloud and rain. */
  depressionBeforeC: number;
  /** Angle between the wind before and the mean wind 1.5–3 h after (small = the wind went back). */
  windReturnDeg: number;
  /** Pressure change from the highest value near the anchor to 2–3 h later (negative after a mesohigh). */
  pressureFallAfterPeakHpa: number;
}

/** QC-clean raw columns used near each candidate (made once per station). */
export interface RawColumns {
  gust: Float64Array;
  peak: Float64Array;
  spd: Float64Array;
  dir: Float64Array;
  tC: Float64Array;
  tdC: Float64Array;
  /** Direction resolution of the reports, degrees (10 for METAR-style tens of degrees, else 1). */
  dirResolutionDeg: number;
}

export function rawColumns(s: StationSeries): RawColumns {
  const dir = cleanColumn(s, 'windDirDeg');
  let tens = true;
  for (let i = 0; i < dir.length && tens; i++) if (dir[i]! === dir[i]! && dir[i]! % 10 !== 0) tens = false;
  return {
    dirResolutionDeg: tens ? 10 : 1,
    gust: cleanColumn(s, 'gustMs'),
    peak: cleanColumn(s, 'peakWindMs'),
    spd: cleanColumn(s, 'windSpeedMs'),
    dir,
    tC: cleanColumn(s, 'temperatureC'),
    tdC: cleanColumn(s, 'dewpointC'),
  };
}

/** Vector-mean wind over [lo, hi) grid indices. */
function meanWind(g: DetectGrid, lo: number, hi: number): { dirDeg: number; speedMs: number; scalarSpeedMs: number } {
  const u = meanIn(g.uMs, lo, hi);
  const v = meanIn(g.vMs, lo, hi);
  const w = windFromComponents(u, v);
  return { dirDeg: w.dirDeg, speedMs: w.speedMs, scalarSpeedMs: meanIn(g.speedMs, lo, hi) };
}

/** Measure the features of a candidate at grid index i. `tSmooth` is the 30-min running mean of tAdjC. */
export function measure(g: DetectGrid, s: StationSeries, raw: RawColumns, i: number, tSmooth: Float64Array, tRawSmooth: Float64Array): Features {
  const perH = MS_PER_HOUR / g.stepMs;
  const before = meanWind(g, i - 2 * perH, i - Math.max(1, perH / 6));
  const after = meanWind(g, i + Math.max(1, perH / 3), i + 2 * perH);
  const beforeLong = meanWind(g, i - 3 * perH, i - perH / 2);
  const afterLong = meanWind(g, i + 1.5 * perH, i + 4 * perH);
  const turnDeg = before.speedMs > 0.3 && after.speedMs > 0.3 ? signedTurnDeg(before.dirDeg, after.dirDeg) : NaN;

  // Temperature: level in the hour before, then the extreme within 6 h in the direction of the 2–3.5 h change.
  const tb = meanIn(g.tAdjC, i - perH, i + 1);
  const tbRaw = meanIn(g.tC, i - perH, i + 1);
  const later = meanIn(g.tAdjC, i + 1.5 * perH, i + 3 * perH) - tb;
  const sign = later < 0 ? 1 : -1; // 1 → look for a minimum
  const ext = argExtremeIn(tSmooth, i, i + 6 * perH + 1, sign);
  const tempAdjChangeC = ext >= 0 ? tSmooth[ext]! - tb : NaN;
  // End of the frontal change: after the steepest part, where the rate of change has dropped to a small
  // fraction of its peak; slower changes beyond it are air-mass modification or the diurnal residual.
  const changeEnd = ext >= 0 ? endOfSteepChange(tSmooth, i, ext, Math.max(1, Math.round(perH / 4)), -sign, 0.07) : -1;
  const frontalChange = changeEnd >= 0 ? tSmooth[changeEnd]! - tb : NaN;
  // Zone end: first time 90 % of the frontal change is complete (leading edge to 90 %).
  let zoneEnd = changeEnd;
  if (changeEnd >= 0 && Math.abs(frontalChange) > 0) {
    for (let k = i; k <= changeEnd; k++) {
      const d = tSmooth[k]! - tb;
      if (d === d && d / frontalChange >= 0.9) {
        zoneEnd = k;
        break;
      }
    }
  }
  let onset = -1;
  if (ext >= 0 && Math.abs(tempAdjChangeC) > 0) {
    for (let k = i; k <= ext; k++) {
      const d = tSmooth[k]! - tb;
      if (d === d && d / tempAdjChangeC >= Math.min(0.2, 1 / Math.abs(tempAdjChangeC))) {
        onset = k;
        break;
      }
    }
  }
  const tempChangeC = changeEnd >= 0 ? at(tRawSmooth, changeEnd) - tbRaw : NaN;
  // Abrupt change within 30 min around the anchor.
  let abrupt = 0;
  const w30 = Math.max(1, Math.round(perH / 2));
  for (let k = Math.max(0, i - w30); k <= i + perH && k + w30 < g.n; k++) {
    const d = g.tAdjC[k + w30]! - g.tAdjC[k]!;
    if (d === d && Math.abs(d) > Math.abs(abrupt) && Math.sign(d) === -sign) abrupt = d;
  }
  // Recovery within 3 h after the extreme.
  let recoveryFraction = 0;
  if (ext >= 0 && Math.abs(tempAdjChangeC) > 0.5) {
    const rec = argExtremeIn(tSmooth, ext, ext + 3 * perH + 1, -sign);
    if (rec >= 0) recoveryFraction = (tSmooth[rec]! - tSmooth[ext]!) / -tempAdjChangeC;
    // The observed temperature must come back too: an adjusted "recovery" alone is the diurnal expectation.
    const recRaw = argExtremeIn(tRawSmooth, ext, ext + 3 * perH + 1, -sign);
    const rawBack = recRaw >= 0 ? (tRawSmooth[recRaw]! - tRawSmooth[ext]!) / -tempAdjChangeC : 0;
    recoveryFraction = Math.min(recoveryFraction, rawBack);
  }
  // Moisture.
  const tdb = meanIn(g.tdC, i - perH, i + 1);
  const dewpointChangeC = meanIn(g.tdC, i + 1 * perH, i + 3 * perH) - tdb;
  const tdMinIdx = argExtremeIn(g.tdC, i, i + 3 * perH + 1, 1);
  const dewpointDropMaxC = tdMinIdx >= 0 ? g.tdC[tdMinIdx]! - tdb : NaN;
  let moistureZoneEnd = -1;
  if (tdMinIdx > i && dewpointDropMaxC < 0) {
    const end = endOfSteepChange(g.tdC, i, tdMinIdx, Math.max(1, Math.round(perH / 4)), -1, 0.07);
    const total = g.tdC[end]! - tdb;
    for (let k = i; k <= end; k++) {
      const d = g.tdC[k]! - tdb;
      if (d === d && d / total >= 0.9) {
        moistureZoneEnd = k;
        break;
      }
    }
  }
  const thetaEChangeK = meanIn(g.thetaEK, i + 1 * perH, i + 3 * perH) - meanIn(g.thetaEK, i - perH, i + 1);
  // Pressure.
  const pm = argExtremeIn(g.pHpa, i - 3 * perH, i + 1 * perH + 1, 1);
  const pMin = pm >= 0 ? g.pHpa[pm]! : NaN;
  const pressureFallBeforeHpa = pm >= 0 ? pMin - meanIn(g.pHpa, pm - 3.25 * perH, pm - 2.75 * perH) : NaN;
  const pressureRiseAfterHpa = pm >= 0 ? meanIn(g.pHpa, pm + 2.75 * perH, pm + 3.25 * perH) - pMin : NaN;
  const pressureRise3hHpa = meanIn(g.pHpa, i + 2.75 * perH, i + 3.25 * perH) - meanIn(g.pHpa, i - 0.25 * perH, i + 0.25 * perH);
  let jump = 0;
  for (let k = Math.max(0, i - w30); k <= i + perH && k + w30 < g.n; k++) {
    const d = g.pHpa[k + w30]! - g.pHpa[k]!;
    if (d === d && d > jump) jump = d;
  }
  const pPeak = argExtremeIn(g.pHpa, i - 0.5 * perH, i + perH + 1, -1);
  const pressureFallAfterPeakHpa = pPeak >= 0 ? meanIn(g.pHpa, i + 2 * perH, i + 3 * perH) - g.pHpa[pPeak]! : NaN;
  const back = meanWind(g, i + 1.5 * perH, i + 3 * perH);
  const windReturnDeg = before.speedMs > 0.3 && back.speedMs > 0.3 ? Math.abs(signedTurnDeg(before.dirDeg, back.dirDeg)) : NaN;
  // Raw reports near the anchor: gusts, precipitation, convection.
  const tMs = g.timeMs[i]!;
  const { gust, peak, spd } = raw;
  let gustMax = NaN;
  let precipNear = false;
  let convectiveNear = false;
  for (let k = lowerBound(s.timeMs, tMs - MS_PER_HOUR); k < s.length && s.timeMs[k]! <= tMs + 2 * MS_PER_HOUR; k++) {
    const cand = Math.max(gust[k]! || 0, peak[k]! || 0, spd[k]! || 0);
    if (cand > 0 && !(cand <= gustMax)) gustMax = cand;
    if (Math.abs(s.timeMs[k]! - tMs) <= MS_PER_HOUR) {
      if (s.weather[k]! & WX.PRECIP || s.precipMm[k]! > 0) precipNear = true;
      if (s.weather[k]! & (WX.THUNDER | WX.CONVECTIVE | WX.HAIL | WX.SQUALL)) convectiveNear = true;
    }
  }
  const kLo = lowerBound(s.timeMs, tMs - 0.5 * MS_PER_HOUR);
  const kHi = lowerBound(s.timeMs, tMs + 0.5 * MS_PER_HOUR + 1);
  const fmh1WindShiftNear = kHi - kLo >= 2 && fmh1WindShifts(s.timeMs.subarray(kLo, kHi), raw.dir.subarray(kLo, kHi), spd.subarray(kLo, kHi)).length > 0;
  const lon = s.meta?.lonDeg;
  const solarHour = lon === undefined ? NaN : solarHourAt(tMs, lon);
  const zoneEndMs = zoneEnd >= 0 ? g.timeMs[zoneEnd]! : NaN;
  return {
    index: i,
    timeMs: tMs,
    windBeforeDeg: before.dirDeg,
    windAfterDeg: after.dirDeg,
    speedBeforeMs: before.scalarSpeedMs,
    speedAfterMs: after.scalarSpeedMs,
    turnDeg,
    tempChangeC,
    tempAdjChangeC,
    frontalChangeAdjC: frontalChange,
    abruptChangeC: abrupt,
    recoveryFraction,
    dewpointChangeC,
    dewpointDropMaxC,
    thetaEChangeK,
    pressureMinHpa: pMin,
    pressureMinTimeMs: pm >= 0 ? g.timeMs[pm]! : NaN,
    pressureFallBeforeHpa,
    pressureRiseAfterHpa,
    pressureRise3hHpa,
    pressureJumpHpa: jump,
    gustMaxMs: gustMax,
    precipNear,
    convectiveNear,
    fmh1WindShiftNear,
    solarHour,
    zoneEndMs,
    zoneHours: (zoneEndMs - tMs) / MS_PER_HOUR,
    moistureZoneEndMs: moistureZoneEnd >= 0 ? g.timeMs[moistureZoneEnd]! : NaN,
    windReturnDeg,
    pressureFallAfterPeakHpa,
    depressionBeforeC: tbRaw - tdb,
    dewpointBeforeC: tdb,
    onsetDelayH: onset >= 0 ? (onset - i) / perH : NaN,
    pressureChangeBefore3hHpa: meanIn(g.pHpa, i - 0.25 * perH, i + 0.25 * perH) - meanIn(g.pHpa, i - 3.25 * perH, i - 2.75 * perH),
    tempAdjChangeLongC: meanIn(g.tAdjC, i + 3 * perH, i + 5 * perH) - meanIn(g.tAdjC, i - 2 * perH, i),
    dewpointChangeLongC: meanIn(g.tdC, i + 3 * perH, i + 5 * perH) - meanIn(g.tdC, i - 2 * perH, i),
    turnLongDeg: beforeLong.speedMs > 0.3 && afterLong.speedMs > 0.3 ? signedTurnDeg(beforeLong.dirDeg, afterLong.dirDeg) : NaN,
    windAfterLongDeg: afterLong.dirDeg,
  };
}

/**
 * End of the steep part of a change in `v` between `from` and `to` (indices): the first index after the
 * steepest point where the rate in the direction `dir` (+1 rising, −1 falling), measured over ±`half`
 * samples, has fallen below `fraction` of its peak; `to` when it never does. common practice, no source.
 */
export function endOfSteepChange(v: ArrayLike<number>, from: number, to: number, half: number, dir: number, fraction: number): number {
  const rate = (k: number) => dir * ((v[Math.min(v.length - 1, k + half)]! - v[Math.max(0, k - half)]!) / (2 * half));
  let kMax = -1;
  let rMax = 0;
  for (let k = from; k <= to; k++) {
    const r = rate(k);
    if (r > rMax) {
      rMax = r;
      kMax = k;
    }
  }
  if (kMax < 0) return to;
  for (let k = kMax + 1; k <= to; k++) {
    const r = rate(k);
    if (!(r >= fraction * rMax)) return k;
  }
  return to;
}

/** First index with t[k] ≥ x in a sorted array. */
export function lowerBound(t: ArrayLike<number>, x: number): number {
  let lo = 0;
  let hi = t.length;
  while (lo < hi) {
    const m = (lo + hi) >> 1;
    if (t[m]! < x) lo = m + 1;
    else hi = m;
  }
  return lo;
}
