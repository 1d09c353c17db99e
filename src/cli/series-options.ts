import { isCalendarDate } from '../ingest/is-calendar-date.js';
import { Option, type Command } from 'commander';
import { usageError } from '../errors.js';
import type { BinReducer } from '../series/bin-accumulator.js';
import { parseBinSpec, parseClockTime, parseExcludedHours } from '../series/bin-spec.js';
import type { FillMethod, SeriesOptions } from '../series/build-series.js';
import { dayNumberOfDate } from '../series/local-day.js';

/** Adds the options of the series stage. */
export function addSeriesOptions(command: Command): Command {
  return command
    .option('--bin <duration>', 'bin length: 30m, 1h, 3h, 1d, 1w …', '1d')
    .option('--day-start <HH:MM>', 'local clock time at which a day starts (04:00 puts a 01:30 entry into the previous day)', '00:00')
    .option('--min-words <n>', 'bins with fewer words are missing (too_few_words)', '1')
    .option('--exclude-hours <HH:MM-HH:MM>', 'local hours whose entries and bins are excluded, e.g. 00:00-07:00')
    .addOption(new Option('--fill <method>', 'fill short gaps (flagged in <score>.filled)').choices(['none', 'carry', 'linear']).default('none'))
    .option('--max-fill <bins>', 'longest run of missing bins that may be filled', '1')
    .option('--detrend', 'add <score>.detrended: residuals from each person\'s linear trend (raw columns kept)')
    .option('--aggregate <spec>', 'per-column bin reducer: weighted (word-weighted mean), mean (entry mean) or sum, as COL=REDUCER[,…] or one reducer for all')
    .option('--windows <file>', 'per-person study windows: CSV with person, from, to (local dates); bins outside are marked outside_window')
    .option('--zones <file>', 'the zone table used when scoring (person, zone[, from]): days are laid out in the zone in force, also on days without entries')
    .option('--from <date>', 'first local date of a common grid for everyone (YYYY-MM-DD)')
    .option('--to <date>', 'last local date of the common grid (YYYY-MM-DD)')
    .option('--max-bins <n>', 'most bins one person\'s series may have; more stops with the person and the entries at the ends of their series (a stray timestamp)', '100000')
    .option('--warn-span-days <n>', 'warn when a person\'s entries span more days than this', '730');
}

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
