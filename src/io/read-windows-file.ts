import { isCalendarDate } from '../ingest/is-calendar-date.js';
import { basename } from 'node:path';
import { usageError } from '../errors.js';
import { readRecords } from '../ingest/read-records.js';
import { tableFile } from './table-file.js';
import { dayNumberOfDate } from '../series/local-day.js';

/**
 * Reads per-person study windows: a CSV/TSV/JSONL file with columns `person`, `from`, `to`
 * (local dates, inclusive). Returns local day numbers by person; throws a usage error naming the
 * line for a bad date, an empty window or a person listed twice.
 */
export async function readWindowsFile(path: string): Promise<Map<string, { from: number; to: number }>> {
  const file = basename(path);
  const windows = new Map<string, { from: number; to: number }>();
  for await (const item of readRecords(tableFile(path))) {
    if (item.kind === 'header') {
      const missing = ['person', 'from', 'to'].filter((c) => item.columns.length > 0 && !item.columns.includes(c));
      if (missing.length > 0) throw usageError(`Cannot read \`${file}\`: a windows file needs the columns person, from and to (local dates); it lacks ${missing.join(', ')}.`);
      continue;
    }
    if (item.kind === 'reject') throw usageError(`Cannot read \`${file}\` on line ${item.diagnostic.source?.line}: ${item.diagnostic.message}`);
    const { person = '', from = '', to = '' } = item.record;
    const where = `Cannot read \`${file}\` on line ${item.source.line}`;
    if (person.trim() === '') throw usageError(`${where}: the person is empty.`);
    for (const [name, value] of [['from', from], ['to', to]] as const) {
      if (!isCalendarDate(value.trim())) throw usageError(`${where}: \`${name}\` must be a local date YYYY-MM-DD that exists; fix the date on that line.`);
    }
    const window = { from: dayNumberOfDate(from.trim()), to: dayNumberOfDate(to.trim()) };
    if (window.from > window.to) throw usageError(`${where}: the window of \`${person}\` ends before it starts.`);
    if (windows.has(person.trim())) throw usageError(`${where}: \`${person}\` has a second window; give each person one line.`);
    windows.set(person.trim(), window);
  }
  return windows;
}
