import { usageError } from '../../errors.js';
import type { Reconciliation } from '../../types.js';
import type { AlignedPair } from '../../validate/aligned-pair.js';
import { absent, present, type ReliabilityCurve, type ReportData, type ValidationData, type ValidationPair } from '../report-data.js';
import { alignedFromCsv } from './aligned-from-csv.js';
import { coverageFromRows } from './coverage-from-rows.js';
import { dynamicsResultTables } from './dynamics-result-tables.js';
import { parseCsvTable } from './parse-csv-table.js';
import { parseSeriesLong } from './parse-series-long.js';
import { personTracks, type BinRatings } from './person-tracks.js';
import { ratingsReconciliationFrom } from './ratings-reconciliation-from.js';
import { readinessFromRows } from './readiness-from-rows.js';
import { withNeverMatched } from './never-matched-terms.js';
import { termsFromJson } from './terms-from-json.js';
import { termsFromTopTerms } from './terms-from-top-terms.js';
import { validationFromJson } from './validation-from-json.js';
import { completePoints, validationFromPairs } from './validation-from-pairs.js';

/** The score drawn when the user names none and it exists (VADER's compound score, bounded −1 to 1). */
const DEFAULT_SCORE = 'vader.compound';

/** Columns of an aligned pairs file that are neither scores nor ratings. */
const ALIGNED_FIXED = new Set(['person', 'time', 'text_missing', 'label', 'bin_start', 'instant', 'time_utc', 'time_local', 'entries', 'words', 'missing', 'reports', 'alignment']);

/** The contents of an output folder as far as they exist (io/read-report-data.ts reads them). */
export interface ReportInputs {
  /** Name of the output folder (shown on the page). */
  source: string;
  tool: { name: string; version: string };
  /** Text of series-long.csv. */
  seriesCsv?: string;
  /** Parsed manifest.json. */
  manifest?: Record<string, unknown>;
  /** Reconciliation from the scores sidecar, used when the manifest has none. */
  reconciliation?: Reconciliation;
  /** Parsed scores sidecar (`scores.csv.meta.json`): the provenance when there is no manifest (output of `lexichron score` alone). */
  scoresMeta?: Record<string, unknown>;
  /** Parsed validation JSON of the validate stage (see validationFromJson). */
  validationJson?: unknown;
  /** Text of the validate stage's aligned pairs CSV (see alignedFromCsv). */
  alignedCsv?: string;
  /** Text of the term audit's top-terms.csv (preferred; see termsFromTopTerms). */
  topTermsCsv?: string;
  /** Parsed term audit JSON, used when there is no top-terms.csv (see termsFromJson). */
  termsJson?: unknown;
  /** Each audited lexicon's term-hits.csv, for the terms that never matched (see withNeverMatched). */
  termHitsFiles?: { lexicon: string; text: string }[];
  /** CSV files of the dynamics stage (see dynamicsResultTables). */
  dynamicsFiles?: { name: string; text: string }[];
  /** Why an input is absent or unreadable, by section (`validation`, `lexicons`, `dynamics`, …). */
  reasons?: Partial<Record<'series' | 'manifest' | 'validation' | 'lexicons' | 'dynamics', string>>;
}

/** Choices a user makes for the report. */
export interface ReportOptions {
  /** Score column drawn in the series and readiness sections (default: `vader.compound` when present among the validated scores, else the first validated score; without validation the same rule over the series' scores). */
  score?: string;
  /** Rating drawn beside it (default: the first rating validated with that score). */
  rating?: string;
  /** Person of the large series view (default: the first person in id order). */
  person?: string;
  /** Readiness threshold on usable lag pairs (default 50). */
  minLagPairs?: number;
  title?: string;
}

/** Names as a list for a message: each in backticks, at most 20, then how many more. */
function choiceList(names: readonly string[]): string {
  if (names.length === 0) return '(none)';
  const shown = names.slice(0, 20).map((n) => `\`${n}\``).join(', ');
  return names.length > 20 ? `${shown} and ${names.length - 20} more` : shown;
}

/** Key of a score × rating pair in {@link ReportInputs.alignedPairs}. */
export function pairKey(score: string, rating: string): string {
  return `${score}\u0000${rating}`;
}

/**
 * Assembles the report's data from what an output folder holds: coverage, tracks and readiness
 * from the series file; reconciliation and provenance from the manifest; validation from its
 * statistics JSON (or, lacking it, from the aligned pairs through the validate stage's own
 * analysis), with the aligned pairs also giving the scatters and the self-reports per bin;
 * term audit and dynamics as given. Every absent input becomes an absent part with its reason.
 * Pure: no files, no clock.
 */
