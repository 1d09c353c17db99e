import type { StatePoints } from './delay-embedding.js';

/** Euclidean distance between state vectors `a` and `b` of `points` (no square root shortcut). */
export function pointDistance(points: StatePoints, a: number, b: number): number {
  const { E, vectors } = points;
  let s = 0;
  const oa = a * E;
  const ob = b * E;
  for (let j = 0; j < E; j++) {
    const d = (vectors[oa + j] as number) - (vectors[ob + j] as number);
    s += d * d;
  }
  return Math.sqrt(s);
}
