import { DateTime } from 'luxon';
import { writeAscii } from '../fast/write-ascii.js';
import { inTimeWindow, type TimeWindow } from './time-window.js';
import { daysInMonth, utcFromFields } from './utc-from-fields.js';
import { resolveWallClock, zoneOffset, type WallClockPolicy } from './zone-offset.js';
import { describeValue, omitValue } from '../privacy/describe-value.js';

/** How timestamps are read. */
export interface TimeOptions {
  /** A luxon format such as `dd/MM/yyyy HH:mm`; when absent, ISO 8601 / RFC 3339 or epoch numbers. */
  format?: string;
  /**
   * Unit of numeric timestamps: seconds, milliseconds, microseconds, nanoseconds, or `auto`, which
   * tells them apart by magnitude (below 10^11 seconds, below 10^14 milliseconds, below 10^17
   * microseconds, else nanoseconds; each range holds the years 1973–5138 of its unit).
   */
  epoch: EpochUnit;
  /** Spring-forward gap policy for times without an offset. */
  gap: WallClockPolicy;
  /** Fall-back overlap policy for times without an offset. */
  overlap: WallClockPolicy;
  /**
   * The plausible times (see timeWindow); a time outside is rejected as `time_outside_window`.
   * Absent: any time RFC 3339 can write (years 0000–9999) is accepted. The command line and
   * study runs always set it (default 1970-01-01 to ten years after now).
   */
  window?: TimeWindow;
}

/** Units of numeric timestamps (`us` is microseconds). */
export type EpochUnit = 'auto' | 's' | 'ms' | 'us' | 'ns';
export const EPOCH_UNITS: readonly EpochUnit[] = ['auto', 's', 'ms', 'us', 'ns'];

export const DEFAULT_TIME_OPTIONS: TimeOptions = { epoch: 'auto', gap: 'reject', overlap: 'reject' };

/**
 * A parsed instant, or the reason it could not be parsed. `fallback` is set when a format was
 * given but the time did not match it and was read as RFC 3339 / ISO 8601 instead (readers count
 * such rows as `time_iso_fallback`). `epoch` is set for a plain epoch number: its instant is
 * known, but not the writer's local offset.
 */
export type InstantResult =
  | { ok: true; instant: number; offsetMinutes: number; hadOffset: boolean; fallback?: true; epoch?: true }
  | { ok: false; code: string; message: string };

const RFC3339 = /^(\d{4})-(\d{2})-(\d{2})(?:[Tt ](\d{2}):(\d{2})(?::(\d{2})(?:[.,](\d{1,9}))?)?)?\s*(Z|z|[+-]\d{2}(?::?\d{2})?)?$/;
const EPOCH = /^-?\d{9,19}(?:\.\d+)?$/;

function parseOffset(text: string): number {
  if (text === 'Z' || text === 'z') return 0;
  const sign = text[0] === '-' ? -1 : 1;
  const digits = text.slice(1).replace(':', '');
  return sign * (Number(digits.slice(0, 2)) * 60 + Number(digits.slice(2, 4) || '0'));
}

/** The fields of an RFC 3339 date-time as read (not yet checked for range); offset in minutes, undefined when absent. */
interface DateTimeFields {
  year: number;
  month: number;
  day: number;
  hour: number;
  minute: number;
  second: number;
  /** The digits after the decimal mark, or undefined. */
  fraction: string | undefined;
  offset: number | undefined;
}

/** The fields of `value` by the RFC3339 pattern (the general reader), or undefined when it does not match. */
function regexFields(value: string): DateTimeFields | undefined {
  const m = RFC3339.exec(value);
  if (!m) return undefined;
  return {
    year: Number(m[1]),
    month: Number(m[2]),
    day: Number(m[3]),
    hour: Number(m[4] ?? 0),
    minute: Number(m[5] ?? 0),
    second: Number(m[6] ?? 0),
    fraction: m[7] || undefined,
    offset: m[8] !== undefined ? parseOffset(m[8]) : undefined,
  };
}

