import { plainNorms, readPlainPiece } from '../fast/read-piece.js';
import { isEnglish } from './is-english.js';
import { tokenize } from './tokenize.js';

/**
 * The normal forms of `term`'s tokens (tokenize(term, language).norm), without the memo when the
 * term is one plain English piece (see readPlainPiece: most terms of a word list). For building
 * a lexicon's tables, which tokenizes every term once (test/text/tokenize.test.ts checks it
 * equals tokenize on every bundled term).
 */
export function termNorms(term: string, language = 'en'): string[] {
  if (isEnglish(language)) {
    const plain = readPlainPiece(term);
    if (plain !== undefined) return plainNorms(plain);
  }
  return tokenize(term, language).norm;
}
