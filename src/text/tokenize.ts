import winkNLP from 'wink-nlp';
import model from 'wink-eng-lite-web-model';

/** Token kinds. Words are what `nWords` counts; punctuation stops negation windows. */
export const TokenKind = { Word: 0, Punct: 1, Emoji: 2, Emoticon: 3, Number: 4, Other: 5 } as const;
export type TokenKind = (typeof TokenKind)[keyof typeof TokenKind];

/**
 * Tokens of one text as parallel arrays (lean for the per-entry hot path).
 * `norm` is the matching form: lower-cased, with contraction pieces expanded (`n't` → `not`).
 */
export interface Tokens {
  norm: string[];
  /** The token as written (for VADER-style capitalisation checks and keyword-in-context). */
  raw: string[];
  kind: TokenKind[];
  /** Number of word tokens (see tokenize for what counts). */
  nWords: number;
}

type Nlp = ReturnType<typeof winkNLP>;
let english: Nlp | undefined;

/** The wink-nlp English tokenizer with an empty pipeline (tokenization only: no sentence, POS or NER steps). */
function englishNlp(): Nlp {
  english ??= winkNLP(model, []);
  return english;
}

const graphemes = new Intl.Segmenter('en', { granularity: 'grapheme' });

function isSingleGrapheme(text: string): boolean {
  const it = graphemes.segment(text)[Symbol.iterator]();
  it.next();
  return it.next().done === true;
}

const WORDISH = new Set(['word', 'number', 'ordinal', 'hashtag', 'mention', 'email', 'url', 'time', 'date', 'currency']);

function kindOf(type: string): TokenKind {
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
 * Tokenizes English text with wink-nlp (wink-eng-lite-web-model).
 *
 * - Words keep their contraction pieces as separate tokens in their expanded form (`can't`,
 *   `cant` and `cannot` → `can`, `not`; `don't`/`dont` → `do`, `not`), but a piece attached to
 *   the one before it is not counted as a word of its own, so each contraction counts one word.
 * - Emoji stay whole as grapheme clusters: skin-tone modifiers, variation selectors, ZWJ
 *   sequences (👨‍👩‍👧) and flag pairs (🇧🇪) are joined back into one token.
 * - Emoticons (`:)`, `:-(`, `<3`) are single tokens.
 * - Words counted: word, number, ordinal, hashtag, mention, email, URL, time, date and currency
 *   tokens; punctuation, emoji, emoticons and symbols are not words.
 */
export function tokenizeEnglish(text: string): Tokens {
  const nlp = englishNlp();
  const its = nlp.its;
  const tokens = nlp.readDoc(text).tokens();
  const values = tokens.out(its.value) as string[];
  const types = tokens.out(its.type) as string[];
  const spaces = tokens.out(its.precedingSpaces) as string[];
  const contraction = tokens.out(its.contractionFlag) as boolean[];
  const norm: string[] = [];
  const raw: string[] = [];
  const kind: TokenKind[] = [];
  let nWords = 0;
  let normals: string[] | undefined;
  for (let i = 0; i < values.length; i++) {
    const value = values[i] as string;
    const type = types[i] as string;
    const attached = spaces[i] === '';
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
    // into flagged pieces; every piece after the first is attached to the one before it.
    const isContraction = contraction[i] === true;
    const isPiece = attached && last >= 0 && (n.startsWith("'") || n.startsWith('’') || n === "n't" || n === 'n’t' || (isContraction && contraction[i - 1] === true));
    if (isPiece || isContraction) {
      normals ??= tokens.out(its.normal) as string[];
      n = (normals[i] as string).toLowerCase();
    }
    const k = kindOf(type);
    raw.push(value);
    norm.push(n);
    kind.push(k);
    if (WORDISH.has(type) && !isPiece) nWords++;
  }
  return { norm, raw, kind, nWords };
}

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

/** Tokenizes `text` for a lexicon of `language` (BCP 47): wink-nlp for English, Intl.Segmenter otherwise. */
export function tokenize(text: string, language = 'en'): Tokens {
  return language === 'en' || language.startsWith('en-') ? tokenizeEnglish(text) : tokenizeSegmenter(text, language);
}
