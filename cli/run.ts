/**
 * fropa command line: parse arguments with yargs, dispatch to a lazily imported command, map the
 * outcome to an exit code. Exit codes: 0 success; 1 no usable data or a runtime failure; 2 usage
 * error (unknown option, missing path, bad option value, unreadable stations or mapping file).
 * Errors never show a stack trace unless `--verbose`.
 */
import { readFileSync } from 'node:fs';
import yargs, { type Argv } from 'yargs';
import { BOUNDARY_KINDS, CAUTION, UsageError } from '../src/index.js';
import { STDIN_TOKEN, withInputOptions, type CliIo } from './options.js';

export type { CliIo } from './options.js';

/** Version from package.json (one level up from cli/ under tsx, two from dist/cli/ when built). */
function version(): string {
  for (const rel of ['../package.json', '../../package.json']) {
    try {
      const p = JSON.parse(readFileSync(new URL(rel, import.meta.url), 'utf8')) as { name?: string; version?: string };
      if (p.name === 'fropa' && p.version) return p.version;
    } catch {
      // try the next candidate
    }
  }
  return 'unknown';
}

/** Word-wrap a paragraph (yargs' ESM build wraps help text mid-word, so fropa wraps its own and turns yargs' wrapping off). */
function wrapWords(text: string, width = 96): string {
  const lines: string[] = [];
  let line = '';
  for (const w of text.split(/\s+/)) {
    if (line && line.length + 1 + w.length > width) {
      lines.push(line);
      line = w;
    } else line = line ? `${line} ${w}` : w;
  }
  if (line) lines.push(line);
  return lines.join('\n');
}

const EPILOGUE = wrapWords('Exit status: 0 success, 1 no usable data or a failure while running (also when detection failed at every station), 2 usage error, 3 some stations failed and were skipped (each named on standard error) while the others gave results.') + '\n\n' + wrapWords(CAUTION);

interface Selected {
  command: 'inspect' | 'detect' | 'verify' | 'report' | 'merge' | 'season';
  args: Record<string, unknown>;
}

/** Options that steer detection and tracking, shared by `detect` and `report`. */
function withDetectionOptions<T>(y: Argv<T>) {
  return y
    .option('kinds', { type: 'string', describe: `Only these kinds, comma-separated: ${BOUNDARY_KINDS.join(', ')}`, group: 'Detection:' })
    .option('min-confidence', { type: 'number', describe: 'Drop passages below this confidence, 0 to 1 (detector default 0.5)', group: 'Detection:' })
    .option('front-speed', { type: 'number', describe: 'Front speed normal to the front, km/h, for zone depth and gradient (default: the speed fitted across the network)', group: 'Detection:' })
    .option('network', { type: 'boolean', default: true, describe: 'Track fronts across stations with coordinates (--no-network to skip)', group: 'Detection:' })
    .option('jobs', { type: 'number', describe: 'Worker threads for detection (default: the number of cores); the output is the same for every value', group: 'Detection:' });
}

