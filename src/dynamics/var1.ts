import { studentTTwoSidedP } from '../stats/distributions.js';
import { notEstimable, type StatResult } from '../stats/stat-result.js';
import { leastSquares, type LeastSquares } from './least-squares.js';
import { personCentre } from './person-centre.js';
import { var1Rows } from './var1-rows.js';

/** One coefficient of a VAR(1) equation: the effect of `predictor` at t − 1 on `outcome` at t. */
export interface Var1Coefficient {
  outcome: string;
  /** A variable name (its lag-1 value) or `(intercept)`. */
  predictor: string;
  estimate: number;
  se: number;
  /** estimate / se. */
  t: number;
  /** Two-sided p from Student t on `df`. */
  p: number;
}

/** A fitted VAR(1). */
export interface Var1Fit {
  variables: string[];
  /** Lag pairs (rows) used. */
  pairs: number;
  /** Residual degrees of freedom per equation. */
  df: number;
  coefficients: Var1Coefficient[];
}

/** Options of {@link var1}. */
export interface Var1Options {
  /** Centre each variable on the person's mean of observed bins first (default true). */
  centre?: boolean;
}

/**
 * First-order vector autoregression of one person's variables (cross-lagged panel within one
 * person), fitted equation by equation by OLS ({@link leastSquares}):
 *
 *   x_{j,t} = c_j + Σ_i a_{ji} x_{i,t−1} + e_{j,t}
 *
 * on the person-mean-centred series, using only rows where every variable is observed at t and
 * t − 1 and the lag is valid ({@link var1Rows}). SEs are the usual OLS ones with
 * σ̂²_j = RSS_j / (n − k − 1), as statsmodels `VAR(...).fit(1)` reports them. Person-mean centring
 * biases the autoregressive effects downward in short series (Nickell bias; Hamaker & Grasman
 * 2015, Frontiers in Psychology 5:1492). Not estimable without more rows than parameters.
 */
export function var1(
  columns: Readonly<Record<string, readonly (number | undefined)[]>>,
  lagValid: readonly boolean[],
  variables: readonly string[],
  options: Var1Options = {},
): StatResult<Var1Fit> {
  const centre = options.centre ?? true;
  const series = variables.map((name) => {
    const column = columns[name];
    if (!column) throw new Error(`var1: unknown variable ${name}`);
    return centre ? personCentre(column) : column;
  });
  const rows = var1Rows(series, lagValid);
  const k = variables.length + 1;
  if (rows.t.length <= k) return notEstimable('too_few_lag_pairs', `${rows.t.length} complete lag pairs for ${k} parameters per equation`);
  const design = rows.lagged.map((lag) => [1, ...lag]);
  const responses = variables.map((_, j) => rows.current.map((now) => now[j] as number));
  const fit = leastSquares(design, responses);
  if (!fit.ok) return fit;
  return { ok: true, variables: [...variables], pairs: rows.t.length, df: fit.df, coefficients: var1Coefficients(fit, variables, ['(intercept)', ...variables]) };
}

/** The coefficient table of a VAR(1) fitted equation by equation: equation j explains `outcomes[j]`, coefficient i belongs to `predictors[i]`; t and two-sided p on the fit's df. */
export function var1Coefficients(fit: LeastSquares, outcomes: readonly string[], predictors: readonly string[]): Var1Coefficient[] {
  const coefficients: Var1Coefficient[] = [];
  fit.fits.forEach((equation, j) => {
    equation.coefficients.forEach((estimate, i) => {
      const se = equation.standardErrors[i] as number;
      const t = estimate / se;
      coefficients.push({ outcome: outcomes[j] as string, predictor: predictors[i] as string, estimate, se, t, p: studentTTwoSidedP(t, fit.df) });
    });
  });
  return coefficients;
}
