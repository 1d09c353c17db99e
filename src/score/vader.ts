import {
  VADER_AFTER_BUT,
  VADER_BEFORE_BUT,
  VADER_BOOSTERS,
  VADER_CAPS_BOOST,
  VADER_DAMPEN,
  VADER_DISTANCE_SCALE,
  VADER_EXCLAMATION_BOOST,
  VADER_IDIOMS,
  VADER_MAX_EXCLAMATIONS,
  VADER_NEGATION_SCALAR,
  VADER_NEGATORS,
  VADER_NEVER_SO_FAR,
  VADER_NEVER_SO_NEAR,
  VADER_NORMALISATION_ALPHA,
  VADER_QUESTION_BOOST,
  VADER_QUESTION_BOOST_MAX,
} from './vader-constants.js';
import { pieceEnd, type Piece } from '../text/tokenize.js';
import type { SerialCache } from '../text/serial-cache.js';
import { detached, GenerationalTable, HASH_START, hashStep } from '../text/piece-table.js';
import { isSpace, stripToken, vaderTokens } from './vader-tokens.js';

/** A VADER lexicon: lower-case token → mean valence (−4 … +4). */
export type VaderLexicon = ReadonlyMap<string, number>;

/** VADER's scores of one text. */
export interface VaderScores {
  /** Normalised sum of valences, in [−1, 1]; 0 when nothing matched. */
  compound: number;
  /** Share of positive intensity (0 … 1). */
  pos: number;
  /** Share of neutral tokens (0 … 1). */
  neu: number;
  /** Share of negative intensity (0 … 1). */
  neg: number;
  /** VADER tokens of the text; 0 means the reference's all-zero result, not a measurement. */
  tokens: number;
  /** Tokens found in the lexicon and scored (boosters and "kind of" are not scored). */
  matched: number;
}

/** Words that can take part in an idiom or a two-word dampener (raw, case-sensitive). */
const IDIOM_WORDS: ReadonlySet<string> = new Set(
  [...VADER_IDIOMS.keys(), ...[...VADER_BOOSTERS.keys()].filter((k) => k.includes(' '))].flatMap((k) => k.split(' ')),
);

/** Shape bits of a token: ASCII upper case seen, ASCII lower case seen, non-ASCII seen. */
const UPPER = 1;
const LOWER = 2;
const OTHER = 4;

function shapeOf(word: string): number {
  let bits = 0;
  for (let k = 0; k < word.length; k++) {
    const c = word.charCodeAt(k);
    if (c >= 0x61 && c <= 0x7a) bits |= LOWER;
    else if (c >= 0x41 && c <= 0x5a) bits |= UPPER;
    else if (c >= 0x80) bits |= OTHER;
  }
  return bits;
}

/**
 * What the VADER rules ask of a token, worked out once per distinct token (VaderWord.flags), so
 * scoring a text compares no strings except in idioms. "Lower" tests are on the token's lower
 * case, the others on the token as written, as in the reference.
 */
const W = {
  /** In the lexicon (lower case). */
  Valenced: 1,
  /** In capitals: some A–Z and no a–z (Python's `isupper` as the reference port tests it). */
  Caps: 2,
  /** A booster or dampener (lower). */
  Booster: 4,
  /** `kind` (lower). */
  Kind: 8,
  /** `of` (lower). */
  Of: 16,
  /** `least` (lower). */
  Least: 32,
  /** `at` or `very` (lower). */
  AtOrVery: 64,
  /** A negator or a token containing `n't`. */
  Negator: 128,
  /** `never`. */
  Never: 256,
  /** `so` or `this`. */
  SoOrThis: 512,
  /** `but`. */
  But: 1024,
  /** `BUT`. */
  ButCaps: 2048,
  /** A word of an idiom or a two-word dampener. */
  Idiom: 4096,
} as const;

/** What VADER needs of one token as written: the token, its valence (0 unless W.Valenced), its booster value and its flags (see W). */
export interface VaderWord {
  raw: string;
  valence: number;
  boost: number;
  flags: number;
}

