import type { BinReducer, BinStore } from './bin-accumulator.js';
import type { BinSpec } from './bin-spec.js';

/** Why a bin has no value. */
export type MissingReason = '' | 'no_text' | 'too_few_words' | 'excluded_hours' | 'outside_window' | 'before_first_entry' | 'after_last_entry';

/** How short gaps are filled: not at all, by the last observed value, or linearly between neighbours. */
export type FillMethod = 'none' | 'carry' | 'linear';

/** How entries are binned into series (see `lexichron series --help`). */
export interface SeriesOptions {
  bin: BinSpec;
  /** Minutes after local midnight at which a day starts. */
  dayStart: number;
  /** Bins with fewer words are missing (`too_few_words`). */
  minWords: number;
  /** Local clock range [start, end) in minutes whose entries and bins are excluded. */
  excludeHours?: [number, number];
  fill: FillMethod;
  /** Longest run of missing bins that may be filled. */
  maxFill: number;
  detrend: boolean;
  /** One reducer per score column. */
  reducers: BinReducer[];
  /** Per-person study windows as local day numbers (inclusive). */
  windows?: ReadonlyMap<string, { from: number; to: number }>;
  /** A common grid for everyone (local day numbers, inclusive); bins outside a person's window are `outside_window`. */
  span?: { from: number; to: number };
  /** The person's zone on a local day (from a zone table with effective dates), when known; else taken from their entries. */
  zoneOn?: (person: string, day: number) => string | undefined;
}

/** One entry as the series stage needs it. */
export interface SeriesEntry {
  person: string;
  instant: number;
  zone: string;
  words: number;
  values: ReadonlyArray<number | undefined>;
  matched: ReadonlyArray<number>;
}

/** Where an entry fell. */
export interface EntryPlacement {
  /** Local day number (days since 1970-01-01 of the local date, after the day start). */
  day: number;
  /** Start instant of the unit bin (sub-daily bin or day). */
  binStart: number;
  excluded: boolean;
}

/** The unit bins of one person: slot of each bin key in the store, and the zone of each local day. */
export interface PersonBins {
  /** Unit-bin key (day · 2048 + bin index within the day) → slot in the store. */
  slots: Map<number, number>;
  /** Local day number → zone of the last entry on that day. */
  dayZones: Map<number, string>;
  firstDay: number;
  lastDay: number;
}

/** Accumulators of every person: one pooled store, and per person the slots of its unit bins. */
export interface SeriesState {
  options: SeriesOptions;
  columns: number;
  store: BinStore;
  persons: Map<string, PersonBins>;
  excludedEntries: number;
  /** Memo of day-start instants: zone → local day number → instant. */
  dayStarts: Map<string, Map<number, number>>;
}

/** One row of the long series (one bin of one person). */
export interface SeriesRow {
  person: string;
  t: number;
  start: number;
  end: number;
  zone: string;
  localDate: string;
  day: number;
  binOfDay: number;
  hours: number;
  hoursSincePrev: number | undefined;
  entries: number;
  words: number;
  missing: MissingReason;
  lagValid: boolean;
  values: Array<number | undefined>;
  matched: number[];
  personMean: Array<number | undefined>;
  within: Array<number | undefined>;
  lag1: Array<number | undefined>;
  withinLag1: Array<number | undefined>;
  filled: Array<'' | 'carry' | 'linear'>;
  detrended: Array<number | undefined>;
}
