/**
 * SeriesBuilder: the columnar sink must give exactly what the object-based series builder gives.
 * The oracle below is the earlier object-based implementation of buildSeries (kept here as the
 * reference); duplicate rules: FMH-1 §12 (COR replaces the report it corrects), the rest common
 * practice, no source.
 */
import { test } from 'uvu';
import * as assert from 'uvu/assert';
import fc from 'fast-check';
import { SERIES_FIELDS, allocSeries, emptyObservation, type DuplicateNote, type Observation, type ObserverRemark, type StationSeries } from '../../src/model/index.js';
import { buildSeries } from '../../src/series/series.js';
import { SeriesBuilder } from '../../src/series/seriesBuilder.js';

const REPORT_TYPE: Record<string, number> = { CSV: 0, METAR: 1, SPECI: 2 };
/** The routine report first, then a special, then a CSV row (the builder's stated rule). */
const TYPE_ORDER: Record<string, number> = { METAR: 0, SPECI: 1, CSV: 2 };

/**
 * The object-based reference, written from the rule as SeriesBuilder.build states it: reports grouped by time;
 * in each group the preferred report is kept (COR first, FMH-1 §12; then more values present; METAR, SPECI,
 * CSV; then the values themselves; the rest common practice, no source); the others are corrections' originals,
 * identical repeats, or conflicts whose values fill the kept report's gaps.
 */
function referenceSeries(station: string, obs: readonly Observation[]): StationSeries {
  const fileOrder = new Map<string, number>();
  for (const o of obs) if (!fileOrder.has(o.file)) fileOrder.set(o.file, fileOrder.size);
  const present = (o: Observation) => SERIES_FIELDS.filter((f) => !Number.isNaN(o[f])).length + (o.weather !== 0 ? 1 : 0);
  const values = (a: Observation, b: Observation): number => {
    for (const f of SERIES_FIELDS) {
      const x = a[f];
      const y = b[f];
      if (x === y || (Number.isNaN(x) && Number.isNaN(y))) continue;
      if (Number.isNaN(x)) return 1;
      if (Number.isNaN(y)) return -1;
      return x < y ? -1 : 1;
    }
    return a.weather - b.weather || a.pressureTrend - b.pressureTrend;
  };
  const prefer = (i: number, j: number): number => {
    const a = obs[i]!;
    const b = obs[j]!;
    return (
      Number(b.corrected) - Number(a.corrected) ||
      present(b) - present(a) ||
      TYPE_ORDER[a.source]! - TYPE_ORDER[b.source]! ||
      values(a, b) ||
      fileOrder.get(a.file)! - fileOrder.get(b.file)! ||
      a.line - b.line ||
      i - j
    );
  };
  const reason = (a: Observation, b: Observation): DuplicateNote['reason'] =>
    a.corrected !== b.corrected ? 'correction' : present(a) !== present(b) ? 'more values' : a.source !== b.source ? 'report type' : 'values tie-break';
  const order = obs.map((_, i) => i).sort((i, j) => obs[i]!.timeMs - obs[j]!.timeMs || prefer(i, j));
  const kept: Observation[] = [];
  const duplicates: DuplicateNote[] = [];
  const same = (a: Observation, b: Observation) => SERIES_FIELDS.every((f) => a[f] === b[f] || (Number.isNaN(a[f]) && Number.isNaN(b[f])));
  let best: Observation | undefined;
  for (const idx of order) {
    const o = obs[idx]!;
    const prev = kept[kept.length - 1];
    if (prev && best && prev.timeMs === o.timeMs) {
      const note = { timeMs: o.timeMs, keptLine: best.line, droppedLine: o.line, file: best.file, droppedFile: o.file };
      if (best.corrected && !o.corrected) {
        duplicates.push({ ...note, action: 'correction-replaced' });
      } else if (same(best, o)) {
        duplicates.push({ ...note, action: 'identical-dropped' });
      } else {
        const merged: Observation = { ...prev };
        for (const f of SERIES_FIELDS) if (Number.isNaN(merged[f])) merged[f] = o[f];
        merged.weather |= o.weather;
        merged.remarks = [...(prev.remarks ?? []), ...(o.remarks ?? [])];
        kept[kept.length - 1] = merged;
        duplicates.push({ ...note, action: 'conflict-resolved', reason: reason(best, o) });
      }
      continue;
    }
    best = o;
    kept.push(o);
  }
  const s = allocSeries(station, kept.length);
  const files = new Map<string, number>();
  kept.forEach((o, i) => {
    s.timeMs[i] = o.timeMs;
    for (const f of SERIES_FIELDS) s[f][i] = o[f];
    s.weather[i] = o.weather;
    s.pressureTrend[i] = o.pressureTrend;
    s.reportType[i] = REPORT_TYPE[o.source]!;
    s.line[i] = o.line;
    if (!files.has(o.file)) {
      files.set(o.file, s.files.length);
      s.files.push(o.file);
    }
    s.fileIndex[i] = files.get(o.file)!;
    if (o.remarks) s.remarks.push(...o.remarks);
  });
  s.duplicates = duplicates;
  s.remarks.sort((a, b) => a.reportTimeMs - b.reportTimeMs);
  return s;
}

