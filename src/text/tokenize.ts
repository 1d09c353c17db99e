import { createRequire } from 'node:module';
import type winkNLP from 'wink-nlp';
import type model from 'wink-eng-lite-web-model';
import { GenerationalTable, HASH_START, hashStep } from './piece-table.js';
import { loadCoreModel } from './wink-model.js';
import { readPiece, readPlainPiece, type PlainPiece, type WinkTokens } from './wink-pieces.js';

export { loadCoreModel } from './wink-model.js';

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
  /**
   * English tokens only: per token a small integer standing for its `norm` (equal norms, equal
   * ids), valid while tokenGeneration() returns `generation`. Lets matchers keep per-word
   * answers in arrays instead of looking each token up by its text.
   */
  ids?: number[];
  generation?: number;
  /**
   * The number of tokens when the arrays are reused from text to text and may be longer (see
   * tokenizeEnglishShared); otherwise undefined and the arrays hold exactly the tokens.
   */
  size?: number;
  /** With tokenizeEnglishShared's piece lists: how many of their entries belong to this text. */
  pieceCount?: number;
}

type Nlp = ReturnType<typeof winkNLP>;
type WinkModel = typeof model;

/**
 * wink-nlp remembers every new word it meets (in its lexeme table), and a remembered word can
 * change how a later text is split: in one process the first `don’twell...` gives
 * `don’twell . ..` and every later one `don’twell ...`; `'em` is split as `' em` until some
 * text has made `'em` a token. Tokens would then depend on the texts read before (their order,
 * and how they were shared between worker threads). So every piece of text is tokenized as by a
 * freshly loaded wink-nlp: scoring reads pieces through wink's tokenizer with new words kept
 * apart from its lexeme table (see readPiece), and the whole-text reference here, through
 * wink's public `readDoc`, takes the words wink added out of the table's index again right after
 * (they stay in its list, whose positions wink relies on; the instance is replaced when the list
 * holds WINK_RENEW words beyond the model's own). Only the reference loads wink-nlp's full
 * pipeline and the model package (sentence, part-of-speech and entity models).
 */
interface IsolatedWink {
  nlp: Nlp;
  /** The lexeme index (text → position in `lexemes`) that wink looks words up in. */
  index: Record<string, number>;
  /** Words the model had before any text was read. */
  intrinsic: number;
  /** The lexeme list, to see how far it has grown. */
  lexemes: unknown[];
}

const WINK_RENEW = 100_000;
let english: IsolatedWink | undefined;

const requireLazily = createRequire(import.meta.url);

function loadIsolatedWink(): IsolatedWink {
  const winkNLPLoader = requireLazily('wink-nlp') as typeof winkNLP;
  const model = requireLazily('wink-eng-lite-web-model') as WinkModel;
  const state: Partial<IsolatedWink> = {};
  const wrapped: WinkModel = {
    ...model,
    core: () => {
      const core = loadCoreModel();
      const lexeme = core.features.lexeme;
      state.intrinsic = lexeme.intrinsicSize;
      state.lexemes = lexeme.list;
      state.index = lexeme.hash;
      return core;
    },
  } as WinkModel;
  state.nlp = winkNLPLoader(wrapped, []);
  return state as IsolatedWink;
}

/** The wink-nlp English tokenizer with an empty pipeline (tokenization only: no sentence, POS or NER steps). */
function englishNlp(): IsolatedWink {
  if (english === undefined || english.lexemes.length - english.intrinsic > WINK_RENEW) english = loadIsolatedWink();
  return english;
}

/** Takes the words wink added since its list had `from` entries out of its index (see IsolatedWink). */
function forgetAdded(wink: IsolatedWink, from: number): void {
  const { lexemes, index } = wink;
  for (let k = from; k < lexemes.length; k++) {
    const word = lexemes[k] as string;
    if (index[word] === k) delete index[word];
  }
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

/** wink's tokens of `text` as read by a freshly loaded wink-nlp (see IsolatedWink), through its public `readDoc`. */
function readWink(text: string): WinkTokens {
  const wink = englishNlp();
  const { nlp } = wink;
  const its = nlp.its;
  const before = wink.lexemes.length;
  const tokens = nlp.readDoc(text).tokens();
  const spaces = tokens.out(its.precedingSpaces) as string[];
  const result = {
    values: tokens.out(its.value) as string[],
    types: tokens.out(its.type) as string[],
    contraction: tokens.out(its.contractionFlag) as boolean[],
    normals: tokens.out(its.normal) as string[],
    spaced: spaces.map((s) => s !== ''),
  };
  if (wink.lexemes.length > before) forgetAdded(wink, before);
  return result;
}

/**
 * Appends wink tokens to `out` with our rules (see tokenizeEnglish). `firstSpaced` overrides
 * whether the first token follows spaces (for a piece of a longer text).
 */
function appendTokens(out: Tokens, wink: WinkTokens, firstSpaced: boolean): void {
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
    const k = kindOf(type);
    raw.push(value);
    norm.push(n);
    kind.push(k);
    if (WORDISH.has(type) && !isPiece) out.nWords++;
  }
}

