import { isNumber } from '../stats/is-number.js';
import type { BinnedSeries } from './types.js';

/**
 * The bins t whose lag pair (x_{t−1}, x_t) is usable: `lagValid[t]` is true and both values are
 * observed. Every lag-based statistic of dynamics/ uses exactly these pairs.
 */
export function lagPairs(series: BinnedSeries): number[] {
  const { values, lagValid } = series;
  const out: number[] = [];
  for (let t = 1; t < values.length; t++) {
    if (lagValid[t] && isNumber(values[t]) && isNumber(values[t - 1])) out.push(t);
  }
  return out;
}
