/**
 * The stacked panel on a small invented series with one passage at 12:00: the passage line sits at the x of
 * its time, bands cover the timing window and the zone, text is escaped, output is deterministic.
 */
import { test } from 'uvu';
import * as assert from 'uvu/assert';
import { PANEL_WIDTH, panelSvg, panelX, pressureField, windDirectionCut } from '../../../src/report/html/panelSvg.js';
import { H, T0, passage, smallSeries } from './fixture.js';
import { assertHasFragment } from './svgAssert.js';

const t0 = T0 + 6 * H;
const t1 = T0 + 30 * H;

test('panelSvg: one passage line at x(time), from below the label to the bottom of the plot', () => {
  const s = smallSeries();
  const e = passage();
  const svg = panelSvg({ series: s, events: [e], t0, t1, id: 'p1', gapMs: 25 * 60_000 });
  const lines = svg.match(/<path class="pass k-cold-front" d="M([\d.]+),/g) ?? [];
  assert.is(lines.length, 1, 'one passage marker');
  // x = left + (t − t0)/(t1 − t0) × plot width: 12:00 is 6 h into a 24 h window → a quarter of the plot.
  const x = panelX(t0, t1)(e.timeMs);
  assert.ok(Math.abs(x - (58 + 0.25 * (PANEL_WIDTH - 58 - 14))) < 1e-9, `x ${x}`);
  assertHasFragment(svg, `<path class="pass k-cold-front" d="M${x.toFixed(1)},`);
  assert.match(svg, '>cold-front 12:00</text>');
});

test('panelSvg: timing-window band (earliest → latest) and lighter zone band (zone start → end)', () => {
  const s = smallSeries();
  const e = passage();
  const svg = panelSvg({ series: s, events: [e], t0, t1, id: 'p1', gapMs: 25 * 60_000 });
  const x = panelX(t0, t1);
  const zone = svg.match(/<rect class="zone k-cold-front" x="([\d.]+)" y="[\d.]+" width="([\d.]+)"/);
  assert.ok(zone, 'zone band');
  assert.ok(Math.abs(Number(zone![1]) - x(e.zoneStartMs)) <= 0.05);
  assert.ok(Math.abs(Number(zone![2]) - (x(e.zoneEndMs) - x(e.zoneStartMs))) <= 0.1);
  const win = svg.match(/<rect class="window k-cold-front" x="([\d.]+)" y="[\d.]+" width="([\d.]+)"/);
  assert.ok(win, 'timing band');
  assert.ok(Math.abs(Number(win![1]) - x(e.timeEarliestMs)) <= 0.05);
});

test('panelSvg: rows for temperature/dew point, pressure, wind direction, wind speed; title and desc', () => {
  const s = smallSeries();
  const svg = panelSvg({ series: s, events: [passage()], t0, t1, id: 'p1', gapMs: 25 * 60_000 });
  for (const cls of ['temp', 'dew', 'pres', 'wdir', 'wspd']) assert.match(svg, `<path class="${cls}" d="M`);
  assert.not.match(svg, 'class="gust"', 'no gusts reported → no gust line');
  assert.match(svg, 'role="img" aria-labelledby="p1-t p1-d"');
  assert.match(svg, '<title id="p1-t">XTST: observations from 2026-03-02 06:00 to 2026-03-03 06:00 UTC</title>');
  assert.match(svg, 'cold-front at 2026-03-02 12:00 UTC');
  // the fixture has sea-level pressure only
  assert.is(pressureField(s, 0, s.length), 'seaLevelPressureHpa');
});

test('pressureField: station pressure when the series has it (every report with an altimeter setting does once derived), not the sea-level pressure SPECI lacks', () => {
  const s = smallSeries();
  // constructed: station pressure at every report, sea-level pressure at every other one (as METAR vs SPECI)
  for (let i = 0; i < s.length; i++) {
    s.stationPressureHpa[i] = 950 + i * 0.01;
    if (i % 2) s.seaLevelPressureHpa[i] = NaN;
  }
  assert.is(pressureField(s, 0, s.length), 'stationPressureHpa');
  const svg = panelSvg({ series: s, events: [], t0, t1, id: 'pp', gapMs: 25 * 60_000 });
  assert.match(svg, 'Pressure (station pressure), hPa');
  const pres = svg.match(/<path class="pres" d="([^"]+)"/)![1]!;
  assert.is((pres.match(/M/g) ?? []).length, 1, 'one unbroken pressure line');
});

test('wind direction: northerly winds are drawn about the middle (cut at 180°), not split between the edges', () => {
  const s = smallSeries();
  for (let i = 0; i < s.length; i++) s.windDirDeg[i] = i % 2 ? 350 : 10;
  assert.is(windDirectionCut(s.windDirDeg, 0, s.length), 180);
  const svg = panelSvg({ series: s, events: [], t0, t1, id: 'pw', gapMs: 25 * 60_000 });
  assert.match(svg, '>N 0</text>');
  assert.match(svg, '>S 180</text>');
  for (let i = 0; i < s.length; i++) s.windDirDeg[i] = 200;
  assert.is(windDirectionCut(s.windDirDeg, 0, s.length), 0);
});

test('panelSvg: a missing value breaks the temperature line; a flagged one becomes a cross', () => {
  const s = smallSeries();
  s.temperatureC[100] = NaN;
  s.temperatureC[120] = 60;
  s.qc.temperatureC[120] = 1;
  const svg = panelSvg({ series: s, events: [], t0, t1, id: 'p2', gapMs: 25 * 60_000 });
  const temp = svg.match(/<path class="temp" d="([^"]+)"/)![1]!;
  assert.is((temp.match(/M/g) ?? []).length, 3, 'missing value and flagged value each split the line');
  assert.match(svg, '<path class="flagged" d="M');
  assert.match(svg, '1 value flagged by quality control drawn as crosses');
});

test('panelSvg: station ids and kinds are escaped; two builds are identical', () => {
  const s = smallSeries('K<&>"');
  const a = panelSvg({ series: s, events: [passage('K<&>"')], t0, t1, id: 'p3', gapMs: 25 * 60_000 });
  const b = panelSvg({ series: s, events: [passage('K<&>"')], t0, t1, id: 'p3', gapMs: 25 * 60_000 });
  assert.is(a, b);
  assert.match(a, 'K&lt;&amp;&gt;&quot;: observations');
  assert.not.match(a, 'K<&');
});

test.run();
