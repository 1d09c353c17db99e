import { describe, expect, it } from 'vitest';
import { linearMixedModel } from '../../src/stats/linear-mixed-model.js';
import { readReferenceCsv } from './reference-csv.js';

// lme4's `sleepstudy` data (Belenky et al. 2003, J Sleep Res 12:1–12; 18 subjects × 10 days),
// exported with the expected REML fit of `Reaction ~ Days + (1 | Subject)` by
// test/reference/sleepstudy/make-expected.R (R 4.2.2, lme4 1.1.31; see versions.txt).
const data = readReferenceCsv('sleepstudy/sleepstudy.csv').map((r) => ({ subject: r.Subject as string, days: Number(r.Days), reaction: Number(r.Reaction) }));
const expected = Object.fromEntries(readReferenceCsv('sleepstudy/expected-lmer-reml.csv').map((r) => [r.quantity as string, Number(r.value)]));

describe('linearMixedModel against lme4 1.1.31 on sleepstudy, Reaction ~ Days + (1 | Subject) by REML', () => {
  const fit = linearMixedModel(data, (d) => d.subject, (d) => d.reaction, (d) => [d.days], { names: ['Days'], inference: 'wald-z' });
  if (!fit.ok) throw new Error(fit.reason);
  it('reads 180 observations of 18 subjects', () => {
    expect([fit.n, fit.groups]).toEqual([180, 18]);
  });
  it('gives lme4’s fixed effects (intercept 251.4051, Days 10.4673)', () => {
    expect(fit.fixed[0]?.estimate).toBeCloseTo(expected.intercept as number, 4);
    expect(fit.fixed[1]?.estimate).toBeCloseTo(expected.days as number, 4);
  });
  it('gives lme4’s standard errors (9.7467, 0.8042)', () => {
    expect(fit.fixed[0]?.se).toBeCloseTo(expected.se_intercept as number, 4);
    expect(fit.fixed[1]?.se).toBeCloseTo(expected.se_days as number, 4);
  });
  it('gives lme4’s variance components (Subject 1378.18, residual 960.46) to 1e-4 relative', () => {
    expect(fit.varianceIntercept / (expected.var_subject as number)).toBeCloseTo(1, 4);
    expect(fit.varianceResidual / (expected.var_residual as number)).toBeCloseTo(1, 4);
  });
  it('gives lme4’s REML criterion (1786.465)', () => {
    expect(fit.remlCriterion).toBeCloseTo(expected.reml_criterion as number, 4);
  });
  it('gives lme4 confint(method = "Wald") intervals', () => {
    expect(fit.fixed[0]?.ciLow).toBeCloseTo(expected.wald_low_intercept as number, 3);
    expect(fit.fixed[0]?.ciHigh).toBeCloseTo(expected.wald_high_intercept as number, 3);
    expect(fit.fixed[1]?.ciLow).toBeCloseTo(expected.wald_low_days as number, 4);
    expect(fit.fixed[1]?.ciHigh).toBeCloseTo(expected.wald_high_days as number, 4);
  });
  it('does not depend on the order of the rows', () => {
    const reversed = linearMixedModel([...data].reverse(), (d) => d.subject, (d) => d.reaction, (d) => [d.days]);
    expect(reversed.ok && reversed.fixed[1]?.estimate).toBeCloseTo(expected.days as number, 6);
  });
  it('uses t on 161 within-person df for Days with the between-within rule (SAS DDFM=BW), 180 − 18 − 1', () => {
    const bw = linearMixedModel(data, (d) => d.subject, (d) => d.reaction, (d) => [d.days]);
    expect(bw.ok && bw.fixed[1]?.df).toBe(161);
    expect(bw.ok && bw.fixed[0]?.df).toBe(17);
  });
});
