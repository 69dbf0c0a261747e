/**
 * Station pressure for a series that has only the altimeter setting: filled where missing and the station
 * elevation is known, by the NWS altimeter-setting inversion in physics/pressure.ts. Mutates the series.
 */
import type { StationSeries } from '../model/index.js';
import { stationPressureFromAltimeterHpa } from '../physics/pressure.js';

/** Fill `stationPressureHpa` from `altimeterHpa` where missing, when `meta.elevationM` is known. NaN altimeter stays NaN. */
export function deriveStationPressure(s: StationSeries): void {
  const elev = s.meta?.elevationM;
  if (elev === undefined || Number.isNaN(elev)) return;
  for (let i = 0; i < s.length; i++) {
    if (Number.isNaN(s.stationPressureHpa[i]!) && !Number.isNaN(s.altimeterHpa[i]!)) {
      s.stationPressureHpa[i] = stationPressureFromAltimeterHpa(s.altimeterHpa[i]!, elev);
    }
  }
}