/** The value of the ASCII digits of `text` from `start` to `end` (exclusive), or −1 when one is not a digit. */
function digitsAt(text: string, start: number, end: number): number {
  let n = 0;
  for (let k = start; k < end; k++) {
    const d = text.charCodeAt(k) - 48; // NaN past the end
    if (!(d >= 0 && d <= 9)) return -1;
    n = n * 10 + d;
  }
  return n;
}

/**
 * The fields of the most common form, `YYYY-MM-DDTHH:MM:SS`, with an optional fraction and an
 * optional `Z` or `±hh:mm` / `±hhmm` / `±hh` offset right after, read without the regular
 * expression (most files write every time this way); undefined for anything else, which
 * regexFields then reads. Accepts exactly what RFC3339 accepts for these forms (tested).
 */
function commonFields(value: string): DateTimeFields | undefined {
  const n = value.length;
  if (n < 19 || value.charCodeAt(4) !== 45 || value.charCodeAt(7) !== 45 || value.charCodeAt(13) !== 58 || value.charCodeAt(16) !== 58) return undefined;
  const t = value.charCodeAt(10);
  if (t !== 84 && t !== 116 && t !== 32) return undefined; // T, t or a space
  const year = digitsAt(value, 0, 4);
  const month = digitsAt(value, 5, 7);
  const day = digitsAt(value, 8, 10);
  const hour = digitsAt(value, 11, 13);
  const minute = digitsAt(value, 14, 16);
  const second = digitsAt(value, 17, 19);
  if (year < 0 || month < 0 || day < 0 || hour < 0 || minute < 0 || second < 0) return undefined;
  let k = 19;
  let fraction: string | undefined;
  if (k < n && (value.charCodeAt(k) === 46 || value.charCodeAt(k) === 44)) {
    let end = k + 1;
    while (end < n && end - k <= 9 && digitsAt(value, end, end + 1) >= 0) end++;
    if (end === k + 1) return undefined;
    fraction = value.slice(k + 1, end);
    k = end;
  }
  let offset: number | undefined;
  if (k < n) {
    const c = value.charCodeAt(k);
    if ((c === 90 || c === 122) && k + 1 === n) offset = 0; // Z or z
    else if (c === 43 || c === 45) {
      const sign = c === 45 ? -1 : 1;
      const hours = digitsAt(value, k + 1, k + 3);
      const rest = n - (k + 3);
      let minutes = 0;
      if (rest === 3 && value.charCodeAt(k + 3) === 58) minutes = digitsAt(value, k + 4, k + 6);
      else if (rest === 2) minutes = digitsAt(value, k + 3, k + 5);
      else if (rest !== 0) return undefined;
      if (hours < 0 || minutes < 0) return undefined;
      offset = sign * (hours * 60 + minutes);
    } else return undefined;
  }
  return { year, month, day, hour, minute, second, fraction, offset };
}

function bad(value: string, what: string): InstantResult {
  return { ok: false, code: 'bad_time', message: `cannot read the time (${describeValue(value)}): ${omitValue(what, value)}` };
}

/**
 * Reads one timestamp.
 *
 * Accepted, in order: epoch seconds or milliseconds (a plain number of 9–16 digits); RFC 3339 /
 * ISO 8601 calendar date-times, with `T` or a space, optional seconds and fraction, and an
 * optional `Z` or `±hh:mm` offset; other ISO 8601 forms through luxon; or `options.format`.
 * With `options.format`, a time that does not match it but is an RFC 3339 / ISO 8601 time is
 * read as such and marked `fallback` (RFC 3339 section 5.6; ISO 8601-1:2019 section 5.4), as is
 * an epoch number when `options.epoch` names its unit.
 * A time with an offset is taken as written (`hadOffset`); a time without one is a wall-clock
 * time in `zone`, and a daylight-saving gap or overlap is resolved by `options.gap`/`overlap`.
 * A leap second (`:60`, RFC 3339 section 5.7) is read as the first instant of the next minute,
 * as POSIX time has no leap seconds.
 */
