/** `fropa inspect <paths...>`: how each file was read, and what each station holds. */
import { buildInspect, inspectToTable, issueLine, loadPaths, type FileReport } from '../../src/index.js';
import { inputArgs, resolveLoadOptions, writeOutput, type CliIo } from '../options.js';

/** Run inspect; returns the exit code (1 when no file yielded an observation). */
export async function run(raw: Record<string, unknown>, io: CliIo): Promise<number> {
  const args = inputArgs(raw);
  const opts = await resolveLoadOptions(args, io);
  const result = loadPaths(args.paths, opts);
  const files = buildInspect(result.reports, result.series, result.qc);
  const text = raw.format === 'json' ? JSON.stringify(files, null, 2) + '\n' : inspectToTable(files);
  await writeOutput(text, args.out, io);
  if (result.series.length === 0) {
    io.stderr(noDataMessage(args.paths, result.reports));
    return 1;
  }
  return 0;
}

/** `fropa: no usable data in …` plus the first issues and notes that say why, each naming its file. */
export function noDataMessage(paths: readonly string[], reports: readonly FileReport[]): string {
  const lines = [`fropa: no usable data in ${paths.join(', ')}`];
  for (const r of reports) {
    if (r.format === 'stations') continue;
    const reasons = Object.entries(r.rejectedByReason).map(([k, n]) => `${k} ${n}`);
    lines.push(`  ${r.file}: ${r.format}, ${r.parsed} parsed, ${r.rejected} rejected${reasons.length ? ` (${reasons.join(', ')})` : ''}${r.issues.length === 0 && r.notes.length ? `; ${r.notes[0]}` : ''}`);
    for (const i of r.issues.slice(0, 3)) lines.push(`  ${issueLine(i)}`);
  }
  return lines.join('\n') + '\n';
}
