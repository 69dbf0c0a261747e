/**
 * Shards: a deterministic share of the stations for each of N independent processes, and the NDJSON
 * records a shard writes so that `merge` can finish the run (tracking, network coherence, frontogenesis)
 * exactly as one process would. A station belongs to shard k of N (1-based) when the FNV-1a 32-bit hash of
 * its id (Fowler, Noll & Vo; IETF draft-eastlake-fnv) modulo N is k − 1: the share depends only on the id,
 * never on file names, file order or the machine, so N shards cover an archive exactly once.
 */
import type { PassageEvent, StationMeta } from '../model/index.js';
import { UsageError } from '../model/index.js';
import type { StationFields } from '../network/frontogenesis.js';

/** Which share: `index` of `count`, 1-based. */
export interface ShardSpec {
  index: number;
  count: number;
}

/**
 * FNV-1a, 32 bits, over the UTF-16 code units of the text (offset basis 2166136261, prime 16777619).
 * @example fnv1a32('a') // 0xe40c292c
 */
export function fnv1a32(text: string): number {
  let h = 0x811c9dc5;
  for (let i = 0; i < text.length; i++) {
    h ^= text.charCodeAt(i);
    h = Math.imul(h, 0x01000193) >>> 0;
  }
  return h >>> 0;
}

/** Whether a station is in a shard. */
export function inShard(station: string, shard: ShardSpec): boolean {
  return fnv1a32(station) % shard.count === shard.index - 1;
}

/** Parse `K/N` (1 ≤ K ≤ N ≤ 100000); UsageError otherwise. */
export function parseShard(spec: string): ShardSpec {
  const m = /^\s*(\d+)\s*\/\s*(\d+)\s*$/.exec(spec);
  const index = m ? Number(m[1]) : NaN, count = m ? Number(m[2]) : NaN;
  if (!(index >= 1 && count >= 1 && index <= count && count <= 100000)) throw new UsageError(`--shard "${spec}" must be K/N with 1 ≤ K ≤ N, e.g. 3/8 (shard 3 of 8)`);
  return { index, count };
}

/** What a shard knows of one of its stations. */
export interface ShardStation {
  station: string;
  meta?: StationMeta;
  /** First and last report, epoch ms (absent for an empty series). */
  span?: { startMs: number; endMs: number };
  /** Per-report θ and wind for frontogenesis (absent without coordinates). */
  fields?: StationFields;
  /** Why its detection failed (absent when it did not). */
  failure?: string;
}

/** Header of every shard output: the shard, and the run-wide plan the merge must share. */
export interface ShardHeader {
  shard: ShardSpec;
  /** Whether the whole archive makes a network (three or more stations with coordinates), and the confidence kept. */
  network: boolean;
  floor: number;
  minConfidence: number;
  /** `--front-speed` of the run, km/h, when given. */
  frontSpeedKmh?: number;
  /** Stations of the whole archive (so the merge can check it has every shard). */
  archiveStations: number;
}

const FORMAT = 'fropa-shard-1';

/** Non-finite numbers survive JSON as strings. */
function replacer(this: unknown, _key: string, v: unknown): unknown {
  if (typeof v === 'number' && !Number.isFinite(v)) return String(v);
  if (ArrayBuffer.isView(v) && !(v instanceof DataView)) return { $f64: Array.from(v as Float64Array, (x) => (Number.isFinite(x) ? x : String(x))) };
  return v;
}

function reviver(_key: string, v: unknown): unknown {
  if (v === 'NaN' || v === 'Infinity' || v === '-Infinity') return Number(v);
  if (v && typeof v === 'object' && '$f64' in (v as object)) return Float64Array.from((v as { $f64: (number | string)[] }).$f64, Number);
  return v;
}

/** The NDJSON text of a shard: a header line, one line per station, one per passage (detected, before tracking). */
export function shardToNdjson(header: ShardHeader, stations: readonly ShardStation[], events: readonly PassageEvent[]): string {
  const lines = [JSON.stringify({ type: 'header', format: FORMAT, ...header }, replacer)];
  for (const s of stations) lines.push(JSON.stringify({ type: 'station', ...s }, replacer));
  for (const e of events) lines.push(JSON.stringify({ type: 'passage', ...e }, replacer));
  return lines.join('\n') + '\n';
}

/** One shard output read back. */
export interface ShardContent {
  header: ShardHeader;
  stations: ShardStation[];
  events: PassageEvent[];
}

/** Read a shard's NDJSON (UsageError naming the source and line for anything that is not a shard record). */
export function shardFromNdjson(text: string, source: string): ShardContent {
  let header: ShardHeader | undefined;
  const stations: ShardStation[] = [];
  const events: PassageEvent[] = [];
  text.split('\n').forEach((line, i) => {
    if (!line.trim()) return;
    let rec: Record<string, unknown>;
    try {
      rec = JSON.parse(line, reviver) as Record<string, unknown>;
    } catch {
      throw new UsageError(`${source}:${i + 1}: not JSON; fropa merge reads the files written by fropa detect --shard`);
    }
    const { type, ...rest } = rec;
    if (type === 'header') {
      if (rest.format !== FORMAT) throw new UsageError(`${source}:${i + 1}: not a fropa shard output (format ${String(rest.format)})`);
      const { format: _f, ...h } = rest;
      header = h as unknown as ShardHeader;
    } else if (type === 'station') stations.push(rest as unknown as ShardStation);
    else if (type === 'passage') events.push(rest as unknown as PassageEvent);
    else throw new UsageError(`${source}:${i + 1}: unknown record type ${JSON.stringify(type)}`);
  });
  if (!header) throw new UsageError(`${source}: no shard header; fropa merge reads the files written by fropa detect --shard`);
  return { header, stations, events };
}
