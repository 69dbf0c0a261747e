/**
 * The HTML report in a real browser: Debian's chromium (installed by .ci/run when missing), driven headless by
 * playwright-core with the system executable (no browser is downloaded). Opens a report of three demo stations
 * (invented data) and a page with a hostile station name, and checks: no console errors, every station section and
 * every passage marker present, the season and verification sections present exactly when asked for, the hostile
 * name rendered as text (no script runs). Screenshots go to
 * test-output/browser/. Skipped (counted) when /usr/bin/chromium is absent.
 * Source of the expectation that markup in data must render as text: the HTML Living Standard's parsing of
 * character references (what escapeXml relies on) and OWASP's XSS prevention cheat sheet (rule 1, HTML-escape
 * untrusted data in element content and attribute values).
 */
import { test } from 'uvu';
import * as assert from 'uvu/assert';
import { existsSync, mkdirSync, mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { fileURLToPath, pathToFileURL } from 'node:url';
import { analyseSeries, loadPaths } from '../../src/pipeline.js';
import { reportHtml } from '../../src/report/html/reportHtml.js';
import { loadGeography } from '../../src/report/html/geography.js';
import { CAUTION } from '../../src/report/caution.js';
import type { StationMeta } from '../../src/model/index.js';
import { passage, smallSeries } from '../report/html/fixture.js';
import { cli } from '../cli/io.js';

const CHROMIUM = '/usr/bin/chromium';
const run = existsSync(CHROMIUM) ? test : (name: string, fn: () => Promise<void>) => test.skip(name, fn);
const OUT = fileURLToPath(new URL('../../test-output/browser/', import.meta.url));

async function withPage<T>(fn: (page: import('playwright-core').Page, errors: string[]) => Promise<T>): Promise<T> {
  const { chromium } = await import('playwright-core');
  const profile = mkdtempSync(join(tmpdir(), 'fropa-chromium-'));
  // a fresh profile folder is the user data dir (playwright passes it as --user-data-dir)
  const browser = await chromium.launchPersistentContext(profile, {
    executablePath: CHROMIUM,
    headless: true,
    viewport: { width: 1400, height: 1000 },
    args: ['--headless', '--no-sandbox', '--disable-gpu', '--disable-quic', '--no-first-run', '--disable-background-networking', '--disable-component-update', '--disable-sync'],
  });
  try {
    const page = await browser.newPage();
    const errors: string[] = [];
    page.on('console', (m) => void (m.type() === 'error' && errors.push(m.text())));
    page.on('pageerror', (e) => void errors.push(String(e)));
    return await fn(page, errors);
  } finally {
    await browser.close();
    rmSync(profile, { recursive: true, force: true });
  }
}

run('demo report in chromium: no console errors, every station section and passage marker, screenshots saved', async () => {
  mkdirSync(OUT, { recursive: true });
  const files = ['XAVN', 'XBRL', 'XDVK'].map((id) => `stations-demo/${id}_2026-03_2026-04.metar.txt`);
  const loaded = loadPaths(files, { stationsFile: 'stations-demo/stations.csv' });
  const from = Date.UTC(2026, 2, 1);
  const to = Date.UTC(2026, 2, 4);
  const { events, tracks } = analyseSeries(loaded.series);
  const metas = loaded.series.map((s) => s.meta).filter((m): m is StationMeta => m !== undefined);
  const html = reportHtml({ series: loaded.series, events, tracks, stations: metas, files: [], fromMs: from, toMs: to, caution: CAUTION, geography: loadGeography() });
  const path = join(OUT, 'demo-report.html');
  writeFileSync(path, html);
  const inPeriod = events.filter((e) => e.timeMs >= from && e.timeMs <= to);
  await withPage(async (page, errors) => {
    await page.goto(pathToFileURL(path).href);
    for (const s of loaded.series) assert.ok((await page.locator(`text=Passages at ${s.station}`).count()) >= 1, s.station);
    const markers = await page.locator('path.pass').count();
    assert.ok(markers >= inPeriod.length, `${markers} markers for ${inPeriod.length} passages`);
    assert.ok((await page.locator('svg.map path.land').count()) >= 1, 'maps carry land and coastlines');
    // season and verification sections only when asked for
    assert.is(await page.locator('#season, #verification').count(), 0);
    assert.equal(errors, []);
    await page.screenshot({ path: join(OUT, 'demo-report-top.png') });
    if (await page.locator('svg.map').count()) await page.locator('svg.map').first().screenshot({ path: join(OUT, 'demo-front-map.png') });
    await page.screenshot({ path: join(OUT, 'demo-report-full.png'), fullPage: true });
  });
  assert.ok(existsSync(join(OUT, 'demo-report-full.png')));
});

run('report --season --forecasts in chromium: both sections appear with bar charts, in the contents, no console errors', async () => {
  mkdirSync(OUT, { recursive: true });
  const path = join(OUT, 'demo-season-verify.html');
  const r = await cli(['report', 'stations-demo', '--season', '--forecasts', 'stations-demo/forecasts/forecast_passages.csv', '--from', '2026-03-01', '--to', '2026-03-10', '--out', path, '--force', '--quiet']);
  assert.is(r.code, 0, r.stderr);
  await withPage(async (page, errors) => {
    await page.goto(pathToFileURL(path).href);
    for (const [id, title] of [['season', 'Season'], ['verification', 'Forecast verification']] as const) {
      const sec = page.locator(`section#${id}`);
      assert.is(await sec.count(), 1, id);
      assert.ok(await sec.isVisible(), `${id} visible`);
      assert.is((await sec.locator('h2').innerText()).trim(), title);
      assert.ok((await sec.locator('svg.bars rect.bar').count()) > 0, `${id}: bars drawn`);
      assert.is(await page.locator(`nav a[href="#${id}"]`).count(), 1, `${id} in the contents`);
    }
    // the bars have a size on screen (the style rules came with the sections)
    const box = await page.locator('#season-months').boundingBox();
    assert.ok(box && box.width > 300 && box.height > 80, JSON.stringify(box));
    assert.equal(errors, []);
    await page.locator('section#season').screenshot({ path: join(OUT, 'demo-season.png') });
    await page.locator('section#verification').screenshot({ path: join(OUT, 'demo-verification.png') });
  });
});

run('a hostile station name (<script>, quotes) renders as text in chromium and runs nothing', async () => {
  mkdirSync(OUT, { recursive: true });
  const hostile = `<script>window.__pwned=1</script>"'><img src=x onerror="window.__pwned=2">`;
  const s = smallSeries('XTST');
  const meta: StationMeta = { id: 'XTST', aliases: [], name: hostile, latDeg: 45, lonDeg: -99, elevationM: 500 };
  s.meta = meta;
  const html = reportHtml({ series: [s], events: [passage()], tracks: [], stations: [meta], files: [{ file: hostile, format: 'csv', parsed: 1, rejected: 0 }], caution: CAUTION });
  const path = join(OUT, 'hostile.html');
  writeFileSync(path, html);
  await withPage(async (page, errors) => {
    await page.goto(pathToFileURL(path).href);
    assert.is(await page.evaluate('window.__pwned'), undefined);
    assert.is(await page.locator('body script').count(), 0);
    assert.ok((await page.locator('body').innerText()).includes('<script>window.__pwned=1</script>'));
    assert.equal(errors, []);
    await page.screenshot({ path: join(OUT, 'hostile.png') });
  });
});

test.run();
