import type { StatePoints } from './delay-embedding.js';
import { nearestNeighboursInto } from './nearest-neighbours.js';
import type { NeighbourTable } from './neighbour-table.js';

/** A library as a membership mask (for the table scan) and an index list (for the direct search). */
export interface Library {
  mask: Uint8Array;
  members: ArrayLike<number>;
}

/**
 * The simplex neighbours of every prediction point in one library, with their weights: what a
 * cross map needs from the state space, independent of the series being estimated, so one set
 * serves the observed target and all its surrogates.
 */
export interface LibraryNeighbours {
  /** Neighbours per point (E + 1 for simplex projection). */
  k: number;
  /** Prediction points. */
  count: number;
  /** `index[p·k + m]`: the m-th nearest library point of prediction point p. */
  index: Int32Array;
  /** `weight[p·k + m]` = exp(−d_m / max(d_1, 1e−6)) (Sugihara et al. 2012). */
  weight: Float64Array;
  /** Σ of the weights of point p. */
  weightSum: Float64Array;
  /** Neighbours found for point p (0: no estimate). */
  found: Int32Array;
}

/** Empty neighbour sets for `count` prediction points, to be filled by {@link libraryNeighbours}. */
export function emptyLibraryNeighbours(count: number, k: number): LibraryNeighbours {
  return { k, count, index: new Int32Array(count * k), weight: new Float64Array(count * k), weightSum: new Float64Array(count), found: new Int32Array(count) };
}

/**
 * Finds the k nearest library points of each prediction point (Euclidean, ties to the lower
 * index, library points within `exclusionRadius` bins skipped) and their simplex weights, into
 * `out`. With a {@link NeighbourTable} the neighbours are read off each point's sorted row,
 * skipping non-members; a small library (|L|²·(E + 2) < k·n, a measured crossover) or no table
 * means a direct search ({@link nearestNeighboursInto}), which gives the same neighbours. A row
 * cut to save memory that runs out also falls back to the direct search.
 */
export function libraryNeighbours(
  points: StatePoints,
  library: Library,
  prediction: ArrayLike<number>,
  exclusionRadius: number,
  out: LibraryNeighbours,
  table?: NeighbourTable,
): LibraryNeighbours {
  const k = out.k;
  const { index, weight, weightSum, found: foundOut } = out;
  const mask = library.mask;
  const size = library.members.length;
  const direct = table === undefined || size * size * (points.E + 2) < k * table.count;
  const indices = new Int32Array(k);
  const distances = new Float64Array(k);
  for (let p = 0; p < prediction.length; p++) {
    const i = prediction[p] as number;
    let found = 0;
    if (!direct) {
      const { order, distance, filled, width } = table;
      const start = i * width;
      const end = start + (filled[i] as number);
      for (let s = start; s < end && found < k; s++) {
        const j = order[s] as number;
        if (mask[j] === 0) continue;
        distances[found] = distance[s] as number;
        indices[found] = j;
        found++;
      }
    }
    if (direct || (found < k && !table.complete)) found = nearestNeighboursInto(points, i, library.members, k, exclusionRadius, indices, distances);
    const scale = Math.max(found > 0 ? (distances[0] as number) : 0, 1e-6);
    const o = p * k;
    let sum = 0;
    for (let m = 0; m < found; m++) {
      const w = Math.exp(-(distances[m] as number) / scale);
      index[o + m] = indices[m] as number;
      weight[o + m] = w;
      sum += w;
    }
    weightSum[p] = sum;
    foundOut[p] = found;
  }
  return out;
}

/**
 * Simplex estimates of `target` (one value per state point) from neighbour sets: Σ w_i y_i / Σ w_i
 * per prediction point, summed in neighbour order as {@link simplexEstimate} does, so the result
 * is exactly that of brute-force simplex projection. NaN where no neighbour was found.
 */
export function crossMapEstimates(neighbours: LibraryNeighbours, target: ArrayLike<number>, out: Float64Array = new Float64Array(neighbours.count)): Float64Array {
  const { k, index, weight, weightSum, found } = neighbours;
  for (let p = 0; p < neighbours.count; p++) {
    const f = found[p] as number;
    if (f === 0) {
      out[p] = Number.NaN;
      continue;
    }
    let s = 0;
    const o = p * k;
    for (let m = 0; m < f; m++) s += (weight[o + m] as number) * (target[index[o + m] as number] as number);
    out[p] = s / (weightSum[p] as number);
  }
  return out;
}
