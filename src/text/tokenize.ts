import { tokenizeEnglish } from '../fast/tokenize-english.js';
import { isEnglish } from './is-english.js';
import { tokenizeSegmenter } from './tokenize-segmenter.js';
import type { Tokens } from './tokens.js';

/**
 * Tokenizes `text` for a lexicon of `language` (BCP 47): wink-nlp for English (the tokens
 * tokenizeEnglishWhole defines, read through the memo of src/fast/tokenize-english.ts),
 * Intl.Segmenter otherwise.
 */
export function tokenize(text: string, language = 'en'): Tokens {
  return isEnglish(language) ? tokenizeEnglish(text) : tokenizeSegmenter(text, language);
}
