/**
 * The report's colours: passage kinds never share a colour with a data series (issue 13: "colours of passage kinds
 * must differ from the colours of the series"), and text colours keep the WCAG 2.1 §1.4.3 contrast of 4.5:1 on
 * white (relative luminance and contrast ratio as defined in WCAG 2.1, "relative luminance" and "contrast ratio").
 */
import { test } from 'uvu';
import * as assert from 'uvu/assert';
import { KIND_STROKES, SERIES_STROKES } from '../../../src/report/html/palette.js';

const rgb = (h: string) => [1, 3, 5].map((i) => parseInt(h.slice(i, i + 2), 16));
const lin = (c: number) => (c / 255 <= 0.03928 ? c / 255 / 12.92 : ((c / 255 + 0.055) / 1.055) ** 2.4);
const luminance = (h: string) => { const [r, g, b] = rgb(h).map(lin); return 0.2126 * r! + 0.7152 * g! + 0.0722 * b!; };

test('every kind colour is at least 50 (RGB distance, common practice, no source) from every series colour', () => {
  for (const [k, ks] of Object.entries(KIND_STROKES)) {
    for (const [n, ss] of Object.entries(SERIES_STROKES)) {
      const d = Math.hypot(...rgb(ks.colour).map((c, i) => c - rgb(ss.colour)[i]!));
      assert.ok(d >= 50, `${k} ${ks.colour} vs ${n} ${ss.colour}: ${d.toFixed(0)}`);
    }
  }
});

test('kind colours (used for labels) reach the WCAG 2.1 §1.4.3 contrast of 4.5:1 on white', () => {
  for (const [k, ks] of Object.entries(KIND_STROKES)) {
    const ratio = 1.05 / (luminance(ks.colour) + 0.05);
    assert.ok(ratio >= 4.5, `${k}: ${ratio.toFixed(2)}`);
  }
});

test.run();
