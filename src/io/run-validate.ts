import { readFile } from 'node:fs/promises';
import { basename, join } from 'node:path';
import type { BinReducer } from '../series/bin-accumulator.js';
import { inputError, usageError } from '../errors.js';
import { parseColumnMapping, resolveColumns, type ColumnMapping } from '../ingest/column-mapping.js';
import { DEFAULT_TIME_OPTIONS, formatLocal, type TimeOptions } from '../ingest/parse-instant.js';
import { recordToEntry } from '../ingest/read-entries.js';
import { readRecords, type TableFormat } from '../ingest/read-records.js';
import { ownTableFile } from './own-table-file.js';
import { tableFile } from './table-file.js';
import type { ZoneTable } from '../ingest/zone-table.js';
import { csvDocument } from '../report/csv.js';
import type { TableResource } from '../report/data-dictionary.js';
import { inferTableResource } from '../report/infer-table-resource.js';
import {
  alignedPairsTable,
  binsPerPersonTable,
  personCorrelationsTable,
  validationDiagnosticsTable,
  validationJson,
  validationStatisticsTable,
  wordReliabilityTable,
  type Table,
} from '../report/validation-tables.js';
import type { Diagnostic } from '../types.js';
import { entryScoreColumns, entryScoreFromRecord, type EntryScore } from '../validate/entry-score.js';
import type { Rating } from '../validate/rating.js';
import { ratingColumns as selectRatingColumns } from '../validate/rating-columns.js';
import { parseRatingScales, type RatingScale } from '../validate/rating-scale.js';
import { DEFAULT_MISSING_CODES, ratingValues } from '../validate/rating-values.js';
import { seriesBinFromRecord, seriesScoreColumns, type SeriesBin } from '../validate/series-bin.js';
import { validateSeries, type ValidateOptions, type ValidationResult } from '../validate/validate-series.js';
import { writeFileAtomic } from './atomic-write.js';

/** Descriptions of the columns of the validation tables (types are read from the values). */
const VALIDATION_COLUMNS: Record<string, string> = {
  score: 'Text score column', rating: 'Self-report (rating) column', level: 'Level of the statistic: pooled, between, within, per_person, model, icc, bootstrap',
  statistic: 'Name of the statistic', estimate: 'Estimate', ci_low: 'Lower end of the 95% interval', ci_high: 'Upper end of the 95% interval',
  se: 'Standard error', df: 'Degrees of freedom', n: 'Number of pairs, persons or bins the statistic rests on', p: 'Two-sided p-value',
  note: 'Why a value is empty, or a caution', person: 'Person id', pairs: 'Pairs of the person', r: 'Pearson correlation',
  time: 'Local start of the bin, or local time of the self-report', time_utc: 'The same instant in UTC', entries: 'Entries behind the text scores',
  words: 'Words behind the text scores', text_missing: 'Why the text side is missing (empty when observed)', reports: 'Self-reports averaged into the row',
  half_r: 'Correlation of the two half scores across bins, averaged over the random splits', reliability: 'Split-half reliability of a bin score (Spearman-Brown corrected); empty when not estimable',
  reliability_low: 'Lower end of the approximate 95% interval of the reliability', reliability_high: 'Upper end of the approximate 95% interval of the reliability',
  halves_scored_by: 'The series reducer used to score each half (weighted, mean or sum)', splits: 'Random splits averaged',
};

/** Options of {@link runValidate}. */
export interface RunValidateOptions {
  /** Long series CSV (needed for bin alignment). */
  series?: string;
  /** Entry-level file: the series stage's event file (or a scores file for windows only). */
  events?: string;
  /** Self-report file (CSV, TSV, JSON Lines or JSON). */
  ratings: string;
  /** Person/time/zone/id columns of the self-report file (`person=COL,time=COL[,zone=COL][,id=COL]`). */
  columns?: ColumnMapping | string;
  format?: TableFormat;
  delimiter?: string;
  zones: ZoneTable;
  time?: TimeOptions;
  /** Rating columns (default: every column but person, time, zone and id). */
  ratingColumns?: string[];
  /**
   * Missing-value codes of the rating columns (`--missing NA,-99`): read as missing, not as errors.
   * Default DEFAULT_MISSING_CODES (`NA`); an empty list leaves only empty cells missing.
   */
  missing?: readonly string[];
  /** Declared scales, as a map or the `--scale` text. */
  scales: ReadonlyMap<string, RatingScale> | string;
  /** Score columns to validate (default: every score column of the series / event file). */
  scoreColumns?: string[];
  /** Output folder. */
  out: string;
  validate?: Partial<ValidateOptions>;
  /** Maps self-report person ids as the text's were mapped (pseudonymization), so both sides match. */
  person?: (id: string) => string;
  /** Name of the self-report file in diagnostics (default: its file name; `run` with a key passes `ratings`, so no file name sits beside pseudonyms). */
  ratingsName?: string;
}

