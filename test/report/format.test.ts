import { test } from 'uvu';
import * as assert from 'uvu/assert';
import Papa from 'papaparse';
import type { PassageEvent } from '../../src/model/index.js';
import {
  EVENT_COLUMNS,
  csvCell,
  eventToRecord,
  eventsToCsv,
  eventsToJson,
  eventsToNdjson,
  eventsToTable,
  isoUtc,
  roundOrNull,
  summaryLines,
} from '../../src/report/format.js';
import { CAUTION } from '../../src/report/caution.js';

/** Invented event for formatting checks (not an observation). */
function sampleEvent(over: Partial<PassageEvent> = {}): PassageEvent {
  const t = Date.UTC(2026, 2, 4, 12, 35);
  return {
    station: 'KXYZ',
    kind: 'cold-front',
    timeMs: t,
    timeEarliestMs: t - 20 * 60000,
    timeLatestMs: t + 20 * 60000,
    confidence: 0.8765,
    tempChangeC: -6.04,
    dewpointChangeC: -4.96,
    thetaEChangeK: -12.35,
    pressureMinHpa: 998.26,
    pressureMinTimeMs: t - 30 * 60000,
    pressureRise3hHpa: 3.14,
    windBeforeDeg: 205.4,
    windAfterDeg: 292.6,
    windTurnDeg: 87.2,
    windSpeedAfterMs: 9.26,
    gustMaxMs: 17.5,
    precipNear: true,
    zoneStartMs: t,
    zoneEndMs: t + 2.5 * 3600000,
    zoneHours: 2.5,
    zoneDepthKm: 90.04,
    gradientKPer100km: 6.71,
    observerFropaTimeMs: NaN, windShiftTimeMs: NaN, changeStartTimeMs: NaN, timeBasis: 'change-point',
    evidence: ['+ wind veered 87°', '− no pressure "kink", weak'],
    ...over,
  };
}

test('EVENT_COLUMNS equals the output contract, in order', () => {
  // Contract: the detect output columns listed in the project's CLI specification.
  assert.equal(
    [...EVENT_COLUMNS],
    [
      'station', 'kind', 'time', 'time_earliest', 'time_latest', 'time_basis', 'wind_shift_time', 'change_start_time', 'confidence', 'temp_change_c', 'dewpoint_change_c',
      'theta_e_change_k', 'pressure_min_hpa', 'pressure_min_time', 'pressure_rise_3h_hpa', 'wind_before_deg',
      'wind_after_deg', 'wind_turn_deg', 'wind_speed_after_ms', 'gust_max_ms', 'precip_near', 'zone_start', 'zone_end',
      'zone_hours', 'zone_depth_km', 'gradient_k_per_100km', 'observer_fropa_time', 'evidence',
      // operators' fields, appended (issue 13); documented with units in the README
      'temp_before_c', 'temp_after_c', 'dewpoint_before_c', 'dewpoint_after_c', 'temp_min_6h_c', 'temp_min_12h_c',
      'freeze_time', 'precip_before_6h', 'precip_types', 'precip_heavy', 'wind_speed_before_ms', 'pressure_source',
      'visibility_before_m', 'visibility_after_m', 'ceiling_before_ft', 'ceiling_after_ft', 'precip_intensity',
    ],
  );
});

test('isoUtc(ms) gives ISO 8601 extended UTC with seconds and Z; null for NaN', () => {
  // ISO 8601-1:2019 §5.4.2 complete representation, extended format, UTC designator Z.
  assert.is(isoUtc(Date.UTC(2026, 2, 4, 12, 35)), '2026-03-04T12:35:00Z');
  assert.is(isoUtc(Date.UTC(2024, 1, 29, 23, 59, 59, 999)), '2024-02-29T23:59:59Z');
  assert.is(isoUtc(NaN), null);
  assert.is(isoUtc(Infinity), null);
});

