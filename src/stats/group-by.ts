/**
 * Groups `values` by `key(d)` into a Map that keeps first-seen key order (d3-array `group`).
 */
export function groupBy<T, K>(values: Iterable<T>, key: (d: T, i: number) => K): Map<K, T[]> {
  const groups = new Map<K, T[]>();
  let i = -1;
  for (const d of values) {
    const k = key(d, ++i);
    const list = groups.get(k);
    if (list) list.push(d);
    else groups.set(k, [d]);
  }
  return groups;
}
