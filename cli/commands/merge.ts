/** `fropa merge <paths...>`: combine the shard outputs of `fropa detect --shard K/N` into the result of one run. */
import { readdirSync, readFileSync, statSync } from 'node:fs';
import { join } from 'node:path';
import { eventsToCsv, eventsToJson, eventsToNdjson, mergeShards, outputFolderFiles, passagesToTable, shardFromNdjson, UsageError, writeOutputFolder } from '../../src/index.js';
import { STDIN_TOKEN, writeOutput, type CliIo } from '../options.js';
import { parseKinds } from './detect.js';
import { failureSummary, EXIT_SOME_FAILED } from '../analysis.js';

/** Shard files named directly, or the `.ndjson` files of a folder (sorted). */
function shardFiles(paths: readonly string[]): string[] {
  const out: string[] = [];
  for (const p of paths) {
    let st;
    try {
      st = statSync(p);
    } catch {
      throw new UsageError(`${p}: no such file or directory`);
    }
    if (st.isDirectory()) out.push(...readdirSync(p).filter((f) => f.endsWith('.ndjson')).sort().map((f) => join(p, f)));
    else out.push(p);
  }
  return out;
}

/** Run merge; exit code 0, 3 when some stations failed in their shard, 1 when all did. */
export async function run(raw: Record<string, unknown>, io: CliIo): Promise<number> {
  const paths = (Array.isArray(raw.paths) ? raw.paths : [raw.paths]).map(String).filter((p) => p !== STDIN_TOKEN);
  if (paths.length === 0) throw new UsageError('name the shard outputs to merge');
  const kinds = parseKinds(raw.kinds);
  const contents = shardFiles(paths).map((file) => {
    let text: string;
    try {
      text = readFileSync(file, 'utf8');
    } catch (e) {
      throw new UsageError(`${file}: cannot read (${(e as NodeJS.ErrnoException).code ?? (e as Error).message})`);
    }
    return { source: file, content: shardFromNdjson(text, file) };
  });
  const merged = mergeShards(contents, { kinds });
  const { events, tracks, stations, failures } = merged;
  for (const f of failures) io.stderr(`fropa: station ${f.station} skipped: ${f.reason}\n`);
  if (failures.length > 0 && failures.length >= stations.length) {
    io.stderr(`fropa: detection failed at every station (${stations.length}); nothing usable remains\n`);
    return 1;
  }
  const outDir = raw.outDir as string | undefined;
  if (outDir !== undefined) {
    const { summary, files } = outputFolderFiles(events, tracks, stations);
    const written = writeOutputFolder(outDir, files);
    io.stdout(summary + written.map((p) => `wrote ${p}`).join('\n') + '\n');
  } else {
    const format = String(raw.format ?? 'table');
    const text = format === 'csv' ? eventsToCsv(events) : format === 'json' ? eventsToJson(events) : format === 'ndjson' ? eventsToNdjson(events) : passagesToTable(events, tracks, { stations });
    await writeOutput(text, raw.out as string | undefined, io);
  }
  if (failures.length === 0) return 0;
  io.stderr(failureSummary(failures, stations.length));
  return EXIT_SOME_FAILED;
}
