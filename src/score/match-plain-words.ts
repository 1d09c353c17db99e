import type { CompiledLexicon } from '../lexicon/compile-lexicon.js';
import { plainWords } from '../text/plain-words.js';
import type { LexiconMatch } from './match-lexicon.js';

/**
 * Matches a `plain-words` lexicon against the words of `text` as written (see plainWords): the
 * text is lower-cased in the lexicon's language, and at each word the longest term of up to
 * `plainMaxWords` words that starts there is taken, then matching resumes after it. No negation
 * and no contraction expansion (`wasn't good` is `wasn't` and `good`), which is how a word-list sum
 * such as a published AFINN score is usually computed. Writes sums and counts per category into
 * `out` (reset first; `negated` is always 0) and returns the number of words.
 */
export function matchPlainWords(text: string, lexicon: CompiledLexicon, out: LexiconMatch): number {
  out.sums.fill(0);
  out.counts.fill(0);
  out.negated = 0;
  const words = plainWords(text.toLocaleLowerCase(lexicon.language));
  const max = lexicon.plainMaxWords;
  for (let i = 0; i < words.length; ) {
    let taken = 1;
    for (let k = Math.min(max, words.length - i); k >= 1; k--) {
      const hit = lexicon.plain.get(k === 1 ? (words[i] as string) : words.slice(i, i + k).join(' '));
      if (!hit) continue;
      for (let h = 0; h < hit.categories.length; h++) {
        const c = hit.categories[h] as number;
        out.sums[c] = (out.sums[c] as number) + (hit.weights[h] as number);
        out.counts[c] = (out.counts[c] as number) + 1;
      }
      taken = k;
      break;
    }
    i += taken;
  }
  return words.length;
}
