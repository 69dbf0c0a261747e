/**
 * The file-system edge of every output fropa writes: never over an input file, never over an existing file
 * unless forced, and atomically (each file written to a temporary name in its own folder, then renamed), so a
 * failure never leaves a mixed set of old and new files.
 */
import { existsSync, mkdirSync, realpathSync, renameSync, rmSync, statSync, writeFileSync, openSync, writeSync, closeSync } from 'node:fs';
import { basename, dirname, join, resolve } from 'node:path';
import { UsageError } from '../model/index.js';

export interface SafeWriteOptions {
  /** Replace files that already exist (never an input file). */
  force?: boolean;
  /** Files that were read as input: never written over, even with `force`. */
  inputs?: readonly string[];
  /** Create missing parent folders (the `--out-dir` bundle); otherwise a missing folder is a write failure. */
  mkdirs?: boolean;
}

/** One file to write: where, and its text. */
export interface PlannedFile {
  path: string;
  /** The whole text, or its pieces in order (written one at a time, so the whole text is never held). */
  text: string | Iterable<string>;
}

/** Canonical path: the real path when it exists, else the real path of the nearest existing folder joined with the rest. */
function canonical(p: string): string {
  const abs = resolve(p);
  if (existsSync(abs)) {
    try {
      return realpathSync(abs);
    } catch {
      return abs;
    }
  }
  const parent = dirname(abs);
  return parent === abs ? abs : join(canonical(parent), basename(abs));
}

/**
 * Check a set of planned outputs before anything is written: a path that is an input file, a folder, or (without
 * `force`) an existing file, and two outputs with the same path, are usage errors (exit code 2) naming the path.
 */
export function checkOutputs(paths: readonly string[], opts: SafeWriteOptions = {}): void {
  const inputs = new Set((opts.inputs ?? []).map(canonical));
  const seen = new Set<string>();
  for (const p of paths) {
    const c = canonical(p);
    if (inputs.has(c)) throw new UsageError(`${p}: is an input file; fropa never writes over its inputs (choose another output name)`);
    if (seen.has(c)) throw new UsageError(`${p}: named twice as an output`);
    seen.add(c);
    if (existsSync(c)) {
      if (statSync(c).isDirectory()) throw new UsageError(`${p}: is a folder, not a file`);
      if (!opts.force) throw new UsageError(`${p}: already exists; add --force to replace it, or choose another name`);
    }
  }
}

let counter = 0;

/**
 * Write every file atomically after `checkOutputs`: all texts go to temporary files beside their targets first
 * (`.name.fropa-tmp-PID-N`), then each is renamed over its target; when any write fails, the temporary files are
 * removed and no target is touched. Throws UsageError (see checkOutputs) or an Error
 * naming the path that could not be written. Parent folders are created only with `mkdirs`.
 */
export function writeFilesSafely(files: readonly PlannedFile[], opts: SafeWriteOptions = {}): string[] {
  checkOutputs(
    files.map((f) => f.path),
    opts,
  );
  const temps: string[] = [];
  try {
    for (const f of files) {
      const dir = dirname(resolve(f.path));
      if (opts.mkdirs) {
        try {
          mkdirSync(dir, { recursive: true });
        } catch (e) {
          throw new Error(`${dirname(f.path)}: cannot create the output folder (${(e as NodeJS.ErrnoException).code ?? (e as Error).message})`);
        }
      }
      const tmp = join(dir, `.${basename(f.path)}.fropa-tmp-${process.pid}-${++counter}`);
      try {
        if (typeof f.text === 'string') writeFileSync(tmp, f.text, { flag: 'wx' });
        else {
          const fd = openSync(tmp, 'wx');
          temps.push(tmp);
          try {
            for (const piece of f.text) writeSync(fd, piece);
          } finally {
            closeSync(fd);
          }
          temps.pop();
        }
      } catch (e) {
        throw new Error(`${f.path}: cannot write the output file (${(e as NodeJS.ErrnoException).code ?? (e as Error).message})`);
      }
      temps.push(tmp);
    }
  } catch (e) {
    for (const t of temps) rmSync(t, { force: true });
    throw e;
  }
  files.forEach((f, i) => renameSync(temps[i]!, resolve(f.path)));
  return files.map((f) => f.path);
}
