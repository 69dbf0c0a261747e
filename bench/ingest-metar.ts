/**
 * METAR decoding speed. Generates a seeded synthetic corpus (invented reports, ≥ 1,000,000 lines,
 * many stations, US and WMO styles, remarks, archive prefixes) in os.tmpdir(), then measures in one run:
 *   (a) read the whole file as a string + String.split('\n') (the strictest floor: no per-line work at all);
 *   (a2) streaming line splitting with node:readline over a file stream (how Node code usually splits a
 *       file into lines), lines/s;
 *   (b) the file streamed in chunks (scanPaths + readDataFiles) into a SeriesBuilder + one typed series per
 *       station (what loadPaths does, without QC), reports/s; (b1) read the bytes + readMetarBytes to an
 *       Observation array; (b0) the decoder alone;
 *   (c) metar-taf-parser's parseMetar on a 50,000-line subset, reports/s.
 * Prints the figures and the ratios ours/split against both splitting references (target ≥ 0.3) and
 * ours/metar-taf-parser.
 * Run: node --import tsx bench/ingest-metar.ts [lines]
 */
import { createReadStream, readFileSync, writeFileSync, rmSync } from 'node:fs';
import { createInterface } from 'node:readline';
import { cpus, loadavg, tmpdir } from 'node:os';
import { join } from 'node:path';
import { pathToFileURL } from 'node:url';
import { parseMetar } from 'metar-taf-parser';
import { readMetarBytes, readMetarText } from '../src/ingest/metar.js';
import { readDataFiles, scanPaths } from '../src/ingest/readPaths.js';
import type { FileReport } from '../src/model/index.js';
import { decodeBytesInto } from '../src/ingest/metar/byteMetar.js';
import { archiveStampInto } from '../src/ingest/metar/calendar.js';
import { decodeInto, newMetarReport, type DecodeRef } from '../src/ingest/metar/decodeMetar.js';
import { SeriesBuilder } from '../src/series/seriesBuilder.js';
import { makeRng } from '../tools/synth/random.js';

const pad = (n: number, w: number) => String(Math.trunc(n)).padStart(w, '0');
const tc = (t: number) => (t < 0 ? 'M' + pad(-Math.round(t), 2) : pad(Math.round(t), 2));
const tg = (t: number) => (t < 0 ? '1' : '0') + pad(Math.round(Math.abs(t) * 10), 3);

interface StationState {
  id: string;
  us: boolean;
  mps: boolean;
  t: number;
  td: number;
  dir: number;
  spd: number;
  p: number;
}

