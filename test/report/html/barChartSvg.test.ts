/**
 * Stacked bar charts of the report's summary sections. Expected geometry by construction (linear scale from the
 * axis: a bar's height is proportional to its count, segments stack in series order); markup in labels must come
 * out as text (HTML Living Standard character references, as escapeXml); tick values from d3-array `ticks`
 * (reference library).
 */
import { test } from 'uvu';
import * as assert from 'uvu/assert';
import { ticks } from 'd3-array';
import { barChartSvg, barTable } from '../../../src/report/html/barChartSvg.js';

const chart = {
  id: 'c1',
  title: 'Counts <by> month',
  categories: ['Jan', 'Feb', 'Mar'],
  series: [
    { label: 'cold-front', cls: 'k-cold-front', values: [2, 0, 4] },
    { label: 'warm-front', cls: 'k-warm-front', values: [1, 3, NaN] },
  ],
  yLabel: 'passages',
  width: 300,
  height: 200,
};

function rects(svg: string): { cls: string; y: number; h: number; title: string }[] {
  return [...svg.matchAll(/<rect class="bar ([^"]+)" x="[^"]+" y="([^"]+)" width="[^"]+" height="([^"]+)"><title>([^<]+)<\/title>/g)].map((m) => ({ cls: m[1]!, y: Number(m[2]), h: Number(m[3]), title: m[4]! }));
}

test('barChartSvg: one segment per non-zero count, heights proportional, stacked from the axis in series order', () => {
  const svg = barChartSvg(chart);
  const r = rects(svg);
  // Jan 2 + 1, Feb 0 + 3, Mar 4 + NaN (nothing drawn for 0 and NaN)
  assert.equal(r.map((x) => x.title), ['Jan: cold-front 2', 'Jan: warm-front 1', 'Feb: warm-front 3', 'Mar: cold-front 4']);
  const unit = r[0]!.h / 2;
  assert.ok(Math.abs(r[1]!.h - unit) < 0.11 && Math.abs(r[2]!.h - 3 * unit) < 0.11 && Math.abs(r[3]!.h - 4 * unit) < 0.11, JSON.stringify(r));
  // the warm-front segment of January sits on top of the cold-front one
  assert.ok(Math.abs(r[1]!.y + r[1]!.h - r[0]!.y) < 0.11);
  // integer ticks of d3-array over [0, 4]
  for (const t of ticks(0, 4, 4)) assert.match(svg, `>${t}</text>`);
  assert.match(svg, 'Counts &lt;by&gt; month');
  assert.not.match(svg, '<by>');
});

test('barChartSvg: all zero still draws axes and says none; deterministic', () => {
  const empty = { ...chart, series: [{ label: 'x', cls: 'b-count', values: [0, 0, 0] }] };
  const svg = barChartSvg(empty);
  assert.match(svg, '(none)</title>');
  assert.is(rects(svg).length, 0);
  assert.is(barChartSvg(chart), barChartSvg(chart));
});

test('barTable: the same numbers as a table, with totals', () => {
  const t = barTable(chart, 'month');
  assert.match(t, '<th scope="row">Jan</th><td class="n">2</td><td class="n">1</td><td class="n">3</td>');
  assert.match(t, '<th scope="row">Mar</th><td class="n">4</td><td class="n">0</td><td class="n">4</td>');
});

test.run();
