import type { CompiledLexicon } from '../lexicon/compile-lexicon.js';
import type { ScoreColumn } from '../score/score-columns.js';

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
