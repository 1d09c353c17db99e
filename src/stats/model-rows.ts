import { isNumber } from './is-number.js';

/** One complete observation of a mixed model: its group, response and predictors. */
export interface ModelRow {
  g: string;
  y: number;
  x: number[];
}

/** The complete rows of a mixed model with their coefficient names and means (see modelRows). */
export interface ModelRows {
  rows: ModelRow[];
  /** Number of predictors (from the first row, else from `names`). */
  q: number;
  /** Coefficient names, `(Intercept)` first; unnamed predictors are `x1`, `x2`, … */
  names: string[];
  /** Means of the predictors and of the response over the complete rows (running means, as Welford). */
  xMeans: number[];
  yMean: number;
}

/**
 * The rows of `values` with a numeric response and as many numeric predictors as the first row
 * has (others are skipped), their coefficient names and the means the models centre on.
 */
export function modelRows<T>(
  values: Iterable<T>,
  groupof: (d: T, i: number) => string,
  yof: (d: T, i: number) => number | undefined | null,
  xof: (d: T, i: number) => readonly (number | undefined | null)[],
  givenNames?: readonly string[],
): ModelRows {
  const rows: ModelRow[] = [];
  let q = -1;
  let i = -1;
  for (const d of values) {
    ++i;
    const y = yof(d, i);
    const x = xof(d, i);
    if (q < 0) q = x.length;
    if (!isNumber(y) || x.length !== q || !x.every(isNumber)) continue;
    rows.push({ g: groupof(d, i), y, x: x as number[] });
  }
  if (q < 0) q = givenNames?.length ?? 0;
  const names = ['(Intercept)', ...Array.from({ length: q }, (_, j) => givenNames?.[j] ?? `x${j + 1}`)];
  const xMeans = new Array<number>(q).fill(0);
  let yMean = 0;
  rows.forEach((row, r) => {
    yMean += (row.y - yMean) / (r + 1);
    for (let j = 0; j < q; j++) xMeans[j] = (xMeans[j] as number) + ((row.x[j] as number) - (xMeans[j] as number)) / (r + 1);
  });
  return { rows, q, names, xMeans, yMean };
}