/** Flags (see W) of the few tokens that have any by their lower case: boosters and the words some rule names. */
const LOWER_FLAGS: ReadonlyMap<string, number> = flagTable([
  [[...VADER_BOOSTERS.keys()], W.Booster],
  [['kind'], W.Kind],
  [['of'], W.Of],
  [['least'], W.Least],
  [['at', 'very'], W.AtOrVery],
]);

/**
 * Flags (see W) of the few tokens that have any as written. A token negates when it is a negator
 * or contains "n't" (case-sensitive, as published): the second test is in vaderWord.
 */
const RAW_FLAGS: ReadonlyMap<string, number> = flagTable([
  [[...VADER_NEGATORS], W.Negator],
  [['never'], W.Never],
  [['so', 'this'], W.SoOrThis],
  [['but'], W.But],
  [['BUT'], W.ButCaps],
  [[...IDIOM_WORDS], W.Idiom],
]);

function flagTable(groups: ReadonlyArray<readonly [readonly string[], number]>): Map<string, number> {
  const table = new Map<string, number>();
  for (const [words, flag] of groups) for (const word of words) table.set(word, (table.get(word) ?? 0) | flag);
  return table;
}

function vaderWord(w: string, lexicon: VaderLexicon): VaderWord {
  const bits = shapeOf(w);
  const lower = bits & (UPPER | OTHER) ? w.toLowerCase() : w;
  const valence = lexicon.get(lower);
  let flags = (LOWER_FLAGS.get(lower) ?? 0) | (RAW_FLAGS.get(w) ?? 0);
  if (valence !== undefined) flags |= W.Valenced;
  if ((bits & (UPPER | LOWER)) === UPPER) flags |= W.Caps;
  if (w.includes("n't")) flags |= W.Negator;
  return { raw: w, valence: valence ?? 0, boost: flags & W.Booster ? (VADER_BOOSTERS.get(lower) as number) : 0, flags };
}

/** The tokens of the text being scored, reused from text to text (scoring is synchronous; entries from `n` on are stale). */
const scratch = { n: 0, words: [] as VaderWord[], sentiments: [] as number[] };

function grow(n: number): void {
  const size = Math.max(n, 2 * scratch.words.length, 64);
  const words = new Array<VaderWord>(size).fill(NO_WORD);
  for (let k = 0; k < scratch.n; k++) words[k] = scratch.words[k] as VaderWord;
  scratch.words = words;
  scratch.sentiments = new Array<number>(size).fill(0);
}

/** Filler of unused scratch entries. */
const NO_WORD: VaderWord = { raw: '', valence: 0, boost: 0, flags: 0 };

/** Appends one token to the scratch arrays. */
function pushWord(word: VaderWord): void {
  const k = scratch.n;
  if (k >= scratch.words.length) grow(k + 1);
  scratch.words[k] = word;
  scratch.n = k + 1;
}

/** The first index below `n` of a token with `flag`, or −1. */
function firstWith(words: readonly VaderWord[], n: number, flag: number): number {
  for (let k = 0; k < n; k++) if ((words[k] as VaderWord).flags & flag) return k;
  return -1;
}

function countChar(text: string, char: string): number {
  let count = 0;
  for (let k = text.indexOf(char); k !== -1; k = text.indexOf(char, k + 1)) count++;
  return count;
}

/**
 * The special-idiom and two-word-dampener check, applied with the modifier three tokens back
 * (only called when one of tokens i−3 … i is an idiom word: otherwise it changes nothing).
 */