/** Build the parser; the command handlers only record which command was chosen. */
function parser(onSelect: (s: Selected) => void) {
  return yargs()
    .scriptName('fropa')
    .usage('$0 <command> <paths...> [options]\n\nFind frontal passages in surface weather-station observations (METAR/SPECI, CSV).')
    .command(
      'inspect <paths...>',
      'Show how each file was read: format, counts, rejections, units, columns, stations, QC',
      (y) =>
        withInputOptions(y)
          .option('format', { choices: ['table', 'json'] as const, default: 'table', describe: 'Output format', group: 'Output:' })
          .example('$0 inspect stations-demo', 'Every file in the demo folder, as a table')
          .example('$0 inspect obs/KXYZ_2026-03.txt --format json', 'One JSON object per file')
          .example('$0 inspect mesonet_march.csv --column "Air Temp=temperature:degF" --tz America/Chicago', 'Name a column and its unit; local times')
          .example('cat reports.txt | $0 inspect - --month 2026-03', 'METAR lines from standard input')
          .epilogue(EPILOGUE),
      (a) => onSelect({ command: 'inspect', args: a as Record<string, unknown> }),
    )
    .command(
      'detect <paths...>',
      'Find frontal and other boundary passages at each station',
      (y) =>
        withDetectionOptions(withInputOptions(y))
          .option('format', { choices: ['table', 'csv', 'json', 'ndjson', 'geojson'] as const, default: 'table', describe: 'Output format (geojson: RFC 7946 stations, passages, hourly front positions, arrivals)', group: 'Output:' })
          .option('at', { type: 'string', describe: 'Point of interest LAT,LON[,NAME] for estimated front arrivals; repeatable', group: 'Output:' })
          .option('points', { type: 'string', describe: 'Points-of-interest CSV file with lat, lon and optional name columns', group: 'Output:' })
          .option('out-dir', { type: 'string', describe: 'Write events.csv, events.json, fronts.csv, fronts.json, summary.txt (and run.geojson with station positions) into DIR', group: 'Output:' })
          .option('local', { type: 'boolean', describe: 'Table times in the --tz zone instead of UTC (needs --tz; CSV/JSON stay UTC)', group: 'Output:' })
          .option('shard', { type: 'string', describe: 'K/N: detect only shard K of N (a fixed share of the stations by id) and write its records as NDJSON for fropa merge', group: 'Scale:' })
          .option('what', { choices: ['events', 'fronts', 'arrivals', 'all'] as const, describe: 'What to write: passages, fronts, estimated arrivals at --at/--points, or all (default: all in the table, events in CSV/JSON/NDJSON; CSV holds one of them)', group: 'Output:' })
          .option('wind-unit', { choices: ['kt', 'm/s', 'mph', 'km/h'] as const, describe: 'Wind unit of the table and of extra CSV columns (JSON keeps m/s, the unit in each key)', group: 'Output:' })
          .option('runway', { type: 'string', describe: 'Runway directions for cross- and tailwind before and after the shift, e.g. 04/22,13/31 (designator × 10 taken as degrees true; or three-digit true headings)', group: 'Output:' })
          .conflicts('out', 'out-dir')
          .example('$0 detect stations-demo', 'Passages in the demo folder, as a table')
          .example('$0 detect stations-demo --out-dir fropa-out', 'Write events and fronts (CSV, JSON) and a summary')
          .example('$0 detect obs/ --stations stations.csv --format csv --out events.csv', 'CSV for a spreadsheet')
          .example('$0 detect obs/ --kinds cold-front,dryline --min-confidence 0.6', 'Only confident cold fronts and drylines')
          .example('$0 detect mesonet_march.csv --tz America/Denver --local', 'Local times in the table')
          .example('$0 detect archive/ --shard 2/8 --out shard-2.ndjson', 'Shard 2 of 8; fropa merge shard-*.ndjson gives what one run gives')
          .example('$0 detect obs/ --wind-unit kt --runway 04/22,13/31', 'Winds in knots with runway cross- and tailwind components')
          .example('$0 detect obs/ --stations stations.csv --format json --what all', 'Passages and fronts in one JSON object')
          .example('$0 detect obs/ --stations stations.csv --at 41.88,-87.63,Downtown', 'Estimated arrival of each tracked front at a point')
          .example('$0 detect obs/ --stations stations.csv --format geojson --out run.geojson', 'Stations, passages and hourly front positions for a GIS')
          .epilogue(EPILOGUE),
      (a) => onSelect({ command: 'detect', args: a as Record<string, unknown> }),
    )
    .command(
      'verify <paths...>',
      'Verify forecast passage times against the passages found in the observations',
      (y) =>
        withInputOptions(y)
          .option('forecasts', { type: 'string', describe: 'Forecast passages, CSV: station, kind, forecast_time, issued_time, valid_from, valid_to (all but station and forecast_time optional)', group: 'Verification:' })
          .option('forecast-series', { type: 'string', describe: 'Forecast point series in any format fropa reads (e.g. model output at a station); its passages are detected as the observed ones; repeatable, one source each', group: 'Verification:' })
          .option('window-hours', { type: 'number', default: 6, describe: 'A forecast and an observed passage match when within this many hours', group: 'Verification:' })
          .option('valid-hours', { type: 'number', describe: 'An issue covers issued time … + this many hours (misses counted there) unless valid_from/valid_to are given; default: ±window around each forecast', group: 'Verification:' })
          .option('bootstrap-resamples', { type: 'number', default: 1000, describe: 'Bootstrap resamples of the headline intervals (0: none)', group: 'Verification:' })
          .option('bootstrap-seed', { type: 'number', default: 1, describe: 'Seed of the bootstrap (output is deterministic)', group: 'Verification:' })
          .option('kinds', { type: 'string', describe: `Verify only these kinds, comma-separated: ${BOUNDARY_KINDS.join(', ')}`, group: 'Verification:' })
          .option('min-confidence', { type: 'number', describe: 'Observed passages: drop those below this confidence, 0 to 1 (detector default 0.5)', group: 'Verification:' })
          .option('format', { choices: ['table', 'csv', 'json', 'scores'] as const, default: 'table', describe: 'Output format (CSV/JSON: one record per forecast and per miss of every issue; scores: CSV of the scores per group, with the headline intervals)', group: 'Output:' })
          .example('$0 verify stations-demo --forecasts stations-demo/forecasts/forecast_passages.csv', 'Demo forecasts against the demo observations: scores per station and lead time')
          .example('$0 verify obs/ --stations stations.csv --forecasts fc.csv --kinds cold-front --window-hours 3', 'Cold fronts only, matched within ±3 h')
          .example('$0 verify obs/ --forecasts fc.csv --format csv --out verification.csv', 'One row per forecast (hit or false alarm) and per miss, every issue')
          .example('$0 verify obs/ --forecasts fc.csv --valid-hours 48', 'Each issue covers 48 h from its issued time: passages there it did not forecast are misses')
          .example('$0 verify obs/ --forecast-series model/', 'Detect passages in model output at the stations and verify them with the same detector')
          .epilogue('Timing error = forecast − observed, minutes: positive = forecast late. Kinds are strict: a cold-front forecast never matches an observed occluded front (such near misses are listed). Each issue is verified on its own; the headline takes the latest issue before each passage.\n\n' + EPILOGUE),
      (a) => onSelect({ command: 'verify', args: a as Record<string, unknown> }),
    )
    .command(
      'report <paths...>',
      'Write one self-contained HTML page with charts of each station around its passages, the fronts and a map',
      (y) =>
        withDetectionOptions(withInputOptions(y))
          .option('from', { type: 'string', describe: 'Start of the period shown, ISO 8601 (UTC unless an offset is given), e.g. 2026-03-02 or 2026-03-02T06:00Z', group: 'Report:' })
          .option('to', { type: 'string', describe: 'End of the period shown (a date alone means the end of that day)', group: 'Report:' })
          .option('station', { type: 'string', describe: 'Show only this station; repeatable or comma-separated', group: 'Report:' })
          .option('local', { type: 'boolean', describe: 'Show passage times in the --tz zone beside UTC (needs --tz)', group: 'Report:' })
          .option('season', { type: 'boolean', describe: 'Add a season section: passages by kind and month, and by hour of the day (as fropa season)', group: 'Report:' })
          .option('forecasts', { type: 'string', describe: 'Add a verification section for these forecast passages (CSV as for fropa verify): hits, misses and false alarms per station, timing errors', group: 'Report:' })
          .option('window-hours', { type: 'number', default: 6, describe: 'With --forecasts: a forecast and an observed passage match when within this many hours', group: 'Report:' })
          .example('$0 report stations-demo --out report.html', 'The demo network: overview, fronts with maps, a chart per passage')
          .example('$0 report stations-demo --from 2026-03-02 --to 2026-03-03 --out march2.html', 'Two days, one chart per station covering them')
          .example('$0 report obs/ --stations stations.csv --station KORD --kinds cold-front', 'One station, cold fronts only')
          .example('$0 report stations-demo --season --forecasts stations-demo/forecasts/forecast_passages.csv', 'With the season charts and the verification charts of the demo forecasts')
          .epilogue('The page needs no network connection: inline SVG and CSS, no scripts. Without --out it is written to report.html; --out - writes it to standard output.\n\n' + EPILOGUE),
      (a) => onSelect({ command: 'report', args: a as Record<string, unknown> }),
    )
    .command(
      'season <paths...>',
      'Summarise a season: passages by kind and month, hour of day (UTC and solar), distributions, front speeds and directions',
      (y) =>
        withDetectionOptions(withInputOptions(y))
          .option('since', { type: 'string', describe: 'First day or time counted, ISO 8601 (UTC unless an offset is given)', group: 'Season:' })
          .option('until', { type: 'string', describe: 'Last day counted (a date alone means the end of that day), or a time', group: 'Season:' })
          .option('format', { choices: ['table', 'csv', 'json'] as const, default: 'table', describe: 'Output format (CSV: scope, measure, bin, value)', group: 'Output:' })
          .example('$0 season stations-demo', 'The demo season as tables, network first')
          .example('$0 season obs/ --since 2025-12-01 --until 2026-02-28 --format csv --out winter.csv', 'One winter, long CSV')
          .epilogue(EPILOGUE),
      (a) => onSelect({ command: 'season', args: a as Record<string, unknown> }),
    )
    .command(
      'merge <paths...>',
      'Combine the outputs of fropa detect --shard K/N (all N shards) into what one run over the whole archive gives',
      (y) =>
        y
          .positional('paths', { type: 'string', array: true, describe: 'Shard outputs (NDJSON) of one run, every shard once', demandOption: true })
          .option('kinds', { type: 'string', describe: `Only these kinds, comma-separated: ${BOUNDARY_KINDS.join(', ')}`, group: 'Output:' })
          .option('format', { choices: ['table', 'csv', 'json', 'ndjson'] as const, default: 'table', describe: 'Output format', group: 'Output:' })
          .option('out', { type: 'string', describe: 'Write the output to FILE instead of standard output', group: 'Output:' })
          .option('out-dir', { type: 'string', describe: 'Write events.csv, events.json, fronts.csv, fronts.json and summary.txt into DIR', group: 'Output:' })
          .conflicts('out', 'out-dir')
          .example('$0 merge shard-*.ndjson --format csv --out events.csv', 'Passages of the whole archive, tracked on the merged passages')
          .example('$0 merge shards/ --out-dir fropa-out', 'Every shard file in a folder; the same bundle as fropa detect --out-dir')
          .epilogue(EPILOGUE),
      (a) => onSelect({ command: 'merge', args: a as Record<string, unknown> }),
    )
    .option('verbose', { type: 'boolean', describe: 'Show stack traces of failures', global: true })
    .option('quiet', { type: 'boolean', describe: 'No notes on standard error', global: true })
    .example('$0 inspect stations-demo', 'How each demo file was read')
    .example('$0 detect stations-demo', 'Passages found in the demo files')
    .example('$0 detect obs/KXYZ_2026-03.txt --format json', 'Passages as JSON')
    .example('$0 verify stations-demo --forecasts stations-demo/forecasts/forecast_passages.csv', 'Forecast passage times against the demo observations')
    .example('$0 report stations-demo --out report.html', 'A page of charts, fronts and maps to open in a browser')
    .demandCommand(1, 'Name a command: inspect, detect, verify, report, season or merge.')
    .recommendCommands()
    .strict()
    .exitProcess(false)
    .fail((msg, err) => {
      throw Object.assign(new UsageError(msg || err?.message || 'invalid arguments'), { fromParser: true });
    })
    .help()
    .alias('h', 'help')
    .version(version())
    .epilogue(EPILOGUE)
    .wrap(null);
}

