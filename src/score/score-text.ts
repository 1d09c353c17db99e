import type { CompiledLexicon } from '../lexicon/compile-lexicon.js';
import { tokenize, tokenizeEnglishShared, type Piece, type Tokens } from '../text/tokenize.js';
import { matchLexicon, type LexiconMatch } from './match-lexicon.js';
import { scoreColumns, VADER_COLUMNS } from './score-columns.js';
import { scoreVader, scoreVaderPieces, type VaderScores } from './vader.js';

/**
 * Scores of a batch of texts as flat typed arrays (row-major), the form the scoring workers send
 * back. For `columns` score columns (scoreColumns order) and `lexicons` lexicons:
 * `values[i·columns + c]` (NaN = no score), `matched[i·columns + c]` (0 for VADER columns),
 * `negated[i·lexicons + l]`, `words[i]`.
 */
export interface BatchScores {
  values: Float64Array;
  matched: Int32Array;
  negated: Int32Array;
  words: Int32Array;
}

/** Empty batch arrays for `n` texts. */
export function createBatchScores(n: number, columns: number, lexicons: number): BatchScores {
  return { values: new Float64Array(n * columns), matched: new Int32Array(n * columns), negated: new Int32Array(n * lexicons), words: new Int32Array(n) };
}

/**
 * Scores text `i` of a batch into `out`, each text on its own (a saturating score such as VADER's
 * compound is never computed over concatenated text).
 *
 * Per category: `count` → 100 × (sum of weights of matched terms) / word tokens of the text
 * (NaN when it has no word tokens); `rating` → mean weight of matched terms (NaN when nothing
 * matched); `sum` → sum of weights (0 when nothing matched, as for AFINN). VADER columns are NaN
 * for a text with no VADER tokens (the reference returns zeros, but empty is not neutral).
 * The text is tokenized once per language; words are counted with the English tokenizer unless
 * only other-language lexicons are used.
 *
 * `part` splits the work between threads: `rules` scores every lexicon but VADER (and counts
 * words), `vader` only the VADER lexicons (from the text itself: no tokenizing), `all` both.
 */
export function scoreTextInto(text: string, lexicons: readonly CompiledLexicon[], out: BatchScores, i: number, columns: number, part: ScorePart = 'all'): void {
  let byLanguage: Map<string, Tokens> | undefined;
  let english: Tokens | undefined;
  let c = i * columns;
  for (let l = 0; l < lexicons.length; l++) {
    const lex = lexicons[l] as CompiledLexicon;
    if (lex.scoring === 'vader') {
      // VADER splits the text its own way, but on whitespace only, so it can start from the
      // memoised pieces of the English tokens (see scoreVaderPieces).
      if (part === 'all') {
        english ??= tokenizeEnglishShared(text, pieces);
        writeVader(out, c, scoreVaderPieces(pieces, text, lex.valence));
      } else if (part === 'vader') {
        writeVader(out, c, scoreVader(text, lex.valence));
      }
      c += VADER_COLUMNS.length;
      continue;
    }
    if (part === 'vader') {
      c += lex.categories.length;
      continue;
    }
    let tokens: Tokens;
    if (isEnglish(lex.language)) {
      tokens = english ??= tokenizeEnglishShared(text, pieces);
    } else {
      byLanguage ??= new Map();
      let t = byLanguage.get(lex.language);
      if (!t) byLanguage.set(lex.language, (t = tokenize(text, lex.language)));
      tokens = t;
    }
    const m = matchLexicon(tokens, lex, undefined, scratchFor(lex));
    out.negated[i * lexicons.length + l] = m.negated;
    for (let k = 0; k < lex.categories.length; k++, c++) {
      const aggregation = (lex.categories[k] as { aggregation: string }).aggregation;
      const sum = m.sums[k] as number;
      const count = m.counts[k] as number;
      out.matched[c] = count;
      if (aggregation === 'count') out.values[c] = tokens.nWords > 0 ? (100 * sum) / tokens.nWords : NaN;
      else if (aggregation === 'rating') out.values[c] = count > 0 ? sum / count : NaN;
      else out.values[c] = sum;
    }
  }
  if (part === 'vader') return;
  const counted = english ?? (byLanguage ? (byLanguage.values().next().value as Tokens) : tokenizeEnglishShared(text, pieces));
  out.words[i] = counted.nWords;
}

function isEnglish(language: string): boolean {
  return language === 'en' || language.startsWith('en-');
}

/** Per lexicon, the match result scoreTextInto reuses from text to text (its values are copied out at once). */
const scratchMatches = new WeakMap<CompiledLexicon, LexiconMatch>();

function scratchFor(lexicon: CompiledLexicon): LexiconMatch {
  let m = scratchMatches.get(lexicon);
  if (m === undefined) {
    const n = lexicon.categories.length;
    m = { sums: new Float64Array(n), counts: new Int32Array(n), negated: 0 };
    scratchMatches.set(lexicon, m);
  }
  return m;
}

/** The memoised pieces of the text being scored (scoring is synchronous). */
const pieces: Piece[] = [];

/** Which lexicons scoreTextInto scores: all, all but VADER (`rules`), or only VADER. */
export type ScorePart = 'all' | 'rules' | 'vader';

/** VADER's four columns at `c` (NaN for a text without VADER tokens). */
function writeVader(out: BatchScores, c: number, v: VaderScores): void {
  const has = v.tokens > 0;
  out.values[c] = has ? v.compound : NaN;
  out.values[c + 1] = has ? v.pos : NaN;
  out.values[c + 2] = has ? v.neu : NaN;
  out.values[c + 3] = has ? v.neg : NaN;
}

/** Scores a batch of texts (see scoreTextInto for `part`). */
export function scoreTexts(texts: readonly string[], lexicons: readonly CompiledLexicon[], columns: number, part: ScorePart = 'all'): BatchScores {
  const out = createBatchScores(texts.length, columns, lexicons.length);
  for (let i = 0; i < texts.length; i++) scoreTextInto(texts[i] as string, lexicons, out, i, columns, part);
  return out;
}

/** Copies the VADER columns of `from` into `into` (batches of the same texts, scored by parts). */
export function mergeVaderColumns(into: BatchScores, from: BatchScores, lexicons: readonly CompiledLexicon[]): void {
  const columns = scoreColumns(lexicons);
  const vader = columns.flatMap((column, k) => (column.aggregation === 'vader' ? [k] : []));
  for (let row = 0; row < into.words.length * columns.length; row += columns.length) {
    for (const k of vader) into.values[row + k] = from.values[row + k] as number;
  }
}
