import { fQuantile, fUpperTail } from './distributions.js';
import { isNumber } from './is-number.js';
import { notEstimable, type StatResult } from './stat-result.js';

/** One Shrout–Fleiss intraclass correlation form with its F test. */
export interface IccForm {
  value: number;
  /** F statistic of the test that the ICC is 0, with its degrees of freedom and p-value. */
  f: number;
  df1: number;
  df2: number;
  p: number;
  /** Confidence interval (Shrout & Fleiss 1979, p. 425: F-based for cases 1 and 3, Satterthwaite for case 2; k forms by Spearman–Brown for case 2). */
  ciLow: number | undefined;
  ciHigh: number | undefined;
}

/** The six Shrout–Fleiss (1979) intraclass correlations of a targets × raters table. */
export interface IntraclassCorrelations {
  /** ICC(1,1): one-way random, single rating. */
  icc1: IccForm;
  /** ICC(2,1): two-way random, absolute agreement, single rating. */
  icc2: IccForm;
  /** ICC(3,1): two-way mixed, consistency, single rating. */
  icc3: IccForm;
  /** ICC(1,k): one-way random, mean of k ratings. */
  icc1k: IccForm;
  /** ICC(2,k): two-way random, mean of k ratings. */
  icc2k: IccForm;
  /** ICC(3,k): two-way mixed, mean of k ratings. */
  icc3k: IccForm;
  /** Mean squares: between targets, within targets, between raters, residual. */
  bms: number;
  wms: number;
  jms: number;
  ems: number;
  /** Complete targets used (n) and raters (k). */
  targets: number;
  raters: number;
  /** Targets left out because a rating was missing. */
  incomplete: number;
  level: number;
}

/**
 * Intraclass correlations of Shrout & Fleiss (1979, Psychological Bulletin 86:420–428) from a
 * complete targets × raters matrix (`rows[i][j]` = rating of target i by rater j; rows with a
 * missing rating are left out and counted). With n targets, k raters and the two-way ANOVA mean
 * squares BMS (targets), WMS (within targets), JMS (raters), EMS (residual):
 *
 * - ICC(1,1) = (BMS − WMS) / (BMS + (k−1)WMS);       ICC(1,k) = (BMS − WMS) / BMS
 * - ICC(2,1) = (BMS − EMS) / (BMS + (k−1)EMS + k(JMS − EMS)/n); ICC(2,k) = (BMS − EMS) / (BMS + (JMS − EMS)/n)
 * - ICC(3,1) = (BMS − EMS) / (BMS + (k−1)EMS);       ICC(3,k) = (BMS − EMS) / BMS
 *
 * F tests as in R psych::ICC (F = BMS/WMS for case 1, BMS/EMS for cases 2 and 3); intervals for
 * cases 1 and 3 from the F distribution, for case 2 by Satterthwaite's approximation (Shrout &
 * Fleiss 1979, p. 425; as psych::ICC).
 */
