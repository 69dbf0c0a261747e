import { test } from 'uvu';
import * as assert from 'uvu/assert';
import { addIssue, allocSeries, newFileReport } from '../../src/model/index.js';
import { buildInspect, inspectToTable, issueLine } from '../../src/report/inspect.js';

/** Invented three-report series (fixture for layout, not observations). */
function series() {
  const s = allocSeries('KXYZ', 3, { id: 'KXYZ', aliases: [], name: 'Test Field', latDeg: 41.9786, lonDeg: -87.9048, elevationM: 201.2 });
  s.timeMs.set([Date.UTC(2026, 2, 4, 0, 0), Date.UTC(2026, 2, 4, 0, 20), Date.UTC(2026, 2, 4, 1, 0)]);
  s.files.push('obs.csv');
  return s;
}

test('issueLine(i) is file:line: reason: message', () => {
  assert.is(issueLine({ file: 'a.csv', line: 12, reason: 'bad-time', message: 'not a time' }), 'a.csv:12: bad-time: not a time');
});

test('buildInspect attaches stations to the files their observations came from', () => {
  const r = newFileReport('obs.csv', 'csv');
  r.lines = 5;
  r.parsed = 3;
  const other = newFileReport('other.csv', 'csv');
  const qc = new Map([['KXYZ', { flagged: { 'temperatureC:spike': 1 }, total: 1 }]]);
  const [a, b] = buildInspect([r, other], [series()], qc);
  assert.equal(a!.stations, ['KXYZ']);
  assert.equal(b!.stations, []);
  const d = a!.station_details[0]!;
  assert.is(d.first, '2026-03-04T00:00:00Z');
  assert.is(d.last, '2026-03-04T01:00:00Z');
  // Spacings 20 and 40 min: the lower median of two (medianCadenceMinutes takes element (n−1)>>1 of the sorted list).
  assert.is(d.median_cadence_min, 20);
  assert.equal(d.qc_flags, { 'temperatureC:spike': 1 });
  assert.is(d.lat, 41.9786);
});

test('inspectToTable: rejections with the first issues and a count of the rest; coordinates or "no coordinates"', () => {
  const r = newFileReport('obs.csv', 'csv');
  r.lines = 10;
  r.parsed = 3;
  for (let line = 2; line <= 8; line++) addIssue(r, { file: 'obs.csv', line, reason: 'truncated', message: 'short row' });
  const s = series();
  const bare = allocSeries('KNOP', 1);
  bare.files.push('obs.csv');
  const text = inspectToTable(buildInspect([r], [s, bare], new Map()), 5);
  assert.match(text, 'rejected   truncated 7');
  assert.match(text, 'obs.csv:2: truncated: short row');
  assert.match(text, 'obs.csv:6: truncated: short row');
  assert.not.match(text, 'obs.csv:7:');
  assert.match(text, '… 2 more');
  assert.match(text, 'station KXYZ (Test Field)');
  assert.match(text, '41.979°N 87.905°W, 201.2 m');
  assert.match(text, /station KNOP\n  where      no coordinates/);
  assert.match(text, 'qc flags   none');
  assert.ok(text.trimEnd().endsWith('1 file(s), 3 line(s) parsed, 7 rejected (truncated 7), 2 station(s)'), text.trimEnd().split('\n').pop());
});
test('inspect lists each conflicting duplicate (both files and lines, which kept, why) and counts identical ones', () => {
  // layout fixture: the notes SeriesBuilder.build writes (invented lines)
  const r = newFileReport('obs.csv', 'csv');
  r.lines = 6;
  r.parsed = 5;
  const s = series();
  const t = Date.UTC(2026, 2, 4, 0, 20);
  s.duplicates = [
    { timeMs: t, action: 'conflict-resolved', reason: 'more values', keptLine: 4, droppedLine: 3, file: 'obs.csv', droppedFile: 'obs.csv' },
    { timeMs: t, action: 'identical-dropped', keptLine: 4, droppedLine: 5, file: 'obs.csv', droppedFile: 'obs.csv' },
    { timeMs: t, action: 'correction-replaced', keptLine: 6, droppedLine: 2, file: 'obs.csv', droppedFile: 'old.csv' },
  ];
  const files = buildInspect([r], [s], new Map());
  const d = files[0]!.station_details[0]!;
  assert.equal([d.duplicates, d.identical_duplicates, d.corrections], [3, 1, 1]);
  assert.equal(d.conflicts, [{ time: '2026-03-04T00:20:00Z', kept_file: 'obs.csv', kept_line: 4, dropped_file: 'obs.csv', dropped_line: 3, reason: 'more values' }]);
  const text = inspectToTable(files);
  assert.match(text, 'conflicts  1 time(s) with differing reports');
  assert.match(text, '2026-03-04T00:20:00Z: kept obs.csv:4 over line 3 (more values)');
  assert.ok(text.trimEnd().endsWith('; 3 duplicate time(s) (1 with differing values, resolved by rule: inspect lists them)'), text.trimEnd().split('\n').pop());
});

test.run();
