import type { RandomSource } from '../stats/random.js';
import { shuffle } from '../stats/shuffle.js';
import type { BinReducer } from '../series/bin-accumulator.js';

/** One scored entry of a bin, as a split needs it. */
export interface BinPiece {
  words: number;
  score: number;
}

/** The two half scores of one random split of a bin, and the words in each half. */
export interface BinHalves {
  a: number;
  b: number;
  wordsA: number;
  wordsB: number;
}

/** The series' value of a set of entries under `reducer` (see `reduceBin`); undefined when it has none. */
export function reducePieces(pieces: readonly BinPiece[], reducer: BinReducer): number | undefined {
  if (pieces.length === 0) return undefined;
  let sum = 0;
  let wsum = 0;
  let wtotal = 0;
  for (const p of pieces) {
    sum += p.score;
    wsum += p.words * p.score;
    wtotal += p.words;
  }
  if (reducer === 'sum') return sum;
  if (reducer === 'mean') return sum / pieces.length;
  return wtotal > 0 ? wsum / wtotal : undefined;
}

/**
 * One random split of a bin's entries into two halves of about equal length, each scored with the
 * series' own reducer. The entries are shuffled (Fisher–Yates, seeded); then, for the word-based
 * reducers (`weighted`, `sum`), each entry in turn goes to the half with fewer words so far, so the
 * halves' word counts differ by at most the longest entry; for `mean`, which weights entries
 * equally, entries alternate, so the halves' entry counts differ by at most one.
 * Undefined when a half would have no value (fewer than two entries, or no words in a half under
 * `weighted`).
 */
export function splitBin(pieces: readonly BinPiece[], reducer: BinReducer, source: RandomSource): BinHalves | undefined {
  if (pieces.length < 2) return undefined;
  const order = shuffle(pieces, source);
  const left: BinPiece[] = [];
  const right: BinPiece[] = [];
  let wordsA = 0;
  let wordsB = 0;
  order.forEach((p, i) => {
    const toLeft = reducer === 'mean' ? i % 2 === 0 : wordsA < wordsB || (wordsA === wordsB && left.length <= right.length);
    if (toLeft) {
      left.push(p);
      wordsA += p.words;
    } else {
      right.push(p);
      wordsB += p.words;
    }
  });
  const a = reducePieces(left, reducer);
  const b = reducePieces(right, reducer);
  return a === undefined || b === undefined || right.length === 0 ? undefined : { a, b, wordsA, wordsB };
}
