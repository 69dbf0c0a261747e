/**
 * Runs every `*.test.ts` under test/ in one process with uvu, then prints one closing line
 * `tests: N passed, N failed, N skipped` for CI. Optional argument: a substring filter on paths.
 * Skipped tests are those registered with uvu's `test.skip`, e.g. the real-data checks when the shared
 * folder is absent (test/helpers/realdata.ts; FROPA_SHARED=/nonexistent forces that path).
 */
import { readdirSync, statSync } from 'node:fs';
import { join, relative, resolve } from 'node:path';
import { fileURLToPath, pathToFileURL } from 'node:url';

const here = fileURLToPath(new URL('.', import.meta.url));
const filter = process.argv[2] ?? '';

function walk(dir: string, out: string[]): string[] {
  for (const name of readdirSync(dir).sort()) {
    const p = join(dir, name);
    if (statSync(p).isDirectory()) walk(p, out);
    else if (name.endsWith('.test.ts') && p.includes(filter)) out.push(p);
  }
  return out;
}

const files = walk(here, []);
(globalThis as any).UVU_DEFER = 1;
const uvu = await import('uvu');
let idx = 0;
for (const file of files) {
  (globalThis as any).UVU_INDEX = idx++;
  (globalThis as any).UVU_QUEUE.push([relative(resolve(here, '..'), file)]);
  await import(pathToFileURL(file).href);
}

// Capture uvu's summary to print the closing line CI reads.
let captured = '';
const write = process.stdout.write.bind(process.stdout);
process.stdout.write = ((chunk: any, ...rest: any[]) => {
  captured += String(chunk);
  return write(chunk, ...rest);
}) as typeof process.stdout.write;
await uvu.exec(false);
process.stdout.write = write;
const plain = captured.replace(/\x1b\[[0-9;]*m/g, '');
const num = (label: string) => Number(new RegExp(label + ':\\s+(\\d+)').exec(plain)?.[1] ?? 0);
const total = num('Total');
const passed = num('Passed');
const skipped = num('Skipped');
// uvu's Total counts the tests that ran; tests registered with test.skip are counted only under Skipped.
const failed = Math.max(0, total - passed);
if (files.length === 0) console.log('no test files found');
console.log(`tests: ${passed} passed, ${failed} failed, ${skipped} skipped`);
if (failed > 0 || files.length === 0) process.exitCode = 1;