/** Generate `n` report lines, time-major (all stations each hour), starting 2024-01-01. */
export function generateCorpus(n: number, seed = 20240227): string {
  const rand = makeRng(seed).next;
  const stations: StationState[] = [];
  const letters = 'ABCDEFGHIJKLMNOPQRSTUVWXYZ';
  const nStations = 400;
  for (let i = 0; i < nStations; i++) {
    const us = i % 3 !== 0;
    const first = us ? 'K' : 'ELU'[i % 3]!;
    const id = first + letters[Math.floor(i / 676) % 26]! + letters[Math.floor(i / 26) % 26]! + letters[i % 26]!;
    stations.push({ id, us, mps: !us && i % 2 === 0, t: 5 + rand() * 20 - 10, td: 0, dir: Math.floor(rand() * 36) * 10, spd: 8, p: 1013 });
  }
  const out: string[] = [];
  const t0 = Date.UTC(2024, 0, 1, 0, 51);
  let hour = 0;
  const wx = ['', '', '', '', '-RA', 'RA', '-SN', 'BR', '-DZ', '+TSRA', 'FG', '-SHRA', 'HZ', '-FZRA'];
  while (out.length < n) {
    for (const st of stations) {
      if (out.length >= n) break;
      // random walk
      st.t += (rand() - 0.5) * 1.5;
      if (st.t > 35) st.t -= 2;
      if (st.t < -25) st.t += 2;
      st.td = st.t - 1 - rand() * 8;
      st.dir = (st.dir + Math.round((rand() - 0.5) * 6) * 10 + 360) % 360;
      st.spd = Math.max(0, Math.min(40, st.spd + Math.round((rand() - 0.5) * 6)));
      st.p = Math.max(960, Math.min(1045, st.p + (rand() - 0.5) * 2));
      const speci = rand() < 0.08;
      const ms = t0 + hour * 3_600_000 - (speci ? Math.floor(rand() * 40 + 5) * 60_000 : 0);
      const d = new Date(ms);
      const ddhhmm = pad(d.getUTCDate(), 2) + pad(d.getUTCHours(), 2) + pad(d.getUTCMinutes(), 2) + 'Z';
      const gust = st.spd >= 15 && rand() < 0.5 ? 'G' + pad(st.spd + 8 + Math.floor(rand() * 12), 2) : '';
      const calm = st.spd === 0;
      const w = wx[Math.floor(rand() * wx.length)]!;
      const g: string[] = [];
      const pr = rand();
      if (pr < 0.5) g.push(`${d.getUTCFullYear()}${pad(d.getUTCMonth() + 1, 2)}${pad(d.getUTCDate(), 2)}${pad(d.getUTCHours(), 2)}${pad(d.getUTCMinutes(), 2)}`);
      else if (pr < 0.6) g.push(d.toISOString().slice(0, 16) + ':00Z');
      g.push(speci ? 'SPECI' : 'METAR', st.id, ddhhmm);
      if (rand() < 0.05) g.push('AUTO');
      if (st.us) {
        g.push(calm ? '00000KT' : `${pad(st.dir, 3)}${pad(st.spd, 2)}${gust}KT`);
        if (st.spd > 6 && rand() < 0.1) g.push(`${pad((st.dir + 330) % 360, 3)}V${pad((st.dir + 40) % 360, 3)}`);
        const vis = w === 'FG' ? '1/4SM' : w === 'BR' ? '1 1/2SM' : w ? `${1 + Math.floor(rand() * 9)}SM` : '10SM';
        g.push(vis);
        if (w) g.push(w);
        const cov = ['FEW', 'SCT', 'BKN', 'OVC'];
        const layers = Math.floor(rand() * 3);
        if (layers === 0) g.push('CLR');
        for (let k = 0; k < layers; k++) g.push(cov[Math.floor(rand() * 4)]! + pad(5 + k * 30 + Math.floor(rand() * 20), 3) + (w === '+TSRA' && k === 0 ? 'CB' : ''));
        g.push(`${tc(st.t)}/${tc(st.td)}`, 'A' + pad(Math.round((st.p - 0.3) / 33.8639 * 100), 4));
        g.push('RMK', 'AO2');
        if (gust && rand() < 0.5) g.push('PK', 'WND', `${pad(st.dir, 3)}${pad(st.spd + 15, 2)}/${pad(Math.floor(rand() * 50), 2)}`);
        if (rand() < 0.01) g.push('WSHFT', pad(Math.floor(rand() * 50), 2), ...(rand() < 0.5 ? ['FROPA'] : []));
        if (w && rand() < 0.3) g.push('RAB' + pad(Math.floor(rand() * 50), 2));
        if (rand() < 0.03) g.push(rand() < 0.5 ? 'PRESRR' : 'PRESFR');
        if (!speci) g.push('SLP' + pad(Math.round(st.p * 10) % 1000, 3));
        if (w && w !== 'BR' && w !== 'FG' && w !== 'HZ') g.push('P' + pad(Math.floor(rand() * 30), 4));
        g.push('T' + tg(st.t) + tg(st.td));
        if (d.getUTCHours() % 3 === 2 && !speci) g.push('5' + Math.floor(rand() * 9) + pad(Math.floor(rand() * 40), 3));
        if (d.getUTCHours() % 6 === 5 && !speci) g.push('1' + tg(st.t + 2), '2' + tg(st.t - 2));
        if (rand() < 0.3) g.push('$');
      } else {
        const spd = st.mps ? Math.round(st.spd / 2) : st.spd;
        g.push(calm ? (st.mps ? '00000MPS' : '00000KT') : `${pad(st.dir, 3)}${pad(spd, 2)}${st.mps ? 'MPS' : 'KT'}`);
        if (!w && rand() < 0.3) g.push('CAVOK');
        else {
          g.push(w === 'FG' ? '0200' : w ? pad(1000 + Math.floor(rand() * 8) * 1000, 4) : '9999');
          if (w === 'FG') g.push('R27L/0450N');
          if (w) g.push(w);
          g.push(['FEW', 'SCT', 'BKN'][Math.floor(rand() * 3)]! + pad(10 + Math.floor(rand() * 40), 3));
        }
        g.push(`${tc(st.t)}/${tc(st.td)}`, 'Q' + pad(Math.floor(st.p), 4));
        g.push(rand() < 0.7 ? 'NOSIG' : 'BECMG');
        if (g[g.length - 1] === 'BECMG') g.push('9999', 'NSW');
      }
      out.push(g.join(' ') + (st.us ? '' : '='));
    }
    hour++;
  }
  return out.join('\n') + '\n';
}

