import { notEstimable, type StatResult } from '../stats/stat-result.js';
import { leastSquares } from './least-squares.js';
import { personCentre } from './person-centre.js';
import { var1Rows } from './var1-rows.js';
import { var1Coefficients, type Var1Fit } from './var1.js';

/** A pooled fixed-effects VAR(1). */
export interface PooledVar1Fit extends Var1Fit {
  /** Persons contributing at least one lag pair. */
  persons: number;
}

/** One person's columns and lag validity, for {@link pooledVar1}. */
export interface PooledVar1Person {
  values: Readonly<Record<string, readonly (number | undefined)[]>>;
  lagValid: readonly boolean[];
}

/**
 * Pooled within-person VAR(1) across persons with person fixed effects (the least-squares dummy
 * variable estimator, computed by the within transformation): each person's series is
 * person-mean centred, the lag-pair rows are built as in {@link var1}, and then the current and
 * lagged values are centred again on the person's means over the rows used, so every person
 * has their own intercept. Coefficients are shared across persons:
 *
 *   x_{j,pt} = c_{jp} + Σ_i a_{ji} x_{i,p,t−1} + e_{j,pt}
 *
 * SEs use σ̂²_j = RSS_j / (N − P − k) with N rows, P persons and k lagged predictors, equal to OLS
 * with person dummies. Centring on person means biases a_{jj} downward when series are short
 * (Nickell 1981; Hamaker & Grasman 2015).
 */
export function pooledVar1(persons: readonly PooledVar1Person[], variables: readonly string[]): StatResult<PooledVar1Fit> {
  const design: number[][] = [];
  const responses: number[][] = variables.map(() => []);
  let contributing = 0;
  for (const person of persons) {
    const series = variables.map((name) => personCentre(person.values[name] ?? []));
    const rows = var1Rows(series, person.lagValid);
    const m = rows.t.length;
    if (m === 0) continue;
    contributing += 1;
    const k = variables.length;
    const meanNow = new Array<number>(k).fill(0);
    const meanLag = new Array<number>(k).fill(0);
    for (let r = 0; r < m; r++)
      for (let j = 0; j < k; j++) {
        meanNow[j] = (meanNow[j] as number) + ((rows.current[r] as number[])[j] as number) / m;
        meanLag[j] = (meanLag[j] as number) + ((rows.lagged[r] as number[])[j] as number) / m;
      }
    for (let r = 0; r < m; r++) {
      design.push((rows.lagged[r] as number[]).map((v, j) => v - (meanLag[j] as number)));
      for (let j = 0; j < k; j++) (responses[j] as number[]).push(((rows.current[r] as number[])[j] as number) - (meanNow[j] as number));
    }
  }
  if (contributing === 0) return notEstimable('no_lag_pairs', 'no person has a complete lag pair');
  const fit = leastSquares(design, responses, contributing);
  if (!fit.ok) return fit;
  return { ok: true, variables: [...variables], pairs: fit.n, df: fit.df, persons: contributing, coefficients: var1Coefficients(fit, variables, variables) };
}
