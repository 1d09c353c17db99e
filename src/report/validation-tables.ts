import type { FixedEffect } from '../stats/linear-mixed-model.js';
import type { StatResult } from '../stats/stat-result.js';
import type { ValidationResult } from '../validate/validate-series.js';
import { formatNumber } from './format-number.js';
import { diagnosticText } from '../privacy/diagnostic-text.js';

/** A table ready for `csvDocument`: header and rows of already-formatted fields. */
export interface Table {
  header: string[];
  rows: string[][];
}

const num = formatNumber;
const note = (r: StatResult<object>): string => (r.ok ? '' : `${r.code}: ${r.reason}`);

/** Header of the tidy statistics table. */
export const VALIDATION_STATISTICS_HEADER = ['score', 'rating', 'level', 'statistic', 'estimate', 'se', 'ci_low', 'ci_high', 'df', 'n', 'p', 'note'];

/**
 * The tidy statistics table: one row per score × rating × statistic, with estimate, standard
 * error, interval, df, n, p and a `note` that says why a value is empty.
 */
export function validationStatisticsTable(result: ValidationResult): Table {
  const rows: string[][] = [];
  for (const { score, rating, analysis: a } of result.pairs) {
    const row = (level: string, statistic: string, f: { estimate?: number; se?: number; ciLow?: number; ciHigh?: number; df?: number; n?: number; p?: number; note?: string }) =>
      rows.push([score, rating, level, statistic, num(f.estimate), num(f.se), num(f.ciLow), num(f.ciHigh), num(f.df), num(f.n), num(f.p), f.note ?? '']);
    row('all', 'pairs', { estimate: a.pairs, n: a.persons, note: 'complete pairs; n = persons' });
    if (a.pooled.ok) row('pooled', 'r', { estimate: a.pooled.r, n: a.pooled.n, note: a.pooled.note });
    else row('pooled', 'r', { note: note(a.pooled) });
    const b = a.between;
    if (b.ok) row('between', 'r_person_means', { estimate: b.r, ciLow: b.ciLow, ciHigh: b.ciHigh, df: b.df, n: b.n, p: b.p, note: b.ciLow === undefined ? 'interval needs n > 3' : '' });
    else row('between', 'r_person_means', { note: note(b) });
    if (a.bootstrapBetween.ok) row('between', 'r_person_means_bootstrap', { estimate: a.between.ok ? a.between.r : undefined, se: a.bootstrapBetween.se, ciLow: a.bootstrapBetween.ciLow, ciHigh: a.bootstrapBetween.ciHigh, n: a.bootstrapBetween.succeeded, note: `percentile interval, ${a.bootstrapBetween.replicates} resamples of persons` });
    else row('between', 'r_person_means_bootstrap', { note: note(a.bootstrapBetween) });
    const w = a.within;
    if (w.ok) row('within', 'r_rm', { estimate: w.r, ciLow: w.ciLow, ciHigh: w.ciHigh, df: w.df, n: w.n, p: w.p, note: w.personsTooFew ? `${w.personsTooFew} person${w.personsTooFew === 1 ? "" : "s"} with fewer than 2 pairs left out` : '' });
    else row('within', 'r_rm', { note: note(w) });
    if (a.bootstrapWithin.ok) row('within', 'r_rm_bootstrap', { estimate: w.ok ? w.r : undefined, se: a.bootstrapWithin.se, ciLow: a.bootstrapWithin.ciLow, ciHigh: a.bootstrapWithin.ciHigh, n: a.bootstrapWithin.succeeded, note: `percentile interval, ${a.bootstrapWithin.replicates} resamples of persons` });
    else row('within', 'r_rm_bootstrap', { note: note(a.bootstrapWithin) });
    const pp = a.perPerson;
    const ppNote = pp.personsWithR === 0 ? `no person has ${pp.minPairs} or more pairs with varying values` : `${pp.personsWithR} of ${pp.persons} persons with at least ${pp.minPairs} pairs`;
    row('per_person', 'r_median', { estimate: pp.median, n: pp.personsWithR, note: ppNote });
    row('per_person', 'r_q1', { estimate: pp.q1, n: pp.personsWithR, note: ppNote });
    row('per_person', 'r_q3', { estimate: pp.q3, n: pp.personsWithR, note: ppNote });
    row('per_person', 'r_min', { estimate: pp.min, n: pp.personsWithR, note: ppNote });
    row('per_person', 'r_max', { estimate: pp.max, n: pp.personsWithR, note: ppNote });
    row('per_person', 'share_positive', { estimate: pp.sharePositive, n: pp.personsWithR, note: ppNote });
    const m = a.mixedModel;
    if (m.ok) {
      const inf = m.inference === 'wald-z' ? 'Wald z' : 't with between/within df';
      for (const f of m.fixed as FixedEffect[]) row('model', f.name === '(Intercept)' ? 'intercept' : f.name, { estimate: f.estimate, se: f.se, ciLow: f.ciLow, ciHigh: f.ciHigh, df: f.df, n: m.n, p: f.p, note: `REML random-intercept model; ${inf}` });
      row('model', 'variance_person', { estimate: m.varianceIntercept, n: m.groups, note: m.boundary ? 'estimated at its bound 0 (singular fit)' : '' });
      row('model', 'variance_residual', { estimate: m.varianceResidual, n: m.n });
      row('model', 'icc_conditional', { estimate: m.icc, n: m.groups, note: 'person variance share of the rating after the score' });
      row('model', 'reml_criterion', { estimate: m.remlCriterion, n: m.n, note: a.reportedModel === 'random_intercept' ? 'reported model' : 'not reported: the random-slope model is' });
    } else row('model', 'fit', { note: note(m) });
    const s = a.randomSlopeModel;
    if (s.ok) {
      const inf = s.inference === 'wald-z' ? 'Wald z' : 't with between/within df (the random-slope predictor on persons − between terms)';
      const lead = a.reportedModel === 'random_slopes' ? 'reported model' : 'not reported';
      for (const f of s.fixed) row('model_slopes', f.name === '(Intercept)' ? 'intercept' : f.name, { estimate: f.estimate, se: f.se, ciLow: f.ciLow, ciHigh: f.ciHigh, df: f.df, n: s.n, p: f.p, note: `REML model with random intercepts and ${s.slope} slopes (${lead}); ${inf}` });
      row('model_slopes', 'variance_person_intercept', { estimate: s.varianceIntercept, n: s.groups, note: s.boundary ? 'singular fit: a variance is at its bound 0' : '' });
      row('model_slopes', `variance_person_slope`, { estimate: s.varianceSlope, n: s.groups });
      row('model_slopes', 'correlation_intercept_slope', { estimate: s.correlation, n: s.groups, note: s.correlation === undefined ? 'a variance is 0' : '' });
      row('model_slopes', 'variance_residual', { estimate: s.varianceResidual, n: s.n });
      row('model_slopes', 'reml_criterion', { estimate: s.criterion, n: s.n, note: lead });
      if (a.slopeTest) row('model_slopes', 'slope_lrt', { estimate: a.slopeTest.statistic, n: s.groups, p: a.slopeTest.p, note: 'REML likelihood ratio, random slopes against random intercepts; p from the 50:50 χ²(1)/χ²(2) mixture (Self & Liang 1987)' });
    } else row('model_slopes', 'fit', { note: note(s) });
    for (const [which, icc] of [['score', a.iccScore], ['rating', a.iccRating]] as const) {
      if (icc.ok) {
        row('icc', `icc1_${which}`, { estimate: icc.icc1, df: icc.df1, n: icc.groups, p: icc.p, note: `one-way ANOVA, n0 = ${num(icc.n0)}` });
        row('icc', `icc1k_${which}`, {
          estimate: icc.icc1k,
          n: icc.groups,
          note: icc.icc1k < 0 ? 'reliability of a person mean; negative because the persons differ less than chance would make them: read it as no between-person reliability' : 'reliability of a person mean',
        });
      } else row('icc', `icc1_${which}`, { note: note(icc) });
    }
  }
  return { header: VALIDATION_STATISTICS_HEADER, rows };
}

