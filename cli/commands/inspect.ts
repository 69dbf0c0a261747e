/** `fropa inspect <paths...>`: how each file was read, and what each station holds. */
import { buildInspect, inspectToTable, loadPaths, noDataMessage } from '../../src/index.js';
import { inputArgs, inputFiles, resolveLoadOptions, writeOutput, type CliIo } from '../options.js';

/** Run inspect; returns the exit code (1 when no file yielded an observation). */
export async function run(raw: Record<string, unknown>, io: CliIo): Promise<number> {
  const args = inputArgs(raw);
  const opts = await resolveLoadOptions(args, io);
  const result = loadPaths(args.paths, opts);
  const files = buildInspect(result.reports, result.series, result.qc);
  const text = raw.format === 'json' ? JSON.stringify(files, null, 2) + '\n' : inspectToTable(files);
  await writeOutput(text, args.out, io, { force: args.force, inputs: inputFiles(result.reports, [...args.paths, args.mapping, args.stations]) });
  if (result.series.length === 0) {
    io.stderr(noDataMessage(args.paths, result.reports));
    return 1;
  }
  return 0;
}
