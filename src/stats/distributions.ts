// jstat ships no type declarations; the few functions used here are typed below.
// @ts-ignore -- untyped CommonJS module
import jStatModule from 'jstat';

interface JStat {
  studentt: { cdf(x: number, df: number): number; inv(p: number, df: number): number };
  normal: { cdf(x: number, mean: number, sd: number): number; inv(p: number, mean: number, sd: number): number };
  centralF: { cdf(x: number, df1: number, df2: number): number; inv(p: number, df1: number, df2: number): number };
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

/** Two-sided p-value of a t statistic: 2·(1 − T_df(|t|)). */
export function studentTTwoSidedP(t: number, df: number): number {
  return Math.min(1, 2 * (1 - jStat.studentt.cdf(Math.abs(t), df)));
}

/** Two-sided p-value of a z statistic: 2·(1 − Φ(|z|)). */
export function normalTwoSidedP(z: number): number {
  return Math.min(1, 2 * (1 - normalCdf(Math.abs(z))));
}

/** F cumulative distribution with (df1, df2) degrees of freedom (jstat). */
export function fCdf(f: number, df1: number, df2: number): number {
  return jStat.centralF.cdf(f, df1, df2);
}

/** F quantile with (df1, df2) degrees of freedom (jstat). */
export function fQuantile(p: number, df1: number, df2: number): number {
  return jStat.centralF.inv(p, df1, df2);
}
