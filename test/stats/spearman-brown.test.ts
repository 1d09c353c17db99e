import { describe, expect, it } from 'vitest';
import { spearmanBrown, spearmanBrownFactor } from '../../src/stats/spearman-brown.js';
import { splitHalfReliability } from '../../src/stats/split-half-reliability.js';

describe('spearmanBrown', () => {
  // Textbook worked example (e.g. Nunnally & Bernstein 1994, Psychometric Theory, 3rd ed., ch. 7;
  // cited from memory): a split-half correlation of .60 corrects to 2(.60)/(1 + .60) = .75.
  it('corrects a split-half correlation of .60 to .75 (textbook worked example, from memory)', () => {
    expect(spearmanBrown(0.6, 2)).toBeCloseTo(0.75, 12);
  });
  // Same textbook, from memory: a test of reliability .70 made three times as long reaches .875.
  it('projects reliability .70 to .875 for a test three times as long (textbook example, from memory)', () => {
    expect(spearmanBrown(0.7, 3)).toBeCloseTo(0.875, 12);
  });
  it('inverts the prophecy: reliability .50 needs a 4 times longer measure to reach .80', () => {
    expect(spearmanBrownFactor(0.5, 0.8)).toBeCloseTo(4, 12);
    expect(spearmanBrown(0.5, spearmanBrownFactor(0.5, 0.8) as number)).toBeCloseTo(0.8, 12);
  });
  it('returns undefined outside its domain', () => {
    expect(spearmanBrown(1.2, 2)).toBeUndefined();
    // A negative half correlation is never stepped up: 2(−0.36)/(1 − 0.36) = −1.125 is not a reliability.
    expect(spearmanBrown(-0.36, 2)).toBeUndefined();
    expect(spearmanBrown(0.5, 0)).toBeUndefined();
    expect(spearmanBrownFactor(0, 0.7)).toBeUndefined();
    expect(spearmanBrownFactor(0.5, 1)).toBeUndefined();
  });
});

describe('splitHalfReliability', () => {
  it('steps the correlation of two halves up to full length', () => {
    const halves = [
      [1, 2],
      [2, 1],
      [3, 4],
      [4, 3],
      [5, 5],
    ];
    const result = splitHalfReliability(halves, (d) => d[0], (d) => d[1]);
    if (!result.ok) throw new Error(result.reason);
    expect(result.halfCorrelation.r).toBeCloseTo(0.8, 12);
    expect(result.reliability).toBeCloseTo(1.6 / 1.8, 12);
  });
  it('says the reliability is not estimable, never negative, when the halves correlate negatively', () => {
    const result = splitHalfReliability([[1, 3], [2, 1], [3, 2], [4, 0.5], [5, 1]], (d) => d[0], (d) => d[1]);
    expect(result.ok ? result.reliability : result.code).toBe('halves_disagree');
    expect(result.ok ? '' : result.reason).toMatch(/r = -0\.\d{3}/);
  });
  it('says why when a half is constant', () => {
    const result = splitHalfReliability([[1, 2], [1, 3], [1, 4]], (d) => d[0], (d) => d[1]);
    expect(result.ok ? '' : result.code).toBe('zero_variance');
  });
});