export function parseInstant(raw: string, zone: string, options: TimeOptions = DEFAULT_TIME_OPTIONS): InstantResult {
  const result = readInstant(raw, zone, options);
  if (!result.ok) return result;
  if (!inTimeWindow(result.instant, undefined)) {
    return { ok: false, code: 'bad_time', message: 'the time lies outside the years 0000–9999 that RFC 3339 can write (or outside ECMA-262\'s ±8.64e15 ms); check the value and its epoch unit (--epoch)' };
  }
  if (!inTimeWindow(result.instant, options.window)) {
    return { ok: false, code: 'time_outside_window', message: 'the time lies outside the plausible window (by default 1970-01-01 to ten years from today); check the value and its epoch unit (--epoch), or widen the window with --time-window FROM/TO' };
  }
  const offsetMinutes = result.offsetMinutes ?? zoneOffset(zone, result.instant);
  return { ok: true, instant: result.instant, offsetMinutes, hadOffset: result.hadOffset, ...(result.fallback ? { fallback: true as const } : {}), ...(result.offsetMinutes === undefined ? { epoch: true as const } : {}) };
}

/** The epoch milliseconds of a plain number in `unit` (`auto`: by magnitude, see TimeOptions.epoch). */
export function epochMillis(value: string, unit: EpochUnit): number {
  const n = Number(value);
  const size = Math.abs(n);
  const chosen = unit !== 'auto' ? unit : size < 1e11 ? 's' : size < 1e14 ? 'ms' : size < 1e17 ? 'us' : 'ns';
  if (chosen === 's') return Math.round(n * 1000);
  if (chosen === 'ms') return Math.round(n);
  if (chosen === 'us') return Math.round(n / 1000);
  // Nanoseconds beyond 2^53 lose precision as a Number: drop the last six digits exactly.
  const [whole = '0', fraction = ''] = value.replace(/^-/, '').split('.');
  const sign = value.startsWith('-') ? -1 : 1;
  const digits = whole.padStart(7, '0');
  const ms = Number(digits.slice(0, -6));
  const rest = Number(`0.${digits.slice(-6)}${fraction}`);
  return sign * (ms + (rest >= 0.5 ? 1 : 0));
}

type ReadResult = { ok: true; instant: number; offsetMinutes: number | undefined; hadOffset: boolean; fallback?: true } | { ok: false; code: string; message: string };

/**
 * parseInstant before the range checks; an epoch number's offset is left undefined (looked up after the checks).
 *
 * With a format, a time that does not match it is read as RFC 3339 / ISO 8601 (with or without
 * an offset, by the same rules as without a format) and marked `fallback`; an epoch number only
 * when its unit is given (`epoch` not `auto`): with a format and a unit left to guess, a bare
 * number is more likely a mistake than a time.
 */
function readInstant(raw: string, zone: string, options: TimeOptions): ReadResult {
  const value = raw.trim();
  if (value === '') return { ok: false, code: 'missing_time', message: 'the time is empty; every row needs a time' };
  if (options.format) {
    const formatted = parseWithFormat(value, zone, options);
    if (formatted.ok) return formatted;
    if (EPOCH.test(value)) return options.epoch === 'auto' ? formatted : { ok: true, instant: epochMillis(value, options.epoch), offsetMinutes: undefined, hadOffset: true, fallback: true };
    const general = readIsoInstant(value, zone, options);
    if (general.ok) return { ...general, fallback: true };
    // An RFC 3339 time that falls in a clock change keeps that reason; anything else is named by the format.
    if (general.code !== 'bad_time') return general;
    return { ...formatted, message: `${formatted.message}, nor is it an RFC 3339 / ISO 8601 time such as 2026-03-29T08:15:00+02:00 (read as a fallback)` };
  }
  if (EPOCH.test(value)) {
    return { ok: true, instant: epochMillis(value, options.epoch), offsetMinutes: undefined, hadOffset: true };
  }
  return readIsoInstant(value, zone, options);
}

