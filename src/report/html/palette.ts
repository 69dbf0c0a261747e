/**
 * Our own palette and line styles for the report. Every series and every boundary kind differs by line
 * style or marker shape as well as by hue, and the hues differ in lightness, so the charts stay readable for
 * colour-blind readers and in grey-scale print. Colours are dark enough for text on white (contrast ratio
 * at least 4.5:1, WCAG 2.1 §1.4.3, checked by hand; from memory of the formula). No kind shares a hue with a
 * series: every kind colour is at least 50 apart (RGB distance) from every series colour (test/report/html/palette.test.ts).
 */
import type { BoundaryKind } from '../../model/index.js';

export interface Stroke {
  colour: string;
  /** SVG stroke-dasharray ('' = solid). */
  dash: string;
  /** Words for the legend. */
  style: string;
}

export const KIND_STROKES: Record<BoundaryKind, Stroke> = {
  'cold-front': { colour: '#1f5fa8', dash: '', style: 'solid' },
  'warm-front': { colour: '#c2185b', dash: '8 3', style: 'long dashes' },
  'occluded-front': { colour: '#6d2f8f', dash: '8 3 2 3', style: 'dash-dot' },
  dryline: { colour: '#7a5214', dash: '2 3', style: 'dotted' },
  'outflow-boundary': { colour: '#00695c', dash: '10 2 2 2 2 2', style: 'dash-dot-dot' },
  'sea-breeze-front': { colour: '#b35900', dash: '4 4', style: 'short dashes' },
  'wind-shift': { colour: '#5c6bc0', dash: '1 5', style: 'sparse dots' },
};

/** Series styles (CSS classes in the page's style sheet use the same values). */
export const SERIES_STROKES = {
  temperature: { colour: '#b8322a', dash: '', style: 'solid line' },
  dewpoint: { colour: '#2e7d32', dash: '6 3', style: 'dashed line' },
  pressure: { colour: '#333333', dash: '', style: 'solid line' },
  windDir: { colour: '#555555', dash: '', style: 'dots' },
  windSpeed: { colour: '#333333', dash: '', style: 'solid line' },
  gust: { colour: '#455a64', dash: '2 2', style: 'dotted line' },
  flagged: { colour: '#000000', dash: '', style: 'crosses' },
} as const satisfies Record<string, Stroke>;

/** CSS class of a boundary kind (`k-cold-front`). */
export function kindClass(kind: BoundaryKind): string {
  return `k-${kind}`;
}
