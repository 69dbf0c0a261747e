/**
 * The decoded METAR/SPECI record (WMO-No. 306 FM 15/FM 16 groups, FMH-1 ch. 12 remarks) that the general
 * decoder, the byte decoder, the group decoders and the remarks decoder all fill. Canonical units; NaN = missing.
 */
import type { ObserverRemark } from '../../model/index.js';

/** One cloud layer (FM 15 group NsNsNshshshs / VVhshshs). `heightFt` NaN when not given or clear. */
export interface SkyLayer {
  /** FEW SCT BKN OVC VV, or CLR SKC NSC NCD, or `///` (cover not observable). */
  cover: string;
  heightFt: number;
  /** CB or TCU (or `///` when the automatic station could not tell). */
  cloudType?: string;
}

/** A decoded METAR/SPECI report. Canonical units; NaN = missing. */
export interface MetarReport {
  type: 'METAR' | 'SPECI';
  station: string;
  timeMs: number;
  auto: boolean;
  corrected: boolean;
  nil: boolean;
  /** Degrees true the wind blows from; 0 for calm; NaN for VRB or missing. */
  windDirDeg: number;
  windSpeedMs: number;
  gustMs: number;
  /** Direction reported as `VRB`. */
  windVariable: boolean;
  /** Extremes of a `dndndnVdxdxdx` group, clockwise from → to; NaN when absent. */
  windVarFromDeg: number;
  windVarToDeg: number;
  /** Prevailing visibility, m (9999 and CAVOK → 10000; `M1/4SM` → 1/4 SM, `P6SM` → 6 SM: the bound). */
  visibilityM: number;
  /** Raw present-weather groups, e.g. `-RA`, `BR` (empty when decoded in lite mode). */
  weatherCodes: string[];
  /** WX bit flags from present weather, CB clouds and lightning remarks. */
  weather: number;
  sky: SkyLayer[];
  /**
   * Ceiling, ft: the lowest layer reported BKN or OVC, or the vertical visibility VV (FMH-1 §12.6.9 ceiling; FM 15
   * cloud group NsNsNshshshs, heights in hundreds of feet); +Infinity when sky groups name no such layer (CLR, SKC,
   * NCD, NSC, CAVOK, FEW/SCT only: no ceiling); NaN when there is no sky group or the layer's height is `///`.
   * Kept in lite mode too.
   */
  ceilingFt: number;
  /** Temperature, °C: the tenths from the `T` remark group when present, else the body group. */
  temperatureC: number;
  dewpointC: number;
  /** True when temperature (and dew point if present) came from the `T` remark group. */
  tempFromRemarks: boolean;
  /** QNH from `Qhhhh`, hPa. */
  qnhHpa: number;
  /** Altimeter setting from `Ahhhh`, converted to hPa. */
  altimeterHpa: number;
  /** `SLPppp` remark, hPa. */
  seaLevelPressureHpa: number;
  /** `5appp` remark: signed 3-h change, hPa (sign from WMO code table 0200). */
  pressureTendency3hHpa: number;
  /** Characteristic `a` of `5appp` (WMO code table 0200), -1 when absent. */
  pressureTendencyCode: number;
  /** PRESRR +1, PRESFR −1, else 0. */
  pressureTrend: number;
  /** `Prrrr` hourly precipitation, mm (trace `P0000` → 0 with `precipTrace`). */
  precip1hMm: number;
  peakWindMs: number;
  peakWindDirDeg: number;
  peakWindTimeMs: number;
  /** WSHFT / FROPA remarks. */
  remarks: ObserverRemark[];
  /** AO1, AO2 (…A) from remarks, '' when absent. */
  stationType: string;
  /** `$` maintenance indicator (FMH-1 §12.7). */
  maintenance: boolean;
  /** Groups not recognised (also cut-off groups), in order. */
  unknownGroups: string[];
  // ---- additions beyond the shared contract ----
  /** `P0000`: a trace of precipitation in the last hour. */
  precipTrace: boolean;
  /** `6RRRR` 3- or 6-h precipitation, mm (trace → 0). */
  precip3or6hMm: number;
  /** `7RRRR` 24-h precipitation, mm. */
  precip24hMm: number;
  /** `1snTTT` / `2snTTT` 6-h maximum and minimum temperature, °C. */
  tempMax6hC: number;
  tempMin6hC: number;
  /** RVR groups as written (kept, not decoded). */
  rvr: string[];
  cavok: boolean;
}

/** An empty report (all values missing). */
export function newMetarReport(): MetarReport {
  return {
    type: 'METAR', station: '', timeMs: NaN, auto: false, corrected: false, nil: false,
    windDirDeg: NaN, windSpeedMs: NaN, gustMs: NaN, windVariable: false, windVarFromDeg: NaN, windVarToDeg: NaN,
    visibilityM: NaN, weatherCodes: [], weather: 0, sky: [], ceilingFt: NaN, temperatureC: NaN, dewpointC: NaN, tempFromRemarks: false,
    qnhHpa: NaN, altimeterHpa: NaN, seaLevelPressureHpa: NaN, pressureTendency3hHpa: NaN, pressureTendencyCode: -1,
    pressureTrend: 0, precip1hMm: NaN, peakWindMs: NaN, peakWindDirDeg: NaN, peakWindTimeMs: NaN, remarks: [],
    stationType: '', maintenance: false, unknownGroups: [], precipTrace: false, precip3or6hMm: NaN, precip24hMm: NaN,
    tempMax6hC: NaN, tempMin6hC: NaN, rvr: [], cavok: false,
  };
}

/** Reset a report for reuse (keeps arrays unless they were handed out). */
export function resetReport(r: MetarReport): void {
  r.type = 'METAR'; r.station = ''; r.timeMs = NaN; r.auto = false; r.corrected = false; r.nil = false;
  r.windDirDeg = NaN; r.windSpeedMs = NaN; r.gustMs = NaN; r.windVariable = false; r.windVarFromDeg = NaN; r.windVarToDeg = NaN;
  r.visibilityM = NaN; if (r.weatherCodes.length) r.weatherCodes.length = 0; r.weather = 0; if (r.sky.length) r.sky.length = 0; r.ceilingFt = NaN; r.temperatureC = NaN; r.dewpointC = NaN;
  r.tempFromRemarks = false; r.qnhHpa = NaN; r.altimeterHpa = NaN; r.seaLevelPressureHpa = NaN; r.pressureTendency3hHpa = NaN;
  r.pressureTendencyCode = -1; r.pressureTrend = 0; r.precip1hMm = NaN; r.peakWindMs = NaN; r.peakWindDirDeg = NaN;
  r.peakWindTimeMs = NaN; if (r.remarks.length) r.remarks = []; r.stationType = ''; r.maintenance = false;
  if (r.unknownGroups.length) r.unknownGroups.length = 0; r.precipTrace = false; r.precip3or6hMm = NaN; r.precip24hMm = NaN; r.tempMax6hC = NaN;
  r.tempMin6hC = NaN; if (r.rvr.length) r.rvr.length = 0; r.cavok = false;
}

/** Keep an unrecognised (or cut-off) group. */
export function unknown(r: MetarReport, s: string, a: number, b: number): void {
  r.unknownGroups.push(s.slice(a, b));
}
