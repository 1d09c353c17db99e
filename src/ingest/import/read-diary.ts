import { DateTime } from 'luxon';
import { usageError } from '../../errors.js';
import type { RawEntry } from '../../types.js';
import { utcFromFields } from '../utc-from-fields.js';
import { resolveWallClock, type WallClockPolicy } from '../zone-offset.js';
import { importReject, type EntryNote, type ImportItem } from './import-item.js';
import type { NumberedLine } from './read-chat-lines.js';
import { describeValue, omitValue } from '../../privacy/describe-value.js';

/** Options of the diary importer. */
export interface DiaryOptions {
  file: string;
  person: string;
  zone: string;
  /** Pattern of a heading line; its group `date` (or else its first group) holds the date. */
  heading: RegExp;
  /** luxon format of the captured date, e.g. `yyyy-MM-dd` or `cccc d MMMM yyyy`. */
  dateFormat: string;
  /** Locale of month and weekday names in the date (BCP 47, default `en`). */
  locale?: string;
  /** Clock time given to headings whose format has no time of day (default 12:00, the middle of the day). */
  defaultTime?: { hour: number; minute: number };
  /**
   * Pattern of a line that starts a timed entry under a heading (several entries a day); its
   * group `time` (or else its first group) holds the clock time, and the rest of the line after
   * the match begins the entry's text. Without it, a heading starts one entry.
   */
  entryTime?: RegExp;
  /** luxon format of the captured clock time (default `H:mm`, which also reads `09:15`). */
  entryTimeFormat?: string;
  dst: { gap: WallClockPolicy; overlap: WallClockPolicy };
}

/** The default heading: a line holding only an ISO 8601 calendar date, optionally after Markdown `#` marks. */
export const DEFAULT_DIARY_HEADING = '^#*\\s*(\\d{4}-\\d{2}-\\d{2})\\s*$';
/** The luxon format of the default heading's date. */
export const DEFAULT_DIARY_DATE_FORMAT = 'yyyy-MM-dd';

/** An example entry-time pattern: a line starting with a clock time and a dash, e.g. `09:15 – Walked to work.` */
export const EXAMPLE_DIARY_ENTRY_TIME = '^(\\d{1,2}:\\d{2})\\s*[-–—]\\s*';
/** The luxon format of a captured entry time by default. */
export const DEFAULT_DIARY_ENTRY_TIME_FORMAT = 'H:mm';

/**
 * Compiles a user's diary pattern (Unicode mode), which must hold a capture group for `part` (the
 * date of a heading, the clock time of an entry). Throws a usage error naming the problem otherwise.
 */
function compileWithGroup(pattern: string, what: string, part: string, example: string, groupExample: string): RegExp {
  let re: RegExp;
  try {
    re = new RegExp(pattern, 'u');
  } catch (error) {
    throw usageError(`Cannot use the diary ${what} pattern \`${pattern}\`: ${(error as Error).message}; write a JavaScript regular expression such as \`${example}\`.`);
  }
  if (new RegExp(`${re.source}|`, 'u').exec('')!.length < 2) {
    throw usageError(`Cannot use the diary ${what} pattern \`${pattern}\`: it has no capture group for the ${part}; put the ${part} in parentheses, e.g. \`${groupExample}\`.`);
  }
  return re;
}

/** Compiles a heading pattern, which must hold a capture group for the date (see compileWithGroup). */
export function compileDiaryHeading(pattern: string): RegExp {
  return compileWithGroup(pattern, 'heading', 'date', DEFAULT_DIARY_HEADING, '^== (.+) ==$');
}

/** Compiles an entry-time pattern, which must hold a capture group for the clock time (see compileWithGroup). */
export function compileDiaryEntryTime(pattern: string): RegExp {
  return compileWithGroup(pattern, 'entry time', 'time', EXAMPLE_DIARY_ENTRY_TIME, '^(\\d{1,2}:\\d{2}) - ');
}

/** Longest line tried as a heading the pattern missed (dated headings are short; longer lines are text). */
const MISSED_HEADING_MAX_CHARS = 80;

