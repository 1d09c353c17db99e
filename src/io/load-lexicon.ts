import { readFile, readdir } from 'node:fs/promises';
import { basename, dirname, isAbsolute, join } from 'node:path';
import { fileURLToPath } from 'node:url';
import { usageError } from '../errors.js';
import { compileLexicon, type CompiledLexicon } from '../lexicon/compile-lexicon.js';
import type { Lexicon } from '../lexicon/lexicon-types.js';
import { parseLexicon } from '../lexicon/parse-lexicon.js';
import { applyLexiconOverrides } from '../terms/apply-lexicon-overrides.js';
import { parseLexiconOverrides } from '../terms/lexicon-overrides.js';
import { diagnosticText } from '../privacy/diagnostic-text.js';

/** Extension of lexicon files. */
export const LEXICON_EXTENSION = '.lex.tsv';

/** Extension of override files (changes to a base lexicon applied at load; see README.md, "Term lists"). */
export const OVERRIDES_EXTENSION = '.over.tsv';

/** The folder of bundled lexicons (lexicons/ at the package root). */
export function bundledLexiconDir(): string {
  return join(dirname(fileURLToPath(import.meta.url)), '..', '..', 'lexicons');
}

/** Names of the bundled lexicons, sorted. */
export async function bundledLexiconNames(): Promise<string[]> {
  const files = await readdir(bundledLexiconDir());
  return files.filter((f) => f.endsWith(LEXICON_EXTENSION)).map((f) => f.slice(0, -LEXICON_EXTENSION.length)).sort();
}

/**
 * Reads a lexicon by bundled name (`afinn-165`), by path (`my-list.lex.tsv`), or as an override
 * file (`my-changes.over.tsv`: its `## base` lexicon with the file's changes applied), validating it.
 * Throws a usage error that lists every problem with its line, or the bundled names when a
 * name is unknown.
 */
export async function readLexicon(nameOrPath: string): Promise<Lexicon> {
  if (nameOrPath.endsWith(OVERRIDES_EXTENSION)) return readOverriddenLexicon(nameOrPath, 0);
  const isPath = nameOrPath.includes('/') || nameOrPath.includes('\\') || nameOrPath.endsWith('.tsv');
  const path = isPath ? nameOrPath : join(bundledLexiconDir(), `${nameOrPath}${LEXICON_EXTENSION}`);
  let text: string;
  try {
    text = await readFile(path, 'utf8');
  } catch {
    if (isPath) throw usageError(`Cannot read lexicon \`${nameOrPath}\`: no such file; check the path.`);
    const names = await bundledLexiconNames();
    throw usageError(`Unknown lexicon \`${nameOrPath}\`; bundled lexicons are ${names.join(', ')}, or give the path of a ${LEXICON_EXTENSION} file.`);
  }
  const { lexicon, problems } = parseLexicon(text);
  if (!lexicon) {
    const shown = [...problems].sort((a, b) => a.line - b.line).slice(0, 20).map((p) => `  line ${p.line}: ${diagnosticText(p.message, 300)}`).join('\n');
    const more = problems.length > 20 ? `\n  … and ${problems.length - 20} more` : '';
    throw usageError(`Cannot use lexicon \`${basename(path)}\`: ${problems.length} problem${problems.length === 1 ? '' : 's'}; fix them and run again:\n${shown}${more}`);
  }
  return lexicon;
}

/**
 * Reads an override file, loads its `## base` (a bundled name, or a path relative to the override
 * file) and applies the changes. Throws a usage error listing every problem with its line.
 */
async function readOverriddenLexicon(path: string, depth: number): Promise<Lexicon> {
  let text: string;
  try {
    text = await readFile(path, 'utf8');
  } catch {
    throw usageError(`Cannot read override file \`${path}\`: no such file; check the path.`);
  }
  const fail = (problems: ReadonlyArray<{ line: number; message: string }>): never => {
    const shown = [...problems].sort((a, b) => a.line - b.line).slice(0, 20).map((p) => `  line ${p.line}: ${diagnosticText(p.message, 300)}`).join('\n');
    throw usageError(`Cannot use override file \`${basename(path)}\`: ${problems.length} problem${problems.length === 1 ? '' : 's'}; fix them and run again:\n${shown}`);
  };
  const { overrides, problems } = parseLexiconOverrides(text);
  if (!overrides) return fail(problems);
  const baseIsPath = overrides.base.includes('/') || overrides.base.includes('\\') || overrides.base.endsWith('.tsv');
  const base = baseIsPath && !isAbsolute(overrides.base) ? join(dirname(path), overrides.base) : overrides.base;
  if (base.endsWith(OVERRIDES_EXTENSION) && depth >= 4) throw usageError(`Cannot use override file \`${basename(path)}\`: override files name each other as base more than 4 deep; point \`## base\` at a lexicon.`);
  const baseLexicon = base.endsWith(OVERRIDES_EXTENSION) ? await readOverriddenLexicon(base, depth + 1) : await readLexicon(base);
  const applied = applyLexiconOverrides(baseLexicon, overrides);
  if (!applied.lexicon) return fail(applied.problems);
  return applied.lexicon;
}

/** Reads and compiles lexicons; throws when two share a name (their columns would collide). */
export async function loadLexicons(namesOrPaths: readonly string[]): Promise<CompiledLexicon[]> {
  const compiled: CompiledLexicon[] = [];
  for (const item of namesOrPaths) {
    const lex = compileLexicon(await readLexicon(item));
    if (compiled.some((c) => c.ref.name === lex.ref.name)) {
      throw usageError(`Two lexicons are named \`${lex.ref.name}\`; their score columns would collide. Give one a different \`## name\`.`);
    }
    compiled.push(lex);
  }
  return compiled;
}
