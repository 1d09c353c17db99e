import type { BootstrapInterval } from '../stats/cluster-bootstrap.js';
import type { OneWayIntraclassCorrelation } from '../stats/one-way-intraclass-correlation.js';
import type { Correlation } from '../stats/pearson-correlation.js';
import type { PooledCorrelation } from './pooled-correlation.js';
import type { RepeatedMeasuresCorrelation } from '../stats/repeated-measures-correlation.js';
import type { StatResult } from '../stats/stat-result.js';

/** A warning attached to a verdict. */
export interface VerdictWarning {
  code: 'levels_disagree_sign' | 'levels_disagree_size' | 'few_persons' | 'few_within_pairs' | 'weak_within' | 'within_not_estimable' | 'between_not_estimable' | 'pooled_differs' | 'slopes_vary';
  message: string;
}

/** What the mixed model adds to a verdict: one sentence, and a warning when slopes vary. */
export interface ModelReading {
  sentence: string;
  warning?: VerdictWarning;
}

/** A plain-words reading of one score × rating analysis. */
export interface Verdict {
  /** `none` when the deciding 95% interval of the within-person correlation includes 0. */
  within: 'not_estimable' | 'none' | 'negligible' | 'weak' | 'moderate' | 'strong';
  between: 'not_estimable' | 'none' | 'negligible' | 'weak' | 'moderate' | 'strong';
  /** Two to four sentences for a researcher. */
  text: string;
  warnings: VerdictWarning[];
}

/** Thresholds of {@link pairVerdict}. */
export const VERDICT_THRESHOLDS = {
  /** Cohen (1988, Statistical Power Analysis, 2nd ed.): r of .1, .3, .5 are small, medium, large. */
  small: 0.1,
  medium: 0.3,
  large: 0.5,
  /** Below this a within-person r is called weak even when clear. From memory, no pooled estimate: published dictionary-vs-momentary-affect associations are weak (README Cautions names two studies). */
  weakWithin: 0.25,
  /** Common practice (no single source): fewer persons make a between-person r too imprecise to read. */
  minPersons: 20,
  /** Common practice: fewer within-person residual df make the within-person r imprecise. */
  minWithinDf: 30,
  /** Common practice: a difference this large between the within and between r is worth a warning. */
  sizeGap: 0.3,
} as const;

type Strength = 'negligible' | 'weak' | 'moderate' | 'strong';

function strength(r: number): Strength {
  const a = Math.abs(r);
  if (a < VERDICT_THRESHOLDS.small) return 'negligible';
  if (a < VERDICT_THRESHOLDS.medium) return 'weak';
  if (a < VERDICT_THRESHOLDS.large) return 'moderate';
  return 'strong';
}

const f2 = (x: number | undefined): string => (x === undefined ? '?' : x.toFixed(2).replace(/^-0\.00$/, '0.00'));

function excludesZero(low: number | undefined, high: number | undefined): boolean {
  return low !== undefined && high !== undefined && (low > 0 || high < 0);
}

/** The interval a level's verdict rests on, and the other one when it was set aside. */
interface DecidingInterval {
  clear: boolean;
  /** e.g. `cluster-bootstrap 95% CI [0.05, 0.55]`. */
  text: string;
  /** A clause naming the analytic interval when it would have decided otherwise, else ''. */
  aside: string;
}

/**
 * The cluster bootstrap (persons resampled) when there is one, because it respects the clustering
 * of occasions within persons and does not assume one common slope; else the analytic interval.
 */
function decidingInterval(analytic: { ciLow: number | undefined; ciHigh: number | undefined; level: number }, bootstrap: StatResult<BootstrapInterval>, analyticAssumes: string): DecidingInterval {
  const pct = `${Math.round(analytic.level * 100)}%`;
  if (bootstrap.ok) {
    const clear = excludesZero(bootstrap.ciLow, bootstrap.ciHigh);
    const analyticClear = excludesZero(analytic.ciLow, analytic.ciHigh);
    return {
      clear,
      text: `cluster-bootstrap ${pct} CI [${f2(bootstrap.ciLow)}, ${f2(bootstrap.ciHigh)}], ${bootstrap.succeeded} resamples of persons`,
      aside:
        analyticClear !== clear
          ? ` The analytic interval [${f2(analytic.ciLow)}, ${f2(analytic.ciHigh)}] ${analyticClear ? 'excludes' : 'includes'} zero, but it ${analyticAssumes}, so the bootstrap interval decides.`
          : '',
    };
  }
  return { clear: excludesZero(analytic.ciLow, analytic.ciHigh), text: `analytic ${pct} CI [${f2(analytic.ciLow)}, ${f2(analytic.ciHigh)}]`, aside: '' };
}

/**
 * Reads the statistics of one score × rating pair in plain words, never overselling:
 * a level counts as showing an association only when the interval that decides it excludes 0,
 * and the sentence quotes that interval. The deciding interval is the cluster bootstrap (persons
 * resampled) when there is one, else the analytic interval (rmcorr's Fisher-z interval within,
 * Fisher's interval over person means between); when the two disagree about zero the sentence
 * names both. Strengths follow Cohen's (1988) conventions, and a clear but weak within-person r
 * gets the reminder that such scores track momentary reports only loosely. Warnings flag levels
 * that disagree in sign or size, only when both levels are clear (ecological fallacy; Robinson
 * 1950), too few persons or within-person pairs, and a pooled r that differs in sign from the
 * within r. The pooled r is descriptive: its pairs are clustered within persons, so it gets no
 * interval or p-value (Bland & Altman 1995).
 */
