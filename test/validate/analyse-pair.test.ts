import { describe, expect, it } from 'vitest';
import { random } from '../../src/stats/random.js';
import { analysePair } from '../../src/validate/analyse-pair.js';
import { buildPairs } from './build-pairs.js';

describe('analysePair', () => {
  const pairs = buildPairs({ persons: 40, occasions: 20, withinSlope: 0.5, betweenSlope: -1, seed: 3 });
  const result = analysePair(pairs, { random: random(1), replicates: 300 });

  it('recovers a positive within-person and a negative between-person association built into the data', () => {
    expect(result.within.ok && result.within.r).toBeGreaterThan(0.3);
    expect(result.between.ok && result.between.r).toBeLessThan(-0.8);
    expect(result.within.ok && result.within.df).toBe(800 - 40 - 1);
    expect(result.between.ok && result.between.n).toBe(40);
  });
  it('warns that the levels disagree in sign', () => {
    expect(result.verdict.warnings.map((w) => w.code)).toContain('levels_disagree_sign');
    expect(result.verdict.within).toBe('moderate');
    expect(result.verdict.text).toMatch(/Within persons the association is moderate and positive/);
    expect(result.verdict.text).toMatch(/not clinical assessments/);
  });
  it('separates the levels in the mixed model: within slope near 0.5, between slope near −1', () => {
    if (!result.mixedModel.ok) throw new Error(result.mixedModel.reason);
    const [, w, b] = result.mixedModel.fixed;
    expect(w?.name).toBe('score_within');
    expect(w?.estimate).toBeGreaterThan(0.35);
    expect(w?.estimate).toBeLessThan(0.65);
    expect(b?.estimate).toBeGreaterThan(-1.2);
    expect(b?.estimate).toBeLessThan(-0.8);
    expect(w?.df).toBe(800 - 40 - 1);
    expect(b?.df).toBe(40 - 2);
  });
  it('gives bootstrap intervals around the within and between correlations', () => {
    if (!result.bootstrapWithin.ok || !result.within.ok) throw new Error('bootstrap failed');
    expect(result.bootstrapWithin.ciLow).toBeLessThan(result.within.r);
    expect(result.bootstrapWithin.ciHigh).toBeGreaterThan(result.within.r);
    expect(result.bootstrapBetween.ok && result.bootstrapBetween.ciHigh).toBeLessThan(0);
  });
  it('summarises per-person correlations over persons with enough pairs', () => {
    expect(result.perPerson.personsWithR).toBe(40);
    expect(result.perPerson.median).toBeGreaterThan(0.2);
    expect((result.perPerson.q1 as number) <= (result.perPerson.median as number)).toBe(true);
  });
  it('is reproducible with the same seed', () => {
    const again = analysePair(pairs, { random: random(1), replicates: 300 });
    expect(again.bootstrapWithin).toEqual(result.bootstrapWithin);
  });
  it('calls a clear but weak within-person association weak and says it should not be oversold', () => {
    const weak = analysePair(buildPairs({ persons: 60, occasions: 30, withinSlope: 0.15, betweenSlope: 0.15, seed: 5 }), { random: random(2), replicates: 200 });
    expect(weak.within.ok && Math.abs(weak.within.r)).toBeLessThan(0.25);
    expect(weak.verdict.warnings.map((w) => w.code)).toContain('weak_within');
  });
  it('says why when every person has a single observation, without NaN', () => {
    const single = analysePair([{ person: 'a', x: 1, y: 2 }, { person: 'b', x: 2, y: 3 }, { person: 'c', x: 3, y: 3 }, { person: 'd', x: 4, y: 5 }], { random: random(3), replicates: 50 });
    expect(single.within.ok ? '' : single.within.code).toBe('too_few_pairs');
    expect(single.verdict.within).toBe('not_estimable');
    expect(single.verdict.warnings.map((w) => w.code)).toEqual(expect.arrayContaining(['within_not_estimable', 'few_persons']));
    expect(JSON.stringify(single)).not.toMatch(/NaN/);
  });
  it('says why when the rating is constant', () => {
    const constant = analysePair(['a', 'b', 'c'].flatMap((person) => [1, 2, 3].map((x) => ({ person, x, y: 4 }))), { random: random(4), replicates: 0 });
    expect(constant.within.ok ? '' : constant.within.code).toBe('zero_variance');
    expect(constant.pooled.ok ? '' : constant.pooled.code).toBe('zero_variance');
    expect(constant.bootstrapWithin.ok ? '' : constant.bootstrapWithin.code).toBe('not_requested');
  });
  it('reports the random-intercept model, and says so, when the slope test does not favour random slopes (slopes built equal)', () => {
    expect(result.reportedModel).toBe('random_intercept');
    expect(result.slopeTest?.p).toBeGreaterThan(0.05);
    expect(result.verdict.text).toMatch(/random-intercept mixed model gives a within-person slope of .*; a likelihood-ratio test does not favour letting persons' slopes vary \(χ² = /);
    expect(result.verdict.warnings.map((w) => w.code)).not.toContain('slopes_vary');
  });
  it('reports random slopes by default when persons\' slopes vary, with a wider within-person interval, and says so in the verdict', () => {
    const source = random('varying-slopes');
    const normal = () => Math.sqrt(-2 * Math.log(1 - source())) * Math.cos(2 * Math.PI * source());
    const varying = Array.from({ length: 30 }, (_, p) => {
      const slope = 0.4 + 0.6 * normal();
      const mx = normal();
      return Array.from({ length: 15 }, () => {
        const dx = normal();
        return { person: `p${p}`, x: mx + dx, y: slope * dx + normal() * 0.7 };
      });
    }).flat();
    const a = analysePair(varying, { random: random(3), replicates: 0 });
    expect(a.reportedModel).toBe('random_slopes');
    expect(a.slopeTest?.p).toBeLessThan(0.001);
    if (!a.mixedModel.ok || !a.randomSlopeModel.ok) throw new Error('fit failed');
    expect(a.randomSlopeModel.fixed[1]?.se).toBeGreaterThan(1.5 * (a.mixedModel.fixed[1]?.se as number));
    expect(a.randomSlopeModel.fixed[1]?.df).toBe(30 - 2);
    expect(a.verdict.text).toMatch(/lets each person's slope vary \(1 \+ score_within \| person\), because a likelihood-ratio test favours it \(χ² = /);
    expect(a.verdict.warnings.map((w) => w.code)).toContain('slopes_vary');
    const never = analysePair(varying, { random: random(3), replicates: 0, randomSlopes: 'never' });
    expect(never.reportedModel).toBe('random_intercept');
    expect(never.randomSlopeModel.ok ? '' : never.randomSlopeModel.code).toBe('not_requested');
  });
  it('says why when every value is missing', () => {
    const empty = analysePair([{ person: 'a', x: undefined, y: 1 }, { person: 'b', x: 2, y: undefined }], { random: random(5), replicates: 10 });
    expect(empty.pairs).toBe(0);
    expect(empty.within.ok).toBe(false);
    expect(empty.mixedModel.ok).toBe(false);
    expect(empty.iccScore.ok).toBe(false);
  });
});
