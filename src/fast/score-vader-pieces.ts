import { applyVaderRules } from '../score/apply-vader-rules.js';
import type { VaderLexicon, VaderScores } from '../score/vader-types.js';
import { vaderTokens } from '../score/vader-tokens.js';
import { vaderWord, type VaderWord } from '../score/vader-word.js';
import { pieceEnd } from './piece-end.js';
import { detached } from './piece-table.js';
import type { SerialCache } from './serial-cache.js';
import type { Piece } from './tokenize-english.js';

/** VADER's tokens of one piece of text: the VaderWord itself for one token (the usual case), else a list. */
export type PieceWords = VaderWord | VaderWord[];

function pieceWords(piece: string, lexicon: VaderLexicon): PieceWords {
  const list = vaderTokens(piece).map((w) => vaderWord(w, lexicon));
  return list.length === 1 ? (list[0] as VaderWord) : list;
}

/** Appends a piece's words to `words` from `n` on; returns the new count. */
function pushPieceWords(words: VaderWord[], n: number, piece: PieceWords): number {
  if (!Array.isArray(piece)) {
    words[n] = piece;
    return n + 1;
  }
  for (let k = 0; k < piece.length; k++) words[n++] = piece[k] as VaderWord;
  return n;
}

/**
 * scoreVader (src/score/score-vader.ts) for a text given as its memoised pieces (see
 * tokenizeEnglishPieces): VADER splits on every whitespace character, which includes every
 * separator of the pieces, so the VADER tokens of the text are those of its pieces in order (the
 * first `count` of `pieces`). Each piece keeps its VADER tokens for `lexicon` in its annotation
 * slot (the VaderWord itself for a piece of one token, the usual case; else a list), so a
 * recurring piece is split and looked up once. `words` is the caller's buffer for the text's
 * tokens (overwritten; reused from text to text by the batch scorer). Equal to scoreVader
 * (tested on the bench corpus, test/fast/fast-path-differential.test.ts).
 */
export function scoreVaderPieces(pieces: readonly Piece[], text: string, lexicon: VaderLexicon, count = pieces.length, words: VaderWord[] = []): VaderScores {
  let n = 0;
  for (let p = 0; p < count; p++) {
    const piece = pieces[p] as Piece;
    let annotation = piece.annotationKey === lexicon ? (piece.annotation as PieceWords) : undefined;
    if (annotation === undefined) {
      annotation = pieceWords(piece.text, lexicon);
      piece.annotationKey = lexicon;
      piece.annotation = annotation;
    }
    n = pushPieceWords(words, n, annotation);
  }
  return applyVaderRules(words, n, text);
}

/**
 * scoreVaderPieces for a text whose pieces another thread found (see Piece.serial): pieces
 * `from` … `from + count − 1` of `serials` and `starts` (their offsets in `text`). A piece's VADER
 * tokens are kept in `cache` by its serial, and worked out from the text when the cache lacks
 * them, so the scores equal scoreVader's whatever the cache holds (tested).
 */
export function scoreVaderSerials(text: string, serials: Int32Array, starts: Int32Array, from: number, count: number, lexicon: VaderLexicon, cache: SerialCache<PieceWords>, words: VaderWord[] = []): VaderScores {
  let n = 0;
  for (let k = from; k < from + count; k++) {
    const serial = serials[k] as number;
    let piece = cache.get(serial);
    if (piece === undefined) {
      const start = starts[k] as number;
      // A copy: words cut from the text itself would keep the whole text alive in the cache.
      piece = pieceWords(detached(text.slice(start, pieceEnd(text, start))), lexicon);
      cache.set(serial, piece);
    }
    n = pushPieceWords(words, n, piece);
  }
  return applyVaderRules(words, n, text);
}
