import { quantile } from './quantile.js';
import { randomInteger, type RandomSource } from './random.js';
import { notEstimable, type StatResult } from './stat-result.js';

/** A percentile bootstrap interval. */
export interface BootstrapInterval {
  ciLow: number;
  ciHigh: number;
  /** Standard deviation of the replicate statistics (bootstrap standard error). */
  se: number;
  /** Replicates requested and replicates whose statistic could be computed. */
  replicates: number;
  succeeded: number;
  level: number;
}

/** Options of {@link clusterBootstrap}. */
export interface ClusterBootstrapOptions {
  /** Number of resamples (default 2000). */
  replicates?: number;
  /** Seeded source of randomness (see `random`). */
  random: RandomSource;
  /** Confidence level (default 0.95). */
  level?: number;
  /** Fewest successful replicates, as a share of `replicates`, for an interval (default 0.9). */
  minSuccessShare?: number;
}

/**
 * Cluster (case) bootstrap: resamples whole clusters (persons) with replacement, keeping each
 * cluster's observations together (Davison & Hinkley 1997, Bootstrap Methods and their
 * Application, §3.8; Field & Welsh 2007), recomputes `statistic` on each resample and returns the
 * percentile interval (quantiles (1−level)/2 and (1+level)/2 by `quantile`: Hyndman & Fan 1996
 * type 7, R's default `quantile`).
 *
 * `statistic` receives the resampled clusters as an array; a cluster drawn twice appears twice
 * and must be treated as two distinct clusters (use its array index as the cluster id). A
 * replicate whose statistic is `undefined` is counted as failed; when fewer than
 * `minSuccessShare` succeed no interval is returned.
 */
export function clusterBootstrap<T>(
  clusters: readonly (readonly T[])[],
  statistic: (sample: readonly (readonly T[])[]) => number | undefined,
  options: ClusterBootstrapOptions,
): StatResult<BootstrapInterval> {
  const replicates = options.replicates ?? 2000;
  const level = options.level ?? 0.95;
  const k = clusters.length;
  if (k < 2) return notEstimable('too_few_persons', `a cluster bootstrap needs at least 2 persons; there ${k === 1 ? 'is' : 'are'} ${k}`);
  const draws: number[] = [];
  for (let b = 0; b < replicates; b++) {
    const sample: (readonly T[])[] = new Array(k);
    for (let j = 0; j < k; j++) sample[j] = clusters[randomInteger(options.random, k)] as readonly T[];
    const value = statistic(sample);
    if (value !== undefined && Number.isFinite(value)) draws.push(value);
  }
  const succeeded = draws.length;
  if (succeeded < (options.minSuccessShare ?? 0.9) * replicates || succeeded < 2) {
    return notEstimable('bootstrap_failed', `only ${succeeded} of ${replicates} bootstrap resamples gave a value`);
  }
  draws.sort((a, b) => a - b);
  let m = 0;
  let m2 = 0;
  draws.forEach((x, j) => {
    const delta = x - m;
    m += delta / (j + 1);
    m2 += delta * (x - m);
  });
  return {
    ok: true,
    // At least 2 finite draws, so both quantiles exist for a level in (0, 1).
    ciLow: quantile(draws, (1 - level) / 2) as number,
    ciHigh: quantile(draws, (1 + level) / 2) as number,
    se: Math.sqrt(m2 / (succeeded - 1)),
    replicates,
    succeeded,
    level,
  };
}
