/**
 * The one typed input of the HTML report. `src/io/read-report-data.ts` assembles it from whatever
 * files a study output folder holds; `renderReport` (src/report/html/render-report.ts) turns it
 * into a page. Every section is a {@link Part}: either its data or the plain reason it is absent,
 * so a report is written even when some stages did not run.
 */
import type { Reconciliation } from '../types.js';

/** A section's data, or why there is none (one sentence a researcher can read). */
export type Part<T> = { ok: true; value: T } | { ok: false; reason: string };

/** Missing-bin reasons of `series-long.csv` (docs/architecture.md). */
export type MissingReason = 'no_text' | 'too_few_words' | 'excluded_hours' | 'outside_window' | 'before_first_entry' | 'after_last_entry';

/** One person-day of the coverage heatmap (bins of that local date summed). */
export interface CoverageCell {
  /** Local calendar date `YYYY-MM-DD`. */
  date: string;
  words: number;
  bins: number;
  observedBins: number;
  /** Set when no bin of the day is observed: the most frequent reason among its bins. */
  missing?: string;
  /** Real length of the day in hours when it differs from 24 (clock change), else undefined. */
  hours?: number;
}

/** Coverage of one person. */
export interface PersonCoverage {
  person: string;
  cells: CoverageCell[];
}

/** Data of the coverage heatmap. */
export interface CoverageData {
  /** Every local date from the first to the last of any person, sorted. */
  dates: string[];
  persons: PersonCoverage[];
  /** Nominal bin length in hours (the most common `bin_hours`). */
  binHours: number;
  /** Missing bins by reason over all persons. */
  missingBins: Record<string, number>;
  totalBins: number;
}

/** One bin of a person's track. */
export interface TrackPoint {
  t: number;
  /** Local wall-clock time of the bin start as if it were UTC (epoch ms): aligns days across zones. */
  start: number;
  /** Real length of the bin in hours. */
  hours: number;
  /** Local calendar date. */
  date: string;
  score: number | undefined;
  rating: number | undefined;
  /** Empty when observed, else the reason. */
  missing: string;
}

/** A person's series as drawn. */
export interface PersonTrack {
  person: string;
  points: TrackPoint[];
  /** Local dates whose bins are longer or shorter than usual (clock changes), with the day's hours. */
  clockChanges: { date: string; hours: number; start: number }[];
}

/** Data of the per-person series section. */
export interface SeriesData {
  /** The score column drawn, e.g. `vader.compound`. */
  score: string;
  /** Score columns available in the series file. */
  scores: string[];
  /** The self-report drawn beside it, when ratings were aligned. */
  rating?: string;
  /** Nominal bin length in hours. */
  binHours: number;
  persons: PersonTrack[];
  /** The person of the large view. */
  selected: string;
}

/** A correlation with its interval as shown in the report. */
export interface ShownCorrelation {
  r: number;
  ciLow?: number;
  ciHigh?: number;
  /** Pairs (pooled), persons (between) or residual df (within) behind it. */
  n: number;
  df?: number;
  persons?: number;
}

/** One text score × rating validation. */
export interface ValidationPair {
  score: string;
  rating: string;
  pairs: number;
  persons: number;
  pooled: ShownCorrelation | { missing: string };
  between: ShownCorrelation | { missing: string };
  within: ShownCorrelation | { missing: string };
  /** Plain-words reading from the validate stage. */
  verdict?: string;
  warnings: string[];
  /** Aligned observations for the scatters (complete pairs). */
  points?: { person: string; x: number; y: number }[];
}

/** One point of the reliability-by-word-count curve. */
export interface ReliabilityPoint {
  words: number;
  reliability: number;
  low?: number;
  high?: number;
  /** Bins behind the estimate. */
  bins?: number;
}

/** The reliability-by-word-count curve of one score. */
export interface ReliabilityCurve {
  score: string;
  points: ReliabilityPoint[];
  /** Reliability aimed at, e.g. 0.7. */
  target?: number;
  /** Recommended `--min-words` that reaches the target. */
  recommendedMinWords?: number;
  note?: string;
}

