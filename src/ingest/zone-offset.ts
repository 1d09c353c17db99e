import { FixedOffsetZone, IANAZone } from 'luxon';

const zones = new Map<string, IANAZone | FixedOffsetZone>();
const offsetCache = new Map<string, Map<number, DaySpan>>();
const QUARTER_HOUR = 15 * 60 * 1000;

const validity = new Map<string, boolean>();

const FIXED = /^UTC([+-])(\d{2}):(\d{2})$/;

/**
 * The label of a fixed UTC offset in minutes, `UTC+01:00` (RFC 3339 `time-numoffset` after `UTC`):
 * the zone of a person without a known zone whose time was written with its offset. Offsets are
 * rounded to whole minutes.
 */
export function fixedOffsetZone(offsetMinutes: number): string {
  const m = Math.round(Math.abs(offsetMinutes));
  return `UTC${offsetMinutes < 0 ? '-' : '+'}${String(Math.floor(m / 60)).padStart(2, '0')}:${String(m % 60).padStart(2, '0')}`;
}

/** The offset in minutes of a fixedOffsetZone label, or undefined for anything else (offsets below 24 h). */
export function fixedOffsetMinutes(zone: string): number | undefined {
  const m = FIXED.exec(zone);
  if (!m) return undefined;
  const hours = Number(m[2]);
  const minutes = Number(m[3]);
  if (hours > 23 || minutes > 59) return undefined;
  const total = hours * 60 + minutes;
  return m[1] === '-' ? -total : total;
}

/**
 * True when `zone` names a zone of the IANA time zone database known to this Node build, or is a
 * fixed offset written as fixedOffsetZone writes it (`UTC+01:00`).
 * Answers are memoized: luxon builds an `Intl.DateTimeFormat` per check, which made checking
 * every row of a scores file the slowest step of the series stage.
 */
export function isValidZone(zone: string): boolean {
  let ok = validity.get(zone);
  if (ok === undefined) {
    ok = IANAZone.isValidZone(zone) || fixedOffsetMinutes(zone) !== undefined;
    if (validity.size > 10_000) validity.clear();
    validity.set(zone, ok);
  }
  return ok;
}

const DAY = 24 * 3600 * 1000;

/** A UTC day of one zone: the offset before and after `change` (Infinity when the day has none). */
interface DaySpan {
  change: number;
  before: number;
  after: number;
}

const IRREGULAR: DaySpan = { change: NaN, before: NaN, after: NaN };

function ianaZone(zone: string): IANAZone | FixedOffsetZone {
  let z = zones.get(zone);
  if (!z) {
    const fixed = fixedOffsetMinutes(zone);
    z = fixed !== undefined ? FixedOffsetZone.instance(fixed) : IANAZone.create(zone);
    zones.set(zone, z);
  }
  return z;
}

/**
 * The offsets of one UTC day in `zone`: luxon is asked at the day's first, middle and last
 * quarter hour; when they differ, the quarter hour of the change is found by bisection.
 * A day whose three samples all differ is marked irregular (per-quarter-hour lookups).
 */
function daySpan(z: IANAZone | FixedOffsetZone, start: number): DaySpan {
  const before = z.offset(start);
  const mid = z.offset(start + DAY / 2);
  const after = z.offset(start + DAY - QUARTER_HOUR);
  if (before === after && mid === before) return { change: Infinity, before, after };
  if (before !== mid && mid !== after) return IRREGULAR;
  // One change: bisect on quarter hours for the first one that reads `after`.
  let lo = 0;
  let hi = DAY / QUARTER_HOUR - 1;
  while (hi - lo > 1) {
    const q = (lo + hi) >> 1;
    if (z.offset(start + q * QUARTER_HOUR) === before) lo = q;
    else hi = q;
  }
  return { change: start + hi * QUARTER_HOUR, before, after };
}

/**
 * UTC offset in minutes of IANA `zone` at epoch milliseconds `instant`.
 *
 * Offsets are cached per UTC day: every transition in the IANA database since 1970 falls on a
 * quarter-hour boundary, and no zone changes its offset and back again within half a day (from
 * memory of the tz data; a day whose samples show two changes falls back to per-quarter-hour
 * lookups). test/ingest/zone-offset.test.ts checks the cache against luxon quarter hour by
 * quarter hour over 2026 in several zones.
 * The caller must have checked the zone with isValidZone.
 */
