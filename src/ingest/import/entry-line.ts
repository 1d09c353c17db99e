import type { RawEntry } from '../../types.js';
import { formatLocal } from '../parse-instant.js';

/** RFC 3339 local time with offset, without milliseconds when they are zero (`2026-03-29T08:15:00+02:00`). */
export function entryTime(instant: number, offsetMinutes: number): string {
  const text = formatLocal(instant, offsetMinutes);
  return instant % 1000 === 0 ? text.replace(/\.000(?=[+-])/, '') : text;
}

/**
 * One line of the entries contract of docs/architecture.md: `{id, person, time, zone, text}`, with
 * `pseudonym_key` after `person` when the entry was pseudonymized (the key's check value, see
 * createPseudonymizer): the mark that keeps `score` and `run` from pseudonymizing it again.
 */
export function entryLine(entry: RawEntry): string {
  const time = entryTime(entry.instant, entry.offsetMinutes);
  if (entry.pseudonymKey !== undefined) return JSON.stringify({ id: entry.id, person: entry.person, pseudonym_key: entry.pseudonymKey, time, zone: entry.zone, text: entry.text });
  return JSON.stringify({ id: entry.id, person: entry.person, time, zone: entry.zone, text: entry.text });
}
