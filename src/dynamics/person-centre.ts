import { mean } from '../stats/mean.js';

/**
 * Person-mean centring: x_t − x̄ with x̄ the mean of the observed bins; missing bins stay
 * `undefined`. Returns the series unchanged (all `undefined`) when nothing is observed.
 */
export function personCentre(values: readonly (number | undefined)[]): (number | undefined)[] {
  const m = mean(values);
  return values.map((v) => (v === undefined || m === undefined || !Number.isFinite(v) ? undefined : v - m));
}
