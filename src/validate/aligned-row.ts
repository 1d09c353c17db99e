/**
 * One occasion at which text scores and self-reports are paired: a bin (bin alignment) or a
 * self-report with the window before it (window alignment).
 */
export interface AlignedRow {
  person: string;
  /** Bin alignment: the bin's start; window alignment: the self-report's time (UTC). */
  instant: number;
  /** Local label: `bin_start` of the bin, or the self-report's local time. */
  label: string;
  /** Entries and words behind the text scores. */
  entries: number;
  words: number;
  /** Empty when the text side is observed; else why not (`no_text`, `too_few_words`, …). */
  missing: string;
  scores: Record<string, number | undefined>;
  /** Self-reports averaged into this row (1 for window alignment). */
  reports: number;
  ratings: Record<string, number | undefined>;
}
