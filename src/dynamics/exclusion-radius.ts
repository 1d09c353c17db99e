import { addCoMoment, emptyCoMoments } from '../stats/co-moments.js';
import { spanValid } from './span-valid.js';
import type { BinnedSeries } from './types.js';

/**
 * The decorrelation time of a series in bins: the first lag k ≥ 1 at which the lag-k
 * autocorrelation (Pearson correlation of the pairs of bins k apart over observed, unbroken
 * stretches) falls below 1/e, the usual e-folding time (common practice). Returns `maxLag` when it
 * never does within `maxLag`, and the first lag with fewer than three pairs when that comes
 * first (gaps leave no longer stretches to judge by).
 */
export function decorrelationTime(series: BinnedSeries, maxLag: number): number {
  for (let k = 1; k <= maxLag; k++) {
    const m = emptyCoMoments();
    for (let t = k; t < series.values.length; t++) {
      if (spanValid(series, t - k, t)) addCoMoment(m, series.values[t - k] as number, series.values[t] as number);
    }
    if (m.n < 3) return k;
    if (!(m.sxx > 0 && m.syy > 0) || m.sxy / Math.sqrt(m.sxx * m.syy) < 1 / Math.E) return k;
  }
  return maxLag;
}

/**
 * The default exclusion radius of cross mapping and simplex forecasts (Theiler 1986, "Spurious
 * dimension from correlation integrals of short time series", Physical Review A 34:2427–2432):
 * library points closer in time than this to the predicted point are not used as neighbours, so
 * a point is not "predicted" by its own recent past. At least E·τ, the span of one embedding
 * vector, and at least the series' decorrelation time ({@link decorrelationTime}, looked for up to
 * 50 bins or a tenth of the series).
 */
export function exclusionRadius(series: BinnedSeries, E: number, tau: number): number {
  const maxLag = Math.max(1, Math.min(50, Math.floor(series.values.length / 10)));
  return Math.max(E * tau, decorrelationTime(series, maxLag));
}
