/** Text folded for name matching, with the position in the original text of every folded character. */
export interface FoldedText {
  folded: string;
  /** `at[k]` is the index in the original text of folded code unit k; `at[folded.length]` is the text's length. */
  at: ArrayLike<number>;
}

const SPACE = /[\s\u00a0\u202f\u2000-\u200b\u2028\u2029\u3000]/u;
/** Right and left single quotation marks, modifier letter apostrophe, prime, acute accent, fullwidth apostrophe (and the grave accent `). */
const APOSTROPHE = /[\u2018\u2019\u201b\u02bc\u2032\u00b4\uff07]/u;
const MARK = /\p{M}/gu;
const utf16 = new TextDecoder('utf-16le');
/** Folded forms of non-ASCII characters met so far (a text holds few distinct ones). */
const cache = new Map<string, string>();

function foldCharacter(ch: string): string {
  let folded = cache.get(ch);
  if (folded === undefined) {
    folded = SPACE.test(ch) ? ' ' : APOSTROPHE.test(ch) ? "'" : ch.normalize('NFD').replace(MARK, '');
    if (cache.size < 4096) cache.set(ch, folded);
  }
  return folded;
}

/**
 * Folds text so that names match however they are typed: letters lose their accents (Unicode
 * canonical decomposition, NFD, with the combining marks removed: `Zoë` → `Zoe`), curly and other
 * apostrophes become `'`, and every run of white space or line breaks becomes one space. Case is
 * left to the matcher. Returns where each folded code unit came from, so that a match in the
 * folded text can be mapped back to the original. Linear in the text's length.
 */
export function foldForNames(text: string): FoldedText {
  // NFD without marks yields at most 3 code units per code unit (Hangul syllables: 3 jamo)
  const buffer = new Uint16Array(text.length * 3);
  const at = new Int32Array(text.length * 3 + 1);
  let k = 0;
  let space = false;
  for (let i = 0; i < text.length; ) {
    const c = text.charCodeAt(i);
    if (c < 0x80) {
      if (c === 0x20 || (c >= 0x09 && c <= 0x0d)) {
        if (!space) {
          buffer[k] = 0x20;
          at[k++] = i;
        }
        space = true;
      } else {
        buffer[k] = c === 0x60 ? 0x27 : c;
        at[k++] = i;
        space = false;
      }
      i++;
      continue;
    }
    const width = c >= 0xd800 && c <= 0xdbff && i + 1 < text.length ? 2 : 1;
    const folded = foldCharacter(text.slice(i, i + width));
    if (folded === ' ') {
      if (!space) {
        buffer[k] = 0x20;
        at[k++] = i;
      }
      space = true;
    } else if (folded !== '') {
      for (let u = 0; u < folded.length; u++) {
        buffer[k] = folded.charCodeAt(u);
        at[k++] = i;
      }
      space = false;
    }
    i += width;
  }
  at[k] = text.length;
  return { folded: utf16.decode(buffer.subarray(0, k)), at: at.subarray(0, k + 1) };
}
