/**
 * Shards and merge: N shard runs plus `fropa merge` give exactly what one run gives (a contract of the
 * issue; reference: the one run on the same files, no external source), and the three ways of running shards
 * in deploy/shards/ pass the right shard arguments to fropa.
 */
import { test } from 'uvu';
import * as assert from 'uvu/assert';
import { execFileSync, spawnSync } from 'node:child_process';
import { chmodSync, copyFileSync, mkdirSync, readdirSync, readFileSync } from 'node:fs';
import { join } from 'node:path';
import { fileURLToPath } from 'node:url';
import { cli, put, tempDir } from '../cli/io.js';
import { fnv1a32, inShard, parseShard } from '../../src/index.js';

const ROOT = fileURLToPath(new URL('../../', import.meta.url));
const DEMO = join(ROOT, 'stations-demo');
const SHARDS = join(ROOT, 'deploy/shards');
const dir = tempDir('fropa-shards-');
// Four demo stations (a network) keep the runs short.
const archive = join(dir, 'archive');
mkdirSync(archive);
for (const f of readdirSync(DEMO).filter((f) => /^X[A-Z]{3}_.*\.(txt|csv)$/.test(f)).sort().slice(0, 4)) copyFileSync(join(DEMO, f), join(archive, f));
copyFileSync(join(DEMO, 'stations.csv'), join(archive, 'stations.csv'));
const BUNDLE = ['events.csv', 'events.json', 'fronts.csv', 'fronts.json', 'summary.txt'];
const bundle = (d: string) => BUNDLE.map((f) => readFileSync(join(d, f), 'utf8'));

let single: string[] = [];

test('FNV-1a 32-bit of published test strings; shards are 1-based and cover every id exactly once', () => {
  // IETF draft-eastlake-fnv (FNV-1a 32-bit test vectors): "" → 0x811c9dc5, "a" → 0xe40c292c, "foobar" → 0xbf9cf968
  assert.is(fnv1a32(''), 0x811c9dc5);
  assert.is(fnv1a32('a'), 0xe40c292c);
  assert.is(fnv1a32('foobar'), 0xbf9cf968);
  const ids = Array.from({ length: 500 }, (_, i) => `K${i.toString(36).toUpperCase()}`);
  for (const n of [1, 3, 8]) for (const id of ids) assert.is([...Array(n).keys()].filter((k) => inShard(id, { index: k + 1, count: n })).length, 1, `${id} in ${n} shards`);
  assert.equal(parseShard('2/8'), { index: 2, count: 8 });
  for (const bad of ['0/4', '5/4', '1/0', 'x', '1-4']) assert.throws(() => parseShard(bad), /must be K\/N/, bad);
});

test('fropa detect --shard K/N for N = 4 and fropa merge give the bytes of one run (events, fronts, summary)', async () => {
  const one = join(dir, 'one');
  const r = await cli(['detect', archive, '--jobs', '1', '--quiet', '--out-dir', one]);
  assert.is(r.code, 0, r.stderr);
  single = bundle(one);
  for (let k = 1; k <= 4; k++) {
    const s = await cli(['detect', archive, '--shard', `${k}/4`, '--jobs', '1', '--quiet', '--out', join(dir, `shard-${k}.ndjson`)]);
    assert.is(s.code, 0, s.stderr);
  }
  const merged = join(dir, 'merged');
  const m = await cli(['merge', ...[1, 2, 3, 4].map((k) => join(dir, `shard-${k}.ndjson`)), '--out-dir', merged]);
  assert.is(m.code, 0, m.stderr);
  assert.equal(bundle(merged), single);
  const missing = await cli(['merge', join(dir, 'shard-1.ndjson'), join(dir, 'shard-3.ndjson')]);
  assert.is(missing.code, 2);
  assert.match(missing.stderr, 'missing shards 2, 4 of 4');
});

/** A stand-in `fropa` that writes its arguments, one per line, to $ARGS_OUT. */
function fakeFropa(): string {
  const bin = join(dir, 'bin');
  mkdirSync(bin, { recursive: true });
  const p = put(bin, 'fropa', '#!/bin/sh\nfor a in "$@"; do printf "%s\\n" "$a"; done >> "$ARGS_OUT"\n');
  chmodSync(p, 0o755);
  return bin;
}

function shardArgs(args: string[]): { shard: string; out: string } {
  return { shard: args[args.indexOf('--shard') + 1]!, out: args[args.indexOf('--out') + 1]! };
}

