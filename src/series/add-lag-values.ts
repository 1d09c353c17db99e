import type { SeriesRow } from './series-types.js';

/**
 * Sets each row's `lagValid` and lag-1 values in place: bin t−1's value (raw and centred) when
 * bins t−1 and t are both observed; empty otherwise, and empty when bin t−1's value was filled.
 */
export function addLagValues(rows: SeriesRow[], columns: number): void {
  for (let t = 0; t < rows.length; t++) {
    const r = rows[t] as SeriesRow;
    const prev = t > 0 ? rows[t - 1] : undefined;
    // Bins t−1 and t are neighbours on the person's grid; across a move to another zone the local day
    // boundary shifts by the change of offset, but the two days still follow each other.
    r.lagValid = prev !== undefined && prev.missing === '' && r.missing === '';
    for (let c = 0; c < columns; c++) {
      r.lag1[c] = r.lagValid && prev && prev.filled[c] === '' ? prev.values[c] : undefined;
      r.withinLag1[c] = r.lagValid && prev && prev.filled[c] === '' ? prev.within[c] : undefined;
    }
  }
}
