import { describe, expect, it } from 'vitest';
import { linearMixedModel } from '../../src/stats/linear-mixed-model.js';
import { randomSlopeMixedModel } from '../../src/stats/random-slope-mixed-model.js';
import { randomSlopeTest } from '../../src/stats/random-slope-test.js';
import { random, type RandomSource } from '../../src/stats/random.js';

function normal(source: RandomSource): number {
  return Math.sqrt(-2 * Math.log(1 - source())) * Math.cos(2 * Math.PI * source());
}

/** Persons × occasions with random intercepts (SD 1) and, when slopeSd > 0, random slopes. */
function simulate(source: RandomSource, persons: number, occasions: number, slopeSd: number) {
  const rows: { g: string; x: number[]; y: number }[] = [];
  for (let p = 0; p < persons; p++) {
    const b0 = normal(source);
    const b1 = slopeSd * normal(source);
    const xs = Array.from({ length: occasions }, () => normal(source));
    const mean = xs.reduce((a, b) => a + b, 0) / occasions;
    for (const x of xs) rows.push({ g: `p${p}`, x: [x - mean], y: 1 + b0 + (0.3 + b1) * (x - mean) + normal(source) });
  }
  return rows;
}

function slopeP(rows: ReturnType<typeof simulate>): number {
  const a = linearMixedModel(rows, (d) => d.g, (d) => d.y, (d) => d.x);
  const b = randomSlopeMixedModel(rows, (d) => d.g, (d) => d.y, (d) => d.x);
  if (!a.ok || !b.ok) throw new Error('fit failed');
  return randomSlopeTest(a.remlCriterion, b.criterion).p;
}

describe('randomSlopeTest', () => {
  it('uses the 50:50 χ²₁/χ²₂ mixture: d = 5.14 gives p = .05 (half of the χ²₂ 5% point; Stram & Lee 1994, Table 1 from memory)', () => {
    // χ²₁ upper tail at 5.1383 is 0.02340, χ²₂ upper tail is 0.07660 (pchisq in R): mean 0.0500.
    expect(randomSlopeTest(10, 10 - 5.1383).p).toBeCloseTo(0.05, 4);
    expect(randomSlopeTest(10, 10).p).toBe(1);
    expect(randomSlopeTest(10, 10.5).statistic).toBe(0);
  });
  // Seeded simulation (common practice for checking a test's size): 200 data sets of 20 persons ×
  // 8 occasions with random intercepts only. At α = .05 the mixture test should reject about 5%
  // of them: the check is the central 99% binomial band for n = 200, p = .05 (3 to 19 rejections,
  // scipy.stats.binom.ppf). Measured: 5 of 200 here; with 30 × 10 and 300 data sets, 13 (4.3%).
  it('rejects about 5% of data sets whose slopes do not vary (false-positive rate within the binomial 99% band)', () => {
    const source = random('random-slope-size');
    let rejections = 0;
    for (let k = 0; k < 200; k++) if (slopeP(simulate(source, 20, 8, 0)) < 0.05) rejections += 1;
    expect(rejections).toBeLessThanOrEqual(19);
    expect(rejections).toBeGreaterThanOrEqual(3);
  });
  it('detects slopes that vary (SD 0.5 around 0.3) in at least 80% of data sets', () => {
    const source = random('random-slope-power');
    let rejections = 0;
    for (let k = 0; k < 30; k++) if (slopeP(simulate(source, 20, 8, 0.5)) < 0.05) rejections += 1;
    expect(rejections).toBeGreaterThanOrEqual(24);
  });
});
