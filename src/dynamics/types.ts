/**
 * Data types shared by the dynamics analyses.
 */

/**
 * One variable of one person in bin order: `values[t]` is the bin's value (`undefined` when the
 * bin is missing) and `lagValid[t]` is true when bin t − 1 is observed and adjacent to bin t
 * (the `lag_valid` column of `series-long.csv`; false across excluded hours and after gaps).
 */
export interface BinnedSeries {
  values: readonly (number | undefined)[];
  lagValid: readonly boolean[];
}

/**
 * A person's series as parseSeriesCsv reads it from `series-long.csv`: one value array per
 * column, in bin order.
 */
export interface PersonSeriesInput {
  person: string;
  /** Within-person time index of each bin (0-based, every bin of the window). */
  t: readonly number[];
  values: Readonly<Record<string, readonly (number | undefined)[]>>;
  lagValid: readonly boolean[];
  /** Missing reason per bin (empty string when observed). */
  missing?: readonly string[];
  /** 1-based bin number within the local day, when known (used for seasonal surrogates). */
  binOfDay?: readonly number[];
  /** Local start of each bin as written in the series file (`bin_start`), when known. */
  binStart?: readonly string[];
}
