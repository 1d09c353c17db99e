import { TokenKind, type Tokens } from './tokens.js';
import type { WinkTokens } from './wink-tokens.js';

const graphemes = new Intl.Segmenter('en', { granularity: 'grapheme' });

function isSingleGrapheme(text: string): boolean {
  const it = graphemes.segment(text)[Symbol.iterator]();
  it.next();
  return it.next().done === true;
}

/** wink token types counted as words: word, number, ordinal, hashtag, mention, email, URL, time, date and currency. */
export const WORD_TYPES: ReadonlySet<string> = new Set(['word', 'number', 'ordinal', 'hashtag', 'mention', 'email', 'url', 'time', 'date', 'currency']);

/** Our kind of a wink token type. */
export function tokenKindOf(type: string): TokenKind {
  switch (type) {
    case 'word':
    case 'hashtag':
    case 'mention':
    case 'email':
    case 'url':
      return TokenKind.Word;
    case 'number':
    case 'ordinal':
    case 'time':
    case 'date':
    case 'currency':
      return TokenKind.Number;
    case 'punctuation':
      return TokenKind.Punct;
    case 'emoji':
      return TokenKind.Emoji;
    case 'emoticon':
      return TokenKind.Emoticon;
    default:
      return TokenKind.Other;
  }
}

/**
 * Appends wink tokens to `out` with our rules (see tokenizeEnglishWhole). `firstSpaced`
 * overrides whether the first token follows spaces (for a piece of a longer text).
 *
 * - Words keep their contraction pieces as separate tokens in their expanded form (`can't`,
 *   `cant` and `cannot` → `can`, `not`; `don't`/`dont` → `do`, `not`), but a piece attached to
 *   the one before it is not counted as a word of its own, so each contraction counts one word.
 * - Emoji stay whole as grapheme clusters: skin-tone modifiers, variation selectors, ZWJ
 *   sequences (👨‍👩‍👧) and flag pairs (🇧🇪) are joined back into one token.
 * - Words counted: see WORD_TYPES; punctuation, emoji, emoticons and symbols are not words.
 */
export function appendTokens(out: Tokens, wink: WinkTokens, firstSpaced: boolean): void {
  const { norm, raw, kind } = out;
  const { values, types, contraction } = wink;
  for (let i = 0; i < values.length; i++) {
    const value = values[i] as string;
    const type = types[i] as string;
    const attached = !(i === 0 ? firstSpaced : wink.spaced[i]);
    const last = raw.length - 1;
    if (attached && last >= 0 && (type === 'emoji' || type === 'unk') && (kind[last] === TokenKind.Emoji || kind[last] === TokenKind.Other)) {
      const joined = (raw[last] as string) + value;
      if (isSingleGrapheme(joined)) {
        raw[last] = joined;
        norm[last] = joined;
        kind[last] = TokenKind.Emoji;
        continue;
      }
    }
    let n = value.toLowerCase();
    // wink splits contractions written with or without an apostrophe (can't, cant, cannot, I'd've)
    // into flagged pieces; every piece after the first is attached to the one before it. (The
    // token before the first one of a space-separated piece is a line break or nothing: never
    // a contraction piece.)
    const isContraction = contraction[i] === true;
    const previousIsContraction = i === 0 ? false : contraction[i - 1] === true;
    const isPiece = attached && last >= 0 && (n.startsWith("'") || n.startsWith('’') || n === "n't" || n === 'n’t' || (isContraction && previousIsContraction));
    if (isPiece || isContraction) n = (wink.normals[i] as string).toLowerCase();
    raw.push(value);
    norm.push(n);
    kind.push(tokenKindOf(type));
    if (WORD_TYPES.has(type) && !isPiece) out.nWords++;
  }
}