export function intraclassCorrelation(rows: Iterable<readonly (number | undefined | null)[]>, options: { level?: number } = {}): StatResult<IntraclassCorrelations> {
  const level = options.level ?? 0.95;
  const complete: number[][] = [];
  let incomplete = 0;
  let k = -1;
  for (const row of rows) {
    if (k < 0) k = row.length;
    if (row.length !== k || !row.every(isNumber)) incomplete += 1;
    else complete.push(row as number[]);
  }
  const n = complete.length;
  if (k < 2) return notEstimable('too_few_raters', 'intraclass correlations need at least two ratings per target');
  if (n < 2) return notEstimable('too_few_targets', `intraclass correlations need at least two complete targets; there are ${n}`);
  // Two-pass sums of squares around the grand, row and column means.
  let grand = 0;
  for (const row of complete) for (const x of row) grand += x;
  grand /= n * k;
  const rowMeans = complete.map((row) => row.reduce((s, x) => s + x, 0) / k);
  const colMeans = Array.from({ length: k }, (_, j) => complete.reduce((s, row) => s + (row[j] as number), 0) / n);
  let ssRows = 0;
  for (const m of rowMeans) ssRows += k * (m - grand) ** 2;
  let ssCols = 0;
  for (const m of colMeans) ssCols += n * (m - grand) ** 2;
  let ssWithin = 0;
  let ssResidual = 0;
  complete.forEach((row, i) => {
    row.forEach((x, j) => {
      ssWithin += (x - (rowMeans[i] as number)) ** 2;
      ssResidual += (x - (rowMeans[i] as number) - (colMeans[j] as number) + grand) ** 2;
    });
  });
  const bms = ssRows / (n - 1);
  const wms = ssWithin / (n * (k - 1));
  const jms = ssCols / (k - 1);
  const ems = ssResidual / ((n - 1) * (k - 1));
  if (!(bms > 0) && !(wms > 0)) return notEstimable('zero_variance', 'every rating is the same, so no intraclass correlation can be computed');
  const alpha = 1 - level;
  const form = (value: number, f: number, df1: number, df2: number, ci: ((fl: number, fu: number) => [number, number]) | undefined): IccForm => {
    const p = Number.isFinite(f) ? fUpperTail(f, df1, df2) : 0;
    let ciLow: number | undefined;
    let ciHigh: number | undefined;
    if (ci && Number.isFinite(f)) {
      const fl = f / fQuantile(1 - alpha / 2, df1, df2);
      const fu = f * fQuantile(1 - alpha / 2, df2, df1);
      [ciLow, ciHigh] = ci(fl, fu);
    }
    return { value, f, df1, df2, p, ciLow, ciHigh };
  };
  // Interval of ICC(2,1): Satterthwaite approximation of Shrout & Fleiss (1979, p. 425), as psych::ICC.
  const icc2Value = (bms - ems) / (bms + (k - 1) * ems + (k * (jms - ems)) / n);
  const icc2Interval = (): [number, number] | undefined => {
    const fj = jms / ems;
    const r = icc2Value;
    const a = n * (1 + (k - 1) * r) - k * r;
    const vn = (k - 1) * (n - 1) * (k * r * fj + a) ** 2;
    const vd = (n - 1) * k * k * r * r * fj * fj + a * a;
    const v = vn / vd;
    if (!(v > 0) || !Number.isFinite(v)) return undefined;
    const fu = fQuantile(1 - alpha / 2, n - 1, v);
    const fl = fQuantile(1 - alpha / 2, v, n - 1);
    const c = k * jms + (k * n - k - n) * ems;
    return [(n * (bms - fu * ems)) / (fu * c + n * bms), (n * (fl * bms - ems)) / (c + n * fl * bms)];
  };
  const interval2 = Number.isFinite(jms / ems) ? icc2Interval() : undefined;
  const stepUp = (x: number): number => (k * x) / (1 + (k - 1) * x);
  const f1 = bms / wms;
  const f3 = bms / ems;
  const df1 = n - 1;
  return {
    ok: true,
    icc1: form((bms - wms) / (bms + (k - 1) * wms), f1, df1, n * (k - 1), (fl, fu) => [(fl - 1) / (fl + k - 1), (fu - 1) / (fu + k - 1)]),
    icc2: form(icc2Value, f3, df1, (n - 1) * (k - 1), interval2 ? () => interval2 : undefined),
    icc3: form((bms - ems) / (bms + (k - 1) * ems), f3, df1, (n - 1) * (k - 1), (fl, fu) => [(fl - 1) / (fl + k - 1), (fu - 1) / (fu + k - 1)]),
    icc1k: form((bms - wms) / bms, f1, df1, n * (k - 1), (fl, fu) => [1 - 1 / fl, 1 - 1 / fu]),
    icc2k: form((bms - ems) / (bms + (jms - ems) / n), f3, df1, (n - 1) * (k - 1), interval2 ? () => [stepUp(interval2[0]), stepUp(interval2[1])] : undefined),
    icc3k: form((bms - ems) / bms, f3, df1, (n - 1) * (k - 1), (fl, fu) => [1 - 1 / fl, 1 - 1 / fu]),
    bms,
    wms,
    jms,
    ems,
    targets: n,
    raters: k,
    incomplete,
    level,
  };
}
