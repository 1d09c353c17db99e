import { cholesky } from './cholesky.js';
import { fixedEffectsTable } from './fixed-effects-table.js';
import { modelRows } from './model-rows.js';
import { minimizeScalar } from './minimize-scalar.js';
import { notEstimable, type StatResult } from './stat-result.js';

/** How intervals and p-values of fixed effects are computed. */
export type FixedEffectInference = 'between-within-t' | 'wald-z';

/** One fixed effect of a mixed model. */
export interface FixedEffect {
  name: string;
  estimate: number;
  se: number;
  /** Estimate / SE (a t or z statistic, see `inference`). */
  statistic: number;
  /** Degrees of freedom of the t reference distribution; `undefined` for Wald z. */
  df: number | undefined;
  p: number;
  ciLow: number;
  ciHigh: number;
  /** `between` when the predictor is constant within every group (or the intercept), else `within`. */
  level: 'between' | 'within';
}

/** A random-intercept linear mixed model fitted by REML. */
export interface LinearMixedModelFit {
  fixed: FixedEffect[];
  /** Covariance matrix of the fixed-effect estimates, σ̂²(XᵀV⁻¹X)⁻¹, in the order of `fixed`. */
  covariance: number[][];
  /** Variance of the random intercepts (between groups), σ²_b. */
  varianceIntercept: number;
  /** Residual (within-group) variance σ². */
  varianceResidual: number;
  /** σ²_b / (σ²_b + σ²): the conditional intraclass correlation. */
  icc: number;
  /** REML criterion −2·log L_R at the optimum (as reported by lme4 `REMLcrit`). */
  remlCriterion: number;
  /** True when the between-group variance is estimated at its bound 0 (a singular fit). */
  boundary: boolean;
  n: number;
  groups: number;
  inference: FixedEffectInference;
  level: number;
}

/** Options of {@link linearMixedModel}. */
export interface LinearMixedModelOptions {
  /** Names of the predictors returned by `xof` (default x1, x2, …); the intercept is `(Intercept)`. */
  names?: readonly string[];
  /** Confidence level of the intervals (default 0.95). */
  level?: number;
  /**
   * Inference for fixed effects: `between-within-t` (default) uses t with the between/within
   * degrees of freedom of SAS PROC MIXED DDFM=BW (within-level predictors N − g − p_within,
   * between-level predictors and the intercept g − p_between); `wald-z` uses the normal
   * distribution, as lme4 `confint(method = "Wald")`.
   */
  inference?: FixedEffectInference;
}

interface GroupMoments {
  n: number;
  /** Σ xⱼ over the group (intercept included). */
  s: number[];
  sy: number;
  xtx: number[][];
  xty: number[];
  yty: number;
}

/**
 * Fits y = Xβ + b_group + ε with b ~ N(0, σ²_b), ε ~ N(0, σ²) by restricted maximum likelihood
 * (Patterson & Thompson 1971; the model of lme4 `y ~ x + (1 | group)`, Bates et al. 2015, J Stat
 * Softw 67(1)). An intercept is added to the predictors returned by `xof`.
 *
 * With λ = σ²_b/σ², Vᵢ = I + λ11ᵀ has Vᵢ⁻¹ = I − λ/(1 + nᵢλ)·11ᵀ and |Vᵢ| = 1 + nᵢλ, so every
 * REML evaluation needs only per-group sums. For fixed λ, β̂ = (XᵀV⁻¹X)⁻¹XᵀV⁻¹y,
 * σ̂² = rᵀV⁻¹r/(N − p), and the profiled criterion
 * −2 log L_R = (N − p)(1 + log 2πσ̂²) + Σ log(1 + nᵢλ) + log|XᵀV⁻¹X|
 * is minimised over log λ ∈ [−25, 20] with Brent's method; λ = 0 is also tried (boundary fit).
 * Predictors are centred before fitting for numerical stability, which leaves the criterion
 * unchanged; the intercept and its variance are transformed back.
 *
 * Rows with a missing response or predictor are skipped. Not estimable with fewer than 2 groups,
 * too few rows for the predictors, or collinear/constant predictors.
 */
