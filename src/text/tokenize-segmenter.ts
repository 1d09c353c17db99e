import { TokenKind, type Tokens } from './tokens.js';

/** Word segmenters by language (built once each: a cache, never read for output). */
const segmenters = new Map<string, Intl.Segmenter>();
const PUNCT = /^[\p{P}]+$/u;
const EMOJI = /\p{Extended_Pictographic}|\p{Regional_Indicator}/u;
const NUMBER = /^\p{N}[\p{N}.,:]*$/u;

/**
 * Tokenizes text in any language with Intl.Segmenter (word granularity, ICU rules built into
 * Node), which also splits languages written without spaces (Japanese, Chinese, Thai) into words.
 * Word-like segments are lower-cased with the language's rules and counted as words.
 */
export function tokenizeSegmenter(text: string, language: string): Tokens {
  let segmenter = segmenters.get(language);
  if (!segmenter) {
    segmenter = new Intl.Segmenter(language, { granularity: 'word' });
    segmenters.set(language, segmenter);
  }
  const norm: string[] = [];
  const raw: string[] = [];
  const kind: TokenKind[] = [];
  let nWords = 0;
  for (const part of segmenter.segment(text)) {
    const value = part.segment;
    if (/^\s+$/u.test(value)) continue;
    let k: TokenKind;
    if (part.isWordLike) k = NUMBER.test(value) ? TokenKind.Number : TokenKind.Word;
    else if (EMOJI.test(value)) k = TokenKind.Emoji;
    else if (PUNCT.test(value)) k = TokenKind.Punct;
    else k = TokenKind.Other;
    raw.push(value);
    norm.push(value.toLocaleLowerCase(language));
    kind.push(k);
    if (part.isWordLike) nWords++;
  }
  return { norm, raw, kind, nWords };
}