export function buildReportData(inputs: ReportInputs, options: ReportOptions = {}): ReportData {
  const why = inputs.reasons ?? {};
  const parsed = inputs.seriesCsv === undefined ? absent<never>(why.series ?? 'the folder has no series-long.csv; run `lexichron series` or `lexichron run` first.') : parseSeriesLong(inputs.seriesCsv);
  // validation
  const fromJson = inputs.validationJson === undefined ? { pairs: [], reliability: [] } : validationFromJson(inputs.validationJson);
  const pairs: ValidationPair[] = fromJson.pairs;
  const reliability: ReliabilityCurve[] = fromJson.reliability;
  let alignedPairs: Map<string, AlignedPair[]> | undefined;
  let binRatings: Map<string, BinRatings> | undefined;
  if (inputs.alignedCsv !== undefined) {
    const header = parseCsvTable(inputs.alignedCsv)?.header ?? [];
    const seriesScores = parsed.ok ? parsed.value.scores : [];
    const scoreNames = pairs.length ? [...new Set(pairs.map((p) => p.score))] : header.filter((h) => seriesScores.includes(h));
    const ratingNames = pairs.length ? [...new Set(pairs.map((p) => p.rating))] : header.filter((h) => !seriesScores.includes(h) && !ALIGNED_FIXED.has(h) && !h.includes('.'));
    const aligned = alignedFromCsv(inputs.alignedCsv, scoreNames, ratingNames, parsed.ok ? parsed.value.rows : []);
    alignedPairs = aligned.pairs;
    binRatings = aligned.binRatings;
  }
  if (pairs.length === 0 && alignedPairs)
    for (const [key, list] of alignedPairs) {
      const [score, rating] = key.split('\u0000') as [string, string];
      pairs.push(validationFromPairs(score, rating, list));
    }
  else if (alignedPairs) for (const p of pairs) if (!p.points) p.points = completePoints(alignedPairs.get(pairKey(p.score, p.rating)) ?? []);
  const scores = parsed.ok ? parsed.value.scores : [];
  if (options.score !== undefined && parsed.ok && !scores.includes(options.score)) {
    throw usageError(`The report's score \`${options.score}\` (--score, or report.score in the study file) is not a score column of series-long.csv; choose one of ${choiceList(scores)}.`);
  }
  if (options.person !== undefined && parsed.ok && !parsed.value.rows.some((r) => r.person === options.person)) {
    throw usageError(`The report's person \`${options.person}\` (--person, or report.person in the study file) has no rows in series-long.csv; choose one of ${choiceList([...new Set(parsed.value.rows.map((r) => r.person))].sort())}.`);
  }
  const preferred = (list: readonly string[]): string | undefined => (list.includes(DEFAULT_SCORE) ? DEFAULT_SCORE : list[0]);
  const score =
    options.score ??
    (options.rating ? pairs.find((p) => p.rating === options.rating)?.score : undefined) ??
    preferred(pairs.map((p) => p.score)) ??
    preferred(scores);
  const rating = options.rating ?? pairs.find((p) => p.score === score)?.rating ?? (binRatings ? [...binRatings.keys()][0] : undefined);
  const shownIndex = Math.max(0, pairs.findIndex((p) => p.score === score && p.rating === rating));
  const validation: ReportData['validation'] =
    pairs.length || reliability.length
      ? present<ValidationData>({ pairs, shown: shownIndex, reliability })
      : absent(why.validation ?? 'the folder has no validation output; name self-reports in the study file (`ratings`) or run `lexichron validate`.');
  // series-based parts
  let coverage: ReportData['coverage'] = absent(parsed.ok ? '' : parsed.reason);
  let series: ReportData['series'] = absent(parsed.ok ? '' : parsed.reason);
  let readiness: ReportData['readiness'] = absent(parsed.ok ? '' : parsed.reason);
  if (parsed.ok) {
    const { rows } = parsed.value;
    if (score === undefined || !scores.includes(score)) {
      const reason = score === undefined ? 'series-long.csv has no score column.' : `the score \`${score}\` is not a column of series-long.csv; choose one of ${scores.map((s) => `\`${s}\``).join(', ')}.`;
      series = absent(reason);
      readiness = absent(reason);
      coverage = present(coverageFromRows(rows));
    } else {
      const cov = coverageFromRows(rows);
      coverage = present(cov);
      const tracks = personTracks(rows, score, cov.binHours, rating ? binRatings?.get(rating) : undefined);
      const selected = options.person !== undefined && tracks.some((t) => t.person === options.person) ? options.person : (tracks[0]?.person ?? '');
      series = tracks.length
        ? present({ score, scores, ...(rating && binRatings?.has(rating) ? { rating } : {}), binHours: cov.binHours, persons: tracks, selected })
        : absent('series-long.csv has no rows.');
      readiness = present(readinessFromRows(rows, score, options.minLagPairs));
    }
  }
  const ratingsReconciliation = ratingsReconciliationFrom(inputs.validationJson, (inputs.manifest?.stages as Record<string, unknown> | undefined)?.validation);
  const manifestReconciliation = inputs.manifest?.reconciliation as Reconciliation | undefined;
  const reconciliation = manifestReconciliation ?? inputs.reconciliation;
  const studyName = ((inputs.manifest?.parameters as Record<string, unknown> | undefined)?.study as Record<string, unknown> | undefined)?.name;
  const topTerms = (inputs.topTermsCsv === undefined ? undefined : termsFromTopTerms(inputs.topTermsCsv)) ?? (inputs.termsJson === undefined ? undefined : termsFromJson(inputs.termsJson));
  const terms = withNeverMatched(topTerms, inputs.termHitsFiles ?? []);
  const dynamics = inputs.dynamicsFiles ? dynamicsResultTables(inputs.dynamicsFiles) : undefined;
  return {
    title: options.title ?? (typeof studyName === 'string' ? `${studyName}: study report` : `Study report: ${inputs.source}`),
    tool: inputs.tool,
    source: inputs.source,
    coverage,
    reconciliation: reconciliation ? present(reconciliation) : absent('neither manifest.json nor scores.csv.meta.json holds a reconciliation.'),
    series,
    validation,
    ...(ratingsReconciliation ? { ratingsReconciliation } : {}),
    lexicons: terms ? present(terms) : absent(why.lexicons ?? 'the folder has no term audit; run `lexichron terms audit` or add the audit to the study file.'),
    readiness,
    dynamics: dynamics ? present(dynamics) : absent(why.dynamics ?? 'the dynamics stage did not run; run `lexichron dynamics` or add it to the study file.'),
    provenance: inputs.manifest ? present({ manifest: inputs.manifest }) : inputs.scoresMeta ? present({ manifest: inputs.scoresMeta }) : absent(why.manifest ?? 'the folder has no manifest.json.'),
  };
}
