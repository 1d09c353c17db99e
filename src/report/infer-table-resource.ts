import Papa from 'papaparse';
import { tableResource, type SchemaField, type TableResource } from './data-dictionary.js';

/**
 * A Table Schema resource for a CSV document whose columns have no fixed dictionary: each field
 * is `integer` or `number` when every non-empty value is one, otherwise `string`; descriptions
 * come from `describe` or name the column.
 */
export function inferTableResource(name: string, path: string, csv: string, describe: (column: string) => string | undefined, description: string): TableResource {
  const rows = Papa.parse<string[]>(csv, { skipEmptyLines: true }).data;
  const header = rows[0] ?? [];
  const fields: SchemaField[] = header.map((column, i) => {
    let integer = true;
    let number = true;
    let any = false;
    for (const row of rows.slice(1)) {
      const v = row[i] ?? '';
      if (v === '') continue;
      any = true;
      if (!/^-?\d+$/.test(v)) integer = false;
      if (!Number.isFinite(Number(v))) number = false;
    }
    const type = !any ? 'string' : integer ? 'integer' : number ? 'number' : 'string';
    return { name: column, type, description: describe(column) ?? `Column ${column} of ${path}` };
  });
  return { ...tableResource(name, path, header, undefined, description), schema: { fields, missingValues: [''] } };
}
