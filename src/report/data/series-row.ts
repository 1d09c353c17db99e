/** One row of `series-long.csv` as the report needs it (docs/architecture.md, "Series"). */
export interface SeriesRow {
  person: string;
  t: number;
  binStart: string;
  localDate: string;
  binHours: number;
  entries: number;
  words: number;
  /** Empty when observed. */
  missing: string;
  lagValid: boolean;
  /** Raw score per score column (`undefined` when missing). */
  values: Record<string, number | undefined>;
}
