/**
 * CSV cells a spreadsheet would execute are neutralised. Source: OWASP "CSV Injection" (owasp.org/www-community/attacks/CSV_Injection):
 * cells beginning with `=`, `+`, `-`, `@`, tab (0x09) or carriage return (0x0D) are formulas to Excel, LibreOffice
 * and Google Sheets; the guidance is to prepend a single quote and quote the cell. RFC 4180 §2 for the quoting.
 */
import { test } from 'uvu';
import * as assert from 'uvu/assert';
import Papa from 'papaparse';
import { csvCell, eventsToCsv, neutraliseFormula } from '../../src/report/format.js';
import { tracksToCsv } from '../../src/report/fronts.js';
import { sampleEvent } from './sampleEvent.js';

test('neutraliseFormula: OWASP CSV injection starts get a leading quote; plain numbers stay numbers', () => {
  // OWASP CSV Injection: each of = + - @ TAB CR at the start of a cell
  for (const bad of ['=1+2', '+SUM(A1)', '-2+3', '@SUM(A1)', '\t=1', '\r=1', '=HYPERLINK("http://x","y")', '-', '+ wind veered']) {
    assert.is(neutraliseFormula(bad), "'" + bad, JSON.stringify(bad));
  }
  // common practice, no source: a negative number in a text cell is data, not a formula
  for (const ok of ['-3.5', '+2', '-0.1', '1e-3', '-2E+5', 'KORD', 'wind 200°', '', ' =x']) assert.is(neutraliseFormula(ok), ok, JSON.stringify(ok));
});

test('csvCell: numbers as numbers, formula text quoted and prefixed, arrays checked as one cell', () => {
  assert.is(csvCell(-6), '-6');
  assert.is(csvCell(-0.5), '-0.5');
  assert.is(csvCell('=cmd|" /C calc"!A0'), `"'=cmd|"" /C calc""!A0"`);
  assert.is(csvCell(['@x', 'y']), "'@x; y");
  // RFC 4180 §2 rule 6: the CR still forces quoting after the prefix
  assert.is(csvCell('\r=1'), `"'\r=1"`);
});

test('eventsToCsv: a hostile station id is neutralised, negative changes stay numbers, no cell starts with + or -', () => {
  const csv = eventsToCsv([sampleEvent({ station: '=2+5+cmd|"/C calc"!A0', tempChangeC: -6.04 }), sampleEvent({ station: '@KABC' })]);
  const rows = Papa.parse<Record<string, string>>(csv.trim(), { header: true }).data;
  assert.is(rows[0]!.station, `'=2+5+cmd|"/C calc"!A0`);
  assert.is(rows[1]!.station, "'@KABC");
  assert.is(rows[0]!.temp_change_c, '-6');
  const cells = Papa.parse<string[]>(csv.trim()).data.flat();
  for (const c of cells) {
    if (/^[=+@\t\r-]/.test(c)) assert.ok(/^[+-]?\d+(\.\d+)?$/.test(c), `cell ${JSON.stringify(c)} would be executed`);
  }
});

test('tracksToCsv: passage lists are one cell that starts with a station id; formula ids neutralised', () => {
  assert.is(csvCell(['-KX@2026-03-04T12:00:00Z']), "'-KX@2026-03-04T12:00:00Z");
  assert.is(tracksToCsv([]).split('\n')[0]!.startsWith('front,kind'), true);
});

test.run();
