import { basename } from 'node:path';
import { usageError } from '../errors.js';
import { readRecords } from '../ingest/read-records.js';
import { tableFile } from './table-file.js';
import { buildZoneTable, type ZoneTable } from '../ingest/zone-table.js';
import { describeColumns } from '../privacy/describe-columns.js';

/**
 * Reads a zone file (CSV/TSV/JSONL with columns `person`, `zone` and optionally `from`, the local
 * date a period starts) into a zone table, with `fallback` for persons not listed.
 */
export async function readZoneFile(path: string | undefined, fallback?: string): Promise<ZoneTable> {
  if (!path) return buildZoneTable([], '', fallback);
  const rows: Array<{ person: string; zone: string; from?: string; line: number }> = [];
  const file = basename(path);
  for await (const item of readRecords(tableFile(path))) {
    if (item.kind === 'header') {
      if (item.columns.length > 0 && (!item.columns.includes('person') || !item.columns.includes('zone'))) {
        throw usageError(`Cannot read \`${file}\`: a zone file needs the columns \`person\` and \`zone\` (and optionally \`from\`); the header has ${describeColumns(item.columns)}`);
      }
      continue;
    }
    if (item.kind === 'reject') throw usageError(`Cannot read \`${file}\` on line ${item.diagnostic.source?.line}: ${item.diagnostic.message}`);
    const r = item.record;
    if (!r.person || !r.zone) throw usageError(`Cannot read \`${file}\` on line ${item.source.line}: \`person\` and \`zone\` must not be empty`);
    rows.push({ person: r.person.trim(), zone: r.zone.trim(), from: r.from, line: item.source.line });
  }
  return buildZoneTable(rows, file, fallback);
}
