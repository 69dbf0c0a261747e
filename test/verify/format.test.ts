/** Verification writers: record contract, outcomes, empty cells, table header and caution. Constructed example (invented times). */
import { test } from 'uvu';
import * as assert from 'uvu/assert';
import type { PassageEvent } from '../../src/model/index.js';
import type { ForecastPassage } from '../../src/verify/forecasts.js';
import { verifyForecasts } from '../../src/verify/verify.js';
import { SCORE_COLUMNS, verificationScoresToCsv, verificationToCsv, verificationToJson, verificationToTable, VERIFY_COLUMNS } from '../../src/verify/format.js';
import { CAUTION } from '../../src/report/caution.js';

const H = 3_600_000;
const T0 = Date.UTC(2026, 2, 2, 12);
const ev = (station: string, kind: PassageEvent['kind'], timeMs: number) => ({ station, kind, timeMs }) as PassageEvent;
const fc = (station: string, kind: ForecastPassage['kind'], forecastMs: number, issuedMs: number): ForecastPassage => ({ station, kind, forecastMs, issuedMs, file: 'f.csv', line: 2 });

const r = verifyForecasts(
  [fc('A', 'cold-front', T0 + 0.5 * H, T0 - 18 * H), fc('A', null, T0 + 40 * H, NaN), fc('B', 'cold-front', T0, T0 - 30 * H)],
  [ev('A', 'cold-front', T0), ev('A', 'cold-front', T0 + 20 * H), ev('B', 'occluded-front', T0 + H)],
  { validHours: 48, bootstrap: { resamples: 200 } },
);

test('verificationToCsv: contract header, one row per forecast and per miss of every issue, in station then time order', () => {
  const rows = verificationToCsv(r).trimEnd().split('\n');
  assert.is(rows[0], VERIFY_COLUMNS.join(','));
  assert.equal(rows.slice(1), [
    'A,cold-front,2026-03-02T12:30:00Z,2026-03-01T18:00:00Z,18.5,2026-03-02T12:00:00Z,cold-front,30,hit,f.csv,2026-03-01T18:00:00Z,2026-03-03T18:00:00Z,12-24h,true',
    // inside the valid window of A's issue (issued + 48 h), not forecast by it: lead = observed − issued = 38 h
    'A,cold-front,,2026-03-01T18:00:00Z,38,2026-03-03T08:00:00Z,cold-front,,miss,f.csv,2026-03-01T18:00:00Z,2026-03-03T18:00:00Z,24-48h,true',
    // no issued time: the forecast covers only ±6 h around itself
    'A,,2026-03-04T04:00:00Z,,,,,,false-alarm,f.csv,,,unknown,true',
    'B,cold-front,2026-03-02T12:00:00Z,2026-03-01T06:00:00Z,30,,,,false-alarm,f.csv,2026-03-01T06:00:00Z,2026-03-03T06:00:00Z,24-48h,true',
    // the forecast of any front makes occluded fronts a verified kind, so B's occluded front is a miss of B's issue
    'B,occluded-front,,2026-03-01T06:00:00Z,31,2026-03-02T13:00:00Z,occluded-front,,miss,f.csv,2026-03-01T06:00:00Z,2026-03-03T06:00:00Z,24-48h,true',
  ]);
});

test('verificationToJson: same records, null for missing', () => {
  const recs = JSON.parse(verificationToJson(r)) as Record<string, unknown>[];
  assert.is(recs.length, 5);
  assert.equal(Object.keys(recs[0]!), [...VERIFY_COLUMNS]);
  assert.is(recs[0]!.error_min, 30);
  assert.is(recs[1]!.forecast_time, null);
  assert.is(recs[1]!.headline, true);
});

test('verificationToTable: sign convention stated, kind mismatch listed, caution last', () => {
  const lines = verificationToTable(r).trimEnd().split('\n');
  assert.match(lines[1]!, /forecast − observed.*positive = forecast late/);
  assert.ok(lines.some((l) => /B cold-front forecast .*observed occluded-front/.test(l)));
  assert.ok(lines.some((l) => /^\s+POD \S+ \[\S+, \S+\]; FAR/.test(l)), 'headline scores with bootstrap intervals');
  assert.ok(lines.some((l) => /^all\s+1\s+2\s+2\s/.test(l)), 'headline: 1 hit, 2 misses, 2 false alarms');
  assert.is(lines[lines.length - 1], CAUTION);
});

test('verificationScoresToCsv: one row per group, the headline row with interval ends, the others without', () => {
  const rows = verificationScoresToCsv(r).trimEnd().split('\n');
  assert.is(rows[0], SCORE_COLUMNS.join(','));
  // headline: 1 hit, 2 misses, 2 false alarms → POD 1/3, FAR 2/3, CSI 1/5, bias 3/3 (Wilks 2011 ch. 8, by hand)
  assert.match(rows[1]!, /^all,all,1,2,2,0\.333,0\.667,0\.2,1,30,30,30,30,30,1,0,/);
  assert.equal(rows.slice(1).map((l) => l.split(',').slice(0, 2).join(',')), ['all,all', 'station,A', 'station,B', 'kind,any', 'kind,cold-front', 'kind,occluded-front', 'source,f.csv', 'lead,12-24h', 'lead,24-48h', 'lead,unknown']);
  assert.ok(rows[2]!.endsWith(',,'), 'intervals only for the headline row');
});

test.run();
