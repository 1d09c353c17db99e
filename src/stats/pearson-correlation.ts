import { normalQuantile, studentTTwoSidedP } from './distributions.js';
import { addCoMoment, emptyCoMoments } from './co-moments.js';
import { isNumber } from './is-number.js';
import { notEstimable, type StatResult } from './stat-result.js';

/** A Pearson correlation with its test and confidence interval. */
export interface Correlation {
  r: number;
  /** Complete pairs used. */
  n: number;
  /** n − 2. */
  df: number;
  /** Two-sided p-value of t = r·√(df / (1 − r²)). */
  p: number;
  /** Fisher-z interval tanh(atanh(r) ∓ z_{(1+level)/2} / √(n − 3)); absent when n ≤ 3. */
  ciLow: number | undefined;
  ciHigh: number | undefined;
  level: number;
}

/** Options of {@link pearsonCorrelation}. */
export interface CorrelationOptions {
  /** Confidence level of the interval (default 0.95). */
  level?: number;
}

/**
 * Pearson's product-moment correlation of the pairs in `values`, skipping pairs where either
 * value is missing. By default each element is a `[x, y]` tuple; `xof`/`yof` pick the numbers
 * otherwise.
 *
 * r = Sxy / √(Sxx·Syy), with co-moments accumulated in one pass by Welford's update
 * (numerically stable). Test: t = r√((n−2)/(1−r²)) on n − 2 df. Interval: Fisher (1915)
 * z-transformation, tanh(atanh r ∓ z_{1−α/2}/√(n−3)).
 *
 * Not estimable with fewer than 3 pairs (`too_few_pairs`) or when either variable is constant
 * (`zero_variance`).
 */
export function pearsonCorrelation<T = readonly [number | undefined, number | undefined]>(
  values: Iterable<T>,
  xof: (d: T, i: number) => number | undefined | null = (d) => (d as unknown as [number, number])[0],
  yof: (d: T, i: number) => number | undefined | null = (d) => (d as unknown as [number, number])[1],
  options: CorrelationOptions = {},
): StatResult<Correlation> {
  const level = options.level ?? 0.95;
  const m = emptyCoMoments();
  let i = -1;
  for (const d of values) {
    ++i;
    const x = xof(d, i);
    const y = yof(d, i);
    if (isNumber(x) && isNumber(y)) addCoMoment(m, x, y);
  }
  return correlationFromMoments(m.n, m.sxx, m.syy, m.sxy, level);
}

/**
 * The correlation, test and Fisher-z interval from sums of squares and co-products
 * (shared by {@link pearsonCorrelation} and callers that accumulate moments themselves).
 */
export function correlationFromMoments(n: number, sxx: number, syy: number, sxy: number, level = 0.95): StatResult<Correlation> {
  if (n < 3) return notEstimable('too_few_pairs', `a correlation needs at least 3 complete pairs; there ${n === 1 ? 'is' : 'are'} ${n}`);
  const scale = Math.max(sxx, syy, 1e-300);
  if (sxx <= 1e-14 * scale || sxx <= 0) return notEstimable('zero_variance', 'the first variable does not vary, so no correlation can be computed');
  if (syy <= 1e-14 * scale || syy <= 0) return notEstimable('zero_variance', 'the second variable does not vary, so no correlation can be computed');
  const r = Math.max(-1, Math.min(1, sxy / Math.sqrt(sxx * syy)));
  const df = n - 2;
  const p = Math.abs(r) === 1 ? 0 : studentTTwoSidedP(r * Math.sqrt(df / (1 - r * r)), df);
  const [ciLow, ciHigh] = fisherInterval(r, n - 3, level);
  return { ok: true, r, n, df, p, ciLow, ciHigh, level };
}

/**
 * Fisher-z interval tanh(atanh r ∓ z_{(1+level)/2}/√m) for a correlation whose z has
 * variance 1/m (m = n − 3 for Pearson; df − 1 for the repeated-measures correlation).
 * Returns `[undefined, undefined]` when m ≤ 0.
 */
export function fisherInterval(r: number, m: number, level = 0.95): [number | undefined, number | undefined] {
  if (!(m > 0)) return [undefined, undefined];
  if (Math.abs(r) >= 1) return [r, r];
  const z = Math.atanh(r);
  const half = normalQuantile((1 + level) / 2) / Math.sqrt(m);
  return [Math.tanh(z - half), Math.tanh(z + half)];
}
