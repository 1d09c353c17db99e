import { createHash } from 'node:crypto';
import type { Lexicon } from './lexicon-types.js';
import { serializeLexicon } from './serialize-lexicon.js';

/**
 * SHA-256 (hex) of a lexicon's content: its canonical serialization with terms sorted by
 * category then term. Two files that differ only in row order, blank lines or spacing share
 * a hash; any change of a term, weight, status, category or metadata changes it.
 */
export function lexiconHash(lexicon: Lexicon): string {
  const terms = [...lexicon.terms].sort((a, b) => (a.category < b.category ? -1 : a.category > b.category ? 1 : a.term < b.term ? -1 : a.term > b.term ? 1 : 0));
  return createHash('sha256').update(serializeLexicon({ ...lexicon, terms })).digest('hex');
}
