import { pearsonCorrelation } from '../stats/pearson-correlation.js';
import type { StatResult } from '../stats/stat-result.js';
import type { AlignedPair } from './aligned-pair.js';

/** Pearson's r over every pair, ignoring persons: a description, with no interval or p-value. */
export interface PooledCorrelation {
  r: number;
  /** Complete pairs. */
  n: number;
  /** Why there is no interval or p-value. */
  note: string;
}

/** Why the pooled r gets no interval or p-value. */
export const POOLED_NOTE = 'descriptive only: pairs are clustered within persons, so an interval or p-value that treats them as independent would be too narrow (Bland & Altman 1995)';

/**
 * Pearson's r over all complete pairs, as a description only. Repeated occasions of a person are
 * not independent, so the usual Fisher interval and t test of this r would be too narrow and are
 * not given (Bland & Altman 1995, BMJ 310:446). Not estimable as `pearsonCorrelation` is not.
 */
export function pooledCorrelation(pairs: Iterable<AlignedPair>): StatResult<PooledCorrelation> {
  const r = pearsonCorrelation(pairs, (d) => d.x, (d) => d.y);
  if (!r.ok) return r;
  return { ok: true, r: r.r, n: r.n, note: POOLED_NOTE };
}