/** True when a luxon format holds a time-of-day token (outside quoted literals). */
function hasClockTime(format: string): boolean {
  return /[Hhm]|t|T/.test(format.replace(/'[^']*'/g, ''));
}

/**
 * Reads a plain-text diary whose entries start with dated headings. Each heading line starts an
 * entry that runs to the next heading; the date is read with luxon's `fromFormat` in
 * `locale`, and a date without a time of day is placed at `defaultTime` (12:00) in the person's zone.
 * With `entryTime`, a line under a heading that matches it starts a further entry at that clock
 * time on the heading's date (several entries a day); text between a heading and its first timed
 * line stays an entry at the heading's time, and is simply absent when there is none.
 *
 * Rejects: a heading whose date does not parse or does not exist (30 February) → `diary_bad_date`
 * (with luxon's explanation), an entry time that does not fit `entryTimeFormat` → `diary_bad_time`,
 * an entry without text → `diary_empty_entry`, text before the first heading → one
 * `diary_before_first_heading`, a local time in a daylight-saving gap or overlap as `dst` says.
 * A line under a heading that is, as a whole, a valid date in `dateFormat` (at most 80 characters)
 * but does not match `heading` is a heading the pattern missed (a month name with a letter
 * beyond a–z and `\w` in the pattern, say): the text under it, and each timed entry, is rejected
 * as `diary_unmatched_heading` instead of being dated to the heading before.
 */
export async function* readDiary(lines: AsyncIterable<NumberedLine> | Iterable<NumberedLine>, options: DiaryOptions): AsyncGenerator<ImportItem> {
  const withTime = hasClockTime(options.dateFormat);
  const locale = options.locale ?? 'en';
  /** A short line that is, as a whole, a valid date in the heading's format: a heading the pattern does not match (a year or day needs a digit). */
  const digits = /[yd]/.test(options.dateFormat.replace(/'[^']*'/g, ''));
  const readsAsHeadingDate = (text: string): boolean => {
    const t = text.trim();
    if (t.length === 0 || t.length > MISSED_HEADING_MAX_CHARS || (digits && !/\d/.test(t))) return false;
    return DateTime.fromFormat(t, options.dateFormat, { zone: 'UTC', locale }).isValid;
  };
  const fallback = options.defaultTime ?? { hour: 12, minute: 0 };
  const timeFormat = options.entryTimeFormat ?? DEFAULT_DIARY_ENTRY_TIME_FORMAT;
  /** An entry being collected: its heading's date, and its own clock time when a timed line started it. */
  type Pending = { line: number; date: string; time?: string; parts: string[]; notes: Set<EntryNote>; unmatched?: boolean };
  let pending: Pending | undefined;
  let before = 0;
  let beforeStart = 0;
  const finish = (p: Pending): ImportItem => {
    const { file } = options;
    if (p.unmatched) {
      return importReject(
        file,
        p.line,
        'diary_unmatched_heading',
        `${p.time === undefined ? 'this line' : 'this entry comes under a line that'} reads as a date in the format \`${options.dateFormat}\` but does not match the heading pattern; the text under it is left out rather than dated to the heading before. Fix --heading (heading in a study file): \\w and \\b know only the letters a–z, so a month or weekday such as \`März\` needs \\p{L}, e.g. \`^(\\p{L}+, \\d{1,2}\\. \\p{L}+ \\d{4})$\``,
      );
    }
    const dt = DateTime.fromFormat(p.date.trim(), options.dateFormat, { zone: 'UTC', locale: options.locale ?? 'en' });
    if (!dt.isValid) {
      return importReject(file, p.line, 'diary_bad_date', `the heading date (${describeValue(p.date.trim())}) does not fit the format \`${options.dateFormat}\` or does not exist (${omitValue(dt.invalidExplanation ?? dt.invalidReason ?? 'no reason given', p.date)})`);
    }
    let clock = { hour: withTime ? dt.hour : fallback.hour, minute: withTime ? dt.minute : fallback.minute, second: withTime ? dt.second : 0 };
    if (p.time !== undefined) {
      const t = DateTime.fromFormat(p.time.trim(), timeFormat, { zone: 'UTC', locale: options.locale ?? 'en' });
      if (!t.isValid) {
        return importReject(file, p.line, 'diary_bad_time', `the entry time (${describeValue(p.time.trim())}) does not fit the format \`${timeFormat}\` (${omitValue(t.invalidExplanation ?? t.invalidReason ?? 'no reason given', p.time)}); give the format with --entry-time-format (entryTimeFormat in a study file)`);
      }
      clock = { hour: t.hour, minute: t.minute, second: t.second };
    }
    const wall = utcFromFields(dt.year, dt.month, dt.day, clock.hour, clock.minute, clock.second);
    if (wall === undefined) return importReject(file, p.line, 'diary_bad_date', 'the heading date has a year outside 0000–9999; check the heading and --date-format');
    const resolved = resolveWallClock(wall, options.zone, options.dst);
    if (!resolved.ok) return importReject(file, p.line, resolved.code, resolved.message);
    const text = p.parts.join('\n').trim();
    if (text === '') return importReject(file, p.line, 'diary_empty_entry', p.time === undefined ? 'the heading is followed by no text' : 'the timed line is followed by no text');
    const entry: RawEntry = { id: `${file}:${p.line}`, person: options.person, instant: resolved.instant, zone: options.zone, offsetMinutes: resolved.offsetMinutes, text, source: { file, line: p.line } };
    return p.notes.size > 0 ? { kind: 'entry', entry, notes: [...p.notes], wallClock: true } : { kind: 'entry', entry, wallClock: true };
  };
  for await (const { line, text, repaired } of lines) {
    const m = options.heading.exec(text);
    if (m) {
      if (pending) yield finish(pending);
      pending = { line, date: m.groups?.date ?? m[1] ?? '', parts: [], notes: new Set() };
      continue;
    }
    const timed = pending && options.entryTime ? options.entryTime.exec(text) : null;
    if (pending && timed) {
      // The heading's own text before its first timed line is an entry only when there is some.
      if (pending.time !== undefined || pending.parts.join('').trim() !== '') yield finish(pending);
      pending = { line, date: pending.date, time: timed.groups?.time ?? timed[1] ?? '', parts: [text.slice(timed.index + timed[0].length)], notes: new Set(), unmatched: pending.unmatched };
      if (repaired) pending.notes.add(repaired);
      continue;
    }
    if (pending && readsAsHeadingDate(text)) {
      // A dated heading the pattern missed: what follows is not the previous day's.
      yield finish(pending);
      pending = { line, date: pending.date, parts: [], notes: new Set(), unmatched: true };
      continue;
    }
    if (pending) {
      pending.parts.push(text);
      if (repaired) pending.notes.add(repaired);
    } else if (text.trim() !== '') {
      if (before === 0) beforeStart = line;
      before++;
    }
  }
  if (pending) yield finish(pending);
  if (before > 0) yield importReject(options.file, beforeStart, 'diary_before_first_heading', `${before} line(s) of text come before the first dated heading and belong to no entry`);
}
