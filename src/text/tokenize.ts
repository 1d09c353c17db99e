import { createRequire } from 'node:module';
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
  /**
   * English tokens only: per token a small integer standing for its `norm` (equal norms, equal
   * ids), valid while tokenGeneration() returns `generation`. Lets matchers keep per-word
   * answers in arrays instead of looking each token up by its text.
   */
  ids?: number[];
  generation?: number;
}

type Nlp = ReturnType<typeof winkNLP>;
type WinkModel = typeof model;

/**
 * wink-nlp remembers every new word it meets (in its lexeme table), and a remembered word can
 * change how a later text is split: in one process the first `don’twell...` gives
 * `don’twell . ..` and every later one `don’twell ...`; `'em` is split as `' em` until some
 * text has made `'em` a token. Tokens would then depend on the texts read before (their order,
 * and how they were shared between worker threads). So every piece of text is tokenized as by a
 * freshly loaded wink-nlp: the words wink adds to its lexeme table while tokenizing a piece are
 * taken out of the table's index again right after (they stay in its list, whose positions wink
 * relies on). The list still grows with each new word; the instance is replaced when it holds
 * WINK_RENEW words beyond the model's own.
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

/** The parts of wink's core model read here (see loadCoreModel). */
interface CoreModel {
  lexicon: Uint32Array | string;
  xpansions: Uint32Array | string;
  packing: { layout: Record<string, number[]>; efList: string[] };
  features: Record<string, { list: unknown[]; hash: Record<string, number>; intrinsicSize: number; index: number; maxIndex: number }> & {
    lexeme: { list: unknown[]; hash: Record<string, number>; intrinsicSize: number; index: number };
    posClusters: { list: unknown[] };
  };
  pos: { hash: Record<string, number> };
}

const requireModelFile = createRequire(import.meta.url);

/** A fresh ArrayBuffer holding the bytes of base64 `data`. */
function bytesOfBase64(data: string): ArrayBuffer {
  const bytes = Buffer.from(data, 'base64');
  return bytes.buffer.slice(bytes.byteOffset, bytes.byteOffset + bytes.byteLength) as ArrayBuffer;
}

/**
 * wink-eng-lite-web-model's core model, prepared as the package's own `core()` prepares it
 * (dist/read-core-model.js and dist/load-core-model.js of version 1.8.1), with two cheaper
 * steps: a structured clone instead of a JSON round trip, and Node's base64 decoder instead of
 * a character loop. About 0.13 s less per start of the tool and of each scoring worker.
 * test/text/tokenize-memo.test.ts checks the tokens equal those of the package's own loader.
 */
export function loadCoreModel(): CoreModel {
  const original = requireModelFile('wink-eng-lite-web-model/dist/languages/cur/models/eng-core-web-model.json') as CoreModel;
  const core = structuredClone(original);
  const { packing, features, pos } = core;
  core.lexicon = new Uint32Array(bytesOfBase64(core.lexicon as string));
  core.xpansions = new Uint32Array(bytesOfBase64(core.xpansions as string));
  for (const f in packing.layout) {
    if (packing.layout[f]![3] !== 0) continue;
    const feature = features[f]!;
    const hash: Record<string, number> = Object.create(null);
    for (let k = 0; k < feature.list.length; k++) hash[feature.list[k] as string] = k;
    feature.hash = hash;
  }
  const lexemeHash: Record<string, number> = Object.create(null);
  for (let k = 0; k < features.lexeme.list.length; k++) lexemeHash[features.lexeme.list[k] as string] = k;
  features.lexeme.hash = lexemeHash;
  const clusters = features.posClusters.list;
  for (let k = 0; k < clusters.length; k++) clusters[k] = new Set((clusters[k] as string).split('_').map((e) => pos.hash[e] || 0));
  packing.efList = [];
  for (const f in packing.layout) {
    const layout = packing.layout[f]!;
    if (layout[3] === 0) {
      const feature = features[f]!;
      feature.intrinsicSize = feature.list.length;
      feature.index = feature.list.length;
      feature.maxIndex = layout[1]! >>> layout[2]!;
    }
    if (layout[4] === 1) packing.efList.push(f);
  }
  features.lexeme.intrinsicSize = features.lexeme.list.length;
  features.lexeme.index = features.lexeme.list.length;
  return core;
}

