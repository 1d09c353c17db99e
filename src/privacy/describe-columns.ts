import { diagnosticText } from './diagnostic-text.js';

/** Header cells listed by name at most. */
const MAX_LISTED = 30;
/** Longest column name shown whole. */
const NAME_MAX = 40;
/** A cell that holds a date, a clock time or a number: data, not a column name. */
const DATA_LIKE = /\d{1,4}[-/.:]\d{1,2}|^[-+]?\d+(?:[.,]\d+)?$/;

/** True when a header row looks like a data row: a cell holds a date, a time or a number, more than four words, or more than 40 characters. */
export function headerLooksLikeData(header: readonly string[]): boolean {
  return header.some((cell) => DATA_LIKE.test(cell) || cell.length > NAME_MAX || cell.trim().split(/\s+/).length > 4);
}

/**
 * The columns of a header as an error message lists them: the names in backticks (at most 30,
 * then how many more). When the "header" looks like a row of data (headerLooksLikeData: the file
 * probably has no header row), no cell is shown, since it would be a participant's text: only how
 * many cells it has, and a hint to add a header row.
 */
export function describeColumns(header: readonly string[]): string {
  if (header.length === 0 || (header.length === 1 && header[0] === '')) return 'no columns';
  if (headerLooksLikeData(header)) {
    return `${header.length} cell(s) that look like data rather than column names (a date, a time, a number or long text; not shown); does the file lack a header row? Add one, e.g. \`person,time,text\``;
  }
  const listed = header.slice(0, MAX_LISTED).map((h) => `\`${diagnosticText(h, NAME_MAX)}\``).join(', ');
  return header.length > MAX_LISTED ? `${listed} and ${header.length - MAX_LISTED} more` : listed;
}
