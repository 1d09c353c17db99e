import { describe, expect, it } from 'vitest';
import { linearMixedModel } from '../../src/stats/linear-mixed-model.js';
import { randomSlopeMixedModel, type MixedModelMethod } from '../../src/stats/random-slope-mixed-model.js';
import { random } from '../../src/stats/random.js';
import { analysePair } from '../../src/validate/analyse-pair.js';
import { readReferenceCsv } from './reference-csv.js';

// lme4 1.1.31 (R 4.2.2) fits of correlated random intercepts and slopes, `y ~ x + (1 + x | g)`,
// by REML and ML, written by test/reference/random-slopes/make-expected.R: on lme4's sleepstudy
// (Belenky et al. 2003; Reaction ~ Days + (1 + Days | Subject)) and on a simulated within/between-
// centred data set (rating ~ score_within + score_between + (1 + score_within | person)).
const expected = readReferenceCsv('random-slopes/expected.csv');
const value = (dataset: string, method: string, quantity: string): number => {
  const row = expected.find((r) => r.dataset === dataset && r.method === method && r.quantity === quantity);
  if (!row) throw new Error(`no expected ${dataset} ${method} ${quantity}`);
  return Number(row.value);
};
const relative = (got: number | undefined, want: number): number => Math.abs((got as number) - want) / Math.abs(want);

const sleep = readReferenceCsv('sleepstudy/sleepstudy.csv').map((r) => ({ g: r.Subject as string, x: [Number(r.Days)], y: Number(r.Reaction) }));
const centred = readReferenceCsv('random-slopes/centred.csv').map((r) => ({ g: r.person as string, x: [Number(r.score_within), Number(r.score_between)], y: Number(r.rating), score: Number(r.score) }));
const datasets = {
  sleepstudy: { rows: sleep, names: ['Days'] },
  centred: { rows: centred, names: ['score_within', 'score_between'] },
} as const;

describe.each([
  ['sleepstudy', 'REML'],
  ['sleepstudy', 'ML'],
  ['centred', 'REML'],
  ['centred', 'ML'],
] as const)('randomSlopeMixedModel against lme4 1.1.31 on %s by %s (make-expected.R), 1e-4 relative', (dataset, method) => {
  const { rows, names } = datasets[dataset];
  const fit = randomSlopeMixedModel(rows, (d) => d.g, (d) => d.y, (d) => d.x, { names, method: method as MixedModelMethod, inference: 'wald-z' });
  if (!fit.ok) throw new Error(fit.reason);
  it('gives lme4’s fixed effects and their standard errors (vcov)', () => {
    ['(Intercept)', ...names].forEach((name, k) => {
      expect(relative(fit.fixed[k]?.estimate, value(dataset, method, `beta_${name}`))).toBeLessThan(1e-4);
      expect(relative(fit.fixed[k]?.se, value(dataset, method, `se_${name}`))).toBeLessThan(1e-4);
    });
  });
  it('gives lme4’s variance components, intercept–slope covariance and correlation (VarCorr)', () => {
    expect(relative(fit.varianceIntercept, value(dataset, method, 'var_intercept'))).toBeLessThan(1e-4);
    expect(relative(fit.varianceSlope, value(dataset, method, 'var_slope'))).toBeLessThan(1e-4);
    expect(relative(fit.covarianceInterceptSlope, value(dataset, method, 'cov_intercept_slope'))).toBeLessThan(1e-4);
    expect(relative(fit.correlation, value(dataset, method, 'cor_intercept_slope'))).toBeLessThan(1e-4);
    expect(relative(fit.varianceResidual, value(dataset, method, 'var_residual'))).toBeLessThan(1e-4);
  });
  it(`gives lme4’s ${method === 'REML' ? 'REMLcrit' : 'deviance'} and logLik`, () => {
    expect(relative(fit.criterion, value(dataset, method, 'criterion'))).toBeLessThan(1e-4);
    expect(relative(fit.logLik, value(dataset, method, 'loglik'))).toBeLessThan(1e-4);
    expect(fit.boundary).toBe(false);
  });
});

describe('the random-slope likelihood-ratio statistic against lme4 (REML fits with the same fixed effects)', () => {
  it.each(['sleepstudy', 'centred'] as const)('gives lme4’s REMLcrit difference on %s', (dataset) => {
    const { rows, names } = datasets[dataset];
    const slopes = randomSlopeMixedModel(rows, (d) => d.g, (d) => d.y, (d) => d.x, { names });
    const intercept = linearMixedModel(rows, (d) => d.g, (d) => d.y, (d) => d.x, { names });
    if (!slopes.ok || !intercept.ok) throw new Error('fit failed');
    expect(relative(intercept.remlCriterion, value(dataset, 'REML', 'null_criterion'))).toBeLessThan(1e-6);
    expect(relative(intercept.remlCriterion - slopes.criterion, value(dataset, 'REML', 'lrt_statistic'))).toBeLessThan(1e-4);
  });
  it('gives lme4’s random-slope fit through analysePair, which centres the score itself', () => {
    const a = analysePair(centred.map((d) => ({ person: d.g, x: d.score, y: d.y })), { random: random(1), replicates: 0 });
    if (!a.randomSlopeModel.ok) throw new Error(a.randomSlopeModel.reason);
    expect(relative(a.randomSlopeModel.fixed[1]?.se, value('centred', 'REML', 'se_score_within'))).toBeLessThan(1e-4);
    expect(relative(a.randomSlopeModel.varianceSlope, value('centred', 'REML', 'var_slope'))).toBeLessThan(1e-4);
    expect(relative(a.slopeTest?.statistic, value('centred', 'REML', 'lrt_statistic'))).toBeLessThan(1e-4);
    expect(a.reportedModel).toBe('random_slopes');
  });
});