function loadIsolatedWink(): IsolatedWink {
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
  state.nlp = winkNLP(wrapped, []);
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

/** wink-nlp's output for one text: token values, types, contraction flags and normals, and whether each token follows spaces. */
interface WinkTokens {
  values: string[];
  types: string[];
  contraction: boolean[];
  /** Normal forms (used for contraction pieces). */
  normals: string[];
  spaced: boolean[];
}

/** wink's tokens of `text` as read by a freshly loaded wink-nlp (see IsolatedWink). */
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
 * wink-nlp splits a text on runs of spaces (these characters) and on runs of tabs and line
 * breaks, then tokenizes each piece on its own: the output for a piece depends only on the
 * piece. Runs of spaces become the next token's preceding spaces; runs of tabs and line breaks
 * are tokens. (Same classes as wink-nlp's splitter; test/text/tokenize-memo.test.ts checks the
 * memoised path equals one wink pass over whole texts.)
 */
const SPLITTER = /([ \u00a0\u2002-\u2005\u2009\u200a\u202f\u205f]+|[\n\r\t]+)/;

/**
 * A memoised piece of text (between separators): our tokens of the piece when it starts a text
 * or follows spaces, and one annotation slot for a scorer (for example VADER's reading of the
 * piece, keyed by its lexicon).
 */
export interface Piece {
  text: string;
  tokens: Tokens;
  /**
   * Our tokens of the piece right after a tab or line break, when they differ from `tokens`:
   * a first token such as `'em` then attaches to the token before and counts no word.
   */
  afterBreak?: Tokens;
  /** Times met in the young map, to find the pieces worth keeping in the hot map. */
  seen: number;
  annotationKey?: object;
  annotation?: unknown;
}

/**
 * Pieces memoised in two generations: new pieces go to `young`; when it is full it becomes
 * `old` (the previous `old` is dropped) and a piece found in `old` moves back to `young`. Pieces
 * in use stay, pieces not met for a generation go, and memory stays bounded (at most twice
 * MEMO_LIMIT pieces) without emptying the memo of common words all at once.
 */
let young = new Map<string, Piece>();
let old = new Map<string, Piece>();
const MEMO_LIMIT = 60_000;
/** Token ids (see Tokens.ids), kept apart from the memo; emptied with it when full. */
const ids = new Map<string, number>();
const IDS_LIMIT = 200_000;
let generation = 0;

/** Empties the memo of pieces and the table of token ids (the next generation of ids begins). */
export function clearTokenMemo(): void {
  hot = new Map();
  young = new Map();
  old = new Map();
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

/**
 * The pieces met most often, in a map small enough to stay in the processor's cache (a look-up
 * in the large maps costs several cache misses): in running text a few thousand pieces make up
 * most tokens. A piece moves here when met HOT_AFTER times, while there is room.
 */
let hot = new Map<string, Piece>();
const HOT_LIMIT = 8192;
const HOT_AFTER = 16;

/** `out` with wink's tokens appended (see appendTokens) and ids for all of them. */
function withIds(out: Tokens, wink: WinkTokens, firstSpaced: boolean): Tokens {
  appendTokens(out, wink, firstSpaced);
  out.ids = out.norm.map(idOf);
  out.generation = generation;
  return out;
}

function winkPiece(piece: string): Piece {
  let hit = hot.get(piece);
  if (hit !== undefined) return hit;
  hit = young.get(piece);
  if (hit !== undefined) {
    if (++hit.seen >= HOT_AFTER && hot.size < HOT_LIMIT) hot.set(piece, hit);
    return hit;
  }
  hit = old.get(piece);
  if (hit === undefined) {
    const wink = readWink(piece);
    const tokens = withIds({ norm: [], raw: [], kind: [], nWords: 0 }, wink, true);
    // After a break the token before is a tab or line break, a control character, and no
    // character joins a control character into one grapheme (Unicode UAX #29, rules GB4 and
    // GB5), so `\n` stands for every break here.
    const afterBreak = withIds({ norm: ['\n'], raw: ['\n'], kind: [TokenKind.Other], nWords: 0 }, wink, false);
    afterBreak.norm.shift();
    afterBreak.raw.shift();
    afterBreak.kind.shift();
    (afterBreak.ids as number[]).shift();
    hit = { text: piece, tokens, seen: 0 };
    if (afterBreak.nWords !== tokens.nWords || afterBreak.norm.some((n, k) => n !== tokens.norm[k])) hit.afterBreak = afterBreak;
  }
  if (young.size >= MEMO_LIMIT) {
    old = young;
    young = new Map();
  }
  young.set(piece, hit);
  return hit;
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
 * wink tokenizes each space-separated piece on its own, so pieces are memoised (see winkPiece),
 * and each piece is read as by a freshly loaded wink-nlp (see IsolatedWink): the tokens are those
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
  if (ids.size >= IDS_LIMIT) clearTokenMemo();
  const idList: number[] = [];
  const out: Tokens = { norm: [], raw: [], kind: [], nWords: 0, ids: idList, generation };
  if (pieces) pieces.length = 0;
  const parts = text.split(SPLITTER);
  let spaced = false;
  for (let p = 0; p < parts.length; p++) {
    const part = parts[p] as string;
    if (part === '') continue;
    if (p % 2 === 1 && part.charCodeAt(0) !== 10 && part.charCodeAt(0) !== 13 && part.charCodeAt(0) !== 9) {
      spaced = true; // a run of spaces: the next token follows spaces
      continue;
    }
    const memoised = winkPiece(part);
    pieces?.push(memoised);
    // Right after a tab or line break the first token may attach to it (see Piece.afterBreak).
    const t = !spaced && out.raw.length > 0 && memoised.afterBreak ? memoised.afterBreak : memoised.tokens;
    const tIds = t.ids as number[];
    for (let k = 0; k < t.raw.length; k++) {
      out.norm.push(t.norm[k] as string);
      out.raw.push(t.raw[k] as string);
      out.kind.push(t.kind[k] as TokenKind);
      idList.push(tIds[k] as number);
    }
    out.nWords += t.nWords;
    spaced = false;
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
  return language === 'en' || language.startsWith('en-') ? tokenizeEnglish(text) : tokenizeSegmenter(text, language);
}
