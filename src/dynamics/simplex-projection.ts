import type { StatePoints } from './delay-embedding.js';
import { nearestNeighboursInto } from './nearest-neighbours.js';
import { simplexEstimate } from './simplex-estimate.js';

/** Options of {@link simplexProjection}. */
export interface ProjectionOptions {
  /** Neighbours per estimate (default E + 1, the minimal simplex). */
  neighbours?: number;
  /** Library points within this many bins of the predicted point are skipped (default 0: the point itself). */
  exclusionRadius?: number;
}

/**
 * Simplex projection by brute force (Sugihara & May 1990): for each point in `prediction`, its
 * E + 1 nearest `library` points in state space ({@link nearestNeighbours}) give the estimate
 * Σ w_i y_i / Σ w_i ({@link simplexEstimate}) of `target[i]`, where `target` holds one value per
 * point (the same series Tp bins ahead for a forecast, another series at the same bin for cross
 * mapping). Returns one estimate per prediction point, `undefined` when no library point is
 * available. O(|prediction| · |library| · E); the reference implementation that
 * {@link tableProjection} is checked against.
 */
export function simplexProjection(
  points: StatePoints,
  target: ArrayLike<number>,
  library: ArrayLike<number>,
  prediction: ArrayLike<number>,
  options: ProjectionOptions = {},
): (number | undefined)[] {
  const k = options.neighbours ?? points.E + 1;
  const radius = options.exclusionRadius ?? 0;
  const out: (number | undefined)[] = [];
  const values = new Float64Array(k);
  const indices = new Int32Array(k);
  const distances = new Float64Array(k);
  for (let p = 0; p < prediction.length; p++) {
    const found = nearestNeighboursInto(points, prediction[p] as number, library, k, radius, indices, distances);
    for (let m = 0; m < found; m++) values[m] = target[indices[m] as number] as number;
    out.push(simplexEstimate(distances, values, found));
  }
  return out;
}
