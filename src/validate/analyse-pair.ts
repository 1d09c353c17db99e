import { addCoMoment, emptyCoMoments, type CoMoments } from '../stats/co-moments.js';
import { clusterBootstrap, type BootstrapInterval } from '../stats/cluster-bootstrap.js';
import { groupBy } from '../stats/group-by.js';
import { isNumber } from '../stats/is-number.js';
import { linearMixedModel, type FixedEffectInference, type LinearMixedModelFit } from '../stats/linear-mixed-model.js';
import { randomSlopeMixedModel, type RandomSlopeFit } from '../stats/random-slope-mixed-model.js';
import { randomSlopeTest, type RandomSlopeTest } from '../stats/random-slope-test.js';
import { oneWayIntraclassCorrelation, type OneWayIntraclassCorrelation } from '../stats/one-way-intraclass-correlation.js';
import { pearsonCorrelation, type Correlation } from '../stats/pearson-correlation.js';
import type { RandomSource } from '../stats/random.js';
import { repeatedMeasuresCorrelation, type RepeatedMeasuresCorrelation } from '../stats/repeated-measures-correlation.js';
import type { StatResult } from '../stats/stat-result.js';
import type { AlignedPair } from './aligned-pair.js';
import { betweenPersonCorrelation, personMeans } from './between-person-correlation.js';
import { perPersonCorrelations, type PerPersonSummary } from './per-person-correlations.js';
import { modelReading } from './model-reading.js';
import { pairVerdict, type Verdict } from './pair-verdict.js';
import { pooledCorrelation, type PooledCorrelation } from './pooled-correlation.js';

/** Options of {@link analysePair}. */
export interface PairAnalysisOptions {
  /** Seeded random source for the cluster bootstrap. */
  random: RandomSource;
  /** Bootstrap resamples (default 2000; 0 skips the bootstrap). */
  replicates?: number;
  /** Fewest complete pairs for a person's own correlation (default 10). */
  minPairs?: number;
  /** Confidence level (default 0.95). */
  level?: number;
  /** Inference for the mixed model's fixed effects (default `between-within-t`). */
  inference?: FixedEffectInference;
  /**
   * Random slopes for the within-person score: `auto` (default) fits both models and reports the
   * random-slope model when the likelihood-ratio test favours it at `slopeAlpha`; `always`
   * reports it whenever it can be fitted; `never` fits only random intercepts.
   */
  randomSlopes?: RandomSlopeChoice;
  /** Level of the random-slope likelihood-ratio test (default 0.05). */
  slopeAlpha?: number;
}

/** When the mixed model gets random slopes for the within-person score. */
export type RandomSlopeChoice = 'auto' | 'always' | 'never';

/** Every statistic of one text score × rating pair. */
export interface PairAnalysis {
  /** Complete pairs and persons contributing at least one. */
  pairs: number;
  persons: number;
  /** Pearson r over all pairs, ignoring persons (mixes both levels; descriptive only, no interval or p). */
  pooled: StatResult<PooledCorrelation>;
  /** Pearson r of person means (n = persons). */
  between: StatResult<Correlation>;
  /** Repeated-measures correlation (Bakdash & Marusich 2017). */
  within: StatResult<RepeatedMeasuresCorrelation>;
  perPerson: PerPersonSummary;
  /** rating ~ 1 + score_within + score_between + (1 | person), REML. */
  mixedModel: StatResult<LinearMixedModelFit>;
  /** rating ~ 1 + score_within + score_between + (1 + score_within | person), REML (not fitted with `randomSlopes: 'never'`). */
  randomSlopeModel: StatResult<RandomSlopeFit>;
  /** Likelihood-ratio test of the random slope (REML fits, same fixed effects), when both fits exist. */
  slopeTest: RandomSlopeTest | undefined;
  /** The model the verdict and the tables lead with. */
  reportedModel: 'random_intercept' | 'random_slopes';
  iccScore: StatResult<OneWayIntraclassCorrelation>;
  iccRating: StatResult<OneWayIntraclassCorrelation>;
  /** Cluster-bootstrap (persons resampled) percentile intervals. */
  bootstrapWithin: StatResult<BootstrapInterval>;
  bootstrapBetween: StatResult<BootstrapInterval>;
  verdict: Verdict;
}

/** Welford co-moments of one person's complete pairs. */
function personMoments(list: readonly AlignedPair[]): CoMoments {
  const m = emptyCoMoments();
  for (const d of list) addCoMoment(m, d.x as number, d.y as number);
  return m;
}

