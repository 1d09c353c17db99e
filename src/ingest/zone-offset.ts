import { IANAZone } from 'luxon';

const zones = new Map<string, IANAZone>();
const offsetCache = new Map<string, Map<number, number>>();
const QUARTER_HOUR = 15 * 60 * 1000;

/** True when `zone` names a zone of the IANA time zone database known to this Node build. */
export function isValidZone(zone: string): boolean {
  return IANAZone.isValidZone(zone);
}

/**
 * UTC offset in minutes of IANA `zone` at epoch milliseconds `instant`.
 *
 * Offsets are cached per quarter hour: every transition in the IANA database since 1970
 * falls on a quarter-hour boundary, so the cache never straddles a change.
 * The caller must have checked the zone with isValidZone.
 */
export function zoneOffset(zone: string, instant: number): number {
  let cache = offsetCache.get(zone);
  if (!cache) {
    cache = new Map();
    offsetCache.set(zone, cache);
  }
  const key = Math.floor(instant / QUARTER_HOUR);
  let offset = cache.get(key);
  if (offset === undefined) {
    let z = zones.get(zone);
    if (!z) {
      z = IANAZone.create(zone);
      zones.set(zone, z);
    }
    offset = z.offset(key * QUARTER_HOUR);
    if (cache.size > 200_000) cache.clear();
    cache.set(key, offset);
  }
  return offset;
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
  const day = 24 * 3600 * 1000;
  const before = zoneOffset(zone, wallMs - day);
  const after = zoneOffset(zone, wallMs + day);
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
