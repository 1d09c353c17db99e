import type { Diagnostic, SourceRef } from '../types.js';
import { scaleOf, type RatingScale } from './rating-scale.js';
import { describeValue } from '../privacy/describe-value.js';

/**
 * Missing-value codes of rating columns when none are declared: `NA`, as R's write.csv writes a
 * missing value (common practice; pandas writes an empty cell, which is always missing). A declared
 * list (`--missing`, study file `ratings.missing`) replaces it; an empty list leaves only empty cells.
 */
export const DEFAULT_MISSING_CODES: readonly string[] = ['NA'];

/**
 * Reads the rating columns of one self-report row against their declared scales.
 *
 * An empty field, or one equal to a declared missing-value code (`missing`, e.g. `NA` or `-99`,
 * compared after trimming), is a missing rating (no diagnostic). A value that is not a number becomes
 * `rating_not_numeric`, one outside its declared scale `rating_out_of_scale`; either way the value
 * is left out (`undefined`) and a Diagnostic with the row's source explains why, while the row's
 * other ratings are kept. `missing` in the result lists the columns read as missing (for counting).
 */
export function ratingValues(
  record: Readonly<Record<string, string>>,
  columns: readonly string[],
  scales: ReadonlyMap<string, RatingScale>,
  source: SourceRef,
  missing: ReadonlySet<string> = new Set(),
): { values: Record<string, number | undefined>; diagnostics: Diagnostic[]; missing: string[] } {
  const values: Record<string, number | undefined> = {};
  const diagnostics: Diagnostic[] = [];
  const absent: string[] = [];
  for (const column of columns) {
    const text = (record[column] ?? '').trim();
    values[column] = undefined;
    if (text === '' || missing.has(text)) {
      absent.push(column);
      continue;
    }
    const value = /^[-+]?(\d+(\.\d*)?|\.\d+)([eE][-+]?\d+)?$/.test(text) ? Number(text) : NaN;
    if (!Number.isFinite(value)) {
      diagnostics.push({ code: 'rating_not_numeric', message: `rating \`${column}\` is ${describeValue(text)}, not a number; the value is left out`, source, stage: 'validate' });
      continue;
    }
    const scale = scaleOf(scales, column);
    if (scale && (value < scale.min || value > scale.max)) {
      diagnostics.push({ code: 'rating_out_of_scale', message: `rating \`${column}\` is ${text}, outside its declared scale ${scale.min} to ${scale.max}; the value is left out`, source, stage: 'validate' });
      continue;
    }
    values[column] = value;
  }
  return { values, diagnostics, missing: absent };
}
