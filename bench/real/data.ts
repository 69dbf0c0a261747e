/**
 * The real development set: which files, how each is read, and the labels (the project's own
 * judgement, made by eye; see labels/CRITERIA.md). Shared by bench/real.ts and the model fit.
 */
import { existsSync, readdirSync, readFileSync } from 'node:fs';
import { dirname, join, resolve } from 'node:path';
import { fileURLToPath } from 'node:url';
import Papa from 'papaparse';

const HERE = dirname(fileURLToPath(import.meta.url));
export const LABEL_DIR = join(HERE, 'labels');
export const STATIONS_FILE = join(HERE, 'stations.csv');
/** `../shared` beside the checkout (FROPA_SHARED overrides). */
export const SHARED = process.env.FROPA_SHARED ?? resolve(HERE, '../../../shared');

export interface RealFile {
  /** File name as the labels name it. */
  name: string;
  path: string;
  /** Minutes east of UTC for naive local times (LCD processed files are local standard time). */
  offsetMinutes?: number;
  /** Station id for files without a station column (the file name gives none we can match). */
  station?: string;
  /** Column overrides `header=field:unit`. */
  columns?: string[];
  /** year/month/day/hour columns (UTC) to be joined into one time column before reading. */
  ymdh?: boolean;
}

export const REAL_FILES: RealFile[] = [
  { name: 'ATL_2019_LCD_localstd.csv', path: 'realskill/ATL_2019_LCD_localstd.csv', offsetMinutes: -300, station: 'KATL' },
  { name: 'ORD_2019_LCD_localstd.csv', path: 'realskill/ORD_2019_LCD_localstd.csv', offsetMinutes: -360, station: 'KORD' },
  { name: 'JFK_2019_LCD_localstd.csv', path: 'realskill/JFK_2019_LCD_localstd.csv', offsetMinutes: -300, station: 'KJFK' },
  { name: 'SUT_2013-2017_iem.csv', path: 'realskill/SUT_2013-2017_iem.csv', columns: ['sped=windSpeed:mph'] },
  { name: 'HXD_2013-2017_iem.csv', path: 'realskill/HXD_2013-2017_iem.csv', columns: ['sped=windSpeed:mph'] },
  { name: 'nyc_2022_EWR_JFK_LGA_hourly_utc.csv', path: 'realskill/nyc_2022_EWR_JFK_LGA_hourly_utc.csv', ymdh: true },
];

export const KINDS_FRONT = new Set(['cold-front', 'warm-front', 'occluded-front']);

export interface Label {
  group: string;
  file: string;
  station: string;
  kind: string;
  timeMs: number;
  shiftBeforeMs: number;
  shiftAfterMs: number;
  changeStartMs: number;
  certainty: string;
  notes: string;
  part: 'tune' | 'report';
}

export interface Coverage {
  file: string;
  station: string;
  /** YYYY-MM */
  month: string;
  part: 'tune' | 'report';
}

const ms = (s: string | undefined): number => {
  if (!s || !s.trim()) return NaN;
  let t = s.trim();
  if (/^\d{4}-\d\d-\d\dT\d\d:\d\dZ$/.test(t)) t = t.replace('Z', ':00Z');
  const v = Date.parse(t.endsWith('Z') || /[+-]\d\d:?\d\d$/.test(t) ? t : t + 'Z');
  return Number.isFinite(v) ? v : NaN;
};

function readCsv(path: string): Record<string, string>[] {
  const r = Papa.parse<Record<string, string>>(readFileSync(path, 'utf8'), { header: true, skipEmptyLines: true });
  return r.data;
}

/**
 * The split by station-year, fixed before any label was scored: `tune` may be used to fit and tune,
 * `report` is only scored.
 */
export const SPLIT: Record<string, Record<string, 'tune' | 'report'>> = {
  KORD: { '2019': 'tune' },
  KATL: { '2019': 'report' },
  KJFK: { '2019': 'report', '2022': 'tune' },
  KEWR: { '2022': 'tune' },
  KLGA: { '2022': 'tune' },
  KSUT: { '2013': 'tune', '2014': 'tune', '2015': 'tune', '2016': 'report', '2017': 'report' },
  KHXD: { '2013': 'report', '2014': 'report', '2015': 'tune', '2016': 'tune', '2017': 'tune' },
};
export const partOfStationYear = (station: string, year: string): 'tune' | 'report' | undefined => SPLIT[station]?.[year];

