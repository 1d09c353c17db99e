import type { CompiledLexicon } from '../lexicon/compile-lexicon.js';
import { formatLocal, formatUtc } from '../ingest/parse-instant.js';
import type { ScoreColumn } from '../score/score-entry.js';
import type { ScoredEntry } from '../types.js';
import { csvRow } from './csv.js';
import { formatNumber } from './format-number.js';

/** Fixed leading columns of a scores file (docs/architecture.md). */
export const SCORE_ID_COLUMNS = ['entry_id', 'person', 'time_utc', 'zone', 'time_local', 'words'] as const;

/** The header of a scores file: id columns, then per lexicon its score, `.n` and `.negated` columns. */
export function scoresHeader(columns: readonly ScoreColumn[], lexicons: readonly CompiledLexicon[], keepText: boolean): string[] {
  const header: string[] = [...SCORE_ID_COLUMNS];
  for (const lex of lexicons) {
    const own = columns.filter((c) => c.lexicon === lex.ref.name);
    for (const c of own) header.push(c.name);
    if (lex.scoring !== 'vader') {
      for (const c of own) header.push(`${c.name}.n`);
      header.push(`${lex.ref.name}.negated`);
    }
  }
  if (keepText) header.push('text');
  return header;
}

/** One CSV line of a scores file for a scored entry, matching scoresHeader. */
export function scoreRow(entry: ScoredEntry, columns: readonly ScoreColumn[], lexicons: readonly CompiledLexicon[], keepText: boolean): string {
  const fields: string[] = [entry.id, entry.person, formatUtc(entry.instant), entry.zone, formatLocal(entry.instant, entry.offsetMinutes), String(entry.nWords)];
  for (const lex of lexicons) {
    const own = columns.filter((c) => c.lexicon === lex.ref.name);
    for (const c of own) fields.push(formatNumber(entry.scores[c.name]));
    if (lex.scoring !== 'vader') {
      for (const c of own) fields.push(String(entry.matched[c.name] ?? 0));
      fields.push(String(entry.negated[lex.ref.name] ?? 0));
    }
  }
  if (keepText) fields.push(entry.text ?? '');
  return csvRow(fields);
}
