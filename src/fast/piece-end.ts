/**
 * wink-nlp splits a text on runs of spaces and on runs of tabs and line breaks (its splitter
 * `([ \u00a0\u2002-\u2005\u2009\u200a\u202f\u205f]+|[\n\r\t]+)`), then tokenizes each piece on
 * its own: the output for a piece depends only on the piece. Runs of spaces become the next
 * token's preceding spaces; runs of tabs and line breaks are tokens. These are the splitter's two
 * classes (test/fast/tokenize-english.test.ts checks the memoised path equals one wink pass over
 * whole texts, every space character included).
 */
export function isSpaceChar(c: number): boolean {
  return c === 0x20 || (c >= 0xa0 && (c === 0xa0 || (c >= 0x2002 && c <= 0x2005) || c === 0x2009 || c === 0x200a || c === 0x202f || c === 0x205f));
}

/** Tabs and line breaks: wink's second class of separators (see isSpaceChar). */
export function isBreakChar(c: number): boolean {
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
