/**
 * CSV ingest throughput: papaparse streaming step-mode parse only (the reference the target is set against)
 * and papaparse streaming chunk-mode parse only, vs fropa's ingest to typed series (a SeriesBuilder plus one
 * typed series per station), on one synthetic seeded file (invented data, ≥ 1,000,000 rows, 12 columns)
 * written to the OS temp folder. fropa is timed three ways: as the command line reads a file (streamed in
 * chunks through scanPaths + readDataFiles: the in-place scan, this file having no quote character), through papaparse
 * (readCsvText with parser 'papaparse': what a file with quotes gets), and through readCsvStream (the
 * library's stream entry, papaparse chunk mode). Prints rows/s for each, wall clock and CPU time, and the
 * ratios (target ≥ 0.7 against step mode).
 * Run: node --import tsx bench/ingest-csv.ts [rows]
 */
import { createReadStream, createWriteStream, existsSync, readFileSync, statSync } from 'node:fs';
import { cpus, loadavg, tmpdir } from 'node:os';
import { join } from 'node:path';
import { pathToFileURL } from 'node:url';
import Papa from 'papaparse';
import { readCsvStream, readCsvText } from '../src/ingest/csv.js';
import { readDataFiles, scanPaths } from '../src/ingest/readPaths.js';
import { SeriesBuilder } from '../src/series/seriesBuilder.js';
import { makeRng } from '../tools/synth/random.js';


const HEADER = 'station,valid,tmpf,dwpf,relh,drct,sknt,gust,alti,mslp,p01i,vsby';

/** Write `rows` synthetic IEM-style rows (10 stations, 5-minute steps) and return the path. */
export async function writeSyntheticCsv(rows: number, seed = 20240227): Promise<string> {
  const path = join(tmpdir(), `fropa-bench-${rows}-${seed}.csv`);
  if (existsSync(path) && statSync(path).size > rows * 40) return path;
  const rnd = makeRng(seed).next; // the same seeded stream on every run: the same file
  const out = createWriteStream(path);
  const stations = ['KAAA', 'KBBB', 'KCCC', 'KDDD', 'KEEE', 'KFFF', 'KGGG', 'KHHH', 'KIII', 'KJJJ'];
  const perStation = Math.ceil(rows / stations.length);
  const t0 = Date.UTC(2020, 0, 1);
  let buf = HEADER + '\n';
  let written = 0;
  for (const st of stations) {
    let t = 50;
    let p = 30;
    for (let i = 0; i < perStation && written < rows; i++, written++) {
      const time = new Date(t0 + i * 300000).toISOString().slice(0, 16).replace('T', ' ');
      t += (rnd() - 0.5) * 1.5;
      p += (rnd() - 0.5) * 0.01;
      const td = t - 5 - rnd() * 10;
      const sknt = Math.round(rnd() * 25);
      const gust = rnd() < 0.2 ? String(sknt + 8 + Math.round(rnd() * 10)) : 'M';
      const prec = rnd() < 0.9 ? '0.00' : (rnd() * 0.2).toFixed(2);
      buf += `${st},${time},${t.toFixed(2)},${td.toFixed(2)},${(50 + rnd() * 50).toFixed(2)},${Math.round(rnd() * 36) * 10},${sknt},${gust},${p.toFixed(2)},${rnd() < 0.3 ? 'M' : (p * 33.8639).toFixed(1)},${prec},10.00\n`;
      if (buf.length > 1 << 20) {
        if (!out.write(buf)) await new Promise<void>((r) => out.once('drain', () => r()));
        buf = '';
      }
    }
  }
  out.end(buf);
  await new Promise<void>((r) => out.once('finish', () => r()));
  return path;
}

/** papaparse streaming parse only, one callback per row (step mode: the target's reference) or per block of rows (chunk mode). */
function papaOnly(path: string, mode: 'step' | 'chunk' = 'step'): Promise<number> {
  return new Promise((resolve, reject) => {
    let n = 0;
    const s = createReadStream(path, { encoding: 'utf8' });
    s.on('error', reject);
    const count =
      mode === 'step'
        ? {
            step: () => {
              n++;
            },
          }
        : {
            chunk: (r: Papa.ParseResult<string[]>) => {
              n += r.data.length;
            },
          };
    Papa.parse(s as unknown as string, {
      delimiter: '',
      delimitersToGuess: [',', '\t', ';', '|'],
      skipEmptyLines: false,
      ...count,
      complete: () => resolve(n),
    } as Papa.ParseConfig<string[]>);
  });
}

