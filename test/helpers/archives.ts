/** Column layouts of downloadable archives, shared by the tests that write samples of them. */

// ECCC "Hourly data" bulk CSV (climate.weather.gc.ca, the column list of its technical documentation, from memory):
// every cell quoted, coordinates first, units in brackets, wind direction in tens of degrees, station pressure in
// kPa, `Date/Time (LST)` local standard time all year.
export const ECCC_HEADER =
  '"Longitude (x)","Latitude (y)","Station Name","Climate ID","Date/Time (LST)","Year","Month","Day","Time (LST)","Temp (°C)","Temp Flag","Dew Point Temp (°C)","Dew Point Temp Flag","Rel Hum (%)","Rel Hum Flag","Precip. Amount (mm)","Precip. Amount Flag","Wind Dir (10s deg)","Wind Dir Flag","Wind Spd (km/h)","Wind Spd Flag","Visibility (km)","Visibility Flag","Stn Press (kPa)","Stn Press Flag","Hmdx","Hmdx Flag","Wind Chill","Wind Chill Flag","Weather"';
