import { normalQuantile, normalTwoSidedP, studentTQuantile, studentTTwoSidedP } from './distributions.js';
import type { FixedEffect, FixedEffectInference } from './linear-mixed-model.js';

/** What fixedEffectsTable needs besides the fitted coefficients. */
export interface FixedEffectsTableOptions {
  /** Names of the coefficients, the intercept first, in the order of `beta`. */
  names: readonly string[];
  /** Per predictor: whether it varies within some group (a within-person term). */
  withinVaries: readonly boolean[];
  /** Observations and groups. */
  n: number;
  groups: number;
  level: number;
  inference: FixedEffectInference;
  /** Index (among the predictors) of the one with a random slope, if any: its df are those of a between term. */
  randomSlope?: number;
}

/**
 * The fixed-effect table of a mixed model fitted on centred predictors: estimates and their
 * covariance back-transformed to the original predictors (β₀ = β₀c + ȳ − Σ βⱼ x̄ⱼ; covariance
 * σ² T C Tᵀ, with C = (XᵀV⁻¹X)⁻¹ on the centred scale), then SE, statistic, p and interval per term.
 * Intervals are Wald z, or t with the between/within degrees of freedom of SAS PROC MIXED
 * DDFM=BW: within terms n − g − (within terms), between terms and the intercept g − (between
 * terms); a term with a random slope takes the between-level df.
 */
export function fixedEffectsTable(
  beta: readonly number[],
  centredInverse: readonly (readonly number[])[],
  sigma2: number,
  xMeans: readonly number[],
  yMean: number,
  options: FixedEffectsTableOptions,
): { fixed: FixedEffect[]; covariance: number[][] } {
  const { withinVaries, n, groups: g, level, inference, randomSlope } = options;
  const p = beta.length;
  const transform = Array.from({ length: p }, (_, r) => Array.from({ length: p }, (_, s) => (r === s ? 1 : r === 0 ? -(xMeans[s - 1] as number) : 0)));
  const estimates = beta.slice();
  estimates[0] = (beta[0] as number) + yMean - xMeans.reduce((sum, xm, j) => sum + (beta[j + 1] as number) * xm, 0);
  const covariance = Array.from({ length: p }, (_, r) =>
    Array.from({ length: p }, (_, s) => {
      let sum = 0;
      for (let u = 0; u < p; u++) for (let v = 0; v < p; v++) sum += ((transform[r] as number[])[u] as number) * ((centredInverse[u] as number[])[v] as number) * ((transform[s] as number[])[v] as number);
      return sigma2 * sum;
    }),
  );
  const betweenTerms = 1 + withinVaries.filter((w) => !w).length;
  const withinTerms = withinVaries.filter((w, j) => w && j !== randomSlope).length;
  const fixed: FixedEffect[] = options.names.map((name, r) => {
    const estimate = estimates[r] as number;
    const se = Math.sqrt((covariance[r] as number[])[r] as number);
    const statistic = estimate / se;
    const levelOf: 'between' | 'within' = r > 0 && withinVaries[r - 1] ? 'within' : 'between';
    if (inference === 'wald-z') {
      const half = normalQuantile((1 + level) / 2) * se;
      return { name, estimate, se, statistic, df: undefined, p: normalTwoSidedP(statistic), ciLow: estimate - half, ciHigh: estimate + half, level: levelOf };
    }
    const df = Math.max(1, levelOf === 'within' && r - 1 !== randomSlope ? n - g - withinTerms : g - betweenTerms);
    const half = studentTQuantile((1 + level) / 2, df) * se;
    return { name, estimate, se, statistic, df, p: studentTTwoSidedP(statistic, df), ciLow: estimate - half, ciHigh: estimate + half, level: levelOf };
  });
  return { fixed, covariance };
}
