/**
 * Where the tests find the public real observations (read-only, not part of the repository): the folder named by
 * the environment variable FROPA_SHARED, else `../shared` beside the repository; the files are in its `realdata/`.
 * Tests that need them register through `realdataTest`, which turns them into skipped tests (counted as skipped by
 * test/run.ts) when the files are absent. `FROPA_SHARED=/nonexistent npm test` exercises that path.
 */
import { existsSync } from 'node:fs';
import { join, resolve, sep } from 'node:path';
import { fileURLToPath } from 'node:url';
import type { Test } from 'uvu';

/** The shared folder: $FROPA_SHARED, or ../shared beside the repository. */
export const SHARED_DIR = process.env.FROPA_SHARED ? resolve(process.env.FROPA_SHARED) : fileURLToPath(new URL('../../../shared/', import.meta.url));

/** The real-data folder, with a trailing separator (so `REALDATA_DIR + name` is a path). */
export const REALDATA_DIR = join(SHARED_DIR, 'realdata') + sep;

/** True when the real-data folder (and each named file in it) exists. */
export function haveRealdata(...names: string[]): boolean {
  return existsSync(REALDATA_DIR) && names.every((n) => existsSync(REALDATA_DIR + n));
}

/** A test registrar: uvu's `test` or `test.skip`. */
export type Register = (name: string, fn: () => void | Promise<void>) => void;

/** `test`, or `test.skip` when the real-data folder or one of the named files is absent. */
export function realdataTest(test: Test, ...names: string[]): Register {
  return haveRealdata(...names) ? test : (name, fn) => test.skip(name, fn);
}

/** The longer real series for skill evaluation (`realskill/` of the shared folder), with a trailing separator. */
export const REALSKILL_DIR = join(SHARED_DIR, 'realskill') + sep;

/** `test`, or `test.skip` when the named files of the shared `realskill/` folder are absent. */
export function realskillTest(test: Test, ...names: string[]): Register {
  const have = existsSync(REALSKILL_DIR) && names.every((n) => existsSync(REALSKILL_DIR + n));
  return have ? test : (name, fn) => test.skip(name, fn);
}
