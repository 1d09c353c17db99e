import type { StatePoints } from './delay-embedding.js';
import { pointDistance } from './point-distance.js';

/**
 * Every point's other points sorted by distance, computed once and reused for every library
 * drawn from the same state space (all library sizes, all random libraries, all surrogates).
 */
export interface NeighbourTable {
  count: number;
  /** Entries kept per row. */
  width: number;
  /** `order[i·width + m]`: the m-th nearest point of i (ties: lower index first). */
  order: Uint32Array;
  /** `distance[i·width + m]`: its Euclidean distance from i (as {@link pointDistance} computes it). */
  distance: Float64Array;
  /** Entries filled in each row (fewer than `width` when the exclusion radius removed points). */
  filled: Uint32Array;
  /** True when every row lists all non-excluded points (nothing was cut to save memory). */
  complete: boolean;
  exclusionRadius: number;
}

/** Options of {@link neighbourTable}. */
export interface NeighbourTableOptions {
  /** Points within this many bins of a point are never its neighbours (default 0: itself only). */
  exclusionRadius?: number;
  /** Memory cap on `count · width` (default 2²³ entries: 32 MB of order, 64 MB of distances); rows are cut to fit. */
  maxEntries?: number;
}

/**
 * Builds a {@link NeighbourTable}: for each point, all other points outside the exclusion radius,
 * sorted by Euclidean distance with ties broken by index (the order of
 * {@link nearestNeighbours}). O(n² E) distances and n sorts of n keys. The sort packs each
 * distance's IEEE-754 bits (top bits) and the point index (low bits) into one 64-bit key so the
 * native typed-array sort can be used, then an insertion pass with the exact (distance, index)
 * comparison repairs the order where the packing dropped low distance bits: the result is
 * exactly the brute-force order. When n² exceeds `maxEntries`, rows keep only the nearest
 * `maxEntries / n` points and {@link tableProjection} falls back to brute force for a point
 * whose row runs out.
 */
export function neighbourTable(points: StatePoints, options: NeighbourTableOptions = {}): NeighbourTable {
  const radius = options.exclusionRadius ?? 0;
  const maxEntries = options.maxEntries ?? 1 << 23;
  const n = points.count;
  const width = Math.max(0, Math.min(n - 1, Math.floor(maxEntries / Math.max(n, 1))));
  const order = new Uint32Array(n * width);
  const sortedDistance = new Float64Array(n * width);
  const filled = new Uint32Array(n);
  const bits = Math.max(1, Math.ceil(Math.log2(Math.max(n, 2))));
  const lowMask = bits >= 32 ? 0xffffffff : (1 << bits) - 1;
  const keys = new BigUint64Array(n);
  const keyWords = new Uint32Array(keys.buffer);
  const scratch = new Float64Array(1);
  const scratchWords = new Uint32Array(scratch.buffer);
  const little = new Uint8Array(new Uint16Array([1]).buffer)[0] === 1;
  const lo = little ? 0 : 1;
  const hi = little ? 1 : 0;
  const distance = new Float64Array(n);
  const row = new Uint32Array(n);
  let complete = true;
  for (let i = 0; i < n; i++) {
    const ti = points.positions[i] as number;
    let m = 0;
    for (let j = 0; j < n; j++) {
      if (Math.abs((points.positions[j] as number) - ti) <= radius) continue;
      const d = pointDistance(points, i, j);
      distance[j] = d;
      scratch[0] = d;
      keyWords[2 * m + hi] = scratchWords[hi] as number;
      keyWords[2 * m + lo] = ((((scratchWords[lo] as number) >>> bits) << bits) | j) >>> 0;
      m++;
    }
    const view = keys.subarray(0, m);
    view.sort();
    for (let s = 0; s < m; s++) row[s] = (keyWords[2 * s + lo] as number) & lowMask;
    // Exact repair: insertion sort on (distance, index); nearly sorted, so about linear.
    for (let s = 1; s < m; s++) {
      const v = row[s] as number;
      const dv = distance[v] as number;
      let b = s - 1;
      while (b >= 0) {
        const u = row[b] as number;
        const du = distance[u] as number;
        if (du > dv || (du === dv && u > v)) {
          row[b + 1] = u;
          b--;
        } else break;
      }
      row[b + 1] = v;
    }
    const keep = Math.min(m, width);
    if (keep < m) complete = false;
    order.set(row.subarray(0, keep), i * width);
    for (let s = 0; s < keep; s++) sortedDistance[i * width + s] = distance[row[s] as number] as number;
    filled[i] = keep;
  }
  return { count: n, width, order, distance: sortedDistance, filled, complete, exclusionRadius: radius };
}
