/**
 * Render one station's 5-minute series from its event schedule (NH-equivalent wind directions).
 * Background: seasonal climate, diurnal temperature cycle shaped by sunrise/sunset, cloud and wind;
 * synoptic pressure troughs and ridges, slow waves and the semidiurnal tide; wind interpolated
 * between synoptic anchors with a diurnal speed cycle, gusts and noise. Events add their signatures.
 * Magnitudes are common practice, no source, except where cited.
 */
import { WX } from '../../src/model/index.js';
import type { Rng } from './random.js';
import { dayOfYear, localSolarHour, sunTimes } from './solarClock.js';
import type { GroupPlan, Passage, StationSchedule } from './planNetwork.js';
import type { SynthSeries, TruthEvent } from './types.js';
import { climateMeanC } from './climateMean.js';

const HOUR = 3_600_000;
const DAY = 86_400_000;

interface Anchor {
  t: number;
  dir: number;
  speed: number;
}

/** Smooth 0→1 step over [a, b]. */
function smoothStep(t: number, a: number, b: number): number {
  if (t <= a) return 0;
  if (t >= b) return 1;
  const x = (t - a) / (b - a);
  return x * x * (3 - 2 * x);
}

/** Trapezoid weight: 0 before a, up to 1 at b, 1 until c, down to 0 at d (smooth ramps). */
function trapezoid(t: number, a: number, b: number, c: number, d: number): number {
  return Math.min(smoothStep(t, a, b), 1 - smoothStep(t, c, d));
}

/** Fraction of an exponential-approach change done `dtH` hours after its start, 90 % at zoneH. */
function approach(dtH: number, zoneH: number): number {
  return dtH <= 0 ? 0 : 1 - Math.pow(10, -dtH / zoneH);
}

/** Signed shortest angular difference b − a, degrees in (−180, 180]. */
function angleDiff(a: number, b: number): number {
  return ((((b - a) % 360) + 540) % 360) - 180;
}

/** Blend direction a toward b by weight w along the shortest arc. */
function blendDir(a: number, b: number, w: number): number {
  return a + angleDiff(a, b) * w;
}

/**
 * Diurnal temperature shape in [−0.5, 0.5] by local solar hour: minimum at sunrise, maximum at
 * 15 h, slow cooling to sunset, then exponential night cooling (time constant 3 h).
 */
export function diurnalShape(hour: number, sunriseH: number, sunsetH: number): number {
  const hm = 15;
  const hs = Math.min(sunriseH, hm - 1);
  const hset = Math.max(sunsetH, hm + 0.5);
  if (hour >= hs && hour < hm) return -0.5 * Math.cos((Math.PI * (hour - hs)) / (hm - hs));
  if (hour >= hm && hour < hset) return 0.5 - (0.3 * (1 - Math.cos((Math.PI * (hour - hm)) / (hset - hm)))) / 2;
  const u = (((hour - hset) % 24) + 24) % 24;
  const len = 24 - hset + hs;
  return 0.2 - (0.7 * (1 - Math.exp(-u / 3))) / (1 - Math.exp(-len / 3));
}

function pushAnchor(list: Anchor[], t: number, dir: number, speed: number, sense: 'short' | 'veer'): void {
  const prev = list[list.length - 1];
  if (!prev) {
    list.push({ t, dir, speed });
    return;
  }
  let d: number;
  if (sense === 'veer') d = (((dir - prev.dir) % 360) + 360) % 360;
  else d = angleDiff(prev.dir, dir);
  list.push({ t, dir: prev.dir + d, speed });
}

