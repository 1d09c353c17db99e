import { DateTime } from 'luxon';
import { usageError } from '../../errors.js';
import type { RawEntry } from '../../types.js';
import { resolveWallClock, type WallClockPolicy } from '../zone-offset.js';
import { importReject, type EntryNote, type ImportItem } from './import-item.js';
import type { NumberedLine } from './read-chat-lines.js';

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
  dst: { gap: WallClockPolicy; overlap: WallClockPolicy };
}

/** The default heading: a line holding only an ISO 8601 calendar date, optionally after Markdown `#` marks. */
export const DEFAULT_DIARY_HEADING = '^#*\\s*(\\d{4}-\\d{2}-\\d{2})\\s*$';
/** The luxon format of the default heading's date. */
export const DEFAULT_DIARY_DATE_FORMAT = 'yyyy-MM-dd';

/**
 * Compiles a user's heading pattern (Unicode mode), which must hold a capture group for the date.
 * Throws a usage error naming the problem otherwise.
 */
export function compileDiaryHeading(pattern: string): RegExp {
  let re: RegExp;
  try {
    re = new RegExp(pattern, 'u');
  } catch (error) {
    throw usageError(`Cannot use the diary heading pattern \`${pattern}\`: ${(error as Error).message}; write a JavaScript regular expression such as \`${DEFAULT_DIARY_HEADING}\`.`);
  }
  if (new RegExp(`${re.source}|`, 'u').exec('')!.length < 2) {
    throw usageError(`Cannot use the diary heading pattern \`${pattern}\`: it has no capture group for the date; put the date part in parentheses, e.g. \`^== (.+) ==$\`.`);
  }
  return re;
}

/** True when a luxon format holds a time-of-day token (outside quoted literals). */
function hasClockTime(format: string): boolean {
  return /[Hhm]|t|T/.test(format.replace(/'[^']*'/g, ''));
}

/**
 * Reads a plain-text diary whose entries start with dated headings. Each heading line starts an
 * entry that runs to the next heading; the date is read with luxon's `fromFormat` in
 * `locale`, and a date without a time of day is placed at `defaultTime` (12:00) in the person's zone.
 *
 * Rejects: a heading whose date does not parse or does not exist (30 February) → `diary_bad_date`
 * (with luxon's explanation), an entry without text → `diary_empty_entry`, text before the first
 * heading → one `diary_before_first_heading`, a local time in a daylight-saving gap or overlap as `dst` says.
 */
export async function* readDiary(lines: AsyncIterable<NumberedLine> | Iterable<NumberedLine>, options: DiaryOptions): AsyncGenerator<ImportItem> {
  const withTime = hasClockTime(options.dateFormat);
  const fallback = options.defaultTime ?? { hour: 12, minute: 0 };
  type Pending = { line: number; date: string; parts: string[]; notes: Set<EntryNote> };
  let pending: Pending | undefined;
  let before = 0;
  let beforeStart = 0;
  const finish = (p: Pending): ImportItem => {
    const { file } = options;
    const dt = DateTime.fromFormat(p.date.trim(), options.dateFormat, { zone: 'UTC', locale: options.locale ?? 'en' });
    if (!dt.isValid) {
      return importReject(file, p.line, 'diary_bad_date', `the heading date \`${p.date.trim().slice(0, 60)}\` does not fit the format \`${options.dateFormat}\` or does not exist (${dt.invalidExplanation ?? dt.invalidReason ?? 'no reason given'})`);
    }
    const hour = withTime ? dt.hour : fallback.hour;
    const minute = withTime ? dt.minute : fallback.minute;
    const resolved = resolveWallClock(Date.UTC(dt.year, dt.month - 1, dt.day, hour, minute, withTime ? dt.second : 0), options.zone, options.dst);
    if (!resolved.ok) return importReject(file, p.line, resolved.code, resolved.message);
    const text = p.parts.join('\n').trim();
    if (text === '') return importReject(file, p.line, 'diary_empty_entry', 'the heading is followed by no text');
    const entry: RawEntry = { id: `${file}:${p.line}`, person: options.person, instant: resolved.instant, zone: options.zone, offsetMinutes: resolved.offsetMinutes, text, source: { file, line: p.line } };
    return p.notes.size > 0 ? { kind: 'entry', entry, notes: [...p.notes] } : { kind: 'entry', entry };
  };
  for await (const { line, text, repaired } of lines) {
    const m = options.heading.exec(text);
    if (m) {
      if (pending) yield finish(pending);
      pending = { line, date: m.groups?.date ?? m[1] ?? '', parts: [], notes: new Set() };
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
