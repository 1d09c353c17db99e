import { describe, expect, it } from 'vitest';
import { linearMixedModel } from '../../src/stats/linear-mixed-model.js';

describe('linearMixedModel (random intercept, REML)', () => {
  it('reduces to ordinary least squares with a boundary fit when groups do not differ', () => {
    // y = 1 + 2x exactly plus alternating noise that is identical in every group.
    const rows = ['a', 'b', 'c'].flatMap((g) => [0, 1, 2, 3].map((x) => ({ g, x, y: 1 + 2 * x + (x % 2 === 0 ? 0.5 : -0.5) })));
    const fit = linearMixedModel(rows, (d) => d.g, (d) => d.y, (d) => [d.x], { names: ['x'] });
    if (!fit.ok) throw new Error(fit.reason);
    expect(fit.boundary).toBe(true);
    expect(fit.varianceIntercept).toBe(0);
    expect(fit.fixed[1]?.name).toBe('x');
    expect(fit.fixed[1]?.estimate).toBeCloseTo(1.8, 10); // OLS slope 9/5
    expect(fit.fixed[1]?.level).toBe('within');
    expect(fit.fixed[0]?.level).toBe('between');
  });
  it('says why when there is a single person', () => {
    const fit = linearMixedModel([1, 2, 3].map((x) => ({ x, y: x })), () => 'p', (d) => d.y, (d) => [d.x]);
    expect(fit.ok ? '' : fit.code).toBe('too_few_persons');
  });
  it('says why when a predictor is constant', () => {
    const rows = ['a', 'b', 'c'].flatMap((g, k) => [0, 1, 2].map((t) => ({ g, x: 5, y: t + k })));
    const fit = linearMixedModel(rows, (d) => d.g, (d) => d.y, (d) => [d.x]);
    expect(fit.ok ? '' : fit.code).toBe('collinear_predictors');
  });
  it('skips rows with a missing response or predictor', () => {
    const rows = ['a', 'b', 'c', 'd'].flatMap((g, k) => [0, 1, 2, 3].map((x) => ({ g, x, y: x === 3 && g === 'a' ? undefined : k + x + ((x * 7 + k * 3) % 5) / 5 })));
    const fit = linearMixedModel(rows, (d) => d.g, (d) => d.y, (d) => [d.x]);
    expect(fit.ok && fit.n).toBe(15);
  });
});
