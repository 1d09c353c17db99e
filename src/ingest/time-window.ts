import { usageError } from '../errors.js';
import { daysInMonth, utcFromFields } from './utc-from-fields.js';

/** The instants a time may take: from `from` (inclusive) to `to` (exclusive), epoch milliseconds. */
export interface TimeWindow {
  from: number;
  to: number;
}

/** The earliest instant RFC 3339 can write: 0000-01-01T00:00:00Z. */
export const EARLIEST_WRITABLE = utcFromFields(0, 1, 1) as number;
/** One past the latest instant RFC 3339 can write: 10000-01-01T00:00:00Z (ECMA-262 allows ±8.64e15 ms, far beyond). */
export const AFTER_LAST_WRITABLE = (utcFromFields(9999, 12, 31, 23, 59, 59, 999) as number) + 1;

const DAY = 86_400_000;

/**
 * The end of the UTC calendar day `years` after `instant`'s (29 February becomes 28 February in
 * a common year): whole days, so that runs on the same day record the same window.
 */
function endOfDayYearsLater(instant: number, years: number): number {
  const d = new Date(instant);
  const year = Math.min(9999, d.getUTCFullYear() + years);
  const day = Math.min(d.getUTCDate(), daysInMonth(year, d.getUTCMonth() + 1));
  return (utcFromFields(year, d.getUTCMonth() + 1, day) as number) + DAY;
}

/** Reads one side of a window: a date (UTC midnight; `end` → the midnight after it) or an RFC 3339 time with an offset. */
function readSide(text: string, end: boolean, spec: string, where: string): number {
  const date = /^(\d{4})-(\d{2})-(\d{2})$/.exec(text);
  if (date) {
    const start = utcFromFields(Number(date[1]), Number(date[2]), Number(date[3]));
    if (start !== undefined) return end ? start + DAY : start;
  } else if (/^\d{4}-\d{2}-\d{2}T\d{2}:\d{2}(:\d{2}(\.\d+)?)?(Z|[+-]\d{2}:\d{2})$/i.test(text)) {
    const t = Date.parse(text);
    if (Number.isFinite(t) && t >= EARLIEST_WRITABLE && t < AFTER_LAST_WRITABLE) return t;
  }
  throw usageError(`${where} \`${spec}\`: \`${text}\` is not a date YYYY-MM-DD or a time with an offset such as 2026-03-01T00:00:00Z; write FROM/TO, e.g. 1990-01-01/2030-12-31, and leave a side empty for its default.`);
}

/**
 * The plausible window of times: by default from 1970-01-01T00:00:00Z (the Unix epoch: older
 * instants in exports are almost always a zero or missing value, and before 1970 the IANA
 * database's offsets are partly local mean time) to the end of the day ten years after `now`. `spec` (the option
 * `--time-window FROM/TO` or the study file's `time.window`) may set either side: a date
 * `YYYY-MM-DD` (FROM from its UTC midnight, TO through its end) or an RFC 3339 time with an
 * offset; an empty side keeps its default. Never wider than RFC 3339 can write (years 0000–9999).
 * `now` is passed in (epoch milliseconds): the clock is read only by the command line.
 */
export function timeWindow(now: number, spec?: string, where = 'Cannot read --time-window'): TimeWindow {
  let from = 0;
  let to = endOfDayYearsLater(now, 10);
  if (spec !== undefined && spec.trim() !== '') {
    const parts = spec.trim().split('/');
    if (parts.length !== 2) throw usageError(`${where} \`${spec}\`: expected FROM/TO, e.g. 1990-01-01/2030-12-31 (leave a side empty for its default: 1970-01-01 and ten years from today).`);
    const [a, b] = parts.map((p) => p.trim()) as [string, string];
    if (a !== '') from = readSide(a, false, spec, where);
    if (b !== '') to = readSide(b, true, spec, where);
    if (from >= to) throw usageError(`${where} \`${spec}\`: FROM must come before TO.`);
  }
  return { from, to };
}

/** True when `instant` lies in `window` (and RFC 3339 can write it). */
export function inTimeWindow(instant: number, window: TimeWindow | undefined): boolean {
  if (!(instant >= EARLIEST_WRITABLE && instant < AFTER_LAST_WRITABLE)) return false;
  return window === undefined || (instant >= window.from && instant < window.to);
}
