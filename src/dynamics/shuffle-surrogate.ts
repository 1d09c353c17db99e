import { isNumber } from '../stats/is-number.js';
import { shuffle } from '../stats/shuffle.js';
import type { RandomSource } from '../stats/random.js';

/**
 * A random-shuffle surrogate: the observed values permuted among the observed bins (missing bins
 * stay missing). Keeps the distribution, destroys all temporal structure; the null model of "no
 * dynamics at all" for cross-map significance.
 */
export function shuffleSurrogate(values: readonly (number | undefined)[], random: RandomSource): (number | undefined)[] {
  const observed: number[] = [];
  for (const v of values) if (isNumber(v)) observed.push(v);
  const permuted = shuffle(observed, random);
  let next = 0;
  return values.map((v) => (isNumber(v) ? (permuted[next++] as number) : undefined));
}
