/**
 * Season summaries: how many passages of each kind fell in each calendar month, at what hour of the day
 * (UTC and local mean solar time), and the distributions of their temperature change, transition-zone
 * hours, 3-h pressure rise and peak gust, per station and for the whole network; for the network also the
 * speeds and directions of the fronts tracked across it. Pure: events and tracks in, a summary out.
 */
import { BOUNDARY_KINDS, type BoundaryKind, type FrontTrack, type PassageEvent, type StationMeta } from '../model/index.js';
import { solarHour } from '../physics/sun.js';
import { quantile } from '../verify/quantile.js';

/** Order statistics of one measure (Hyndman & Fan 1996 definition 7 quantiles; NaN values left out, counted in `missing`). */
export interface Distribution {
  n: number;
  missing: number;
  min: number;
  p10: number;
  p25: number;
  median: number;
  p75: number;
  p90: number;
  max: number;
  mean: number;
}

export const SEASON_MEASURES = ['tempChangeC', 'zoneHours', 'pressureRise3hHpa', 'gustMaxMs'] as const;
export type SeasonMeasure = (typeof SEASON_MEASURES)[number];

export interface SeasonGroup {
  /** Station id, or `network` for all stations together. */
  scope: string;
  passages: number;
  /** Per kind: passages in each calendar month (index 0 = January), by the UTC date of the passage. */
  byKindMonth: Record<BoundaryKind, number[]>;
  /** Passages per hour of the day, UTC (index = hour). */
  hourUtc: number[];
  /** Passages per hour of local mean solar time (UTC + longitude / 15 h); stations without a longitude are not counted. */
  hourSolar: number[];
  distributions: Record<SeasonMeasure, Distribution>;
}

export interface SeasonFronts {
  fronts: number;
  speedKmh: Distribution;
  /** Fronts by the direction they move toward, eight 45° sectors centred on N, NE, E, …, NW. */
  towardSector: number[];
}

export interface SeasonSummary {
  sinceMs: number;
  untilMs: number;
  network: SeasonGroup;
  stations: SeasonGroup[];
  fronts: SeasonFronts;
}

export const SECTORS = ['N', 'NE', 'E', 'SE', 'S', 'SW', 'W', 'NW'] as const;

/** Distribution of the finite values (NaN statistics for none). */
export function distribution(values: readonly number[]): Distribution {
  const v = values.filter(Number.isFinite);
  const q = (p: number) => quantile(v, p);
  return {
    n: v.length,
    missing: values.length - v.length,
    min: v.length ? Math.min(...v) : NaN,
    p10: q(0.1),
    p25: q(0.25),
    median: q(0.5),
    p75: q(0.75),
    p90: q(0.9),
    max: v.length ? Math.max(...v) : NaN,
    mean: v.length ? v.reduce((a, b) => a + b, 0) / v.length : NaN,
  };
}

function group(scope: string, events: readonly PassageEvent[], lonOf: (station: string) => number): SeasonGroup {
  const byKindMonth = Object.fromEntries(BOUNDARY_KINDS.map((k) => [k, new Array<number>(12).fill(0)])) as Record<BoundaryKind, number[]>;
  const hourUtc = new Array<number>(24).fill(0);
  const hourSolar = new Array<number>(24).fill(0);
  for (const e of events) {
    const d = new Date(e.timeMs);
    byKindMonth[e.kind][d.getUTCMonth()]!++;
    hourUtc[d.getUTCHours()]!++;
    const h = solarHour(e.timeMs, lonOf(e.station));
    if (Number.isFinite(h)) hourSolar[Math.floor(h) % 24]!++;
  }
  const distributions = Object.fromEntries(SEASON_MEASURES.map((m) => [m, distribution(events.map((e) => e[m]))])) as Record<SeasonMeasure, Distribution>;
  return { scope, passages: events.length, byKindMonth, hourUtc, hourSolar, distributions };
}

/**
 * The season summary of passages and fronts between `sinceMs` (inclusive) and `untilMs` (exclusive); a
 * passage counts by its time, a front by its fitted time at the network origin. `stationIds` lists every
 * station read, so stations without passages get a (zero) group too.
 */
export function seasonSummary(
  events: readonly PassageEvent[],
  tracks: readonly FrontTrack[],
  stations: readonly StationMeta[],
  stationIds: readonly string[],
  sinceMs = -Infinity,
  untilMs = Infinity,
): SeasonSummary {
  const lon = new Map(stations.map((s) => [s.id, s.lonDeg]));
  const lonOf = (id: string) => lon.get(id) ?? NaN;
  const inside = events.filter((e) => e.timeMs >= sinceMs && e.timeMs < untilMs);
  const byStation = new Map<string, PassageEvent[]>(stationIds.map((id) => [id, []]));
  for (const e of inside) {
    const list = byStation.get(e.station);
    if (list) list.push(e);
    else byStation.set(e.station, [e]);
  }
  const fronts = tracks.filter((t) => t.t0Ms >= sinceMs && t.t0Ms < untilMs);
  const towardSector = new Array<number>(8).fill(0);
  for (const t of fronts) if (Number.isFinite(t.directionDeg)) towardSector[Math.floor((((t.directionDeg + 22.5) % 360) + 360) % 360 / 45) % 8]!++;
  return {
    sinceMs,
    untilMs,
    network: group('network', inside, lonOf),
    stations: [...byStation.keys()].sort().map((id) => group(id, byStation.get(id)!, lonOf)),
    fronts: { fronts: fronts.length, speedKmh: distribution(fronts.map((t) => t.speedKmh)), towardSector },
  };
}
