import { applyVaderRules } from './apply-vader-rules.js';
import type { VaderLexicon, VaderScores } from './vader-types.js';
import { vaderTokens } from './vader-tokens.js';
import { vaderWord } from './vader-word.js';

export type { VaderLexicon, VaderScores } from './vader-types.js';

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
  const words = vaderTokens(text).map((token) => vaderWord(token, lexicon));
  return applyVaderRules(words, words.length, text);
}
