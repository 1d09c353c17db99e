/**
 * Pearson's ρ between observed values and estimates over the entries where the estimate is
 * finite (two passes: means, then centred sums), the skill of {@link forecastSkill} without its
 * error measures, for the inner loop of cross mapping. Undefined with fewer than 3 pairs or a
 * constant side. Clamped to [−1, 1].
 */
export function skillRho(observed: ArrayLike<number>, estimates: ArrayLike<number>): number | undefined {
  const length = Math.min(observed.length, estimates.length);
  let n = 0;
  let mx = 0;
  let my = 0;
  for (let i = 0; i < length; i++) {
    const y = estimates[i] as number;
    if (!Number.isFinite(y)) continue;
    n++;
    mx += observed[i] as number;
    my += y;
  }
  if (n < 3) return undefined;
  mx /= n;
  my /= n;
  let sxx = 0;
  let syy = 0;
  let sxy = 0;
  for (let i = 0; i < length; i++) {
    const y = estimates[i] as number;
    if (!Number.isFinite(y)) continue;
    const dx = (observed[i] as number) - mx;
    const dy = y - my;
    sxx += dx * dx;
    syy += dy * dy;
    sxy += dx * dy;
  }
  if (!(sxx > 0) || !(syy > 0)) return undefined;
  return Math.max(-1, Math.min(1, sxy / Math.sqrt(sxx * syy)));
}
