import { mean } from '../stats/mean.js';
import { quantile } from '../stats/quantile.js';
import { randomInteger, type RandomSource } from '../stats/random.js';

/** A difference of means with a percentile bootstrap interval. */
export interface MeanDifference {
  /** mean(b) − mean(a). */
  difference: number;
  low: number;
  high: number;
  level: number;
}

/**
 * Percentile bootstrap interval (Efron & Tibshirani 1993, ch. 13) of mean(b) − mean(a), resampling
 * each sample with replacement independently `replicates` times. Returns undefined when either
 * sample is empty.
 */
export function bootstrapMeanDifference(
  a: readonly number[],
  b: readonly number[],
  random: RandomSource,
  replicates = 1000,
  level = 0.95,
): MeanDifference | undefined {
  if (a.length === 0 || b.length === 0) return undefined;
  const differences = new Float64Array(replicates);
  const resampleMean = (xs: readonly number[]): number => {
    let s = 0;
    for (let i = 0; i < xs.length; i++) s += xs[randomInteger(random, xs.length)] as number;
    return s / xs.length;
  };
  for (let r = 0; r < replicates; r++) differences[r] = resampleMean(b) - resampleMean(a);
  const alpha = (1 - level) / 2;
  return {
    difference: (mean(b) as number) - (mean(a) as number),
    low: quantile(differences, alpha) as number,
    high: quantile(differences, 1 - alpha) as number,
    level,
  };
}
