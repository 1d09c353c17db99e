/** Count, means and sums of squares and co-products of paired values (see {@link addCoMoment}). */
export interface CoMoments {
  n: number;
  mx: number;
  my: number;
  /** Σ (x − x̄)². */
  sxx: number;
  /** Σ (y − ȳ)². */
  syy: number;
  /** Σ (x − x̄)(y − ȳ). */
  sxy: number;
}

/** An empty accumulator for {@link addCoMoment}. */
export function emptyCoMoments(): CoMoments {
  return { n: 0, mx: 0, my: 0, sxx: 0, syy: 0, sxy: 0 };
}

/**
 * Adds one complete pair (x, y) to `m` by Welford's (1962) one-pass update, extended to the
 * co-product: δx = x − x̄; δy = y − ȳ; x̄ += δx/n; ȳ += δy/n; Sxx += δx(x − x̄); Syy += δy(y − ȳ);
 * Sxy += δx(y − ȳ). Numerically stable; the caller skips missing values.
 */
export function addCoMoment(m: CoMoments, x: number, y: number): void {
  m.n += 1;
  const dx = x - m.mx;
  const dy = y - m.my;
  m.mx += dx / m.n;
  m.my += dy / m.n;
  m.sxx += dx * (x - m.mx);
  m.syy += dy * (y - m.my);
  m.sxy += dx * (y - m.my);
}
