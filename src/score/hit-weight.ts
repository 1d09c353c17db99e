import type { CompiledLexicon } from '../lexicon/compile-lexicon.js';

/**
 * What one hit adds to category `category` of a lexicon: the weight `weight`, or, when the hit is
 * negated, per the lexicon's rule — `drop`: nothing; `flip`: nothing for a `count` category (a
 * negated "worried" is not an occurrence of worry) and the reflected weight (scale low + scale
 * high − w, i.e. −w on a symmetric scale) for `rating` and `sum` categories; `ignore`: the weight.
 * Returns undefined for "nothing". The one place the negation rules live (scoring and the term
 * audit both call it).
 */
export function hitWeight(lexicon: CompiledLexicon, category: number, weight: number, negated: boolean): number | undefined {
  if (!negated || lexicon.negation === 'ignore') return weight;
  if (lexicon.negation === 'drop' || lexicon.categories[category]?.aggregation === 'count') return undefined;
  return lexicon.reflect - weight;
}
