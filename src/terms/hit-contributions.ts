import type { CompiledLexicon, Hit } from '../lexicon/compile-lexicon.js';
import { hitWeight } from '../score/hit-weight.js';

/**
 * What one hit adds to each category's score, exactly as matchLexicon scores it (hitWeight).
 * Returns `[categoryIndex, weight]` pairs.
 */
export function hitContributions(hit: Hit, negated: boolean, lexicon: CompiledLexicon): Array<[number, number]> {
  const out: Array<[number, number]> = [];
  for (let k = 0; k < hit.categories.length; k++) {
    const c = hit.categories[k] as number;
    const w = hitWeight(lexicon, c, hit.weights[k] as number, negated);
    if (w !== undefined) out.push([c, w]);
  }
  return out;
}
