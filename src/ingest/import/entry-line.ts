import type { RawEntry } from '../../types.js';
import { formatLocal } from '../parse-instant.js';

/** RFC 3339 local time with offset, without milliseconds when they are zero (`2026-03-29T08:15:00+02:00`). */
export function entryTime(instant: number, offsetMinutes: number): string {
  const text = formatLocal(instant, offsetMinutes);
  return instant % 1000 === 0 ? text.replace(/\.000(?=[+-])/, '') : text;
}

/** One line of the entries contract of docs/architecture.md: `{id, person, time, zone, text}`. */
export function entryLine(entry: RawEntry): string {
  return JSON.stringify({ id: entry.id, person: entry.person, time: entryTime(entry.instant, entry.offsetMinutes), zone: entry.zone, text: entry.text });
}
