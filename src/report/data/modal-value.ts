/**
 * The most frequent value (ties go to the value seen first); undefined for no values.
 * Used for a series' nominal bin length and a day's dominant missing reason.
 */
export function modalValue<T>(values: Iterable<T>): T | undefined {
  const counts = new Map<T, number>();
  let best: T | undefined;
  let bestCount = 0;
  for (const v of values) {
    const c = (counts.get(v) ?? 0) + 1;
    counts.set(v, c);
    if (c > bestCount) {
      best = v;
      bestCount = c;
    }
  }
  return best;
}
