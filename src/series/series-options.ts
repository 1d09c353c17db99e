import { isCalendarDate } from '../ingest/is-calendar-date.js';
import { usageError } from '../errors.js';
import type { BinReducer } from './bin-accumulator.js';
import { parseBinSpec, parseClockTime, parseExcludedHours } from './bin-spec.js';
import type { FillMethod, SeriesOptions } from './series-types.js';
import { dayNumberOfDate } from './local-day.js';

/*
 * The series options as the command line and the study file give them (`--bin`, `--aggregate` …),
 * checked and parsed. Shared by `lexichron series` (src/cli/series-options.ts adds the options to
 * the command) and the study runner (src/pipeline.ts).
 */

function wholeNumber(value: unknown, option: string, min = 0): number {
  const n = Number(value);
  if (!Number.isInteger(n) || n < min) throw usageError(`${option} \`${String(value)}\` must be a whole number ≥ ${min}.`);
  return n;
}

function date(value: unknown, option: string): number {
  const text = String(value);
  if (!isCalendarDate(text)) throw usageError(`${option} \`${text}\` is not a date YYYY-MM-DD.`);
  return dayNumberOfDate(text);
}

/** Parses `--aggregate`: one reducer for all columns, or COL=REDUCER pairs. */
export function parseReducers(spec: string | undefined, columns?: readonly string[]): Record<string, BinReducer> | BinReducer | undefined {
  if (!spec) return undefined;
  const valid = ['weighted', 'mean', 'sum'];
  if (valid.includes(spec)) return spec as BinReducer;
  const out: Record<string, BinReducer> = {};
  for (const part of spec.split(',')) {
    const at = part.lastIndexOf('=');
    const col = part.slice(0, at).trim();
    const red = part.slice(at + 1).trim();
    if (at <= 0 || !valid.includes(red)) throw usageError(`--aggregate \`${part}\` must be COLUMN=weighted|mean|sum, or one of weighted, mean, sum for every column.`);
    if (columns && !columns.includes(col)) throw usageError(`--aggregate names \`${col}\`, which is not a score column.`);
    out[col] = red as BinReducer;
  }
  return out;
}

/** Series options (without reducers) from parsed commander options. */
export function seriesOptionsFrom(opts: Record<string, unknown>): Omit<SeriesOptions, 'reducers'> & { maxBins: number; warnSpanDays: number } {
  const span = opts.from !== undefined || opts.to !== undefined ? { from: date(opts.from, '--from'), to: date(opts.to, '--to') } : undefined;
  if ((opts.from === undefined) !== (opts.to === undefined)) throw usageError('--from and --to go together: give both dates of the common grid.');
  if (span && span.from > span.to) throw usageError('--from must not be after --to.');
  return {
    bin: parseBinSpec(String(opts.bin ?? '1d')),
    dayStart: parseClockTime(String(opts.dayStart ?? '00:00')),
    minWords: wholeNumber(opts.minWords ?? 1, '--min-words'),
    excludeHours: opts.excludeHours ? parseExcludedHours(String(opts.excludeHours)) : undefined,
    fill: (opts.fill as FillMethod) ?? 'none',
    maxFill: wholeNumber(opts.maxFill ?? 1, '--max-fill'),
    detrend: opts.detrend === true,
    span,
    maxBins: wholeNumber(opts.maxBins ?? 100_000, '--max-bins', 1),
    warnSpanDays: wholeNumber(opts.warnSpanDays ?? 730, '--warn-span-days', 1),
  };
}
