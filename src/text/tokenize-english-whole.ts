import { appendTokens } from './append-tokens.js';
import { readWink } from './read-wink.js';
import type { Tokens } from './tokens.js';

/**
 * Tokenizes English text with wink-nlp (wink-eng-lite-web-model) in one pass over the whole
 * text through its public `readDoc` (see readWink), with our rules (see appendTokens): the plain
 * definition of lexichron's English tokens. The scoring path reads the same tokens piece by piece
 * through a memo (tokenizeEnglish, src/fast/tokenize-english.ts), tested equal to this on every
 * test corpus and on the bench corpus, except where, in one pass, one piece's new words would
 * have changed how a later piece of the same text is split (each piece is read as by a freshly
 * loaded wink-nlp there).
 */
export function tokenizeEnglishWhole(text: string): Tokens {
  const out: Tokens = { norm: [], raw: [], kind: [], nWords: 0 };
  const wink = readWink(text);
  appendTokens(out, wink, wink.spaced[0] ?? false);
  return out;
}
