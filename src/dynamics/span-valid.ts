import { isNumber } from '../stats/is-number.js';
import type { BinnedSeries } from './types.js';

/**
 * True when every bin from `from` to `to` (inclusive) is observed and each step between them is a
 * valid lag (`lagValid[s]` for from < s ≤ to): the stretch has no missing bin and no break.
 */
export function spanValid(series: BinnedSeries, from: number, to: number): boolean {
  if (from < 0 || to >= series.values.length || from > to) return false;
  if (!isNumber(series.values[from])) return false;
  for (let s = from + 1; s <= to; s++) if (!series.lagValid[s] || !isNumber(series.values[s])) return false;
  return true;
}
