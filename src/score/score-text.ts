import type { CompiledLexicon } from '../lexicon/compile-lexicon.js';
import { isEnglish } from '../text/is-english.js';
import { tokenizeEnglishWhole } from '../text/tokenize-english-whole.js';
import { tokenizeSegmenter } from '../text/tokenize-segmenter.js';
import type { Tokens } from '../text/tokens.js';
import type { ScoredEntry } from '../types.js';
import { matchLexicon, type LexiconMatch } from './match-lexicon.js';
import { matchPlainWords } from './match-plain-words.js';
import { VADER_COLUMNS, type ScoreColumn } from './score-columns.js';
import { scoreVader } from './score-vader.js';

/** The scores of one text: the scoring fields of a ScoredEntry. */
export type TextScores = Pick<ScoredEntry, 'nWords' | 'scores' | 'matched' | 'negated'>;

/**
 * What a score means: the scores of one text with every lexicon, computed the plain way. This is
 * the reference the scoring path (src/fast/score-texts.ts: memoised tokens, token ids, typed
 * arrays, worker threads) is tested against on the bench corpus, row for row and byte for byte
 * (test/fast/fast-path-differential.test.ts). Each text is scored on its own (a saturating score
 * such as VADER's compound is never computed over concatenated text).
 *
 * - Tokens: English lexicons read the text with wink-nlp's `readDoc` in one pass
 *   (tokenizeEnglishWhole); other languages with Intl.Segmenter (tokenizeSegmenter).
 * - `nWords` (the `words` column) counts the English word tokens, unless every lexicon that
 *   reads tokens is of another language: then the first such language's words.
 * - A rules lexicon is matched on the tokens (matchLexicon: longest pattern first, negation
 *   within the lexicon's window). Per category: `count` → 100 × (sum of weights of matched terms)
 *   ÷ word tokens (none when the text has no words), times the rate's factor
 *   (ScoreColumn.scale: per 1,000 words, or a proportion); `rating` → mean weight of matched
 *   terms (none when nothing matched); `sum` → sum of weights (0 when nothing matched, as for
 *   AFINN). `.n`: matched terms; `negated`: negated hits.
 * - A `plain-words` lexicon is matched on the words as written (matchPlainWords), its `count`
 *   categories per those words; `negated` is 0.
 * - VADER: scoreVader on the text (its own whitespace tokens and rules); no scores when the text
 *   has no VADER tokens (the published implementation gives zeros, but empty is not neutral).
 */
export function scoreText(text: string, lexicons: readonly CompiledLexicon[], columns: readonly ScoreColumn[]): TextScores {
  const values: Array<number | undefined> = [];
  const matchedCounts: number[] = [];
  const negated: Record<string, number> = {};
  let english: Tokens | undefined;
  const byLanguage = new Map<string, Tokens>();
  const tokensFor = (language: string): Tokens => {
    if (isEnglish(language)) return (english ??= tokenizeEnglishWhole(text));
    let tokens = byLanguage.get(language);
    if (tokens === undefined) byLanguage.set(language, (tokens = tokenizeSegmenter(text, language)));
    return tokens;
  };
  /** Per category (c), the value of its aggregation from a match over `words` words. */
  const categoryValues = (lex: CompiledLexicon, m: LexiconMatch, words: number): void => {
    lex.categories.forEach((category, c) => {
      const sum = m.sums[c] as number;
      const count = m.counts[c] as number;
      if (category.aggregation === 'count') values.push(words > 0 ? (100 * sum) / words : undefined);
      else if (category.aggregation === 'rating') values.push(count > 0 ? sum / count : undefined);
      else values.push(sum);
      matchedCounts.push(count);
    });
  };
  for (const lex of lexicons) {
    if (lex.scoring === 'vader') {
      const v = scoreVader(text, lex.valence);
      const has = v.tokens > 0;
      for (const name of VADER_COLUMNS) {
        values.push(has ? v[name] : undefined);
        matchedCounts.push(0);
      }
      tokensFor('en');
    } else if (lex.scoring === 'plain-words') {
      const m: LexiconMatch = { sums: new Float64Array(lex.categories.length), counts: new Int32Array(lex.categories.length), negated: 0 };
      const words = matchPlainWords(text, lex, m);
      categoryValues(lex, m, words);
      negated[lex.ref.name] = 0;
    } else {
      const tokens = tokensFor(lex.language);
      const m = matchLexicon(tokens, lex);
      categoryValues(lex, m, tokens.nWords);
      negated[lex.ref.name] = m.negated;
    }
  }
  const counted = english ?? byLanguage.values().next().value ?? tokensFor('en');
  const scores: Record<string, number | undefined> = {};
  const matched: Record<string, number> = {};
  columns.forEach((column, c) => {
    const value = values[c];
    scores[column.name] = value === undefined ? undefined : value * (column.scale ?? 1);
    if (column.aggregation !== 'vader') matched[column.name] = matchedCounts[c] as number;
  });
  return { nWords: counted.nWords, scores, matched, negated };
}