export function linearMixedModel<T>(
  values: Iterable<T>,
  groupof: (d: T, i: number) => string,
  yof: (d: T, i: number) => number | undefined | null,
  xof: (d: T, i: number) => readonly (number | undefined | null)[],
  options: LinearMixedModelOptions = {},
): StatResult<LinearMixedModelFit> {
  const level = options.level ?? 0.95;
  const inference = options.inference ?? 'between-within-t';
  // Complete rows; y and the predictors are centred on their means below.
  const { rows, q, names, xMeans, yMean } = modelRows(values, groupof, yof, xof, options.names);
  const p = q + 1;
  const n = rows.length;
  const groups = new Map<string, GroupMoments>();
  const withinVaries = new Array<boolean>(q).fill(false);
  const firstInGroup = new Map<string, number[]>();
  for (const row of rows) {
    const z = [1, ...row.x.map((x, j) => x - (xMeans[j] as number))];
    const y = row.y - yMean;
    let m = groups.get(row.g);
    if (!m) {
      m = { n: 0, s: new Array<number>(p).fill(0), sy: 0, xtx: Array.from({ length: p }, () => new Array<number>(p).fill(0)), xty: new Array<number>(p).fill(0), yty: 0 };
      groups.set(row.g, m);
      firstInGroup.set(row.g, row.x);
    } else {
      const first = firstInGroup.get(row.g) as number[];
      for (let j = 0; j < q; j++) if (row.x[j] !== first[j]) withinVaries[j] = true;
    }
    m.n += 1;
    m.sy += y;
    m.yty += y * y;
    for (let a = 0; a < p; a++) {
      const za = z[a] as number;
      m.s[a] = (m.s[a] as number) + za;
      m.xty[a] = (m.xty[a] as number) + za * y;
      const row2 = m.xtx[a] as number[];
      for (let b = 0; b < p; b++) row2[b] = (row2[b] as number) + za * (z[b] as number);
    }
  }
  const g = groups.size;
  if (g < 2) return notEstimable('too_few_persons', `a random-intercept model needs at least 2 persons; there ${g === 1 ? 'is' : 'are'} ${g}`);
  if (n - p < 1 || n <= g) return notEstimable('too_few_observations', `a random-intercept model with ${p} fixed effects needs more observations than persons and fixed effects; there are ${n} observations from ${g} persons`);
  const groupList = [...groups.values()];

  const evaluate = (lambda: number) => {
    const a = Array.from({ length: p }, () => new Array<number>(p).fill(0));
    const b = new Array<number>(p).fill(0);
    let c = 0;
    let logDetV = 0;
    for (const m of groupList) {
      const w = lambda / (1 + m.n * lambda);
      logDetV += Math.log1p(m.n * lambda);
      c += m.yty - w * m.sy * m.sy;
      for (let r = 0; r < p; r++) {
        b[r] = (b[r] as number) + (m.xty[r] as number) - w * (m.s[r] as number) * m.sy;
        const ar = a[r] as number[];
        const xr = m.xtx[r] as number[];
        for (let s = 0; s < p; s++) ar[s] = (ar[s] as number) + (xr[s] as number) - w * (m.s[r] as number) * (m.s[s] as number);
      }
    }
    const factor = cholesky(a);
    if (!factor) return undefined;
    const beta = factor.solve(b);
    let rVr = c;
    for (let r = 0; r < p; r++) rVr -= (b[r] as number) * (beta[r] as number);
    rVr = Math.max(rVr, 0);
    const sigma2 = rVr / (n - p);
    const criterion = (n - p) * (1 + Math.log(2 * Math.PI * sigma2)) + logDetV + factor.logDeterminant;
    return { beta, sigma2, criterion, factor };
  };

  const atZero = evaluate(0);
  if (!atZero) return notEstimable('collinear_predictors', 'the predictors are constant or collinear, so their effects cannot be separated');
  if (!(atZero.sigma2 > 0)) return notEstimable('perfect_fit', 'the predictors explain the response exactly; there is no residual variance to model');
  const objective = (t: number): number => {
    const e = evaluate(Math.exp(t));
    return e && Number.isFinite(e.criterion) ? e.criterion : Number.MAX_VALUE;
  };
  const best = minimizeScalar(objective, -25, 20, 1e-10);
  let lambda = Math.exp(best.x);
  let fit = evaluate(lambda);
  let boundary = false;
  if (!fit || atZero.criterion <= fit.criterion) {
    lambda = 0;
    fit = atZero;
    boundary = true;
  }
  const { beta, sigma2, criterion, factor } = fit;
  const { fixed, covariance } = fixedEffectsTable(beta, factor.inverse(), sigma2, xMeans, yMean, { names, withinVaries, n, groups: g, level, inference });
  const varianceIntercept = lambda * sigma2;
  return {
    ok: true,
    fixed,
    covariance,
    varianceIntercept,
    varianceResidual: sigma2,
    icc: varianceIntercept / (varianceIntercept + sigma2),
    remlCriterion: criterion,
    boundary,
    n,
    groups: g,
    inference,
    level,
  };
}
