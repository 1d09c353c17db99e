/**
 * Wall-clock epoch of a local date-time string such as `2026-03-29T04:00:00+02:00`: its fields
 * read as if in UTC, ignoring the offset, so bins of persons in different zones line up by local
 * clock. Returns undefined for text that is not such a time.
 */
export function wallClock(text: string): number | undefined {
  const m = /^(\d{4})-(\d{2})-(\d{2})(?:[T ](\d{2}):(\d{2})(?::(\d{2}))?)?/.exec(text);
  if (!m) return undefined;
  return Date.UTC(Number(m[1]), Number(m[2]) - 1, Number(m[3]), Number(m[4] ?? 0), Number(m[5] ?? 0), Number(m[6] ?? 0));
}
