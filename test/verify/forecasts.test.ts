/**
 * readForecastsText(): every line parsed or rejected with file:line and reason. Invented rows; times
 * in ISO 8601 (ISO 8601-1:2019 §5.4, UTC designator Z or an offset).
 */
import { test } from 'uvu';
import * as assert from 'uvu/assert';
import { buildStationIndex } from '../../src/ingest/stations.js';
import type { StationMeta } from '../../src/model/index.js';
import { parseForecastKind, readForecastsText } from '../../src/verify/forecasts.js';

const stations: StationMeta[] = [
  { id: 'XAVN', aliases: [], latDeg: 43, lonDeg: -95, elevationM: 300 },
  { id: 'XCDR', aliases: ['CDR'], latDeg: 44, lonDeg: -94, elevationM: 280 },
];
const index = buildStationIndex(stations);

test('readForecastsText: good rows, aliases resolved, extra columns ignored, headers case-insensitive', () => {
  const text = [
    'Station,KIND,Forecast_Time,Issued_Time,forecaster',
    'XAVN,cold-front,2026-03-02T14:07Z,2026-03-01T09:00Z,ab',
    'cdr,Warm,2026-03-19T08:49+01:00,2026-03-18T06:00Z,cd',
    '',
    'XAVN,,2026-03-20T06:24Z,,ef',
  ].join('\n');
  const { forecasts, report } = readForecastsText(text, 'fc.csv', { stations: index });
  assert.is(report.rejected, 0);
  assert.is(report.parsed, 3);
  assert.equal(
    forecasts.map((f) => [f.station, f.kind, f.forecastMs, f.issuedMs, f.line]),
    [
      ['XAVN', 'cold-front', Date.UTC(2026, 2, 2, 14, 7), Date.UTC(2026, 2, 1, 9), 2],
      ['XCDR', 'warm-front', Date.UTC(2026, 2, 19, 7, 49), Date.UTC(2026, 2, 18, 6), 3],
      ['XAVN', null, Date.UTC(2026, 2, 20, 6, 24), NaN, 5],
    ],
  );
});

test('readForecastsText: bad time, unknown station, bad kind, issued after the forecast are rejected with line and reason', () => {
  const text = [
    'station,kind,forecast_time,issued_time',
    'XAVN,cold-front,2026-03-02 25:07Z,2026-03-01T09:00Z',
    'XZZZ,cold-front,2026-03-02T14:07Z,2026-03-01T09:00Z',
    'XAVN,squall-line,2026-03-02T14:07Z,2026-03-01T09:00Z',
    'XAVN,cold-front,2026-03-02T14:07Z,2026-03-03T09:00Z',
    'XAVN,cold-front,2026-03-02T14:07Z,yesterday',
    'XAVN,cold-front,2026-03-02T14:07',
    'XAVN,cold-front,2026-03-02T14:07Z,2026-03-01T09:00Z',
  ].join('\n');
  const { forecasts, report } = readForecastsText(text, 'fc.csv', { stations: index });
  assert.is(forecasts.length, 1);
  assert.is(forecasts[0]!.line, 8);
  assert.equal(
    report.issues.map((i) => [i.line, i.reason]),
    [
      [2, 'bad-forecast-time'],
      [3, 'unknown-station'],
      [4, 'bad-kind'],
      [5, 'issued-after-forecast'],
      [6, 'bad-issued-time'],
      [7, 'truncated'],
    ],
  );
  assert.ok(report.issues.every((i) => i.file === 'fc.csv'));
  assert.match(report.issues[1]!.message, /XZZZ.*not in the stations file/);
  assert.match(report.issues[2]!.message, /cold-front/, 'the message lists the known kinds');
  assert.is(report.rejected, 6);
  assert.is(report.rejectedByReason['bad-forecast-time'], 1);
});

test('readForecastsText: a naive time needs a zone; with one it is read as local time', () => {
  const text = 'station,forecast_time\nXAVN,2026-03-02 08:07\n';
  const bad = readForecastsText(text, 'fc.csv');
  assert.is(bad.report.issues[0]!.reason, 'naive-time');
  assert.is(bad.report.issues[0]!.line, 2);
  assert.match(bad.report.issues[0]!.message, /no UTC offset/);
  const ok = readForecastsText(text, 'fc.csv', { zone: 'America/Chicago' });
  // America/Chicago is UTC−6 in early March 2026 (CST; DST starts 8 March 2026, second Sunday of March, US Energy Policy Act 2005, from memory).
  assert.is(ok.forecasts[0]!.forecastMs, Date.UTC(2026, 2, 2, 14, 7));
});

