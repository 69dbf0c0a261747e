/**
 * The in-place scan of quote-free CSV (readCsvBytes / readCsvText, parser 'auto') against papaparse's own
 * parse of the same text (parser 'papaparse'): observations, issues, notes, value counts, units and station
 * positions must be the same. Reference: papaparse (general-purpose CSV library from the registry); the rows
 * are invented (seeded), with the oddities real exports carry: missing markers, sentinels, flags, truncated
 * and over-long rows, blank lines, padded cells, non-breaking spaces, decimal commas, times going backwards,
 * empty station cells, CRLF and CR line endings, a BOM, semicolons and tabs, unit inference, local times.
 */
import { readdirSync, readFileSync } from 'node:fs';
import { test } from 'uvu';
import * as assert from 'uvu/assert';
import { CsvCore, readCsvBytes, readCsvText, type CsvOptions } from '../../src/ingest/csv.js';
import { decodeMetarAt, isParseIssue, metarToObservation } from '../../src/ingest/metar.js';
import { makeRng } from '../../tools/synth/random.js';
import { REALDATA_DIR, realdataTest } from '../helpers/realdata.js';

// count the in-place scans, so that each comparison is known to compare the two parsers
let scans = 0;
const scanBytes = CsvCore.prototype.scanBytes;
CsvCore.prototype.scanBytes = function (this: CsvCore, ...args: Parameters<typeof scanBytes>) {
  scans++;
  return scanBytes.apply(this, args);
};

const ODD: ((r: string, rand: () => number) => string)[] = [
  (r) => r.replace(',', ',,'), // one cell too many
  (r) => r.slice(0, r.length >> 1), // truncated
  () => '', // blank line
  () => '   ', // blank cells only
  (r) => r.replace(/,M(,|$)/, ',-9999$1'), // sentinel
  (r) => r.replace(/,/g, (m, i: number) => (i % 3 === 0 ? ', ' : m)), // padded cells
  (r) => r.replace(/,[0-9.]+$/, ',T'), // trace flag
  (r) => r.replace(/,([0-9])/, ',1e3x$1'), // garbage
  (r) => r + ',extra', // extra cell
  (r) => ',' + r.slice(r.indexOf(',') + 1), // empty station
  (r) => r.replace('2021', '2020'), // time going backwards
  (r) => r.replace(/(\d)\.(\d)/, '$1,$2'), // a stray decimal comma (shifts cells)
  (r) => r.replace(/,([0-9.]+),/, ',$1s,'), // suspect flag
  (r) => r.replace(',', ',\u00a0'), // non-breaking space
  (r) => r.replace(/,(\d\d\d\d-)/, ', $1'), // blank before the time
  (r) => r.replace(/ \d\d:\d\d/, ' 25:61'), // impossible time
  (r) => r.replace(/ (\d\d:\d\d)/, 'T$1Z'), // time with Z
  (r) => r.replace(/,(\d\d\d\d-\d\d-\d\d \d\d:\d\d)/, ',$1:00'), // seconds (not the quick form)
  (r) => r.replace(/^[A-Z]+/, 'KÉÉ'), // non-ASCII station
  (r) => r.replace(/,M,/, ',NA,'),
];

/** Rows in the IEM-download style (invented stations and values), with oddities mixed in. */
function makeText(nRows: number, seed: number, delimiter: string, newline: string, bom: boolean, header: string): string {
  const rand = makeRng(seed).next;
  const ids = ['XAAA', 'XBBB', 'XCCC', 'XDDD'];
  const lines = [header];
  const t0 = Date.UTC(2021, 2, 1);
  for (let i = 0; i < nRows; i++) {
    const id = ids[i % ids.length]!;
    const time = new Date(t0 + Math.floor(i / ids.length) * 300_000).toISOString().slice(0, 16).replace('T', ' ');
    const t = (40 + rand() * 30).toFixed(2);
    const td = (20 + rand() * 20).toFixed(2);
    const gust = rand() < 0.2 ? String(20 + Math.floor(rand() * 20)) : 'M';
    const slp = rand() < 0.3 ? 'M' : (1000 + rand() * 30).toFixed(1);
    let row = `${id},${time},${t},${td},${(50 + rand() * 50).toFixed(2)},${Math.floor(rand() * 36) * 10},${Math.floor(rand() * 25)},${gust},${(29.5 + rand()).toFixed(2)},${slp},${rand() < 0.9 ? '0.00' : (rand() * 0.2).toFixed(2)}`;
    if (rand() < 0.03) row = ODD[Math.floor(rand() * ODD.length)]!(row, rand);
    lines.push(delimiter === ',' ? row : row.replaceAll(',', delimiter));
  }
  return (bom ? '\ufeff' : '') + lines.join(newline) + newline;
}

