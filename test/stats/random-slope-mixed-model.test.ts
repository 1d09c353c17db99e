import { describe, expect, it } from 'vitest';
import { minimizeNelderMead } from '../../src/stats/minimize-nelder-mead.js';
import { randomSlopeMixedModel } from '../../src/stats/random-slope-mixed-model.js';

describe('minimizeNelderMead', () => {
  it('finds the minimum (1, 1) of Rosenbrock’s function from the classic start (−1.2, 1) (Rosenbrock 1960)', () => {
    const f = (x: readonly number[]) => 100 * ((x[1] as number) - (x[0] as number) ** 2) ** 2 + (1 - (x[0] as number)) ** 2;
    const m = minimizeNelderMead(f, [-1.2, 1], { tolerance: 1e-14, xTolerance: 1e-9 });
    expect(m.x[0]).toBeCloseTo(1, 5);
    expect(m.x[1]).toBeCloseTo(1, 5);
    expect(m.value).toBeLessThan(1e-10);
  });
});

describe('randomSlopeMixedModel: when it cannot be fitted', () => {
  const rows = (persons: number, occasions: number, x: (p: number, t: number) => number) =>
    Array.from({ length: persons }, (_, p) => Array.from({ length: occasions }, (_, t) => ({ g: `p${p}`, x: [x(p, t)], y: p + 0.5 * t + ((p * 7 + t * 3) % 5) / 5 }))).flat();
  it('says why with fewer than 3 persons', () => {
    const fit = randomSlopeMixedModel(rows(2, 6, (_, t) => t), (d) => d.g, (d) => d.y, (d) => d.x);
    expect(fit.ok ? '' : fit.code).toBe('too_few_persons');
  });
  it('says why when the slope predictor never varies within a person', () => {
    const fit = randomSlopeMixedModel(rows(5, 6, (p) => p), (d) => d.g, (d) => d.y, (d) => d.x);
    expect(fit.ok ? '' : fit.code).toBe('slope_constant_within');
  });
  it('says why with about two observations per person', () => {
    const fit = randomSlopeMixedModel(rows(5, 2, (_, t) => t), (d) => d.g, (d) => d.y, (d) => d.x);
    expect(fit.ok ? '' : fit.code).toBe('too_few_observations');
  });
  it('marks a fit whose slopes do not vary as singular, with a slope variance near 0 and no NaN', () => {
    // Every person has the same slope 0.5 and the same deterministic noise pattern.
    const data = Array.from({ length: 8 }, (_, p) => Array.from({ length: 6 }, (_, t) => ({ g: `p${p}`, x: [t], y: p * 1.5 + 0.5 * t + (t % 2 ? 0.3 : -0.3) }))).flat();
    const fit = randomSlopeMixedModel(data, (d) => d.g, (d) => d.y, (d) => d.x);
    if (!fit.ok) throw new Error(fit.reason);
    expect(fit.boundary).toBe(true);
    expect(fit.varianceSlope).toBeLessThan(1e-6);
    // With no person-to-person variation left, the slope is the within-person OLS slope 0.5 + 0.9/17.5.
    expect(fit.fixed[1]?.estimate).toBeCloseTo(0.5 + 0.9 / 17.5, 6);
    expect(JSON.stringify(fit)).not.toMatch(/NaN|null/);
  });
});
