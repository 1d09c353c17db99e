import type { Part } from '../report-data.js';
import { parseCsvTable } from './parse-csv-table.js';
import type { SeriesRow } from './series-row.js';

const FIXED = new Set(['person', 't', 'bin_start', 'bin_end', 'local_date', 'day', 'bin_of_day', 'bin_hours', 'hours_since_prev', 'entries', 'words', 'missing', 'lag_valid']);
const DERIVED = /\.(n|person_mean|within|lag1|within_lag1|filled|detrended)$/;
const REQUIRED = ['person', 't', 'bin_start', 'local_date', 'bin_hours', 'words', 'missing'];

/** Rows and score columns of a series file. */
export interface ParsedSeries {
  rows: SeriesRow[];
  /** Raw score columns in file order (derived `.n`, `.within`, `.lag1`… columns left out). */
  scores: string[];
}

const num = (cell: string | undefined): number | undefined => {
  if (cell === undefined || cell === '') return undefined;
  const v = Number(cell);
  return Number.isFinite(v) ? v : undefined;
};

/**
 * Reads the text of a `series-long.csv` into rows (columns per docs/architecture.md). Returns the
 * reason when required columns are absent, naming them, so the report can say what is wrong.
 */
export function parseSeriesLong(text: string): Part<ParsedSeries> {
  const table = parseCsvTable(text);
  if (!table) return { ok: false, reason: 'series-long.csv is empty' };
  const index = new Map(table.header.map((h, i) => [h, i]));
  const lacking = REQUIRED.filter((c) => !index.has(c));
  if (lacking.length) return { ok: false, reason: `series-long.csv lacks the column${lacking.length > 1 ? 's' : ''} ${lacking.map((c) => `\`${c}\``).join(', ')}; was it written by \`lexichron series\`?` };
  const scores = table.header.filter((h) => !FIXED.has(h) && !DERIVED.test(h));
  const at = (row: string[], name: string): string | undefined => {
    const i = index.get(name);
    return i === undefined ? undefined : row[i];
  };
  const rows: SeriesRow[] = [];
  for (const row of table.rows) {
    const values: Record<string, number | undefined> = {};
    for (const s of scores) values[s] = num(at(row, s));
    rows.push({
      person: at(row, 'person') ?? '',
      t: num(at(row, 't')) ?? rows.length,
      binStart: at(row, 'bin_start') ?? '',
      localDate: at(row, 'local_date') ?? '',
      binHours: num(at(row, 'bin_hours')) ?? 0,
      entries: num(at(row, 'entries')) ?? 0,
      words: num(at(row, 'words')) ?? 0,
      missing: at(row, 'missing') ?? '',
      lagValid: at(row, 'lag_valid') === '1',
      values,
    });
  }
  return { ok: true, value: { rows, scores } };
}
