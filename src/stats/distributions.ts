// jstat ships no type declarations; the few functions used here are typed below.
// @ts-ignore -- untyped CommonJS module
import jStatModule from 'jstat';

interface JStat {
  studentt: { cdf(x: number, df: number): number; inv(p: number, df: number): number };
  normal: { cdf(x: number, mean: number, sd: number): number; inv(p: number, mean: number, sd: number): number };
  centralF: { cdf(x: number, df1: number, df2: number): number; inv(p: number, df1: number, df2: number): number };
  ibeta(x: number, a: number, b: number): number;
}
const jStat = jStatModule as unknown as JStat;

/** Standard normal cumulative distribution Φ(z) (jstat). */
export function normalCdf(z: number): number {
  return jStat.normal.cdf(z, 0, 1);
}

/** Standard normal quantile Φ⁻¹(p), e.g. `normalQuantile(0.975)` ≈ 1.959964 (jstat). */
export function normalQuantile(p: number): number {
  return jStat.normal.inv(p, 0, 1);
}

/** Student t cumulative distribution with `df` degrees of freedom (jstat). */
export function studentTCdf(t: number, df: number): number {
  return jStat.studentt.cdf(t, df);
}

/** Student t quantile with `df` degrees of freedom (jstat). */
export function studentTQuantile(p: number, df: number): number {
  return jStat.studentt.inv(p, df);
}

/** Two-sided p-value of a t statistic: 2·T_df(−|t|) (the lower tail, so tiny p-values do not round to 0). */
export function studentTTwoSidedP(t: number, df: number): number {
  return Math.min(1, 2 * jStat.studentt.cdf(-Math.abs(t), df));
}

/** Two-sided p-value of a z statistic: 2·Φ(−|z|). */
export function normalTwoSidedP(z: number): number {
  return Math.min(1, 2 * normalCdf(-Math.abs(z)));
}

/** F cumulative distribution with (df1, df2) degrees of freedom (jstat). */
export function fCdf(f: number, df1: number, df2: number): number {
  return jStat.centralF.cdf(f, df1, df2);
}

/**
 * Upper tail P(F > f) of the F distribution with (df1, df2) degrees of freedom, computed as the
 * regularized incomplete beta I_x(df2/2, df1/2) with x = df2 / (df2 + df1·f), so that small
 * p-values keep their size instead of rounding to 0 as 1 − CDF would.
 */
export function fUpperTail(f: number, df1: number, df2: number): number {
  if (!(f > 0)) return 1;
  return jStat.ibeta(df2 / (df2 + df1 * f), df2 / 2, df1 / 2);
}

/** F quantile with (df1, df2) degrees of freedom (jstat). */
export function fQuantile(p: number, df1: number, df2: number): number {
  return jStat.centralF.inv(p, df1, df2);
}
