import { notEstimable, type StatResult } from '../stats/stat-result.js';

/** The fit of one response in {@link leastSquares}. */
export interface LeastSquaresFit {
  coefficients: number[];
  standardErrors: number[];
  /** Residual variance σ̂² = RSS / (n − k − dfExtra). */
  residualVariance: number;
  residualSumSquares: number;
}

/** OLS fits of several responses on one design. */
export interface LeastSquares {
  fits: LeastSquaresFit[];
  n: number;
  /** Residual degrees of freedom n − k − dfExtra. */
  df: number;
  /** (XᵀX)⁻¹, k × k, row-major. */
  unscaledCovariance: number[];
}

/**
 * Ordinary least squares of each response column on the design `x` (rows of k predictors; add a
 * column of ones for an intercept), by Householder QR (Golub & Van Loan, Matrix Computations,
 * §5.2–5.3), which avoids forming XᵀX:
 *
 *   β̂ = R⁻¹ Qᵀy,   σ̂² = ‖y − Xβ̂‖² / (n − k − dfExtra),   SE(β̂_j) = σ̂ √[(RᵀR)⁻¹]_jj
 *
 * `dfExtra` removes degrees of freedom used outside the design (e.g. person means absorbed by a
 * within transformation). Not estimable when n − k − dfExtra < 1 or X is rank deficient.
 */
export function leastSquares(x: readonly (readonly number[])[], responses: readonly (readonly number[])[], dfExtra = 0): StatResult<LeastSquares> {
  const n = x.length;
  const k = n > 0 ? (x[0] as readonly number[]).length : 0;
  const df = n - k - dfExtra;
  if (k === 0) return notEstimable('no_predictors', 'the design has no columns');
  if (df < 1) return notEstimable('too_few_rows', `${n} rows for ${k + dfExtra} parameters leave no residual degrees of freedom`);
  // Column-major copy of X and of the responses.
  const a = new Float64Array(n * k);
  for (let i = 0; i < n; i++) for (let j = 0; j < k; j++) a[j * n + i] = (x[i] as readonly number[])[j] as number;
  const ys = responses.map((y) => Float64Array.from(y));
  const scale = new Float64Array(k);
  for (let j = 0; j < k; j++) {
    let s = 0;
    for (let i = 0; i < n; i++) s = Math.max(s, Math.abs(a[j * n + i] as number));
    scale[j] = s;
  }
  const diag = new Float64Array(k);
  for (let j = 0; j < k; j++) {
    const col = j * n;
    let norm = 0;
    for (let i = j; i < n; i++) norm = Math.hypot(norm, a[col + i] as number);
    if (!(norm > 1e-12 * Math.max(scale[j] as number, 1e-300)) || (scale[j] as number) === 0) {
      return notEstimable('rank_deficient', `predictor ${j + 1} is constant or a linear combination of the others`);
    }
    const alpha = (a[col + j] as number) > 0 ? -norm : norm;
    // v = x − alpha e1 stored in place; R_jj = alpha.
    a[col + j] = (a[col + j] as number) - alpha;
    let vnorm2 = 0;
    for (let i = j; i < n; i++) vnorm2 += (a[col + i] as number) ** 2;
    diag[j] = alpha;
    const apply = (target: Float64Array, offset: number): void => {
      let dot = 0;
      for (let i = j; i < n; i++) dot += (a[col + i] as number) * (target[offset + i] as number);
      const f = (2 * dot) / vnorm2;
      for (let i = j; i < n; i++) target[offset + i] = (target[offset + i] as number) - f * (a[col + i] as number);
    };
    if (vnorm2 > 0) {
      for (let jj = j + 1; jj < k; jj++) apply(a, jj * n);
      for (const y of ys) apply(y, 0);
    }
  }
  // R: diag plus upper triangle a[jj*n + j] for jj > j.
  const r = (i: number, j: number): number => (i === j ? (diag[i] as number) : (a[j * n + i] as number));
  // Rinv (upper triangular), then (RᵀR)⁻¹ = Rinv Rinvᵀ.
  const rinv = new Float64Array(k * k);
  for (let j = k - 1; j >= 0; j--) {
    rinv[j * k + j] = 1 / r(j, j);
    for (let i = j - 1; i >= 0; i--) {
      let s = 0;
      for (let m = i + 1; m <= j; m++) s += r(i, m) * (rinv[m * k + j] as number);
      rinv[i * k + j] = -s / r(i, i);
    }
  }
  const unscaled: number[] = new Array(k * k).fill(0);
  for (let i = 0; i < k; i++)
    for (let j = 0; j < k; j++) {
      let s = 0;
      for (let m = Math.max(i, j); m < k; m++) s += (rinv[i * k + m] as number) * (rinv[j * k + m] as number);
      unscaled[i * k + j] = s;
    }
  const fits = ys.map((qty): LeastSquaresFit => {
    const beta = new Array<number>(k).fill(0);
    for (let i = k - 1; i >= 0; i--) {
      let s = qty[i] as number;
      for (let m = i + 1; m < k; m++) s -= r(i, m) * (beta[m] as number);
      beta[i] = s / r(i, i);
    }
    let rss = 0;
    for (let i = k; i < n; i++) rss += (qty[i] as number) ** 2;
    const residualVariance = rss / df;
    return {
      coefficients: beta,
      standardErrors: beta.map((_, j) => Math.sqrt(residualVariance * (unscaled[j * k + j] as number))),
      residualVariance,
      residualSumSquares: rss,
    };
  });
  return { ok: true, fits, n, df, unscaledCovariance: unscaled };
}
