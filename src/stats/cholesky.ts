/** A Cholesky factorisation A = L·Lᵀ of a small symmetric positive-definite matrix. */
export interface CholeskyFactor {
  /** Lower-triangular factor, row-major. */
  lower: number[][];
  /** Solves A·x = b. */
  solve(b: readonly number[]): number[];
  /** A⁻¹. */
  inverse(): number[][];
  /** log |A| = 2 Σ log Lᵢᵢ. */
  logDeterminant: number;
}

/**
 * Cholesky–Banachiewicz factorisation of a symmetric positive-definite matrix (Golub & Van Loan,
 * Matrix Computations, alg. 4.2.1), for the few-by-few normal equations of regression and the
 * mixed model. Returns `undefined` when the matrix is not positive definite (a pivot ≤ 1e-12
 * times the largest diagonal element), i.e. when predictors are collinear or constant.
 */
export function cholesky(matrix: readonly (readonly number[])[]): CholeskyFactor | undefined {
  const p = matrix.length;
  const lower = Array.from({ length: p }, () => new Array<number>(p).fill(0));
  let maxDiagonal = 0;
  for (let i = 0; i < p; i++) maxDiagonal = Math.max(maxDiagonal, Math.abs((matrix[i] as number[])[i] as number));
  for (let i = 0; i < p; i++) {
    const li = lower[i] as number[];
    for (let j = 0; j <= i; j++) {
      const lj = lower[j] as number[];
      let sum = (matrix[i] as number[])[j] as number;
      for (let k = 0; k < j; k++) sum -= (li[k] as number) * (lj[k] as number);
      if (i === j) {
        if (!(sum > 1e-12 * maxDiagonal)) return undefined;
        li[i] = Math.sqrt(sum);
      } else {
        li[j] = sum / (lj[j] as number);
      }
    }
  }
  let logDeterminant = 0;
  for (let i = 0; i < p; i++) logDeterminant += 2 * Math.log((lower[i] as number[])[i] as number);
  const solve = (b: readonly number[]): number[] => {
    const y = new Array<number>(p).fill(0);
    for (let i = 0; i < p; i++) {
      let s = b[i] as number;
      for (let k = 0; k < i; k++) s -= ((lower[i] as number[])[k] as number) * (y[k] as number);
      y[i] = s / ((lower[i] as number[])[i] as number);
    }
    const x = new Array<number>(p).fill(0);
    for (let i = p - 1; i >= 0; i--) {
      let s = y[i] as number;
      for (let k = i + 1; k < p; k++) s -= ((lower[k] as number[])[i] as number) * (x[k] as number);
      x[i] = s / ((lower[i] as number[])[i] as number);
    }
    return x;
  };
  const inverse = (): number[][] => {
    const columns = Array.from({ length: p }, (_, j) => solve(Array.from({ length: p }, (_, i) => (i === j ? 1 : 0))));
    return Array.from({ length: p }, (_, i) => Array.from({ length: p }, (_, j) => (columns[j] as number[])[i] as number));
  };
  return { lower, solve, inverse, logDeterminant };
}
