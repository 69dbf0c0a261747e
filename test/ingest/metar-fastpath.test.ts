/**
 * The single-pass byte decoder (decodeBytesInto) against the general decoder (decodeInto on the line as
 * text, lite mode, general tokenizer): wherever the fast path accepts a line, the decoded report must be the same, field by
 * field (NaN, -0 and array contents included). Lines: every line of test/fixtures/metar-corpus.txt
 * (real KJFK/KORD reports and constructed WMO-style ones, provenance in its header), the demo METAR
 * files, the real METAR files of the shared folder when present, the synthetic benchmark corpus, and
 * random lines built from a vocabulary of common and tricky groups (fast-check).
 * Equality to our own general decoder, not to an outside source: the general decoder's values are
 * checked against WMO-No. 306 / FMH-1 and metar-taf-parser in metar.test.ts and metar-crosscheck.test.ts.
 */
import { readdirSync, readFileSync } from 'node:fs';
import { test } from 'uvu';
import * as assert from 'uvu/assert';
import fc from 'fast-check';
import { archiveStampInto } from '../../src/ingest/metar/calendar.js';
import { decodeInto, newMetarReport, type DecodeRef, type MetarReport } from '../../src/ingest/metar/decodeMetar.js';
import { decodeBytesInto } from '../../src/ingest/metar/byteMetar.js';
import { generateCorpus } from '../../bench/ingest-metar.js';
import { REALDATA_DIR, realdataTest } from '../helpers/realdata.js';

const fast = newMetarReport();
const slow = newMetarReport();

/** Canonical text of a report (NaN and -0 spelled out). */
function canon(r: MetarReport): string {
  return JSON.stringify(r, (_k, v) => (typeof v === 'number' && (Number.isNaN(v) || Object.is(v, -0)) ? String(v === 0 ? '-0' : v) : v));
}

/** Decode one line both ways as readMetarBytes would; returns [fast path used, mismatch text or ''] */
function compareLine(line: string): [boolean, string] {
  const u = Buffer.from(line, 'utf8');
  let a = 0;
  let b = line.length;
  while (a < b && line.charCodeAt(a) <= 32) a++;
  while (b > a && line.charCodeAt(b - 1) <= 32) b--;
  if (a === b || line.charCodeAt(a) === 35) return [false, ''];
  // byte positions of the same trimmed line
  let ua = 0;
  let ub = u.length;
  while (ua < ub && u[ua]! <= 32) ua++;
  while (ub > ua && u[ub - 1]! <= 32) ub--;
  const ref: DecodeRef = { year: 2024, month: 2, refDay: 10, refMode: 'nearest', file: 'x', line: 1, column0: 0 };
  const st = { year: 0, month: 0, day: 0, next: 0 };
  let start = a;
  let ustart = ua;
  // the stamp is ASCII: the same number of characters and bytes from the trimmed start
  if (u[ua]! <= 57 && archiveStampInto(u, ua, ub, st)) {
    ref.year = st.year;
    ref.month = st.month;
    ref.refDay = st.day;
    ref.refMode = 'archive';
    ref.column0 = st.next - ua;
    start = a + (st.next - ua);
    ustart = st.next;
  }
  if (!decodeBytesInto(fast, u, ustart, ub, { ...ref })) return [false, ''];
  for (let i = ustart; i < ub; i++) if (u[i]! < 32 || u[i]! > 126) return [true, 'fast path took a line with a control or non-ASCII byte'];
  const is = decodeInto(slow, line, start, b, { ...ref }, true);
  if (is) return [true, `general decoder refused: ${is.reason}`];
  const x = canon(fast);
  const y = canon(slow);
  return [true, x === y ? '' : `fast ${x}\nslow ${y}`];
}

function checkLines(lines: string[], what: string, minFast: number): void {
  let used = 0;
  for (const l of lines) {
    const [u, diff] = compareLine(l);
    if (u) used++;
    if (diff) assert.unreachable(`${what}: ${l}\n${diff}`);
  }
  assert.ok(used >= minFast, `${what}: fast path took ${used} lines, expected at least ${minFast}`);
}

test('fixture corpus: fast path == general decoder on every line it takes', () => {
  const lines = readFileSync(new URL('../fixtures/metar-corpus.txt', import.meta.url), 'utf8').split('\n');
  checkLines(lines, 'metar-corpus.txt', 10);
});

test('demo METAR files: fast path == general decoder', () => {
  const dir = new URL('../../stations-demo/', import.meta.url);
  const files = readdirSync(dir).filter((f) => f.endsWith('.metar.txt'));
  assert.ok(files.length > 0);
  for (const f of files) checkLines(readFileSync(new URL(f, dir), 'utf8').split('\n'), f, 1);
});

realdataTest(test)('real METAR files of the shared folder (skipped when absent)', () => {
  const files = readdirSync(REALDATA_DIR).filter((f) => /metar.*\.txt$/i.test(f));
  for (const f of files) checkLines(readFileSync(REALDATA_DIR + f, 'utf8').split('\n'), f, 1);
});

