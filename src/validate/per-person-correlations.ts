import { groupBy } from '../stats/group-by.js';
import { pearsonCorrelation } from '../stats/pearson-correlation.js';
import { quantile } from '../stats/quantile.js';
import { isNumber } from '../stats/is-number.js';
import type { AlignedPair } from './aligned-pair.js';

/** The correlation of one person's own pairs, or why there is none. */
export interface PersonCorrelation {
  person: string;
  /** Complete pairs of this person. */
  pairs: number;
  r: number | undefined;
  /** Empty when `r` is present; otherwise why not (`too_few_pairs`, `zero_variance`). */
  note: string;
}

/** Distribution of per-person correlations. */
export interface PerPersonSummary {
  persons: number;
  /** Persons with at least `minPairs` complete pairs and a defined r. */
  personsWithR: number;
  minPairs: number;
  median: number | undefined;
  q1: number | undefined;
  q3: number | undefined;
  min: number | undefined;
  max: number | undefined;
  /** Share of those persons whose r is above 0. */
  sharePositive: number | undefined;
  correlations: PersonCorrelation[];
}

/**
 * Each person's own Pearson correlation of x and y over their complete pairs (idiographic view),
 * and the distribution of those correlations: median, quartiles (type 7), range and share
 * positive, over persons with at least `minPairs` pairs (default 10, common practice; per-person r
 * from fewer pairs is dominated by noise). Persons are listed in sorted id order.
 */
export function perPersonCorrelations(pairs: Iterable<AlignedPair>, minPairs = 10): PerPersonSummary {
  const groups = groupBy(pairs, (d) => d.person);
  const correlations: PersonCorrelation[] = [];
  for (const person of [...groups.keys()].sort()) {
    const list = (groups.get(person) ?? []).filter((d) => isNumber(d.x) && isNumber(d.y));
    if (list.length < minPairs) {
      correlations.push({ person, pairs: list.length, r: undefined, note: 'too_few_pairs' });
      continue;
    }
    const result = pearsonCorrelation(list, (d) => d.x, (d) => d.y);
    correlations.push({ person, pairs: list.length, r: result.ok ? result.r : undefined, note: result.ok ? '' : result.code });
  }
  const rs = correlations.map((c) => c.r).filter(isNumber);
  return {
    persons: correlations.length,
    personsWithR: rs.length,
    minPairs,
    median: quantile(rs, 0.5),
    q1: quantile(rs, 0.25),
    q3: quantile(rs, 0.75),
    min: rs.length ? Math.min(...rs) : undefined,
    max: rs.length ? Math.max(...rs) : undefined,
    sharePositive: rs.length ? rs.filter((r) => r > 0).length / rs.length : undefined,
    correlations,
  };
}
