import type { FixedEffect, LinearMixedModelFit } from '../stats/linear-mixed-model.js';
import type { RandomSlopeFit } from '../stats/random-slope-mixed-model.js';
import type { RandomSlopeTest } from '../stats/random-slope-test.js';
import type { StatResult } from '../stats/stat-result.js';
import type { ModelReading } from './pair-verdict.js';

const f2 = (x: number | undefined): string => (x === undefined ? '?' : x.toFixed(2).replace(/^-0\.00$/, '0.00'));
const pText = (p: number): string => (p < 0.001 ? 'p < .001' : `p = ${p.toFixed(3).replace(/^0/, '')}`);

/**
 * One sentence on the mixed model the analysis reports: whether persons' within-person slopes
 * were allowed to vary and why (the likelihood-ratio test), and the within-person slope with the
 * interval of that model; plus a `slopes_vary` warning when the random-slope model is reported.
 * Undefined when neither model could be fitted.
 */
export function modelReading(
  a: { mixedModel: StatResult<LinearMixedModelFit>; randomSlopeModel: StatResult<RandomSlopeFit>; slopeTest: RandomSlopeTest | undefined; reportedModel: 'random_intercept' | 'random_slopes' },
  alpha: number,
): ModelReading | undefined {
  const within = (fixed: readonly FixedEffect[]) => fixed.find((f) => f.name === 'score_within');
  const test = a.slopeTest ? `χ² = ${a.slopeTest.statistic.toFixed(1)}, ${pText(a.slopeTest.p)}; REML fits, 50:50 χ²₁/χ²₂ mixture` : undefined;
  const pct = (level: number) => `${Math.round(level * 100)}%`;
  if (a.reportedModel === 'random_slopes' && a.randomSlopeModel.ok) {
    const m = a.randomSlopeModel;
    const w = within(m.fixed);
    const sd = Math.sqrt(m.varianceSlope);
    const why = test ? (a.slopeTest && a.slopeTest.p < alpha ? `because a likelihood-ratio test favours it (${test})` : `as requested (likelihood-ratio ${test})`) : 'as requested';
    return {
      sentence: `The mixed model lets each person's slope vary (1 + score_within | person), ${why}: the average within-person slope is ${f2(w?.estimate)} rating units per score unit, ${pct(m.level)} CI [${f2(w?.ciLow)}, ${f2(w?.ciHigh)}], and persons' slopes spread around it with SD ${f2(sd)}.`,
      warning: {
        code: 'slopes_vary',
        message: `Persons differ in how their rating follows their score (SD of slopes ${f2(sd)} around an average of ${f2(w?.estimate)}); the average within-person association does not describe every person, and the random-slope model's interval for the average allows for that spread.`,
      },
    };
  }
  if (a.mixedModel.ok) {
    const m = a.mixedModel;
    const w = within(m.fixed);
    const why = test ? `a likelihood-ratio test does not favour letting persons' slopes vary (${test})` : a.randomSlopeModel.ok || a.randomSlopeModel.code === 'not_requested' ? '' : `a model with varying slopes could not be fitted (${a.randomSlopeModel.reason})`;
    return {
      sentence: `The random-intercept mixed model gives a within-person slope of ${f2(w?.estimate)} rating units per score unit, ${pct(m.level)} CI [${f2(w?.ciLow)}, ${f2(w?.ciHigh)}]${why ? `; ${why}` : ''}.`,
    };
  }
  return undefined;
}
