import type { StatePoints } from './delay-embedding.js';
import { crossMapEstimates, emptyLibraryNeighbours, libraryNeighbours, type Library } from './library-neighbours.js';
import type { NeighbourTable } from './neighbour-table.js';

export type { Library } from './library-neighbours.js';

/**
 * Simplex projection for one library using a precomputed {@link NeighbourTable}
 * ({@link libraryNeighbours}, then {@link crossMapEstimates}). Gives exactly the estimates of
 * {@link simplexProjection} with the same exclusion radius (a test checks this against brute
 * force). Writes estimates into `out[p]` for `prediction[p]` (NaN when no library point is
 * available) and returns `out`.
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
  const sets = libraryNeighbours(points, library, prediction, table.exclusionRadius, emptyLibraryNeighbours(prediction.length, neighbours), table);
  return crossMapEstimates(sets, target, out);
}
