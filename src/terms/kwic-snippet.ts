/** Left context, matched text and right context of one hit. */
export interface Snippet {
  left: string;
  match: string;
  right: string;
}

/**
 * Character offset of each token in `text` (tokens are searched in order from the end of the
 * previous one); -1 for a token not found as written (e.g. an expanded contraction piece).
 */
export function tokenOffsets(text: string, raw: readonly string[]): number[] {
  const out: number[] = [];
  let at = 0;
  for (const t of raw) {
    const i = text.indexOf(t, at);
    out.push(i);
    if (i >= 0) at = i + t.length;
  }
  return out;
}

/** Extra tokens read beyond the context before redacting, so that a phone number or address cut by the window edge is still recognised. */
const MARGIN = 8;

function offsetAt(offsets: readonly number[], i: number, fallback: number): number {
  for (let j = i; j >= 0 && j < offsets.length; j++) if ((offsets[j] as number) >= 0) return offsets[j] as number;
  return fallback;
}

/**
 * A keyword-in-context snippet cut from the original text (original spacing kept): `context`
 * tokens each side of the hit at tokens [start, start+length). Each side is redacted over a wider
 * window (context + 8 tokens) and then cut back to its last (left) or first (right) `context`
 * words, so that an e-mail, URL or phone number across the window edge is still redacted whole.
 * For languages written without spaces (`spaced` false) sides are cut back by characters.
 */
export function kwicSnippet(text: string, offsets: readonly number[], raw: readonly string[], start: number, length: number, context: number, redact: (s: string) => string, spaced = true): Snippet {
  const n = raw.length;
  const matchStart = offsetAt(offsets, start, 0);
  const last = start + length - 1;
  const lastOffset = offsets[last] as number;
  const matchEnd = lastOffset >= 0 ? lastOffset + (raw[last] as string).length : matchStart + raw.slice(start, start + length).join('').length;
  const wideLeft = offsetAt(offsets, Math.max(0, start - context - MARGIN), 0);
  const nearLeft = offsetAt(offsets, Math.max(0, start - context), matchStart);
  const afterRight = start + length + context;
  const wideRightEnd = afterRight + MARGIN >= n ? text.length : offsetAt(offsets, afterRight + MARGIN, text.length);
  const nearRightEnd = afterRight >= n ? text.length : offsetAt(offsets, afterRight, text.length);
  const leftWide = redact(text.slice(wideLeft, matchStart));
  const rightWide = redact(text.slice(matchEnd, wideRightEnd));
  let left: string;
  let right: string;
  if (spaced) {
    const lw = leftWide.trim().split(/\s+/).filter((w) => w !== '');
    const rw = rightWide.trim().split(/\s+/).filter((w) => w !== '');
    const leftCount = text.slice(nearLeft, matchStart).trim().split(/\s+/).filter((w) => w !== '').length;
    const rightCount = text.slice(matchEnd, nearRightEnd).trim().split(/\s+/).filter((w) => w !== '').length;
    left = lw.slice(Math.max(0, lw.length - leftCount)).join(' ');
    right = rw.slice(0, rightCount).join(' ');
  } else {
    left = leftWide.slice(Math.max(0, leftWide.length - (matchStart - nearLeft)));
    right = rightWide.slice(0, nearRightEnd - matchEnd);
  }
  return { left: left.replace(/\s+/g, ' '), match: text.slice(matchStart, matchEnd).replace(/\s+/g, ' '), right: right.replace(/\s+/g, ' ') };
}
