import { addCoMoment, emptyCoMoments } from '../stats/co-moments.js';
import { notEstimable, type StatResult } from '../stats/stat-result.js';

/** Agreement between observed values and their estimates. */
export interface Skill {
  /** Pearson correlation ρ of observed and estimated values (the EDM "skill"). */
  rho: number;
  /** Mean absolute error. */
  mae: number;
  /** Root mean squared error. */
  rmse: number;
  /** Pairs with both values. */
  n: number;
}

/**
 * Forecast (or cross-map) skill: Pearson's ρ between observed and estimated values, with MAE and
 * RMSE, over the pairs where both are finite. Co-moments by Welford's update. Not estimable with
 * fewer than 3 pairs or when either side is constant.
 */
export function forecastSkill(observed: ArrayLike<number | undefined>, estimated: ArrayLike<number | undefined>): StatResult<Skill> {
  const m = emptyCoMoments();
  let sae = 0;
  let sse = 0;
  const length = Math.min(observed.length, estimated.length);
  for (let i = 0; i < length; i++) {
    const x = observed[i];
    const y = estimated[i];
    if (x === undefined || y === undefined || !Number.isFinite(x) || !Number.isFinite(y)) continue;
    addCoMoment(m, x, y);
    sae += Math.abs(x - y);
    sse += (x - y) ** 2;
  }
  const { n, sxx, syy, sxy } = m;
  if (n < 3) return notEstimable('too_few_predictions', `${n} estimates; at least 3 are needed for a skill`);
  if (!(sxx > 0) || !(syy > 0)) return notEstimable('zero_variance', 'observed or estimated values are constant');
  return { ok: true, rho: Math.max(-1, Math.min(1, sxy / Math.sqrt(sxx * syy))), mae: sae / n, rmse: Math.sqrt(sse / n), n };
}