// Kubernetes documentation, "Jobs: completion mode Indexed": each pod gets its index 0…completions−1 in the
// environment variable JOB_COMPLETION_INDEX.
test('deploy/shards/job.yaml: an Indexed Job whose pod with JOB_COMPLETION_INDEX i runs shard i+1 of completions', () => {
  const yaml = readFileSync(join(SHARDS, 'job.yaml'), 'utf8');
  assert.match(yaml, /^\s*completionMode: Indexed$/m);
  const completions = Number(/^\s*completions: (\d+)$/m.exec(yaml)![1]);
  const shards = Number(/- name: SHARDS\n\s*value: "(\d+)"/.exec(yaml)![1]);
  assert.is(shards, completions, 'SHARDS = completions');
  // The container's shell command: the folded block after `args:`.
  const lines = yaml.split('\n');
  const at = lines.findIndex((l) => /^\s*- >-$/.test(l));
  const indent = lines[at + 1]!.search(/\S/);
  const cmd: string[] = [];
  for (let i = at + 1; i < lines.length && lines[i]!.search(/\S/) >= indent; i++) cmd.push(lines[i]!.trim());
  const bin = fakeFropa();
  for (const index of [0, 3, completions - 1]) {
    const out = join(dir, `k8s-${index}.txt`);
    execFileSync('/bin/sh', ['-c', cmd.join(' ')], { env: { PATH: `${bin}:/usr/bin:/bin`, JOB_COMPLETION_INDEX: String(index), SHARDS: String(shards), ARGS_OUT: out } });
    const args = readFileSync(out, 'utf8').trim().split('\n');
    assert.equal(shardArgs(args), { shard: `${index + 1}/${completions}`, out: `/results/shard-${index + 1}.ndjson` });
    assert.is(args[0], 'detect');
  }
});

// Slurm sbatch documentation, "Job array": SLURM_ARRAY_TASK_ID is the task's index in --array,
// SLURM_ARRAY_TASK_COUNT the number of tasks.
test('deploy/shards/slurm.sh: array task K of --array=1-N runs shard K of N', () => {
  const script = readFileSync(join(SHARDS, 'slurm.sh'), 'utf8');
  const m = /^#SBATCH --array=1-(\d+)$/m.exec(script)!;
  const n = Number(m[1]);
  const bin = fakeFropa();
  for (const k of [1, 5, n]) {
    const out = join(dir, `slurm-${k}.txt`);
    execFileSync('bash', [join(SHARDS, 'slurm.sh')], {
      cwd: dir,
      env: { PATH: `${bin}:/usr/bin:/bin`, SLURM_ARRAY_TASK_ID: String(k), SLURM_ARRAY_TASK_COUNT: String(n), SLURM_CPUS_PER_TASK: '2', ARCHIVE: '/data/x', OUT: 'res', ARGS_OUT: out },
    });
    const args = readFileSync(out, 'utf8').trim().split('\n');
    assert.equal(shardArgs(args), { shard: `${k}/${n}`, out: `res/shard-${k}.ndjson` });
    assert.equal(args.slice(0, 2), ['detect', '/data/x']);
  }
});

// GNU parallel manual: `{}` is replaced by the input line; here the shard numbers 1…4 from seq.
const haveParallel = spawnSync('parallel', ['--version'], { encoding: 'utf8' }).status === 0;
if (haveParallel) {
  test('deploy/shards/parallel.sh: 4 shards through GNU parallel, merged, give the bytes of one run', () => {
    const out = join(dir, 'gnu');
    const fropa = `${process.execPath} --import tsx ${join(ROOT, 'cli/main.ts')}`;
    const r = spawnSync('bash', [join(SHARDS, 'parallel.sh'), archive, out, '4'], { cwd: ROOT, encoding: 'utf8', env: { ...process.env, FROPA: fropa } });
    assert.is(r.status, 0, r.stderr);
    assert.equal(readdirSync(out).filter((f) => f.endsWith('.ndjson')).sort(), ['shard-1.ndjson', 'shard-2.ndjson', 'shard-3.ndjson', 'shard-4.ndjson']);
    assert.ok(single.length > 0, 'the one-run bundle was made by the test above');
    assert.equal(bundle(join(out, 'merged')), single);
  });
} else {
  test.skip('deploy/shards/parallel.sh through GNU parallel (parallel not installed: apt-get install -y parallel; .ci/run installs it)');
}

test.run();
