import type { CompiledLexicon } from '../lexicon/compile-lexicon.js';
import type { RawEntry, ScoredEntry } from '../types.js';
import { scoreColumns, type ScoreColumn } from './score-columns.js';
import { scoreTexts, type BatchScores } from '../fast/score-texts.js';

/**
 * Turns text `i` of batch scores back into a ScoredEntry (NaN becomes undefined: no score).
 * `columns` is scoreColumns(lexicons) for the same lexicons.
 */
export function scoredEntryFrom(entry: RawEntry, batch: BatchScores, i: number, columns: readonly ScoreColumn[], lexicons: readonly CompiledLexicon[], keepText = false): ScoredEntry {
  const scores: Record<string, number | undefined> = {};
  const matched: Record<string, number> = {};
  const negated: Record<string, number> = {};
  const n = columns.length;
  for (let c = 0; c < n; c++) {
    const column = columns[c] as ScoreColumn;
    const v = batch.values[i * n + c] as number;
    scores[column.name] = Number.isNaN(v) ? undefined : v * (column.scale ?? 1);
    if (column.aggregation !== 'vader') matched[column.name] = batch.matched[i * n + c] as number;
  }
  for (let l = 0; l < lexicons.length; l++) {
    const lex = lexicons[l] as CompiledLexicon;
    if (lex.scoring !== 'vader') negated[lex.ref.name] = batch.negated[i * lexicons.length + l] as number;
  }
  const scored: ScoredEntry = {
    id: entry.id,
    person: entry.person,
    instant: entry.instant,
    zone: entry.zone,
    offsetMinutes: entry.offsetMinutes,
    nWords: batch.words[i] as number,
    scores,
    matched,
    negated,
    source: entry.source,
  };
  if (keepText) scored.text = entry.text;
  return scored;
}

/**
 * Scores one entry with every lexicon (see scoreTextInto for the score of each aggregation).
 * The entry's text is not kept unless `keepText`.
 */
export function scoreEntry(entry: RawEntry, lexicons: readonly CompiledLexicon[], keepText = false): ScoredEntry {
  const columns = scoreColumns(lexicons);
  return scoredEntryFrom(entry, scoreTexts([entry.text], lexicons, columns.length), 0, columns, lexicons, keepText);
}
