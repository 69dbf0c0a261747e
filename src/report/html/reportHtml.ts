/**
 * The visual report as one self-contained HTML page (inline SVG and CSS, no scripts, fonts or external
 * files): what was read, counts by kind, the safety caution at top and bottom, the fronts tracked across the
 * network with a small map each, and per station an overview strip, a table of passages and stacked
 * time-series panels around each passage. Pure: the same input gives the same bytes (no clock is read).
 */
import { BOUNDARY_KINDS, type BoundaryKind, type FrontTrack, type PassageEvent, type StationMeta, type StationSeries } from '../../model/index.js';
import { medianCadenceMinutes } from '../../series/series.js';
import { escapeXml } from './escape.js';
import { frontMapSvg } from './frontMapSvg.js';
import type { Geography } from './geography.js';
import { overviewSvg } from './overviewSvg.js';
import { KIND_STROKES, SERIES_STROKES, kindClass } from './palette.js';
import { panelSvg } from './panelSvg.js';
import { utcMinute } from './timeAxis.js';
import { DateTime } from 'luxon';
import { legendSvg } from './legendSvg.js';
import { barCss } from './barChartSvg.js';

const HOUR = 3_600_000;

export interface ReportFile {
  file: string;
  format: string;
  parsed: number;
  rejected: number;
}

export interface ReportInput {
  /** Stations to show, in order. */
  series: readonly StationSeries[];
  /** Passages (any station; only those of shown stations inside the period are shown). */
  events: readonly PassageEvent[];
  /** Fronts tracked across the network (those with a passage inside the period are shown). */
  tracks: readonly FrontTrack[];
  /** Every station with coordinates (for the maps). */
  stations: readonly StationMeta[];
  files: readonly ReportFile[];
  /** Period shown, epoch ms UTC; default: all data of the shown stations. */
  fromMs?: number;
  toMs?: number;
  caution: string;
  /** Free text under the title (e.g. the command line); nothing time-dependent is added by the builder. */
  note?: string;
  /** Hours either side of a passage drawn in its panel (default 12). */
  windowHours?: number;
  /** Most panels per station (default 40). */
  maxPanels?: number;
  /** Periods up to this long get one panel per station instead of one per passage, hours (default 96). */
  singlePanelHours?: number;
  /** IANA zone: passage times are shown in it beside UTC (tables and captions); UTC only when absent. */
  localZone?: string;
  /** Land, coastlines and borders for the front maps (geography.ts loadGeography); plain maps when absent. */
  geography?: Geography;
  /** Extra sections (season, verification), in order; none by default. */
  sections?: readonly ReportSection[];
}

/**
 * A section built elsewhere (season charts, verification charts: src/season/seasonHtml.ts, src/verify/verifyHtml.ts)
 * and placed after the fronts, before the stations; listed in the contents.
 */
export interface ReportSection {
  /** Element id (unique in the page). */
  id: string;
  title: string;
  /** The section's body: HTML with inline SVG, escaped by its builder. */
  html: string;
}

export interface PanelWindow {
  t0: number;
  t1: number;
  events: PassageEvent[];
}

/**
 * Panel windows for one station's passages (sorted by time): a passage within 6 h of the first passage of
 * the current window joins it; each window spans its first passage − `hours` to its last + `hours`, clipped
 * to the period. At most `max` windows (the first ones); `dropped` says how many passages were left out.
 */
export function passageWindows(events: readonly PassageEvent[], fromMs: number, toMs: number, hours = 12, max = 40): { windows: PanelWindow[]; dropped: number } {
  const sorted = [...events].sort((a, b) => a.timeMs - b.timeMs);
  const windows: PanelWindow[] = [];
  let dropped = 0;
  for (const e of sorted) {
    const cur = windows[windows.length - 1];
    if (cur && e.timeMs - cur.events[0]!.timeMs <= 6 * HOUR) {
      cur.events.push(e);
      cur.t1 = Math.min(toMs, e.timeMs + hours * HOUR);
      continue;
    }
    if (windows.length >= max) {
      dropped++;
      continue;
    }
    windows.push({ t0: Math.max(fromMs, e.timeMs - hours * HOUR), t1: Math.min(toMs, e.timeMs + hours * HOUR), events: [e] });
  }
  return { windows, dropped };
}

