import type { CompiledLexicon } from '../lexicon/compile-lexicon.js';
import { tokenize, type Tokens } from '../text/tokenize.js';
import type { RawEntry, ScoredEntry } from '../types.js';
import { matchLexicon } from './match-lexicon.js';
import { scoreVader } from './vader.js';

/** The score columns of a lexicon, in output order, with the aggregation that produced them. */
export interface ScoreColumn {
  name: string;
  lexicon: string;
  category: string;
  aggregation: 'count' | 'rating' | 'sum' | 'vader';
}

/** VADER's four outputs, in the order of the published implementation's result. */
export const VADER_COLUMNS = ['compound', 'pos', 'neu', 'neg'] as const;

/** The score columns produced by a set of compiled lexicons (`<lexicon>.<category>`). */
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

/**
 * Scores one entry with every lexicon, each entry on its own (a saturating score such as
 * VADER's compound is never computed over concatenated text).
 *
 * Per category: `count` → 100 × (sum of weights of matched terms) / word tokens of the entry
 * (undefined when the entry has no word tokens); `rating` → mean weight of matched terms
 * (undefined when nothing matched); `sum` → sum of weights (0 when nothing matched, as for AFINN).
 * VADER columns are empty for a text with no VADER tokens. The text is tokenized once per
 * language. The entry's text is not kept unless `keepText`.
 */
export function scoreEntry(entry: RawEntry, lexicons: readonly CompiledLexicon[], keepText = false): ScoredEntry {
  const scores: Record<string, number | undefined> = {};
  const matched: Record<string, number> = {};
  const negated: Record<string, number> = {};
  const byLanguage = new Map<string, Tokens>();
  for (const lex of lexicons) {
    const name = lex.ref.name;
    if (lex.scoring === 'vader') {
      const v = scoreVader(entry.text, lex.valence);
      // A text with no VADER tokens has no score (the reference returns zeros; empty is not neutral).
      const has = v.tokens > 0;
      scores[`${name}.compound`] = has ? v.compound : undefined;
      scores[`${name}.pos`] = has ? v.pos : undefined;
      scores[`${name}.neu`] = has ? v.neu : undefined;
      scores[`${name}.neg`] = has ? v.neg : undefined;
      continue;
    }
    let tokens = byLanguage.get(lex.language);
    if (!tokens) {
      tokens = tokenize(entry.text, lex.language);
      byLanguage.set(lex.language, tokens);
    }
    const m = matchLexicon(tokens, lex);
    negated[name] = m.negated;
    for (let c = 0; c < lex.categories.length; c++) {
      const category = lex.categories[c] as { name: string; aggregation: string };
      const column = `${name}.${category.name}`;
      const sum = m.sums[c] as number;
      const count = m.counts[c] as number;
      matched[column] = count;
      if (category.aggregation === 'count') scores[column] = tokens.nWords > 0 ? (100 * sum) / tokens.nWords : undefined;
      else if (category.aggregation === 'rating') scores[column] = count > 0 ? sum / count : undefined;
      else scores[column] = sum;
    }
  }
  // Words are counted with the English tokenizer unless only other-language lexicons were used.
  const counted = byLanguage.get('en') ?? byLanguage.values().next().value ?? tokenize(entry.text, 'en');
  const nWords = counted.nWords;
  const scored: ScoredEntry = {
    id: entry.id,
    person: entry.person,
    instant: entry.instant,
    zone: entry.zone,
    offsetMinutes: entry.offsetMinutes,
    nWords,
    scores,
    matched,
    negated,
    source: entry.source,
  };
  if (keepText) scored.text = entry.text;
  return scored;
}
