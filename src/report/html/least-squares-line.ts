/**
 * Ordinary least-squares line y = a + b·x through the points (two-pass: means, then centred
 * sums), or undefined when x does not vary. Drawn on scatters as a reading aid.
 */
export function leastSquaresLine(points: readonly { x: number; y: number }[]): { intercept: number; slope: number } | undefined {
  if (points.length < 2) return undefined;
  let mx = 0;
  let my = 0;
  for (const p of points) {
    mx += p.x;
    my += p.y;
  }
  mx /= points.length;
  my /= points.length;
  let sxx = 0;
  let sxy = 0;
  for (const p of points) {
    sxx += (p.x - mx) * (p.x - mx);
    sxy += (p.x - mx) * (p.y - my);
  }
  if (!(sxx > 0)) return undefined;
  const slope = sxy / sxx;
  return { intercept: my - slope * mx, slope };
}