/** Data period of the series: first and last report time (NaN pair when empty). */
function dataPeriod(series: readonly StationSeries[]): [number, number] {
  let a = Infinity, b = -Infinity;
  for (const s of series) {
    if (s.length === 0) continue;
    a = Math.min(a, s.timeMs[0]!);
    b = Math.max(b, s.timeMs[s.length - 1]!);
  }
  return a <= b ? [a, b] : [NaN, NaN];
}

const fmt = (x: number, d: number, signed = false) => {
  if (!Number.isFinite(x)) return '–';
  const r = Number(x.toFixed(d));
  const v = r === 0 ? 0 : r;
  return (signed && v > 0 ? '+' : '') + v.toFixed(d);
};
const plural = (n: number, w: string) => `${n} ${w}${n === 1 ? '' : 's'}`;
const compass = (deg: number) => ['N', 'NE', 'E', 'SE', 'S', 'SW', 'W', 'NW'][Math.round((((deg % 360) + 360) % 360) / 45) % 8]!;

/** Style sheet of the page (colours from palette.ts; print rules keep panels whole and colours exact). */
export function reportCss(): string {
  const kinds = BOUNDARY_KINDS.map((k) => {
    const s = KIND_STROKES[k];
    return `.${kindClass(k)}{stroke:${s.colour};fill:${s.colour}}path.pass.${kindClass(k)}{stroke-dasharray:${s.dash || 'none'}}.kind-${k}{border-left:6px solid ${s.colour}}`;
  }).join('\n');
  const S = SERIES_STROKES;
  return `
body{font:14px/1.45 system-ui,-apple-system,"Segoe UI",Roboto,Helvetica,Arial,sans-serif;color:#1a1a1a;background:#fff;margin:0 auto;max-width:none;padding:0 16px 32px}
h1{font-size:1.6em;margin:0.6em 0 0.2em}h2{font-size:1.3em;margin:1.6em 0 0.4em;border-bottom:2px solid #ccc;padding-bottom:2px}h3{font-size:1.05em;margin:1.2em 0 0.3em}
.caution{border:2px solid #8a5a00;background:#fff6e0;padding:8px 12px;font-weight:600}
table{border-collapse:collapse;margin:0.4em 0 1em;font-size:0.92em}th,td{border:1px solid #bbb;padding:3px 6px;text-align:left;vertical-align:top}th{background:#f0f0f0}td.n{text-align:right;font-variant-numeric:tabular-nums}
td.ev{font-size:0.88em;line-height:1.3}td.ev .fails{color:#555;font-style:italic}td.t{white-space:nowrap}
.muted{color:#555}.sr{position:absolute;left:-10000px;width:1px;height:1px;overflow:hidden}nav ul{columns:4;list-style:none;padding:0}figure{margin:0.6em 0 1.2em}figcaption{font-size:0.9em;color:#333}
svg{max-width:100%;height:auto;font-size:11px;font-family:inherit}svg.panel{width:100%}svg text{fill:#222}
.grid{stroke:#e3e3e3;stroke-width:1;fill:none}.land{fill:#f1efe6;stroke:#8c8c8c;stroke-width:0.8}.graticule{fill:none;stroke:#d6dde6;stroke-width:0.6}.border{fill:none;stroke:#9a9a9a;stroke-width:0.7}.border.state{stroke-dasharray:3 2}.scalebar{fill:none;stroke:#333;stroke-width:1.2}.grid.day{stroke:#bdbdbd}.frame{fill:none;stroke:#999;stroke-width:1}
.row-title{font-weight:600;fill:#333}.y-labels text,.tick-labels text{fill:#444}
.temp{fill:none;stroke:${S.temperature.colour};stroke-width:1.8;stroke-linejoin:round;stroke-linecap:round}
.dew{fill:none;stroke:${S.dewpoint.colour};stroke-width:1.6;stroke-dasharray:${S.dewpoint.dash};stroke-linecap:round}
.pres{fill:none;stroke:${S.pressure.colour};stroke-width:1.6;stroke-linecap:round}
.wdir{fill:none;stroke:${S.windDir.colour};stroke-width:3.2;stroke-linecap:round}
.wspd{fill:none;stroke:${S.windSpeed.colour};stroke-width:1.6;stroke-linecap:round}
.gust{fill:none;stroke:${S.gust.colour};stroke-width:1.4;stroke-dasharray:${S.gust.dash};stroke-linecap:round}
.flagged{fill:none;stroke:${S.flagged.colour};stroke-width:1.8}
rect.zone{fill-opacity:0.10;stroke:none}rect.window{fill-opacity:0.28;stroke:none}rect.win{fill:#000;fill-opacity:0.05}
path.pass{stroke-width:2;fill:none}text.pass-label{font-weight:600;stroke:none}
.iso{fill:none;stroke-width:1.2;stroke-opacity:0.8}.iso-label{font-size:9px;fill:#444}
.stn{fill:none;stroke:#111;stroke-width:6;stroke-linecap:round}.stn-id{font-weight:600;font-size:10px}.arr{font-size:9px;font-weight:600}.arr.expected{fill:#666;font-weight:400}
.arrow{fill:none;stroke:#111;stroke-width:1.6}.map-caption{font-size:10px}
.maps{display:flex;flex-wrap:wrap;gap:10px}.maps figure{margin:0;width:340px}
${kinds}
@media print{body{max-width:none;font-size:11px}nav{display:none}figure,svg,tr{break-inside:avoid;page-break-inside:avoid}h2,h3{break-after:avoid}*{-webkit-print-color-adjust:exact;print-color-adjust:exact}}
`.trim();
}

