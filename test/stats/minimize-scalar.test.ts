import { describe, expect, it } from 'vitest';
import { minimizeScalar } from '../../src/stats/minimize-scalar.js';

describe('minimizeScalar (Brent 1973)', () => {
  it('finds the minimum of a parabola', () => {
    const result = minimizeScalar((x) => (x - 1.3) ** 2 + 2, -10, 10);
    expect(result.x).toBeCloseTo(1.3, 8);
    expect(result.value).toBeCloseTo(2, 12);
  });
  // R documentation of optimize(): f(x) = (x − 1/3)² on (0, 1) has its minimum at 1/3.
  it('finds 1/3 for (x − 1/3)² on (0, 1), the example of R’s optimize()', () => {
    expect(minimizeScalar((x) => (x - 1 / 3) ** 2, 0, 1).x).toBeCloseTo(1 / 3, 8);
  });
  it('stops at the boundary for a monotone function', () => {
    expect(minimizeScalar((x) => x, 0, 1).x).toBeLessThan(1e-6);
  });
});
