import { isNumber } from '../../stats/is-number.js';
import { analysePair } from '../../validate/analyse-pair.js';
import type { AlignedPair } from '../../validate/aligned-pair.js';
import type { ValidationPair } from '../report-data.js';
import { shownCorrelation } from './shown-correlation.js';

/**
 * A validation entry computed from aligned pairs with the validate stage's own `analysePair`
 * (without the bootstrap, which the report does not redo): pooled, between-person and
 * within-person (repeated-measures) correlations with 95% intervals, the plain-words verdict and
 * its warnings, and the complete pairs for the scatters. Used when the folder holds aligned pairs
 * but no statistics file.
 */
export function validationFromPairs(score: string, rating: string, pairs: readonly AlignedPair[]): ValidationPair {
  const a = analysePair(pairs, { random: () => 0.5, replicates: 0 });
  const points = completePoints(pairs);
  return {
    score,
    rating,
    pairs: a.pairs,
    persons: a.persons,
    pooled: shownCorrelation(a.pooled),
    between: shownCorrelation(a.between),
    within: shownCorrelation(a.within),
    verdict: a.verdict.text,
    warnings: a.verdict.warnings.map((w) => w.message),
    points,
  };
}

/** The complete pairs (both values present) as plain points, in input order. */
export function completePoints(pairs: readonly AlignedPair[]): { person: string; x: number; y: number }[] {
  return pairs.filter((d) => isNumber(d.x) && isNumber(d.y)).map((d) => ({ person: d.person, x: d.x as number, y: d.y as number }));
}
