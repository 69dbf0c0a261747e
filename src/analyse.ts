/**
 * The main job over a set of station series: detect the passages at every station, then (with three or
 * more located stations) track the fronts across the network, add their kinematic frontogenesis, and give
 * each tracked passage the zone depth and gradient from the fitted speed. Pure; the CLI commands share it.
 */
import type { BoundaryKind, FrontTrack, PassageEvent, StationMeta, StationSeries } from './model/index.js';
import type { DetectOptions } from './detect/types.js';
import { detectStation } from './detect/detect.js';
import { trackFronts, withTrackSpeeds } from './network/track.js';
import { withFrontogenesis } from './network/frontogenesis.js';

export interface AnalyseOptions extends DetectOptions {
  /** Track fronts across the network (default true). */
  network?: boolean;
  /** Keep only these kinds in the result (tracking still sees every passage). */
  kinds?: ReadonlySet<BoundaryKind> | null;
}

export interface Analysis {
  /** Sorted by station, then time, then kind. */
  events: PassageEvent[];
  tracks: FrontTrack[];
}

/** Stable order: station, then time, then kind. Sorts in place and returns the array. */
export function sortEvents(events: PassageEvent[]): PassageEvent[] {
  return events.sort((a, b) => (a.station < b.station ? -1 : a.station > b.station ? 1 : a.timeMs - b.timeMs || (a.kind < b.kind ? -1 : a.kind > b.kind ? 1 : 0)));
}

/** Detect, track and measure. A failure at one station is re-thrown with the station's id. */
export function analyseSeries(series: readonly StationSeries[], opts: AnalyseOptions = {}): Analysis {
  let all: PassageEvent[] = [];
  for (const s of series) {
    try {
      all.push(...detectStation(s, opts));
    } catch (e) {
      throw new Error(`${s.station}: detection failed: ${(e as Error).message}`, { cause: e });
    }
  }
  const metas = series.map((s) => s.meta).filter((m): m is StationMeta => m !== undefined);
  const allTracks = opts.network === false ? [] : withFrontogenesis(trackFronts(all, metas), series);
  // The fitted speed is the speed normal to the front; an explicit --front-speed wins.
  if (opts.frontSpeedKmh === undefined) all = withTrackSpeeds(all, allTracks);
  const kinds = opts.kinds;
  return {
    events: sortEvents(all.filter((e) => !kinds || kinds.has(e.kind))),
    tracks: allTracks.filter((t) => !kinds || kinds.has(t.kind)),
  };
}