function idiomValence(valence: number, words: readonly VaderWord[], i: number, n: number): number {
  const t3 = words[i - 3]!;
  const t2 = words[i - 2]!;
  const t1 = words[i - 1]!;
  const t0 = words[i]!;
  const w3 = t3.raw;
  const w2 = t2.raw;
  const w1 = t1.raw;
  const w0 = t0.raw;
  const has0 = (t0.flags & W.Idiom) !== 0;
  const has1 = (t1.flags & W.Idiom) !== 0;
  const has2 = (t2.flags & W.Idiom) !== 0;
  const has3 = (t3.flags & W.Idiom) !== 0;
  let v = valence;
  // The reference tries these in order and keeps the first idiom found; a
  // sequence can only be an idiom when each of its words occurs in one.
  let idiom: number | undefined;
  if (has1 && has0) idiom = VADER_IDIOMS.get(`${w1} ${w0}`);
  if (idiom === undefined && has2 && has1 && has0) idiom = VADER_IDIOMS.get(`${w2} ${w1} ${w0}`);
  if (idiom === undefined && has2 && has1) idiom = VADER_IDIOMS.get(`${w2} ${w1}`);
  if (idiom === undefined && has3 && has2 && has1) idiom = VADER_IDIOMS.get(`${w3} ${w2} ${w1}`);
  if (idiom === undefined && has3 && has2) idiom = VADER_IDIOMS.get(`${w3} ${w2}`);
  if (idiom !== undefined) v = idiom;
  if (has0 && n - 1 > i) {
    const next = words[i + 1]!;
    if (next.flags & W.Idiom) {
      const two = VADER_IDIOMS.get(`${w0} ${next.raw}`);
      if (two !== undefined) v = two;
      if (n - 1 > i + 1 && words[i + 2]!.flags & W.Idiom) {
        const three = VADER_IDIOMS.get(`${w0} ${next.raw} ${words[i + 2]!.raw}`);
        if (three !== undefined) v = three;
      }
    }
  }
  if ((has3 && has2 && VADER_BOOSTERS.has(`${w3} ${w2}`)) || (has2 && has1 && VADER_BOOSTERS.has(`${w2} ${w1}`))) {
    v += VADER_DAMPEN;
  }
  return v;
}

/**
 * Score one text with the VADER rules (Hutto & Gilbert 2014).
 *
 * Per token (see {@link vaderTokens}) found in the lexicon, its valence v is
 * adjusted, in this order, as in the reference implementation:
 * 1. ALL-CAPS emphasis: ±0.733 when the token is in capitals and the text is
 *    not entirely in capitals;
 * 2. for each of the 3 preceding tokens that is not itself in the lexicon:
 *    booster/dampener ±0.293 (sign follows v, ±0.733 more when the modifier is in
 *    capitals) scaled by distance 1, 0.95, 0.9; negation v × −0.74 when the token
 *    is a negator or contains "n't"; "never so/this" × 1.5 (2 back) or × 1.25
 *    (3 back, also for "so/this" right before); at 3 back, the special idioms
 *    replace v and "kind of"/"sort of"/"just enough" add −0.293;
 * 3. "least" right before: × −0.74 unless preceded by "at" or "very".
 * Boosters and "kind" in "kind of" score 0. Then sentiment before the first
 * "but" (or "BUT") is × 0.5 and after it × 1.5. With x the sum of valences,
 * exclamation marks (up to 4, 0.292 each) and question marks (2–3: 0.18 each,
 * more: 0.96) add to |x|, and compound = x / √(x² + 15).
 * pos, neg and neu are the shares of Σ(v+1) over positive v, Σ|v−1| over
 * negative v and the count of zero v, the punctuation emphasis added to the
 * larger of pos and neg.
 *
 * Values are not rounded (the reference rounds compound to 4 and the shares to
 * 3 decimals for display). Score each entry on its own: compound saturates, so
 * it is never meaningful over concatenated entries.
 *
 * @param text - the text of one entry
 * @param lexicon - lower-case token → mean valence, e.g. the bundled `vader` lexicon
 * @returns the scores; a text without tokens gives all zeros with `tokens: 0`
 *   (the reference's result), which callers should treat as "no score"
 */
export function scoreVader(text: string, lexicon: VaderLexicon): VaderScores {
  let cache = tokenCaches.get(lexicon);
  if (cache === undefined) {
    cache = { table: new GenerationalTable(TOKEN_CACHE_LIMIT), read: (token) => vaderWord(stripToken(token), lexicon) };
    tokenCaches.set(lexicon, cache);
  }
  const { table, read } = cache;
  scratch.n = 0;
  // vaderTokens, with each whitespace-separated token looked up by its range of the text: a
  // token met before costs no substring.
  const n = text.length;
  let start = 0;
  let hash = HASH_START;
  for (let k = 0; k <= n; k++) {
    const c = k === n ? 0x20 : text.charCodeAt(k);
    if (!isSpace(c)) {
      hash = hashStep(hash, c);
      continue;
    }
    if (k - start > 1) pushWord(table.get(text, start, k, hash, read));
    start = k + 1;
    hash = HASH_START;
  }
  return scoreScratch(text);
}

