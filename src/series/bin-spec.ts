import { usageError } from '../errors.js';

/**
 * A bin length. Sub-daily bins (`minutes` < 1440) tile each local day from its start (so a
 * 25-hour day holds 25 hourly bins and the last bin of a day may be shorter); daily and
 * multi-day bins are whole local calendar days; weekly bins are local ISO weeks (Monday first).
 */
export interface BinSpec {
  text: string;
  /** Bin length in minutes for sub-daily bins; 0 otherwise. */
  minutes: number;
  /** Bin length in local days for daily/multi-day bins; 0 otherwise. */
  days: number;
  /** True for `1w` bins (ISO weeks). */
  week: boolean;
}

/**
 * Parses a bin duration: a positive whole number and a unit, `m` (minutes), `h` (hours),
 * `d` (days) or `w` (one week): `30m`, `1h`, `3h`, `1d`, `1w`. Sub-daily bins must divide a
 * 24-hour day evenly. Throws a usage error that names the fix.
 */
export function parseBinSpec(text: string): BinSpec {
  const m = /^\s*(\d+)\s*(m|min|h|d|w)\s*$/i.exec(text);
  const n = m ? Number(m[1]) : 0;
  if (!m || n <= 0) throw usageError(`Bin \`${text}\` is not a positive duration; write a whole number and a unit: 30m, 1h, 3h, 1d or 1w.`);
  const unit = (m[2] as string).toLowerCase();
  if (unit === 'w') {
    if (n !== 1) throw usageError(`Bin \`${text}\`: only 1w (local ISO weeks) is supported; use days for other lengths, e.g. 14d.`);
    return { text, minutes: 0, days: 0, week: true };
  }
  if (unit === 'd') return { text, minutes: 0, days: n, week: false };
  const minutes = unit === 'h' ? n * 60 : n;
  if (minutes >= 1440) {
    if (minutes % 1440 === 0) return { text, minutes: 0, days: minutes / 1440, week: false };
    throw usageError(`Bin \`${text}\` is longer than a day but not a whole number of days; use d units, e.g. 2d.`);
  }
  if (1440 % minutes !== 0) throw usageError(`Bin \`${text}\` does not divide a 24-hour day evenly; use one of 1, 2, 3, 4, 5, 6, 10, 12, 15, 20, 30 minutes or 1, 2, 3, 4, 6, 8, 12 hours.`);
  return { text, minutes, days: 0, week: false };
}

/** Parses a local clock time `HH:MM` into minutes after midnight (the day start, e.g. 04:00 → 240). */
export function parseClockTime(text: string, option = '--day-start'): number {
  const m = /^(\d{1,2}):(\d{2})$/.exec(text.trim());
  const h = m ? Number(m[1]) : NaN;
  const min = m ? Number(m[2]) : NaN;
  if (!m || h > 23 || min > 59) throw usageError(`${option} \`${text}\` is not a clock time from 00:00 to 23:59; write HH:MM, e.g. 04:00.`);
  return h * 60 + min;
}

/** Parses excluded hours `HH:MM-HH:MM` (may wrap midnight, e.g. 23:00-07:00) into [start, end) minutes. */
export function parseExcludedHours(text: string): [number, number] {
  const parts = text.split('-');
  if (parts.length !== 2) throw usageError(`--exclude-hours \`${text}\` must be a range of local clock times HH:MM-HH:MM, e.g. 00:00-07:00.`);
  const start = parseClockTime(parts[0] as string, '--exclude-hours');
  const end = parseClockTime(parts[1] as string, '--exclude-hours');
  if (start === end) throw usageError(`--exclude-hours \`${text}\` is empty; start and end must differ.`);
  return [start, end];
}

/** True when local minute-of-day `minute` lies in the excluded range (which may wrap midnight). */
export function inExcludedHours(minute: number, range: [number, number] | undefined): boolean {
  if (!range) return false;
  const [start, end] = range;
  return start < end ? minute >= start && minute < end : minute >= start || minute < end;
}

/**
 * True when a bin of `length` minutes starting at local minute-of-day `start` lies wholly inside
 * the excluded range (which may wrap midnight). Bins that only overlap it keep their other entries.
 */
export function binInExcludedHours(start: number, length: number, range: [number, number] | undefined): boolean {
  if (!range) return false;
  const [from, to] = range;
  const rangeLength = (to - from + 1440) % 1440;
  const offset = (start - from + 1440) % 1440;
  return length <= rangeLength && offset + length <= rangeLength;
}
