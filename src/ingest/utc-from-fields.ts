/** Milliseconds in 400 Gregorian years (146,097 days): the calendar repeats exactly after them. */
const FOUR_CENTURIES_MS = 146_097 * 86_400_000;

const MONTH_DAYS = [31, 28, 31, 30, 31, 30, 31, 31, 30, 31, 30, 31];

/** Days in `month` (1–12) of `year` in the proleptic Gregorian calendar. */
export function daysInMonth(year: number, month: number): number {
  if (month !== 2) return MONTH_DAYS[month - 1] as number;
  return (year % 4 === 0 && year % 100 !== 0) || year % 400 === 0 ? 29 : 28;
}

/**
 * Epoch milliseconds of a calendar date and clock time read as UTC, with the year taken as
 * written: year 26 is the year 26, never 1926 (Date.UTC maps years 0–99 to 1900–1999, ECMA-262
 * section 21.4.3.4 MakeFullYear, so the date is computed 400 years later and moved back).
 * A second of 60 (a leap second, RFC 3339 section 5.7) is the first instant of the next minute.
 *
 * Returns undefined when a field is not a whole number or out of range: year outside
 * 0000–9999 (what RFC 3339 can write), month outside 1–12, a day the month does not have,
 * hour over 23, minute over 59, second over 60, millisecond outside 0–999.
 */
export function utcFromFields(year: number, month: number, day: number, hour = 0, minute = 0, second = 0, millisecond = 0): number | undefined {
  for (const n of [year, month, day, hour, minute, second, millisecond]) if (!Number.isInteger(n) || n < 0) return undefined;
  if (year > 9999 || month < 1 || month > 12 || day < 1 || day > daysInMonth(year, month)) return undefined;
  if (hour > 23 || minute > 59 || second > 60 || millisecond > 999) return undefined;
  return Date.UTC(year + 400, month - 1, day, hour, minute, second, millisecond) - FOUR_CENTURIES_MS;
}
