import { usageError } from '../errors.js';
import type { BinReducer } from '../series/bin-accumulator.js';
import type { FixedEffectInference } from '../stats/linear-mixed-model.js';
import { random } from '../stats/random.js';
import type { Diagnostic } from '../types.js';
import { alignRatingsToBins } from './align-ratings-to-bins.js';
import { alignRatingsToWindows } from './align-ratings-to-windows.js';
import type { AlignedRow } from './aligned-row.js';
import { analysePair, type PairAnalysis, type RandomSlopeChoice } from './analyse-pair.js';
import { binsPerPerson, type BinsPerPerson } from './bins-per-person.js';
import type { EntryScore } from './entry-score.js';
import type { Rating } from './rating.js';
import type { SeriesBin } from './series-bin.js';
import { wordCountReliability, type WordCountReliability } from './word-count-reliability.js';

/** Options of {@link validateSeries}, with their defaults. */
export interface ValidateOptions {
  /** `bins` (default): ratings averaged into the text series' bins; `window`: text in the window before each self-report. */
  align: 'bins' | 'window';
  /** Window length in minutes for `window` alignment (default 180). */
  windowMinutes: number;
  /** Fewest words in a window for a text score (`window` alignment; default 1). Bins use the series stage's own --min-words. */
  minWords: number;
  /** Seed of the bootstrap and split-half randomness (default 1). */
  seed: number | string;
  /** Bootstrap resamples (default 2000; 0 skips). */
  replicates: number;
  /** Fewest pairs for a person's own correlation (default 10). */
  minPairs: number;
  /** Target reliability of the word-count analysis (default 0.7). */
  reliability: number;
  /** Confidence level (default 0.95). */
  level: number;
  /** Fixed-effect inference of the mixed model (default `between-within-t`). */
  inference: FixedEffectInference;
  /** Random slopes for the within-person score (default `auto`: when the likelihood-ratio test favours them). */
  randomSlopes: RandomSlopeChoice;
}

export const DEFAULT_VALIDATE_OPTIONS: ValidateOptions = {
  align: 'bins',
  windowMinutes: 180,
  minWords: 1,
  seed: 1,
  replicates: 2000,
  minPairs: 10,
  reliability: 0.7,
  level: 0.95,
  inference: 'between-within-t',
  randomSlopes: 'auto',
};

/** What {@link validateSeries} needs: parsed inputs (see `runValidate` for reading them from files). */
export interface ValidateInput {
  /** The long text series (needed for `bins` alignment and bins-per-person counts). */
  bins?: readonly SeriesBin[];
  /** Entry-level scores (event file): needed for `window` alignment and the word-count reliability. */
  entries?: readonly EntryScore[];
  ratings: readonly Rating[];
  scoreColumns: readonly string[];
  ratingColumns: readonly string[];
  /** The series' reducer per score column (from the series' .meta.json); default `weighted`. */
  reducers?: Readonly<Record<string, BinReducer>>;
  /** The series stage's --min-words (from its .meta.json), for the reliability warning under bin alignment. */
  seriesMinWords?: number;
  /** Formats a self-report's local time (window labels); default: ISO UTC. */
  label?: (rating: Rating) => string;
}

/** The result of one validation: aligned rows, every pair's analysis, reliability and diagnostics. */
export interface ValidationResult {
  options: ValidateOptions;
  rows: AlignedRow[];
  pairs: { score: string; rating: string; analysis: PairAnalysis }[];
  reliability: WordCountReliability[];
  binsPerPerson: BinsPerPerson[];
  diagnostics: Diagnostic[];
  /** Self-reports with at least one rating value (unanswered prompts are `rating_unanswered` diagnostics), aligned rows, rows with text, persons. */
  counts: { ratings: number; rows: number; rowsWithText: number; persons: number };
}

/**
 * Validates text scores against self-reports: aligns them (by bins or by prompt windows), then
 * analyses every score × rating pair with {@link analysePair}, estimates the word-count
 * reliability of each score from the entry-level file when given, and counts the bins behind
 * each person mean. Pure: the randomness of each pair is seeded from `seed`, the score and the
 * rating, so results do not depend on the order in which pairs are analysed.
 *
 * Throws a usage error when the chosen alignment lacks its input.
 */
export function validateSeries(input: ValidateInput, options: Partial<ValidateOptions> = {}): ValidationResult {
  const o: ValidateOptions = { ...DEFAULT_VALIDATE_OPTIONS, ...options };
  const diagnostics: Diagnostic[] = [];
  // A prompt without any rating value (every rating column empty or a missing code) is no
  // observation: it makes no aligned row, no report and no pair, and is counted here.
  const answered: Rating[] = [];
  for (const r of input.ratings) {
    if (input.ratingColumns.some((c) => r.values[c] !== undefined)) answered.push(r);
    else diagnostics.push({ code: 'rating_unanswered', message: `the self-report of \`${r.person}\` holds no rating (every rating column is empty, a missing-value code or left out); the prompt is not paired`, source: r.source, stage: 'validate' });
  }
  input = { ...input, ratings: answered };
  let rows: AlignedRow[];
  if (o.align === 'bins') {
    if (!input.bins) throw usageError('Bin alignment needs the long text series (series-long.csv); pass it as SERIES.');
    const aligned = alignRatingsToBins(input.bins, input.ratings, input.ratingColumns);
    rows = aligned.rows;
    diagnostics.push(...aligned.diagnostics);
  } else {
    if (!input.entries) throw usageError('Window alignment needs the entry-level scores; pass the series event file (series-long.events.csv) or a scores file with --events FILE.');
    const known = new Set(input.entries.map((e) => e.person));
    for (const r of input.ratings) {
      if (!known.has(r.person)) diagnostics.push({ code: 'rating_person_not_in_series', message: `person \`${r.person}\` has self-reports but no text; the self-report has no text window`, source: r.source, stage: 'validate' });
    }
    rows = alignRatingsToWindows(input.entries, input.ratings, {
      windowMinutes: o.windowMinutes,
      minWords: o.minWords,
      scoreColumns: input.scoreColumns,
      ratingColumns: input.ratingColumns,
      label: input.label ?? ((r) => new Date(r.instant).toISOString()),
    });
  }
  const pairs: ValidationResult['pairs'] = [];
  for (const score of input.scoreColumns) {
    for (const rating of input.ratingColumns) {
      const analysis = analysePair(
        rows.map((r) => ({ person: r.person, x: r.scores[score], y: r.ratings[rating] })),
        { random: random(`${o.seed}\u0000${score}\u0000${rating}`), replicates: o.replicates, minPairs: o.minPairs, level: o.level, inference: o.inference, randomSlopes: o.randomSlopes },
      );
      pairs.push({ score, rating, analysis });
    }
  }
  const reliability = input.entries
    ? input.scoreColumns.map((c) =>
        wordCountReliability(input.entries as EntryScore[], c, {
          random: random(`${o.seed}\u0000reliability\u0000${c}`),
          target: o.reliability,
          reducer: input.reducers?.[c] ?? 'weighted',
          minWordsInUse: o.align === 'bins' ? input.seriesMinWords : o.minWords,
        }),
      )
    : [];
  const perPerson = input.bins ? input.scoreColumns.map((c) => binsPerPerson(input.bins as SeriesBin[], c)) : [];
  return {
    options: o,
    rows,
    pairs,
    reliability,
    binsPerPerson: perPerson,
    diagnostics,
    counts: { ratings: answered.length, rows: rows.length, rowsWithText: rows.filter((r) => r.missing === '').length, persons: new Set(rows.map((r) => r.person)).size },
  };
}
