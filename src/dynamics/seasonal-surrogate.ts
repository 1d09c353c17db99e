import { isNumber } from '../stats/is-number.js';
import { shuffle } from '../stats/shuffle.js';
import type { RandomSource } from '../stats/random.js';

/**
 * A seasonal surrogate (as used in the EDM literature, e.g. Deyle et al. 2016, PNAS, on influenza and humidity, cited from memory; the EDM libraries call them
 * "seasonal" surrogates): the series is split into a cycle (the mean of the observed values at
 * each phase, e.g. the bin of the day) and residuals; the residuals are permuted among the
 * observed bins and added back to the cycle. Keeps the shared daily rhythm, destroys everything
 * else, so two series that only share a rhythm do not look causally linked.
 * `phase[t]` is any integer label of bin t's position in the cycle.
 */
export function seasonalSurrogate(values: readonly (number | undefined)[], phase: readonly number[], random: RandomSource): (number | undefined)[] {
  const sums = new Map<number, { n: number; mean: number }>();
  values.forEach((v, t) => {
    if (!isNumber(v)) return;
    const key = phase[t] as number;
    const s = sums.get(key) ?? { n: 0, mean: 0 };
    s.n += 1;
    s.mean += (v - s.mean) / s.n;
    sums.set(key, s);
  });
  const residuals: number[] = [];
  values.forEach((v, t) => {
    if (isNumber(v)) residuals.push(v - (sums.get(phase[t] as number) as { mean: number }).mean);
  });
  const permuted = shuffle(residuals, random);
  let next = 0;
  return values.map((v, t) => (isNumber(v) ? (sums.get(phase[t] as number) as { mean: number }).mean + (permuted[next++] as number) : undefined));
}