/**
 * wink-nlp splits a text on runs of spaces and on runs of tabs and line breaks (its splitter
 * `([ \u00a0\u2002-\u2005\u2009\u200a\u202f\u205f]+|[\n\r\t]+)`), then tokenizes each piece on
 * its own: the output for a piece depends only on the piece. Runs of spaces become the next
 * token's preceding spaces; runs of tabs and line breaks are tokens. These are the splitter's two
 * classes (test/text/tokenize-memo.test.ts checks the memoised path equals one wink pass over
 * whole texts, every space character included).
 */
function isSpaceChar(c: number): boolean {
  return c === 0x20 || (c >= 0xa0 && (c === 0xa0 || (c >= 0x2002 && c <= 0x2005) || c === 0x2009 || c === 0x200a || c === 0x202f || c === 0x205f));
}

function isBreakChar(c: number): boolean {
  return c === 0x0a || c === 0x0d || c === 0x09;
}

/** Where the piece of `text` that starts at `start` ends (see tokenizeEnglishInto): at the next separator, or after a run of tabs and line breaks. */
export function pieceEnd(text: string, start: number): number {
  const n = text.length;
  let k = start;
  if (k < n && isBreakChar(text.charCodeAt(k))) {
    while (k < n && isBreakChar(text.charCodeAt(k))) k++;
    return k;
  }
  while (k < n && !isSpaceChar(text.charCodeAt(k)) && !isBreakChar(text.charCodeAt(k))) k++;
  return k;
}

/**
 * Our tokens of a piece in one reading, laid out for the loop that copies them into a text's
 * tokens: a piece of one token (most pieces) holds it in its own fields, so copying it reads one
 * object; longer pieces hold arrays.
 */
export interface PieceReading {
  count: number;
  nWords: number;
  /** The token when count is 1 (else unused). */
  norm: string;
  raw: string;
  kind: TokenKind;
  id: number;
  /** All tokens when count is not 1 (else undefined). */
  all: Required<Pick<Tokens, 'norm' | 'raw' | 'kind' | 'ids'>> | undefined;
}

/**
 * A memoised piece of text (between separators): our tokens of the piece when it starts a text
 * or follows spaces (its PieceReading fields), and one annotation slot for a scorer (for example
 * VADER's reading of the piece, keyed by its lexicon).
 */
export interface Piece extends PieceReading {
  text: string;
  /**
   * A number given to this piece when it was read, never given to another piece read by this
   * thread (until pieceSerialEpoch() changes): lets another thread that sees only the text and
   * the serial keep what it works out for the piece (see SerialCache).
   */
  serial: number;
  /**
   * Our tokens of the piece right after a tab or line break, when they differ: a first token such
   * as `'em` then attaches to the token before and counts no word.
   */
  afterBreak: PieceReading | undefined;
  annotationKey: object | undefined;
  annotation: unknown;
}

/** The PieceReading fields of `tokens` (whose arrays it may keep). */
function readingOf(tokens: Tokens): PieceReading {
  const ids = tokens.ids as number[];
  const one = tokens.norm.length === 1;
  return {
    count: tokens.norm.length,
    nWords: tokens.nWords,
    norm: one ? (tokens.norm[0] as string) : '',
    raw: one ? (tokens.raw[0] as string) : '',
    kind: one ? (tokens.kind[0] as TokenKind) : TokenKind.Other,
    id: one ? (ids[0] as number) : -1,
    all: one ? undefined : { norm: tokens.norm, raw: tokens.raw, kind: tokens.kind, ids },
  };
}

/**
 * Pieces memoised in two generations (see GenerationalTable), looked up by a range of the text
 * being tokenized: a piece met before costs no substring.
 */
const MEMO_LIMIT = 60_000;
let memo = new GenerationalTable<Piece>(MEMO_LIMIT);
/** Token ids (see Tokens.ids), kept apart from the memo; emptied with it when full. */
const ids = new Map<string, number>();
const IDS_LIMIT = 200_000;
let generation = 0;

/** Empties the memo of pieces and the table of token ids (the next generation of ids begins). */
export function clearTokenMemo(): void {
  memo = new GenerationalTable(MEMO_LIMIT);
  ids.clear();
  generation++;
}

/** The generation of token ids (see Tokens.ids); ids of an older generation mean nothing now. */
export function tokenGeneration(): number {
  return generation;
}

