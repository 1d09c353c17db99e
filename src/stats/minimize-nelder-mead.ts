/** The result of a multidimensional minimisation. */
export interface SimplexMinimum {
  x: number[];
  value: number;
  evaluations: number;
}

/**
 * Minimises f over ℝⁿ by the Nelder–Mead (1965) simplex method with the standard coefficients
 * (reflection 1, expansion 2, contraction ½, shrink ½; Lagarias et al. 1998, SIAM J Optim 9:112),
 * restarted from the best point (at most 5 times) until a restart improves the minimum by less
 * than 1000·`tolerance` (a restart guards against the method's known premature collapse). Stops a run when
 * the simplex's function values span less than `tolerance` (absolute, default 1e-10) and its
 * vertices lie within `xTolerance`·(1 + |x|) of the best (default 1e-6); `step` is the initial
 * edge length.
 */
export function minimizeNelderMead(f: (x: readonly number[]) => number, start: readonly number[], options: { step?: number; tolerance?: number; xTolerance?: number; maxEvaluations?: number } = {}): SimplexMinimum {
  const n = start.length;
  const tolerance = options.tolerance ?? 1e-10;
  const xTolerance = options.xTolerance ?? 1e-6;
  const maxEvaluations = options.maxEvaluations ?? 20000;
  let evaluations = 0;
  const evaluate = (x: number[]): number => {
    evaluations += 1;
    const v = f(x);
    return Number.isFinite(v) ? v : Number.MAX_VALUE;
  };
  const run = (origin: readonly number[], step: number): { x: number[]; value: number } => {
    const points: number[][] = [origin.slice()];
    for (let i = 0; i < n; i++) {
      const p = origin.slice();
      p[i] = (p[i] as number) + step * (Math.abs(p[i] as number) > 1 ? Math.abs(p[i] as number) : 1);
      points.push(p);
    }
    let values = points.map(evaluate);
    while (evaluations < maxEvaluations) {
      const order = values.map((_, i) => i).sort((a, b) => (values[a] as number) - (values[b] as number));
      const sorted = order.map((i) => points[i] as number[]);
      values = order.map((i) => values[i] as number);
      points.splice(0, points.length, ...sorted);
      const best = points[0] as number[];
      const spread = (values[n] as number) - (values[0] as number);
      const size = Math.max(...points.slice(1).map((p) => Math.max(...p.map((v, j) => Math.abs(v - (best[j] as number)) / (1 + Math.abs(best[j] as number))))));
      if (spread <= tolerance && size <= xTolerance) break;
      const centroid = new Array<number>(n).fill(0);
      for (let i = 0; i < n; i++) for (let j = 0; j < n; j++) centroid[j] = (centroid[j] as number) + ((points[i] as number[])[j] as number) / n;
      const worst = points[n] as number[];
      const along = (t: number): number[] => centroid.map((c, j) => c + t * (c - (worst[j] as number)));
      const reflected = along(1);
      const fr = evaluate(reflected);
      if (fr < (values[0] as number)) {
        const expanded = along(2);
        const fe = evaluate(expanded);
        if (fe < fr) { points[n] = expanded; values[n] = fe; } else { points[n] = reflected; values[n] = fr; }
      } else if (fr < (values[n - 1] as number)) {
        points[n] = reflected;
        values[n] = fr;
      } else {
        const outside = fr < (values[n] as number);
        const contracted = along(outside ? 0.5 : -0.5);
        const fc = evaluate(contracted);
        if (fc < (outside ? fr : (values[n] as number))) {
          points[n] = contracted;
          values[n] = fc;
        } else {
          for (let i = 1; i <= n; i++) {
            points[i] = (points[i] as number[]).map((v, j) => (best[j] as number) + 0.5 * (v - (best[j] as number)));
            values[i] = evaluate(points[i] as number[]);
          }
        }
      }
    }
    let k = 0;
    for (let i = 1; i <= n; i++) if ((values[i] as number) < (values[k] as number)) k = i;
    return { x: points[k] as number[], value: values[k] as number };
  };
  let best = run(start, options.step ?? 0.5);
  for (let restart = 0; restart < 5 && evaluations < maxEvaluations; restart++) {
    const next = run(best.x, 0.05);
    const improved = best.value - next.value > 1000 * tolerance;
    if (next.value < best.value) best = next;
    if (!improved) break;
  }
  return { x: best.x, value: best.value, evaluations };
}
