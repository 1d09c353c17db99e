import type { StatePoints } from './delay-embedding.js';
import { pointDistance } from './point-distance.js';

/** The k nearest library points of one point, nearest first. */
export interface Neighbours {
  indices: number[];
  distances: number[];
}

/**
 * Brute-force k nearest neighbours of point `i` among the `library` points (indices into
 * `points`), excluding every library point whose bin lies within `exclusionRadius` bins of
 * point i's bin (radius 0 excludes the point itself). Ties are broken by the lower index, the
 * same order {@link neighbourTable} uses.
 */
export function nearestNeighbours(points: StatePoints, i: number, library: ArrayLike<number>, k: number, exclusionRadius = 0): Neighbours {
  const indices: number[] = [];
  const distances: number[] = [];
  const ti = points.positions[i] as number;
  const before = (d: number, j: number, at: number): boolean =>
    d < (distances[at] as number) || (d === distances[at] && j < (indices[at] as number));
  for (let m = 0; m < library.length; m++) {
    const j = library[m] as number;
    if (Math.abs((points.positions[j] as number) - ti) <= exclusionRadius) continue;
    const d = pointDistance(points, i, j);
    if (indices.length === k) {
      if (!before(d, j, k - 1)) continue;
      indices[k - 1] = j;
      distances[k - 1] = d;
    } else {
      indices.push(j);
      distances.push(d);
    }
    for (let at = indices.length - 1; at > 0 && before(distances[at] as number, indices[at] as number, at - 1); at--) {
      const dj = distances[at] as number;
      const ij = indices[at] as number;
      distances[at] = distances[at - 1] as number;
      indices[at] = indices[at - 1] as number;
      distances[at - 1] = dj;
      indices[at - 1] = ij;
    }
  }
  return { indices, distances };
}