/** How fropa reads the file: as the command line does, forced through papaparse, or from a stream. */
type Way = 'file' | 'papaparse' | 'stream';

/** Read into a SeriesBuilder (one reused Observation, no object per row), then one series per station. */
async function fropaRead(path: string, way: Way): Promise<{ rows: number; series: number; readMs: number; buildMs: number }> {
  const t0 = performance.now();
  const builder = new SeriesBuilder();
  const sink = (o: Parameters<SeriesBuilder['add']>[0]) => builder.add(o);
  const { report } =
    way === 'stream'
      ? await readCsvStream(createReadStream(path), path, { reuseObservation: true }, sink)
      : way === 'file'
        ? { report: readDataFiles(scanPaths([path]).dataFiles, {}, sink).reports[0]! }
        : readCsvText(readFileSync(path, 'utf8'), path, { reuseObservation: true, parser: 'papaparse' }, sink);
  const t1 = performance.now();
  let series = 0;
  for (const station of builder.stations()) series += builder.build(station).length;
  return { rows: report.parsed, series, readMs: t1 - t0, buildMs: performance.now() - t1 };
}

export interface BenchResult {
  rows: number;
  papaRowsPerSec: number;
  fropaRowsPerSec: number;
  /** fropa / papaparse, wall clock (best of the repeats each). */
  ratio: number;
  /** The same from process CPU time (user + system), robust when other processes share the cores. */
  cpu: { papaRowsPerSec: number; fropaRowsPerSec: number; ratio: number };
  /** papaparse chunk mode parse only (for information; the target is against step mode above): rows/s and fropa / it. */
  chunk: { papaRowsPerSec: number; ratio: number; cpuPapaRowsPerSec: number; cpuRatio: number };
  /** fropa through papaparse (files with quotes) and through readCsvStream: rows/s and ratio to step mode (wall, CPU). */
  viaPapaparse: { rowsPerSec: number; ratio: number; cpuRatio: number };
  viaStream: { rowsPerSec: number; ratio: number; cpuRatio: number };
  readMs: number;
  buildMs: number;
}

/** Time an async function: [value, wall ms, CPU ms of this process]. */
async function timed<T>(f: () => Promise<T>): Promise<[T, number, number]> {
  const c = process.cpuUsage();
  const t = performance.now();
  const v = await f();
  const u = process.cpuUsage(c);
  return [v, performance.now() - t, (u.user + u.system) / 1000];
}

