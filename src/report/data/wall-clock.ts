import { utcFromFields } from '../../ingest/utc-from-fields.js';
/**
 * Wall-clock epoch of a local date-time string such as `2026-03-29T04:00:00+02:00`: its fields
 * read as if in UTC, ignoring the offset, so bins of persons in different zones line up by local
 * clock. Returns undefined for text that is not such a time.
 */
export function wallClock(text: string): number | undefined {
  const m = /^(\d{4})-(\d{2})-(\d{2})(?:[T ](\d{2}):(\d{2})(?::(\d{2}))?)?/.exec(text);
  if (!m) return undefined;
  // utcFromFields keeps years 0–99 as written (Date.UTC would read 0026 as 1926).
  return utcFromFields(Number(m[1]), Number(m[2]), Number(m[3]), Number(m[4] ?? 0), Number(m[5] ?? 0), Number(m[6] ?? 0));
}
