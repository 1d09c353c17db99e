import type { CompiledLexicon } from '../lexicon/compile-lexicon.js';
import { matchLexicon, type LexiconMatch } from '../score/match-lexicon.js';
import { matchPlainWords } from '../score/match-plain-words.js';
import { VADER_COLUMNS } from '../score/score-columns.js';
import { scoreVader } from '../score/score-vader.js';
import type { VaderLexicon, VaderScores } from '../score/vader-types.js';
import type { VaderWord } from '../score/vader-word.js';
import { isEnglish } from '../text/is-english.js';
import { tokenize } from '../text/tokenize.js';
import type { Tokens } from '../text/tokens.js';
import { scoreVaderPieces, scoreVaderSerials, type PieceWords } from './score-vader-pieces.js';
import { SerialCache } from './serial-cache.js';
import { pieceSerialEpoch, tokenizeEnglishInto, type Piece } from './tokenize-english.js';

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
  /**
   * For a batch scored without its VADER lexicons (part `rules`): the pieces of each text (see
   * Piece.serial), so that the thread that scores VADER need not find them again. Text i has
   * `counts[i]` pieces (−1: none were made, score VADER from the text), listed in order after
   * those of the texts before it: serial in `serials`, offset in the text in `starts`.
   */
  pieces?: { serials: Int32Array; starts: Int32Array; counts: Int32Array; epoch: number };
}

/**
 * Empty batch arrays for `n` texts, views of one ArrayBuffer (one allocation, and one buffer to
 * transfer between threads: see batchBuffers).
 */
export function createBatchScores(n: number, columns: number, lexicons: number): BatchScores {
  const buffer = new ArrayBuffer(8 * n * columns + 4 * (n * columns + n * lexicons + n));
  let at = 0;
  const values = new Float64Array(buffer, at, n * columns);
  at += 8 * n * columns;
  const matched = new Int32Array(buffer, at, n * columns);
  at += 4 * n * columns;
  const negated = new Int32Array(buffer, at, n * lexicons);
  at += 4 * n * lexicons;
  return { values, matched, negated, words: new Int32Array(buffer, at, n) };
}

/** The distinct ArrayBuffers under a batch's arrays: what a thread transfers when it sends the batch. */
export function batchBuffers(batch: BatchScores): ArrayBuffer[] {
  const buffers = new Set<ArrayBuffer>();
  for (const list of [batch.values, batch.matched, batch.negated, batch.words]) buffers.add(list.buffer as ArrayBuffer);
  if (batch.pieces) for (const list of [batch.pieces.serials, batch.pieces.starts, batch.pieces.counts]) buffers.add(list.buffer as ArrayBuffer);
  return [...buffers];
}

/**
 * What scoreTextInto reuses from text to text within one batch (its contents are copied out at
 * once): the English tokens (arrays never shortened, see tokenizeEnglishInto), the text's pieces
 * and their offsets, one match result per lexicon and VADER's token buffer. Made per batch by
 * scoreTexts, so no scoring state is shared between calls or kept at module level.
 */
export interface TextScratch {
  tokens: Tokens;
  pieces: Piece[];
  starts: number[];
  matches: LexiconMatch[];
  vaderWords: VaderWord[];
}

/** A TextScratch for these lexicons. */
export function createTextScratch(lexicons: readonly CompiledLexicon[]): TextScratch {
  return {
    tokens: { norm: [], raw: [], kind: [], nWords: 0, ids: [], generation: 0, size: 0, pieceCount: 0 },
    pieces: [],
    starts: [],
    matches: lexicons.map((lex) => ({ sums: new Float64Array(lex.categories.length), counts: new Int32Array(lex.categories.length), negated: 0 })),
    vaderWords: [],
  };
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
 * words; see scoreVaderInto for the rest), `all` every lexicon. Returns how many pieces the text
 * was split into by the English tokenizer (listed in the first entries of `pieces` and
 * `pieceStarts`), or −1 when it was not tokenized in English.
 */
export function scoreTextInto(text: string, lexicons: readonly CompiledLexicon[], out: BatchScores, i: number, columns: number, part: ScorePart = 'all', scratch: TextScratch = createTextScratch(lexicons)): number {
  const { pieces, starts: pieceStarts } = scratch;
  let byLanguage: Map<string, Tokens> | undefined;
  let english: Tokens | undefined;
  let c = i * columns;
  for (let l = 0; l < lexicons.length; l++) {
    const lex = lexicons[l] as CompiledLexicon;
    if (lex.scoring === 'vader') {
      // VADER splits the text its own way, but on whitespace only, so it can start from the
      // memoised pieces of the English tokens (see scoreVaderPieces).
      // Tokenized in part `rules` too: the pieces go to the thread that scores VADER, and the
      // words column counts English words whenever VADER is among the lexicons (see scoreText).
      english ??= tokenizeEnglishInto(scratch.tokens, text, pieces, pieceStarts);
      if (part === 'all') writeVader(out, c, scoreVaderPieces(pieces, text, lex.valence, english.pieceCount, scratch.vaderWords));
      c += VADER_COLUMNS.length;
      continue;
    }
    if (lex.scoring === 'plain-words') {
      const m = scratch.matches[l] as LexiconMatch;
      const words = matchPlainWords(text, lex, m);
      out.negated[i * lexicons.length + l] = 0;
      for (let k = 0; k < lex.categories.length; k++, c++) writeCategory(out, c, (lex.categories[k] as { aggregation: string }).aggregation, m.sums[k] as number, m.counts[k] as number, words);
      continue;
    }
    let tokens: Tokens;
    if (isEnglish(lex.language)) {
      tokens = english ??= tokenizeEnglishInto(scratch.tokens, text, pieces, pieceStarts);
    } else {
      byLanguage ??= new Map();
      let t = byLanguage.get(lex.language);
      if (!t) byLanguage.set(lex.language, (t = tokenize(text, lex.language)));
      tokens = t;
    }
    const m = matchLexicon(tokens, lex, undefined, scratch.matches[l]);
    out.negated[i * lexicons.length + l] = m.negated;
    for (let k = 0; k < lex.categories.length; k++, c++) writeCategory(out, c, (lex.categories[k] as { aggregation: string }).aggregation, m.sums[k] as number, m.counts[k] as number, tokens.nWords);
  }
  if (english === undefined && byLanguage === undefined) english = tokenizeEnglishInto(scratch.tokens, text, pieces, pieceStarts);
  const counted = english ?? (byLanguage?.values().next().value as Tokens);
  out.words[i] = counted.nWords;
  return english === undefined ? -1 : (english.pieceCount as number);
}

