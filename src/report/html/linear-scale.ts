/**
 * A linear map from a data interval to a pixel interval: y = r0 + (x − d0)·(r1 − r0)/(d1 − d0).
 * A zero-width domain maps every value to the middle of the range (a constant series stays drawn).
 */
export function linearScale(domain: readonly [number, number], range: readonly [number, number]): (x: number) => number {
  const [d0, d1] = domain;
  const [r0, r1] = range;
  if (d1 === d0) return () => (r0 + r1) / 2;
  const k = (r1 - r0) / (d1 - d0);
  return (x) => r0 + (x - d0) * k;
}
