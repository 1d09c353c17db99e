import { describe, expect, it } from 'vitest';
import { mean } from '../../src/stats/mean.js';
import { standardDeviation } from '../../src/stats/standard-deviation.js';
import { variance } from '../../src/stats/variance.js';

describe('mean, variance and standardDeviation', () => {
  it('skip missing values like d3-array', () => {
    const values = [2, undefined, 4, NaN, 4, null, 4, 5, 5, 7, 9];
    expect(mean(values)).toBe(5);
    expect(variance(values)).toBeCloseTo(32 / 7, 12);
    expect(standardDeviation(values)).toBeCloseTo(Math.sqrt(32 / 7), 12);
  });
  it('use an accessor', () => {
    expect(mean([{ v: 1 }, { v: 3 }], (d) => d.v)).toBe(2);
  });
  it('return undefined with no values, and variance with one', () => {
    expect(mean([])).toBeUndefined();
    expect(mean([undefined])).toBeUndefined();
    expect(variance([3])).toBeUndefined();
  });
  // Classic cancellation test (Chan, Golub & LeVeque 1983; common practice): the naive
  // Σx² − (Σx)²/n formula loses every digit here, Welford's update does not.
  it('stays exact for values with a large common offset (numerical stability, common practice)', () => {
    const values = [4, 7, 13, 16].map((x) => x + 1e9);
    expect(variance(values)).toBeCloseTo(30, 6);
    expect(mean(values)).toBe(1e9 + 10);
  });
});
