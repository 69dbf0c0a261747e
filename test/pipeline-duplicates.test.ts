/**
 * Conflicting duplicate reports (same station and minute, different values) are resolved by a rule on the reports
 * themselves, never by their order in the input: shuffling the lines of a file gives byte-identical detections
 * and the same series values. Data: the invented demo station XAVN (stations-demo/), with repeats, SPECIs at
 * the minute of a METAR, corrections (COR) and reports without their remarks added by the test (invented too).
 * Report forms: WMO-No. 306 FM 15/16 (METAR/SPECI, COR after the time group); FMH-1 §12 (a COR replaces the
 * report it corrects).
 */
import { readFileSync } from 'node:fs';
import { test } from 'uvu';
import * as assert from 'uvu/assert';
import fc from 'fast-check';
import { analyseSeries, eventsToCsv, loadPaths, SERIES_FIELDS, type StationSeries } from '../src/index.js';

const DEMO = readFileSync(new URL('../stations-demo/XAVN_2026-03_2026-04.metar.txt', import.meta.url), 'utf8').trim().split('\n');

/** The wind group with its speed raised by `kt` knots (`35008KT` → `35011KT`). */
const windUp = (line: string, kt: number) => line.replace(/ (\d{3}|VRB)(\d{2})(G\d{2})?KT /, (_m, d: string, s: string, g = '') => ` ${d}${String(Number(s) + kt).padStart(2, '0')}${g}KT `);

/** The demo lines plus duplicates of five kinds at fixed places (every kind resolves differently). */
function withDuplicates(): string[] {
  const out = [...DEMO];
  DEMO.forEach((l, i) => {
    if (i % 37 === 5) out.push(windUp(l.replace(' METAR ', ' SPECI '), 3)); // routine report over a special
    if (i % 53 === 7) out.push(windUp(l.replace(/(\d{6}Z) /, '$1 COR '), 5)); // the correction wins
    if (i % 61 === 11) out.push(windUp(l.replace(/ RMK .*$/, ''), 4)); // fewer values: SLP and T group gone
    if (i % 71 === 13) out.push(l); // identical repeat
    if (i % 83 === 17) out.push(windUp(l, 2)); // same kind, same count: the values decide
  });
  return out;
}

function run(lines: readonly string[]): { csv: string; values: string; series: StationSeries } {
  const r = loadPaths(['-'], { stdinText: lines.join('\n') + '\n' });
  assert.is(r.series.length, 1);
  const s = r.series[0]!;
  const values = JSON.stringify([Array.from(s.timeMs), ...SERIES_FIELDS.map((f) => Array.from(s[f], (x) => (Number.isNaN(x) ? null : x))), Array.from(s.weather), Array.from(s.reportType), Array.from(s.pressureTrend)]);
  return { csv: eventsToCsv(analyseSeries(r.series).events), values, series: s };
}

test('loadPaths + analyseSeries: shuffled lines with conflicting duplicates give byte-identical detections (fast-check)', () => {
  const lines = withDuplicates();
  const ref = run(lines);
  // the reference holds every kind of resolution, and detections to compare
  const reasons = new Set(ref.series.duplicates.map((d) => `${d.action}${d.reason ? `:${d.reason}` : ''}`));
  assert.equal([...reasons].sort(), ['conflict-resolved:more values', 'conflict-resolved:report type', 'conflict-resolved:values tie-break', 'correction-replaced', 'identical-dropped']);
  assert.ok(ref.csv.split('\n').length > 2, 'detections to compare');
  fc.assert(
    fc.property(fc.shuffledSubarray(lines, { minLength: lines.length, maxLength: lines.length }), (shuffled) => {
      const got = run(shuffled);
      assert.is(got.values, ref.values);
      assert.is(got.csv, ref.csv);
      assert.is(got.series.duplicates.length, ref.series.duplicates.length);
    }),
    { numRuns: 4, seed: 20261204 },
  );
});

test('loadPaths: the kept report of a conflict is the same whichever line comes first, and both lines are named', () => {
  // a METAR and a SPECI of the same minute (invented), then the same two the other way round
  const metar = '202603011251 METAR XAVN 011251Z AUTO 35008KT 10SM FEW050 M06/M12 A2981 RMK AO2 SLP142';
  const speci = '202603011251 SPECI XAVN 011251Z AUTO 35014KT 10SM FEW050 M06/M12 A2981 RMK AO2 SLP142';
  for (const lines of [[metar, speci], [speci, metar]]) {
    const s = loadPaths(['-'], { stdinText: lines.join('\n') + '\n' }).series[0]!;
    // 8 kt = 4.1156 m/s (1 kt = 1852/3600 m/s, NIST SP 811 B.8)
    assert.ok(Math.abs(s.windSpeedMs[0]! - 8 * 1852 / 3600) < 1e-9, lines[0]);
    const d = s.duplicates[0]!;
    assert.equal([d.action, d.reason, d.keptLine, d.droppedLine], ['conflict-resolved', 'report type', lines.indexOf(metar) + 1, lines.indexOf(speci) + 1]);
  }
});

test.run();
