/**
 * The verification section of the HTML report: the per-station counts and the timing errors of verifyForecasts
 * (contingency counts after Wilks 2011, ch. 8; timing error = forecast − observed), binned in whole hours.
 * Constructed forecasts and passages (expected values by construction).
 */
import { test } from 'uvu';
import * as assert from 'uvu/assert';
import { verifyForecasts } from '../../src/verify/verify.js';
import { timingHistogram, verificationSection } from '../../src/verify/verifyHtml.js';
import type { ForecastPassage } from '../../src/verify/forecasts.js';
import { passage } from '../report/html/fixture.js';

const H = 3_600_000;
const T = Date.UTC(2026, 2, 2, 12);
const fc = (station: string, t: number): ForecastPassage => ({ station, kind: 'cold-front', forecastMs: t, issuedMs: t - 24 * H, file: 'f.csv', line: 2 });

test('timingHistogram: whole-hour bins over ±window; the edge +window in the last bin', () => {
  // -30 min in [-1, 0), 10 min in [0, 1), 70 min in [1, 2); +120 min (the edge of a 2 h window) in the last bin
  assert.equal(timingHistogram([-30, 10, 70, 120, NaN], 2), { edges: [-2, -1, 0, 1], counts: [0, 1, 1, 2] });
});

test('verificationSection: hits, misses and false alarms per station and the timing errors of the hits', () => {
  const events = [passage('XAAA', T, 'cold-front'), passage('XBBB', T, 'cold-front')];
  // XBBB: an issue before its passage, valid over it, forecasting it 30 h late: a false alarm and a miss
  const forecasts = [fc('XAAA', T + 90 * 60_000), fc('XAAA', T + 30 * H), fc('XCCC', T), { ...fc('XBBB', T + 30 * H), issuedMs: T - 20 * H, validFromMs: T - 12 * H, validToMs: T + 36 * H }];
  const r = verifyForecasts(forecasts, events, { windowHours: 6, bootstrap: false });
  const sec = verificationSection(r, 'f.csv');
  // XAAA: one hit (forecast 90 min late), one false alarm; XBBB: a miss; XCCC: a false alarm (no observations there)
  assert.match(sec.html, '<title>XAAA: hits 1</title>');
  assert.match(sec.html, '<title>XAAA: false alarms 1</title>');
  assert.match(sec.html, '<title>XBBB: misses 1</title>');
  assert.match(sec.html, '<title>+1: hits 1</title>');
  assert.match(sec.html, `Hits ${r.scores.hits}, misses ${r.scores.misses}, false alarms ${r.scores.falseAlarms}`);
});

test.run();