/** Per lexicon, the VaderWord of each whitespace-separated token met by scoreVader, by the token as written (bounded: see GenerationalTable). */
const tokenCaches = new WeakMap<VaderLexicon, { table: GenerationalTable<VaderWord>; read: (token: string) => VaderWord }>();
const TOKEN_CACHE_LIMIT = 60_000;

/**
 * scoreVader for a text given as its memoised pieces (see tokenizeEnglishPieces): VADER splits
 * on every whitespace character, which includes every separator of the pieces, so the VADER
 * tokens of the text are those of its pieces in order (the first `count` of `pieces`). Each piece keeps its VADER tokens for
 * `lexicon` in its annotation slot (the VaderWord itself for a piece of one token, the usual
 * case; else a list), so a recurring piece is split and looked up once.
 */
export function scoreVaderPieces(pieces: readonly Piece[], text: string, lexicon: VaderLexicon, count = pieces.length): VaderScores {
  scratch.n = 0;
  for (let p = 0; p < count; p++) {
    const piece = pieces[p] as Piece;
    let annotation = piece.annotationKey === lexicon ? (piece.annotation as PieceWords) : undefined;
    if (annotation === undefined) {
      annotation = pieceWords(piece.text, lexicon);
      piece.annotationKey = lexicon;
      piece.annotation = annotation;
    }
    pushPieceWords(annotation);
  }
  return scoreScratch(text);
}

/** VADER's tokens of one piece of text: the VaderWord itself for one token (the usual case), else a list. */
export type PieceWords = VaderWord | VaderWord[];

function pieceWords(piece: string, lexicon: VaderLexicon): PieceWords {
  const list = vaderTokens(piece).map((w) => vaderWord(w, lexicon));
  return list.length === 1 ? (list[0] as VaderWord) : list;
}

function pushPieceWords(words: PieceWords): void {
  if (!Array.isArray(words)) pushWord(words);
  else for (let k = 0; k < words.length; k++) pushWord(words[k] as VaderWord);
}

/**
 * scoreVaderPieces for a text whose pieces another thread found (see Piece.serial): pieces
 * `from` … `from + count − 1` of `serials` and `starts` (their offsets in `text`). A piece's VADER
 * tokens are kept in `cache` by its serial, and worked out from the text when the cache lacks
 * them, so the scores equal scoreVader's whatever the cache holds (tested).
 */
export function scoreVaderSerials(text: string, serials: Int32Array, starts: Int32Array, from: number, count: number, lexicon: VaderLexicon, cache: SerialCache<PieceWords>): VaderScores {
  scratch.n = 0;
  for (let k = from; k < from + count; k++) {
    const serial = serials[k] as number;
    let words = cache.get(serial);
    if (words === undefined) {
      const start = starts[k] as number;
      // A copy: words cut from the text itself would keep the whole text alive in the cache.
      words = pieceWords(detached(text.slice(start, pieceEnd(text, start))), lexicon);
      cache.set(serial, words);
    }
    pushPieceWords(words);
  }
  return scoreScratch(text);
}

