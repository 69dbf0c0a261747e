/**
 * Network coherence as evidence for the kind of a passage. A synoptic front is a line that moves
 * steadily across a network, so a passage that the tracker fits into a front crossing three or more
 * stations is evidence for a front, and can keep a weak one (a warm front's change is small at any one
 * station); a cooling seen at one station while its neighbours, reporting at the time, saw no front
 * within hours is evidence for a mesoscale boundary (an outflow or a local change), as in
 * Wakimoto1982 (the gust front is a few tens of km across). The sizes below are common practice, no
 * source.
 */
import type { FrontTrack, PassageEvent, StationMeta, StationSeries } from '../model/index.js';
import { MS_PER_HOUR } from '../physics/constants.js';
import { stationGraph, type StationSpan } from './neighbours.js';

/** Neighbours are stations within this distance. */
export const NEIGHBOUR_KM = 300;
/** A neighbour's front counts as the same one within this time. */
const SAME_FRONT_MS = 4 * MS_PER_HOUR;
/** Confidence gained by a tracked passage (fraction of the remaining doubt removed). */
const TRACKED_GAIN = 0.3;
/** Confidence kept by an isolated cooling whose neighbours saw nothing. */
const ISOLATED_FACTOR = 0.75;

const FRONTS = new Set(['cold-front', 'warm-front', 'occluded-front']);

function reporting(s: StationSpan | undefined, tMs: number): boolean {
  if (!s) return false;
  return s.startMs <= tMs - 3 * MS_PER_HOUR && s.endMs >= tMs + 3 * MS_PER_HOUR;
}

/**
 * Adjust the confidence of front passages by network coherence. Pure: returns new event objects for
 * those it changes. Stations without coordinates, or without two neighbours reporting at the time, are
 * left as they are (single-station data work as before).
 */
export function withNetworkCoherence(
  events: readonly PassageEvent[],
  tracks: readonly FrontTrack[],
  metas: readonly StationMeta[],
  series: readonly StationSeries[] | ReadonlyMap<string, StationSpan>,
): PassageEvent[] {
  const tracked = new Map<PassageEvent, FrontTrack>();
  for (const t of tracks) for (const m of t.members) if (t.members.length >= 3) tracked.set(m.event, t);
  const located = metas.filter((m) => Number.isFinite(m.latDeg) && Number.isFinite(m.lonDeg));
  // When each station reported (its series' first and last report, or the spans given).
  const bySeries: ReadonlyMap<string, StationSpan> =
    series instanceof Map ? series : new Map((series as readonly StationSeries[]).filter((s) => s.length > 0).map((s) => [s.station, { startMs: s.timeMs[0]!, endMs: s.timeMs[s.length - 1]! }]));
  // Every station within NEIGHBOUR_KM (geodesic), found through the grid of neighbours.ts in about linear time.
  const graph = stationGraph(located, NEIGHBOUR_KM, Number.MAX_SAFE_INTEGER);
  const neighbours = new Map<string, string[]>();
  located.forEach((m, i) => {
    if (!neighbours.has(m.id)) neighbours.set(m.id, [...graph.neighbours[i]!].sort((a, b) => a - b).map((j) => located[j]!.id).filter((id) => id !== m.id));
  });
  // Front passage times per station, sorted, to look up "a front within SAME_FRONT_MS" by binary search.
  const frontTimes = new Map<string, number[]>();
  for (const o of events) {
    if (!FRONTS.has(o.kind)) continue;
    const list = frontTimes.get(o.station);
    if (list) list.push(o.timeMs);
    else frontTimes.set(o.station, [o.timeMs]);
  }
  for (const list of frontTimes.values()) list.sort((a, b) => a - b);
  const sawFront = (id: string, tMs: number): boolean => {
    const list = frontTimes.get(id);
    if (!list) return false;
    let lo = 0, hi = list.length;
    while (lo < hi) {
      const m = (lo + hi) >> 1;
      if (list[m]! < tMs - SAME_FRONT_MS) lo = m + 1;
      else hi = m;
    }
    return lo < list.length && list[lo]! <= tMs + SAME_FRONT_MS;
  };
  return events.map((e) => {
    if (!FRONTS.has(e.kind)) return e;
    const track = tracked.get(e);
    if (track) {
      const confidence = Math.round((1 - (1 - e.confidence) * (1 - TRACKED_GAIN)) * 100) / 100;
      return { ...e, confidence, evidence: [...e.evidence, `+ part of a front tracked across ${track.members.length} stations (${track.speedKmh.toFixed(0)} km/h toward ${track.directionDeg.toFixed(0)}°)`] };
    }
    const near = (neighbours.get(e.station) ?? []).filter((id) => reporting(bySeries.get(id), e.timeMs));
    if (near.length < 2) return e;
    const seen = near.filter((id) => sawFront(id, e.timeMs));
    if (seen.length > 0) return e;
    const confidence = Math.round(e.confidence * ISOLATED_FACTOR * 100) / 100;
    return { ...e, confidence, evidence: [...e.evidence, `− none of ${near.length} neighbouring stations within ${NEIGHBOUR_KM} km saw a front within ${SAME_FRONT_MS / MS_PER_HOUR} h: a local boundary?`] };
  });
}
