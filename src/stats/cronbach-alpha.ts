import { isNumber } from './is-number.js';
import { notEstimable, type StatResult } from './stat-result.js';

/** Cronbach's alpha of a set of items. */
export interface CronbachAlpha {
  /** From the item covariance matrix C: k/(k−1) · (1 − tr C / ΣC) (psych::alpha `raw_alpha`). */
  alpha: number;
  /** From the item correlation matrix R: k/(k−1) · (1 − k / ΣR) (psych::alpha `std.alpha`). */
  standardizedAlpha: number;
  /** Items (k). */
  items: number;
  /** Complete rows used. */
  n: number;
  /** Rows left out because an item was missing. */
  incomplete: number;
}

/**
 * Cronbach's (1951) coefficient alpha for rows of item scores (`rows[i][j]` = item j of unit i),
 * α = k/(k−1) · (1 − Σσ²ⱼ / σ²_total), computed from the covariance matrix accumulated in one
 * pass with Welford-style co-moment updates. Uses complete rows only (listwise); R psych::alpha
 * uses pairwise covariances, which agree on complete data.
 *
 * Not estimable with fewer than 2 items or 2 complete rows, or when the total score does not vary.
 */
export function cronbachAlpha(rows: Iterable<readonly (number | undefined | null)[]>): StatResult<CronbachAlpha> {
  let k = -1;
  let n = 0;
  let incomplete = 0;
  let means: number[] = [];
  let comoments: number[][] = [];
  for (const row of rows) {
    if (k < 0) {
      k = row.length;
      means = new Array<number>(k).fill(0);
      comoments = Array.from({ length: k }, () => new Array<number>(k).fill(0));
    }
    if (row.length !== k || !row.every(isNumber)) {
      incomplete += 1;
      continue;
    }
    n += 1;
    const deltas = row.map((x, j) => (x as number) - (means[j] as number));
    for (let j = 0; j < k; j++) means[j] = (means[j] as number) + (deltas[j] as number) / n;
    for (let j = 0; j < k; j++) {
      const after = (row[j] as number) - (means[j] as number);
      const cj = comoments[j] as number[];
      for (let l = 0; l < k; l++) cj[l] = (cj[l] as number) + (deltas[l] as number) * after;
    }
  }
  if (k < 2) return notEstimable('too_few_items', 'alpha needs at least two items');
  if (n < 2) return notEstimable('too_few_rows', `alpha needs at least two complete rows; there are ${n}`);
  let trace = 0;
  let total = 0;
  let correlationSum = 0;
  for (let j = 0; j < k; j++) {
    const cj = comoments[j] as number[];
    trace += cj[j] as number;
    for (let l = 0; l < k; l++) {
      total += cj[l] as number;
      const denominator = Math.sqrt((cj[j] as number) * ((comoments[l] as number[])[l] as number));
      if (!(denominator > 0)) return notEstimable('zero_variance', `item ${denominator > 0 ? l + 1 : (cj[j] as number) > 0 ? l + 1 : j + 1} does not vary`);
      correlationSum += (cj[l] as number) / denominator;
    }
  }
  if (!(total > 0)) return notEstimable('zero_variance', 'the total score does not vary');
  const factor = k / (k - 1);
  return { ok: true, alpha: factor * (1 - trace / total), standardizedAlpha: factor * (1 - k / correlationSum), items: k, n, incomplete };
}
