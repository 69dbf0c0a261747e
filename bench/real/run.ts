/**
 * Load the real development files through fropa's readers and run the main job on them.
 * One group of series per file (the New York 2022 file is a three-station network and is tracked).
 */
import { existsSync, readFileSync } from 'node:fs';
import { join } from 'node:path';
import { analyseSeries, loadPaths, type PassageEvent, type StationSeries, type AnalyseOptions } from '../../src/index.js';
import { joinYmdh, REAL_FILES, SHARED, STATIONS_FILE, type RealFile } from './data.js';
import type { ColumnOverride } from '../../src/ingest/columns.js';

export interface LoadedFile {
  file: RealFile;
  series: StationSeries[];
}

function overrides(specs: readonly string[] | undefined): ColumnOverride[] | undefined {
  if (!specs) return undefined;
  return specs.map((s) => {
    const [header, rest] = s.split('=') as [string, string];
    const [field, unit] = rest.split(':');
    return { header, field, unit } as ColumnOverride;
  });
}

/** Read every real file (missing ones are skipped with a note on stderr). */
export function loadRealFiles(files: readonly RealFile[] = REAL_FILES): LoadedFile[] {
  const out: LoadedFile[] = [];
  for (const f of files) {
    const path = join(SHARED, f.path);
    let paths = [path];
    let stdinText: string | undefined;
    try {
      if (f.ymdh) {
        stdinText = joinYmdh(readFileSync(path, 'utf8'));
        paths = ['-'];
      } else if (!existsSync(path)) throw new Error('missing');
    } catch {
      process.stderr.write(`bench:real: ${path} not found, skipped\n`);
      continue;
    }
    const r = loadPaths(paths, { stationsFile: STATIONS_FILE, offsetMinutes: f.offsetMinutes, overrides: overrides(f.columns), stdinText });
    for (const s of r.series) {
      if (f.station) s.station = f.station;
      if (!s.meta) s.meta = r.stations.find((m) => m.id === s.station || m.aliases.includes(s.station));
      if (s.meta) s.station = s.meta.id;
    }
    out.push({ file: f, series: r.series });
  }
  return out;
}

/** Run the main job on each loaded file. */
export function detectReal(loaded: readonly LoadedFile[], opts: AnalyseOptions = {}): PassageEvent[] {
  const all: PassageEvent[] = [];
  for (const l of loaded) all.push(...analyseSeries(l.series, { ...opts }).events);
  return all;
}