/** The aligned pairs: one row per occasion with its text scores and ratings. */
export function alignedPairsTable(result: ValidationResult, scoreColumns: readonly string[], ratingColumns: readonly string[]): Table {
  const header = ['person', 'time', 'time_utc', 'entries', 'words', 'text_missing', 'reports', ...scoreColumns, ...ratingColumns];
  const rows = result.rows.map((r) => [r.person, r.label, new Date(r.instant).toISOString(), num(r.entries), num(r.words), r.missing, num(r.reports), ...scoreColumns.map((c) => num(r.scores[c])), ...ratingColumns.map((c) => num(r.ratings[c]))]);
  return { header, rows };
}

/** Each person's own correlation per score × rating, with why it is empty where it is. */
export function personCorrelationsTable(result: ValidationResult): Table {
  const rows: string[][] = [];
  for (const { score, rating, analysis } of result.pairs) {
    for (const c of analysis.perPerson.correlations) rows.push([score, rating, c.person, num(c.pairs), num(c.r), c.note]);
  }
  return { header: ['score', 'rating', 'person', 'pairs', 'r', 'note'], rows };
}

/** Word-count reliability bands per score. */
export function wordReliabilityTable(result: ValidationResult): Table {
  const rows: string[][] = [];
  for (const rel of result.reliability) {
    for (const b of rel.bands) rows.push([rel.column, num(b.low), num(b.high), num(b.bins), num(b.medianWords), num(b.halfR), num(b.reliability), num(b.reliabilityLow), num(b.reliabilityHigh), num(b.withinReliability), num(b.wordsForTarget), rel.reducer, num(rel.splits), b.note]);
  }
  return { header: ['score', 'words_from', 'words_below', 'bins', 'median_words', 'half_r', 'reliability', 'reliability_low', 'reliability_high', 'within_reliability', 'words_for_target', 'halves_scored_by', 'splits', 'note'], rows };
}

