/** The safety caution fropa shows to people (table output, help text); never inside CSV/JSON data. */
export const CAUTION =
  'Caution: fropa is not a certified observing or forecasting system. Official observations and forecasts, ' +
  'local rules and licensed practice govern aviation, road-treatment and warning decisions.';
