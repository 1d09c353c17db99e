import type { CompiledLexicon, Hit, Phrase } from '../lexicon/compile-lexicon.js';
import { MIN_WILDCARD_STEM } from '../lexicon/parse-lexicon.js';
import { tokenGeneration } from '../fast/tokenize-english.js';
import { TokenKind, type Tokens } from '../text/tokens.js';
import { hitWeight } from './hit-weight.js';

/** Per-category totals of one lexicon over one entry. */
export interface LexiconMatch {
  /** Sum of (possibly flipped) weights per category. */
  sums: Float64Array;
  /** Matched terms per category. */
  counts: Int32Array;
  /** Hits preceded by a negator within the window (flipped, dropped or left as they were). */
  negated: number;
}

/** Called for each hit (for audits and keyword-in-context); not used on the scoring hot path. */
export type HitListener = (hit: Hit, start: number, length: number, negated: boolean) => void;

function isNegated(tokens: Tokens, at: number, lexicon: CompiledLexicon): boolean {
  const stop = Math.max(0, at - lexicon.window);
  for (let j = at - 1; j >= stop; j--) {
    if (tokens.kind[j] === TokenKind.Punct) return false;
    if (lexicon.negators.has(tokens.norm[j] as string)) return true;
  }
  return false;
}

type Start = NonNullable<ReturnType<CompiledLexicon['starts']['get']>>;

/** What a lexicon holds for one token text: patterns starting with it, and its wildcard hit. */
interface Answer {
  start: Start | undefined;
  wild: Hit | null;
}

const NO_ANSWER: Answer = { start: undefined, wild: null };

function answerFor(token: string, lexicon: CompiledLexicon): Answer {
  const start = lexicon.starts.get(token);
  const wild = lexicon.stemLengths.length === 0 || token.length < MIN_WILDCARD_STEM ? null : wildcardHit(token, lexicon);
  return start === undefined && wild === null ? NO_ANSWER : { start, wild };
}

/**
 * Per lexicon, what it holds for each token id of the current generation (see Tokens.ids):
 * `state[id]` is UNKNOWN, NOTHING (most tokens: no pattern starts with it and no wildcard takes
 * it) or SOMETHING, with the Answer in `answers[id]`. The states are one byte per id, so the
 * common "nothing here" is read from a small table that stays in the processor's cache instead
 * of an array of pointers the size of the vocabulary.
 */
interface Answers {
  generation: number;
  state: Uint8Array;
  answers: Array<Answer | undefined>;
}

const UNKNOWN = 0;
const NOTHING = 1;
const SOMETHING = 2;

const answersByLexicon = new WeakMap<CompiledLexicon, Answers>();

function answersOf(lexicon: CompiledLexicon, generation: number): Answers {
  let entry = answersByLexicon.get(lexicon);
  if (entry === undefined || entry.generation !== generation) {
    entry = { generation, state: new Uint8Array(1024), answers: [] };
    answersByLexicon.set(lexicon, entry);
  }
  return entry;
}

/** The Answer for token `i` (by its id when `known` is given), or undefined when the lexicon holds nothing for it. */
function answerAt(tokens: Tokens, i: number, lexicon: CompiledLexicon, known: Answers | undefined): Answer | undefined {
  if (known === undefined) {
    const answer = answerFor(tokens.norm[i] as string, lexicon);
    return answer === NO_ANSWER ? undefined : answer;
  }
  const id = (tokens.ids as number[])[i] as number;
  if (id >= known.state.length) {
    const grown = new Uint8Array(Math.max(2 * known.state.length, id + 1));
    grown.set(known.state);
    known.state = grown;
  }
  const state = known.state[id];
  if (state === NOTHING) return undefined;
  if (state === SOMETHING) return known.answers[id];
  const answer = answerFor(tokens.norm[i] as string, lexicon);
  if (answer === NO_ANSWER) {
    known.state[id] = NOTHING;
    return undefined;
  }
  known.state[id] = SOMETHING;
  known.answers[id] = answer;
  return answer;
}

