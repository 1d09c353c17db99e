/** Order of day, month and year in a numeric date. */
export type DateOrder = 'dmy' | 'mdy' | 'ymd';

/** The settled order, or why it cannot be settled. */
export type DateOrderResult =
  | { ok: true; order: DateOrder; evidence: string }
  | { ok: false; reason: 'ambiguous' | 'conflict' | 'empty'; message: string };

/**
 * Settles the order of numeric dates from every date of a file, not line by line
 * (a single line such as `03/04/21` cannot tell 3 April from 4 March):
 * - a first number of four digits on every line → year-month-day;
 * - some first number above 12 (a day) → day-month-year; some second number above 12 → month-day-year;
 * - both, or a mixture with year-first dates → `conflict`; neither → `ambiguous`, and the caller
 *   must ask for an explicit order (`--date-order dmy|mdy|ymd`).
 */
export function settleDateOrder(dates: Iterable<{ parts: readonly [number, number, number]; firstDigits: number }>): DateOrderResult {
  let n = 0;
  let yearFirst = 0;
  let firstOver12: readonly number[] | undefined;
  let secondOver12: readonly number[] | undefined;
  for (const d of dates) {
    n++;
    if (d.firstDigits === 4) {
      yearFirst++;
      continue;
    }
    if (!firstOver12 && d.parts[0] > 12) firstOver12 = d.parts;
    if (!secondOver12 && d.parts[1] > 12) secondOver12 = d.parts;
  }
  const show = (p: readonly number[]): string => p.join('/');
  if (n === 0) return { ok: false, reason: 'empty', message: 'the file holds no dated lines' };
  if (yearFirst === n) return { ok: true, order: 'ymd', evidence: 'every date starts with a four-digit year' };
  if (yearFirst > 0) return { ok: false, reason: 'conflict', message: `${yearFirst} of ${n} dates start with a year and the others do not` };
  if (firstOver12 && secondOver12) {
    return { ok: false, reason: 'conflict', message: `the date ${show(firstOver12)} needs day first but ${show(secondOver12)} needs month first` };
  }
  if (firstOver12) return { ok: true, order: 'dmy', evidence: `day first, as ${show(firstOver12)} shows` };
  if (secondOver12) return { ok: true, order: 'mdy', evidence: `month first, as ${show(secondOver12)} shows` };
  return { ok: false, reason: 'ambiguous', message: `no date of the ${n} has a number above 12 in its first two places, so day and month cannot be told apart` };
}
