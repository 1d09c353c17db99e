import { isNumber } from './is-number.js';

/**
 * The p-quantile of the finite numbers in `values` by linear interpolation between order
 * statistics (Hyndman & Fan 1996 type 7, the default of R `quantile` and d3-array `quantile`).
 * Missing values are skipped; returns `undefined` when there are none or p is outside [0, 1].
 */
export function quantile<T>(values: Iterable<T>, p: number, valueof?: (d: T, i: number) => number | undefined | null): number | undefined {
  if (!(p >= 0 && p <= 1)) return undefined;
  const sorted: number[] = [];
  let i = -1;
  for (const d of values) {
    const x = valueof ? valueof(d, ++i) : (d as unknown);
    if (isNumber(x)) sorted.push(x);
  }
  if (sorted.length === 0) return undefined;
  sorted.sort((a, b) => a - b);
  const h = (sorted.length - 1) * p;
  const lo = Math.floor(h);
  const a = sorted[lo] as number;
  const b = sorted[Math.min(lo + 1, sorted.length - 1)] as number;
  return a + (h - lo) * (b - a);
}