/** Run f; returns [value, wall seconds, CPU seconds of this process (user + system)]. */
function time<T>(f: () => T): [T, number, number] {
  const c = process.cpuUsage();
  const t = process.hrtime.bigint();
  const v = f();
  const u = process.cpuUsage(c);
  return [v, Number(process.hrtime.bigint() - t) / 1e9, (u.user + u.system) / 1e6];
}

export interface MetarBenchFigures {
  lines: number;
  bytes: number;
  splitLinesPerS: number;
  /** node:readline streaming split, lines/s. */
  streamSplitLinesPerS: number;
  oursReportsPerS: number;
  oursDecodeOnlyReportsPerS: number;
  /** Decoder alone (read + decode into one reused report, no records), reports/s. */
  bareDecoderReportsPerS: number;
  parsed: number;
  rejected: number;
  unknownGroups: number;
  stations: number;
  referenceReportsPerS: number;
  referenceLines: number;
  ratioOursToSplit: number;
  /** (b) against the streaming split (a2). */
  ratioOursToStreamSplit: number;
  /** (read + decode to Observations) / split: the decoder's own target (≥ 0.3). */
  ratioDecodeOnlyToSplit: number;
  ratioOursToReference: number;
  /** The same figures from process CPU time (robust when other processes share the cores). */
  cpu: {
    splitLinesPerS: number;
    oursReportsPerS: number;
    oursDecodeOnlyReportsPerS: number;
    bareDecoderReportsPerS: number;
    referenceReportsPerS: number;
    ratioOursToSplit: number;
    ratioOursToStreamSplit: number;
    ratioDecodeOnlyToSplit: number;
    ratioOursToReference: number;
  };
}

