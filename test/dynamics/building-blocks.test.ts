import { describe, expect, it } from 'vitest';
import { random } from '../../src/stats/random.js';
import { kendallTau } from '../../src/dynamics/kendall-tau.js';
import { librarySizes } from '../../src/dynamics/library-sizes.js';
import { shuffleSurrogate } from '../../src/dynamics/shuffle-surrogate.js';
import { seasonalSurrogate } from '../../src/dynamics/seasonal-surrogate.js';
import { stackSegments } from '../../src/dynamics/stack-segments.js';
import { leastSquares } from '../../src/dynamics/least-squares.js';
import { simplexEstimate } from '../../src/dynamics/simplex-estimate.js';

describe('dynamics building blocks', () => {
  it('gives Kendall τ = 1 with exact one-sided p = 1/5! for five increasing values, and the tabled p for S = 4 at n = 5 (Kendall 1938: P(S ≥ 4) = 0.242)', () => {
    const up = kendallTau([1, 2, 3, 4, 5], [0.1, 0.2, 0.3, 0.4, 0.5]);
    expect(up.ok && up.tau).toBe(1);
    expect(up.ok && up.pIncreasing).toBeCloseTo(1 / 120, 15);
    // S = 4 (7 concordant, 3 discordant): 29 of 120 permutations have S ≥ 4 (tail of Kendall's table for n = 5).
    const mid = kendallTau([1, 2, 3, 4, 5], [2, 1, 4, 5, 3]);
    expect(mid.ok && mid.s).toBe(4);
    expect(mid.ok && mid.pIncreasing).toBeCloseTo(29 / 120, 12);
  });

  it('spreads library sizes evenly from the smallest to the largest, without duplicates', () => {
    expect(librarySizes(10, 100, 4)).toEqual([10, 40, 70, 100]);
    expect(librarySizes(5, 7, 10)).toEqual([5, 6, 7]);
    expect(librarySizes(50, 40, 10)).toEqual([40]);
  });

  it('keeps the observed values (shuffle) or the cycle means (seasonal) and leaves missing bins missing', () => {
    const values = [1, 2, undefined, 4, 5, 6, 7, undefined];
    const shuffled = shuffleSurrogate(values, random(1));
    expect(shuffled[2]).toBeUndefined();
    expect(shuffled.filter((v) => v !== undefined).sort()).toEqual([1, 2, 4, 5, 6, 7]);
    const phase = [0, 1, 0, 1, 0, 1, 0, 1];
    const seasonal = seasonalSurrogate(values, phase, random(2));
    const sumAt = (xs: (number | undefined)[]) => xs.reduce<number>((a, v) => a + (v ?? 0), 0);
    expect(sumAt(seasonal)).toBeCloseTo(sumAt(values), 12); // residuals sum to zero overall
    expect(seasonal[7]).toBeUndefined();
  });

  it('stacks segments with a break and a gap between persons', () => {
    const s = stackSegments(
      [
        { values: [1, 2], lagValid: [false, true], phase: [1, 2] },
        { values: [3, 4], lagValid: [true, true], phase: [1, 2] },
      ],
      1,
    );
    expect(s.values).toEqual([1, 2, undefined, 3, 4]);
    expect(s.lagValid).toEqual([false, true, false, false, true]);
    expect(s.phase).toEqual([1, 2, -1, 1, 2]);
  });

  it('solves least squares exactly on a textbook line and refuses a rank-deficient design', () => {
    // y = 1 + 2x exactly, plus one point off the line: hand-computed OLS: slope Sxy/Sxx = 10.45/5 = 2.09, intercept 4.075 − 2.09·1.5 = 0.94.
    const x = [[1, 0], [1, 1], [1, 2], [1, 3]];
    const fit = leastSquares(x, [[1, 3, 5, 7.3]]);
    expect(fit.ok).toBe(true);
    if (fit.ok) {
      expect(fit.fits[0]!.coefficients[0]).toBeCloseTo(0.94, 12);
      expect(fit.fits[0]!.coefficients[1]).toBeCloseTo(2.09, 12);
    }
    const bad = leastSquares([[1, 2], [1, 2], [1, 2], [1, 2]], [[1, 2, 3, 4]]);
    expect(bad.ok).toBe(false);
  });

  it('weights simplex neighbours by exp(−d/d₁) and gives nothing without neighbours', () => {
    expect(simplexEstimate([1, 2], [10, 20], 2)).toBeCloseTo((Math.exp(-1) * 10 + Math.exp(-2) * 20) / (Math.exp(-1) + Math.exp(-2)), 12);
    expect(simplexEstimate([], [], 0)).toBeUndefined();
  });
});
