import { createBinStore } from './bin-accumulator.js';
import type { SeriesOptions, SeriesState } from './series-types.js';

/** A new, empty series state for `columns` score columns. */
export function createSeriesState(options: SeriesOptions, columns: number): SeriesState {
  return { options, columns, store: createBinStore(columns), persons: new Map(), excludedEntries: 0, dayStarts: new Map() };
}
