import { pearsonCorrelation, type Correlation } from './pearson-correlation.js';
import { spearmanBrown } from './spearman-brown.js';
import type { StatResult } from './stat-result.js';

/** A split-half reliability estimate. */
export interface SplitHalfReliability {
  /** Correlation between the two half scores. */
  halfCorrelation: Correlation;
  /** Spearman–Brown corrected to full length: 2r / (1 + r). */
  reliability: number;
}

/**
 * Split-half reliability: the Pearson correlation between two half scores of the same units
 * (`aof`, `bof`, missing pairs skipped), stepped up to full length with the Spearman–Brown
 * formula 2r/(1 + r) (Spearman 1910; Brown 1910). The correction assumes parallel halves, so it
 * is never applied to a correlation ≤ 0: halves that do not agree positively measure nothing in
 * common, and a "reliability" such as 2(−0.36)/(1 − 0.36) = −1.13 would be meaningless.
 * Not estimable when the correlation is not (too few pairs, constant halves) or r ≤ 0
 * (`halves_disagree`, with r in the reason).
 */
export function splitHalfReliability<T>(
  values: Iterable<T>,
  aof: (d: T, i: number) => number | undefined | null,
  bof: (d: T, i: number) => number | undefined | null,
): StatResult<SplitHalfReliability> {
  const correlation = pearsonCorrelation(values, aof, bof);
  if (!correlation.ok) return correlation;
  const reliability = correlation.r > 0 ? spearmanBrown(correlation.r, 2) : undefined;
  if (reliability === undefined) return { ok: false, code: 'halves_disagree', reason: `the two halves do not agree (r = ${correlation.r.toFixed(3)}), so a split-half reliability is not estimable` };
  return { ok: true, halfCorrelation: correlation, reliability };
}