test('synthetic benchmark corpus (invented reports): fast path == general decoder', () => {
  checkLines(generateCorpus(20_000).split('\n'), 'bench corpus', 19_000);
});

/** Groups the fast path handles, nearly-handled look-alikes and rare forms (invented combinations). */
const GROUPS = [
  'AUTO', 'COR', 'CCA', 'NIL', 'NOSIG', 'BECMG', 'TEMPO', 'RMK', 'CAVOK', '$', '=', 'KT', 'MPS',
  '27015KT', '27015G25KT', '00000KT', '36010KT', '37010KT', 'VRB03KT', '27005MPS', '270P99KT', '210103G130KT', '///05KT', '27015G2KT', '2701KT', '27015KMH', '04015',
  '250V310', '370V010', '9999', '0800', '4000NE', '1234', '10SM', '1/2SM', '1', '2', '11/2SM', 'M1/4SM', 'P6SM', '1/0SM', '1000SM', 'SM',
  '-RA', 'RA', '+TSRA', 'BR', 'FG', 'VCSH', 'MIFG', 'NSW', 'RERA', 'REXX', 'XX', '-XX', 'TS', 'SHRA', 'FZRA',
  'FEW020', 'SCT015CB', 'BKN100TCU', 'OVC///', 'OVC02', 'OVC0A0', 'VV002', 'CLR', 'SKC', 'NSC', 'NCD', '//////',
  '12/08', 'M05/M07', '12/M03', '00/M00', 'M00/M01', '12/', '1A/08', '12/0A', '/////', 'M5/M07',
  'A2992', 'A29A2', 'A////', 'Q1013', 'Q101', 'R27L/0450N', 'R27', 'WS', 'W15/S2', 'SLP123',
  'AO2', 'AO1', 'AO2A', 'SLP982', 'SLPNO', 'SLP12A', 'T01230045', 'T1012', 'T0123004', 'T2123', 'P0000', 'P0012', 'P////', 'PK', 'WND',
  '27030/45', '270030/1215', '27030/75', '58012', '50000', '5////', '59012', '10123', '21012', '1////', '30000', '4/005', '60012',
  'PRESRR', 'PRESFR', 'RAB07', 'RAE21B40', 'TSB05', 'WSHFT', '30', 'FROPA', 'LTG', 'LTGICCG', 'RWY27', 'VIS', 'CIG', 'SNINCR', 'DSNT', 'XYZ',
  // bytes the fast path must leave to the general decoder: non-ASCII, tabs, carriage returns inside a line
  'RÉ', 'Ré/1', 'A2992\t', '\t-RA', '+RA\r', 'SNIXXX', 'PRESXR',
];

/** Groups the fast path takes (drawn more often, so that many random lines reach it). */
const COMMON = new Set([
  'AUTO', 'NOSIG', 'BECMG', 'RMK', 'CAVOK', '$', '27015KT', '27015G25KT', '00000KT', '36010KT', '37010KT', 'VRB03KT', '27005MPS', '250V310',
  '9999', '0800', '10SM', '1/2SM', '1', 'P6SM', '-RA', 'RA', '+TSRA', 'BR', 'VCSH', 'MIFG', 'NSW', 'FEW020', 'SCT015CB', 'OVC02', 'CLR', 'VV002',
  '12/08', 'M05/M07', '12/M03', '00/M00', 'A2992', 'A29A2', 'Q1013', 'R27L/0450N', 'AO2', 'AO1', 'SLP982', 'T01230045', 'T1012', 'P0000', 'PK', 'WND',
  '27030/45', '58012', '50000', '10123', '21012', 'PRESRR', 'RAB07', 'TSB05', 'LTG', 'RWY27',
]);

test('random lines of common and tricky groups: fast path == general decoder (fast-check)', () => {
  const header = fc.tuple(
    fc.constantFrom('', 'METAR ', 'SPECI ', 'METAR COR ', '202402101651 ', '2024-02-10T16:51:00Z METAR ', 'COR '),
    fc.constantFrom('KORD', 'EGLL', 'K1A', 'KABCDE', 'kord', 'K-OR'),
    fc.constantFrom(' 101651Z', ' 101651', ' 102400Z', ' 102401Z', ' 321651Z', ' 10165Z', ''),
  );
  const common = fc.constantFrom(...GROUPS.filter((g) => COMMON.has(g)));
  const body = fc.array(fc.oneof({ arbitrary: common, weight: 12 }, { arbitrary: fc.constantFrom(...GROUPS), weight: 1 }), { maxLength: 18 });
  let used = 0;
  fc.assert(
    fc.property(header, body, fc.constantFrom(' ', '  '), fc.boolean(), ([h, st, tm], groups, sep, eq) => {
      const line = h + st + tm + (groups.length ? ' ' : '') + groups.join(sep) + (eq ? '=' : '');
      const [u, diff] = compareLine(line);
      if (u) used++;
      if (diff) throw new Error(`${line}\n${diff}`);
    }),
    { numRuns: 20_000, seed: 20240227 },
  );
  assert.ok(used > 800, `fast path took only ${used} random lines`);
});

test.run();