function countsByKind(events: readonly PassageEvent[]): Map<BoundaryKind, number> {
  const m = new Map<BoundaryKind, number>();
  for (const k of BOUNDARY_KINDS) {
    const n = events.filter((e) => e.kind === k).length;
    if (n) m.set(k, n);
  }
  return m;
}

/** Evidence strings (`+ …` held, `− …` failed) as a list in plain words. */
function evidenceList(ev: readonly string[]): string {
  if (!ev.length) return '';
  return ev
    .map((s) => {
      const fails = /^[−-]\s*/.test(s);
      const text = s.replace(/^[+−-]\s*/, '');
      return `<span class="${fails ? 'fails' : 'holds'}">${fails ? '− <span class="sr">failed: </span>' : '+ <span class="sr">held: </span>'}${escapeXml(text)}</span>`;
    })
    .join('; ');
}

/** ` (HH:MM ZONE-ABBREVIATION local)` for a time in a zone; '' without a zone or for NaN. */
function localBeside(ms: number, zone: string | undefined): string {
  if (!zone || !Number.isFinite(ms)) return '';
  const d = DateTime.fromMillis(ms, { zone });
  return ` (${d.toFormat('yyyy-MM-dd HH:mm')} ${d.offsetNameShort ?? zone} local)`;
}

