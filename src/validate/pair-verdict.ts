import type { BootstrapInterval } from '../stats/cluster-bootstrap.js';
import type { OneWayIntraclassCorrelation } from '../stats/one-way-intraclass-correlation.js';
import type { Correlation } from '../stats/pearson-correlation.js';
import type { RepeatedMeasuresCorrelation } from '../stats/repeated-measures-correlation.js';
import type { StatResult } from '../stats/stat-result.js';

/** A warning attached to a verdict. */
export interface VerdictWarning {
  code: 'levels_disagree_sign' | 'levels_disagree_size' | 'few_persons' | 'few_within_pairs' | 'weak_within' | 'within_not_estimable' | 'between_not_estimable' | 'pooled_differs';
  message: string;
}

/** A plain-words reading of one score × rating analysis. */
export interface Verdict {
  /** `none` when the 95% interval of the within-person correlation includes 0. */
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
  /** Below this a within-person r is called weak even when clear (published dictionary-vs-momentary-affect associations are often below .25). */
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

/**
 * Reads the statistics of one score × rating pair in plain words, never overselling:
 * a level counts as showing an association only when its 95% interval excludes 0 (the bootstrap
 * interval must agree where there is one), strengths follow Cohen's (1988) conventions, and a
 * clear but weak within-person r gets the reminder that such scores track momentary reports only
 * loosely. Warnings flag levels that disagree in sign or size (ecological fallacy; Robinson 1950),
 * too few persons or within-person pairs, and a pooled r that differs in sign from the within r.
 */
export function pairVerdict(input: {
  pairs: number;
  persons: number;
  pooled: StatResult<Correlation>;
  between: StatResult<Correlation>;
  within: StatResult<RepeatedMeasuresCorrelation>;
  iccScore: StatResult<OneWayIntraclassCorrelation>;
  iccRating: StatResult<OneWayIntraclassCorrelation>;
  bootstrapWithin: StatResult<BootstrapInterval>;
  bootstrapBetween: StatResult<BootstrapInterval>;
}): Verdict {
  const warnings: VerdictWarning[] = [];
  const sentences: string[] = [];
  const { within, between, pooled } = input;
  let withinLevel: Verdict['within'] = 'not_estimable';
  let betweenLevel: Verdict['between'] = 'not_estimable';
  if (within.ok) {
    const bootOk = !input.bootstrapWithin.ok || excludesZero(input.bootstrapWithin.ciLow, input.bootstrapWithin.ciHigh);
    const clear = excludesZero(within.ciLow, within.ciHigh) && bootOk;
    withinLevel = clear ? strength(within.r) : 'none';
    const stats = `r_rm = ${f2(within.r)}, 95% CI [${f2(within.ciLow)}, ${f2(within.ciHigh)}], df = ${within.df}, ${within.persons} persons`;
    if (!clear) sentences.push(`Within persons there is no clear association (${stats}): the interval includes zero, so this score cannot be said to track this rating from one occasion to the next.`);
    else
      sentences.push(
        `Within persons the association is ${withinLevel} and ${within.r > 0 ? 'positive' : 'negative'} (${stats}): when a person's text scores ${within.r > 0 ? 'higher' : 'lower'} than their own average, their rating tends to be higher.`,
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
  if (between.ok) {
    const bootOk = !input.bootstrapBetween.ok || excludesZero(input.bootstrapBetween.ciLow, input.bootstrapBetween.ciHigh);
    const clear = excludesZero(between.ciLow, between.ciHigh) && bootOk;
    betweenLevel = clear ? strength(between.r) : 'none';
    const stats = `r = ${f2(between.r)}, 95% CI [${f2(between.ciLow)}, ${f2(between.ciHigh)}], n = ${between.n} persons`;
    sentences.push(
      clear
        ? `Between persons the association is ${betweenLevel} and ${between.r > 0 ? 'positive' : 'negative'} (${stats}): people whose texts score ${between.r > 0 ? 'higher' : 'lower'} on average tend to report higher on average.`
        : `Between persons there is no clear association (${stats}).`,
    );
    if (between.n < VERDICT_THRESHOLDS.minPersons) warnings.push({ code: 'few_persons', message: `Only ${between.n} persons: the between-person correlation rests on ${between.n} points and is very imprecise.` });
  } else {
    sentences.push(`The between-person association could not be estimated: ${between.reason}.`);
    warnings.push({ code: 'between_not_estimable', message: between.reason });
  }
  if (within.ok && between.ok) {
    const anyClear = excludesZero(within.ciLow, within.ciHigh) || excludesZero(between.ciLow, between.ciHigh);
    if (Math.sign(within.r) !== Math.sign(between.r) && anyClear && Math.min(Math.abs(within.r), Math.abs(between.r)) >= VERDICT_THRESHOLDS.small)
      warnings.push({
        code: 'levels_disagree_sign',
        message: `The within-person (${f2(within.r)}) and between-person (${f2(between.r)}) correlations have opposite signs: what holds across people does not hold within a person here, and neither may be read as the other.`,
      });
    else if (Math.abs(within.r - between.r) >= VERDICT_THRESHOLDS.sizeGap)
      warnings.push({
        code: 'levels_disagree_size',
        message: `The within-person (${f2(within.r)}) and between-person (${f2(between.r)}) correlations differ by ${f2(Math.abs(within.r - between.r))}; report them separately, not the pooled r.`,
      });
  }
  if (pooled.ok && within.ok && Math.sign(pooled.r) !== Math.sign(within.r) && Math.abs(pooled.r - within.r) >= VERDICT_THRESHOLDS.small)
    warnings.push({ code: 'pooled_differs', message: `The pooled r (${f2(pooled.r)}) and the within-person r (${f2(within.r)}) differ in sign; the pooled r mixes both levels and should not be reported alone.` });
  sentences.push('These are research measures, not clinical assessments.');
  return { within: withinLevel, between: betweenLevel, text: sentences.join(' '), warnings };
}
