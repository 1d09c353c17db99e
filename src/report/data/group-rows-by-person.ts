import type { SeriesRow } from './series-row.js';

/** Series rows grouped by person (persons sorted by code point, rows sorted by `t`). */
export function groupRowsByPerson(rows: readonly SeriesRow[]): Map<string, SeriesRow[]> {
  const groups = new Map<string, SeriesRow[]>();
  for (const r of rows) {
    const list = groups.get(r.person);
    if (list) list.push(r);
    else groups.set(r.person, [r]);
  }
  const sorted = new Map<string, SeriesRow[]>();
  for (const person of [...groups.keys()].sort()) sorted.set(person, (groups.get(person) ?? []).sort((a, b) => a.t - b.t));
  return sorted;
}