/** Synoptic wind anchors for a station from its passages. */
function windAnchors(s: StationSchedule, startMs: number, endMs: number, rng: Rng): Anchor[] {
  const list: Anchor[] = [{ t: startMs - DAY, dir: rng.uniform(0, 360), speed: rng.uniform(2.5, 4.5) }];
  const begin = (t0: number) => {
    while (list.length > 1 && list[list.length - 1]!.t >= t0 - HOUR) list.pop();
    const last = list[list.length - 1]!;
    if (t0 - last.t > 40 * HOUR) pushAnchor(list, (last.t + t0) / 2, last.dir + rng.uniform(-60, 60), rng.uniform(2.5, 4.5), 'short');
  };
  for (const p of s.passages) {
    const te = p.timeMs;
    const sh = p.shiftMin * 60000;
    if (p.kind === 'warm-front') {
      begin(te - 10 * HOUR);
      pushAnchor(list, te - 10 * HOUR, p.preDir, p.preSpeedMs * 0.8, 'short');
      pushAnchor(list, te, p.preDir, p.preSpeedMs, 'short');
      pushAnchor(list, te + sh, p.postDir, p.postSpeedMs, 'veer');
      pushAnchor(list, te + 6 * HOUR, p.postDir + 5, p.postSpeedMs, 'veer');
      continue;
    }
    if (p.prefrontalLeadH > 0) {
      const tp = te - p.prefrontalLeadH * HOUR;
      const mid = p.preDir + rng.uniform(45, 60);
      begin(tp - 8 * HOUR);
      pushAnchor(list, tp - 8 * HOUR, p.preDir, p.preSpeedMs * 0.8, 'short');
      pushAnchor(list, tp, p.preDir, p.preSpeedMs, 'short');
      pushAnchor(list, tp + 15 * 60000, mid, p.preSpeedMs * 0.9, 'veer');
      pushAnchor(list, te, mid + 4, p.preSpeedMs * 0.85, 'veer');
      const post = angleDiff(mid + 4, p.postDir) < 45 ? mid + 4 + 50 : p.postDir;
      pushAnchor(list, te + sh, post, p.postSpeedMs, 'veer');
      pushAnchor(list, te + 10 * HOUR, post + 10, p.postSpeedMs * 0.6, 'veer');
      pushAnchor(list, te + 30 * HOUR, post + 35, 3.5, 'veer');
      continue;
    }
    begin(te - 8 * HOUR);
    pushAnchor(list, te - 8 * HOUR, p.preDir, p.preSpeedMs * 0.8, 'short');
    pushAnchor(list, te, p.preDir, p.preSpeedMs, 'short');
    pushAnchor(list, te + sh, p.postDir, p.postSpeedMs, 'veer');
    pushAnchor(list, te + 10 * HOUR, p.postDir + 10, p.postSpeedMs * 0.6, 'veer');
    pushAnchor(list, te + 30 * HOUR, p.postDir + 35, 3.5, 'veer');
  }
  begin(endMs + DAY);
  pushAnchor(list, endMs + DAY, list[list.length - 1]!.dir, 3.5, 'short');
  return list;
}

/** Temperature and dew-point anomaly of the air mass from front passages at time t. */
function airmass(ps: readonly Passage[], t: number): { dT: number; dTd: number; postWeight: number } {
  let dT = 0;
  let dTd = 0;
  let postWeight = 0;
  for (const p of ps) {
    const te = p.timeMs;
    if (t < te - 12 * HOUR || t > te + 30 * DAY) continue;
    const hrs = (t - te) / HOUR;
    const tau = p.note === 'arctic' ? 80 : 54;
    const decay = Math.exp(-Math.max(0, hrs - 2 * p.zoneH) / tau);
    if (p.kind === 'warm-front') {
      const f = hrs < 0 ? 0.15 * Math.exp(hrs / 2) : 0.15 + 0.85 * approach(hrs, p.zoneH);
      dT += p.dT * f * decay;
      dTd += p.dTd * f * decay;
    } else {
      dT += p.dT * approach(hrs, p.zoneH) * decay;
      dTd += p.dTd * approach(hrs - p.dewLagH, p.zoneH * 1.2) * decay;
      if (p.kind === 'cold-front' && hrs > 0 && hrs < 14) postWeight = Math.max(postWeight, 1 - hrs / 14);
    }
  }
  return { dT, dTd, postWeight };
}

/** Pressure anomaly of troughs, ridges and warm-front falls, hPa. */
function pressureAnomaly(ps: readonly Passage[], t: number): number {
  let dp = 0;
  for (const p of ps) {
    if (p.kind === 'warm-front') {
      const tc = Number.isNaN(p.pairedColdMs) ? p.timeMs + 36 * HOUR : p.pairedColdMs;
      const fall = 1 / (1 + Math.exp(-(t - (p.timeMs - 2 * HOUR)) / (3 * HOUR)));
      const recover = t > tc ? Math.exp(-(t - tc) / (10 * HOUR)) : 1;
      dp -= p.troughHpa * fall * recover;
      continue;
    }
    if (Math.abs(t - p.timeMs) > 6 * DAY) continue;
    const tk = p.timeMs - (p.prefrontalLeadH > 0 ? p.prefrontalLeadH * HOUR : p.troughLeadMin * 60000);
    const d = p.troughHpa;
    const ta = Math.min(14, Math.max(5, d / 0.8)) * HOUR;
    const tb = Math.min(10, Math.max(4, d / 0.9)) * HOUR;
    dp -= d * (t < tk ? Math.exp((t - tk) / ta) : Math.exp(-(t - tk) / tb));
    dp += 0.6 * d * Math.exp(-(((t - tk - 22 * HOUR) / (14 * HOUR)) ** 2));
  }
  return dp;
}

