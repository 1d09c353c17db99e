import { readFileSync } from 'node:fs';
import Papa from 'papaparse';

/**
 * Parses CSV text with papaparse (quoted fields, quoted line breaks and CRLF handled) into rows
 * of strings, header row included; blank lines are left out. Throws on a malformed row, so a
 * broken reference file fails its test instead of yielding shifted columns.
 */
export function parseCsvRows(text: string): string[][] {
  const parsed = Papa.parse<string[]>(text, { header: false, skipEmptyLines: true });
  const error = parsed.errors[0];
  if (error) throw new Error(`Cannot parse CSV: ${error.message} (row ${error.row ?? '?'})`);
  return parsed.data;
}

/** Parses CSV text into objects keyed by the header row (see {@link parseCsvRows}); missing cells are ''. */
export function parseCsv(text: string): Record<string, string>[] {
  const [header = [], ...rows] = parseCsvRows(text);
  return rows.map((cells) => Object.fromEntries(header.map((h, i) => [h, cells[i] ?? ''])));
}

/** Reads a CSV file (UTF-8) into objects keyed by its header row. */
export function readCsv(file: string): Record<string, string>[] {
  return parseCsv(readFileSync(file, 'utf8'));
}
