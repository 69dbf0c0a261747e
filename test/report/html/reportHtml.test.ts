/**
 * The report page on a small invented series: self-contained (no scripts, no external URLs), caution at top
 * and bottom, counts, one passage marker at the right x, escaped evidence, identical bytes on a second build.
 * Accessibility points follow WCAG 2.1 (1.1.1 text alternatives: <title> in each SVG; 2.4.2 page title).
 */
import { test } from 'uvu';
import * as assert from 'uvu/assert';
import { passageWindows, reportHtml, type ReportInput } from '../../../src/report/html/reportHtml.js';
import { panelX } from '../../../src/report/html/panelSvg.js';
import { CAUTION } from '../../../src/report/caution.js';
import { H, T0, passage, smallSeries } from './fixture.js';

function input(over: Partial<ReportInput> = {}): ReportInput {
  return {
    series: [smallSeries()],
    events: [passage()],
    tracks: [],
    stations: [],
    files: [{ file: 'obs/<odd>&name.csv', format: 'csv', parsed: 289, rejected: 0 }],
    caution: CAUTION,
    ...over,
  };
}

test('reportHtml: one self-contained page: doctype, lang, <title>, inline style, no script or external URL', () => {
  const html = reportHtml(input());
  assert.ok(html.startsWith('<!DOCTYPE html>\n<html lang="en">'));
  assert.match(html, /<title>fropa report: 1 station, 2026-03-02 00:00 to 2026-03-04 00:00 UTC<\/title>/);
  assert.match(html, '<style>');
  assert.not.match(html, /<script/i);
  assert.not.match(html, /<link/i);
  // the only URLs are the SVG namespace
  const urls = html.match(/https?:\/\/[^\s"')]+/g) ?? [];
  assert.ok(urls.every((u) => u === 'http://www.w3.org/2000/svg'), urls.join(' '));
});

test('reportHtml: the caution text is at the top and at the bottom', () => {
  const html = reportHtml(input());
  const first = html.indexOf(CAUTION);
  const last = html.lastIndexOf(CAUTION);
  assert.ok(first > 0 && first < html.indexOf('id="summary"'), 'caution before the summary');
  assert.ok(last > html.indexOf('<footer>'), 'caution in the footer');
});

test('reportHtml: counts by kind, one chart with one passage marker at the right x, escaped file and evidence', () => {
  const e = passage();
  const html = reportHtml(input({ events: [e, passage('OTHER', e.timeMs)] }));
  assert.match(html, '1 passage found');
  assert.match(html, '1 cold-front</li>');
  const markers = html.match(/<path class="pass k-cold-front" d="M[\d.]+,[\d.]+V[\d.]+" data-time="/g) ?? [];
  // the 48-h period is short, so one chart covers it all
  assert.is(markers.length, 1, 'one passage marker (OTHER is not a shown station)');
  const x = panelX(T0, T0 + 48 * H)(e.timeMs).toFixed(1).replace(/\.0$/, '');
  assert.match(html, `<path class="pass k-cold-front" d="M${x},`);
  assert.match(html, 'obs/&lt;odd&gt;&amp;name.csv');
  assert.match(html, 'pressure rise &lt;1 hPa &amp; &quot;small&quot;');
  assert.match(html, 'Test &lt;site&gt; &amp; co');
  assert.is((html.match(/<svg /g) ?? []).length, 2, 'legend and one chart');
});

test('reportHtml: deterministic: two builds are byte-identical', () => {
  assert.is(reportHtml(input()), reportHtml(input()));
});

test('reportHtml: a long period gets an overview strip and one chart per passage window', () => {
  const s = smallSeries();
  const from = T0 - 10 * 24 * H; // 12 days, longer than the single-chart limit
  const html = reportHtml(input({ series: [s], fromMs: from, toMs: T0 + 48 * H, events: [passage(), passage('XTST', T0 + 30 * H, 'warm-front')] }));
  assert.match(html, '<svg class="overview"');
  assert.is((html.match(/<svg class="panel"/g) ?? []).length, 2);
  assert.match(html, 'href="#st-0-p0"');
});

test('passageWindows: passages within 6 h share a window; ±hours; capped with a count of the rest', () => {
  const ev = [0, 4, 20, 40, 41].map((h) => passage('X', T0 + h * H));
  const { windows, dropped } = passageWindows(ev, T0 - 100 * H, T0 + 100 * H, 12, 2);
  assert.is(windows.length, 2);
  assert.is(windows[0]!.events.length, 2);
  assert.is(windows[0]!.t0, T0 - 12 * H);
  assert.is(windows[0]!.t1, T0 + 16 * H);
  assert.is(dropped, 2, 'the passages at 40 h and 41 h have no window');
  const clipped = passageWindows([passage('X', T0)], T0 - H, T0 + 100 * H).windows[0]!;
  assert.is(clipped.t0, T0 - H, 'clipped to the period');
});

test('reportHtml: with a local zone, passage times show local time beside UTC (IANA tz database: Chicago is UTC−6, CST, on 2026-03-02)', () => {
  const e = passage();
  const html = reportHtml(input({ events: [e], localZone: 'America/Chicago' }));
  // passage() is at 2026-03-02 12:00 UTC → 06:00 CST
  assert.match(html, '2026-03-02 06:00 CST local');
  assert.not.match(reportHtml(input({ events: [e] })), ' local)');
});

test.run();
