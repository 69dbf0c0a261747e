/**
 * The import structure of src/ and cli/ (DEVELOPERS.md, "Layout"): no import cycles between files, no upward
 * imports between layers, and the CLI reaches the library only through its public entry src/index.ts.
 * Imports are read from the source text (static `import`/`export … from` and dynamic `import('…')`, type-only
 * imports included: a cycle through types is still a cycle in the design). Rules of this project (no source).
 */
import { test } from 'uvu';
import * as assert from 'uvu/assert';
import { readdirSync, readFileSync, statSync } from 'node:fs';
import { dirname, join, relative, resolve } from 'node:path';
import { fileURLToPath } from 'node:url';

const root = fileURLToPath(new URL('..', import.meta.url));

/**
 * Layers from the bottom up; a file may import its own layer or a lower one. `src/<folder>/…` is in layer
 * `<folder>`; `src/pipeline.ts` and `src/index.ts` are the top two.
 */
export const LAYERS = ['model', 'physics', 'signal', 'ingest', 'series', 'qc', 'detect', 'network', 'report', 'verify', 'season', 'parallel', 'pipeline', 'index'] as const;

type Graph = Map<string, string[]>;

/** Relative import specifiers of a TypeScript source text. */
export function importSpecifiers(text: string): string[] {
  const out: string[] = [];
  const code = text.replace(/\/\*[\s\S]*?\*\//g, '').replace(/^\s*\/\/.*$/gm, '');
  for (const m of code.matchAll(/^\s*(?:import|export)\s[^;]*?\bfrom\s+['"]([^'"]+)['"]/gm)) out.push(m[1]!);
  for (const m of code.matchAll(/^\s*import\s+['"]([^'"]+)['"]/gm)) out.push(m[1]!);
  for (const m of code.matchAll(/\bimport\(\s*['"]([^'"]+)['"]\s*\)/g)) out.push(m[1]!);
  return out.filter((s) => s.startsWith('.'));
}

function tsFiles(dir: string, out: string[] = []): string[] {
  for (const name of readdirSync(dir).sort()) {
    const p = join(dir, name);
    if (statSync(p).isDirectory()) tsFiles(p, out);
    else if (name.endsWith('.ts') && !name.endsWith('.d.ts')) out.push(p);
  }
  return out;
}

/** File → files it imports, as repository-relative paths with `.ts` (the `.js` of NodeNext specifiers mapped back). */
function importGraph(): Graph {
  const g: Graph = new Map();
  for (const f of [...tsFiles(join(root, 'src')), ...tsFiles(join(root, 'cli'))]) {
    const deps = importSpecifiers(readFileSync(f, 'utf8')).map((s) => relative(root, resolve(dirname(f), s.replace(/\.js$/, '.ts'))));
    g.set(relative(root, f).split('\\').join('/'), deps.map((d) => d.split('\\').join('/')));
  }
  return g;
}

/** The layer of a src/ file, or null when it is in no known layer. */
export function layerOf(file: string): string | null {
  const m = /^src\/(?:([^/]+)\/.*|([^/]+)\.ts)$/.exec(file);
  if (!m) return null;
  const name = m[1] ?? m[2]!;
  return (LAYERS as readonly string[]).includes(name) ? name : null;
}

/** Every import that breaks the layer order or the CLI rule, as `from -> to (why)`. */
export function layerViolations(g: Graph): string[] {
  const bad: string[] = [];
  const rank = (l: string) => (LAYERS as readonly string[]).indexOf(l);
  for (const [from, deps] of g) {
    for (const to of deps) {
      if (from.startsWith('cli/')) {
        if (to.startsWith('src/') && to !== 'src/index.ts') bad.push(`${from} -> ${to} (the CLI imports only src/index.ts)`);
        continue;
      }
      if (to.startsWith('cli/')) {
        bad.push(`${from} -> ${to} (the library never imports the CLI)`);
        continue;
      }
      const lf = layerOf(from);
      const lt = layerOf(to);
      if (lf === null) bad.push(`${from} (in no layer; add its folder to LAYERS)`);
      else if (lt === null) bad.push(`${from} -> ${to} (target in no layer)`);
      else if (rank(lt) > rank(lf)) bad.push(`${from} -> ${to} (upward: ${lf} imports ${lt})`);
    }
  }
  return [...new Set(bad)];
}

/** Import cycles between files: the strongly connected components with more than one file (Tarjan 1972), or a file importing itself. */
export function importCycles(g: Graph): string[][] {
  let next = 0;
  const index = new Map<string, number>();
  const low = new Map<string, number>();
  const stack: string[] = [];
  const onStack = new Set<string>();
  const cycles: string[][] = [];
  const visit = (v: string) => {
    index.set(v, next);
    low.set(v, next);
    next++;
    stack.push(v);
    onStack.add(v);
    for (const w of g.get(v) ?? []) {
      if (!g.has(w)) continue;
      if (!index.has(w)) {
        visit(w);
        low.set(v, Math.min(low.get(v)!, low.get(w)!));
      } else if (onStack.has(w)) low.set(v, Math.min(low.get(v)!, index.get(w)!));
    }
    if (low.get(v) === index.get(v)) {
      const c: string[] = [];
      let w: string;
      do {
        w = stack.pop()!;
        onStack.delete(w);
        c.push(w);
      } while (w !== v);
      if (c.length > 1 || (g.get(v) ?? []).includes(v)) cycles.push(c.sort());
    }
  };
  for (const v of g.keys()) if (!index.has(v)) visit(v);
  return cycles;
}

test('importSpecifiers() finds static, re-export, type-only and dynamic relative imports, not packages or comments', () => {
  const text = [
    "import { a } from './a.js';",
    "import type { B } from '../model/index.js';",
    "export { c } from './c.js';",
    "export * from './d.js';",
    "const m = await import('./e.js');",
    "import yargs from 'yargs';",
    "// import { x } from './commented.js';",
    'import {\n  f,\n  g,\n} from "./fg.js";',
  ].join('\n');
  assert.equal(importSpecifiers(text).sort(), ['../model/index.js', './a.js', './c.js', './d.js', './e.js', './fg.js']);
});

test('layerViolations() and importCycles() catch an upward import, a deep CLI import and a cycle (small graph)', () => {
  const g: Graph = new Map([
    ['src/ingest/readPaths.ts', ['src/qc/qc.ts', 'src/model/index.ts']],
    ['src/qc/qc.ts', ['src/model/index.ts']],
    ['src/model/index.ts', []],
    ['src/report/a.ts', ['src/report/b.ts']],
    ['src/report/b.ts', ['src/report/a.ts']],
    ['cli/run.ts', ['src/index.ts', 'src/report/a.ts', 'cli/options.ts']],
    ['cli/options.ts', []],
    ['src/index.ts', []],
  ]);
  assert.equal(layerViolations(g), [
    'src/ingest/readPaths.ts -> src/qc/qc.ts (upward: ingest imports qc)',
    'cli/run.ts -> src/report/a.ts (the CLI imports only src/index.ts)',
  ]);
  assert.equal(importCycles(g), [['src/report/a.ts', 'src/report/b.ts']]);
});

const graph = importGraph();

test('src/ and cli/: every file found and every import resolves to a file', () => {
  assert.ok(graph.size > 50, `${graph.size} files`);
  const missing = [...graph].flatMap(([f, deps]) => deps.filter((d) => !graph.has(d)).map((d) => `${f} -> ${d}`));
  assert.equal(missing, []);
});

test('no import cycles between files in src/ and cli/', () => {
  assert.equal(importCycles(graph), []);
});

test(`no upward imports (layers, bottom up: ${LAYERS.join(' < ')}); cli/ imports only src/index.ts; src/ never imports cli/`, () => {
  assert.equal(layerViolations(graph), []);
});

test.run();
