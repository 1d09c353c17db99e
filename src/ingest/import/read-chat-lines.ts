import type { RawEntry } from '../../types.js';
import { daysInMonth, utcFromFields } from '../utc-from-fields.js';
import { resolveWallClock, type WallClockPolicy } from '../zone-offset.js';
import type { DecodedLine } from './decode-text-line.js';
import { importReject, type EntryNote, type ImportItem } from './import-item.js';
import { normalizeSender, parseChatLine, splitEmbeddedHeaders, type ChatStamp } from './parse-chat-line.js';
import type { DateOrder } from './settle-date-order.js';

/** Options of the chat-lines importer. */
export interface ChatLinesOptions {
  file: string;
  person: string;
  /** The person's IANA zone; the times in the file are wall-clock times in it. */
  zone: string;
  /** The participant's sender name(s) in the export; everyone else is a third party. */
  senders: readonly string[];
  /** Settled with settleDateOrder over the whole file, or given explicitly. */
  dateOrder: DateOrder;
  /** Daylight-saving gap and overlap policies for the wall-clock times. */
  dst: { gap: WallClockPolicy; overlap: WallClockPolicy };
}

/** A decoded line with its 1-based number. */
export interface NumberedLine extends DecodedLine {
  line: number;
}

/** Reads the date of a stamp in `order`; two-digit years are taken as 20yy (chat exports are recent). */
export function chatStampTime(stamp: ChatStamp, order: DateOrder, zone: string, dst: ChatLinesOptions['dst']):
  | { ok: true; instant: number; offsetMinutes: number }
  | { ok: false; code: string; message: string } {
  const [p0, p1, p2] = stamp.parts;
  let [year, month, day] = order === 'ymd' ? [p0, p1, p2] : order === 'dmy' ? [p2, p1, p0] : [p2, p0, p1];
  const yearDigits = order === 'ymd' ? stamp.firstDigits : stamp.lastDigits;
  if (yearDigits <= 2) year += 2000;
  const shown = stamp.parts.join('/');
  if (month < 1 || month > 12) return { ok: false, code: 'chat_bad_date', message: `the date ${shown} has no month ${month} when read as ${order}` };
  const days = daysInMonth(year, month);
  if (day < 1 || day > days) return { ok: false, code: 'chat_bad_date', message: `the date ${shown} read as ${order} has day ${day}, which does not exist in ${year}-${String(month).padStart(2, '0')}` };
  let hour = stamp.hour;
  if (stamp.meridiem) {
    if (hour < 1 || hour > 12) return { ok: false, code: 'chat_bad_time', message: `the hour ${hour} is not on a 12-hour clock (1–12 before AM/PM)` };
    hour = (hour % 12) + (stamp.meridiem === 'pm' ? 12 : 0);
  }
  if (hour > 23 || stamp.minute > 59 || stamp.second > 59) return { ok: false, code: 'chat_bad_time', message: 'the time of day is out of range' };
  const wall = utcFromFields(year, month, day, hour, stamp.minute, stamp.second);
  if (wall === undefined) return { ok: false, code: 'chat_bad_date', message: 'the date has a year outside 0000–9999' };
  const resolved = resolveWallClock(wall, zone, dst);
  return resolved.ok ? resolved : { ok: false, code: resolved.code, message: resolved.message };
}

/**
 * Reads a line-based chat export ("chat-lines", see parseChatLine) into entries of one person.
 *
 * Each dated line with a sender starts a message; undated lines continue it. Messages whose
 * sender is one of `senders` (compared with normalizeSender) become entries; all others are
 * dropped as `third_party` with no text kept; dated lines without a sender are dropped as
 * `system_line`. A line that looks like a header but cannot be read (a flipped byte, a NUL or
 * invalid UTF-8 in its date or time: see looksLikeChatHeader) → `chat_bad_header`, together with
 * the lines that continue it: their author is unknown, so they join no message. Continuation
 * lines are trusted only while they cannot be mistaken for a header. Undated lines before the
 * first dated line → one `chat_orphan_lines` reject;
 * impossible dates and times → `chat_bad_date`/`chat_bad_time`; times in a daylight-saving gap or
 * overlap follow `dst`. The `id` is `<file>:<line>` of the message's first line.
 */
export async function* readChatLines(lines: AsyncIterable<NumberedLine> | Iterable<NumberedLine>, options: ChatLinesOptions): AsyncGenerator<ImportItem> {
  const own = new Set(options.senders.map(normalizeSender));
  type Pending = { line: number; stamp: ChatStamp; own: boolean; parts: string[]; notes: Set<EntryNote> };
  /** A damaged header and the number of lines that continue it (rejected together). */
  type Damaged = { line: number; damaged: number };
  let pending: Pending | Damaged | undefined;
  let orphanStart = 0;
  let orphans = 0;
  const finish = (p: Pending | Damaged): ImportItem => {
    const { file } = options;
    if ('damaged' in p) {
      const more = p.damaged > 0 ? ` and the ${p.damaged} line(s) after it are` : ' is';
      return importReject(file, p.line, 'chat_bad_header', `the line looks like the start of a message, but its date, time or sender cannot be read (a damaged byte?); it${more} left out, since their author is unknown`);
    }
    if (!p.own) return { kind: 'drop', reason: 'third_party', source: { file, line: p.line } };
    const time = chatStampTime(p.stamp, options.dateOrder, options.zone, options.dst);
    if (!time.ok) return importReject(file, p.line, time.code, time.message);
    const text = p.parts.join('\n').trim();
    if (text === '') return importReject(file, p.line, 'empty_text', 'the message holds no text');
    const entry: RawEntry = { id: `${file}:${p.line}`, person: options.person, instant: time.instant, zone: options.zone, offsetMinutes: time.offsetMinutes, text, source: { file, line: p.line } };
    return p.notes.size > 0 ? { kind: 'entry', entry, notes: [...p.notes], wallClock: true } : { kind: 'entry', entry, wallClock: true };
  };
  for await (const numbered of lines) {
    // a line that holds another message's header is read as two lines (see splitEmbeddedHeaders)
    for (const text of splitEmbeddedHeaders(numbered.text)) {
      const { line, repaired } = numbered;
      const parsed = parseChatLine(text);
      if (parsed.kind === 'continuation') {
        if (pending && 'damaged' in pending) {
          pending.damaged++;
        } else if (pending) {
          if (pending.own) {
            pending.parts.push(parsed.text);
            if (repaired) pending.notes.add(repaired);
          }
        } else if (parsed.text.trim() !== '') {
          if (orphans === 0) orphanStart = line;
          orphans++;
        }
        continue;
      }
      if (pending) yield finish(pending);
      pending = undefined;
      if (parsed.kind === 'system') {
        yield { kind: 'drop', reason: 'system_line', source: { file: options.file, line } };
        continue;
      }
      if (parsed.kind === 'damaged') {
        pending = { line, damaged: 0 };
        continue;
      }
      const isOwn = own.has(normalizeSender(parsed.sender));
      pending = { line, stamp: parsed.stamp, own: isOwn, parts: isOwn ? [parsed.text] : [], notes: new Set(isOwn && repaired ? [repaired] : []) };
    }
  }
  if (pending) yield finish(pending);
  if (orphans > 0) {
    yield importReject(options.file, orphanStart, 'chat_orphan_lines', `${orphans} undated line(s) before the first dated line belong to no message`);
  }
}
