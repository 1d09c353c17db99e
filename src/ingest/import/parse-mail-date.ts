import { describeValue, omitValue } from '../../privacy/describe-value.js';
import { daysInMonth, utcFromFields } from '../utc-from-fields.js';
/** A Date header read as an instant with the offset written in it, or the reason it could not be read. */
export type MailDateResult =
  | { ok: true; instant: number; offsetMinutes: number }
  | { ok: false; code: 'mail_bad_date'; message: string };

const MONTHS = ['jan', 'feb', 'mar', 'apr', 'may', 'jun', 'jul', 'aug', 'sep', 'oct', 'nov', 'dec'];

/** Obsolete zone names of RFC 5322 section 4.3 with their offsets in minutes. */
const NAMED_ZONES: Record<string, number> = {
  ut: 0, gmt: 0, z: 0,
  edt: -240, est: -300, cdt: -300, cst: -360, mdt: -360, mst: -420, pdt: -420, pst: -480,
};

const DATE_TIME = new RegExp(
  '^(?:(mon|tue|wed|thu|fri|sat|sun)[a-z]*\\s*,?\\s*)?' +
    '(\\d{1,2})\\s*(jan|feb|mar|apr|may|jun|jul|aug|sep|oct|nov|dec)[a-z]*\\.?\\s*(\\d{2,4})\\s+' +
    '(\\d{1,2}):(\\d{1,2})(?::(\\d{1,2}))?' +
    '(?:\\s*([+-]\\d{4}|[a-z]{1,5}))?$',
  'i',
);

/** Removes RFC 5322 comments (nested, with quoted pairs) and folds white space. */
function stripComments(value: string): string {
  let out = '';
  let depth = 0;
  for (let i = 0; i < value.length; i++) {
    const c = value[i];
    if (c === '\\' && depth > 0) i++;
    else if (c === '(') depth++;
    else if (c === ')' && depth > 0) depth--;
    else if (depth === 0) out += c;
  }
  return out.replace(/\s+/g, ' ').trim();
}

function fail(value: string, why: string): MailDateResult {
  return { ok: false, code: 'mail_bad_date', message: `the Date header (${describeValue(value)}) cannot be read: ${omitValue(why, value)}` };
}

/**
 * Reads the date-time of a Date header (RFC 5322 section 3.3) with its zone offset, also
 * accepting the obsolete forms of section 4.3: two- and three-digit years (00–49 → 2000–2049,
 * 50–999 → +1900), comments and white space anywhere (`09(comment):   55  :  06`), and named
 * zones (UT, GMT, EST/EDT, CST/CDT, MST/MDT, PST/PDT). Military and other alphabetic zones are
 * read as `-0000` (offset 0), as section 4.3 directs. A leap second (`:60`) becomes the first
 * instant of the next minute. The day of the week is not checked against the date.
 *
 * Returns `mail_bad_date` for anything else, including impossible dates (31 Feb) and times.
 */
export function parseMailDate(value: string): MailDateResult {
  const text = stripComments(value).replace(/\s*:\s*/g, ':');
  const m = DATE_TIME.exec(text);
  if (!m) return fail(value, 'expected the form `Fri, 21 Nov 1997 09:55:06 -0600` (RFC 5322 section 3.3)');
  const day = Number(m[2]);
  const month = MONTHS.indexOf((m[3] as string).toLowerCase()) + 1;
  let year = Number(m[4]);
  const yearDigits = (m[4] as string).length;
  if (yearDigits === 2) year += year < 50 ? 2000 : 1900;
  else if (yearDigits === 3) year += 1900;
  const hour = Number(m[5]);
  const minute = Number(m[6]);
  const second = Number(m[7] ?? 0);
  const zone = m[8];
  if (zone === undefined) return fail(value, 'it has no zone offset such as +0200');
  let offset: number;
  if (/^[+-]\d{4}$/.test(zone)) {
    const hh = Number(zone.slice(1, 3));
    const mm = Number(zone.slice(3, 5));
    if (mm > 59) return fail(value, `the zone offset ${zone} has ${mm} minutes`);
    offset = (zone[0] === '-' ? -1 : 1) * (hh * 60 + mm);
  } else {
    offset = NAMED_ZONES[zone.toLowerCase()] ?? 0;
  }
  if (day < 1 || day > daysInMonth(year, month)) return fail(value, `day ${day} does not exist in ${MONTHS[month - 1]} ${year}`);
  if (hour > 23 || minute > 59 || second > 60) return fail(value, 'the time of day is out of range');
  const wall = utcFromFields(year, month, day, hour, minute, second);
  if (wall === undefined) return fail(value, 'the year is outside 0000–9999');
  return { ok: true, instant: wall - offset * 60000, offsetMinutes: offset };
}
