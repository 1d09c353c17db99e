import { isNumber } from './is-number.js';

/** Count, mean and sum of squared deviations of a sample (see {@link moments}). */
export interface Moments {
  n: number;
  mean: number;
  /** Σ (x − mean)², accumulated by Welford's update. */
  sumSquares: number;
}

/**
 * One-pass count, mean and sum of squared deviations by Welford's (1962) algorithm
 * (Technometrics 4:419–420): δ = x − m; m += δ/n; M2 += δ·(x − m). Missing values are skipped.
 * Returns `{ n: 0, mean: 0, sumSquares: 0 }` for no values; callers check `n`.
 */
export function moments<T>(values: Iterable<T>, valueof?: (d: T, i: number) => number | undefined | null): Moments {
  let n = 0;
  let m = 0;
  let m2 = 0;
  let i = -1;
  for (const d of values) {
    const x = valueof ? valueof(d, ++i) : (d as unknown);
    if (!isNumber(x)) continue;
    n += 1;
    const delta = x - m;
    m += delta / n;
    m2 += delta * (x - m);
  }
  return { n, mean: m, sumSquares: m2 };
}

/**
 * Unbiased sample variance s² = Σ(x − x̄)² / (n − 1), computed with Welford's one-pass update
 * (numerically stable). Missing values are skipped; returns `undefined` with fewer than two values
 * (d3-array's `variance` convention).
 */
export function variance<T>(values: Iterable<T>, valueof?: (d: T, i: number) => number | undefined | null): number | undefined {
  const { n, sumSquares } = moments(values, valueof);
  return n > 1 ? sumSquares / (n - 1) : undefined;
}
