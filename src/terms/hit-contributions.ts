import type { CompiledLexicon, Hit } from '../lexicon/compile-lexicon.js';

/**
 * What one hit adds to each category's score, exactly as matchLexicon scores it: nothing when
 * negated under `drop`; under `flip`, nothing for `count` categories and the reflected weight
 * (scale low + scale high − w) for the others; the weight otherwise.
 * Returns `[categoryIndex, weight]` pairs.
 */
export function hitContributions(hit: Hit, negated: boolean, lexicon: CompiledLexicon): Array<[number, number]> {
  if (negated && lexicon.negation === 'drop') return [];
  const out: Array<[number, number]> = [];
  for (let k = 0; k < hit.categories.length; k++) {
    const c = hit.categories[k] as number;
    let w = hit.weights[k] as number;
    if (negated && lexicon.negation === 'flip') {
      if (lexicon.categories[c]?.aggregation === 'count') continue;
      w = lexicon.reflect - w;
    }
    out.push([c, w]);
  }
  return out;
}
