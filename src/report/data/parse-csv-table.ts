import Papa from 'papaparse';
import { restoreCell } from '../csv.js';

/** A CSV document as a header and string rows. */
export interface CsvTable {
  header: string[];
  rows: string[][];
}

/**
 * Parses a whole CSV document (RFC 4180, first row the header) into string cells; blank lines are
 * skipped, and cells neutralised against spreadsheet formulas by lexichron's writers are given back
 * as written (restoreCell: a person `'=p1` is `=p1` in the report). Returns undefined when the text
 * has no header row.
 */
export function parseCsvTable(text: string): CsvTable | undefined {
  const parsed = Papa.parse<string[]>(text.replace(/^\uFEFF/, ''), { skipEmptyLines: true });
  const [header, ...rows] = parsed.data;
  if (!header || header.length === 0) return undefined;
  return { header, rows: rows.map((row) => row.map(restoreCell)) };
}
