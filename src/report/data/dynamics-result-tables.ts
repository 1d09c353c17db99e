import type { DynamicsData, ResultTable } from '../report-data.js';
import { parseCsvTable } from './parse-csv-table.js';

/** Rows shown per dynamics table before it is cut (the file holds them all). */
export const MAX_TABLE_ROWS = 200;

/**
 * Dynamics results as plain tables, one per CSV file of the dynamics stage (`name` is the file
 * name, shown as the table title), cut to {@link MAX_TABLE_ROWS} rows with the rest counted.
 * Numbers are shown as written in the file. Returns undefined when no file has rows.
 */
export function dynamicsResultTables(files: readonly { name: string; text: string }[]): DynamicsData | undefined {
  const tables: ResultTable[] = [];
  for (const f of files) {
    const t = parseCsvTable(f.text);
    if (!t || t.rows.length === 0) continue;
    const table: ResultTable = { title: f.name, columns: t.header, rows: t.rows.slice(0, MAX_TABLE_ROWS).map((r) => r.map((c) => (/^-?\d+\.\d{5,}$/.test(c) ? Number(c).toFixed(4) : c))) };
    if (t.rows.length > MAX_TABLE_ROWS) table.omitted = t.rows.length - MAX_TABLE_ROWS;
    tables.push(table);
  }
  return tables.length ? { tables } : undefined;
}
