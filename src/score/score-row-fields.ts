import type { CompiledLexicon } from '../lexicon/compile-lexicon.js';
import { formatLocal, formatUtc } from '../ingest/parse-instant.js';
import { formatNumber } from '../report/format-number.js';
import type { ScoredEntry } from '../types.js';
import type { ScoreColumn } from './score-columns.js';

/**
 * The fields of a scores row as strings, in the order of the scores file's header
 * (scoresHeader, src/report/score-rows.ts): entry id, person, UTC time, zone, local time, word
 * count, then per lexicon its score columns and, for all but VADER, their `.n` columns and its
 * `.negated` column; then the text when `text` is given. Numbers with formatNumber (empty for no
 * score), times with formatUtc and formatLocal. `csvRow` of these fields is the line the scoring
 * path's byte writer (src/fast/score-row-filler.ts) writes, byte for byte (tested on the bench
 * corpus).
 */
export function scoreRowFields(entry: ScoredEntry, columns: readonly ScoreColumn[], lexicons: readonly CompiledLexicon[], text?: string): string[] {
  const fields = [entry.id, entry.person, formatUtc(entry.instant), entry.zone, formatLocal(entry.instant, entry.offsetMinutes), String(entry.nWords)];
  for (const lex of lexicons) {
    const own = columns.filter((c) => c.lexicon === lex.ref.name);
    for (const c of own) fields.push(formatNumber(entry.scores[c.name]));
    if (lex.scoring === 'vader') continue;
    for (const c of own) fields.push(String(entry.matched[c.name]));
    fields.push(String(entry.negated[lex.ref.name]));
  }
  if (text !== undefined) fields.push(text);
  return fields;
}
