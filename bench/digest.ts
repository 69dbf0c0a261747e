/**
 * `node --import tsx bench/digest.ts [--out FILE] [--skip-cli]`: SHA-256 digests of what fropa makes of the real
 * and demo inputs, to compare a reader change before and after (outputs must stay byte-identical).
 * Library level: every series column and every file report of `loadPaths` on each input. CLI level: stdout,
 * stderr and exit code of inspect, detect, verify and report (the HTML page) on each input, run as fresh processes.
 * Inputs: the shared real-data folders beside the checkout (`FROPA_SHARED` names another) and stations-demo.
 */
import { createHash } from 'node:crypto';
import { spawnSync } from 'node:child_process';
import { existsSync, mkdtempSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join, resolve } from 'node:path';
import { fileURLToPath } from 'node:url';
import { loadPaths, type StationSeries } from '../src/index.js';

const root = fileURLToPath(new URL('..', import.meta.url));
const shared = process.env.FROPA_SHARED ? resolve(process.env.FROPA_SHARED) : join(root, '..', 'shared');
const args = process.argv.slice(2);
const outAt = args.indexOf('--out');
const skipCli = args.includes('--skip-cli');
// run from the checkout (paths in outputs are as given: the demo relative, the shared folders as found)
process.chdir(root);
const inputs = [join(shared, 'realdata'), join(shared, 'realskill'), 'stations-demo'].filter((p) => existsSync(p));
const forecasts = join('stations-demo', 'forecasts', 'forecast_passages.csv');

const sha = (x: string | Uint8Array) => createHash('sha256').update(x).digest('hex').slice(0, 16);

/** Every column of a series, as bytes, in a fixed order. */
function seriesDigest(s: StationSeries): string {
  const h = createHash('sha256');
  h.update(JSON.stringify({ station: s.station, meta: s.meta, length: s.length, files: s.files, remarks: s.remarks, duplicates: s.duplicates }));
  for (const [k, v] of Object.entries(s).sort(([a], [b]) => a.localeCompare(b))) {
    if (ArrayBuffer.isView(v)) {
      h.update(k);
      h.update(new Uint8Array(v.buffer, v.byteOffset, v.byteLength));
    }
  }
  for (const [k, v] of Object.entries(s.qc).sort(([a], [b]) => a.localeCompare(b))) {
    h.update(k);
    h.update(v);
  }
  return h.digest('hex').slice(0, 16);
}

const lines: string[] = [];
for (const p of inputs) {
  const name = p.slice(p.lastIndexOf('/') + 1);
  const r = loadPaths([p]);
  lines.push(`${name} loadPaths series ${sha(r.series.map(seriesDigest).join(','))} reports ${sha(JSON.stringify(r.reports))} stations ${r.series.length}`);
  console.log(lines[lines.length - 1]);
}
if (!skipCli) {
  const tmp = mkdtempSync(join(tmpdir(), 'fropa-digest-'));
  try {
    for (const p of inputs) {
      const name = p.slice(p.lastIndexOf('/') + 1);
      const page = join(tmp, `${name}.html`);
      const runs: [string, string[]][] = [
        ['inspect', ['inspect', p]],
        ['detect', ['detect', p, '--jobs', '1']],
        ['verify', ['verify', p, '--forecasts', forecasts]],
        ['report', ['report', p, '--out', page, '--jobs', '1']],
      ];
      for (const [cmd, argv] of runs) {
        const r = spawnSync(process.execPath, ['--import', 'tsx', join(root, 'cli', 'main.ts'), ...argv], { cwd: root, encoding: 'buffer', maxBuffer: 1 << 30 });
        const extra = cmd === 'report' && existsSync(page) ? ` page ${sha(readFileSync(page))}` : '';
        // the temporary folder's name changes from run to run
        const clean = (b: Buffer) => sha(b.toString('utf8').split(tmp).join('<tmp>'));
        lines.push(`${name} ${cmd} exit ${r.status} stdout ${clean(r.stdout)} stderr ${clean(r.stderr)}${extra}`);
        console.log(lines[lines.length - 1]);
        rmSync(page, { force: true });
      }
    }
  } finally {
    rmSync(tmp, { recursive: true, force: true });
  }
}
if (outAt >= 0 && args[outAt + 1]) writeFileSync(args[outAt + 1]!, lines.join('\n') + '\n');
