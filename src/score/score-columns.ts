import type { CompiledLexicon } from '../lexicon/compile-lexicon.js';

/** The score columns of a lexicon, in output order, with the aggregation that produced them. */
export interface ScoreColumn {
  name: string;
  lexicon: string;
  category: string;
  aggregation: 'count' | 'rating' | 'sum' | 'vader';
}

/** VADER's four outputs, in the order of the published implementation's result. */
export const VADER_COLUMNS = ['compound', 'pos', 'neu', 'neg'] as const;

/** The score columns produced by a set of compiled lexicons (`<lexicon>.<category>`), lexicon by lexicon. */
export function scoreColumns(lexicons: readonly CompiledLexicon[]): ScoreColumn[] {
  const columns: ScoreColumn[] = [];
  for (const lex of lexicons) {
    if (lex.scoring === 'vader') {
      for (const c of VADER_COLUMNS) columns.push({ name: `${lex.ref.name}.${c}`, lexicon: lex.ref.name, category: c, aggregation: 'vader' });
    } else {
      for (const c of lex.categories) columns.push({ name: `${lex.ref.name}.${c.name}`, lexicon: lex.ref.name, category: c.name, aggregation: c.aggregation });
    }
  }
  return columns;
}
