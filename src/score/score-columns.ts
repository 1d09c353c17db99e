import type { CompiledLexicon } from '../lexicon/compile-lexicon.js';

/** The score columns of a lexicon, in output order, with the aggregation that produced them. */
export interface ScoreColumn {
  name: string;
  lexicon: string;
  category: string;
  aggregation: 'count' | 'rating' | 'sum' | 'vader';
  /** For `count` categories: the rate's unit, which is also the end of the column name. */
  unit?: CountRate;
  /** Factor from the scorer's value (per 100 words for `count`) to the written one (1 otherwise). */
  scale?: number;
}

/** The rate of a `count` category: matched words per 100 words, per 1,000 words, or their proportion (0–1). */
export type CountRate = 'per100w' | 'per1000w' | 'prop';

/** The accepted rates of `count` categories, with their factor from a per-100-words value. */
export const COUNT_RATES: Readonly<Record<CountRate, number>> = { per100w: 1, per1000w: 10, prop: 0.01 };

/** VADER's four outputs, in the order of the published implementation's result. */
export const VADER_COLUMNS = ['compound', 'pos', 'neu', 'neg'] as const;

/**
 * The score columns produced by a set of compiled lexicons (`<lexicon>.<category>`), lexicon by
 * lexicon; a `count` category's name ends in its rate's unit (`<lexicon>.<category>_per100w`).
 */
export function scoreColumns(lexicons: readonly CompiledLexicon[], rate: CountRate = 'per100w'): ScoreColumn[] {
  const columns: ScoreColumn[] = [];
  for (const lex of lexicons) {
    if (lex.scoring === 'vader') {
      for (const c of VADER_COLUMNS) columns.push({ name: `${lex.ref.name}.${c}`, lexicon: lex.ref.name, category: c, aggregation: 'vader' });
    } else {
      for (const c of lex.categories) {
        if (c.aggregation === 'count') columns.push({ name: `${lex.ref.name}.${c.name}_${rate}`, lexicon: lex.ref.name, category: c.name, aggregation: c.aggregation, unit: rate, scale: COUNT_RATES[rate] });
        else columns.push({ name: `${lex.ref.name}.${c.name}`, lexicon: lex.ref.name, category: c.name, aggregation: c.aggregation });
      }
    }
  }
  return columns;
}
