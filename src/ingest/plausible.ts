/**
 * The window of observation times the readers accept. A stamp far in the past or future (year 0001, 9999:
 * a typo, a zeroed field, a sentinel) is rejected with its line, so one bad line never stretches a station's
 * series over millennia. Default: 1900-01-01T00:00Z up to (not including) 2100-01-01T00:00Z, the years
 * the file-name dates are read in too (common practice, no source: surface synoptic archives start in the
 * late 19th century). Fixed, not the clock, so outputs stay deterministic; configurable per read.
 */

/** Inclusive start and exclusive end of accepted observation times, epoch ms UTC. */
export interface TimeWindow {
  fromMs: number;
  toMs: number;
}

export const DEFAULT_TIME_WINDOW: Readonly<TimeWindow> = Object.freeze({ fromMs: Date.UTC(1900, 0, 1), toMs: Date.UTC(2100, 0, 1) });

/** True when `timeMs` lies in the window. */
export function inTimeWindow(timeMs: number, w: Readonly<TimeWindow>): boolean {
  return timeMs >= w.fromMs && timeMs < w.toMs;
}

/** The rejection message for a time outside the window. */
export function outOfWindowMessage(timeMs: number, w: Readonly<TimeWindow>): string {
  const iso = (t: number) => (Number.isFinite(t) && Math.abs(t) <= 8.64e15 ? new Date(t).toISOString().slice(0, 16) + 'Z' : String(t));
  return `time ${iso(timeMs)} is outside the accepted window ${iso(w.fromMs)} to ${iso(w.toMs)}; fix the stamp (or widen the window with the time-window option)`;
}
