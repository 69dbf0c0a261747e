/**
 * One observation as every reader produces it, with the observer remarks it may carry.
 * Canonical units: °C, hPa, m/s, degrees true, epoch ms UTC. Missing is NaN.
 */

/** Observer remark about a wind shift or frontal passage (FMH-1 §12.7 remarks `WSHFT hhmm [FROPA]`). */
export interface ObserverRemark {
  /** Time of the report carrying the remark. */
  reportTimeMs: number;
  /** `WSHFT` (wind shift without frontal label), `FROPA`, `WRM FROPA`, `APRNT FROPA`, ... the literal label. */
  label: string;
  /** True when the remark says the shift was frontal. */
  frontal: boolean;
  /** Time the wind shift began (`WSHFT hhmm`), NaN when not given. */
  shiftTimeMs: number;
  file: string;
  line: number;
}

/**
 * One observation in canonical units. Produced by every reader (METAR, CSV) and consumed by the
 * series builder. All numbers are NaN when missing.
 */
export interface Observation {
  station: string;
  timeMs: number;
  /** 'METAR' | 'SPECI' | 'CSV' */
  source: 'METAR' | 'SPECI' | 'CSV';
  /** Report is a correction (COR / CCA) of an earlier one at the same time. */
  corrected: boolean;
  temperatureC: number;
  dewpointC: number;
  /** Degrees true the wind blows FROM; 0 with speed 0 for calm; NaN for variable/missing. */
  windDirDeg: number;
  windSpeedMs: number;
  gustMs: number;
  stationPressureHpa: number;
  seaLevelPressureHpa: number;
  altimeterHpa: number;
  /** Precipitation amount over the reporting period, mm (NaN unknown). */
  precipMm: number;
  /** Bit set of WX flags. */
  weather: number;
  /** Peak wind since last report, m/s (PK WND), NaN if none. */
  peakWindMs: number;
  /** PRESRR = +1, PRESFR = -1, none = 0. */
  pressureTrend: number;
  /** Prevailing visibility, m (WMO-No. 306 FM 15 visibility group; statute miles converted), NaN if not reported. */
  visibilityM: number;
  /**
   * Ceiling, ft above ground (aviation convention, FMH-1 §12.6.9: the lowest layer reported BKN or OVC, or the
   * vertical visibility VV into an obscuration); +Infinity when the sky was reported without such a layer (no
   * ceiling: CLR, SKC, NCD, NSC, CAVOK, FEW/SCT only); NaN when the sky was not reported.
   */
  ceilingFt: number;
  /** Station latitude/longitude/elevation from the row itself (CSV), NaN otherwise. */
  latDeg: number;
  lonDeg: number;
  elevationM: number;
  /** Observer remarks (WSHFT / FROPA) in this report. */
  remarks?: ObserverRemark[];
  file: string;
  line: number;
}

/** Make an Observation with every measurement missing. */
export function emptyObservation(station: string, timeMs: number, file: string, line: number): Observation {
  return {
    station,
    timeMs,
    source: 'CSV',
    corrected: false,
    temperatureC: NaN,
    dewpointC: NaN,
    windDirDeg: NaN,
    windSpeedMs: NaN,
    gustMs: NaN,
    stationPressureHpa: NaN,
    seaLevelPressureHpa: NaN,
    altimeterHpa: NaN,
    precipMm: NaN,
    weather: 0,
    peakWindMs: NaN,
    pressureTrend: 0,
    visibilityM: NaN,
    ceilingFt: NaN,
    latDeg: NaN,
    lonDeg: NaN,
    elevationM: NaN,
    file,
    line,
  };
}
