/**
 * Encode a synthetic 5-minute series as US-style METAR/SPECI archive lines
 * (WMO-No. 306 FM 15/FM 16 body; FMH-1 remarks). One line per report:
 * `YYYYMMDDHHMM METAR KXXX DDHHMMZ dddffGggKT 10SM FEW030 T/Td A2992 RMK AO2 SLPppp T0TTT1TTT ...`
 */
import { WX, type StationMeta } from '../../src/model/index.js';
import { makeRng } from './random.js';
import type { SynthSeries, TruthEvent } from './types.js';

/** 1 kt = 1852/3600 m/s exactly (definition of the international nautical mile). */
const MS_PER_KT = 1852 / 3600;
/** Conventional inch of mercury, hPa (NIST SP 811 App. B.8: 3386.389 Pa). */
const HPA_PER_INHG = 33.86389;
const MM_PER_IN = 25.4;

export interface MetarOptions {
  /** Minute of the hourly routine report, 51 or 53 (default 51). */
  routineMinute?: number;
  /** Issue SPECIs on wind shifts and on the start of precipitation or thunder (default true). */
  speci?: boolean;
  /** Truth list: frontal passages at this station may carry an observer `WSHFT hhmm FROPA` remark. */
  truth?: readonly TruthEvent[];
  /** Probability that a cold-front passage gets the FROPA remark (default 0.5). */
  fropaRemarkProbability?: number;
  /** Prefix each line with the archive timestamp `YYYYMMDDHHMM` (default true). */
  archivePrefix?: boolean;
  /** Exact duplicate lines to insert (default 0). */
  duplicates?: number;
  /** Damaged lines to insert (truncated or garbled, default 0). */
  badLines?: number;
  /** Seed for the encoder's own choices (remarks, VRB, damage). */
  seed?: number;
}

const pad = (n: number, w: number) => String(Math.abs(Math.trunc(n))).padStart(w, '0');

/** METAR temperature token: whole °C, `M` for negative; from tenths so (−0.5, 0) gives `M00` (AFMAN 15-111 Att. 3). */
export function metarTempToken(c: number): string {
  if (Number.isNaN(c)) return '';
  const tenths = Math.round(c * 10);
  const whole = Math.round(tenths / 10);
  if (tenths < 0) return 'M' + pad(-whole, 2);
  return pad(whole, 2);
}

/** FMH-1 `T` remark group value part for one temperature: sign digit (1 = negative) + tenths. @example tGroupPart(-1.5) // '1015' */
export function tGroupPart(c: number): string {
  const t = Math.round(c * 10);
  return (t < 0 ? '1' : '0') + pad(Math.abs(t), 3);
}

/**
 * Altimeter setting from station pressure, Smithsonian Meteorological Tables (List 1951) p. 269 in the
 * NWS form A = ((p − 0.3)^0.190284 + 8.4228807e-5 · H)^(1/0.190284), hPa; NaN propagates.
 * @example altimeterHpaFromStation(1013.25, 0) // ≈ 1012.95
 */
export function altimeterHpaFromStation(stationHpa: number, elevationM: number): number {
  const n = 0.190284;
  return Math.pow(Math.pow(stationHpa - 0.3, n) + 8.4228807e-5 * elevationM, 1 / n);
}

function windGroup(dirDeg: number, speedMs: number, gustMs: number, vrb: boolean): string {
  if (Number.isNaN(speedMs) || Number.isNaN(dirDeg)) return '/////KT';
  const kt = Math.round(speedMs / MS_PER_KT);
  if (kt < 1) return '00000KT';
  const g = Number.isNaN(gustMs) ? 0 : Math.round(gustMs / MS_PER_KT);
  // Gust when peaks exceed the mean by 5 kt or more (peak–lull spread ≥ 10 kt), FMH-1 §5.4.4 approximated.
  const gustTxt = g - kt >= 5 && g >= 12 ? 'G' + pad(g, 2) : '';
  if (vrb && kt <= 3) return `VRB${pad(kt, 2)}KT`;
  let d = Math.round(dirDeg / 10) * 10;
  if (d === 0) d = 360;
  return `${pad(d, 3)}${pad(kt, 2)}${gustTxt}KT`;
}

