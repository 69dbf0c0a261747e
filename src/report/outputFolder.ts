/**
 * The output folder of `fropa detect --out-dir`: events and fronts as CSV and JSON, and a summary text for people
 * (counts per station and kind, the network table, the caution). `outputFolderFiles` is pure; `writeOutputFolder`
 * is the file-system edge.
 */
import { mkdirSync, writeFileSync } from 'node:fs';
import { join } from 'node:path';
import type { FrontTrack, PassageEvent } from '../model/index.js';
import { CAUTION } from './caution.js';
import { eventsToCsv, eventsToJson, summaryLines } from './format.js';
import { tracksToCsv, tracksToJson, tracksToTable } from './fronts.js';

/** One file of the folder: its name and its text. */
export interface OutputFile {
  name: string;
  text: string;
}

/** The summary text and the files: events.csv, events.json, fronts.csv, fronts.json, summary.txt (in this order). */
export function outputFolderFiles(events: readonly PassageEvent[], tracks: readonly FrontTrack[], stations: readonly string[]): { summary: string; files: OutputFile[] } {
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
    ],
  };
}

/** Create `dir` (and its parents) and write the files; returns the paths written. A failure throws an Error naming the folder. */
export function writeOutputFolder(dir: string, files: readonly OutputFile[]): string[] {
  try {
    mkdirSync(dir, { recursive: true });
    for (const f of files) writeFileSync(join(dir, f.name), f.text);
  } catch (e) {
    throw new Error(`${dir}: cannot write the output folder (${(e as NodeJS.ErrnoException).code ?? (e as Error).message})`);
  }
  return files.map((f) => join(dir, f.name));
}