function passageTable(events: readonly PassageEvent[], panelOf: (e: PassageEvent) => string | undefined, zone?: string): string {
  if (!events.length) return '<p>No passages found at this station in the period.</p>';
  const rows = events
    .map((e) => {
      const href = panelOf(e);
      const time = escapeXml(utcMinute(e.timeMs)) + (zone ? `<br><span class="muted">${escapeXml(localBeside(e.timeMs, zone).trim())}</span>` : '');
      const wind = Number.isFinite(e.windBeforeDeg) || Number.isFinite(e.windAfterDeg) ? `${fmt(e.windBeforeDeg, 0)}→${fmt(e.windAfterDeg, 0)} (${fmt(e.windTurnDeg, 0, true)})` : '–';
      return (
        `<tr class="kind-${e.kind}"><td class="t">${href ? `<a href="#${escapeXml(href)}">${time}</a>` : time}</td><td class="t">${escapeXml(e.kind)}</td>` +
        `<td class="n">±${fmt((e.timeLatestMs - e.timeEarliestMs) / 2 / 60000, 0)}</td><td class="n">${fmt(e.confidence, 2)}</td>` +
        `<td class="n">${fmt(e.tempChangeC, 1, true)}</td><td class="n">${fmt(e.dewpointChangeC, 1, true)}</td><td>${wind}</td>` +
        `<td class="n">${fmt(e.pressureMinHpa, 1)}${e.operator && e.operator.pressureSource !== 'none' ? ` <span class="src">(${escapeXml(e.operator.pressureSource)})</span>` : ''}</td>` +
        `<td class="n">${fmt(e.zoneHours, 1)}</td><td class="ev">${evidenceList(e.evidence)}</td></tr>`
      );
    })
    .join('');
  return (
    '<table><thead><tr><th scope="col">time (UTC)</th><th scope="col">kind</th><th scope="col">± min</th><th scope="col">confidence</th>' +
    '<th scope="col">ΔT °C</th><th scope="col">ΔTd °C</th><th scope="col">wind ° before→after (turn, + veering)</th><th scope="col">p min hPa (pressure drawn)</th><th scope="col">zone h</th><th scope="col">evidence (+ held, − failed)</th></tr></thead>' +
    `<tbody>${rows}</tbody></table>`
  );
}

function frontsSection(tracks: readonly FrontTrack[], stations: readonly StationMeta[], geography?: Geography): string {
  if (!tracks.length) return '';
  const byId = new Map(stations.map((s) => [s.id, s]));
  const rows = tracks
    .map(
      (t) =>
        `<tr class="kind-${t.kind}"><td class="t"><a href="#front-${tracks.indexOf(t)}">${escapeXml(t.id)}</a></td><td class="n">${t.members.length}</td>` +
        `<td class="t">${escapeXml(utcMinute(t.members[0]!.event.timeMs))}</td><td class="t">${escapeXml(utcMinute(t.members[t.members.length - 1]!.event.timeMs))}</td>` +
        `<td class="n">${fmt(t.speedKmh, 0)}</td><td class="t">${fmt(t.directionDeg, 0)}° ${compass(t.directionDeg)}</td><td class="n">${fmt(t.rmsResidualMin, 0)}</td>` +
        `<td>${escapeXml(t.trend)}</td><td class="n">${fmt(t.strengthSlopeCPer100km, 2, true)}</td><td class="n">${fmt(t.frontogenesisKPer100kmPer3h ?? NaN, 2, true)}</td></tr>`,
    )
    .join('');
  const maps = tracks
    .map((t, i) => {
      const ids = [...t.members.map((m) => m.station), ...t.expected.map((e) => e.station)];
      const metas = [...new Set(ids)].map((id) => byId.get(id)).filter((m): m is StationMeta => m !== undefined).sort((a, b) => (a.id < b.id ? -1 : 1));
      if (metas.length < 2) return '';
      return `<figure id="front-${i}">${frontMapSvg({ track: t, stations: metas, id: `map-${i}`, geography })}<figcaption>${escapeXml(t.id)}</figcaption></figure>`;
    })
    .join('');
  return (
    '<section id="network"><h2>Fronts across the network</h2>' +
    '<p>Passages at three or more stations fitted as one straight front moving steadily. Speed is normal to the front; “toward” is the direction it moves; “fit ± min” is the root-mean-square distance of the observed passage times from the fitted ones; trend: along-track strengthening (frontogenesis) or weakening (frontolysis) of the temperature change; F: Petterssen kinematic frontogenesis at the passages (median), positive when the wind field tightens the temperature gradient.</p>' +
    '<table><thead><tr><th scope="col">front</th><th scope="col">stations</th><th scope="col">first (UTC)</th><th scope="col">last (UTC)</th><th scope="col">speed km/h</th><th scope="col">toward</th><th scope="col">fit ± min</th><th scope="col">trend</th><th scope="col">ΔT °C per 100 km</th><th scope="col">F K per 100 km per 3 h</th></tr></thead>' +
    `<tbody>${rows}</tbody></table>` +
    '<p>Maps (north up, equirectangular about the network centre): lines are the fitted front position every 3 h, labelled with the hour (UTC); at each station the observed passage time in bold, or the fitted time in brackets where no passage of this front was detected; the arrow shows the motion; the bar gives the scale.' +
    (geography ? ` Grey: land and coastlines, country borders (solid) and US state borders (dashed), with a graticule. ${escapeXml(geography.credit)}` : '') +
    '</p>' +
    `<div class="maps">${maps}</div></section>`
  );
}