/** Run the benchmark (one warm-up, then best of `repeats` for each side, interleaved) and print figures. */
export async function benchCsv(rows = 1_000_000, repeats = 3): Promise<BenchResult> {
  const path = await writeSyntheticCsv(rows);
  console.log(`file ${path}: ${(statSync(path).size / 1e6).toFixed(1)} MB, ${rows} rows, 12 columns (node ${process.version})`);
  console.log('papaparse options are the same on all sides (delimiter guessing, default quote handling; fastMode not forced)');
  // warm-up (JIT) on every side, not timed
  await papaOnly(path);
  await papaOnly(path, 'chunk');
  for (const w of ['file', 'papaparse', 'stream'] as const) await fropaRead(path, w);
  let papaBest = Infinity;
  let papaCpu = Infinity;
  let chunkBest = Infinity;
  let chunkCpu = Infinity;
  let fropaBest = Infinity;
  let fropaCpu = Infinity;
  let split = { readMs: 0, buildMs: 0 };
  const other = { papaparse: { wall: Infinity, cpu: Infinity }, stream: { wall: Infinity, cpu: Infinity } };
  for (let r = 0; r < repeats; r++) {
    const [n, pw, pc] = await timed(() => papaOnly(path));
    papaBest = Math.min(papaBest, pw);
    papaCpu = Math.min(papaCpu, pc);
    const [nc, cw, cc] = await timed(() => papaOnly(path, 'chunk'));
    chunkBest = Math.min(chunkBest, cw);
    chunkCpu = Math.min(chunkCpu, cc);
    const [f, fw, fc] = await timed(() => fropaRead(path, 'file'));
    for (const w of ['papaparse', 'stream'] as const) {
      const [g, gw, gc] = await timed(() => fropaRead(path, w));
      if (g.rows !== rows) throw new Error(`row counts differ (${w}): ${g.rows}, expected ${rows}`);
      other[w].wall = Math.min(other[w].wall, gw);
      other[w].cpu = Math.min(other[w].cpu, gc);
    }
    if (fw < fropaBest) split = { readMs: f.readMs, buildMs: f.buildMs };
    fropaBest = Math.min(fropaBest, fw);
    fropaCpu = Math.min(fropaCpu, fc);
    if (f.rows !== rows || n !== rows + 1 || nc !== rows + 1 || f.series !== rows) throw new Error(`row counts differ: papa ${n - 1}, fropa ${f.rows} (${f.series} in series), expected ${rows}`);
  }
  const per = (ms: number) => rows / (ms / 1000);
  const res: BenchResult = {
    rows,
    papaRowsPerSec: per(papaBest),
    fropaRowsPerSec: per(fropaBest),
    ratio: papaBest / fropaBest,
    cpu: { papaRowsPerSec: per(papaCpu), fropaRowsPerSec: per(fropaCpu), ratio: papaCpu / fropaCpu },
    chunk: { papaRowsPerSec: per(chunkBest), ratio: chunkBest / fropaBest, cpuPapaRowsPerSec: per(chunkCpu), cpuRatio: chunkCpu / fropaCpu },
    viaPapaparse: { rowsPerSec: per(other.papaparse.wall), ratio: papaBest / other.papaparse.wall, cpuRatio: papaCpu / other.papaparse.cpu },
    viaStream: { rowsPerSec: per(other.stream.wall), ratio: papaBest / other.stream.wall, cpuRatio: papaCpu / other.stream.cpu },
    readMs: split.readMs,
    buildMs: split.buildMs,
  };
  const k = (x: number) => `${(x / 1e3).toFixed(0)} k rows/s`;
  console.log(`papaparse step parse only (reference): ${k(res.papaRowsPerSec)} wall (${papaBest.toFixed(0)} ms), ${k(res.cpu.papaRowsPerSec)} CPU (${papaCpu.toFixed(0)} ms)`);
  console.log(`papaparse chunk parse only:            ${k(res.chunk.papaRowsPerSec)} wall (${chunkBest.toFixed(0)} ms), ${k(res.chunk.cpuPapaRowsPerSec)} CPU (${chunkCpu.toFixed(0)} ms)`);
  console.log(`fropa file ingest to typed series:     ${k(res.fropaRowsPerSec)} wall (${fropaBest.toFixed(0)} ms), ${k(res.cpu.fropaRowsPerSec)} CPU (${fropaCpu.toFixed(0)} ms)  (the file streamed through scanPaths + readDataFiles, as the command line)`);
  console.log(`  of which read ${split.readMs.toFixed(0)} ms, series build ${split.buildMs.toFixed(0)} ms (wall)`);
  console.log(`ratio fropa / papaparse step:  ${res.ratio.toFixed(2)} wall, ${res.cpu.ratio.toFixed(2)} CPU (the issue's target: >= 0.70 against streaming step-mode parse only)`);
  console.log(`ratio fropa / papaparse chunk: ${res.chunk.ratio.toFixed(2)} wall, ${res.chunk.cpuRatio.toFixed(2)} CPU (for information)`);
  console.log(`fropa through papaparse (files with quotes): ${k(res.viaPapaparse.rowsPerSec)} wall, ratio to step ${res.viaPapaparse.ratio.toFixed(2)} wall, ${res.viaPapaparse.cpuRatio.toFixed(2)} CPU`);
  console.log(`fropa readCsvStream (library stream entry):  ${k(res.viaStream.rowsPerSec)} wall, ratio to step ${res.viaStream.ratio.toFixed(2)} wall, ${res.viaStream.cpuRatio.toFixed(2)} CPU`);
  console.log(`  load average ${loadavg().map((x) => x.toFixed(1)).join(' ')} on ${cpus().length} cores`);
  return res;
}

if (import.meta.url === pathToFileURL(process.argv[1] ?? '').href) {
  const rows = Number(process.argv[2] ?? 1_000_000);
  await benchCsv(rows);
}
