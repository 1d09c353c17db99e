import type { StatePoints } from './delay-embedding.js';

/** The k nearest library points of one point, nearest first. */
export interface Neighbours {
  indices: number[];
  distances: number[];
}

/**
 * Brute-force k nearest neighbours of point `i` among the `library` points (indices into
 * `points`) by Euclidean distance, excluding every library point whose bin lies within
 * `exclusionRadius` bins of point i's bin (radius 0 excludes the point itself). Ties are broken
 * by the lower index, the same order {@link neighbourTable} uses. O(|library| · E).
 */
export function nearestNeighbours(points: StatePoints, i: number, library: ArrayLike<number>, k: number, exclusionRadius = 0): Neighbours {
  const indices = new Int32Array(k);
  const distances = new Float64Array(k);
  const found = nearestNeighboursInto(points, i, library, k, exclusionRadius, indices, distances);
  return { indices: Array.from(indices.subarray(0, found)), distances: Array.from(distances.subarray(0, found)) };
}

/**
 * The allocation-free core of {@link nearestNeighbours}: writes the neighbours into `indices`
 * and `distances` (length ≥ k) and returns how many were found (< k when the library is small).
 */
export function nearestNeighboursInto(
  points: StatePoints,
  i: number,
  library: ArrayLike<number>,
  k: number,
  exclusionRadius: number,
  indices: Int32Array,
  distances: Float64Array,
): number {
  const { E, vectors, positions } = points;
  const ti = positions[i] as number;
  const oi = i * E;
  let found = 0;
  for (let m = 0; m < library.length; m++) {
    const j = library[m] as number;
    const dt = (positions[j] as number) - ti;
    if (dt <= exclusionRadius && dt >= -exclusionRadius) continue;
    const oj = j * E;
    let s = 0;
    for (let c = 0; c < E; c++) {
      const diff = (vectors[oi + c] as number) - (vectors[oj + c] as number);
      s += diff * diff;
    }
    const d = Math.sqrt(s);
    let at: number;
    if (found === k) {
      const last = distances[k - 1] as number;
      if (k === 0 || d > last || (d === last && j > (indices[k - 1] as number))) continue;
      at = k - 1;
    } else at = found++;
    // Shift larger entries right and insert (d, j).
    while (at > 0) {
      const dp = distances[at - 1] as number;
      if (dp > d || (dp === d && (indices[at - 1] as number) > j)) {
        distances[at] = dp;
        indices[at] = indices[at - 1] as number;
        at--;
      } else break;
    }
    distances[at] = d;
    indices[at] = j;
  }
  return found;
}