test('roundOrNull(x, d) rounds half away from zero, never returns -0, NaN → null', () => {
  assert.is(roundOrNull(-0.25, 1), -0.3);
  assert.is(roundOrNull(0.25, 1), 0.3);
  assert.ok(Object.is(roundOrNull(-0.04, 1), 0));
  assert.is(roundOrNull(NaN, 1), null);
  assert.is(roundOrNull(292.6, 0), 293);
});

test('eventToRecord(e) keys follow EVENT_COLUMNS; rounding per unit; NaN → null', () => {
  const r = eventToRecord(sampleEvent());
  assert.equal(Object.keys(r), [...EVENT_COLUMNS]);
  assert.is(r.time, '2026-03-04T12:35:00Z');
  assert.is(r.time_earliest, '2026-03-04T12:15:00Z');
  assert.is(r.confidence, 0.88);
  assert.is(r.temp_change_c, -6);
  assert.is(r.theta_e_change_k, -12.4);
  assert.is(r.pressure_min_hpa, 998.3);
  assert.is(r.wind_before_deg, 205);
  assert.is(r.wind_after_deg, 293);
  assert.is(r.zone_depth_km, 90);
  assert.is(r.gradient_k_per_100km, 6.7);
  assert.is(r.precip_near, true);
  assert.is(r.observer_fropa_time, null);
  assert.equal(r.evidence, ['+ wind veered 87°', '− no pressure "kink", weak']);
  const missing = eventToRecord(sampleEvent({ tempChangeC: NaN, zoneStartMs: NaN, gustMaxMs: NaN }));
  assert.is(missing.temp_change_c, null);
  assert.is(missing.zone_start, null);
  assert.is(missing.gust_max_ms, null);
});

test('csvCell quotes fields with comma, quote, CR or LF and doubles quotes (RFC 4180 §2 rules 5-7)', () => {
  // RFC 4180 §2 rule 6: fields containing line breaks (CRLF), double quotes and commas should be enclosed in double quotes.
  // RFC 4180 §2 rule 7: a double quote inside a quoted field is escaped by preceding it with another double quote.
  assert.is(csvCell('plain'), 'plain');
  assert.is(csvCell('a,b'), '"a,b"');
  assert.is(csvCell('say "hi"'), '"say ""hi"""');
  assert.is(csvCell('two\nlines'), '"two\nlines"');
  assert.is(csvCell('cr\rhere'), '"cr\rhere"');
  assert.is(csvCell(null), '');
  assert.is(csvCell(false), 'false');
  assert.is(csvCell(-3.5), '-3.5');
  assert.is(csvCell(['a', 'b, c']), '"a; b, c"');
});

test('eventsToCsv: header is the contract, no comment line, NaN → empty cell, evidence joined with "; "', () => {
  const csv = eventsToCsv([sampleEvent(), sampleEvent({ station: 'KABC', tempChangeC: NaN, evidence: [] })]);
  const lines = csv.split('\n');
  assert.is(lines[0], EVENT_COLUMNS.join(','));
  assert.not.ok(csv.startsWith('#'));
  assert.ok(csv.endsWith('\n'));
  // Reference reader: papaparse (RFC 4180 parser) recovers every cell.
  const parsed = Papa.parse<Record<string, string>>(csv.trim(), { header: true });
  assert.equal(parsed.errors, []);
  assert.equal(parsed.meta.fields, [...EVENT_COLUMNS]);
  assert.is(parsed.data.length, 2);
  // OWASP "CSV Injection": no cell begins with + or -; the marks are written as words
  assert.is(parsed.data[0]!.evidence, 'held: wind veered 87°; failed: no pressure "kink", weak');
  assert.is(parsed.data[0]!.temp_change_c, '-6');
  assert.is(parsed.data[0]!.precip_near, 'true');
  assert.is(parsed.data[0]!.observer_fropa_time, '');
  assert.is(parsed.data[1]!.temp_change_c, '');
  assert.is(parsed.data[1]!.evidence, '');
});

