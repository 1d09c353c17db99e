import { readdirSync, readFileSync } from 'node:fs';
import { join, relative, resolve, dirname, sep } from 'node:path';
import { fileURLToPath } from 'node:url';
import { describe, expect, it } from 'vitest';

/**
 * The layering rule of docs/architecture.md ("Layers"), checked on the source text:
 * only src/io/ and src/cli/ touch files, processes, threads or the environment, and nothing
 * outside src/cli/ imports from src/cli/. There are no exceptions. Common practice (a hand-made architecture check),
 * no outside source.
 */

const ROOT = resolve(dirname(fileURLToPath(import.meta.url)), '../..');
const SRC = join(ROOT, 'src');

/**
 * Node modules that reach the file system, other processes or threads, the environment, the
 * network or the engine's settings. Each is listed with and without the `node:` prefix.
 * Allowed everywhere: `node:path`, `node:url`, `node:crypto`, `node:stream`, `node:string_decoder`,
 * `node:buffer`, `node:readline` (a line splitter over a stream it is given: reaching the terminal
 * would need `process.stdin`, which the scan of `process` catches) and `node:module` (loading
 * installed packages and their data, as `import` does).
 */
const EFFECTFUL_MODULES = [
  'fs', 'fs/promises', 'child_process', 'worker_threads', 'os', 'process', 'cluster', 'net', 'http', 'https', 'http2', 'dgram', 'dns', 'dns/promises', 'tls', 'tty', 'v8', 'vm', 'inspector',
];
const EFFECTFUL = new Set(EFFECTFUL_MODULES.flatMap((name) => [name, `node:${name}`]));

/** Folders (under src/) whose files may use the modules above and `process`. */
const EFFECT_LAYERS = ['io', 'cli'];

function sourceFiles(dir: string): string[] {
  const files: string[] = [];
  for (const entry of readdirSync(dir, { withFileTypes: true })) {
    const path = join(dir, entry.name);
    if (entry.isDirectory()) files.push(...sourceFiles(path));
    else if (/\.(ts|mts|cts|js|mjs)$/.test(entry.name)) files.push(path);
  }
  return files.sort();
}

/** The text with comments blanked (string contents kept), so commented-out code does not count. */
export function withoutComments(text: string): string {
  let out = '';
  let i = 0;
  while (i < text.length) {
    const c = text[i]!;
    const next = text[i + 1];
    if (c === '/' && next === '/') {
      while (i < text.length && text[i] !== '\n') i++;
    } else if (c === '/' && next === '*') {
      const end = text.indexOf('*/', i + 2);
      const stop = end === -1 ? text.length : end + 2;
      out += text.slice(i, stop).replace(/[^\n]/g, ' ');
      i = stop;
    } else if (c === "'" || c === '"' || c === '`') {
      let j = i + 1;
      while (j < text.length && text[j] !== c) j += text[j] === '\\' ? 2 : 1;
      out += text.slice(i, j + 1);
      i = j + 1;
    } else {
      out += c;
      i++;
    }
  }
  return out;
}

/** Module specifiers of static imports, re-exports and dynamic imports in `text`. */
export function importSpecifiers(text: string): string[] {
  const code = withoutComments(text);
  const found: string[] = [];
  const patterns = [
    /\bimport\s+(?:type\s+)?[^'"`;]*?\bfrom\s*['"]([^'"]+)['"]/g,
    /\bimport\s*['"]([^'"]+)['"]/g,
    /\bexport\s+(?:type\s+)?(?:\*(?:\s+as\s+\w+)?|\{[^}]*\})\s*from\s*['"]([^'"]+)['"]/g,
    /\bimport\s*\(\s*['"`]([^'"`]+)['"`]\s*[,)]/g,
  ];
  for (const pattern of patterns) for (const m of code.matchAll(pattern)) found.push(m[1]!);
  return found;
}

/** The 1-based lines of `text` that use the global `process` (`process.env`, `process['cwd']` …), comments left out. */
export function processLines(text: string): number[] {
  const lines: number[] = [];
  withoutComments(text).split('\n').forEach((line, k) => {
    if (/(?<![\w.$])process\s*[.[]/.test(line)) lines.push(k + 1);
  });
  return lines;
}

interface Breach {
  file: string;
  problem: string;
}

function layerOf(file: string): string {
  return relative(SRC, file).split(sep)[0]!;
}

function breachesOf(file: string): Breach[] {
  const name = relative(SRC, file).split(sep).join('/');
  const text = readFileSync(file, 'utf8');
  const layer = layerOf(file);
  const breaches: Breach[] = [];
  for (const spec of importSpecifiers(text)) {
    if (!EFFECT_LAYERS.includes(layer) && EFFECTFUL.has(spec)) {
      breaches.push({ file: name, problem: `imports '${spec}' (only src/io/ and src/cli/ may)` });
    }
    if (layer !== 'cli' && spec.startsWith('.')) {
      const target = relative(SRC, resolve(dirname(file), spec)).split(sep);
      if (target[0] === 'cli') breaches.push({ file: name, problem: `imports '${spec}' from src/cli/ (nothing outside src/cli/ may)` });
    }
  }
  if (!EFFECT_LAYERS.includes(layer)) {
    for (const line of processLines(text)) breaches.push({ file: name, problem: `uses \`process\` on line ${line} (only src/io/ and src/cli/ may)` });
  }
  return breaches;
}

describe('layers', () => {
  it('the import scanner finds static, type-only, re-exported and dynamic imports and skips comments', () => {
    const text = [
      "import { a } from 'node:fs';",
      "import type { B } from '../cli/x.js';",
      "import 'side-effect';",
      "export { c } from './c.js';",
      "export * from 'node:os';",
      "const w = await import('node:worker_threads');",
      "// import { d } from 'node:child_process';",
      "/* import('node:v8') */",
      'import {\n  e,\n  f,\n} from "fs/promises";',
    ].join('\n');
    expect(importSpecifiers(text)).toEqual(expect.arrayContaining(['node:fs', '../cli/x.js', 'side-effect', './c.js', 'node:os', 'node:worker_threads', 'fs/promises']));
    expect(importSpecifiers(text)).not.toContain('node:child_process');
    expect(importSpecifiers(text)).not.toContain('node:v8');
  });

  it('the process scanner finds uses of the global process and skips comments and other names', () => {
    const text = ['const a = process.env.HOME;', '// process.exit(1)', 'const b = subprocess.pid + my.process.x;', "const c = process['cwd']();", '/* process.argv */ const d = 1;'].join('\n');
    expect(processLines(text)).toEqual([1, 4]);
  });

  it('only src/io/ and src/cli/ import effectful Node modules or use process, and nothing outside src/cli/ imports from it', () => {
    const breaches = sourceFiles(SRC).flatMap(breachesOf);
    expect(breaches.map((b) => `${b.file}: ${b.problem}`)).toEqual([]);
  });
});
