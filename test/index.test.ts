/** The library surface (src/index.ts): what a caller gets, and the internals it keeps behind it. Project rules (no source). */
import { test } from 'uvu';
import * as assert from 'uvu/assert';
import * as fropa from '../src/index.js';

test('src/index.ts exports the pipeline, the readers, the writers, the caution and the usage error', () => {
  const wanted = [
    'loadPaths', 'analyseSeries', 'sortEvents', 'checkDetectOptions',
    'readMetarText', 'readMetarBytes', 'decodeMetar', 'readCsvText', 'readCsvBytes', 'readCsvStream', 'readStationsText', 'readForecastsText',
    'eventsToCsv', 'eventsToJson', 'eventsToNdjson', 'eventsToTable', 'tracksToCsv', 'tracksToJson', 'tracksToTable', 'passagesToTable',
    'outputFolderFiles', 'writeOutputFolder', 'reportHtml', 'buildInspect', 'inspectToTable',
    'verifyForecasts', 'verificationToCsv', 'verificationToJson', 'verificationToTable',
    'parsePeriodTime', 'selectStations', 'eventsInPeriod', 'CAUTION', 'UsageError', 'BOUNDARY_KINDS', 'WX', 'QC', 'physics',
  ];
  const exported = fropa as Record<string, unknown>;
  assert.equal(wanted.filter((n) => exported[n] === undefined), []);
});

test('src/index.ts keeps internals behind it: cell formatters, builder helpers, issue counters, removed dead code', () => {
  const internals = ['csvCell', 'alignColumns', 'isoUtc', 'roundOrNull', 'allocSeries', 'SeriesBuilder', 'addIssue', 'newFileReport', 'groupByStation', 'buildAllSeries', 'cleanColumn'];
  assert.equal(internals.filter((n) => n in fropa), []);
});

test('UsageError is a RangeError recognised by instanceof, named UsageError', () => {
  const e = new fropa.UsageError('--kinds: unknown kind "x"');
  assert.ok(e instanceof fropa.UsageError && e instanceof RangeError);
  assert.is(e.name, 'UsageError');
});

test.run();
