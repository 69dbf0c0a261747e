/**
 * readMetarText on a real archive: KORD 2024-02-27/28 METAR/SPECI text from an NCEI Local Climatological
 * Data file (US federal observations, public domain). Expected figures were observed on this file and
 * checked by reading the reports (SLP890 at 280251Z; three cut reports: BKN1, BKN0, trailing 580).
 * Skips when the shared data folder beside the repository is absent.
 */
import { readFileSync } from 'node:fs';
import { test } from 'uvu';
import * as assert from 'uvu/assert';
import { readMetarText } from '../../src/ingest/metar.js';
import { buildSeries } from '../../src/series/series.js';
import { REALDATA_DIR, realdataTest } from '../helpers/realdata.js';

const kord = REALDATA_DIR + 'KORD_2024-02-27_28_metar.txt';
const t = realdataTest(test, 'KORD_2024-02-27_28_metar.txt');

t('readMetarText(KORD_2024-02-27_28_metar.txt): 59 lines, all parsed, 3 unknown groups from archive cuts', () => {
  const { observations, report } = readMetarText(readFileSync(kord, 'utf8'), 'KORD_2024-02-27_28_metar.txt');
  assert.is(report.format, 'metar');
  assert.is(report.lines, 59);
  assert.is(report.parsed, 59);
  assert.is(report.rejected, 0);
  assert.is(report.unknownGroups, 3);
  assert.ok(report.notes[0]!.includes('file name'));
  assert.is(observations.filter((o) => o.source === 'SPECI').length, 25); // grep -c ^SPECI on the file
  assert.is(observations[0]!.timeMs, Date.UTC(2024, 1, 27, 8, 51));
  assert.is(observations[58]!.timeMs, Date.UTC(2024, 1, 28, 17, 51));
});

t('KORD series: SLP minimum 989.0 hPa at 02:51Z on the 28th; PRESRR and lightning flags present', () => {
  const { observations } = readMetarText(readFileSync(kord, 'utf8'), 'KORD_2024-02-27_28_metar.txt');
  const s = buildSeries('KORD', observations);
  assert.is(s.length, 59);
  let k = -1;
  for (let i = 0; i < s.length; i++) if (!Number.isNaN(s.seaLevelPressureHpa[i]!) && (k < 0 || s.seaLevelPressureHpa[i]! < s.seaLevelPressureHpa[k]!)) k = i;
  assert.is(s.seaLevelPressureHpa[k], 989.0);
  assert.is(s.timeMs[k], Date.UTC(2024, 1, 28, 2, 51));
  // PRESRR at 01:51, 07:51, 09:42, 10:51, 11:35, 12:51; PRESFR at 01:09
  let rr = 0;
  let fr = 0;
  for (let i = 0; i < s.length; i++) {
    if (s.pressureTrend[i] === 1) rr++;
    if (s.pressureTrend[i] === -1) fr++;
  }
  assert.is(rr, 6);
  assert.is(fr, 1);
  // temperature from the T group: −7 °C region by 15:51 (T10671128 → −6.7 °C)
  const i1551 = Array.from(s.timeMs).indexOf(Date.UTC(2024, 1, 28, 15, 51));
  assert.is(s.temperatureC[i1551], -6.7);
});

test.run();
