import { inTimeWindow } from '../ingest/time-window.js';
import type { Diagnostic, SourceRef } from '../types.js';
import { restoreCell } from '../report/csv.js';

/** One bin of the long series file, as validation needs it. */
export interface SeriesBin {
  person: string;
  /** `bin_start` as written (local time with offset). */
  binStart: string;
  start: number;
  end: number;
  entries: number;
  words: number;
  /** Empty when observed, else the series stage's reason. */
  missing: string;
  scores: Record<string, number | undefined>;
}

/** Columns of the long series file that are not scores (docs/architecture.md). */
const ID_COLUMNS = new Set(['person', 't', 'bin_start', 'bin_end', 'local_date', 'day', 'bin_of_day', 'bin_hours', 'hours_since_prev', 'entries', 'words', 'missing', 'lag_valid']);
const DERIVED = /\.(n|person_mean|within|lag1|within_lag1|filled|detrended)$/;

/** The score columns of a long series header: every column that is neither an id column nor a derived one. */
export function seriesScoreColumns(header: readonly string[]): string[] {
  return header.filter((h) => !ID_COLUMNS.has(h) && !DERIVED.test(h));
}

const parseNumber = (text: string | undefined): number | undefined => {
  if (text === undefined || text.trim() === '') return undefined;
  const x = Number(text);
  return Number.isFinite(x) ? x : undefined;
};

/**
 * Reads one row of the long series file. Returns a Diagnostic (`bad_series_row`) when the person,
 * `bin_start` or `bin_end` is unusable; an unreadable score becomes missing.
 */
export function seriesBinFromRecord(record: Readonly<Record<string, string>>, source: SourceRef, scoreColumns: readonly string[]): SeriesBin | Diagnostic {
  const person = restoreCell((record.person ?? '').trim());
  const start = Date.parse(record.bin_start ?? '');
  const end = Date.parse(record.bin_end ?? '');
  if (person === '' || !inTimeWindow(start, undefined) || !inTimeWindow(end, undefined) || end <= start) {
    return { code: 'bad_series_row', message: 'the row lacks a person or a readable bin_start/bin_end; was it written by lexichron series?', source, stage: 'validate' };
  }
  const scores: Record<string, number | undefined> = {};
  for (const c of scoreColumns) scores[c] = parseNumber(record[c]);
  return { person, binStart: record.bin_start as string, start, end, entries: parseNumber(record.entries) ?? 0, words: parseNumber(record.words) ?? 0, missing: (record.missing ?? '').trim(), scores };
}