/** The whole report page. */
export function reportHtml(r: ReportInput): string {
  const hours = r.windowHours ?? 12;
  const maxPanels = r.maxPanels ?? 40;
  const [d0, d1] = dataPeriod(r.series);
  const from = r.fromMs ?? d0;
  const to = r.toMs ?? d1;
  const shown = new Set(r.series.map((s) => s.station));
  const inPeriod = (t: number) => t >= from && t <= to;
  const events = r.events.filter((e) => shown.has(e.station) && inPeriod(e.timeMs));
  const tracks = r.tracks.filter((t) => t.members.some((m) => inPeriod(m.event.timeMs)));
  const single = to - from <= (r.singlePanelHours ?? 96) * HOUR;
  const period = Number.isFinite(from) ? `${utcMinute(from)} to ${utcMinute(to)} UTC` : 'no data';
  const title = `fropa report: ${plural(r.series.length, 'station')}, ${period}`;

  const counts = countsByKind(events);
  const countText = counts.size ? [...counts].map(([k, n]) => `<li><span class="kind-${k}" aria-hidden="true">&nbsp;</span> ${n} ${escapeXml(k)}</li>`).join('') : '<li>no passages</li>';
  const fileRows = r.files
    .map((f) => `<tr><td>${escapeXml(f.file)}</td><td>${escapeXml(f.format)}</td><td class="n">${f.parsed}</td><td class="n">${f.rejected}</td></tr>`)
    .join('');
  const stationRows = r.series
    .map((s, i) => {
      const m = s.meta;
      const n = events.filter((e) => e.station === s.station).length;
      return `<tr><td><a href="#st-${i}">${escapeXml(s.station)}</a></td><td>${escapeXml(m?.name ?? '')}</td><td class="n">${m ? fmt(m.latDeg, 2) : '–'}</td><td class="n">${m ? fmt(m.lonDeg, 2) : '–'}</td><td class="n">${m ? fmt(m.elevationM, 0) : '–'}</td><td class="n">${s.length}</td><td class="n">${n}</td></tr>`;
    })
    .join('');

  let stationsHtml = '';
  r.series.forEach((s, si) => {
    const mine = events.filter((e) => e.station === s.station).sort((a, b) => a.timeMs - b.timeMs);
    const cadence = medianCadenceMinutes(s.timeMs);
    const gapMs = Number.isFinite(cadence) && cadence > 0 ? 2.5 * cadence * 60000 : Infinity;
    const { windows, dropped } = single ? { windows: [{ t0: from, t1: to, events: mine }], dropped: 0 } : passageWindows(mine, from, to, hours, maxPanels);
    const panelIds = windows.map((_, wi) => `st-${si}-p${wi}`);
    const panelOf = (e: PassageEvent) => {
      const wi = windows.findIndex((w) => w.events.includes(e));
      return wi >= 0 ? panelIds[wi] : undefined;
    };
    const name = s.meta?.name ? ` — ${s.meta.name}` : '';
    let h = `<section id="st-${si}" class="station"><h2>${escapeXml(s.station + name)}</h2>`;
    h += `<p>${plural(s.length, 'report')} in all; median spacing ${fmt(cadence, 0)} min; ${plural(mine.length, 'passage')} in the period.</p>`;
    if (!single) h += `<figure>${overviewSvg({ series: s, events: mine, t0: from, t1: to, id: `st-${si}-ov`, gapMs, windows: windows.map((w, wi) => ({ t0: w.t0, t1: w.t1, href: panelIds[wi]! })) })}</figure>`;
    h += `<h3>Passages at ${escapeXml(s.station)}</h3>` + passageTable(mine, panelOf, r.localZone);
    if (windows.length) {
      h += `<h3>Charts${single ? '' : ` around each passage (±${hours} h)`}</h3>`;
      if (dropped) h += `<p class="muted">Only the first ${maxPanels} charts are drawn; ${plural(dropped, 'later passage')} ${dropped === 1 ? 'has' : 'have'} no chart here (restrict the period with --from/--to to see ${dropped === 1 ? 'it' : 'them'}).</p>`;
      windows.forEach((w, wi) => {
        const cap = w.events.length ? w.events.map((e) => `${e.kind} ${utcMinute(e.timeMs)} UTC${localBeside(e.timeMs, r.localZone)}`).join('; ') : 'no passage';
        h += `<figure id="${panelIds[wi]}">${panelSvg({ series: s, events: mine, t0: w.t0, t1: w.t1, id: `${panelIds[wi]}s`, gapMs })}<figcaption>${escapeXml(`${s.station}, ${utcMinute(w.t0)} to ${utcMinute(w.t1)} UTC: ${cap}`)}</figcaption></figure>`;
      });
    } else if (!single) h += '<p class="muted">No passage, so no detailed chart; the overview above shows the whole period.</p>';
    stationsHtml += h + '</section>';
  });

  const caution = `<p class="caution" role="note">${escapeXml(r.caution)}</p>`;
  const sections = r.sections ?? [];
  const sectionLinks = sections.map((x) => `<li><a href="#${escapeXml(x.id)}">${escapeXml(x.title)}</a></li>`).join('');
  const sectionsHtml = sections.map((x) => `<section id="${escapeXml(x.id)}"><h2>${escapeXml(x.title)}</h2>${x.html}</section>`).join('\n');
  const nav = r.series.length > 1 || sections.length ? `<nav aria-label="Stations"><h2>Contents</h2><ul>${tracks.length ? '<li><a href="#network">Fronts across the network</a></li>' : ''}${sectionLinks}${r.series.map((s, i) => `<li><a href="#st-${i}">${escapeXml(s.station)}</a></li>`).join('')}</ul></nav>` : '';
  const layout = single
    ? 'The period is short, so each station gets one chart covering all of it.'
    : `Each station gets an overview of its temperature over the whole period and one chart per passage (±${hours} h; passages within 6 h share a chart; at most ${maxPanels} charts per station).`;

  return (
    '<!DOCTYPE html>\n<html lang="en">\n<head>\n<meta charset="utf-8">\n<meta name="viewport" content="width=device-width, initial-scale=1">\n' +
    `<title>${escapeXml(title)}</title>\n<style>\n${reportCss()}${sections.length ? '\n' + barCss() : ''}\n</style>\n</head>\n<body>\n<header>\n` +
    `<h1>Frontal passages: ${escapeXml(period)}</h1>\n${caution}\n` +
    (r.note ? `<p class="muted">${escapeXml(r.note)}</p>\n` : '') +
    '</header>\n<main>\n<section id="summary"><h2>What was read and found</h2>' +
    `<p>${plural(r.series.length, 'station')}, ${plural(r.files.length, 'file')}, period ${escapeXml(period)}. ${plural(events.length, 'passage')} found:</p><ul>${countText}</ul>` +
    `<p>${escapeXml(layout)} All times are UTC.</p>` +
    `<details><summary>Files read (${r.files.length})</summary><table><thead><tr><th scope="col">file</th><th scope="col">format</th><th scope="col">reports read</th><th scope="col">lines rejected</th></tr></thead><tbody>${fileRows}</tbody></table></details>` +
    `<table><thead><tr><th scope="col">station</th><th scope="col">name</th><th scope="col">lat °</th><th scope="col">lon °</th><th scope="col">elevation m</th><th scope="col">reports</th><th scope="col">passages</th></tr></thead><tbody>${stationRows}</tbody></table>` +
    `<h3>How to read the charts</h3><figure>${legendSvg()}</figure></section>\n` +
    nav +
    frontsSection(tracks, r.stations, r.geography) +
    (sections.length ? '\n' + sectionsHtml : '') +
    '\n' +
    stationsHtml +
    `\n</main>\n<footer>\n${caution}\n</footer>\n</body>\n</html>\n`
  );
}
