import type { AlignedPair } from '../../validate/aligned-pair.js';
import type { BinRatings } from './person-tracks.js';
import { parseCsvTable } from './parse-csv-table.js';
import type { SeriesRow } from './series-row.js';

const LABEL_COLUMNS = ['bin_start', 'time', 'label', 'time_local'];

/**
 * Aligned observations from the validate stage's pairs file (one row per occasion: `person`, a
 * label column holding the bin start, then score and rating columns). Returns per score × rating
 * the pairs for the scatters, and per rating the values by person and bin index `t` (matched to
 * the series rows by bin start) for the series charts. Columns that are not found are skipped.
 */
export function alignedFromCsv(
  text: string,
  scores: readonly string[],
  ratings: readonly string[],
  seriesRows: readonly SeriesRow[],
): { pairs: Map<string, AlignedPair[]>; binRatings: Map<string, BinRatings> } {
  const pairs = new Map<string, AlignedPair[]>();
  const binRatings = new Map<string, BinRatings>();
  const table = parseCsvTable(text);
  if (!table) return { pairs, binRatings };
  const col = new Map(table.header.map((h, i) => [h, i]));
  const personAt = col.get('person');
  if (personAt === undefined) return { pairs, binRatings };
  const labelAt = LABEL_COLUMNS.map((c) => col.get(c)).find((i) => i !== undefined);
  const tOf = new Map(seriesRows.map((r) => [`${r.person}\u0000${r.binStart}`, r.t]));
  const value = (row: string[], name: string): number | undefined => {
    const i = col.get(name);
    const cell = i === undefined ? undefined : row[i];
    if (cell === undefined || cell === '') return undefined;
    const v = Number(cell);
    return Number.isFinite(v) ? v : undefined;
  };
  const presentScores = scores.filter((s) => col.has(s));
  const presentRatings = ratings.filter((r) => col.has(r));
  for (const r of presentRatings) binRatings.set(r, new Map());
  for (const row of table.rows) {
    const person = row[personAt] ?? '';
    for (const s of presentScores)
      for (const r of presentRatings) {
        const key = `${s}\u0000${r}`;
        const list = pairs.get(key) ?? [];
        list.push({ person, x: value(row, s), y: value(row, r) });
        pairs.set(key, list);
      }
    if (labelAt === undefined) continue;
    const t = tOf.get(`${person}\u0000${row[labelAt] ?? ''}`);
    if (t === undefined) continue;
    for (const r of presentRatings) {
      const v = value(row, r);
      if (v === undefined) continue;
      const byPerson = binRatings.get(r) as Map<string, Map<number, number>>;
      const own = byPerson.get(person) ?? new Map<number, number>();
      own.set(t, v);
      byPerson.set(person, own);
    }
  }
  return { pairs, binRatings };
}
