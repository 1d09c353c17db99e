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
  VADER_NEVER_SO_FAR,
  VADER_NEVER_SO_NEAR,
  VADER_NORMALISATION_ALPHA,
  VADER_QUESTION_BOOST,
  VADER_QUESTION_BOOST_MAX,
} from './vader-constants.js';
import type { VaderScores } from './vader-types.js';
import { W, type VaderWord } from './vader-word.js';

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
 * VADER's scores of a text from its tokens (the first `n` of `words`, each worked out by
 * vaderWord) and the text itself (for its ! and ?): the rules of scoreVader
 * (src/score/score-vader.ts), in the order of the reference implementation.
 */
export function applyVaderRules(words: readonly VaderWord[], n: number, text: string): VaderScores {
  if (n === 0) return { compound: 0, pos: 0, neu: 0, neg: 0, tokens: 0, matched: 0 };
  const sentiments = new Array<number>(n).fill(0);
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