const value = fc.oneof(fc.constant(NaN), fc.constant(1), fc.constant(2), fc.double({ min: -50, max: 50, noNaN: true }));
const observation = fc
  .record({
    t: fc.integer({ min: 0, max: 6 }),
    corrected: fc.boolean(),
    temperatureC: value,
    dewpointC: value,
    windSpeedMs: value,
    seaLevelPressureHpa: value,
    weather: fc.integer({ min: 0, max: 0x3fff }),
    pressureTrend: fc.integer({ min: -1, max: 1 }),
    source: fc.constantFrom('METAR', 'SPECI', 'CSV') as fc.Arbitrary<Observation['source']>,
    file: fc.constantFrom('a.txt', 'b.csv'),
    remark: fc.boolean(),
  });

function toObservations(rows: { t: number; corrected: boolean; temperatureC: number; dewpointC: number; windSpeedMs: number; seaLevelPressureHpa: number; weather: number; pressureTrend: number; source: Observation['source']; file: string; remark: boolean }[]): Observation[] {
  return rows.map((r, i) => {
    const o = emptyObservation('KXYZ', r.t * 3_600_000, r.file, i + 1);
    o.corrected = r.corrected;
    o.temperatureC = r.temperatureC;
    o.dewpointC = r.dewpointC;
    o.windSpeedMs = r.windSpeedMs;
    o.seaLevelPressureHpa = r.seaLevelPressureHpa;
    o.weather = r.weather;
    o.pressureTrend = r.pressureTrend;
    o.source = r.source;
    if (r.remark) {
      const rm: ObserverRemark = { reportTimeMs: o.timeMs, label: 'FROPA', frontal: true, shiftTimeMs: NaN, file: r.file, line: i + 1 };
      o.remarks = [rm];
    }
    return o;
  });
}

const plain = (s: StationSeries) => JSON.parse(JSON.stringify(s, (_k, v) => (ArrayBuffer.isView(v) ? Array.from(v as Float64Array, (x) => (Number.isNaN(x) ? 'NaN' : x)) : v)));

test('SeriesBuilder.build() equals the object-based reference on random reports (duplicates, COR, unsorted, two files)', () => {
  fc.assert(
    fc.property(fc.array(observation, { maxLength: 30 }), (rows) => {
      const obs = toObservations(rows);
      const expected = plain(referenceSeries('KXYZ', obs));
      assert.equal(plain(buildSeries('KXYZ', obs)), expected);
      // through the builder with one reused object, as the readers feed it
      const b = new SeriesBuilder();
      const scratch = emptyObservation('', NaN, '', 0);
      for (const o of obs) {
        Object.assign(scratch, o);
        if (!o.remarks) scratch.remarks = undefined;
        b.add(scratch);
      }
      assert.equal(plain(b.build('KXYZ')), expected);
    }),
    { numRuns: 400, seed: 20240227 },
  );
});

test('SeriesBuilder.build() equals the reference when rows of many stations interleave across chunk and slab boundaries', () => {
  // invented reports: 40 stations × 1,500 rows each, round-robin (60,000 rows: several record chunks per
  // station and several shared slabs), with repeats and unsorted stretches
  let seed = 12345;
  const rnd = () => ((seed = (seed * 1103515245 + 12345) & 0x7fffffff) / 0x7fffffff);
  const ids = Array.from({ length: 40 }, (_, i) => `K${String.fromCharCode(65 + (i % 26))}${String.fromCharCode(65 + Math.floor(i / 26))}X`);
  const perStation = new Map<string, Observation[]>(ids.map((id) => [id, []]));
  const b = new SeriesBuilder();
  const scratch = emptyObservation('', NaN, '', 0);
  for (let row = 0; row < 1500; row++) {
    for (const id of ids) {
      const t = (row + (rnd() < 0.05 ? -3 : 0)) * 3_600_000;
      const o = emptyObservation(id, t, rnd() < 0.5 ? 'a.txt' : 'b.txt', row + 1);
      o.temperatureC = rnd() < 0.1 ? NaN : Math.round(rnd() * 400) / 10 - 10;
      o.dewpointC = rnd() < 0.1 ? NaN : -5;
      o.windSpeedMs = rnd() * 20;
      o.seaLevelPressureHpa = 1000 + rnd() * 30;
      o.weather = rnd() < 0.2 ? 5 : 0;
      o.corrected = rnd() < 0.02;
      o.source = 'METAR';
      perStation.get(id)!.push(o);
      Object.assign(scratch, o);
      scratch.remarks = undefined;
      b.add(scratch);
    }
  }
  for (const id of ids) assert.equal(plain(b.build(id)), plain(referenceSeries(id, perStation.get(id)!)), id);
});

test('SeriesBuilder resolves raw ids once each and groups aliases under one station', () => {
  const calls: string[] = [];
  const b = new SeriesBuilder((id) => (calls.push(id), id === 'JFK' ? 'KJFK' : id));
  for (const [id, t] of [['JFK', 1], ['KJFK', 2], ['JFK', 3], ['KLGA', 1]] as const) b.add(emptyObservation(id, t, 'f', t));
  assert.equal(calls, ['JFK', 'KJFK', 'KLGA']);
  assert.equal(b.stations(), ['KJFK', 'KLGA']);
  assert.equal(Array.from(b.build('KJFK').timeMs), [1, 2, 3]);
  assert.is(b.build('NONE').length, 0);
});

test.run();
