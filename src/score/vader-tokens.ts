import { VADER_STRIPPABLE_PUNCTUATION } from './vader-constants.js';

/** Whitespace as matched by a JavaScript `\s` (the reference splits text on it). */
export function isSpace(c: number): boolean {
  if (c <= 0x20) return c === 0x20 || (c >= 0x09 && c <= 0x0d);
  if (c < 0xa0) return false;
  return (
    c === 0xa0 || c === 0x1680 || (c >= 0x2000 && c <= 0x200a) || c === 0x2028 || c === 0x2029 ||
    c === 0x202f || c === 0x205f || c === 0x3000 || c === 0xfeff
  );
}

/** ASCII punctuation, the characters of Python's `string.punctuation`. */
function isPunctuation(c: number): boolean {
  return (c >= 0x21 && c <= 0x2f) || (c >= 0x3a && c <= 0x40) || (c >= 0x5b && c <= 0x60) || (c >= 0x7b && c <= 0x7e);
}

/**
 * Strip one run of punctuation from the start or the end of a token, the way
 * the reference implementation does: only when the run is one of
 * {@link VADER_STRIPPABLE_PUNCTUATION}, sits on one side only, and what is left
 * is at least 2 characters with no punctuation inside ("funny." → "funny",
 * "(funny)" and "don't," stay as they are, emoticons such as ":)" stay whole).
 */
export function stripToken(token: string): string {
  const n = token.length;
  let lead = 0;
  while (lead < n && isPunctuation(token.charCodeAt(lead))) lead++;
  if (lead === n) return token;
  let trail = 0;
  while (isPunctuation(token.charCodeAt(n - 1 - trail))) trail++;
  if ((lead === 0) === (trail === 0)) return token;
  const start = lead;
  const end = n - trail;
  if (end - start < 2) return token;
  for (let k = start + 1; k < end - 1; k++) if (isPunctuation(token.charCodeAt(k))) return token;
  const run = lead > 0 ? token.slice(0, lead) : token.slice(end);
  return VADER_STRIPPABLE_PUNCTUATION.has(run) ? token.slice(start, end) : token;
}

/**
 * VADER's tokens of a text: split on whitespace, drop tokens of one UTF-16
 * code unit or fewer (the reference drops "a", "I" and lone punctuation),
 * then strip leading or trailing punctuation as described at `stripToken`.
 *
 * This is the tokenisation of the VADER reference implementation
 * (Hutto & Gilbert 2014, `vaderSentiment.py`, the release ported by the npm
 * package `vader-sentiment` 1.1.3), computed token by token instead of through
 * a table of every punctuation-word pair. It is specific to VADER and separate
 * from lexichron's word tokens.
 *
 * @param text - the text of one entry
 * @returns the tokens in order, possibly empty
 */
export function vaderTokens(text: string): string[] {
  const out: string[] = [];
  const n = text.length;
  let start = 0;
  for (let k = 0; k <= n; k++) {
    if (k === n || isSpace(text.charCodeAt(k))) {
      if (k - start > 1) out.push(stripToken(text.slice(start, k)));
      start = k + 1;
    }
  }
  return out;
}
