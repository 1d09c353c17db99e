import { rename, rm } from 'node:fs/promises';
import { open } from 'node:fs/promises';
import Papa from 'papaparse';
import { usageError } from '../errors.js';
import { temporaryPathFor } from './own-temporaries.js';

/** Which table a CSV holds, which decides the column types of its Parquet copy. */
export type ParquetTable = 'scores' | 'series';

/** Whole-number columns of the scores and series tables (the others are text or double). */
const INTEGER_COLUMNS = new Set(['words', 't', 'day', 'bin_of_day', 'entries', 'lag_valid']);
/** Text columns. */
const TEXT_COLUMNS = new Set(['entry_id', 'person', 'zone', 'missing', 'text']);
/** Columns holding an RFC 3339 time with an offset, split into an instant and a wall-clock time. */
const LOCAL_TIME_COLUMNS = new Set(['time_local', 'bin_start', 'bin_end']);

/** SQL string literal. */
const lit = (text: string): string => `'${text.replaceAll("'", "''")}'`;
/** SQL identifier. */
const id = (text: string): string => `"${text.replaceAll('"', '""')}"`;

/**
 * The SELECT list turning the text columns of a scores or series CSV into typed Parquet columns:
 * `time_utc` → TIMESTAMP WITH TIME ZONE (the UTC instant); a local time with offset
 * (`time_local`, `bin_start`, `bin_end`) → a TIMESTAMP of the wall-clock time (no zone) and, for
 * the bins, `<name>_utc` with the instant; `zone` stays the IANA name, so instant, wall-clock time
 * and zone are separate columns; `local_date` → DATE; counts → BIGINT; `.filled` and text columns
 * → VARCHAR; every other column → DOUBLE. Empty fields become NULL.
 */
export function parquetColumns(header: readonly string[]): string[] {
  const out: string[] = [];
  for (const name of header) {
    const v = `NULLIF(${id(name)}, '')`;
    if (name === 'time_utc') out.push(`CAST(${v} AS TIMESTAMPTZ) AS ${id(name)}`);
    else if (LOCAL_TIME_COLUMNS.has(name)) {
      out.push(`CAST(regexp_replace(${v}, '([+-][0-9][0-9]:[0-9][0-9]|Z)$', '') AS TIMESTAMP) AS ${id(name)}`);
      if (name !== 'time_local') out.push(`CAST(${v} AS TIMESTAMPTZ) AS ${id(`${name}_utc`)}`);
    } else if (name === 'local_date') out.push(`CAST(${v} AS DATE) AS ${id(name)}`);
    else if (TEXT_COLUMNS.has(name) || name.endsWith('.filled')) out.push(`${id(name)}`);
    else if (INTEGER_COLUMNS.has(name) || name.endsWith('.n') || name.endsWith('.negated')) out.push(`CAST(${v} AS BIGINT) AS ${id(name)}`);
    else out.push(`CAST(${v} AS DOUBLE) AS ${id(name)}`);
  }
  return out;
}

/**
 * Writes a Parquet copy of a scores or series CSV written by lexichron (`scores.csv` →
 * `scores.parquet`), through DuckDB's Node bindings (`@duckdb/node-api`, its Parquet extension
 * statically linked: nothing is downloaded, extension auto-install is switched off). Written to a
 * temporary file and renamed into place. Returns the Parquet file's path.
 */
export async function writeParquet(csvPath: string, table: ParquetTable): Promise<string> {
  const out = csvPath.replace(/\.csv$/i, '') + '.parquet';
  const firstLine = await headerOf(csvPath);
  const { DuckDBInstance } = await import('@duckdb/node-api');
  const db = await DuckDBInstance.create(':memory:', { autoinstall_known_extensions: 'false', autoload_known_extensions: 'true', threads: '1' });
  const connection = await db.connect();
  const tmp = temporaryPathFor(out);
  try {
    const source = `read_csv(${lit(csvPath)}, header = true, all_varchar = true, delim = ',', quote = '"', escape = '"', new_line = '\\n', auto_detect = false, columns = {${firstLine.map((c) => `${lit(c)}: 'VARCHAR'`).join(', ')}})`;
    await connection.run(`COPY (SELECT ${parquetColumns(firstLine).join(', ')} FROM ${source}) TO ${lit(tmp)} (FORMAT parquet, COMPRESSION zstd)`);
    await rename(tmp, out);
  } catch (error) {
    await rm(tmp, { force: true });
    throw usageError(`Cannot write the Parquet copy of \`${csvPath}\` (${table}): ${(error as Error).message}`);
  } finally {
    connection.closeSync();
    db.closeSync();
  }
  return out;
}

/** The column names of a CSV written by lexichron: its first record, read by papaparse (RFC 4180 quoting) from the file's first 1 MB. */
async function headerOf(csvPath: string): Promise<string[]> {
  const file = await open(csvPath, 'r');
  try {
    const { buffer, bytesRead } = await file.read({ buffer: Buffer.alloc(1 << 20), position: 0 });
    const text = buffer.subarray(0, bytesRead).toString('utf8');
    return Papa.parse<string[]>(text, { delimiter: ',', newline: '\n', preview: 1 }).data[0] ?? [];
  } finally {
    await file.close();
  }
}
