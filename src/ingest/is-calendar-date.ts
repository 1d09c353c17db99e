import { utcFromFields } from './utc-from-fields.js';

/**
 * True when `text` is a calendar date `YYYY-MM-DD` that exists (proleptic Gregorian calendar):
 * `2026-02-30` and `2026-13-01` are not, `2028-02-29` is. Date.parse accepts day 30 of February
 * (it only checks 1–31), so side files checked with it took impossible dates.
 */
export function isCalendarDate(text: string): boolean {
  const m = /^(\d{4})-(\d{2})-(\d{2})$/.exec(text);
  return m !== null && utcFromFields(Number(m[1]), Number(m[2]), Number(m[3])) !== undefined;
}