export interface RenderResult {
  series: SynthSeries;
  truth: TruthEvent[];
}

/**
 * Render one station. Wind directions in the result are NH-equivalent; the caller mirrors them for
 * southern stations.
 */
export function renderStation(s: StationSchedule, group: GroupPlan, startMs: number, n: number, stepMs: number, rng: Rng): RenderResult {
  const meta = s.station.meta;
  const endMs = startMs + (n - 1) * stepMs;
  const anchors = windAnchors(s, startMs, endMs, rng.fork('wind'));
  const noise = rng.fork('noise');
  const wxRng = rng.fork('wx');
  const series: SynthSeries = {
    station: meta.id,
    length: n,
    timeMs: new Float64Array(n),
    temperatureC: new Float64Array(n),
    dewpointC: new Float64Array(n),
    windDirDeg: new Float64Array(n),
    windSpeedMs: new Float64Array(n),
    gustMs: new Float64Array(n),
    stationPressureHpa: new Float64Array(n),
    seaLevelPressureHpa: new Float64Array(n),
    precipMm: new Float64Array(n),
    weather: new Uint16Array(n),
    cloudFraction: new Float32Array(n),
  };
  const elev = Number.isFinite(meta.elevationM) ? meta.elevationM : 0;
  const bias = rng.uniform(-1, 1);
  const rangeBase = rng.uniform(11, 14);
  const depression = rng.uniform(5, 7.5);
  const stepH = stepMs / HOUR;
  const arT = Math.exp(-stepH / 1.5);
  const arTd = Math.exp(-stepH / 1.0);
  let nT = 0;
  let nTd = 0;
  let nP = 0;
  let nDir = 0;
  let nSpd = 0;
  let walk = 0;
  let ai = 0;
  let sunDoy = -1;
  let sun = { sunriseH: 6, sunsetH: 18 };
  const showerSpans = s.passages.filter((p) => p.showers && p.kind !== 'warm-front');
  for (let i = 0; i < n; i++) {
    const t = startMs + i * stepMs;
    series.timeMs[i] = t;
    const hSolar = localSolarHour(t, meta.lonDeg);
    const doy = dayOfYear(t);
    if (doy !== sunDoy) {
      sunDoy = doy;
      sun = sunTimes(doy, meta.latDeg);
    }
    const { sunriseH, sunsetH } = sun;

    // Synoptic wind from anchors.
    while (ai < anchors.length - 2 && anchors[ai + 1]!.t <= t) ai++;
    const a0 = anchors[ai]!;
    const a1 = anchors[ai + 1] ?? a0;
    const fr = a1.t > a0.t ? Math.min(1, Math.max(0, (t - a0.t) / (a1.t - a0.t))) : 0;
    let dir = a0.dir + (a1.dir - a0.dir) * fr;
    let synSpeed = a0.speed + (a1.speed - a0.speed) * fr;

    // Cloud: daily base, then event envelopes in time order.
    const dayIdx = Math.floor((t - startMs) / DAY);
    const fd = ((t - startMs) % DAY) / DAY;
    let cloud = (group.dailyCloud[dayIdx] ?? 0.4) * (1 - fd) + (group.dailyCloud[dayIdx + 1] ?? 0.4) * fd;
    for (const p of s.passages) {
      const te = p.timeMs;
      if (Math.abs(t - te) > 3 * DAY) continue;
      if (p.kind === 'warm-front') {
        const w = trapezoid(t, te - (p.rainLeadH + 8) * HOUR, te - p.rainLeadH * HOUR, te + HOUR, te + 5 * HOUR);
        cloud = cloud * (1 - w) + 1 * w;
      } else {
        const tp = te - p.prefrontalLeadH * HOUR;
        const w = trapezoid(t, tp - 4 * HOUR, tp - HOUR, te + 2 * HOUR, te + 10 * HOUR);
        cloud = cloud * (1 - w) + 0.9 * w;
        const wc = trapezoid(t, te + 6 * HOUR, te + 12 * HOUR, te + 30 * HOUR, te + 40 * HOUR);
        cloud = cloud * (1 - wc) + (p.note === 'arctic' ? 0.5 : 0.15) * wc;
      }
    }
    let rangeC = rangeBase;
    let calmW = 0;
    let calmSpeed = 0;
    for (const c of s.calmNights) {
      const w = trapezoid(t, c.sunsetMs - 4 * HOUR, c.sunsetMs - 2 * HOUR, c.sunriseMs + HOUR, c.sunriseMs + 3 * HOUR);
      if (w > 0) {
        cloud *= 1 - w;
        rangeC = rangeC * (1 - w) + c.rangeC * w;
        calmW = Math.max(calmW, w);
        calmSpeed = c.speedMs;
      }
    }
    let seaW = 0;
    let sea = s.seaBreezes[0];
    for (const b of s.seaBreezes) {
      const w = trapezoid(t, b.onsetMs, b.onsetMs + 45 * 60000, b.endMs, b.endMs + 90 * 60000);
      if (w > seaW) {
        seaW = w;
        sea = b;
      }
      const wc = trapezoid(t, b.onsetMs - 4 * HOUR, b.onsetMs - 2 * HOUR, b.endMs, b.endMs + 2 * HOUR);
      cloud = Math.min(cloud, cloud * (1 - wc) + 0.2 * wc);
    }
    let dryW = 0;
    let dryD = s.drylines[0];
    for (const d of s.drylines) {
      const w = Math.min(approach((t - d.timeMs) / HOUR, d.zoneH), 1 - approach((t - d.retreatMs) / HOUR, d.retreatZoneH));
      if (w > dryW) {
        dryW = w;
        dryD = d;
      }
    }
    if (dryW > 0) cloud = cloud * (1 - dryW) + 0.1 * dryW;
    let outT = 0;
    let outP = 0;
    let outW = 0;
    let out = s.outflows[0];
    for (const o of s.outflows) {
      const dtH = (t - o.timeMs) / HOUR;
      if (dtH < -2 || dtH > 6) continue;
      const rise = 10 / 60;
      const tau = o.recoveryH / 2.3;
      const w = dtH < 0 ? 0 : Math.min(1, dtH / rise) * Math.exp(-Math.max(0, dtH - rise) / tau);
      const wp = dtH < 0 ? 0 : Math.min(1, dtH / (5 / 60)) * Math.exp(-Math.max(0, dtH - 5 / 60) / (tau * 0.5));
      cloud = Math.max(cloud, trapezoid(t, o.timeMs - HOUR, o.timeMs - 0.3 * HOUR, o.timeMs + 0.5 * HOUR, o.timeMs + 2 * HOUR));
      if (w > outW) {
        outW = w;
        out = o;
      }
      outT += o.dT * w;
      outP += o.jumpHpa * wp;
    }
    cloud = Math.min(1, Math.max(0, cloud));

    // Wind: overrides, diurnal speed cycle, noise.
    synSpeed = synSpeed * (1 - calmW) + calmSpeed * calmW;
    if (seaW > 0 && sea) {
      dir = blendDir(dir, sea.onshoreDir, seaW);
      synSpeed = synSpeed * (1 - seaW) + sea.speedMs * seaW;
    }
    if (dryW > 0 && dryD) {
      dir = blendDir(dir, dryD.dryDir, dryW);
      synSpeed += 2 * dryW;
    }
    const mixing = 0.8 + 0.5 * Math.max(0, Math.sin((Math.PI * (hSolar - 8)) / 12));
    const { dT: amT, dTd: amTd, postWeight } = airmass(s.passages, t);
    let speed = synSpeed * (calmW > 0.5 ? 1 : mixing);
    if (outW > 0 && out) {
      dir = blendDir(dir, out.fromDir, Math.min(1, outW * 1.3));
      speed += 10 * outW;
    }
    nSpd = 0.9 * nSpd + 0.3 * noise.normal();
    speed = Math.max(0, speed * (1 + 0.12 * nSpd));
    nDir = 0.85 * nDir + noise.normal() * (3 + 12 / (1 + speed));
    if (speed < 2) walk = 0.97 * walk + noise.normal() * 12;
    else walk *= 0.9;
    dir += nDir + walk;
    let gust: number;
    if (speed >= 3) gust = speed * (1.25 + 0.3 * noise.next() + 0.25 * postWeight) + (cloud > 0.7 && hSolar > 10 && hSolar < 19 ? noise.next() * 2 : 0);
    else gust = speed + noise.next();
    if (outW > 0 && out) gust = Math.max(gust, out.gustMs * outW + speed * 0.3);

    // Temperature and dew point.
    const windFactor = 1 / (1 + 0.06 * Math.max(0, synSpeed - 2));
    const rangeNow = rangeC * (1 - 0.65 * cloud) * windFactor;
    const shape = diurnalShape(hSolar, sunriseH, sunsetH);
    const base = climateMeanC(t, meta.latDeg) - 0.0065 * elev + bias;
    nT = arT * nT + Math.sqrt(1 - arT * arT) * 0.25 * noise.normal();
    nTd = arTd * nTd + Math.sqrt(1 - arTd * arTd) * 0.3 * noise.normal();
    let temp = base + amT + rangeNow * shape + nT;
    let dew = base - depression + amTd + 0.08 * rangeNow * shape + nTd;
    // A dryline separates warm, moist air from dry air (Schaefer1986): on its day the moist side is lifted to
    // a warm-sector dew point of about 13 °C before the dry air arrives (no random draws, so nothing else moves).
    let moistW = 0;
    for (const d of s.drylines) moistW = Math.max(moistW, trapezoid(t, d.timeMs - 18 * HOUR, d.timeMs - 10 * HOUR, d.retreatMs + 2 * HOUR, d.retreatMs + 8 * HOUR));
    if (moistW > 0) {
      temp += 6 * moistW;
      dew += Math.max(0, 13 - dew) * moistW;
      dew = Math.min(dew, temp - 1);
    }
    if (dryW > 0 && dryD) {
      temp += dryD.dT * dryW;
      dew += dryD.dTd * dryW;
    }
    if (seaW > 0 && sea) {
      temp += sea.dT * seaW;
      dew += sea.dTd * seaW;
    }
    if (outW > 0 && out) dew += out.dTd * outW;
    temp += outT;
    dew = Math.min(dew, temp - 0.1);

    // Pressure.
    let slp = group.basePressureHpa + pressureAnomaly(s.passages, t) + outP;
    for (const wv of group.pressureWaves) slp += wv.amplitudeHpa * Math.sin((2 * Math.PI * (t - startMs)) / (wv.periodDays * DAY) + wv.phase);
    slp += 0.5 * Math.cos((2 * Math.PI * (hSolar - 10)) / 12);
    nP = 0.9 * nP + 0.03 * noise.normal();
    slp += nP;
    const tMeanK = temp + 273.15 + 0.0065 * elev * 0.5;
    const stn = slp * Math.exp((-9.80665 * elev) / (287.05 * tMeanK));

    // Precipitation and weather.
    let precip = 0;
    let wx = 0;
    for (const p of showerSpans) {
      const te = p.timeMs;
      if (t >= te - 10 * 60000 && t <= te + p.showerMin * 60000) {
        if (wxRng.chance(0.85)) {
          precip += (p.rainRateMmH * stepH) * (0.5 + wxRng.next());
          wx |= WX.PRECIP | WX.SHOWER | (temp < 1 ? WX.SNOW : WX.RAIN);
          if (p.thunder && t < te + 0.6 * p.showerMin * 60000) wx |= WX.THUNDER | WX.CONVECTIVE;
        }
      }
    }
    for (const p of s.passages) {
      if (p.kind !== 'warm-front') continue;
      if (t >= p.timeMs - p.rainLeadH * HOUR && t <= p.timeMs - 0.3 * HOUR && wxRng.chance(0.8)) {
        const r = p.rainRateMmH * stepH * (0.5 + wxRng.next());
        precip += r;
        wx |= WX.PRECIP | (temp < 0.5 ? WX.SNOW : p.rainRateMmH < 0.5 ? WX.DRIZZLE : WX.RAIN);
      }
    }
    for (const o of s.outflows) {
      if (t >= o.timeMs - 2 * 60000 && t <= o.timeMs + o.rainMin * 60000) {
        precip += o.rainMmH * stepH * (0.6 + 0.8 * wxRng.next());
        wx |= WX.PRECIP | WX.RAIN | WX.SHOWER | WX.HEAVY | WX.THUNDER | WX.CONVECTIVE;
      }
    }
    if (precip === 0 && temp - dew < 0.6 && speed < 1.5) wx |= WX.FOG;

    if (speed < 0.3) {
      speed = 0;
      gust = 0;
      dir = 0;
    }
    series.temperatureC[i] = Math.round(temp * 10) / 10;
    series.dewpointC[i] = Math.round(dew * 10) / 10;
    series.windDirDeg[i] = speed === 0 ? 0 : Math.round(((dir % 360) + 360) % 360) % 360;
    series.windSpeedMs[i] = Math.round(speed * 10) / 10;
    series.gustMs[i] = Math.round(Math.max(gust, speed) * 10) / 10;
    series.seaLevelPressureHpa[i] = Math.round(slp * 10) / 10;
    series.stationPressureHpa[i] = Math.round(stn * 10) / 10;
    series.precipMm[i] = Math.round(precip * 10) / 10;
    series.weather[i] = wx;
    series.cloudFraction[i] = cloud;
  }
  return { series, truth: truthFor(s, rng) };
}