test('readForecastsText: duplicates, times outside the observations, valid windows; each with file, line and reason', () => {
  const text = [
    'station,kind,forecast_time,issued_time,valid_from,valid_to',
    'XAVN,cold-front,2026-03-02T14:07Z,2026-03-01T09:00Z,2026-03-01T12:00Z,2026-03-03T12:00Z',
    'XAVN,cold-front,2026-03-02T14:07Z,2026-03-01T09:00Z,,',
    'XAVN,cold-front,2026-03-02T14:07Z,2026-03-01T21:00Z,,',
    'XAVN,cold-front,2026-06-02T14:07Z,2026-06-01T09:00Z,,',
    'XCDR,warm-front,2026-03-10T14:07Z,,2026-03-11T00:00Z,2026-03-10T00:00Z',
    'XCDR,warm-front,2026-03-10T14:07Z,,soon,',
    'XCDR,warm-front,2026-03-10T14:07Z,,,',
  ].join('\n');
  const spans = new Map<string, [number, number]>([
    ['XAVN', [Date.UTC(2026, 2, 1), Date.UTC(2026, 4, 1)]],
    ['XCDR', [Date.UTC(2026, 2, 1), Date.UTC(2026, 4, 1)]],
  ]);
  const { forecasts, report } = readForecastsText(text, 'fc.csv', { stations: index, observedSpans: spans });
  assert.equal(forecasts.map((f) => f.line), [2, 4, 8], 'another issue of the same passage (line 4) is not a duplicate');
  assert.equal(forecasts[0]!.validFromMs, Date.UTC(2026, 2, 1, 12));
  assert.equal(forecasts[0]!.validToMs, Date.UTC(2026, 2, 3, 12));
  assert.ok(Number.isNaN(forecasts[1]!.validFromMs!));
  assert.equal(
    report.issues.map((i) => [i.file, i.line, i.reason]),
    [
      ['fc.csv', 3, 'duplicate'],
      ['fc.csv', 5, 'outside-observations'],
      ['fc.csv', 6, 'bad-valid-time'],
      ['fc.csv', 7, 'bad-valid-time'],
    ],
  );
  assert.match(report.issues[0]!.message, /line 2/);
  assert.is(report.rejected, 4);
  assert.is(report.parsed + report.rejected, report.lines - 1, 'every data line parsed or rejected');
});

test('readForecastsText: a missing forecast_time column rejects every line with a clear message', () => {
  const { forecasts, report } = readForecastsText('station,kind,when\nXAVN,cold-front,2026-03-02T14:07Z\nXAVN,cold-front,2026-03-07T14:07Z\n', 'fc.csv');
  assert.is(forecasts.length, 0);
  assert.is(report.rejected, 2);
  assert.is(report.issues[0]!.reason, 'missing-column');
  assert.match(report.issues[0]!.message, /no forecast_time column among: station, kind, when/);
});

test('readForecastsText: without a stations index or observed set any station id is accepted; with observed stations, those count as known', () => {
  const text = 'station,forecast_time\nQQQQ,2026-03-02T14:07Z\n';
  assert.is(readForecastsText(text, 'fc.csv').forecasts.length, 1);
  assert.is(readForecastsText(text, 'fc.csv', { observedStations: new Set(['QQQQ']) }).forecasts.length, 1);
  assert.is(readForecastsText(text, 'fc.csv', { observedStations: new Set(['XAVN']) }).report.issues[0]!.reason, 'unknown-station');
});

test('readForecastsText: an empty file is one issue, not a throw', () => {
  const { report } = readForecastsText('\n\n', 'fc.csv');
  assert.is(report.issues[0]!.reason, 'empty');
});

test('parseForecastKind: full names, short names, any', () => {
  assert.is(parseForecastKind('Cold-Front'), 'cold-front');
  assert.is(parseForecastKind('occluded'), 'occluded-front');
  assert.is(parseForecastKind('dryline'), 'dryline');
  assert.is(parseForecastKind('any'), null);
  assert.is(parseForecastKind(''), null);
  assert.is(parseForecastKind('squall'), undefined);
});

test.run();
