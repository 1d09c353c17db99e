/**
 * `count` library sizes spread evenly from `min` to `max` (both included), rounded to whole
 * points, duplicates removed, increasing. Returns `[max]` when min ≥ max.
 */
export function librarySizes(min: number, max: number, count: number): number[] {
  const lo = Math.max(1, Math.floor(min));
  const hi = Math.max(1, Math.floor(max));
  if (lo >= hi || count <= 1) return [hi];
  const out = new Set<number>();
  for (let i = 0; i < count; i++) out.add(Math.round(lo + ((hi - lo) * i) / (count - 1)));
  return [...out].sort((a, b) => a - b);
}
