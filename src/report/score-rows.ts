import type { CompiledLexicon } from '../lexicon/compile-lexicon.js';
import { formatLocal, formatUtc } from '../ingest/parse-instant.js';
import type { ScoreColumn } from '../score/score-entry.js';
import type { ScoredEntry } from '../types.js';
import { csvField } from './csv.js';
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

/**
 * A row formatter for a scores file, matching scoresHeader: the column layout is worked out once,
 * so formatting a row touches only the entry's values.
 */
export function scoreRowWriter(columns: readonly ScoreColumn[], lexicons: readonly CompiledLexicon[], keepText: boolean): (entry: ScoredEntry) => string {
  const layout = lexicons.map((lex) => ({
    names: columns.filter((c) => c.lexicon === lex.ref.name).map((c) => c.name),
    rules: lex.scoring !== 'vader',
    lexicon: lex.ref.name,
  }));
  return (entry) => {
    // Numbers and RFC 3339 times never need quoting: only the id, person, zone and text go through csvField.
    let line = `${csvField(entry.id)},${csvField(entry.person)},${formatUtc(entry.instant)},${csvField(entry.zone)},${formatLocal(entry.instant, entry.offsetMinutes)},${entry.nWords}`;
    for (const { names, rules, lexicon } of layout) {
      for (const name of names) line += `,${formatNumber(entry.scores[name])}`;
      if (rules) {
        for (const name of names) line += `,${entry.matched[name] ?? 0}`;
        line += `,${entry.negated[lexicon] ?? 0}`;
      }
    }
    if (keepText) line += `,${csvField(entry.text ?? '')}`;
    return line;
  };
}

/** One CSV line of a scores file for a scored entry, matching scoresHeader. */
export function scoreRow(entry: ScoredEntry, columns: readonly ScoreColumn[], lexicons: readonly CompiledLexicon[], keepText: boolean): string {
  return scoreRowWriter(columns, lexicons, keepText)(entry);
}
