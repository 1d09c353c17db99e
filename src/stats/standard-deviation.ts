import { variance } from './variance.js';

/**
 * Sample standard deviation √s² (n − 1 denominator), skipping missing values.
 * Returns `undefined` with fewer than two values.
 */
export function standardDeviation<T>(values: Iterable<T>, valueof?: (d: T, i: number) => number | undefined | null): number | undefined {
  const v = variance(values, valueof);
  return v === undefined ? undefined : Math.sqrt(v);
}