/** Station ids as the labels write them (ICAO); 3-letter US ids get a K. */
export const icao = (id: string) => (id.length === 3 ? 'K' + id : id);

/** Every label and coverage row, with the part of each label taken from its station-year. */
export function readLabels(dir = LABEL_DIR): { labels: Label[]; coverage: Coverage[]; problems: string[] } {
  const problems: string[] = [];
  const coverage: Coverage[] = [];
  const labels: Label[] = [];
  if (!existsSync(dir)) return { labels, coverage, problems: [`no label folder ${dir}`] };
  const names = readdirSync(dir).sort();
  for (const n of names.filter((n) => n.endsWith('-coverage.csv'))) {
    for (const r of readCsv(join(dir, n))) {
      const part = (r.part ?? '').trim();
      if (part !== 'tune' && part !== 'report') {
        problems.push(`${n}: bad part ${part}`);
        continue;
      }
      coverage.push({ file: (r.file ?? '').trim(), station: icao((r.station ?? '').trim()), month: (r.month ?? '').trim(), part });
    }
  }
  for (const c of coverage) {
    const p = partOfStationYear(c.station, c.month.slice(0, 4));
    if (p !== c.part) problems.push(`coverage ${c.station} ${c.month}: part ${c.part}, but the split says ${p ?? 'none'}`);
  }
  for (const n of names.filter((n) => n.endsWith('-events.csv'))) {
    const group = n.replace(/-events\.csv$/, '');
    readCsv(join(dir, n)).forEach((r, i) => {
      const station = icao((r.station ?? '').trim());
      const timeMs = ms(r.time_utc);
      if (!station || Number.isNaN(timeMs)) {
        problems.push(`${n}:${i + 2}: no station or time`);
        return;
      }
      const year = new Date(timeMs).toISOString().slice(0, 4);
      const part = partOfStationYear(station, year);
      if (!part) {
        problems.push(`${n}:${i + 2}: ${station} ${year} is in no coverage part`);
        return;
      }
      labels.push({
        group,
        file: (r.file ?? '').trim(),
        station,
        kind: (r.kind ?? '').trim(),
        timeMs,
        shiftBeforeMs: ms(r.shift_before_utc),
        shiftAfterMs: ms(r.shift_after_utc),
        changeStartMs: ms(r.change_start_utc),
        certainty: (r.certainty ?? '').trim(),
        notes: (r.notes ?? '').trim(),
        part,
      });
    });
  }
  labels.sort((a, b) => (a.station < b.station ? -1 : a.station > b.station ? 1 : a.timeMs - b.timeMs));
  return { labels, coverage, problems };
}

/** The text of a year/month/day/hour file with those columns joined into one ISO UTC `time` column. */
export function joinYmdh(text: string): string {
  const r = Papa.parse<string[]>(text, { skipEmptyLines: true });
  const rows = r.data;
  const h = rows[0]!;
  const iy = h.indexOf('year'), im = h.indexOf('month'), id = h.indexOf('day'), ih = h.indexOf('hour');
  const keep = h.map((_, j) => j).filter((j) => j !== iy && j !== im && j !== id && j !== ih);
  const p2 = (x: string) => x.padStart(2, '0');
  const out = [['time', ...keep.map((j) => h[j]!)].join(',')];
  for (let k = 1; k < rows.length; k++) {
    const row = rows[k]!;
    out.push([`${row[iy]}-${p2(row[im]!)}-${p2(row[id]!)}T${p2(row[ih]!)}:00Z`, ...keep.map((j) => row[j] ?? '')].join(','));
  }
  return out.join('\n') + '\n';
}

/** Is `timeMs` at `station` inside a covered station-month? */
export function coveredBy(coverage: readonly Coverage[]): (station: string, timeMs: number) => Coverage | undefined {
  const m = new Map<string, Coverage>();
  for (const c of coverage) m.set(`${c.station}|${c.month}`, c);
  return (station, timeMs) => m.get(`${station}|${new Date(timeMs).toISOString().slice(0, 7)}`);
}