/** An RFC 3339 / ISO 8601 date-time (trimmed, not empty, not an epoch number), with or without an offset. */
function readIsoInstant(value: string, zone: string, options: TimeOptions): ReadResult {
  const f = commonFields(value) ?? regexFields(value);
  if (f) {
    const { year, month, day, hour, minute, second } = f;
    const fraction = f.fraction !== undefined ? Math.round(Number(`0.${f.fraction}`) * 1000) : 0;
    if (month < 1 || month > 12) return bad(value, `month ${month} is not 1–12`);
    if (day < 1 || day > daysInMonth(year, month)) return bad(value, `day ${day} does not exist in ${year}-${String(month).padStart(2, '0')}`);
    if (hour > 23 || minute > 59 || second > 60) return bad(value, 'the clock time is out of range (hours 00–23, minutes 00–59, seconds 00–60)');
    const start = utcFromFields(year, month, day, hour, minute, second);
    if (start === undefined) return bad(value, 'the year is outside 0000–9999');
    const wall = start + fraction; // a fraction may round up to 1000 ms
    if (f.offset !== undefined) {
      // `-00:00` (RFC 3339 section 4.3: UTC, local offset unknown) gives 0, not −0.
      const offset = f.offset === 0 ? 0 : f.offset;
      if (Math.abs(offset) >= 24 * 60) return bad(value, 'the UTC offset is out of range');
      return { ok: true, instant: wall - offset * 60000, offsetMinutes: offset, hadOffset: true };
    }
    return fromWall(wall, zone, options);
  }
  const iso = DateTime.fromISO(value, { setZone: true, zone: 'UTC' });
  if (iso.isValid) {
    if (/(?:Z|[+-]\d{2}(?::?\d{2})?)$/i.test(value)) return { ok: true, instant: iso.toMillis(), offsetMinutes: iso.offset, hadOffset: true };
    const wall = utcFromFields(iso.year, iso.month, iso.day, iso.hour, iso.minute, iso.second, iso.millisecond);
    if (wall === undefined) return bad(value, 'the year is outside 0000–9999');
    return fromWall(wall, zone, options);
  }
  return bad(value, 'expected RFC 3339 such as 2026-03-29T08:15:00+02:00, a local time such as 2026-03-29 08:15, epoch seconds or milliseconds, or pass --time-format');
}

function fromWall(wall: number, zone: string, options: TimeOptions): ReadResult {
  const resolved = resolveWallClock(wall, zone, options);
  if (!resolved.ok) return resolved;
  return { ok: true, instant: resolved.instant, offsetMinutes: resolved.offsetMinutes, hadOffset: false };
}