test('eventsToCsv([]) is the header line alone', () => {
  assert.is(eventsToCsv([]), EVENT_COLUMNS.join(',') + '\n');
});

test('eventsToNdjson: one JSON object per line, null for NaN, evidence an array', () => {
  const text = eventsToNdjson([sampleEvent(), sampleEvent({ kind: 'warm-front', confidence: NaN })]);
  const lines = text.trimEnd().split('\n');
  assert.is(lines.length, 2);
  const objs = lines.map((l) => JSON.parse(l) as Record<string, unknown>);
  assert.equal(Object.keys(objs[0]!), [...EVENT_COLUMNS]);
  assert.is(objs[0]!.observer_fropa_time, null);
  assert.ok(Array.isArray(objs[0]!.evidence));
  assert.is(objs[1]!.confidence, null);
  assert.not.match(text, /NaN/);
});

test('eventsToJson: a JSON array of records; [] when empty', () => {
  const arr = JSON.parse(eventsToJson([sampleEvent(), sampleEvent()])) as unknown[];
  assert.is(arr.length, 2);
  assert.equal(JSON.parse(eventsToJson([])), []);
});

test('eventsToTable: units in headers, aligned rows, summary per station, caution last', () => {
  const text = eventsToTable([sampleEvent(), sampleEvent({ kind: 'wind-shift', timeMs: Date.UTC(2026, 2, 5, 1, 0) })], {
    stations: ['KXYZ', 'KQQQ'],
  });
  const lines = text.trimEnd().split('\n');
  for (const h of ['time (UTC)', 'ΔT °C', 'turn °', 'zone h', 'p min hPa', 'gust m/s']) assert.ok(lines[0]!.includes(h), h);
  // Columns aligned: the time column starts at the same offset in header and rows.
  const at = lines[0]!.indexOf('time (UTC)');
  assert.is(lines[2]!.indexOf('2026-03-04 12:35'), at);
  assert.is(lines[3]!.indexOf('2026-03-05 01:00'), at);
  assert.ok(lines.includes('KQQQ  no passages'));
  assert.ok(lines.includes('KXYZ  2 passages: 1 cold-front, 1 wind-shift'));
  assert.is(lines[lines.length - 2], '2 passages at 1 of 2 stations');
  assert.is(lines[lines.length - 1], CAUTION);
});

test('eventsToTable with a zone shows local time: 2026-03-04 12:35Z is 06:35 in Chicago (CST, UTC−6)', () => {
  // US DST in 2026 starts on the second Sunday of March (8 March), 15 U.S.C. §260a; so 4 March is CST.
  const text = eventsToTable([sampleEvent()], { zone: 'America/Chicago' });
  assert.ok(text.includes('time (America/Chicago)'));
  assert.ok(text.includes('2026-03-04 06:35'));
});

test('eventsToTable([]) says no passages and still ends with the caution', () => {
  const lines = eventsToTable([], { stations: ['KXYZ'] }).trimEnd().split('\n');
  assert.is(lines[0], 'no passages found');
  assert.is(lines[lines.length - 1], CAUTION);
});

test('eventsToTable with 200,000 passages: one line each, no call-stack overflow (a 1 GB archive gives that many)', () => {
  const base = sampleEvent();
  const many = Array.from({ length: 200_000 }, (_, i) => ({ ...base, timeMs: base.timeMs + i * 60_000 }));
  const lines = eventsToTable(many).split('\n');
  assert.ok(lines.length > 200_000);
  assert.is(lines[lines.length - 2], CAUTION);
});

test('summaryLines counts by kind, most frequent first', () => {
  const ev = [sampleEvent(), sampleEvent({ kind: 'dryline' }), sampleEvent({ kind: 'dryline' })];
  assert.equal(summaryLines(ev), ['KXYZ  3 passages: 2 dryline, 1 cold-front', '3 passages at 1 of 1 station']);
});

test.run();
