import { addCoMoment, emptyCoMoments, type CoMoments } from './co-moments.js';
import { studentTTwoSidedP } from './distributions.js';
import { fisherInterval } from './pearson-correlation.js';
import { isNumber } from './is-number.js';
import { notEstimable, type StatResult } from './stat-result.js';

/** A repeated-measures (within-person) correlation. */
export interface RepeatedMeasuresCorrelation {
  r: number;
  /** N − k − 1, with N observations and k persons that have at least two complete pairs. */
  df: number;
  /** Complete pairs used (N). */
  n: number;
  /** Persons used (k): those with two or more complete pairs. */
  persons: number;
  /** Persons left out because they had fewer than two complete pairs. */
  personsTooFew: number;
  /** Two-sided p-value of t = r·√(df / (1 − r²)). */
  p: number;
  ciLow: number | undefined;
  ciHigh: number | undefined;
  level: number;
  /** Common within-person slope of y on x (ANCOVA slope). */
  slope: number;
}

/**
 * Repeated-measures correlation of Bakdash & Marusich (2017, Frontiers in Psychology 8:456),
 * equivalently the within-subject correlation of Bland & Altman (1995, BMJ 310:446): the
 * association of x and y within persons, from the ANCOVA y ~ person + x.
 *
 * With person-centred values, r_rm = Σ(x−x̄ᵢ)(y−ȳᵢ) / √(Σ(x−x̄ᵢ)² · Σ(y−ȳᵢ)²), the sign of the
 * common slope times √(SS_x / (SS_x + SS_residual)). df = N − k − 1. Test: t = r√(df/(1−r²)).
 * Interval as in the rmcorr package (0.8.1): tanh(atanh r ∓ z_{(1+level)/2}/√(df − 1)).
 *
 * Missing x or y are skipped; persons with fewer than two complete pairs contribute nothing and
 * are counted in `personsTooFew` (their exclusion leaves N − k − 1 unchanged). Not estimable when
 * fewer than one residual df remains or x or y never varies within a person.
 */
export function repeatedMeasuresCorrelation<T>(
  values: Iterable<T>,
  personof: (d: T, i: number) => string,
  xof: (d: T, i: number) => number | undefined | null,
  yof: (d: T, i: number) => number | undefined | null,
  options: { level?: number } = {},
): StatResult<RepeatedMeasuresCorrelation> {
  const level = options.level ?? 0.95;
  const groups = new Map<string, CoMoments>();
  let i = -1;
  for (const d of values) {
    ++i;
    const x = xof(d, i);
    const y = yof(d, i);
    if (!isNumber(x) || !isNumber(y)) continue;
    const key = personof(d, i);
    let g = groups.get(key);
    if (!g) groups.set(key, (g = emptyCoMoments()));
    addCoMoment(g, x, y);
  }
  let n = 0;
  let k = 0;
  let tooFew = 0;
  let sxx = 0;
  let syy = 0;
  let sxy = 0;
  for (const g of groups.values()) {
    if (g.n < 2) {
      tooFew += 1;
      continue;
    }
    n += g.n;
    k += 1;
    sxx += g.sxx;
    syy += g.syy;
    sxy += g.sxy;
  }
  const df = n - k - 1;
  if (k === 0) return notEstimable('too_few_pairs', 'no person has two or more complete pairs, so there is no within-person variation to correlate');
  if (df < 1) return notEstimable('too_few_pairs', `the within-person correlation needs N − k − 1 ≥ 1; here N = ${n} pairs from k = ${k} persons`);
  if (!(sxx > 0)) return notEstimable('zero_variance', 'the first variable never varies within a person');
  if (!(syy > 0)) return notEstimable('zero_variance', 'the second variable never varies within a person');
  const r = Math.max(-1, Math.min(1, sxy / Math.sqrt(sxx * syy)));
  const p = Math.abs(r) === 1 ? 0 : studentTTwoSidedP(r * Math.sqrt(df / (1 - r * r)), df);
  const [ciLow, ciHigh] = fisherInterval(r, df - 1, level);
  return { ok: true, r, df, n, persons: k, personsTooFew: tooFew, p, ciLow, ciHigh, level, slope: sxy / sxx };
}