/** What {@link runValidate} wrote. */
export interface RunValidateResult {
  result: ValidationResult;
  scoreColumns: string[];
  ratingColumns: string[];
  /** Paths written, by role. */
  files: Record<'statistics' | 'pairs' | 'persons' | 'json' | 'diagnostics' | 'reliability' | 'binsPerPerson', string | undefined>;
  /** Data-package resources of the tables written (paths relative to `out`). */
  resources: TableResource[];
  /**
   * Self-report rows read, kept, and rejected by code (rows and values); `missing`: rating values
   * read as missing (empty or a missing-value code) per rating column, with the `codes` in use;
   * `notes`: kept rows by note (`time_iso_fallback`), absent when none.
   */
  reconciliation: { read: number; kept: number; rejected: Record<string, number>; missing: Record<string, number>; codes: string[]; notes?: Record<string, number> };
}

/** Reads the self-report file into ratings and diagnostics (row rejects and value rejects). */
export async function readRatings(options: Pick<RunValidateOptions, 'ratings' | 'columns' | 'format' | 'delimiter' | 'zones' | 'time' | 'ratingColumns' | 'scales' | 'person' | 'ratingsName' | 'missing'>): Promise<{ ratings: Rating[]; columns: string[]; diagnostics: Diagnostic[]; read: number; missing: Record<string, number>; codes: string[]; notes: Record<string, number> }> {
  const scales = typeof options.scales === 'string' ? parseRatingScales(options.scales) : options.scales;
  const mapping = typeof options.columns === 'string' || options.columns === undefined ? parseColumnMapping(options.columns) : options.columns;
  const time = options.time ?? DEFAULT_TIME_OPTIONS;
  const file = basename(options.ratings);
  const codes = [...new Set((options.missing ?? DEFAULT_MISSING_CODES).map((m) => m.trim()).filter((m) => m !== ''))];
  const missing = new Set(codes);
  /** Values read as missing, per rating column; kept rows with a note, by note. */
  const missingCount: Record<string, number> = {};
  const notes: Record<string, number> = {};
  const ratings: Rating[] = [];
  const diagnostics: Diagnostic[] = [];
  let columns: ColumnMapping | undefined;
  let ratingCols: string[] = [];
  let read = 0;
  const resolve = (header: readonly string[]) => {
    columns = resolveColumns(mapping, header, file, false);
    ratingCols = selectRatingColumns(header, [columns.person, columns.time, columns.zone ?? 'zone', columns.id ?? 'id'], options.ratingColumns, scales, file);
  };
  const named = options.ratingsName;
  for await (const raw of readRecords(tableFile(options.ratings), { format: options.format, delimiter: options.delimiter })) {
    let item = raw;
    if (item.kind === 'header') {
      if (item.columns.length > 0) resolve(item.columns);
      continue;
    }
    read += 1;
    if (named !== undefined) item = item.kind === 'reject' ? { ...item, diagnostic: { ...item.diagnostic, source: item.diagnostic.source && { ...item.diagnostic.source, file: named } } } : { ...item, source: { ...item.source, file: named } };
    if (item.kind === 'reject') {
      diagnostics.push({ ...item.diagnostic, stage: 'validate' });
      continue;
    }
    if (!columns) resolve(Object.keys(item.record));
    const c = columns as ColumnMapping;
    // The text readers' person, time and zone handling, with the person column standing in for text.
    // A person without a zone whose time carries its offset keeps that offset (recordToEntry).
    const parsed = recordToEntry(item.record, item.source, { ...c, text: c.person }, options.zones, time);
    if (parsed.kind === 'reject') {
      diagnostics.push({ ...parsed.diagnostic, stage: 'validate' });
      continue;
    }
    const { values, diagnostics: valueProblems, missing: absent } = ratingValues(item.record, ratingCols, scales, item.source, missing);
    diagnostics.push(...valueProblems);
    for (const column of absent) missingCount[column] = (missingCount[column] ?? 0) + 1;
    for (const note of parsed.notes ?? []) notes[note] = (notes[note] ?? 0) + 1;
    const e = parsed.entry;
    ratings.push({ person: options.person ? options.person(e.person) : e.person, instant: e.instant, zone: e.zone, offsetMinutes: e.offsetMinutes, values, source: item.source });
  }
  if (!columns) throw inputError(`Cannot read \`${file}\`: it holds no self-reports.`);
  const missingByColumn: Record<string, number> = {};
  for (const column of ratingCols) if (missingCount[column]) missingByColumn[column] = missingCount[column] as number;
  return { ratings, columns: ratingCols, diagnostics, read, missing: missingByColumn, codes, notes };
}

