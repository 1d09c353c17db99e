import type { StatePoints } from './delay-embedding.js';
import type { NeighbourTable } from './neighbour-table.js';
import { nearestNeighboursInto } from './nearest-neighbours.js';
import { pointDistance } from './point-distance.js';
import { simplexEstimate } from './simplex-estimate.js';

/** A library as a membership mask (for the table scan) and an index list (for the brute-force fallback). */
export interface Library {
  mask: Uint8Array;
  members: ArrayLike<number>;
}

/**
 * Simplex projection for one library using a precomputed {@link NeighbourTable}: the nearest
 * library members of each prediction point are read off its sorted row, skipping points outside
 * the library, instead of searching; a small library (|L|²·(E + 2) < k·n, a measured crossover) is searched directly, which is
 * cheaper than scanning deep into the rows. Gives exactly the estimates of {@link simplexProjection}
 * with the same exclusion radius (a test checks this against brute force). Writes estimates into
 * `out[p]` for `prediction[p]` (NaN when no library point is available) and returns `out`.
 */
export function tableProjection(
  table: NeighbourTable,
  points: StatePoints,
  target: ArrayLike<number>,
  library: Library,
  prediction: ArrayLike<number>,
  neighbours: number,
  out: Float64Array = new Float64Array(prediction.length),
): Float64Array {
  const { order, filled, width, complete } = table;
  const mask = library.mask;
  const distances = new Float64Array(neighbours);
  const values = new Float64Array(neighbours);
  const indices = new Int32Array(neighbours);
  const size = library.members.length;
  // A small library is searched directly (|library| distances per point) rather than by scanning
  // the sorted rows (about k·n/|library| entries per point); both give the same neighbours.
  const direct = size * size * (points.E + 2) < neighbours * table.count;
  for (let p = 0; p < prediction.length; p++) {
    const i = prediction[p] as number;
    if (direct) {
      const found = nearestNeighboursInto(points, i, library.members, neighbours, table.exclusionRadius, indices, distances);
      for (let m = 0; m < found; m++) values[m] = target[indices[m] as number] as number;
      out[p] = simplexEstimate(distances, values, found) ?? Number.NaN;
      continue;
    }
    const start = i * width;
    const end = start + (filled[i] as number);
    let found = 0;
    for (let s = start; s < end && found < neighbours; s++) {
      const j = order[s] as number;
      if (mask[j] === 0) continue;
      distances[found] = pointDistance(points, i, j);
      values[found] = target[j] as number;
      found++;
    }
    if (found < neighbours && !complete) {
      // The row was cut to save memory and ran out: search this point directly.
      found = nearestNeighboursInto(points, i, library.members, neighbours, table.exclusionRadius, indices, distances);
      for (let m = 0; m < found; m++) values[m] = target[indices[m] as number] as number;
    }
    out[p] = simplexEstimate(distances, values, found) ?? Number.NaN;
  }
  return out;
}
