import { usageError } from '../errors.js';
import { scaleOf, type RatingScale } from './rating-scale.js';

/**
 * The rating columns of a self-report table: those named (`--rating`), or every column that is
 * not the person, time, zone or id column. Throws a usage error for a named column the header
 * lacks, for a table without rating columns, and for a rating without a declared scale (every
 * rating needs one so that out-of-scale values can be rejected).
 */
export function ratingColumns(
  header: readonly string[],
  reserved: readonly (string | undefined)[],
  named: readonly string[] | undefined,
  scales: ReadonlyMap<string, RatingScale>,
  file: string,
): string[] {
  let columns: string[];
  if (named && named.length > 0) {
    const unknown = named.filter((c) => !header.includes(c));
    if (unknown.length > 0) throw usageError(`Cannot read \`${file}\`: no rating column ${unknown.map((c) => `\`${c}\``).join(', ')}; the header has ${header.map((h) => `\`${h}\``).join(', ')}.`);
    columns = [...named];
  } else {
    columns = header.filter((h) => !reserved.includes(h) && h !== '');
  }
  if (columns.length === 0) throw usageError(`Cannot read \`${file}\`: no rating columns besides ${reserved.filter(Boolean).map((c) => `\`${c}\``).join(', ')}; name them with --rating COL.`);
  const unscaled = columns.filter((c) => !scaleOf(scales, c));
  if (unscaled.length > 0) {
    throw usageError(`No scale declared for rating ${unscaled.map((c) => `\`${c}\``).join(', ')}; declare each with --scale, e.g. --scale ${unscaled.map((c) => `${c}=1:7`).join(',')} (or *=1:7 for all).`);
  }
  return columns;
}
