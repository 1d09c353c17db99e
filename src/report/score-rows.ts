import type { CompiledLexicon } from '../lexicon/compile-lexicon.js';
import { formatLocal, formatUtc } from '../ingest/parse-instant.js';
import type { ScoreColumn } from '../score/score-entry.js';
import type { BatchScores } from '../score/score-text.js';
import type { RawEntry } from '../types.js';
import { csvField } from './csv.js';
import { formatNumber, integerText } from './format-number.js';

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
 * so formatting a row reads the batch's typed arrays directly (no per-entry objects).
 * Row `i` of `batch` holds the scores of `entry`; `text` is written when the file keeps text.
 */
export function scoreRowWriter(columns: readonly ScoreColumn[], lexicons: readonly CompiledLexicon[], keepText: boolean): (entry: RawEntry, batch: BatchScores, i: number, text?: string) => string {
  const n = columns.length;
  const nl = lexicons.length;
  const indexOf = new Map(columns.map((c, k) => [c.name, k]));
  const layout = lexicons.map((lex, l) => ({
    columns: columns.filter((c) => c.lexicon === lex.ref.name).map((c) => indexOf.get(c.name) as number),
    rules: lex.scoring !== 'vader',
    lexicon: l,
  }));
  // The fields of one row, joined once (one string per row instead of one per field added).
  const fields: string[] = [];
  return (entry, batch, i, text) => {
    // Numbers and RFC 3339 times never need quoting: only the id, person, zone and text go through csvField.
    let f = 0;
    fields[f++] = csvField(entry.id);
    fields[f++] = csvField(entry.person);
    fields[f++] = formatUtc(entry.instant);
    fields[f++] = csvField(entry.zone);
    fields[f++] = formatLocal(entry.instant, entry.offsetMinutes);
    fields[f++] = integerText(batch.words[i] as number);
    const row = i * n;
    for (const { columns: own, rules, lexicon } of layout) {
      for (const c of own) fields[f++] = formatNumber(batch.values[row + c]);
      if (rules) {
        for (const c of own) fields[f++] = integerText(batch.matched[row + c] as number);
        fields[f++] = integerText(batch.negated[i * nl + lexicon] as number);
      }
    }
    if (keepText) fields[f++] = csvField(text ?? '');
    fields.length = f;
    return fields.join(',');
  };
}