/** VADER's scores of the tokens in the scratch arrays (see scoreVader); `text` for its ! and ?. */
function scoreScratch(text: string): VaderScores {
  const n = scratch.n;
  if (n === 0) return { compound: 0, pos: 0, neu: 0, neg: 0, tokens: 0, matched: 0 };
  const { words, sentiments } = scratch;
  let capsCount = 0;
  for (let k = 0; k < n; k++) if ((words[k] as VaderWord).flags & W.Caps) capsCount++;
  const capDiff = capsCount > 0 && capsCount < n;

  let matched = 0;
  for (let i = 0; i < n; i++) {
    const word = words[i] as VaderWord;
    const flags = word.flags;
    if (!(flags & W.Valenced) || flags & W.Booster || (flags & W.Kind && i < n - 1 && (words[i + 1] as VaderWord).flags & W.Of)) {
      sentiments[i] = 0;
      continue;
    }
    matched++;
    let v = word.valence;
    if (capDiff && flags & W.Caps) v += v > 0 ? VADER_CAPS_BOOST : -VADER_CAPS_BOOST;

    for (let back = 0; back < 3 && back < i; back++) {
      const before = words[i - back - 1] as VaderWord;
      if (before.flags & W.Valenced) continue;
      if (before.flags & W.Booster) {
        let s = v < 0 ? -before.boost : before.boost;
        if (capDiff && before.flags & W.Caps) s += v > 0 ? VADER_CAPS_BOOST : -VADER_CAPS_BOOST;
        if (back > 0 && s !== 0) s *= VADER_DISTANCE_SCALE[back]!;
        v += s;
      }
      v = negationCheck(v, words, back, i);
      if (back === 2 && (flags | (words[i - 1] as VaderWord).flags | (words[i - 2] as VaderWord).flags | before.flags) & W.Idiom) v = idiomValence(v, words, i, n);
    }

    if (i > 0 && (words[i - 1] as VaderWord).flags & W.Least && !((words[i - 1] as VaderWord).flags & W.Valenced)) {
      if (i === 1 || !((words[i - 2] as VaderWord).flags & W.AtOrVery)) v *= VADER_NEGATION_SCALAR;
    }
    sentiments[i] = v;
  }

  let but = firstWith(words, n, W.But);
  if (but < 0) but = firstWith(words, n, W.ButCaps);
  if (but >= 0) {
    for (let i = 0; i < n; i++) {
      if (i < but) sentiments[i] = sentiments[i]! * VADER_BEFORE_BUT;
      else if (i > but) sentiments[i] = sentiments[i]! * VADER_AFTER_BUT;
    }
  }

  let sum = 0;
  let posSum = 0;
  let negSum = 0;
  let neutral = 0;
  for (let i = 0; i < n; i++) {
    const s = sentiments[i]!;
    sum += s;
    if (s > 0) posSum += s + 1;
    else if (s < 0) negSum += s - 1;
    else neutral++;
  }

  const emphasis = punctuationEmphasis(text);
  if (sum > 0) sum += emphasis;
  else if (sum < 0) sum -= emphasis;
  const compound = Math.max(-1, Math.min(1, sum / Math.sqrt(sum * sum + VADER_NORMALISATION_ALPHA)));

  if (posSum > Math.abs(negSum)) posSum += emphasis;
  else if (posSum < Math.abs(negSum)) negSum -= emphasis;
  const total = posSum + Math.abs(negSum) + neutral;
  return {
    compound,
    pos: Math.abs(posSum / total),
    neu: Math.abs(neutral / total),
    neg: Math.abs(negSum / total),
    tokens: n,
    matched,
  };
}

/** Negation and "never so/this" with the modifier `back + 1` tokens before token i. */
function negationCheck(v: number, words: readonly VaderWord[], back: number, i: number): number {
  const t1 = words[i - 1] as VaderWord;
  if (back === 0) return t1.flags & W.Negator ? v * VADER_NEGATION_SCALAR : v;
  const t2 = words[i - 2] as VaderWord;
  if (back === 1) {
    if (t2.flags & W.Never && t1.flags & W.SoOrThis) return v * VADER_NEVER_SO_NEAR;
    return t2.flags & W.Negator ? v * VADER_NEGATION_SCALAR : v;
  }
  const t3 = words[i - 3] as VaderWord;
  if ((t3.flags & W.Never && t2.flags & W.SoOrThis) || t1.flags & W.SoOrThis) return v * VADER_NEVER_SO_FAR;
  return t3.flags & W.Negator ? v * VADER_NEGATION_SCALAR : v;
}

/** Emphasis from "!" (0.292 each, up to 4) and "?" (2–3: 0.18 each; more: 0.96) anywhere in the text. */
function punctuationEmphasis(text: string): number {
  const exclamations = Math.min(countChar(text, '!'), VADER_MAX_EXCLAMATIONS);
  const questions = countChar(text, '?');
  const q = questions > 1 ? (questions <= 3 ? questions * VADER_QUESTION_BOOST : VADER_QUESTION_BOOST_MAX) : 0;
  return exclamations * VADER_EXCLAMATION_BOOST + q;
}
