import { appendTokens, tokenKindOf, WORD_TYPES } from '../text/append-tokens.js';
import { TokenKind, type Tokens } from '../text/tokens.js';
import type { WinkTokens } from '../text/wink-tokens.js';
import { isBreakChar, isSpaceChar } from './piece-end.js';
import { GenerationalTable, HASH_START, hashStep } from './piece-table.js';
import { plainNorms, readPiece, readPlainPiece, type PlainPiece } from './read-piece.js';

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
 * The memo of this thread (a cache: what it holds never changes a token, tested with an empty,
 * a warm and a cleared memo). Pieces are memoised in two generations (see GenerationalTable),
 * looked up by a range of the text being tokenized: a piece met before costs no substring.
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
  if (plain.mark === '') return { count: 1, nWords: WORD_TYPES.has(plain.wordType) ? 1 : 0, norm, raw: plain.word, kind: tokenKindOf(plain.wordType), id: idOf(norm), all: undefined };
  return readingOf({
    norm: norms,
    raw: [plain.word, plain.mark],
    kind: [tokenKindOf(plain.wordType), tokenKindOf(plain.markType)],
    nWords: (WORD_TYPES.has(plain.wordType) ? 1 : 0) + (WORD_TYPES.has(plain.markType) ? 1 : 0),
    ids: norms.map(idOf),
  });
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
 * Tokenizes English text as tokenizeEnglishWhole (src/text/tokenize-english-whole.ts) defines it,
 * piece by piece through the memo: wink tokenizes each space-separated piece on its own, so
 * pieces are memoised (see GenerationalTable), and each piece is read as by a freshly loaded
 * wink-nlp (see readPiece). The tokens are those of one wink pass over the whole text except
 * where, in that pass, one piece's new words would have changed how a later piece of the same
 * text is split.
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

/**
 * Tokenizes `text` into `out`, overwriting what it held, and returns `out`; lists the memoised
 * pieces of the text in `pieces` and, with `starts`, the offset in `text` of each.
 *
 * With `out.size` defined (a Tokens that the caller refills text after text, as the batch
 * scorer does), the arrays are never shortened, so they may hold stale tokens past `size` (the
 * number of tokens of this text), and the first `pieceCount` entries of `pieces` and `starts`
 * are this text's; this saves allocating arrays per text. Otherwise the arrays are cut to the
 * text's tokens and pieces.
 */
export function tokenizeEnglishInto(out: Tokens, text: string, pieces?: Piece[], starts?: number[]): Tokens {
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
