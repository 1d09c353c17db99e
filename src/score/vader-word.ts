import { VADER_BOOSTERS, VADER_IDIOMS, VADER_NEGATORS } from './vader-constants.js';
import type { VaderLexicon } from './vader-types.js';

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
export const W = {
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

/** What VADER's rules need of token `w` (as written, after stripToken) with `lexicon` (see W). */
export function vaderWord(w: string, lexicon: VaderLexicon): VaderWord {
  const bits = shapeOf(w);
  const lower = bits & (UPPER | OTHER) ? w.toLowerCase() : w;
  const valence = lexicon.get(lower);
  let flags = (LOWER_FLAGS.get(lower) ?? 0) | (RAW_FLAGS.get(w) ?? 0);
  if (valence !== undefined) flags |= W.Valenced;
  if ((bits & (UPPER | LOWER)) === UPPER) flags |= W.Caps;
  if (w.includes("n't")) flags |= W.Negator;
  return { raw: w, valence: valence ?? 0, boost: flags & W.Booster ? (VADER_BOOSTERS.get(lower) as number) : 0, flags };
}
