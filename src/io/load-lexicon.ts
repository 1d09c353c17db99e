import { readFile, readdir } from 'node:fs/promises';
import { basename, dirname, join } from 'node:path';
import { fileURLToPath } from 'node:url';
import { usageError } from '../errors.js';
import { compileLexicon, type CompiledLexicon } from '../lexicon/compile-lexicon.js';
import type { Lexicon } from '../lexicon/lexicon-types.js';
import { parseLexicon } from '../lexicon/parse-lexicon.js';

/** Extension of lexicon files. */
export const LEXICON_EXTENSION = '.lex.tsv';

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
 * Reads a lexicon by bundled name (`afinn-165`) or by path (`my-list.lex.tsv`), validating it.
 * Throws a usage error that lists every problem with its line, or the bundled names when a
 * name is unknown.
 */
export async function readLexicon(nameOrPath: string): Promise<Lexicon> {
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
    const shown = problems.slice(0, 20).map((p) => `  line ${p.line}: ${p.message}`).join('\n');
    const more = problems.length > 20 ? `\n  … and ${problems.length - 20} more` : '';
    throw usageError(`Cannot use lexicon \`${basename(path)}\`: ${problems.length} problem${problems.length === 1 ? '' : 's'}; fix them and run again:\n${shown}${more}`);
  }
  return lexicon;
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
