import { cholesky } from './cholesky.js';
import { fixedEffectsTable } from './fixed-effects-table.js';
import { modelRows } from './model-rows.js';
import type { FixedEffect, FixedEffectInference } from './linear-mixed-model.js';
import { minimizeNelderMead } from './minimize-nelder-mead.js';
import { notEstimable, type StatResult } from './stat-result.js';

/** How variance components are estimated. */
export type MixedModelMethod = 'REML' | 'ML';

/** A linear mixed model with correlated random intercepts and slopes per group. */
export interface RandomSlopeFit {
  fixed: FixedEffect[];
  /** Covariance matrix of the fixed-effect estimates, σ̂²(XᵀV⁻¹X)⁻¹, in the order of `fixed`. */
  covariance: number[][];
  /** Name of the predictor whose slope varies between groups. */
  slope: string;
  /** Variance of the random intercepts (at slope predictor 0). */
  varianceIntercept: number;
  /** Variance of the random slopes. */
  varianceSlope: number;
  /** Covariance of random intercepts and slopes. */
  covarianceInterceptSlope: number;
  /** Their correlation; undefined when either variance is 0. */
  correlation: number | undefined;
  /** Residual variance σ². */
  varianceResidual: number;
  method: MixedModelMethod;
  /** −2·log L (ML, lme4 `deviance`) or −2·log L_R (REML, lme4 `REMLcrit`) at the optimum. */
  criterion: number;
  /** log L or log L_R: −criterion/2 (lme4 `logLik`). */
  logLik: number;
  /** True when the random-effects covariance is singular: a diagonal element of Λ below 1e-4, as lme4 `isSingular` (here with the slope predictor scaled to unit root mean square). */
  boundary: boolean;
  n: number;
  groups: number;
  inference: FixedEffectInference;
  level: number;
}

/** Options of {@link randomSlopeMixedModel}. */
export interface RandomSlopeOptions {
  /** Names of the predictors returned by `xof` (default x1, x2, …). */
  names?: readonly string[];
  /** Index (into the predictors of `xof`) of the predictor with a random slope (default 0). */
  slope?: number;
  /** `REML` (default, as lme4) or `ML`. */
  method?: MixedModelMethod;
  level?: number;
  /**
   * `between-within-t` (default): t tests; the random-slope predictor gets the between-group df
   * g − p_between (its SE rests on the spread of g group slopes; the containment rule of SAS PROC
   * MIXED), other within-level predictors N − g − p_within, between-level ones g − p_between.
   * `wald-z`: normal, as lme4 `confint(method = "Wald")`.
   */
  inference?: FixedEffectInference;
}

interface Moments {
  n: number;
  ztz: number[][];
  ztx: number[][];
  zty: number[];
}

/**
 * Fits y = Xβ + Zᵢbᵢ + ε with Zᵢ = [1, zᵢ] (z one of the predictors), bᵢ ~ N(0, σ²ΛΛᵀ),
 * ε ~ N(0, σ²I): correlated random intercepts and slopes, the model of lme4
 * `y ~ x + (1 + x | group)` in lme4's parameterisation (Bates, Mächler, Bolker & Walker 2015,
 * J Stat Softw 67(1), eqs. 2–4 and 34–41): Λ lower triangular with θ = (θ₁₁, θ₂₁, θ₂₂), σ and β
 * profiled out. Per group, with M = ΛᵀZᵢᵀZᵢΛ + I (2 × 2), the Woodbury identity gives
 * XᵀV⁻¹X = Σ XᵢᵀXᵢ − XᵢᵀZᵢΛM⁻¹ΛᵀZᵢᵀXᵢ (likewise for y) and log|Vᵢ| = log|M|, so
 * REML: −2 log L_R = Σ log|M| + log|XᵀV⁻¹X| + (N − p)(1 + log(2π r/(N − p))),
 * ML:   −2 log L   = Σ log|M| + N(1 + log(2π r/N)),
 * with r = yᵀV⁻¹y − β̂ᵀXᵀV⁻¹y. θ is found by Nelder–Mead over ℝ³ (ΛΛᵀ is the same for sign
 * changes of a column, so no bounds are needed), started from lme4's θ = (1, 0, 1) after scaling
 * the slope predictor to unit root mean square; variances are reported in the original units.
 *
 * Rows with a missing response or predictor are skipped. Not estimable with fewer than 3 groups,
 * too few rows, collinear predictors or a slope predictor that never varies within a group.
 */
