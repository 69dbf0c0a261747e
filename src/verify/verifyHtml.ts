/**
 * The verification section of the HTML report (`fropa report --forecasts FILE`): hits, misses and false alarms per
 * station, and the distribution of timing errors (forecast − observed; positive = forecast late) of the hits, as
 * inline SVG bar charts with their numbers in tables. Pure: a verification result in, HTML text out.
 */
import { barFigure, type BarChartInput } from '../report/html/barChartSvg.js';
import { escapeXml } from '../report/html/escape.js';
import type { ReportSection } from '../report/html/reportHtml.js';
import type { VerifyResult } from './verify.js';

const f2 = (x: number) => (Number.isFinite(x) ? x.toFixed(2) : '–');
const f0 = (x: number) => (Number.isFinite(x) ? (Math.round(x) === 0 ? 0 : Math.round(x)).toFixed(0) : '–');

/**
 * Timing errors of the hits in whole-hour bins over [−window, +window): bin h holds errors from h to h + 1 hours (an
 * error of exactly +window, the edge of the match window, goes in the last bin).
 * @example timingHistogram([-30, 10, 70], 2) // { edges: [-2, -1, 0, 1], counts: [0, 1, 1, 1] }
 */
export function timingHistogram(errorsMin: readonly number[], windowHours: number): { edges: number[]; counts: number[] } {
  const w = Math.max(1, Math.ceil(windowHours));
  const edges = Array.from({ length: 2 * w }, (_, k) => k - w);
  const counts = new Array<number>(2 * w).fill(0);
  for (const e of errorsMin) {
    if (!Number.isFinite(e)) continue;
    const k = Math.min(2 * w - 1, Math.max(0, Math.floor(e / 60) + w));
    counts[k]!++;
  }
  return { edges, counts };
}

/** The verification section: scores in words, hits/misses/false alarms per station, timing-error histogram. */
export function verificationSection(r: VerifyResult, forecastLabel: string): ReportSection {
  const stations = [...r.byStation.keys()].sort();
  const sc = stations.map((s) => r.byStation.get(s)!);
  const perStation: BarChartInput = {
    id: 'verify-stations',
    title: 'Hits, misses and false alarms per station',
    categories: stations,
    series: [
      { label: 'hits', cls: 'b-hit', values: sc.map((x) => x.hits) },
      { label: 'misses', cls: 'b-miss', values: sc.map((x) => x.misses) },
      { label: 'false alarms', cls: 'b-false-alarm', values: sc.map((x) => x.falseAlarms) },
    ],
    yLabel: 'count',
    labelEvery: stations.length > 24 ? Math.ceil(stations.length / 24) : 1,
  };
  const h = timingHistogram(r.pairs.map((p) => p.errorMin), r.windowHours);
  const timing: BarChartInput = {
    id: 'verify-timing',
    title: 'Timing error of the hits (forecast − observed, hours)',
    categories: h.edges.map((e) => (e > 0 ? `+${e}` : String(e))),
    series: [{ label: 'hits', cls: 'b-hit', values: h.counts }],
    yLabel: 'hits',
  };
  const s = r.scores;
  let html =
    `<p>Forecasts from ${escapeXml(forecastLabel)} (${r.issueCount} issue${r.issueCount === 1 ? '' : 's'}) against the observed passages, matched within ±${r.windowHours} h, kinds strict, the latest issue before each passage, as <code>fropa verify</code> counts them (its passages are found without the network stage, so they can differ slightly from those shown below). ` +
    `Hits ${s.hits}, misses ${s.misses}, false alarms ${s.falseAlarms}; probability of detection ${f2(s.pod)}, false-alarm ratio ${f2(s.far)}, critical success index ${f2(s.csi)}, bias ${f2(s.bias)} (Wilks 2011, ch. 8); ` +
    `timing error mean ${f0(s.timingErrorMeanMin)} min, median ${f0(s.timingErrorMedianMin)} min (positive = forecast late).</p>`;
  html += barFigure(perStation, 'station', 'Per station: hits and misses of the observed passages, false alarms of the forecasts (stacked).');
  html += barFigure(timing, 'error from (h)', 'Bar h holds the hits whose forecast time was h to h + 1 hours after the observed passage (negative: forecast early).');
  return { id: 'verification', title: 'Forecast verification', html };
}
