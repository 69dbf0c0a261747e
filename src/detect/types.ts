/** Options of detection. The event types live in src/model/event.ts. */

/** @deprecated Re-exported for old import paths; import from src/model/. */
export { BOUNDARY_KINDS, type BoundaryKind, type PassageEvent } from '../model/event.js';

export interface DetectOptions {
  /** Front speed normal to the front, km/h, for zone depth and gradient. */
  frontSpeedKmh?: number;
  /** Drop events below this confidence. Default 0.5 (DEFAULT_MIN_CONFIDENCE). */
  minConfidence?: number;
  /** Classifier parameters: the fitted ones by default; `null` for the hand signatures alone. */
  model?: import('./model.js').ModelParams | null;
}