/** Data of the validation section. */
export interface ValidationData {
  pairs: ValidationPair[];
  /** The pair whose scatters are drawn (index into `pairs`). */
  shown: number;
  reliability: ReliabilityCurve[];
}

/** One term of a category's audit. */
export interface AuditedTerm {
  term: string;
  hits: number;
  /** Share of the category's hits, 0–1. */
  share: number;
  flags: string[];
}

/** A category's most frequent terms. */
export interface CategoryAudit {
  lexicon: string;
  category: string;
  totalHits: number;
  /** Matched terms (none when no term of the category matched). */
  terms: AuditedTerm[];
  /** Terms that never matched in the corpus, and all terms of the category, when the audit lists them. */
  neverMatched?: string[];
  termCount?: number;
}

/** Data of the lexicon section. */
export interface LexiconAuditData {
  categories: CategoryAudit[];
  /** What each flag means. */
  flagMeanings: Record<string, string>;
}

/** Dynamics readiness of one person's score series. */
export interface PersonReadiness {
  person: string;
  bins: number;
  observed: number;
  percentMissing: number | undefined;
  longestGapBins: number;
  longestGapHours: number;
  lagPairs: number;
  autocorrelation: number | undefined;
  mssd: number | undefined;
  ready: boolean;
}

/** Data of the dynamics readiness section. */
export interface ReadinessData {
  variable: string;
  minLagPairs: number;
  persons: PersonReadiness[];
}

/** A plain table of results (e.g. from the dynamics stage). */
export interface ResultTable {
  title: string;
  columns: string[];
  rows: string[][];
  /** Rows not shown (the table is cut for page size). */
  omitted?: number;
}

/** Data of the dynamics results. */
export interface DynamicsData {
  tables: ResultTable[];
}

/**
 * How the self-reports were read and matched to the text (the validate stage's record): rows read
 * and kept, what was left out with its reason (whole rows, single ratings, self-reports that found
 * no text), and what was paired. Counts not known to this version of the report are kept in
 * `more`, by the name the stage gave them, so nothing the stage counted goes unshown.
 */
export interface RatingsReconciliation {
  /** Self-report rows read from the ratings file (absent when the output does not record it). */
  read?: number;
  /** Rows with a usable person and time. */
  kept?: number;
  /** Whole rows left out, by reason code. */
  rowsLeftOut: Record<string, number>;
  /** Single ratings left out while the row was kept (not a number, outside the scale), by code. */
  valuesLeftOut: Record<string, number>;
  /** Self-reports that found no text to pair with, by code. */
  notPaired: Record<string, number>;
  /** Prompts whose every rating is missing: never paired (absent when the stage recorded none). */
  unanswered?: number;
  /** Other problems of the validate stage (e.g. unreadable rows of the series file), by code. */
  other: Record<string, number>;
  /** Aligned occasions (bins, or windows before each self-report), those with text, and persons. */
  occasions?: number;
  occasionsWithText?: number;
  persons?: number;
  /** Further counts the stage recorded: label (its own name) and either a number or counts by code. */
  more: Array<{ name: string; value: number | Record<string, number> }>;
}

/** Data of the provenance section: the manifest as written. */
export interface ProvenanceData {
  manifest: Record<string, unknown>;
}

/** Everything the report shows. */
export interface ReportData {
  title: string;
  tool: { name: string; version: string };
  /** Name of the output folder the report was built from (not a full path). */
  source: string;
  coverage: Part<CoverageData>;
  reconciliation: Part<Reconciliation>;
  series: Part<SeriesData>;
  validation: Part<ValidationData>;
  /** How the self-reports were read and paired (shown in the validation section); absent without a validate stage. */
  ratingsReconciliation?: RatingsReconciliation;
  lexicons: Part<LexiconAuditData>;
  readiness: Part<ReadinessData>;
  dynamics: Part<DynamicsData>;
  provenance: Part<ProvenanceData>;
}

/** Builds a present part. */
export function present<T>(value: T): Part<T> {
  return { ok: true, value };
}

/** Builds an absent part with its reason. */
export function absent<T>(reason: string): Part<T> {
  return { ok: false, reason };
}
