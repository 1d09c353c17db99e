import { isNumber } from './is-number.js';

/**
 * Arithmetic mean of the finite numbers in `values` (d3-array style: an optional accessor
 * `valueof(d, i)` picks the number; missing and non-finite values are skipped).
 *
 * Uses the running update m_k = m_{k-1} + (x_k − m_{k-1}) / k (Welford 1962), which does not
 * overflow on large sums. Returns `undefined` when there is no finite value.
 */
export function mean<T>(values: Iterable<T>, valueof?: (d: T, i: number) => number | undefined | null): number | undefined {
  let n = 0;
  let m = 0;
  let i = -1;
  for (const d of values) {
    const x = valueof ? valueof(d, ++i) : (d as unknown);
    if (!isNumber(x)) continue;
    n += 1;
    m += (x - m) / n;
  }
  return n > 0 ? m : undefined;
}
