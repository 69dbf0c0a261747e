/**
 * The output folder of `fropa detect --out-dir`: events and fronts as CSV and JSON, and a summary text for people
 * (counts per station and kind, the network table, the caution). `outputFolderFiles` is pure; `writeOutputFolder`
 * is the file-system edge.
 */
import { join } from 'node:path';
import type { FrontTrack, PassageEvent, StationMeta } from '../model/index.js';
import { toGeoJson } from './geojson.js';
import { CAUTION } from './caution.js';
import { writeFilesSafely, type SafeWriteOptions } from './safeWrite.js';
import { eventsToCsv, eventsToJson, summaryLines } from './format.js';
import { tracksToCsv, tracksToJson, tracksToTable } from './fronts.js';

/** One file of the folder: its name and its text. */
export interface OutputFile {
  name: string;
  text: string;
}

/**
 * The summary text and the files: events.csv, events.json, fronts.csv, fronts.json, summary.txt (in this order), and
 * run.geojson (RFC 7946, geojson.ts) when station positions are given.
 */
export function outputFolderFiles(events: readonly PassageEvent[], tracks: readonly FrontTrack[], stations: readonly string[], metas: readonly StationMeta[] = []): { summary: string; files: OutputFile[] } {
  const network = tracksToTable(tracks);
  const summary = [...summaryLines(events, stations), ...(network ? ['', network.trimEnd()] : []), CAUTION].join('\n') + '\n';
  return {
    summary,
    files: [
      { name: 'events.csv', text: eventsToCsv(events) },
      { name: 'events.json', text: eventsToJson(events) },
      { name: 'fronts.csv', text: tracksToCsv(tracks) },
      { name: 'fronts.json', text: tracksToJson(tracks) },
      { name: 'summary.txt', text: summary },
      ...(metas.length ? [{ name: 'run.geojson', text: toGeoJson({ events, tracks, stations: metas }) }] : []),
    ],
  };
}

/**
 * Create `dir` (and its parents) and write the files atomically as one set (safeWrite.ts): an existing file is
 * replaced only with `force`, an input file never. Returns the paths written. A failure throws an Error naming the
 * folder and leaves none of the new files behind; a refused path throws UsageError.
 */
export function writeOutputFolder(dir: string, files: readonly OutputFile[], opts: SafeWriteOptions = {}): string[] {
  const planned = files.map((f) => ({ path: join(dir, f.name), text: f.text }));
  try {
    return writeFilesSafely(planned, { ...opts, mkdirs: true });
  } catch (e) {
    if (e instanceof RangeError) throw e;
    throw new Error(`${dir}: cannot write the output folder (${(e as Error).message})`, { cause: e });
  }
}
