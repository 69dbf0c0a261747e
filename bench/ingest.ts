/**
 * `npm run bench:ingest`: METAR and CSV ingest throughput, each beside its reference measured in the same
 * run (line splitting, in memory and streaming, and metar-taf-parser for METAR; papaparse parse-only for CSV).
 * Optional argument: lines/rows (default 1,000,000).
 */
import { benchMetar } from './ingest-metar.js';
import { benchCsv } from './ingest-csv.js';

const n = Number(process.argv[2] ?? 1_000_000);
console.log('== METAR ==');
const m = await benchMetar(n);
console.log('\n== CSV ==');
const c = await benchCsv(n);
console.log('\n== summary ==');
console.log(
  `METAR decode to typed series / streaming line splitting (node:readline): ${m.ratioOursToStreamSplit.toFixed(2)} wall, ${m.cpu.ratioOursToStreamSplit.toFixed(2)} CPU (target >= 0.30); ` +
    `/ in-memory String.split: ${m.ratioOursToSplit.toFixed(2)} wall, ${m.cpu.ratioOursToSplit.toFixed(2)} CPU; ` +
    `/ metar-taf-parser: ${m.ratioOursToReference.toFixed(0)}x wall, ${m.cpu.ratioOursToReference.toFixed(0)}x CPU (target well over 50x)`,
);
console.log(
  `CSV file ingest to typed series / papaparse streaming step-mode parse-only: ${c.ratio.toFixed(2)} wall, ${c.cpu.ratio.toFixed(2)} CPU (target >= 0.70); ` +
    `through papaparse (quoted files): ${c.viaPapaparse.ratio.toFixed(2)} wall, ${c.viaPapaparse.cpuRatio.toFixed(2)} CPU`,
);
