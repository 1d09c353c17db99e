import { resolveWallClock, zoneOffset } from '../ingest/zone-offset.js';

const DAY = 86_400_000;

/** The local date `YYYY-MM-DD` of day number `dayNumber` (days since 1970-01-01). */
export function dateOfDayNumber(dayNumber: number): string {
  return new Date(dayNumber * DAY).toISOString().slice(0, 10);
}

/** Days since 1970-01-01 of a local date `YYYY-MM-DD`. */
export function dayNumberOfDate(date: string): number {
  return Math.round(Date.parse(`${date}T00:00:00Z`) / DAY);
}

/**
 * The local day an instant belongs to in `zone`, with days starting at `dayStart` minutes after
 * local midnight (a 01:30 entry belongs to the previous day when the day starts at 04:00).
 * Returns the day number (days since 1970-01-01 of the local date) and the minutes since the
 * local wall-clock day start.
 */
export function localDayOf(instant: number, zone: string, dayStart: number): { day: number; minuteOfDay: number } {
  const wall = instant + zoneOffset(zone, instant) * 60000 - dayStart * 60000;
  const day = Math.floor(wall / DAY);
  return { day, minuteOfDay: Math.floor((wall - day * DAY) / 60000) };
}

/**
 * The instant at which local day `day` starts in `zone` (wall clock `dayStart` minutes after
 * midnight). If that wall-clock time is skipped by a clock change, the day starts at the first
 * instant after the gap.
 */
export function dayStartInstant(day: number, zone: string, dayStart: number): number {
  const wall = day * DAY + dayStart * 60000;
  const r = resolveWallClock(wall, zone, { gap: 'later', overlap: 'earlier' });
  if (!r.ok) return wall - zoneOffset(zone, wall) * 60000;
  // In a gap, 'later' gives the instant that reads after the gap: the first instant of the day.
  return r.instant;
}