async function readSeriesBins(path: string): Promise<{ bins: SeriesBin[]; columns: string[]; diagnostics: Diagnostic[] }> {
  const bins: SeriesBin[] = [];
  const diagnostics: Diagnostic[] = [];
  let columns: string[] | undefined;
  for await (const item of readRecords(await ownTableFile(path), { format: 'csv' })) {
    if (item.kind === 'header') {
      for (const required of ['person', 'bin_start', 'bin_end', 'missing']) {
        if (!item.columns.includes(required)) throw usageError(`Cannot read \`${basename(path)}\` as a long series: no column \`${required}\`. Pass the long series CSV written by \`lexichron series\`.`);
      }
      columns = seriesScoreColumns(item.columns);
      continue;
    }
    if (item.kind === 'reject') {
      diagnostics.push({ ...item.diagnostic, stage: 'validate' });
      continue;
    }
    const bin = seriesBinFromRecord(item.record, item.source, columns ?? []);
    if ('code' in bin) diagnostics.push(bin);
    else bins.push(bin);
  }
  if (!columns || columns.length === 0) throw inputError(`\`${basename(path)}\` has no score columns to validate; give the long series of a scores file that was scored with at least one lexicon.`);
  return { bins, columns, diagnostics };
}

async function readEntryScores(path: string): Promise<{ entries: EntryScore[]; columns: string[]; diagnostics: Diagnostic[] }> {
  const entries: EntryScore[] = [];
  const diagnostics: Diagnostic[] = [];
  let columns: string[] | undefined;
  for await (const item of readRecords(await ownTableFile(path))) {
    if (item.kind === 'header') {
      for (const required of ['person', 'time_utc', 'words']) {
        if (!item.columns.includes(required)) throw usageError(`Cannot read \`${basename(path)}\` as entry scores: no column \`${required}\`. Pass the event file written by \`lexichron series\` (…events.csv) or a scores file written by \`lexichron score\`.`);
      }
      columns = entryScoreColumns(item.columns);
      continue;
    }
    if (item.kind === 'reject') {
      diagnostics.push({ ...item.diagnostic, stage: 'validate' });
      continue;
    }
    const entry = entryScoreFromRecord(item.record, item.source, columns ?? []);
    if ('code' in entry) diagnostics.push(entry);
    else entries.push(entry);
  }
  return { entries, columns: columns ?? [], diagnostics };
}

/**
 * The series' reducer per score column and its --min-words, from the `.meta.json` the series
 * stage writes beside the long series; empty when the file is absent or unreadable (the
 * word-count reliability then scores halves by the word-weighted mean and gives no warning).
 */
async function readSeriesMeta(path: string | undefined): Promise<{ reducers?: Record<string, BinReducer>; minWords?: number }> {
  if (!path) return {};
  try {
    const meta = JSON.parse(await readFile(path, 'utf8')) as { options?: { minWords?: unknown }; columns?: { name?: unknown; reducer?: unknown }[] };
    const reducers: Record<string, BinReducer> = {};
    for (const c of Array.isArray(meta.columns) ? meta.columns : []) {
      if (typeof c.name === 'string' && (c.reducer === 'weighted' || c.reducer === 'mean' || c.reducer === 'sum')) reducers[c.name] = c.reducer;
    }
    const minWords = meta.options?.minWords;
    return { reducers, ...(typeof minWords === 'number' && Number.isFinite(minWords) ? { minWords } : {}) };
  } catch {
    return {};
  }
}

/**
 * Reads the text series (and/or the entry-level file) and the self-reports, runs
 * `validateSeries`, and writes, atomically, into `out`: `validation-statistics.csv` (tidy, every
 * statistic), `validation.json` (the same with verdicts), `validation-pairs.csv` (aligned pairs),
 * `validation-persons.csv` (per-person r), `validation-diagnostics.csv`, and with an entry-level
 * file `validation-word-reliability.csv`; with a series `validation-bins-per-person.csv`.
 */
