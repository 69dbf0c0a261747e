/**
 * The season section of the HTML report: its charts and tables carry the counts of seasonSummary (the summary
 * `fropa season` prints), nothing else. Passages constructed at chosen times (expected counts by construction).
 */
import { test } from 'uvu';
import * as assert from 'uvu/assert';
import { seasonSummary } from '../../src/season/season.js';
import { seasonSection } from '../../src/season/seasonHtml.js';
import { passage } from '../report/html/fixture.js';

test('seasonSection: months by kind and hours of the day from the summary', () => {
  const events = [
    passage('XTST', Date.UTC(2026, 2, 2, 14), 'cold-front'),
    passage('XTST', Date.UTC(2026, 2, 9, 14), 'cold-front'),
    passage('XTST', Date.UTC(2026, 3, 1, 3), 'warm-front'),
  ];
  const s = seasonSummary(events, [], [], ['XTST']);
  const sec = seasonSection(s);
  assert.is(sec.id, 'season');
  // March: 2 cold fronts; April: 1 warm front (UTC dates)
  assert.match(sec.html, '<title>Mar: cold-front 2</title>');
  assert.match(sec.html, '<title>Apr: warm-front 1</title>');
  assert.match(sec.html, '<th scope="row">Mar</th><td class="n">2</td><td class="n">0</td><td class="n">2</td>');
  // 14 UTC twice, 03 UTC once
  assert.match(sec.html, '<title>14: passages 2</title>');
  assert.match(sec.html, '<title>03: passages 1</title>');
  // no station longitude known: no solar-time chart
  assert.not.match(sec.html, 'solar');
  assert.match(sec.html, '3 passages at 1 station');
});

test.run();