/**
 * Analyses one text score (x) against one rating (y) at three levels: pooled, between persons
 * (person means) and within persons (repeated-measures correlation, per-person correlations),
 * plus a random-intercept mixed model of the rating on the within-person part (x − person mean)
 * and the between-person part (person mean − mean of person means) of the score, the same model
 * with a random slope for the within-person part (lme4's `(1 + score_within | person)`), a
 * likelihood-ratio test between the two (REML, 50:50 χ²₁/χ²₂ mixture; see `randomSlopeTest`) that
 * decides which model is reported (`randomSlopes`), the ICC(1) of
 * each variable over the same pairs, and cluster-bootstrap intervals for the within and between
 * correlations. Ends with a plain-words verdict and warnings (see `pairVerdict`).
 *
 * The ICCs use the complete pairs, so both describe the same occasions as the correlations.
 * Separating within- and between-person associations follows Curran & Bauer (2011, Annu Rev
 * Psychol 62:583–619) and Bland & Altman (1995).
 */
export function analysePair(pairs: readonly AlignedPair[], options: PairAnalysisOptions): PairAnalysis {
  const level = options.level ?? 0.95;
  const complete = pairs.filter((d) => isNumber(d.x) && isNumber(d.y));
  const means = personMeans(complete);
  const meanByPerson = new Map(means.map((m) => [m.person, m.x]));
  const grandOfMeans = means.length ? means.reduce((s, m) => s + m.x, 0) / means.length : 0;
  const pooled = pooledCorrelation(complete);
  const between = betweenPersonCorrelation(complete, level);
  const within = repeatedMeasuresCorrelation(complete, (d) => d.person, (d) => d.x, (d) => d.y, { level });
  const perPerson = perPersonCorrelations(pairs, options.minPairs ?? 10);
  // Within- and between-person parts of the text score: person-mean centred, and the person mean around the mean of means.
  const predictors = (d: (typeof complete)[number]): number[] => {
    const m = meanByPerson.get(d.person) as number;
    return [(d.x as number) - m, m - grandOfMeans];
  };
  const mixedModel = linearMixedModel(
    complete,
    (d) => d.person,
    (d) => d.y,
    predictors,
    { names: ['score_within', 'score_between'], level, inference: options.inference ?? 'between-within-t' },
  );
  const choice = options.randomSlopes ?? 'auto';
  const randomSlopeModel: StatResult<RandomSlopeFit> =
    choice === 'never'
      ? { ok: false, code: 'not_requested', reason: 'random slopes were not requested' }
      : randomSlopeMixedModel(
          complete,
          (d) => d.person,
          (d) => d.y,
          predictors,
          { names: ['score_within', 'score_between'], slope: 0, level, inference: options.inference ?? 'between-within-t' },
        );
  const slopeTest = mixedModel.ok && randomSlopeModel.ok ? randomSlopeTest(mixedModel.remlCriterion, randomSlopeModel.criterion) : undefined;
  const reportedModel: PairAnalysis['reportedModel'] =
    randomSlopeModel.ok && (choice === 'always' || (slopeTest !== undefined && slopeTest.p < (options.slopeAlpha ?? 0.05))) ? 'random_slopes' : 'random_intercept';
  const iccScore = oneWayIntraclassCorrelation(complete, (d) => d.person, (d) => d.x);
  const iccRating = oneWayIntraclassCorrelation(complete, (d) => d.person, (d) => d.y);
  const replicates = options.replicates ?? 2000;
  // Resample persons through their sufficient statistics (count, means, within-person sums of
  // squares and co-products), so each replicate costs O(persons), not O(pairs).
  const clusters = [...groupBy(complete, (d) => d.person).values()].map((list) => [personMoments(list)]);
  const skipped = { ok: false as const, code: 'not_requested', reason: 'the bootstrap was not requested (0 resamples)' };
  const bootstrapWithin =
    replicates > 0
      ? clusterBootstrap(
          clusters,
          (sample) => {
            let n = 0, k = 0, sxx = 0, syy = 0, sxy = 0;
            for (const [m] of sample) {
              if (!m || m.n < 2) continue;
              n += m.n;
              k += 1;
              sxx += m.sxx;
              syy += m.syy;
              sxy += m.sxy;
            }
            return n - k - 1 >= 1 && sxx > 0 && syy > 0 ? sxy / Math.sqrt(sxx * syy) : undefined;
          },
          { random: options.random, replicates, level },
        )
      : skipped;
  const bootstrapBetween =
    replicates > 0
      ? clusterBootstrap(
          clusters,
          (sample) => {
            const r = pearsonCorrelation(sample, (c) => c[0]?.mx, (c) => c[0]?.my);
            return r.ok ? r.r : undefined;
          },
          { random: options.random, replicates, level },
        )
      : skipped;
  const result = {
    pairs: complete.length,
    persons: means.length,
    pooled,
    between,
    within,
    perPerson,
    mixedModel,
    randomSlopeModel,
    slopeTest,
    reportedModel,
    iccScore,
    iccRating,
    bootstrapWithin,
    bootstrapBetween,
  };
  return { ...result, verdict: pairVerdict({ ...result, model: modelReading(result, options.slopeAlpha ?? 0.05) }) };
}