function weatherTokens(wx: number, precipRateMmH: number): string {
  const out: string[] = [];
  if (wx & WX.PRECIP) {
    const heavy = wx & WX.HEAVY || precipRateMmH > 7.6;
    const light = !heavy && precipRateMmH < 2.5;
    const intensity = heavy ? '+' : light ? '-' : '';
    const ph = wx & WX.SNOW ? 'SN' : wx & WX.DRIZZLE ? 'DZ' : 'RA';
    if (wx & WX.THUNDER) out.push(`${intensity}TS${ph}`);
    else if (wx & WX.SHOWER) out.push(`${intensity}SH${ph}`);
    else out.push(`${intensity}${ph}`);
  } else if (wx & WX.THUNDER) out.push('TS');
  if (wx & WX.FOG) out.push(wx & WX.PRECIP ? 'BR' : 'FG');
  return out.join(' ');
}

function visibility(wx: number, rate: number): string {
  if (wx & WX.FOG && !(wx & WX.PRECIP)) return '1/2SM';
  if (wx & WX.HEAVY || rate > 7.6) return '1 1/2SM';
  if (wx & WX.SNOW) return '2SM';
  if (wx & WX.PRECIP) return rate > 2.5 ? '3SM' : '6SM';
  return '10SM';
}

function skyGroup(cloud: number, wx: number): string {
  if (wx & WX.FOG && !(wx & WX.PRECIP)) return 'VV002';
  const low = wx & WX.PRECIP ? (wx & WX.THUNDER ? '035CB' : '025') : '050';
  if (cloud < 0.08) return 'CLR';
  if (cloud < 0.3) return `FEW${low.slice(0, 3)} SCT250`;
  if (cloud < 0.6) return `SCT${low}`;
  if (cloud < 0.9) return `BKN${low}`;
  return `OVC${low}`;
}

const utcStamp = (t: number) => {
  const d = new Date(t);
  return `${d.getUTCFullYear()}${pad(d.getUTCMonth() + 1, 2)}${pad(d.getUTCDate(), 2)}${pad(d.getUTCHours(), 2)}${pad(d.getUTCMinutes(), 2)}`;
};

/**
 * Encode a series as METAR/SPECI lines in time order.
 * Values of a report are those of the 5-min sample at or just before the report minute; the gust is
 * the highest 5-min gust in the last 10 minutes; the precipitation group is the amount since the
 * previous routine report (hundredths of an inch, `P0000` for a trace).
 */