/** Observed bins behind each person mean and the mean's reliability. */
export function binsPerPersonTable(result: ValidationResult): Table {
  const rows: string[][] = [];
  for (const b of result.binsPerPerson) for (const p of b.perPerson) rows.push([b.column, p.person, num(p.bins), num(p.meanReliability), p.meanReliability === undefined ? (b.icc1 === undefined ? 'ICC(1) not estimable' : 'ICC(1) not positive or no bins') : '']);
  return { header: ['score', 'person', 'bins', 'mean_reliability', 'note'], rows };
}

/** Diagnostics of the validation stage. */
export function validationDiagnosticsTable(result: ValidationResult): Table {
  return { header: ['code', 'message', 'file', 'line', 'stage'], rows: result.diagnostics.map((d) => [d.code, diagnosticText(d.message), d.source?.file ?? '', num(d.source?.line), d.stage]) };
}

/**
 * The JSON summary: options, the ratings reconciliation when given (self-report rows read, kept,
 * and left out by reason: what the report's reconciliation table shows), counts, each pair's
 * statistics and verdict, reliability and bins-per-person summaries, and diagnostic counts by
 * code. Non-finite numbers never appear.
 */
export function validationJson(result: ValidationResult, reconciliation?: Readonly<Record<string, unknown>>): string {
  const diagnostics: Record<string, number> = {};
  for (const d of result.diagnostics) diagnostics[d.code] = (diagnostics[d.code] ?? 0) + 1;
  const clean = (value: unknown): unknown => {
    if (typeof value === 'number') return Number.isFinite(value) ? value : undefined;
    if (Array.isArray(value)) return value.map(clean);
    if (value && typeof value === 'object') return Object.fromEntries(Object.entries(value).map(([k, v]) => [k, clean(v)]));
    return value;
  };
  const body = {
    options: result.options,
    ...(reconciliation ? { reconciliation } : {}),
    counts: result.counts,
    diagnostics,
    pairs: result.pairs.map(({ score, rating, analysis }) => {
      const { perPerson, ...rest } = analysis;
      const { correlations: _omit, ...perPersonSummary } = perPerson;
      return { score, rating, ...rest, perPerson: perPersonSummary };
    }),
    reliability: result.reliability,
    binsPerPerson: result.binsPerPerson.map(({ perPerson: _p, ...summary }) => summary),
  };
  return JSON.stringify(clean(body), null, 2) + '\n';
}
