import { createReadStream } from 'node:fs';
import { basename, extname } from 'node:path';
import { createInterface } from 'node:readline';
import { usageError } from '../errors.js';
import { parseColumnMapping, type ColumnMapping } from '../ingest/column-mapping.js';
import { DEFAULT_TIME_OPTIONS, type TimeOptions } from '../ingest/parse-instant.js';
import { readEntries } from '../ingest/read-entries.js';
import { readRecords, type TableFormat } from '../ingest/read-records.js';
import { tableFile } from './table-file.js';
import type { ZoneTable } from '../ingest/zone-table.js';
import type { AuditEntry } from '../terms/term-auditor.js';
import type { Diagnostic } from '../types.js';
import { describeColumns } from '../privacy/describe-columns.js';

/** How to read a corpus for `terms suggest` and `terms audit`. */
export interface ReadCorpusOptions {
  /** Column mapping as for `score` (`person=COL,time=COL,text=COL[,id=COL]`); only `text` is required unless `bins`. */
  columns?: string | ColumnMapping;
  format?: TableFormat;
  delimiter?: string;
  /** Give each entry a `bin` (the person's local date): needs time and zone, read as by `score`. */
  bins?: { zones: ZoneTable; time?: TimeOptions };
}

/** What {@link readCorpus} yields. */
export type CorpusItem = { kind: 'entry'; entry: AuditEntry } | { kind: 'reject'; diagnostic: Diagnostic };

function localDate(instant: number, offsetMinutes: number): string {
  return new Date(instant + offsetMinutes * 60000).toISOString().slice(0, 10);
}

/**
 * Streams the entries of a corpus: a plain-text file (`.txt`, one entry per non-empty line, the
 * file name as person), or a table (CSV/TSV/JSONL/JSON) with a text column and, when present, a
 * person column (otherwise the file name is the person) and an id column. With `bins`, entries are
 * read as by `score` (time and zone required) and binned by the person's local date. Rows without
 * text become rejects with their line; a missing text column is a usage error naming the columns.
 */
export async function* readCorpus(path: string, options: ReadCorpusOptions = {}): AsyncGenerator<CorpusItem> {
  const file = basename(path);
  const mapping = typeof options.columns === 'object' ? options.columns : parseColumnMapping(options.columns);
  if (extname(path).toLowerCase() === '.txt' && !options.format) {
    if (options.bins) throw usageError(`Cannot bin \`${file}\` by day: a .txt corpus has no times; give a CSV/TSV/JSONL file with person, time and text, or use --over entries.`);
    const lines = createInterface({ input: createReadStream(path, { encoding: 'utf8' }), crlfDelay: Infinity });
    let n = 0;
    for await (const line of lines) {
      n++;
      const text = n === 1 ? line.replace(/^\uFEFF/, '') : line;
      if (text.trim() === '') continue;
      yield { kind: 'entry', entry: { id: `${file}:${n}`, person: file, text } };
    }
    return;
  }
  const reader = { format: options.format, delimiter: options.delimiter };
  if (options.bins) {
    for await (const item of readEntries(tableFile(path), { ...reader, columns: mapping, zones: options.bins.zones, time: options.bins.time ?? DEFAULT_TIME_OPTIONS })) {
      if (item.kind === 'reject') yield item;
      else yield { kind: 'entry', entry: { id: item.entry.id, person: item.entry.person, text: item.entry.text, bin: localDate(item.entry.instant, item.entry.offsetMinutes) } };
    }
    return;
  }
  let hasPerson = false;
  let idColumn: string | undefined;
  const check = (header: readonly string[]): void => {
    if (!header.includes(mapping.text)) {
      throw usageError(`Cannot read \`${file}\`: no text column \`${mapping.text}\`; the header has ${describeColumns(header)}. Name the text column with --columns text=COLUMN.`);
    }
    hasPerson = header.includes(mapping.person);
    idColumn = mapping.id ?? (header.includes('id') ? 'id' : undefined);
  };
  let checked = false;
  for await (const item of readRecords(tableFile(path), reader)) {
    if (item.kind === 'header') {
      if (item.columns.length > 0) {
        check(item.columns);
        checked = true;
      }
      continue;
    }
    if (item.kind === 'reject') {
      yield item;
      continue;
    }
    if (!checked) {
      check(Object.keys(item.record));
      checked = true;
    }
    const text = item.record[mapping.text] ?? '';
    if (text.trim() === '') {
      yield { kind: 'reject', diagnostic: { code: 'empty_text', message: `the \`${mapping.text}\` field is empty; there is nothing to match`, source: item.source, stage: 'terms' } };
      continue;
    }
    const person = hasPerson ? (item.record[mapping.person] ?? '').trim() || file : file;
    const id = idColumn ? (item.record[idColumn] ?? '').trim() || `${file}:${item.source.line}` : `${file}:${item.source.line}`;
    yield { kind: 'entry', entry: { id, person, text } };
  }
}
