/**
 * UTC offset in minutes written at the end of an RFC 3339 local time (`…+02:00` → 120, `…Z` → 0);
 * undefined when the text carries no offset.
 */
export function offsetMinutes(text: string): number | undefined {
  const m = /(?:([+-])(\d{2}):?(\d{2})|Z)$/.exec(text);
  if (!m) return undefined;
  if (!m[1]) return 0;
  return (m[1] === '-' ? -1 : 1) * (Number(m[2]) * 60 + Number(m[3]));
}
