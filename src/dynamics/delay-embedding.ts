import type { BinnedSeries } from './types.js';
import { spanValid } from './span-valid.js';

/** Delay-coordinate vectors of a series: vector r is `vectors[r·E … r·E + E − 1]`, taken at bin `positions[r]`. */
export interface StatePoints {
  E: number;
  tau: number;
  count: number;
  vectors: Float64Array;
  positions: Int32Array;
}

/**
 * Time-delay embedding (Takens 1981; as used by Sugihara & May 1990 and Sugihara et al. 2012):
 *
 *   v_t = (x_t, x_{t−τ}, x_{t−2τ}, …, x_{t−(E−1)τ})
 *
 * A vector is formed only when every bin it spans, t − (E − 1)τ … t, is observed and adjacent
 * (no missing bin, no break such as excluded night hours; {@link spanValid}), so nothing is
 * interpolated. For τ > 1 this also requires the bins between the coordinates to be observed.
 * `keep(t)` can drop further positions (for example those whose target is missing).
 */
export function delayEmbedding(series: BinnedSeries, E: number, tau = 1, keep?: (t: number) => boolean): StatePoints {
  if (!Number.isInteger(E) || E < 1) throw new Error(`delayEmbedding: E must be a positive integer, got ${E}`);
  if (!Number.isInteger(tau) || tau < 1) throw new Error(`delayEmbedding: tau must be a positive integer, got ${tau}`);
  const span = (E - 1) * tau;
  const positions: number[] = [];
  for (let t = span; t < series.values.length; t++) {
    if (spanValid(series, t - span, t) && (!keep || keep(t))) positions.push(t);
  }
  const vectors = new Float64Array(positions.length * E);
  positions.forEach((t, r) => {
    for (let j = 0; j < E; j++) vectors[r * E + j] = series.values[t - j * tau] as number;
  });
  return { E, tau, count: positions.length, vectors, positions: Int32Array.from(positions) };
}
