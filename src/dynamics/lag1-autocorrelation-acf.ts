import { notEstimable, type StatResult } from '../stats/stat-result.js';
import { moments } from '../stats/variance.js';
import type { BinnedSeries } from './types.js';
import { lagPairs } from './lag-pairs.js';

/** A lag-1 autocorrelation estimate. */
export interface Lag1Estimate {
  r: number;
  /** Valid lag pairs used. */
  pairs: number;
}

/**
 * Lag-1 autocorrelation in the ACF (time-series) form (Box & Jenkins; as R `acf`):
 *
 *   r₁ = Σ_{valid pairs} (x_t − x̄)(x_{t−1} − x̄) / Σ_{all observed t} (x_t − x̄)²
 *
 * with x̄ the mean of every observed bin. The numerator runs over valid lag pairs only (adjacent,
 * both observed); the denominator over all observed bins. Because the denominator holds n terms
 * and the numerator at most n − 1, r₁ is shrunk towards 0 relative to the Pearson form
 * ({@link lag1AutocorrelationPearson}); the difference is of order 1/n and noticeable in short
 * series, and grows when gaps remove pairs but not bins. Not estimable without a valid pair or
 * when the series is constant.
 */
export function lag1AutocorrelationAcf(series: BinnedSeries): StatResult<Lag1Estimate> {
  const pairs = lagPairs(series);
  if (pairs.length === 0) return notEstimable('no_lag_pairs', 'no two adjacent observed bins');
  const { mean, sumSquares } = moments(series.values);
  if (!(sumSquares > 0)) return notEstimable('zero_variance', 'the series is constant');
  let numerator = 0;
  for (const t of pairs) numerator += ((series.values[t] as number) - mean) * ((series.values[t - 1] as number) - mean);
  return { ok: true, r: numerator / sumSquares, pairs: pairs.length };
}
