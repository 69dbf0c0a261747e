/** Station ids from a station column, the METAR text or the file name (src/ingest/stations.ts stationFromFileName, csv.ts). */
import { test } from 'uvu';
import * as assert from 'uvu/assert';
import { mkdtempSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { buildStationIndex, stationFromFileName } from '../../src/ingest/stations.js';
import { loadPaths } from '../../src/pipeline.js';
import { buildInspect, inspectToTable } from '../../src/report/inspect.js';

const index = buildStationIndex([
  { id: 'KORD', aliases: ['ORD'], latDeg: 41.995, lonDeg: -87.934, elevationM: 201.8 },
  { id: 'KATL', aliases: [], latDeg: 33.63, lonDeg: -84.44, elevationM: 308 },
  { id: 'site-7', aliases: [], latDeg: 40, lonDeg: -100, elevationM: 500 },
]);

test('stationFromFileName(): whole stem, then the leading token matched against ids and aliases', () => {
  assert.is(stationFromFileName(index, 'x/ORD_2019_LCD_localstd.csv').id, 'ORD'); // alias ORD → KORD
  assert.match(stationFromFileName(index, 'x/ORD_2019_LCD_localstd.csv').rule, 'alias of KORD');
  // US ICAO prefix: K + the 3-letter id (ICAO Doc 7910, from memory)
  assert.match(stationFromFileName(index, 'ATL_2019_LCD_localstd.csv').rule, 'ICAO prefix of KATL');
  assert.is(stationFromFileName(index, 'site-7.csv.gz').id, 'site-7'); // the whole stem is a listed id: kept whole
  assert.is(stationFromFileName(index, 'KSEA_2020-01.csv').id, 'KSEA'); // not listed, looks like an id
  assert.is(stationFromFileName(index, 'mesonet_march.csv').id, 'mesonet_march'); // a leading word is not an id
});

test('loadPaths(): the leading token of a file name finds the station; inspect says which rule gave the id', () => {
  const dir = mkdtempSync(join(tmpdir(), 'fropa-ids-'));
  writeFileSync(join(dir, 'stations.csv'), 'id,alias,name,lat,lon,elevation_m\nKORD,ORD,Chicago O Hare,41.995,-87.934,201.8\n');
  writeFileSync(join(dir, 'ORD_2019_LCD_extract.csv'), 'time,temp_c,wind_dir,wind_speed_ms\n2019-01-01T06:00Z,1,270,5\n2019-01-01T07:00Z,0,280,6\n');
  // a raw METAR column without a station column: the report's own id (WMO-No. 306 FM 15: CCCC after the keyword)
  writeFileSync(join(dir, 'metars.csv'), 'valid,metar\n2019-01-01 06:51,KMDW 010651Z 29008KT 10SM OVC020 01/M01 A3002\n');
  const r = loadPaths([dir]);
  assert.equal(r.series.map((s) => s.station), ['KMDW', 'KORD']);
  const files = buildInspect(r.reports, r.series, r.qc);
  const ord = files.find((f) => f.file.endsWith('ORD_2019_LCD_extract.csv'))!;
  assert.match(ord.station_id_rule!, 'leading token "ORD" of the file name (alias of KORD');
  assert.match(files.find((f) => f.file.endsWith('metars.csv'))!.station_id_rule!, 'the METAR text of "metar"');
  assert.match(inspectToTable(files), 'ids from   leading token "ORD"');
});

test.run();