/**
 * Run fropa with the given arguments (without `node` and the script); returns the exit code.
 * All output goes through `io`.
 */
export async function runCli(argv: readonly string[], io: CliIo): Promise<number> {
  const verbose = argv.includes('--verbose');
  try {
    let selected: Selected | null = null;
    const { output } = await new Promise<{ output: string }>((resolve, reject) => {
      try {
        // yargs drops a lone `-` from positionals; carry it through as a token that inputArgs turns back.
        const args = argv.map((a) => (a === '-' ? STDIN_TOKEN : a));
        parser((s) => (selected = s)).parse(args, {}, (err, _a, out) => (err ? reject(err) : resolve({ output: out })));
      } catch (e) {
        reject(e);
      }
    });
    if (output) io.stdout(output.endsWith('\n') ? output : output + '\n');
    if (!selected) return 0; // --help or --version
    const sel = selected as Selected;
    const mod =
      sel.command === 'inspect'
        ? await import('./commands/inspect.js')
        : sel.command === 'detect'
          ? await import('./commands/detect.js')
          : sel.command === 'verify'
            ? await import('./commands/verify.js')
            : sel.command === 'report'
              ? await import('./commands/report.js')
              : sel.command === 'merge'
                ? await import('./commands/merge.js')
                : await import('./commands/season.js');
    return await mod.run(sel.args, io);
  } catch (e) {
    const err = e instanceof Error ? e : new Error(String(e));
    const usage = err instanceof UsageError;
    io.stderr(`fropa: ${err.message.split(STDIN_TOKEN).join('-')}\n`);
    if ((err as { fromParser?: boolean }).fromParser) io.stderr('Run fropa --help (or fropa <command> --help) for usage.\n');
    if (verbose && err.stack) io.stderr(err.stack + '\n');
    if (verbose && err.cause instanceof Error && err.cause.stack) io.stderr('caused by: ' + err.cause.stack + '\n');
    return usage ? 2 : 1;
  }
}

/** Streams of this process. */
export function processIo(): CliIo {
  return {
    stdout: (t) => void process.stdout.write(t),
    stderr: (t) => void process.stderr.write(t),
    // Progress only on a terminal, never under CI (NO_COLOR is respected: the bar has no colours at all).
    ...(process.stderr.isTTY && !process.env.CI ? { progress: process.stderr } : {}),
    stdinFd: 0,
    readStdin: async () => {
      const chunks: Buffer[] = [];
      for await (const c of process.stdin) chunks.push(c as Buffer);
      return Buffer.concat(chunks).toString('utf8');
    },
  };
}