/** One category's value: `count` per 100 words, `rating` mean weight, `sum` the sum (see scoreTextInto). */
function writeCategory(out: BatchScores, c: number, aggregation: string, sum: number, count: number, words: number): void {
  out.matched[c] = count;
  if (aggregation === 'count') out.values[c] = words > 0 ? (100 * sum) / words : NaN;
  else if (aggregation === 'rating') out.values[c] = count > 0 ? sum / count : NaN;
  else out.values[c] = sum;
}

/** Which lexicons scoreTextInto scores: all, or all but VADER (`rules`). */
export type ScorePart = 'all' | 'rules';

/** VADER's four columns at `c` (NaN for a text without VADER tokens). */
function writeVader(out: BatchScores, c: number, v: VaderScores): void {
  const has = v.tokens > 0;
  out.values[c] = has ? v.compound : NaN;
  out.values[c + 1] = has ? v.pos : NaN;
  out.values[c + 2] = has ? v.neu : NaN;
  out.values[c + 3] = has ? v.neg : NaN;
}

/**
 * Scores a batch of texts (see scoreTextInto for `part`). Scored by part `rules` with VADER
 * lexicons among `lexicons`, the batch also lists the pieces of its texts (BatchScores.pieces),
 * for scoreVaderInto.
 */
export function scoreTexts(texts: readonly string[], lexicons: readonly CompiledLexicon[], columns: number, part: ScorePart = 'all'): BatchScores {
  const out = createBatchScores(texts.length, columns, lexicons.length);
  const scratch = createTextScratch(lexicons);
  if (part !== 'rules' || !lexicons.some((l) => l.scoring === 'vader')) {
    for (let i = 0; i < texts.length; i++) scoreTextInto(texts[i] as string, lexicons, out, i, columns, part, scratch);
    return out;
  }
  const counts = new Int32Array(texts.length);
  const serials: number[] = [];
  const starts: number[] = [];
  for (let i = 0; i < texts.length; i++) {
    const count = scoreTextInto(texts[i] as string, lexicons, out, i, columns, part, scratch);
    counts[i] = count;
    for (let k = 0; k < count; k++) {
      serials.push((scratch.pieces[k] as Piece).serial);
      starts.push(scratch.starts[k] as number);
    }
  }
  const n = serials.length;
  const listed = new Int32Array(2 * n);
  listed.set(serials);
  listed.set(starts, n);
  out.pieces = { serials: listed.subarray(0, n), starts: listed.subarray(n), counts, epoch: pieceSerialEpoch() };
  return out;
}

/** Per VADER lexicon, the VADER tokens of the pieces one scoring thread has sent, by serial (see scoreVaderInto). */
export type PieceWordCaches = Map<VaderLexicon, SerialCache<PieceWords>>;

/**
 * Fills the VADER columns of a batch that was scored by part `rules` (in another thread): from
 * the pieces the batch lists, kept in `caches` by serial, or from the text itself where it lists
 * none. The scores equal those of part `all` (tested).
 */
export function scoreVaderInto(batch: BatchScores, texts: readonly string[], lexicons: readonly CompiledLexicon[], columns: number, caches: PieceWordCaches): void {
  const pieceList = batch.pieces;
  // Per lexicon: its VADER cache for this batch's serials, or undefined for a rules lexicon.
  const vaderCaches = lexicons.map((lex) => {
    if (lex.scoring !== 'vader' || !pieceList) return undefined;
    let cache = caches.get(lex.valence);
    if (cache === undefined) caches.set(lex.valence, (cache = new SerialCache<PieceWords>()));
    cache.useEpoch(pieceList.epoch);
    return cache;
  });
  const words: VaderWord[] = [];
  let first = 0;
  for (let i = 0; i < texts.length; i++) {
    const text = texts[i] as string;
    const count = pieceList ? (pieceList.counts[i] as number) : -1;
    let c = i * columns;
    for (let l = 0; l < lexicons.length; l++) {
      const lex = lexicons[l] as CompiledLexicon;
      if (lex.scoring !== 'vader') {
        c += lex.categories.length;
        continue;
      }
      const cache = vaderCaches[l];
      if (count < 0 || !pieceList || !cache) writeVader(batch, c, scoreVader(text, lex.valence));
      else writeVader(batch, c, scoreVaderSerials(text, pieceList.serials, pieceList.starts, first, count, lex.valence, cache, words));
      c += VADER_COLUMNS.length;
    }
    if (count > 0) first += count;
  }
}