export async function runValidate(options: RunValidateOptions): Promise<RunValidateResult> {
  const align = options.validate?.align ?? 'bins';
  if (align === 'bins' && !options.series) throw usageError('Bin alignment needs the long series CSV; pass SERIES, or choose --align window with --events FILE.');
  if (align === 'window' && !options.events) throw usageError('Window alignment needs entry-level scores; pass --events FILE (the series event file …events.csv, or a scores file).');
  const ratings = await readRatings(options);
  const series = options.series ? await readSeriesBins(options.series) : undefined;
  const events = options.events ? await readEntryScores(options.events) : undefined;
  let scoreColumns = align === 'bins' ? (series?.columns ?? []) : (events?.columns ?? []);
  if (options.scoreColumns && options.scoreColumns.length > 0) {
    const unknown = options.scoreColumns.filter((c) => !scoreColumns.includes(c));
    if (unknown.length > 0) throw usageError(`Unknown score column ${unknown.map((c) => `\`${c}\``).join(', ')}; the ${align === 'bins' ? 'series' : 'event file'} has ${scoreColumns.map((c) => `\`${c}\``).join(', ')}.`);
    scoreColumns = options.scoreColumns;
  }
  if (scoreColumns.length === 0) throw inputError(`There are no score columns to validate in the ${align === 'bins' ? 'series' : 'event file'}; score the text with at least one lexicon and build the series again.`);
  if (ratings.ratings.length === 0) {
    const first = ratings.diagnostics[0];
    const why = first ? ` The first problem, on line ${first.source?.line ?? '?'}: ${first.message} (${ratings.diagnostics.length} rows left out).` : '';
    throw inputError(`\`${basename(options.ratings)}\` holds no usable self-reports.${why}`);
  }
  const entries = events?.entries;
  const meta = await readSeriesMeta(options.series ? `${options.series}.meta.json` : options.events ? `${options.events.replace(/\.events\.csv$/i, '.csv')}.meta.json` : undefined);
  const result = validateSeries(
    {
      bins: series?.bins,
      entries: align === 'window' || (entries && entries.some((e) => e.binStart !== undefined)) ? entries : undefined,
      ratings: ratings.ratings,
      scoreColumns,
      ratingColumns: ratings.columns,
      reducers: meta.reducers,
      seriesMinWords: meta.minWords,
      label: (r) => formatLocal(r.instant, r.offsetMinutes),
    },
    options.validate,
  );
  if (entries && !entries.some((e) => e.binStart !== undefined)) result.reliability = []; // a scores file has no bins
  result.reliability = result.reliability.filter((r) => events?.columns.includes(r.column));
  result.diagnostics.unshift(...ratings.diagnostics, ...(series?.diagnostics ?? []), ...(events?.diagnostics ?? []));
  const out = options.out;
  const write = async (name: string, table: Table, description: string) => {
    await writeFileAtomic(join(out, name), csvDocument(table.header, table.rows));
    resources.push(inferTableResource(name.replace(/\.csv$/, ''), name, csvDocument(table.header, table.rows), (column) => VALIDATION_COLUMNS[column], description));
    return join(out, name);
  };
  const resources: TableResource[] = [];
  const files: RunValidateResult['files'] = {
    statistics: await write('validation-statistics.csv', validationStatisticsTable(result), 'Every validation statistic per text score and rating, one per row; `note` says why a value is empty.'),
    pairs: await write('validation-pairs.csv', alignedPairsTable(result, scoreColumns, ratings.columns), 'Text scores and self-reports aligned per occasion.'),
    persons: await write('validation-persons.csv', personCorrelationsTable(result), 'Each person\'s own correlation of a text score with a rating.'),
    diagnostics: await write('validation-diagnostics.csv', validationDiagnosticsTable(result), 'Self-report rows and values left out, with reasons.'),
    reliability: result.reliability.length > 0 ? await write('validation-word-reliability.csv', wordReliabilityTable(result), 'Split-half reliability of bin scores by bin word count (Spearman-Brown corrected).') : undefined,
    binsPerPerson: result.binsPerPerson.length > 0 ? await write('validation-bins-per-person.csv', binsPerPersonTable(result), 'Observed bins behind each person mean and the reliability of that mean.') : undefined,
    json: join(out, 'validation.json'),
  };
  const rejected: Record<string, number> = {};
  for (const d of ratings.diagnostics) rejected[d.code] = (rejected[d.code] ?? 0) + 1;
  const notes = Object.keys(ratings.notes).length > 0 ? { notes: ratings.notes } : {};
  const reconciliation = { read: ratings.read, kept: ratings.ratings.length, rejected, missing: ratings.missing, codes: ratings.codes, ...notes };
  await writeFileAtomic(files.json as string, validationJson(result, reconciliation));
  return { result, scoreColumns, ratingColumns: ratings.columns, files, resources, reconciliation };
}
