import { basename } from 'node:path';
import { usageError } from '../errors.js';
import { readRecords, type TableFormat } from '../ingest/read-records.js';
import { serializeLexicon } from '../lexicon/serialize-lexicon.js';
import type { Lexicon, LexiconProblem } from '../lexicon/lexicon-types.js';
import { normsToLexicon, type NormsRecord, type NormsToLexiconOptions } from '../terms/norms-to-lexicon.js';
import type { Diagnostic } from '../types.js';
import { writeFileAtomic } from './atomic-write.js';
import { tableFile } from './table-file.js';

/** Options of {@link runTermsFromNorms} (`lexichron terms from-norms`). */
export interface RunTermsFromNormsOptions extends NormsToLexiconOptions {
  /** The norms table: CSV, TSV, JSON Lines or JSON, one row per word. */
  file: string;
  format?: TableFormat;
  delimiter?: string;
  /** The lexicon file to write (.lex.tsv). */
  out: string;
}

/** What {@link runTermsFromNorms} wrote (no lexicon when there were problems), and the rows it left out or questioned. */
export interface RunTermsFromNormsResult {
  lexicon?: Lexicon;
  /** Rows left out or questioned (the lexicon is written without them). */
  diagnostics: Diagnostic[];
  /** Problems that stop the lexicon from being made (nothing is written). */
  problems: LexiconProblem[];
}

/**
 * Converts a table of word norms into a lexicon with one rating category per rating column
 * (`normsToLexicon`) and writes it, unless there are problems (returned, nothing written). Throws
 * (exit 2) when a named column is missing.
 */
export async function runTermsFromNorms(options: RunTermsFromNormsOptions): Promise<RunTermsFromNormsResult> {
  const { file, format, delimiter, out, ...norms } = options;
  const records: NormsRecord[] = [];
  const rejects: Diagnostic[] = [];
  for await (const item of readRecords(tableFile(file), { format: format as never, delimiter })) {
    if (item.kind === 'header') {
      const missing = [norms.word, ...norms.ratings.map((r) => r.column)].filter((c) => item.columns.length > 0 && !item.columns.includes(c));
      if (missing.length) throw usageError(`Cannot read \`${basename(file)}\`: no column ${missing.map((m) => `\`${m}\``).join(', ')}; the header has ${item.columns.map((c) => `\`${c}\``).join(', ')}. Fix --word / --rating.`);
    } else if (item.kind === 'reject') rejects.push(item.diagnostic);
    else records.push({ record: item.record, source: item.source });
  }
  const result = normsToLexicon(records, norms);
  const diagnostics = [...rejects, ...result.diagnostics];
  if (result.lexicon) await writeFileAtomic(out, serializeLexicon(result.lexicon));
  return { ...(result.lexicon ? { lexicon: result.lexicon } : {}), diagnostics, problems: result.problems };
}
