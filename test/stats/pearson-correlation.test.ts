import { describe, expect, it } from 'vitest';
import { pearsonCorrelation } from '../../src/stats/pearson-correlation.js';

describe('pearsonCorrelation', () => {
  // Anscombe (1973) quartet, set 1: r = 0.8164205 (R cor(anscombe$x1, anscombe$y1), from memory
  // of the published r = .816 common to all four sets).
  const x = [10, 8, 13, 9, 11, 14, 6, 4, 12, 7, 5];
  const y = [8.04, 6.95, 7.58, 8.81, 8.33, 9.96, 7.24, 4.26, 10.84, 4.82, 5.68];
  it('gives r = .816 for Anscombe’s (1973) first data set', () => {
    const result = pearsonCorrelation(x.map((xi, i) => [xi, y[i]] as const));
    if (!result.ok) throw new Error(result.reason);
    expect(result.r).toBeCloseTo(0.8164205, 6);
    expect(result.n).toBe(11);
    expect(result.df).toBe(9);
    // t = r√(9/(1−r²)) = 4.241455, two-sided p = 0.002170 (R cor.test, from memory of Anscombe's regression p).
    expect(result.p).toBeCloseTo(0.00217, 5);
    expect(result.ciLow).toBeCloseTo(Math.tanh(Math.atanh(0.8164205) - 1.959964 / Math.sqrt(8)), 5);
  });
  it('skips pairs with a missing value', () => {
    const result = pearsonCorrelation([[1, 2], [2, undefined], [3, 5], [undefined, 1], [4, 4], [5, 6]]);
    expect(result.ok && result.n).toBe(4);
  });
  it('says why it cannot be computed: too few pairs, or a constant variable', () => {
    const few = pearsonCorrelation([[1, 2], [2, 3]]);
    expect(few.ok ? '' : few.code).toBe('too_few_pairs');
    const constant = pearsonCorrelation([[1, 2], [2, 2], [3, 2], [4, 2]]);
    expect(constant.ok ? '' : constant.code).toBe('zero_variance');
    expect(constant.ok ? '' : constant.reason).toMatch(/does not vary/);
  });
});
