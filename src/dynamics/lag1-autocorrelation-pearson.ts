import { pearsonCorrelation } from '../stats/pearson-correlation.js';
import { notEstimable, type StatResult } from '../stats/stat-result.js';
import type { BinnedSeries } from './types.js';
import { lagPairs } from './lag-pairs.js';
import type { Lag1Estimate } from './lag1-autocorrelation-acf.js';

/**
 * Lag-1 autocorrelation as the Pearson correlation of the valid lag pairs (x_{t−1}, x_t):
 * each side is centred on its own mean over the pairs and scaled by its own SD, so the estimate
 * is not shrunk by the n versus n − 1 terms of the ACF form ({@link lag1AutocorrelationAcf}).
 * It equals the OLS slope of the standardized AR(1) regression. Not estimable with fewer than
 * 3 pairs or when either side is constant.
 */
export function lag1AutocorrelationPearson(series: BinnedSeries): StatResult<Lag1Estimate> {
  const pairs = lagPairs(series);
  const result = pearsonCorrelation(pairs, (t) => series.values[t - 1], (t) => series.values[t]);
  if (!result.ok) return pairs.length < 3 ? notEstimable('too_few_lag_pairs', `only ${pairs.length} valid lag pairs; at least 3 are needed`) : result;
  return { ok: true, r: result.r, pairs: result.n };
}