export function pairVerdict(input: {
  pairs: number;
  persons: number;
  pooled: StatResult<PooledCorrelation>;
  between: StatResult<Correlation>;
  within: StatResult<RepeatedMeasuresCorrelation>;
  iccScore: StatResult<OneWayIntraclassCorrelation>;
  iccRating: StatResult<OneWayIntraclassCorrelation>;
  bootstrapWithin: StatResult<BootstrapInterval>;
  bootstrapBetween: StatResult<BootstrapInterval>;
  /** The mixed model's reading of the within-person slope, when fitted (see `analysePair`). */
  model?: ModelReading;
}): Verdict {
  const warnings: VerdictWarning[] = [];
  const sentences: string[] = [];
  const { within, between, pooled } = input;
  let withinLevel: Verdict['within'] = 'not_estimable';
  let betweenLevel: Verdict['between'] = 'not_estimable';
  let withinClear = false;
  let betweenClear = false;
  if (within.ok) {
    const decided = decidingInterval(within, input.bootstrapWithin, 'assumes one common within-person slope and independent occasions');
    const clear = decided.clear;
    withinClear = clear;
    withinLevel = clear ? strength(within.r) : 'none';
    const stats = `r_rm = ${f2(within.r)}, ${decided.text}; df = ${within.df}, ${within.persons} persons`;
    if (!clear) sentences.push(`Within persons there is no clear association (${stats}): the interval includes zero, so this score cannot be said to track this rating from one occasion to the next.${decided.aside}`);
    else
      sentences.push(
        `Within persons the association is ${withinLevel} and ${within.r > 0 ? 'positive' : 'negative'} (${stats}): when a person's text scores ${within.r > 0 ? 'higher' : 'lower'} than their own average, their rating tends to be higher.${decided.aside}`,
      );
    if (clear && Math.abs(within.r) < VERDICT_THRESHOLDS.weakWithin)
      warnings.push({
        code: 'weak_within',
        message: `The within-person r of ${f2(within.r)} is ${strength(within.r)}, as published associations of dictionary scores with momentary self-reports usually are; it supports statements about averages over many occasions or persons, not reading one person's state from one text.`,
      });
    if (within.df < VERDICT_THRESHOLDS.minWithinDf) warnings.push({ code: 'few_within_pairs', message: `Only ${within.df} within-person degrees of freedom; the within-person r is imprecise.` });
  } else {
    sentences.push(`The within-person association could not be estimated: ${within.reason}.`);
    warnings.push({ code: 'within_not_estimable', message: within.reason });
  }
  if (input.model) sentences.push(input.model.sentence);
  if (between.ok) {
    const decided = decidingInterval(between, input.bootstrapBetween, 'assumes the person means are a bivariate normal sample');
    const clear = decided.clear;
    betweenClear = clear;
    betweenLevel = clear ? strength(between.r) : 'none';
    const stats = `r = ${f2(between.r)}, ${decided.text}; n = ${between.n} persons`;
    sentences.push(
      clear
        ? `Between persons the association is ${betweenLevel} and ${between.r > 0 ? 'positive' : 'negative'} (${stats}): people whose texts score ${between.r > 0 ? 'higher' : 'lower'} on average tend to report higher on average.${decided.aside}`
        : `Between persons there is no clear association (${stats}).${decided.aside}`,
    );
    if (between.n < VERDICT_THRESHOLDS.minPersons) warnings.push({ code: 'few_persons', message: `Only ${between.n} persons: the between-person correlation rests on ${between.n} points and is very imprecise.` });
  } else {
    sentences.push(`The between-person association could not be estimated: ${between.reason}.`);
    warnings.push({ code: 'between_not_estimable', message: between.reason });
  }
  if (within.ok && between.ok && withinClear && betweenClear) {
    if (Math.sign(within.r) !== Math.sign(between.r))
      warnings.push({
        code: 'levels_disagree_sign',
        message: `The within-person (${f2(within.r)}) and between-person (${f2(between.r)}) correlations have opposite signs, and both intervals exclude zero: what holds across people does not hold within a person here, and neither may be read as the other.`,
      });
    else if (Math.abs(within.r - between.r) >= VERDICT_THRESHOLDS.sizeGap)
      warnings.push({
        code: 'levels_disagree_size',
        message: `The within-person (${f2(within.r)}) and between-person (${f2(between.r)}) correlations differ by ${f2(Math.abs(within.r - between.r))}; report them separately, not the pooled r.`,
      });
  }
  if (pooled.ok && within.ok && Math.sign(pooled.r) !== Math.sign(within.r) && Math.abs(pooled.r - within.r) >= VERDICT_THRESHOLDS.small)
    warnings.push({ code: 'pooled_differs', message: `The pooled r (${f2(pooled.r)}) and the within-person r (${f2(within.r)}) differ in sign; the pooled r mixes both levels and should not be reported alone.` });
  if (input.model?.warning) warnings.push(input.model.warning);
  sentences.push('These are research measures, not clinical assessments.');
  return { within: withinLevel, between: betweenLevel, text: sentences.join(' '), warnings };
}
