/** The chart legend as an SVG string: line styles of the series, the passage marks, and each boundary kind. */
import { BOUNDARY_KINDS } from '../../model/index.js';
import { escapeXml } from './escape.js';
import { kindClass } from './palette.js';

/** Legend for the panels (two columns of samples with words). */
export function legendSvg(): string {
  const items: [string, string][] = [
    ['<path class="temp" d="M4,0H40"/>', 'temperature (solid)'],
    ['<path class="dew" d="M4,0H40"/>', 'dew point (dashed)'],
    ['<path class="pres" d="M4,0H40"/>', 'pressure'],
    ['<path class="wdir" d="M8,0h0M20,0h0M32,0h0"/>', 'wind direction (dots)'],
    ['<path class="wspd" d="M4,0H40"/>', 'wind speed (solid)'],
    ['<path class="gust" d="M4,0H40"/>', 'gust (dotted)'],
    ['<path class="flagged" d="M19,-3l6,6m0,-6l-6,6"/>', 'value flagged by quality control (not used in detection)'],
    ['<path class="temp" d="M4,0H18M28,0H40"/>', 'gap in a line: missing or flagged value, or no report for 2.5 report intervals'],
    ['<rect class="window k-cold-front" x="4" y="-7" width="36" height="14"/>', 'timing window: last report before to first after the passage'],
    ['<rect class="zone k-cold-front" x="4" y="-7" width="36" height="14"/>', 'transition zone behind the passage (lighter)'],
  ];
  const kinds: [string, string][] = BOUNDARY_KINDS.map((k) => [`<path class="pass ${kindClass(k)}" d="M4,0H40"/>`, `passage: ${k}`]);
  const rowH = 18;
  const col = (list: [string, string][], x: number) =>
    list.map(([sample, text], i) => `<g transform="translate(${x},${12 + i * rowH})">${sample}<text x="48" y="0" dy="0.32em">${escapeXml(text)}</text></g>`).join('');
  const h = 12 + Math.max(items.length, kinds.length) * rowH;
  return (
    `<svg class="legend" xmlns="http://www.w3.org/2000/svg" viewBox="0 0 960 ${h}" width="960" height="${h}" role="img" aria-labelledby="legend-t">` +
    '<title id="legend-t">Legend: temperature solid, dew point dashed, pressure solid, wind direction dots, wind speed solid, gust dotted, crosses mark values flagged by quality control, gaps in lines are missing reports; each passage is a vertical line with a dark band over its timing window and a light band over its transition zone; each kind has its own colour and line pattern.</title>' +
    col(items, 0) +
    col(kinds, 560) +
    '</svg>'
  );
}
