/** A word as written: letters and digits, joined by inner apostrophes or hyphens. */
const WORD = /[\p{L}\p{N}]+(?:['-][\p{L}\p{N}]+)*/gu;

/**
 * The words of a text as written, for plain word-list sums: the text with ’ read as ', split
 * into runs of letters and digits that may be joined by an inner apostrophe or hyphen (`can't`,
 * `well-being`, `gr8`). Nothing is expanded, stemmed or dropped; case is kept (lower-case the
 * text first to match a lower-case word list).
 */
export function plainWords(text: string): string[] {
  return text.replace(/’/g, "'").match(WORD) ?? [];
}