/** The hit at token `i`, or undefined: a Phrase covers its tokens, any other hit one token (see hitLength). */
function findHit(tokens: Tokens, i: number, lexicon: CompiledLexicon, known: Answers | undefined): Hit | undefined {
  const answer = answerAt(tokens, i, lexicon, known);
  if (answer === undefined) return undefined;
  const start = answer.start;
  if (start) {
    if (start.phrases) {
      for (const phrase of start.phrases) {
        const n = phrase.tokens.length;
        if (i + n > (tokens.size ?? tokens.norm.length)) continue;
        let ok = true;
        for (let k = 1; k < n; k++) {
          if (tokens.norm[i + k] !== phrase.tokens[k]) {
            ok = false;
            break;
          }
        }
        if (ok) return phrase;
      }
    }
    if (start.exact) return start.exact;
  }
  return answer.wild ?? undefined;
}

/** Tokens a hit covers: a phrase's tokens, else one. */
function hitLength(hit: Hit): number {
  return (hit as Partial<Phrase>).tokens?.length ?? 1;
}

/** The wildcard with the longest stem that `token` starts with, or null. */
function wildcardHit(token: string, lexicon: CompiledLexicon): Hit | null {
  // Most tokens match no wildcard: one look-up of their first three characters rules that out
  // before a substring is cut for every stem length.
  if (!lexicon.stemPrefixes.has(token.slice(0, MIN_WILDCARD_STEM))) return null;
  for (const len of lexicon.stemLengths) {
    if (token.length < len) continue;
    const wild = lexicon.wildcards.get(token.slice(0, len));
    if (wild) return wild;
  }
  return null;
}


/**
 * Matches one lexicon against an entry's tokens.
 *
 * At each position the longest pattern wins (phrase, then exact word, then the wildcard with the
 * longest stem), and the tokens it covers are consumed, so no token is ever counted twice.
 * A hit is negated when a negator occurs within `window` tokens before it, stopping at
 * punctuation. Negation rules: `flip` maps each weight w to (scale low + scale high) − w
 * (−w on a symmetric scale) for `rating` and `sum` categories and drops the hit from `count`
 * categories (a negated "worried" is not an occurrence of worry); `drop` removes the hit;
 * `ignore` scores it as written. Negated hits are counted either way.
 *
 * `into`, when given, is overwritten and returned instead of a new result (the scoring loop
 * reuses one per lexicon rather than allocating two typed arrays per entry).
 */
export function matchLexicon(tokens: Tokens, lexicon: CompiledLexicon, onHit?: HitListener, into?: LexiconMatch): LexiconMatch {
  const nc = lexicon.categories.length;
  let sums: Float64Array;
  let counts: Int32Array;
  if (into !== undefined && into.sums.length === nc) {
    sums = into.sums;
    counts = into.counts;
    sums.fill(0);
    counts.fill(0);
  } else {
    sums = new Float64Array(nc);
    counts = new Int32Array(nc);
  }
  let negated = 0;
  const n = tokens.size ?? tokens.norm.length;
  const hasNegation = lexicon.negation !== 'ignore' || lexicon.window > 0;
  // Answers by token id when the tokens carry ids of the current generation; else by text.
  const known = tokens.ids !== undefined && tokens.generation === tokenGeneration() ? answersOf(lexicon, tokens.generation) : undefined;
  let i = 0;
  while (i < n) {
    if (tokens.kind[i] === TokenKind.Punct) {
      i++;
      continue;
    }
    const hit = findHit(tokens, i, lexicon, known);
    if (!hit) {
      i++;
      continue;
    }
    const length = hitLength(hit);
    const neg = hasNegation && isNegated(tokens, i, lexicon);
    onHit?.(hit, i, length, neg);
    if (neg) negated++;
    for (let k = 0; k < hit.categories.length; k++) {
      const c = hit.categories[k] as number;
      const w = hitWeight(lexicon, c, hit.weights[k] as number, neg);
      if (w === undefined) continue;
      sums[c] = (sums[c] as number) + w;
      counts[c] = (counts[c] as number) + 1;
    }
    i += length;
  }
  if (into === undefined) return { sums, counts, negated };
  into.sums = sums;
  into.counts = counts;
  into.negated = negated;
  return into;
}