export function zoneOffset(zone: string, instant: number): number {
  let cache = offsetCache.get(zone);
  if (!cache) {
    cache = new Map();
    offsetCache.set(zone, cache);
  }
  const key = Math.floor(instant / DAY);
  let span = cache.get(key);
  if (span === undefined) {
    span = daySpan(ianaZone(zone), key * DAY);
    if (cache.size > 100_000) cache.clear();
    cache.set(key, span);
  }
  if (span === IRREGULAR) return ianaZone(zone).offset(Math.floor(instant / QUARTER_HOUR) * QUARTER_HOUR);
  return instant < span.change ? span.before : span.after;
}

/** How to resolve a local wall-clock time that a daylight-saving change skips or repeats. */
export type WallClockPolicy = 'reject' | 'earlier' | 'later';

/** Outcome of turning a wall-clock time into an instant. */
export type WallClockResult =
  | { ok: true; instant: number; offsetMinutes: number }
  | { ok: false; code: 'time_in_gap' | 'time_ambiguous'; message: string };

/**
 * Turns a local wall-clock time, given as milliseconds of a notional UTC clock
 * (`Date.UTC(y, m-1, d, h, min, s)`), into an instant in `zone`.
 *
 * - Normal times have exactly one instant.
 * - In a spring-forward gap (e.g. 02:30 on 2026-03-29 in Europe/Brussels) there is none:
 *   `gap: 'earlier'` takes the offset in force after the change (the earlier instant, 00:30Z),
 *   `gap: 'later'` the offset before it (the later instant, 01:30Z, which reads 03:30 local);
 *   `reject` reports `time_in_gap`.
 * - In a fall-back overlap (e.g. 02:30 on 2026-10-25 in Europe/Brussels) there are two:
 *   `overlap: 'earlier'` takes the first (00:30Z, +02:00), `later` the second (01:30Z, +01:00);
 *   `reject` reports `time_ambiguous`.
 */
export function resolveWallClock(
  wallMs: number,
  zone: string,
  policy: { gap: WallClockPolicy; overlap: WallClockPolicy },
): WallClockResult {
  const before = zoneOffset(zone, wallMs - DAY);
  const after = zoneOffset(zone, wallMs + DAY);
  const candidates: Array<{ instant: number; offsetMinutes: number }> = [];
  for (const offset of before === after ? [before] : [before, after]) {
    const instant = wallMs - offset * 60000;
    if (zoneOffset(zone, instant) === offset) candidates.push({ instant, offsetMinutes: offset });
  }
  if (candidates.length === 0 && before === after) {
    // A change within the day that returns to the same offset (rare): fall back to the offset at the wall time itself.
    const offset = zoneOffset(zone, wallMs);
    const instant = wallMs - offset * 60000;
    if (zoneOffset(zone, instant) === offset) candidates.push({ instant, offsetMinutes: offset });
  }
  if (candidates.length === 1) return { ok: true, ...(candidates[0] as { instant: number; offsetMinutes: number }) };
  if (candidates.length === 0) {
    if (policy.gap === 'reject') {
      return { ok: false, code: 'time_in_gap', message: `the local time does not exist in ${zone} (the clocks skip it at a daylight-saving change); fix the time or choose --dst-gap earlier|later` };
    }
    const offset = policy.gap === 'earlier' ? after : before;
    return { ok: true, instant: wallMs - offset * 60000, offsetMinutes: zoneOffset(zone, wallMs - offset * 60000) };
  }
  if (policy.overlap === 'reject') {
    return { ok: false, code: 'time_ambiguous', message: `the local time occurs twice in ${zone} (the clocks go back at a daylight-saving change); add a UTC offset or choose --dst-overlap earlier|later` };
  }
  candidates.sort((a, b) => a.instant - b.instant);
  return { ok: true, ...(candidates[policy.overlap === 'earlier' ? 0 : candidates.length - 1] as { instant: number; offsetMinutes: number }) };
}
