import { normalTwoSidedP } from './distributions.js';

/** A likelihood-ratio test of a random slope (its variance and its covariance with the intercept). */
export interface RandomSlopeTest {
  /** Criterion of the random-intercept fit minus that of the random-slope fit (≥ 0). */
  statistic: number;
  /** p-value from the 50:50 mixture of χ²(1) and χ²(2). */
  p: number;
}

/**
 * Likelihood-ratio test of `(1 + x | g)` against `(1 | g)`: the statistic is the difference of the
 * two fits' −2 log-likelihoods, here REML criteria of fits with the same fixed effects (valid for
 * comparing covariance structures; Pinheiro & Bates 2000, Mixed-Effects Models in S and S-PLUS,
 * §2.4.1). The null value of the slope variance lies on the boundary of its parameter space, so the
 * statistic does not follow χ²(2); its null distribution is the 50:50 mixture of χ²(1) and χ²(2)
 * (Self & Liang 1987, JASA 82:605–610; Stram & Lee 1994, Biometrics 50:1171–1177). The naive χ²(2)
 * p-value would be conservative, as Pinheiro & Bates note. p = ½P(χ²₁ > d) + ½P(χ²₂ > d), with
 * P(χ²₁ > d) = 2(1 − Φ(√d)) and P(χ²₂ > d) = e^(−d/2).
 */
export function randomSlopeTest(interceptCriterion: number, slopeCriterion: number): RandomSlopeTest {
  const statistic = Math.max(0, interceptCriterion - slopeCriterion);
  const p = 0.5 * normalTwoSidedP(Math.sqrt(statistic)) + 0.5 * Math.exp(-statistic / 2);
  return { statistic, p: Math.min(1, p) };
}