export function randomSlopeMixedModel<T>(
  values: Iterable<T>,
  groupof: (d: T, i: number) => string,
  yof: (d: T, i: number) => number | undefined | null,
  xof: (d: T, i: number) => readonly (number | undefined | null)[],
  options: RandomSlopeOptions = {},
): StatResult<RandomSlopeFit> {
  const level = options.level ?? 0.95;
  const inference = options.inference ?? 'between-within-t';
  const method = options.method ?? 'REML';
  const slopeIndex = options.slope ?? 0;
  const { rows, q, names, xMeans, yMean } = modelRows(values, groupof, yof, xof, options.names);
  if (slopeIndex < 0 || slopeIndex >= q) return notEstimable('no_slope_predictor', `there is no predictor number ${slopeIndex + 1} to give a random slope`);
  const p = q + 1;
  const n = rows.length;
  // Centre the fixed-effect columns (the criterion is unchanged) but not the slope's Z column.
  let zSquares = 0;
  for (const row of rows) zSquares += (row.x[slopeIndex] as number) ** 2;
  const zScale = Math.sqrt(zSquares / Math.max(1, n)) || 1;
  const groups = new Map<string, Moments>();
  const withinVaries = new Array<boolean>(q).fill(false);
  const firstInGroup = new Map<string, number[]>();
  const xtx = Array.from({ length: p }, () => new Array<number>(p).fill(0));
  const xty = new Array<number>(p).fill(0);
  let yty = 0;
  for (const row of rows) {
    const x = [1, ...row.x.map((v, j) => v - (xMeans[j] as number))];
    const z = [1, (row.x[slopeIndex] as number) / zScale];
    const y = row.y - yMean;
    let m = groups.get(row.g);
    if (!m) {
      m = { n: 0, ztz: [[0, 0], [0, 0]], ztx: [new Array<number>(p).fill(0), new Array<number>(p).fill(0)], zty: [0, 0] };
      groups.set(row.g, m);
      firstInGroup.set(row.g, row.x);
    } else {
      const first = firstInGroup.get(row.g) as number[];
      for (let j = 0; j < q; j++) if (row.x[j] !== first[j]) withinVaries[j] = true;
    }
    m.n += 1;
    yty += y * y;
    for (let a = 0; a < p; a++) {
      xty[a] = (xty[a] as number) + (x[a] as number) * y;
      for (let b = 0; b < p; b++) (xtx[a] as number[])[b] = ((xtx[a] as number[])[b] as number) + (x[a] as number) * (x[b] as number);
    }
    for (let a = 0; a < 2; a++) {
      m.zty[a] = (m.zty[a] as number) + (z[a] as number) * y;
      for (let b = 0; b < 2; b++) (m.ztz[a] as number[])[b] = ((m.ztz[a] as number[])[b] as number) + (z[a] as number) * (z[b] as number);
      for (let b = 0; b < p; b++) (m.ztx[a] as number[])[b] = ((m.ztx[a] as number[])[b] as number) + (z[a] as number) * (x[b] as number);
    }
  }
  const g = groups.size;
  if (g < 3) return notEstimable('too_few_persons', `a random-slope model needs at least 3 persons; there ${g === 1 ? 'is' : 'are'} ${g}`);
  if (!withinVaries[slopeIndex]) return notEstimable('slope_constant_within', `${names[slopeIndex + 1]} never varies within a person, so its slope cannot vary between persons`);
  if (n - p < 1 || n <= 2 * g) return notEstimable('too_few_observations', `a random-slope model needs more than two observations per person on average; there are ${n} observations from ${g} persons`);
  // Per group, packed: s00, s01, s11 (ZᵀZ), zᵀy (2), ZᵀX (2 × p).
  const stride = 5 + 2 * p;
  const packed = new Float64Array(g * stride);
  let k = 0;
  for (const m of groups.values()) {
    const o = k * stride;
    packed[o] = (m.ztz[0] as number[])[0] as number;
    packed[o + 1] = (m.ztz[0] as number[])[1] as number;
    packed[o + 2] = (m.ztz[1] as number[])[1] as number;
    packed[o + 3] = m.zty[0] as number;
    packed[o + 4] = m.zty[1] as number;
    for (let c = 0; c < p; c++) {
      packed[o + 5 + c] = (m.ztx[0] as number[])[c] as number;
      packed[o + 5 + p + c] = (m.ztx[1] as number[])[c] as number;
    }
    k += 1;
  }
  const dfResidual = method === 'REML' ? n - p : n;
  const g0 = new Float64Array(p);
  const g1 = new Float64Array(p);

  const evaluate = (theta: readonly number[]) => {
    const t11 = theta[0] as number;
    const t21 = theta[1] as number;
    const t22 = theta[2] as number;
    const a = xtx.map((r) => r.slice());
    const b = xty.slice();
    let c = yty;
    let logDetM = 0;
    for (let grp = 0; grp < g; grp++) {
      const o = grp * stride;
      const s00 = packed[o] as number;
      const s01 = packed[o + 1] as number;
      const s11 = packed[o + 2] as number;
      // G = ΛᵀZᵀX (2 × p), h = ΛᵀZᵀy, M = ΛᵀZᵀZΛ + I with Λ = [[t11, 0], [t21, t22]].
      for (let col = 0; col < p; col++) {
        const z0 = packed[o + 5 + col] as number;
        const z1 = packed[o + 5 + p + col] as number;
        g0[col] = t11 * z0 + t21 * z1;
        g1[col] = t22 * z1;
      }
      const h0 = t11 * (packed[o + 3] as number) + t21 * (packed[o + 4] as number);
      const h1 = t22 * (packed[o + 4] as number);
      const m00 = 1 + t11 * t11 * s00 + 2 * t11 * t21 * s01 + t21 * t21 * s11;
      const m01 = t22 * (t11 * s01 + t21 * s11);
      const m11 = 1 + t22 * t22 * s11;
      const det = m00 * m11 - m01 * m01;
      logDetM += Math.log(det);
      const i00 = m11 / det;
      const i01 = -m01 / det;
      const i11 = m00 / det;
      c -= h0 * (i00 * h0 + i01 * h1) + h1 * (i01 * h0 + i11 * h1);
      for (let r = 0; r < p; r++) {
        const wr0 = i00 * (g0[r] as number) + i01 * (g1[r] as number);
        const wr1 = i01 * (g0[r] as number) + i11 * (g1[r] as number);
        b[r] = (b[r] as number) - (wr0 * h0 + wr1 * h1);
        const ar = a[r] as number[];
        for (let col = 0; col < p; col++) ar[col] = (ar[col] as number) - (wr0 * (g0[col] as number) + wr1 * (g1[col] as number));
      }
    }
    const factor = cholesky(a);
    if (!factor) return undefined;
    const beta = factor.solve(b);
    let rss = c;
    for (let r = 0; r < p; r++) rss -= (b[r] as number) * (beta[r] as number);
    rss = Math.max(rss, 0);
    const sigma2 = rss / dfResidual;
    const criterion = logDetM + dfResidual * (1 + Math.log(2 * Math.PI * sigma2)) + (method === 'REML' ? factor.logDeterminant : 0);
    return { beta, sigma2, criterion, factor };
  };

  const atZero = evaluate([0, 0, 0]);
  if (!atZero) return notEstimable('collinear_predictors', 'the predictors are constant or collinear, so their effects cannot be separated');
  if (!(atZero.sigma2 > 0)) return notEstimable('perfect_fit', 'the predictors explain the response exactly; there is no residual variance to model');
  const objective = (theta: readonly number[]): number => {
    const e = evaluate(theta);
    return e && Number.isFinite(e.criterion) ? e.criterion : Number.MAX_VALUE;
  };
  const found = minimizeNelderMead(objective, [1, 0, 1], { step: 0.5, tolerance: 1e-9 });
  const theta = found.x;
  const fit = evaluate(theta) as NonNullable<ReturnType<typeof evaluate>>;
  const [t11, t21, t22] = theta as [number, number, number];
  const { beta, sigma2, criterion, factor } = fit;
  const { fixed, covariance } = fixedEffectsTable(beta, factor.inverse(), sigma2, xMeans, yMean, { names, withinVaries, n, groups: g, level, inference, randomSlope: slopeIndex });
  // σ²ΛΛᵀ in the scaled slope units, then back to the original units of the slope predictor.
  const varianceIntercept = sigma2 * t11 * t11;
  const covarianceInterceptSlope = (sigma2 * t11 * t21) / zScale;
  const varianceSlope = (sigma2 * (t21 * t21 + t22 * t22)) / (zScale * zScale);
  const singular = Math.abs(t11) < 1e-4 || Math.abs(t22) < 1e-4;
  return {
    ok: true,
    fixed,
    covariance,
    slope: names[slopeIndex + 1] as string,
    varianceIntercept,
    varianceSlope,
    covarianceInterceptSlope,
    correlation: varianceIntercept > 0 && varianceSlope > 0 ? covarianceInterceptSlope / Math.sqrt(varianceIntercept * varianceSlope) : undefined,
    varianceResidual: sigma2,
    method,
    criterion,
    logLik: -criterion / 2,
    boundary: singular,
    n,
    groups: g,
    inference,
    level,
  };
}