const norm = (d: number) => ((Math.round(d) % 360) + 360) % 360;

/** Truth records of one station (NH-equivalent directions). */
function truthFor(s: StationSchedule, _rng: Rng): TruthEvent[] {
  const id = s.station.meta.id;
  const out: TruthEvent[] = [];
  for (const p of s.passages) {
    const zoneEnd = p.kind === 'warm-front' ? p.timeMs + p.zoneH * Math.log10(0.85 / 0.1) * HOUR : p.timeMs + p.zoneH * HOUR;
    out.push({
      station: id,
      kind: p.kind,
      timeMs: p.timeMs,
      zoneEndMs: Math.round(zoneEnd),
      tempChangeC: Math.round(p.dT * 10) / 10,
      dewpointChangeC: Math.round(p.dTd * 10) / 10,
      windBeforeDeg: norm(p.preDir),
      windAfterDeg: norm(p.postDir),
      frontId: p.frontId,
      note: p.note,
      isDecoy: false,
    });
    if (p.prefrontalLeadH > 0) {
      out.push({ station: id, kind: 'prefrontal-trough', timeMs: Math.round(p.timeMs - p.prefrontalLeadH * HOUR), frontId: p.frontId, note: 'wind shift and pressure trough ahead of the cold front', isDecoy: true });
    }
  }
  for (const d of s.drylines) {
    out.push({ station: id, kind: 'dryline', timeMs: d.timeMs, zoneEndMs: Math.round(d.timeMs + d.zoneH * HOUR), tempChangeC: Math.round(d.dT * 10) / 10, dewpointChangeC: Math.round(d.dTd * 10) / 10, windAfterDeg: norm(d.dryDir), frontId: d.id, isDecoy: false });
    out.push({ station: id, kind: 'dryline-retreat', timeMs: d.retreatMs, zoneEndMs: Math.round(d.retreatMs + d.retreatZoneH * HOUR), dewpointChangeC: Math.round(-d.dTd * 10) / 10, frontId: d.id, isDecoy: true });
  }
  for (const o of s.outflows) {
    out.push({ station: id, kind: 'outflow-boundary', timeMs: o.timeMs, zoneEndMs: Math.round(o.timeMs + o.recoveryH * HOUR), tempChangeC: Math.round(o.dT * 10) / 10, windAfterDeg: norm(o.fromDir), isDecoy: true });
  }
  for (const b of s.seaBreezes) {
    out.push({ station: id, kind: 'sea-breeze-front', timeMs: b.onsetMs, zoneEndMs: b.endMs, tempChangeC: Math.round(b.dT * 10) / 10, dewpointChangeC: Math.round(b.dTd * 10) / 10, windAfterDeg: norm(b.onshoreDir), isDecoy: true });
  }
  for (const c of s.calmNights) {
    out.push({ station: id, kind: 'night-cooling', timeMs: Math.round(c.sunsetMs - HOUR), zoneEndMs: Math.round(c.sunriseMs), tempChangeC: -Math.round(c.rangeC * 0.73 * 10) / 10, isDecoy: true });
  }
  out.sort((a, b) => a.timeMs - b.timeMs);
  return out;
}