/** Generate the corpus, measure (a), (b), (c), print and return the figures. */
export async function benchMetar(nLines = 1_000_000): Promise<MetarBenchFigures> {
  const file = join(tmpdir(), `fropa-bench_2024-01-01_metar-${process.pid}.txt`);
  const corpus = generateCorpus(nLines);
  writeFileSync(file, corpus);
  const bytes = Buffer.byteLength(corpus);
  try {
    // warm-up on a slice (JIT), not timed
    let cut = 0;
    for (let k = 0; k < 100_000 && cut >= 0; k++) cut = corpus.indexOf('\n', cut + 1);
    const warm = cut > 0 ? corpus.slice(0, cut + 1) : corpus;
    for (let k = 0; k < 2; k++) {
      warm.split('\n');
      readMetarText(warm, file);
    }
    const warmLines = warm.split('\n').slice(0, 2000);
    for (const l of warmLines) {
      try {
        parseMetar(l.replace(/^\S*\d{8}\S*\s+/, ''));
      } catch {
        /* counted below */
      }
    }
    // (a) read + split; best of 3
    let split = Infinity;
    let splitCpu = Infinity;
    let nSplit = 0;
    for (let k = 0; k < 3; k++) {
      const [lines, s, c] = time(() => readFileSync(file, 'utf8').split('\n'));
      nSplit = lines.length - 1;
      split = Math.min(split, s);
      splitCpu = Math.min(splitCpu, c);
    }
    // (a2) streaming split with node:readline; best of 3
    let stream = Infinity;
    let streamCpu = Infinity;
    let nStream = 0;
    for (let k = 0; k < 3; k++) {
      const c0 = process.cpuUsage();
      const t0 = process.hrtime.bigint();
      let n = 0;
      for await (const _line of createInterface({ input: createReadStream(file), crlfDelay: Infinity })) n++;
      const s = Number(process.hrtime.bigint() - t0) / 1e9;
      const u = process.cpuUsage(c0);
      nStream = n;
      stream = Math.min(stream, s);
      streamCpu = Math.min(streamCpu, (u.user + u.system) / 1e6);
    }
    // (b) the file streamed through the METAR reader (scanPaths + readDataFiles, as loadPaths) into a SeriesBuilder
    // (no Observation per report) + one series per station; best of 3
    let ours = Infinity;
    let oursCpu = Infinity;
    let res!: { report: FileReport };
    let nStations = 0;
    for (let k = 0; k < 3; k++) {
      const [, s, c] = time(() => {
        const b = new SeriesBuilder();
        const r = readDataFiles(scanPaths([file]).dataFiles, {}, (o) => b.add(o));
        res = { report: r.reports[0]! };
        nStations = 0;
        for (const id of b.stations()) {
          b.build(id);
          nStations++;
        }
      });
      ours = Math.min(ours, s);
      oursCpu = Math.min(oursCpu, c);
    }
    // (b1) read + readMetarBytes to an array of Observation records (the array API), no series
    let decodeOnly = Infinity;
    let decodeOnlyCpu = Infinity;
    for (let k = 0; k < 3; k++) {
      const [, sd, cd] = time(() => readMetarBytes(readFileSync(file), file).observations.length);
      decodeOnly = Math.min(decodeOnly, sd);
      decodeOnlyCpu = Math.min(decodeOnlyCpu, cd);
    }
    // (b0) the decoder alone into one reused MetarReport (no Observation records): where the time goes;
    // as in readMetarBytes, the byte decoder first, the general one (on the line as text) for lines it gives up on
    let bare = Infinity;
    let bareCpu = Infinity;
    for (let k = 0; k < 3; k++) {
      const [, sb, cb] = time(() => {
        const u = readFileSync(file);
        const r = newMetarReport();
        const st = { year: 0, month: 0, day: 0, next: 0 };
        const ref: DecodeRef = { year: 2024, month: 1, refDay: 1, refMode: 'nearest', file, line: 0, column0: 0 };
        let p = 0;
        while (p < u.length) {
          let e = u.indexOf(10, p);
          if (e < 0) e = u.length;
          let start = p;
          if (archiveStampInto(u, p, e, st)) {
            ref.year = st.year;
            ref.month = st.month;
            ref.refDay = st.day;
            ref.refMode = 'archive';
            start = st.next;
          } else ref.refMode = 'nearest';
          if (!decodeBytesInto(r, u, start, e, ref)) decodeInto(r, u.toString('utf8', start, e), 0, e - start, ref, true);
          p = e + 1;
        }
      });
      bare = Math.min(bare, sb);
      bareCpu = Math.min(bareCpu, cb);
    }
    // (c) metar-taf-parser on a 50,000-line subset (archive prefixes stripped: it takes the report only)
    const subset = corpus.split('\n', 50_000).map((l) => {
      const m = /^(?:\d{12}|\d{4}-\d\d-\d\dT\d\d:\d\d:\d\dZ)\s+/.exec(l);
      return m ? l.slice(m[0].length) : l;
    });
    let refFail = 0;
    const [, sRef, cRef] = time(() => {
      for (const l of subset) {
        try {
          parseMetar(l);
        } catch {
          refFail++;
        }
      }
    });
    const fig: MetarBenchFigures = {
      lines: nSplit,
      bytes,
      splitLinesPerS: nSplit / split,
      streamSplitLinesPerS: nStream / stream,
      oursReportsPerS: res.report.lines / ours,
      oursDecodeOnlyReportsPerS: res.report.lines / decodeOnly,
      bareDecoderReportsPerS: nSplit / bare,
      parsed: res.report.parsed,
      rejected: res.report.rejected,
      unknownGroups: res.report.unknownGroups ?? 0,
      stations: nStations,
      referenceReportsPerS: subset.length / sRef,
      referenceLines: subset.length,
      ratioOursToSplit: split / ours,
      ratioOursToStreamSplit: (res.report.lines / ours) / (nStream / stream),
      ratioDecodeOnlyToSplit: split / decodeOnly,
      ratioOursToReference: res.report.lines / ours / (subset.length / sRef),
      cpu: {
        splitLinesPerS: nSplit / splitCpu,
        oursReportsPerS: res.report.lines / oursCpu,
        oursDecodeOnlyReportsPerS: res.report.lines / decodeOnlyCpu,
        bareDecoderReportsPerS: nSplit / bareCpu,
        referenceReportsPerS: subset.length / cRef,
        ratioOursToSplit: splitCpu / oursCpu,
        ratioOursToStreamSplit: (res.report.lines / oursCpu) / (nStream / streamCpu),
        ratioDecodeOnlyToSplit: splitCpu / decodeOnlyCpu,
        ratioOursToReference: res.report.lines / oursCpu / (subset.length / cRef),
      },
    };
    const k = (x: number) => Math.round(x / 1000).toLocaleString('en-US') + 'k';
    console.log(`METAR bench: ${fig.lines.toLocaleString('en-US')} lines, ${(bytes / 1e6).toFixed(1)} MB, ${fig.stations} stations (node ${process.version})`);
    console.log(`  (a) read + String.split (in memory) ${k(fig.splitLinesPerS)} lines/s`);
    console.log(`  (a2) streaming split (node:readline) ${k(fig.streamSplitLinesPerS)} lines/s`);
    console.log(`  (b) read + decode to typed series  ${k(fig.oursReportsPerS)} reports/s  (parsed ${fig.parsed}, rejected ${fig.rejected}, unknown groups ${fig.unknownGroups})`);
    console.log(`  (b1) read + decode to Observation[] ${k(fig.oursDecodeOnlyReportsPerS)} reports/s  (the array API, no series)`);
    console.log(`  (b0) read + decoder alone, no records ${k(fig.bareDecoderReportsPerS)} reports/s  (split ratio ${(split / bare).toFixed(2)})`);
    console.log(`  (c) metar-taf-parser (50k subset)  ${k(fig.referenceReportsPerS)} reports/s  (${refFail} threw)`);
    console.log(`  wall clock, best of 3: decode to series / in-memory split = ${fig.ratioOursToSplit.toFixed(2)}, / streaming split = ${fig.ratioOursToStreamSplit.toFixed(2)} (target >= 0.30); Observation[] / split = ${fig.ratioDecodeOnlyToSplit.toFixed(2)}; ours / metar-taf-parser = ${fig.ratioOursToReference.toFixed(1)}x (target well over 50x)`);
    const c = fig.cpu;
    console.log(`  CPU time: split ${k(c.splitLinesPerS)}/s, streaming split ${k(nStream / streamCpu)}/s, decoder alone ${k(c.bareDecoderReportsPerS)}/s, to series ${k(c.oursReportsPerS)}/s, to Observation[] ${k(c.oursDecodeOnlyReportsPerS)}/s, metar-taf-parser ${k(c.referenceReportsPerS)}/s`);
    console.log(`            to series / in-memory split = ${c.ratioOursToSplit.toFixed(2)}, / streaming split = ${c.ratioOursToStreamSplit.toFixed(2)} (target >= 0.30), Observation[] / split = ${c.ratioDecodeOnlyToSplit.toFixed(2)}, ours / metar-taf-parser = ${c.ratioOursToReference.toFixed(1)}x`);
    console.log(`  load average ${loadavg().map((x) => x.toFixed(1)).join(' ')} on ${cpus().length} cores`);
    return fig;
  } finally {
    rmSync(file, { force: true });
  }
}

if (import.meta.url === pathToFileURL(process.argv[1] ?? '').href) {
  const n = Number(process.argv[2] ?? 1_000_000);
  await benchMetar(n);
}
