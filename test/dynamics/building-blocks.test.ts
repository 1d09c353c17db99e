import { describe, expect, it } from 'vitest';
import { random } from '../../src/stats/random.js';
import { librarySizes } from '../../src/dynamics/library-sizes.js';
import { seasonalSurrogates } from '../../src/dynamics/seasonal-surrogate.js';
import { stackSegments } from '../../src/dynamics/stack-segments.js';
import { leastSquares } from '../../src/dynamics/least-squares.js';
import { simplexEstimate } from '../../src/dynamics/simplex-estimate.js';

describe('dynamics building blocks', () => {
  it('spreads library sizes evenly from the smallest to the largest, without duplicates', () => {
    expect(librarySizes(10, 100, 4)).toEqual([10, 40, 70, 100]);
    expect(librarySizes(5, 7, 10)).toEqual([5, 6, 7]);
    expect(librarySizes(50, 40, 10)).toEqual([40]);
  });

  it('keeps each person’s calendar cycle (seasonal) and leaves missing bins missing', () => {
    // Person 0 is high at phase 1, person 1 at phase 0; the residuals are phase-randomised within persons.
    const values = [0, 10, 1, 11, undefined, 10, 0, 12, 5, 0, 6, 1, 5, 0, 7, 1];
    const phase = [0, 1, 0, 1, 0, 1, 0, 1, 0, 1, 0, 1, 0, 1, 0, 1];
    const segment = [0, 0, 0, 0, 0, 0, 0, 0, 1, 1, 1, 1, 1, 1, 1, 1];
    for (const seasonal of [seasonalSurrogates(values, phase, 1, random(2), segment)[0]!, seasonalSurrogates(values, phase, 1, random(3), segment)[0]!]) {
      expect(seasonal[4]).toBeUndefined();
      const meanAt = (k: number, p: number) => {
        const xs = seasonal.filter((v, t) => segment[t] === k && phase[t] === p && v !== undefined) as number[];
        return xs.reduce((a, b) => a + b, 0) / xs.length;
      };
      expect(meanAt(0, 1)).toBeGreaterThan(meanAt(0, 0) + 5);
      expect(meanAt(1, 0)).toBeGreaterThan(meanAt(1, 1) + 3);
    }
  });

  it('stacks person-centred segments with a break and a gap between persons, and records whose bin each is', () => {
    const s = stackSegments(
      [
        { values: [1, 2], lagValid: [false, true], phase: [1, 2] },
        { values: [3, 4], lagValid: [true, true], phase: [1, 2] },
      ],
      1,
    );
    expect(s.values).toEqual([-0.5, 0.5, undefined, -0.5, 0.5]);
    expect(s.lagValid).toEqual([false, true, false, false, true]);
    expect(s.phase).toEqual([1, 2, -1, 1, 2]);
    expect(s.segment).toEqual([0, 0, -1, 1, 1]);
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