function parseWithFormat(value: string, zone: string, options: TimeOptions): ReadResult {
  const format = options.format as string;
  const dt = DateTime.fromFormat(value, format, { zone: 'UTC', setZone: true });
  if (!dt.isValid) return bad(value, `it does not match the format \`${format}\` (${dt.invalidExplanation ?? dt.invalidReason ?? 'no reason given'})`);
  if (/Z{1,3}|ZZZZ/.test(format.replace(/'[^']*'/g, ''))) return { ok: true, instant: dt.toMillis(), offsetMinutes: dt.offset, hadOffset: true };
  const wall = utcFromFields(dt.year, dt.month, dt.day, dt.hour, dt.minute, dt.second, dt.millisecond);
  if (wall === undefined) return bad(value, 'the year is outside 0000–9999');
  return fromWall(wall, zone, options);
}

const DAY_MS = 86_400_000;
/** Where isoWithoutZone writes before it reads the characters back (formatting is synchronous). */
const SCRATCH = Buffer.alloc(32);

/** `ms` (milliseconds since the epoch, read as UTC) as `YYYY-MM-DDTHH:MM:SS.mmm`, the form of toISOString without `Z`. */
function isoWithoutZone(ms: number): string {
  const end = writeIsoWithoutZone(SCRATCH, 0, ms);
  return end === undefined ? new Date(ms).toISOString().slice(0, -1) : SCRATCH.toString('latin1', 0, end);
}

/** Formats an instant as RFC 3339 UTC with milliseconds (`2026-03-29T06:15:00.000Z`). */
export function formatUtc(instant: number): string {
  if (!Number.isInteger(instant)) return new Date(instant).toISOString();
  return `${isoWithoutZone(instant)}Z`;
}

/**
 * Formats an instant as local time with its offset (`2026-03-29T08:15:00.000+02:00`). RFC 3339's
 * `time-numoffset` has whole minutes only, so an offset with seconds (local mean time before a
 * zone adopted standard time, e.g. +00:19:32 in Amsterdam before 1937) is written rounded to the
 * minute and the clock time shifted with it: the text still names the exact instant.
 */
export function formatLocal(instant: number, offsetMinutes: number): string {
  offsetMinutes = Math.round(offsetMinutes);
  const wall = instant + offsetMinutes * 60000;
  const local = Number.isInteger(wall) ? isoWithoutZone(wall) : new Date(wall).toISOString().slice(0, 23);
  return local + offsetText(offsetMinutes);
}

/** The date part (`2026-03-29T`, ASCII bytes) of the last day written: consecutive rows mostly share a day. */
let lastDateBytes = new Uint8Array(0);
let lastDateBytesDay = NaN;

/** Writes the two decimal digits of `n` (0–99). */
function writeTwo(buffer: Uint8Array, at: number, n: number): number {
  buffer[at] = 48 + ((n / 10) | 0);
  buffer[at + 1] = 48 + (n % 10);
  return at + 2;
}

/**
 * Writes `ms` (milliseconds since the epoch, read as UTC) as `YYYY-MM-DDTHH:MM:SS.mmm` in ASCII
 * bytes; undefined when ms is not a whole number or its year is outside 0000–9999 (then the
 * callers fall back to Date's toISOString).
 */
function writeIsoWithoutZone(buffer: Uint8Array, at: number, ms: number): number | undefined {
  if (!Number.isInteger(ms)) return undefined;
  const day = Math.floor(ms / DAY_MS);
  if (day !== lastDateBytesDay) {
    const iso = new Date(day * DAY_MS).toISOString();
    if (iso.length !== 24) return undefined;
    lastDateBytes = Uint8Array.from(iso.slice(0, 11), (c) => c.charCodeAt(0));
    lastDateBytesDay = day;
  }
  for (let k = 0; k < 11; k++) buffer[at++] = lastDateBytes[k] as number;
  let rest = ms - day * DAY_MS;
  const milli = rest % 1000;
  rest = (rest - milli) / 1000;
  const second = rest % 60;
  rest = (rest - second) / 60;
  const minute = rest % 60;
  at = writeTwo(buffer, at, (rest - minute) / 60);
  buffer[at++] = 58; // :
  at = writeTwo(buffer, at, minute);
  buffer[at++] = 58;
  at = writeTwo(buffer, at, second);
  buffer[at++] = 46; // .
  buffer[at++] = 48 + ((milli / 100) | 0);
  return writeTwo(buffer, at, milli % 100);
}

/** Writes formatUtc(instant) as ASCII bytes into `buffer` at `at` (at most 27); returns where it ended. */
export function writeUtcTime(buffer: Uint8Array, at: number, instant: number): number {
  const end = writeIsoWithoutZone(buffer, at, instant);
  if (end === undefined) return writeAscii(buffer, at, formatUtc(instant));
  buffer[end] = 90; // Z
  return end + 1;
}

/** Writes formatLocal(instant, offsetMinutes) as ASCII bytes into `buffer` at `at` (at most 32); returns where it ended. */
export function writeLocalTime(buffer: Uint8Array, at: number, instant: number, offsetMinutes: number): number {
  offsetMinutes = Math.round(offsetMinutes);
  const end = writeIsoWithoutZone(buffer, at, instant + offsetMinutes * 60000);
  if (end === undefined) return writeAscii(buffer, at, formatLocal(instant, offsetMinutes));
  return writeAscii(buffer, end, offsetText(offsetMinutes));
}

/** `+02:00` for 120 minutes (RFC 3339 `time-numoffset`), remembered per offset (a file has few). */
const offsetTexts = new Map<number, string>();

function offsetText(offsetMinutes: number): string {
  let text = offsetTexts.get(offsetMinutes);
  if (text === undefined) {
    const sign = offsetMinutes < 0 ? '-' : '+';
    const abs = Math.abs(offsetMinutes);
    text = `${sign}${String(Math.floor(abs / 60)).padStart(2, '0')}:${String(abs % 60).padStart(2, '0')}`;
    offsetTexts.set(offsetMinutes, text);
  }
  return text;
}
