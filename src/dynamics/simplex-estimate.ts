/**
 * The simplex projection estimate from neighbours sorted by distance (Sugihara & May 1990,
 * Nature 344:734–741; weights as in Sugihara et al. 2012 and the EDM libraries):
 *
 *   w_i = exp(−d_i / max(d_1, 1e−6)),   ŷ = Σ w_i y_i / Σ w_i
 *
 * with d_1 the smallest distance. Reads the first `count` entries of `distances` and `targets`.
 * Returns `undefined` when `count` is 0.
 */
export function simplexEstimate(distances: ArrayLike<number>, targets: ArrayLike<number>, count: number): number | undefined {
  if (count <= 0) return undefined;
  const scale = Math.max(distances[0] as number, 1e-6);
  let sw = 0;
  let swy = 0;
  for (let i = 0; i < count; i++) {
    const w = Math.exp(-(distances[i] as number) / scale);
    sw += w;
    swy += w * (targets[i] as number);
  }
  return swy / sw;
}
