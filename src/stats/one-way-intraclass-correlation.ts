import { fUpperTail } from './distributions.js';
import { isNumber } from './is-number.js';
import { notEstimable, type StatResult } from './stat-result.js';

/** One-way intraclass correlation of repeated observations nested in groups (persons). */
export interface OneWayIntraclassCorrelation {
  /** ICC(1): share of variance between groups, (MSb − MSw) / (MSb + (n₀ − 1)·MSw). May be negative. */
  icc1: number;
  /** ICC(1,k) with k = n₀: reliability of a group mean, (MSb − MSw) / MSb. */
  icc1k: number;
  /** Mean squares between and within groups. */
  msBetween: number;
  msWithin: number;
  /** F = MSb / MSw on (groups − 1, N − groups) df and its p-value. */
  f: number;
  df1: number;
  df2: number;
  p: number;
  /** Average group size adjusted for imbalance, n₀ = (N − Σnᵢ²/N) / (groups − 1) (or N/g, see options). */
  n0: number;
  groups: number;
  n: number;
}

/**
 * One-way random-effects ICC(1) and ICC(1,k) for unbalanced groups (Shrout & Fleiss 1979 case 1,
 * with the ANOVA estimator's average group size n₀ for unbalanced groups, Snedecor & Cochran,
 * Statistical Methods, §10.14; equal to R psych::statsBy `ICC1`/`ICC2` for balanced groups).
 *
 * MSb = Σnᵢ(ȳᵢ − ȳ)²/(g − 1), MSw = ΣΣ(y − ȳᵢ)²/(N − g) (two-pass, around group means),
 * ICC(1) = (MSb − MSw)/(MSb + (n₀ − 1)MSw), ICC(1,k) = (MSb − MSw)/MSb.
 * (R psych::statsBy uses the plain mean group size N/g instead of n₀: identical for balanced
 * groups.) Missing values are skipped. Not estimable with fewer than 2 groups, no within-group
 * replication, or no variation at all.
 */
export function oneWayIntraclassCorrelation<T>(
  values: Iterable<T>,
  groupof: (d: T, i: number) => string,
  valueof: (d: T, i: number) => number | undefined | null,
): StatResult<OneWayIntraclassCorrelation> {
  const groups = new Map<string, number[]>();
  let i = -1;
  for (const d of values) {
    ++i;
    const y = valueof(d, i);
    if (!isNumber(y)) continue;
    const key = groupof(d, i);
    const list = groups.get(key);
    if (list) list.push(y);
    else groups.set(key, [y]);
  }
  const g = groups.size;
  let n = 0;
  let sumSquaredSizes = 0;
  let grand = 0;
  const means: [number, number][] = [];
  for (const list of groups.values()) {
    let m = 0;
    list.forEach((y, j) => (m += (y - m) / (j + 1)));
    means.push([list.length, m]);
    n += list.length;
    sumSquaredSizes += list.length ** 2;
    grand += list.length * m;
  }
  if (g < 2) return notEstimable('too_few_persons', `an intraclass correlation needs at least 2 persons; there ${g === 1 ? 'is' : 'are'} ${g}`);
  if (n - g < 1) return notEstimable('too_few_observations', 'every person has a single observation, so within-person variance cannot be estimated');
  grand /= n;
  let ssBetween = 0;
  for (const [size, m] of means) ssBetween += size * (m - grand) ** 2;
  let ssWithin = 0;
  let j = 0;
  for (const list of groups.values()) {
    const m = (means[j++] as [number, number])[1];
    for (const y of list) ssWithin += (y - m) ** 2;
  }
  const df1 = g - 1;
  const df2 = n - g;
  const msBetween = ssBetween / df1;
  const msWithin = ssWithin / df2;
  if (!(msBetween > 0) && !(msWithin > 0)) return notEstimable('zero_variance', 'the variable is constant, so no intraclass correlation can be computed');
  const n0 = (n - sumSquaredSizes / n) / df1;
  const f = msWithin > 0 ? msBetween / msWithin : Infinity;
  const p = Number.isFinite(f) ? fUpperTail(f, df1, df2) : 0;
  const icc1 = (msBetween - msWithin) / (msBetween + (n0 - 1) * msWithin);
  const icc1k = msBetween > 0 ? (msBetween - msWithin) / msBetween : -Infinity;
  if (!Number.isFinite(icc1k)) return notEstimable('zero_variance', 'the person means do not differ at all, so the reliability of a person mean is not defined');
  return { ok: true, icc1, icc1k, msBetween, msWithin, f, df1, df2, p, n0, groups: g, n };
}