export function toMetarLines(series: SynthSeries, meta: StationMeta, opts: MetarOptions = {}): string[] {
  const rng = makeRng(opts.seed ?? 1);
  const minute = opts.routineMinute ?? 51;
  const n = series.length;
  if (n === 0) return [];
  const t0 = series.timeMs[0]!;
  const step = n > 1 ? series.timeMs[1]! - t0 : 300000;
  const idxAt = (t: number) => Math.min(n - 1, Math.max(0, Math.floor((t - t0) / step)));
  const elev = Number.isFinite(meta.elevationM) ? meta.elevationM : 0;
  const fropaP = opts.fropaRemarkProbability ?? 0.5;
  const fronts = (opts.truth ?? []).filter((e) => e.station === meta.id && (e.kind === 'cold-front' || e.kind === 'warm-front') && !e.isDecoy);
  const remarkFor = new Map<number, string>();
  for (const f of fronts) {
    if (f.kind === 'cold-front' && rng.chance(fropaP)) {
      const d = new Date(f.timeMs);
      remarkFor.set(f.timeMs, `WSHFT ${pad(d.getUTCHours(), 2)}${pad(d.getUTCMinutes(), 2)} FROPA`);
    } else if (f.kind === 'warm-front' && rng.chance(fropaP * 0.3)) {
      remarkFor.set(f.timeMs, 'WRM FROPA');
    }
  }
  const pendingRemarks = [...remarkFor.entries()].sort((a, b) => a[0] - b[0]);

  // Report times: routine every hour, SPECIs at wind shifts and precipitation/thunder onsets.
  type Rep = { t: number; i: number; speci: boolean };
  const reps: Rep[] = [];
  const firstHour = Math.floor(t0 / 3600000) * 3600000;
  for (let h = firstHour; h <= series.timeMs[n - 1]!; h += 3600000) {
    const t = h + minute * 60000;
    if (t < t0 || t > series.timeMs[n - 1]!) continue;
    reps.push({ t, i: idxAt(t), speci: false });
  }
  if (opts.speci ?? true) {
    for (let i = 3; i < n; i++) {
      const spd = series.windSpeedMs[i]!;
      const d0 = series.windDirDeg[i - 3]!;
      const d1 = series.windDirDeg[i]!;
      const s0 = Math.min(series.windSpeedMs[i - 3]!, series.windSpeedMs[i - 2]!, series.windSpeedMs[i - 1]!);
      const turn = Math.abs(((((d1 - d0) % 360) + 540) % 360) - 180);
      // FMH-1 §5.4.6: ≥ 45° in < 15 min with sustained wind ≥ 10 kt throughout.
      const shift = turn >= 45 && Math.min(s0, spd) >= 10 * MS_PER_KT;
      // Precipitation or thunder beginning after at least 30 min without it.
      let before = 0;
      for (let k = Math.max(0, i - 6); k < i; k++) before |= series.weather[k]!;
      const wxStart = (series.weather[i]! & WX.PRECIP) !== 0 && (before & WX.PRECIP) === 0;
      const tsStart = (series.weather[i]! & WX.THUNDER) !== 0 && (before & WX.THUNDER) === 0;
      if (!(shift || wxStart || tsStart)) continue;
      const t = series.timeMs[i]! + rng.int(1, 4) * 60000;
      reps.push({ t, i, speci: true });
    }
  }
  reps.sort((a, b) => a.t - b.t);
  // Drop SPECIs within 10 min of another report.
  const kept: Rep[] = [];
  for (const r of reps) {
    const prev = kept[kept.length - 1];
    if (prev && r.t - prev.t < 10 * 60000) {
      if (r.speci) continue;
      if (prev.speci) kept.pop();
    }
    kept.push(r);
  }

  const lines: string[] = [];
  let lastRoutineIdx = -1;
  let lastReportIdx = -1;
  let remarkPtr = 0;
  for (const r of kept) {
    const i = r.i;
    const T = series.temperatureC[i]!;
    const Td = series.dewpointC[i]!;
    const spd = series.windSpeedMs[i]!;
    if (Number.isNaN(T) && Number.isNaN(spd) && Number.isNaN(series.stationPressureHpa[i]!)) continue; // station down
    const d = new Date(r.t);
    const ident = meta.id;
    let gust = NaN;
    for (let k = Math.max(0, i - 1); k <= i; k++) if (!(series.gustMs[k]! <= gust)) gust = series.gustMs[k]!;
    const rate = series.precipMm[i]! * (3600000 / step);
    let wxAll = 0;
    for (let k = Math.max(0, i - 1); k <= i; k++) wxAll |= series.weather[k]!;
    const body: string[] = [];
    body.push(`${r.speci ? 'SPECI' : 'METAR'} ${ident} ${pad(d.getUTCDate(), 2)}${pad(d.getUTCHours(), 2)}${pad(d.getUTCMinutes(), 2)}Z AUTO`);
    body.push(windGroup(series.windDirDeg[i]!, spd, gust, rng.chance(0.5)));
    body.push(visibility(series.weather[i]!, rate));
    const wxTxt = weatherTokens(series.weather[i]!, rate);
    if (wxTxt) body.push(wxTxt);
    body.push(skyGroup(series.cloudFraction[i]!, series.weather[i]!));
    if (!Number.isNaN(T)) body.push(`${metarTempToken(T)}/${metarTempToken(Td)}`);
    const stn = series.stationPressureHpa[i]!;
    if (!Number.isNaN(stn)) body.push(`A${pad(Math.floor((altimeterHpaFromStation(stn, elev) / HPA_PER_INHG) * 100 + 1e-9), 4)}`);
    const rmk: string[] = ['RMK', 'AO2'];
    // Peak wind since the last report when > 25 kt (FMH-1 §5.4.5).
    let pk = -1;
    let pkI = -1;
    for (let k = Math.max(lastReportIdx + 1, i - 12); k <= i; k++) if (series.gustMs[k]! > pk) {
      pk = series.gustMs[k]!;
      pkI = k;
    }
    if (pk / MS_PER_KT > 25.5 && pkI >= 0) {
      const pt = new Date(series.timeMs[pkI]!);
      rmk.push(`PK WND ${pad(Math.round(series.windDirDeg[pkI]! / 10) * 10 || 360, 3)}${pad(Math.round(pk / MS_PER_KT), 2)}/${pad(pt.getUTCHours(), 2)}${pad(pt.getUTCMinutes(), 2)}`);
    }
    // Observer wind-shift / FROPA remark in the first report after the passage (within 90 min).
    while (remarkPtr < pendingRemarks.length && pendingRemarks[remarkPtr]![0] < r.t - 90 * 60000) remarkPtr++;
    if (remarkPtr < pendingRemarks.length && pendingRemarks[remarkPtr]![0] <= r.t) {
      rmk.push(pendingRemarks[remarkPtr]![1]);
      remarkPtr++;
    }
    // PRESRR / PRESFR: station pressure changing ≥ 0.06 inHg/h totalling ≥ 0.02 inHg (FMH-1, AFMAN 15-111 §13.4.3.3).
    const i60 = i - Math.round(3600000 / step);
    if (i60 >= 0) {
      const dp = (stn - series.stationPressureHpa[i60]!) / HPA_PER_INHG;
      if (dp >= 0.06) rmk.push('PRESRR');
      else if (dp <= -0.06) rmk.push('PRESFR');
    }
    if (!r.speci) {
      const slp = series.seaLevelPressureHpa[i]!;
      rmk.push(Number.isNaN(slp) ? 'SLPNO' : `SLP${pad(Math.round(slp * 10) % 1000, 3)}`);
      if (lastRoutineIdx >= 0) {
        let mm = 0;
        for (let k = lastRoutineIdx + 1; k <= i; k++) if (series.precipMm[k]! > 0) mm += series.precipMm[k]!;
        if (mm > 0) rmk.push(`P${pad(Math.round((mm / MM_PER_IN) * 100), 4)}`);
      }
    }
    if (!Number.isNaN(T) && !Number.isNaN(Td)) rmk.push(`T${tGroupPart(T)}${tGroupPart(Td)}`);
    if (!r.speci && d.getUTCHours() % 3 === 2 && minute >= 45) {
      // 3-hourly tendency 5appp (WMO code table 0200), reported with the report before the synoptic hour.
      const i3 = i - Math.round(10800000 / step);
      const im = i - Math.round(5400000 / step);
      if (i3 >= 0) {
        const p0 = series.stationPressureHpa[i3]!;
        const pm = series.stationPressureHpa[im]!;
        const dp = stn - p0;
        if (!Number.isNaN(dp) && !Number.isNaN(pm)) {
          const first = pm - p0;
          const ppp = Math.round(Math.abs(dp) * 10);
          const a = ppp === 0 ? 4 : dp > 0 ? (first < 0 ? 3 : 2) : first > 0 ? 8 : 7;
          rmk.push(`5${a}${pad(a === 4 ? 0 : ppp, 3)}`);
        }
      }
    }
    if (!r.speci) lastRoutineIdx = i;
    lastReportIdx = i;
    const text = `${body.join(' ')} ${rmk.join(' ')}`;
    lines.push(opts.archivePrefix === false ? text : `${utcStamp(r.t)} ${text}`);
  }
  // Damage: duplicates and bad lines at seeded positions.
  for (let k = 0; k < (opts.duplicates ?? 0) && lines.length > 2; k++) {
    const j = rng.int(1, lines.length - 2);
    lines.splice(j + 1, 0, lines[j]!);
  }
  for (let k = 0; k < (opts.badLines ?? 0) && lines.length > 2; k++) {
    const j = rng.int(1, lines.length - 2);
    const src = lines[j]!;
    const kind = rng.int(0, 2);
    const bad = kind === 0 ? src.slice(0, Math.max(20, Math.floor(src.length * rng.uniform(0.3, 0.6)))) : kind === 1 ? src.replace(/ (\d{3}|VRB)(\d{2})(G\d{2})?KT/, ' 2$2QKT').replace(/ (M?\d{2})\/(M?\d{2}) /, ' $1/X$2 ') : `${src.slice(0, 13)}METAR ${meta.id} 3199Z ////`;
    lines.splice(j + 1, 0, bad);
  }
  return lines;
}
