/** The result of a one-dimensional minimisation. */
export interface ScalarMinimum {
  x: number;
  value: number;
  evaluations: number;
}

/**
 * Minimises f on [lower, upper] by Brent's (1973) method, golden-section search combined with
 * successive parabolic interpolation (Brent, Algorithms for Minimization without Derivatives,
 * ch. 5; the `fmin` algorithm behind R's `optimize`). Converges to a local minimum to within
 * `tolerance` (absolute, default 1e-10) plus a relative term √ε·|x|.
 */
export function minimizeScalar(f: (x: number) => number, lower: number, upper: number, tolerance = 1e-10, maxEvaluations = 500): ScalarMinimum {
  const golden = 0.5 * (3 - Math.sqrt(5));
  const eps = Math.sqrt(Number.EPSILON);
  let a = lower;
  let b = upper;
  let v = a + golden * (b - a);
  let w = v;
  let x = v;
  let e = 0;
  let d = 0;
  let fx = f(x);
  let fv = fx;
  let fw = fx;
  let evaluations = 1;
  while (evaluations < maxEvaluations) {
    const xm = 0.5 * (a + b);
    const tol1 = eps * Math.abs(x) + tolerance / 3;
    const tol2 = 2 * tol1;
    if (Math.abs(x - xm) <= tol2 - 0.5 * (b - a)) break;
    let useGolden = true;
    if (Math.abs(e) > tol1) {
      // Parabola through x, v, w.
      let r = (x - w) * (fx - fv);
      let q = (x - v) * (fx - fw);
      let p = (x - v) * q - (x - w) * r;
      q = 2 * (q - r);
      if (q > 0) p = -p;
      else q = -q;
      r = e;
      e = d;
      if (Math.abs(p) < Math.abs(0.5 * q * r) && p > q * (a - x) && p < q * (b - x)) {
        d = p / q;
        const u = x + d;
        if (u - a < tol2 || b - u < tol2) d = xm >= x ? tol1 : -tol1;
        useGolden = false;
      }
    }
    if (useGolden) {
      e = x >= xm ? a - x : b - x;
      d = golden * e;
    }
    const u = Math.abs(d) >= tol1 ? x + d : x + (d > 0 ? tol1 : -tol1);
    const fu = f(u);
    evaluations += 1;
    if (fu <= fx) {
      if (u >= x) a = x;
      else b = x;
      v = w;
      fv = fw;
      w = x;
      fw = fx;
      x = u;
      fx = fu;
    } else {
      if (u < x) a = u;
      else b = u;
      if (fu <= fw || w === x) {
        v = w;
        fv = fw;
        w = u;
        fw = fu;
      } else if (fu <= fv || v === x || v === w) {
        v = u;
        fv = fu;
      }
    }
  }
  return { x, value: fx, evaluations };
}