function idOf(norm: string): number {
  let id = ids.get(norm);
  if (id === undefined) {
    id = ids.size;
    ids.set(norm, id);
  }
  return id;
}

/** `out` with wink's tokens appended (see appendTokens) and ids for all of them. */
function withIds(out: Tokens, wink: WinkTokens, firstSpaced: boolean): Tokens {
  appendTokens(out, wink, firstSpaced);
  out.ids = out.norm.map(idOf);
  out.generation = generation;
  return out;
}

/**
 * Whether a piece whose first wink token is `first` can read differently right after a tab or
 * line break than after spaces: only a first token that appendTokens would attach to the token
 * before (an apostrophe piece or `n't`); emoji never join a break (see newPiece).
 */
function mayAttach(first: string | undefined): boolean {
  if (first === undefined) return false;
  const c = first.charCodeAt(0);
  return c === 0x27 || c === 0x2019 || ((c === 0x6e || c === 0x4e) && first.length === 3 && /^n['’]t$/i.test(first));
}

/** Serials of pieces (see Piece.serial): the next one, and how often they started again from 0. */
let nextSerial = 0;
let serialEpoch = 0;
const MAX_SERIAL = 0x3fffffff;

function takeSerial(): number {
  if (nextSerial > MAX_SERIAL) {
    nextSerial = 0;
    serialEpoch++;
  }
  return nextSerial++;
}

/** Changes when piece serials start again from 0 (after about a billion pieces): a serial means a piece only together with its epoch. */
export function pieceSerialEpoch(): number {
  return serialEpoch;
}

/**
 * Our reading of a plain piece (see readPlainPiece), as appendTokens makes it: the word in lower
 * case, counted when its type is a word type, then the mark (punctuation, attached, and never a
 * contraction piece). A letter never attaches to a break (see mayAttach), so a plain piece reads
 * the same after a break.
 */
function plainReading(plain: PlainPiece): PieceReading {
  const norms = plainNorms(plain);
  const norm = norms[0] as string;
  if (plain.mark === '') return { count: 1, nWords: WORDISH.has(plain.wordType) ? 1 : 0, norm, raw: plain.word, kind: kindOf(plain.wordType), id: idOf(norm), all: undefined };
  return readingOf({
    norm: norms,
    raw: [plain.word, plain.mark],
    kind: [kindOf(plain.wordType), kindOf(plain.markType)],
    nWords: (WORDISH.has(plain.wordType) ? 1 : 0) + (WORDISH.has(plain.markType) ? 1 : 0),
    ids: norms.map(idOf),
  });
}

/** The normal forms of a plain piece's tokens: the word in lower case, then the mark (if any) as it is. */
function plainNorms(plain: PlainPiece): string[] {
  const word = plain.word.toLowerCase();
  return plain.mark === '' ? [word] : [word, plain.mark];
}

/** A piece read by wink (see readPiece), with our tokens of it after spaces and, where they differ, after a break. */
function newPiece(piece: string): Piece {
  const plain = readPlainPiece(piece);
  if (plain !== undefined) return { text: piece, serial: takeSerial(), ...plainReading(plain), afterBreak: undefined, annotationKey: undefined, annotation: undefined };
  const wink = readPiece(piece);
  const tokens = withIds({ norm: [], raw: [], kind: [], nWords: 0 }, wink, true);
  const made: Piece = { text: piece, serial: takeSerial(), ...readingOf(tokens), afterBreak: undefined, annotationKey: undefined, annotation: undefined };
  if (!mayAttach(wink.values[0])) return made;
  // After a break the token before is a tab or line break, a control character, and no
  // character joins a control character into one grapheme (Unicode UAX #29, rules GB4 and
  // GB5), so `\n` stands for every break here.
  const afterBreak = withIds({ norm: ['\n'], raw: ['\n'], kind: [TokenKind.Other], nWords: 0 }, wink, false);
  afterBreak.norm.shift();
  afterBreak.raw.shift();
  afterBreak.kind.shift();
  (afterBreak.ids as number[]).shift();
  if (afterBreak.nWords !== tokens.nWords || afterBreak.norm.some((n, k) => n !== tokens.norm[k])) made.afterBreak = readingOf(afterBreak);
  return made;
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
 *
 * wink tokenizes each space-separated piece on its own, so pieces are memoised (see GenerationalTable),
 * and each piece is read as by a freshly loaded wink-nlp (see readPiece): the tokens are those
 * of one wink pass over the whole text (`tokenizeEnglishWhole`) except where, in that pass, one
 * piece's new words would have changed how a later piece of the same text is split.
 */
export function tokenizeEnglish(text: string): Tokens {
  return tokenizeEnglishPieces(text);
}

/**
 * tokenizeEnglish, also listing the memoised pieces of the text in order in `pieces` (when
 * given), for scorers that annotate pieces. The pieces stay valid until the next call.
 */
export function tokenizeEnglishPieces(text: string, pieces?: Piece[]): Tokens {
  return tokenizeEnglishInto({ norm: [], raw: [], kind: [], nWords: 0, ids: [], generation }, text, pieces);
}

/** The Tokens that tokenizeEnglishShared fills, text after text. */
const shared: Tokens = { norm: [], raw: [], kind: [], nWords: 0, ids: [], generation, size: 0, pieceCount: 0 };

/**
 * tokenizeEnglishPieces into one Tokens object that every call refills: for a caller that is done
 * with the tokens of a text before it tokenizes the next one (the scoring loop), it saves
 * allocating arrays per text. The arrays are never shortened, so they may hold stale tokens
 * past `size` (the number of tokens of this text), and the first `pieceCount` entries of
 * `pieces` and `starts` are this text's. Valid until the next call.
 */
export function tokenizeEnglishShared(text: string, pieces?: Piece[], starts?: number[]): Tokens {
  return tokenizeEnglishInto(shared, text, pieces, starts);
}

/**
 * Tokenizes `text` into `out`, overwriting what it held (see tokenizeEnglishPieces); with
 * `starts`, also the offset in `text` of each piece listed in `pieces`.
 */
function tokenizeEnglishInto(out: Tokens, text: string, pieces: Piece[] | undefined, starts?: number[]): Tokens {
  if (ids.size >= IDS_LIMIT) clearTokenMemo();
  const { norm, raw, kind } = out;
  const idList = out.ids as number[];
  out.generation = generation;
  out.nWords = 0;
  const n = text.length;
  let p = 0; // pieces listed
  let m = 0; // tokens written
  let spaced = false;
  let k = 0;
  while (k < n) {
    let c = text.charCodeAt(k);
    if (isSpaceChar(c)) {
      spaced = true; // a run of spaces: the next token follows spaces
      k++;
      continue;
    }
    // A piece runs to the next separator; a run of tabs and line breaks is a piece of its own.
    const start = k;
    const breaks = isBreakChar(c);
    let hash = HASH_START;
    do {
      hash = hashStep(hash, c);
      if (++k === n) break;
      c = text.charCodeAt(k);
    } while (breaks ? isBreakChar(c) : !isSpaceChar(c) && !isBreakChar(c));
    const memoised = memo.get(text, start, k, hash, newPiece);
    if (pieces) pieces[p] = memoised;
    if (starts) starts[p] = start;
    p++;
    // Right after a tab or line break the first token may attach to it (see Piece.afterBreak).
    const t: PieceReading = !spaced && m > 0 && memoised.afterBreak !== undefined ? memoised.afterBreak : memoised;
    const all = t.all;
    if (all === undefined) {
      norm[m] = t.norm;
      raw[m] = t.raw;
      kind[m] = t.kind;
      idList[m] = t.id;
      m++;
    } else {
      for (let j = 0; j < t.count; j++, m++) {
        norm[m] = all.norm[j] as string;
        raw[m] = all.raw[j] as string;
        kind[m] = all.kind[j] as TokenKind;
        idList[m] = all.ids[j] as number;
      }
    }
    out.nWords += t.nWords;
    spaced = false;
  }
  if (out.size !== undefined) {
    // Reused arrays keep their length (shortening them would make the next longer text grow them again).
    out.size = m;
    out.pieceCount = p;
  } else {
    if (pieces) pieces.length = p;
    if (starts) starts.length = p;
  }
  return out;
}

/** One wink pass over the whole text, without memo: the reference the memoised path is tested against. */
export function tokenizeEnglishWhole(text: string): Tokens {
  const out: Tokens = { norm: [], raw: [], kind: [], nWords: 0 };
  const wink = readWink(text);
  appendTokens(out, wink, wink.spaced[0] ?? false);
  return out;
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
  return isEnglish(language) ? tokenizeEnglish(text) : tokenizeSegmenter(text, language);
}

/** Whether a BCP 47 language tag is English (`en`, `en-GB`, …): the languages wink-nlp tokenizes. */
export function isEnglish(language: string): boolean {
  return language === 'en' || language.startsWith('en-');
}

/**
 * The normal forms of `term`'s tokens (tokenize(term, language).norm), without the memo when the
 * term is one plain English piece (see readPlainPiece: most terms of a word list), as
 * plainReading gives them (plainNorms). For building a lexicon's tables, which tokenizes every term once.
 */
export function termNorms(term: string, language = 'en'): string[] {
  if (isEnglish(language)) {
    const plain = readPlainPiece(term);
    if (plain !== undefined) return plainNorms(plain);
  }
  return tokenize(term, language).norm;
}
