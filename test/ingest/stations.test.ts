import { test } from 'uvu';
import * as assert from 'uvu/assert';
import { readFileSync } from 'node:fs';
import { assertClose } from '../helpers/assert.js';
import { REALDATA_DIR, realdataTest } from '../helpers/realdata.js';
import { buildStationIndex, looksLikeStationsFile, readStationsText, resolveStation } from '../../src/ingest/stations.js';


// Real stations list (NCEI ISD station history / LCD headers), 12 stations; K1V6 and CXTO without coordinates.
realdataTest(test, 'stations.csv')('readStationsText() reads the real stations list and resolves the ids data files use', () => {
  const { stations, report } = readStationsText(readFileSync(REALDATA_DIR + 'stations.csv', 'utf8'), 'stations.csv');
  assert.is(stations.length, 12);
  assert.is(report.rejected, 0);
  const ord = stations.find((s) => s.id === 'KORD')!;
  assert.equal(ord.aliases, ['ORD']);
  assertClose(ord.latDeg, 41.96017, 1e-9);
  assertClose(ord.elevationM, 204.8, 1e-9);
  assert.ok(Number.isNaN(stations.find((s) => s.id === 'K1V6')!.latDeg));
  const idx = buildStationIndex(stations);
  assert.is(resolveStation(idx, 'JFK').id, 'KJFK');
  assert.is(resolveStation(idx, 'JFK').via, 'alias');
  assert.is(resolveStation(idx, '0CO').id, 'K0CO');
  assert.is(resolveStation(idx, 'CXTO').via, 'id');
});

test('readStationsText() reads aliases, coastal flags, sea bearing and elevation in feet', () => {
  const text = 'id,lat,lon,elevation_ft,name,aliases,coastal,sea_bearing_deg\nKXYZ,30.1,-85.2,100,Test Field,XYZ;XY1|XY2,yes,180\nKABC,31,-86,M,,,,\nKXYZ,0,0,0,,,,\n,1,1,1,,,,\n';
  const { stations, report } = readStationsText(text, 's.csv');
  assert.is(stations.length, 2);
  const s = stations[0]!;
  assert.equal(s.aliases, ['XYZ', 'XY1', 'XY2']);
  assertClose(s.elevationM, 30.48, 1e-12, 0, 'NIST SP 811: 1 ft = 0.3048 m');
  assert.is(s.coastal, true);
  assert.is(s.seaBearingDeg, 180);
  assert.is(s.name, 'Test Field');
  assert.ok(Number.isNaN(stations[1]!.elevationM));
  assert.equal(report.rejectedByReason, { 'duplicate-station': 1, 'no-id': 1 });
});

test('readStationsText() reads a tz column (IANA zone names); a name that is not one is noted and ignored', () => {
  // zone names from the IANA tz database (zone1970.tab); invented stations
  const { stations, report } = readStationsText('id,lat,lon,tz\nXAAA,44.6,-63.5,America/Halifax\nXBBB,45.4,-75.7,Mars/Olympus\nXCCC,1,2,\n', 's.csv');
  assert.equal(stations.map((s) => s.timeZone), ['America/Halifax', undefined, undefined]);
  assert.ok(report.notes.includes('time zone "Mars/Olympus" at line 3 is not an IANA zone name (e.g. America/Toronto); ignored'));
});

test('resolveStation() maps a 3-letter id to the unique K or P ICAO id, and not when ambiguous', () => {
  const meta = (id: string, aliases: string[] = []) => ({ id, aliases, latDeg: 0, lonDeg: 0, elevationM: 0 });
  const idx = buildStationIndex([meta('KDEN'), meta('PANC'), meta('KHNL'), meta('PHNL'), meta('EGLL', ['LHR']), meta('KAAA', ['DUP']), meta('KBBB', ['DUP'])]);
  assert.equal(resolveStation(idx, 'den'), { id: 'KDEN', meta: meta('KDEN'), via: 'icao-prefix' });
  assert.is(resolveStation(idx, 'ANC').id, 'PANC');
  assert.is(resolveStation(idx, 'HNL').via, 'ambiguous');
  assert.is(resolveStation(idx, 'LHR').id, 'EGLL');
  assert.is(resolveStation(idx, 'DUP').via, 'ambiguous');
  assert.equal(resolveStation(idx, ' ZZZ '), { id: 'ZZZ', via: 'unknown' });
});

test('looksLikeStationsFile() tells a stations list from a data file', () => {
  assert.ok(looksLikeStationsFile(['id', 'alias', 'name', 'lat', 'lon', 'elevation_m']));
  assert.not.ok(looksLikeStationsFile(['station', 'valid', 'lat', 'lon', 'tmpf']));
  assert.not.ok(looksLikeStationsFile(['id', 'name']));
});

test.run();