const IEM = 'station,valid,tmpf,dwpf,relh,drct,sknt,gust,alti,mslp,p01i';
const BARE = 'id,time,temp,dew,rh,dir,spd,gust,press,slp,rain';

/** As the loader decodes a raw METAR column. */
const decodeRawReport: CsvOptions['decodeRawReport'] = (text, timeMs, file, line) => {
  const r = decodeMetarAt(text, timeMs, file, line);
  return isParseIssue(r) ? null : { ...metarToObservation(r, file, line), tempFromRemarks: r.tempFromRemarks };
};

/** Canonical JSON (NaN, ±Infinity and Maps spelled out). */
function canon(x: unknown): string {
  return JSON.stringify(x, (_k, v) => (typeof v === 'number' && !Number.isFinite(v) ? String(v) : v instanceof Map ? [...v] : v));
}

/** Returns how many of the two non-reference reads scanned in place. */
function sameBothWays(text: string, what: string, opts: CsvOptions = {}): number {
  const before = scans;
  const ref = readCsvText(text, 'x.csv', { ...opts, parser: 'papaparse' });
  assert.is(scans, before, 'parser papaparse must not scan in place');
  const scanned = readCsvBytes(Buffer.from(text, 'utf8'), 'x.csv', opts);
  const scannedText = readCsvText(text, 'x.csv', opts);
  assert.ok(ref.report.lines > 0, `${what}: nothing read`);
  assert.is(canon(scanned), canon(ref), `${what}: readCsvBytes differs from papaparse`);
  assert.is(canon(scannedText), canon(ref), `${what}: readCsvText differs from papaparse`);
  return scans - before;
}

test('in-place scan == papaparse: commas, LF, IEM headers (unit names), oddities', () => {
  assert.is(sameBothWays(makeText(20_000, 1, ',', '\n', false, IEM), 'comma/LF'), 2);
});

test('in-place scan == papaparse: semicolons, CRLF, BOM, extra missing markers', () => {
  assert.is(sameBothWays(makeText(20_000, 2, ';', '\r\n', true, IEM), 'semicolon/CRLF/BOM', { missing: ['0.00', 'xx'] }), 2);
});

test('in-place scan == papaparse: tabs, CR, bare headers (units inferred), local time zone', () => {
  assert.is(sameBothWays(makeText(20_000, 3, '\t', '\r', false, BARE), 'tab/CR/bare', { zone: 'America/Chicago' }), 2);
});

realdataTest(test)('in-place scan == papaparse: real files of the shared folder (skipped when absent)', () => {
  for (const f of readdirSync(REALDATA_DIR).filter((n) => /\.(csv|tsv)$/.test(n))) {
    const text = readFileSync(REALDATA_DIR + f, 'utf8');
    sameBothWays(text, f, { decodeRawReport });
  }
});

test('readCsvBytes edge inputs read as the text path reads them (NUL, blank, non-ASCII start, no header rows)', () => {
  const rows = makeText(20_000, 5, ',', '\n', false, IEM);
  const cases: [string, string][] = [
    ['NUL in the first rows', rows.replace('\n', '\n\u0000\n')],
    ['only blanks', ' '.repeat(1 << 21) + '\n'],
    ['non-breaking spaces before the header', '\u00a0'.repeat(10) + '\n' + rows],
    ['header only, then blank lines', IEM + '\n'.repeat(1 << 21)],
    ['one column (no delimiter)', rows.replaceAll(',', ' ')],
  ];
  for (const [what, text] of cases) {
    const ref = readCsvText(text, 'x.csv', { parser: 'papaparse' });
    assert.is(canon(readCsvBytes(Buffer.from(text, 'utf8'), 'x.csv')), canon(ref), what);
  }
});

test('a quote anywhere keeps the file on papaparse (a quoted cell may hold the delimiter)', () => {
  const text = makeText(20_000, 4, ',', '\n', false, IEM).replace('XBBB,', '"XB,BB",');
  assert.is(sameBothWays(text, 'quoted'), 0);
  assert.ok(readCsvText(text, 'x.csv').observations.some((o) => o.station === 'XB,BB'));
});

test.run();
