import { notEstimable, type StatResult } from '../stats/stat-result.js';
import { isNumber } from '../stats/is-number.js';
import type { BinnedSeries } from './types.js';

/** Mean square successive difference and its root. */
export interface Mssd {
  /** MSSD = Σ (x_t − x_{t−1})² / n_pairs over valid successive pairs. */
  mssd: number;
  /** RMSSD = √MSSD, in the units of the series. */
  rmssd: number;
  /** Valid successive pairs used. */
  pairs: number;
}

/**
 * Mean square successive difference (von Neumann, Kent, Bellinson & Hart 1941, Ann. Math.
 * Statist. 12:153–162) and its root, the instability index of Jahng, Wood & Trull (2008,
 * Psychological Methods 13:354–375):
 *
 *   MSSD = (1 / m) Σ_{t: lagValid[t], x_t and x_{t−1} observed} (x_t − x_{t−1})²,   RMSSD = √MSSD
 *
 * Only valid successive pairs count: a difference is never taken across a missing bin or across
 * a break (excluded hours), so gaps do not inflate instability. With no gaps this equals
 * R `psych::mssd` (mean of `diff(x)^2`). Not estimable without at least one valid pair.
 */
export function mssd(series: BinnedSeries): StatResult<Mssd> {
  const { values, lagValid } = series;
  let pairs = 0;
  let mean = 0;
  for (let t = 1; t < values.length; t++) {
    const x = values[t];
    const previous = values[t - 1];
    if (!lagValid[t] || !isNumber(x) || !isNumber(previous)) continue;
    const d = x - previous;
    pairs += 1;
    mean += (d * d - mean) / pairs;
  }
  if (pairs === 0) return notEstimable('no_lag_pairs', 'no two adjacent observed bins, so there is no successive difference');
  return { ok: true, mssd: mean, rmssd: Math.sqrt(mean), pairs };
}
