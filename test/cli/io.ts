/** Test helpers for the CLI: an in-memory CliIo, temp files, and the no-stack-trace check. */
import { mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import * as assert from 'uvu/assert';
import { runCli, type CliIo } from '../../cli/run.js';

export interface CliResult {
  code: number;
  stdout: string;
  stderr: string;
}

/** Run the CLI in this process with captured streams; `stdin` is what `-` reads. */
export async function cli(argv: string[], stdin = ''): Promise<CliResult> {
  let stdout = '';
  let stderr = '';
  const io: CliIo = {
    stdout: (t) => void (stdout += t),
    stderr: (t) => void (stderr += t),
    readStdin: async () => stdin,
  };
  const code = await runCli(argv, io);
  return { code, stdout, stderr };
}

/** A fresh temp folder for one test file, removed when the test process exits. */
export function tempDir(prefix = 'fropa-cli-'): string {
  const dir = mkdtempSync(join(tmpdir(), prefix));
  process.on('exit', () => rmSync(dir, { recursive: true, force: true }));
  return dir;
}

/** Write a file into `dir` and return its path. */
export function put(dir: string, name: string, content: string | Buffer): string {
  const p = join(dir, name);
  writeFileSync(p, content);
  return p;
}

/** No stack-trace frames (`    at fn (file:line)`) in a stream. */
export function assertNoStack(text: string, what = 'stderr'): void {
  assert.not.match(text, /^\s{4}at /m, `${what} holds a stack trace:\n${text}`);
}
