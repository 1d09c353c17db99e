import { isNumber } from '../stats/is-number.js';
import { notEstimable, type StatResult } from '../stats/stat-result.js';

/** Raw Cronbach's alpha from per-item variances and the variance of the total. */
export interface ItemAlpha {
  alpha: number;
  items: number;
  n: number;
}

/**
 * Cronbach's (1951) raw alpha, α = k/(k−1) · (1 − Σ s²ⱼ / s²_total), from sparse rows: each row
 * lists only its non-zero items as `[item, value]` pairs (absent items are 0). Needs no covariance
 * matrix, so it scales to lists with thousands of terms; item variances are two-pass (mean first,
 * then squared deviations, zeros included analytically). Equal to psych::alpha `raw_alpha` on
 * complete data. `k` is the number of items (items that never occur have variance 0 and count).
 *
 * Not estimable with k < 2, fewer than 2 rows, or a total score that does not vary.
 */
export function itemAlpha(rows: ReadonlyArray<ReadonlyArray<readonly [number, number]>>, k: number): StatResult<ItemAlpha> {
  const n = rows.length;
  if (k < 2) return notEstimable('too_few_items', 'alpha needs at least two items (terms)');
  if (n < 2) return notEstimable('too_few_rows', `alpha needs at least two rows; there are ${n}`);
  const sums = new Float64Array(k);
  const nonZero = new Int32Array(k);
  const totals = new Float64Array(n);
  rows.forEach((row, i) => {
    for (const [j, x] of row) {
      if (!isNumber(x) || j < 0 || j >= k) continue;
      sums[j] = (sums[j] as number) + x;
      nonZero[j] = (nonZero[j] as number) + 1;
      totals[i] = (totals[i] as number) + x;
    }
  });
  const means = sums.map((s) => s / n);
  const ss = new Float64Array(k);
  for (const row of rows) {
    for (const [j, x] of row) {
      if (!isNumber(x) || j < 0 || j >= k) continue;
      const d = x - (means[j] as number);
      ss[j] = (ss[j] as number) + d * d;
    }
  }
  let itemVariance = 0;
  for (let j = 0; j < k; j++) {
    const m = means[j] as number;
    itemVariance += ((ss[j] as number) + (n - (nonZero[j] as number)) * m * m) / (n - 1);
  }
  let totalMean = 0;
  for (const t of totals) totalMean += t;
  totalMean /= n;
  let totalSs = 0;
  for (const t of totals) totalSs += (t - totalMean) * (t - totalMean);
  const totalVariance = totalSs / (n - 1);
  if (!(totalVariance > 0)) return notEstimable('zero_variance', 'the total score does not vary');
  return { ok: true, alpha: (k / (k - 1)) * (1 - itemVariance / totalVariance), items: k, n };
}
