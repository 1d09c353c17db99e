import { inTimeWindow } from '../ingest/time-window.js';
import type { Diagnostic, SourceRef } from '../types.js';
import { restoreCell } from '../report/csv.js';

/** One scored entry as validation needs it (from the series stage's event file or the scores file). */
export interface EntryScore {
  person: string;
  instant: number;
  /** Start instant of the bin the entry fell in (event file only). */
  binStart: number | undefined;
  words: number;
  /** True when the series stage excluded the entry (excluded hours). */
  excluded: boolean;
  scores: Record<string, number | undefined>;
}

const FIXED = new Set(['entry_id', 'person', 'time_utc', 'time_local', 'zone', 'bin_start', 'local_date', 'excluded', 'words', 'text']);
const DERIVED = /\.(n|negated)$/;

/** Score columns of an entry-level header (event file or scores file). */
export function entryScoreColumns(header: readonly string[]): string[] {
  return header.filter((h) => !FIXED.has(h) && !DERIVED.test(h) && !h.endsWith('.negated'));
}

/**
 * Reads one entry-level row: `person`, `time_utc`, `words`, optional `bin_start` and `excluded`,
 * and the score columns. Returns a Diagnostic (`bad_entry_row`) when person, time or word count
 * is unusable.
 */
export function entryScoreFromRecord(record: Readonly<Record<string, string>>, source: SourceRef, scoreColumns: readonly string[]): EntryScore | Diagnostic {
  const person = restoreCell((record.person ?? '').trim());
  const instant = Date.parse(record.time_utc ?? '');
  const words = Number(record.words);
  if (person === '' || !inTimeWindow(instant, undefined) || !Number.isInteger(words) || words < 0) {
    return { code: 'bad_entry_row', message: 'the row lacks a person, a readable time_utc or a whole word count; was it written by lexichron score or series?', source, stage: 'validate' };
  }
  const binStart = record.bin_start ? Date.parse(record.bin_start) : undefined;
  const scores: Record<string, number | undefined> = {};
  for (const c of scoreColumns) {
    const text = (record[c] ?? '').trim();
    const x = text === '' ? undefined : Number(text);
    scores[c] = x !== undefined && Number.isFinite(x) ? x : undefined;
  }
  return { person, instant, binStart: binStart !== undefined && Number.isFinite(binStart) ? binStart : undefined, words, excluded: record.excluded === '1', scores };
}
