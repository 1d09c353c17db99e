import { basename, extname } from 'node:path';
import { createInterface } from 'node:readline';
import { Readable } from 'node:stream';
import Papa from 'papaparse';
import { inputError, usageError } from '../errors.js';
import type { Diagnostic, SourceRef } from '../types.js';
import { lineBreakState, normalizeLineBreaks } from './normalize-line-breaks.js';
import { textDecoder, textEncoding } from './text-encoding.js';

/**
 * A table file to read, as src/io/ opens it (`tableFile(path)`, src/io/table-file.ts): this module
 * parses, the caller reads (docs/architecture.md, "Layers").
 */
export interface TableFile {
  /** The file's path as the user named it: used in messages and to tell the format. */
  path: string;
  /** Throws a clear error when the file cannot be opened for reading (missing, a folder …). */
  check(): Promise<void>;
  /** The file's bytes in chunks, in order; leaving the loop early releases the file. */
  chunks(): AsyncIterable<Buffer>;
  /** The file's bytes at once. */
  bytes(): Promise<Buffer>;
}

/** The table formats lexichron reads. */
export type TableFormat = 'csv' | 'tsv' | 'jsonl' | 'json';

export interface ReadRecordsOptions {
  /** Format; by default taken from the file's extension (.csv, .tsv, .jsonl/.ndjson, .json). */
  format?: TableFormat;
  /** Field delimiter for delimited text; by default `,` for .csv and a tab for .tsv, or guessed when `auto`. */
  delimiter?: string;
  /** Longest accepted field in characters; longer rows are rejected with `field_too_long`. Default 1,000,000. */
  maxFieldLength?: number;
  /**
   * Called with the file's bytes as they are read, in order (all of them once the reading has
   * ended without an error): lets a caller take the file's digest from the same read.
   */
  onBytes?: (bytes: Buffer) => void;
}

/** One row read from a table, with its source line, or the reason it was rejected. */
export type RecordItem =
  | { kind: 'header'; columns: string[]; source: SourceRef }
  | { kind: 'record'; record: Record<string, string>; source: SourceRef }
  | { kind: 'reject'; diagnostic: Diagnostic };

const DEFAULT_MAX_FIELD = 1_000_000;

/** The table format implied by a file name, or undefined when the extension says nothing. */
export function formatFromPath(path: string): TableFormat | undefined {
  const ext = extname(path).toLowerCase();
  if (ext === '.csv') return 'csv';
  if (ext === '.tsv' || ext === '.tab') return 'tsv';
  if (ext === '.jsonl' || ext === '.ndjson') return 'jsonl';
  if (ext === '.json') return 'json';
  return undefined;
}

function reject(file: string, line: number, code: string, message: string): RecordItem {
  return { kind: 'reject', diagnostic: { code, message, source: { file, line }, stage: 'ingest' } };
}

/**
 * Reads a table file (opened by src/io/: `readRecords(tableFile(path))`) as a stream of records keyed by column name.
 *
 * CSV/TSV go through papaparse with RFC 4180 quoting (quoted fields may hold delimiters,
 * doubled quotes and line breaks); the first item is always the header. Row-level problems
 * (unclosed quote, wrong field count, invalid UTF-8, over-long field, bad JSON) become
 * `reject` items with the physical line of the row's start; nothing is dropped silently.
 * A byte-order mark is removed. Memory stays bounded by one row.
 */
export async function* readRecords(source: TableFile, options: ReadRecordsOptions = {}): AsyncGenerator<RecordItem> {
  for await (const batch of readRecordBatches(source, options)) yield* batch;
}

/**
 * readRecords in batches: the items of one chunk of the file at a time (a few hundred rows), in
 * order, never empty. For readers that handle many rows per step of the event loop (scoring);
 * memory stays bounded by a chunk plus one row.
 */
export async function* readRecordBatches(source: TableFile, options: ReadRecordsOptions = {}): AsyncGenerator<RecordItem[]> {
  const path = source.path;
  const format = options.format ?? formatFromPath(path);
  if (!format) {
    throw usageError(`Cannot tell the format of \`${path}\` from its extension; name it .csv, .tsv, .jsonl or .json, or pass --format csv|tsv|jsonl|json.`);
  }
  await source.check();
  const maxField = options.maxFieldLength ?? DEFAULT_MAX_FIELD;
  const onBytes = options.onBytes;
  if (format === 'jsonl') yield* readJsonLines(source, maxField, onBytes);
  else if (format === 'json') yield* readJsonArray(source, maxField, onBytes);
  else yield* readDelimited(source, format === 'tsv' ? (options.delimiter ?? '\t') : (options.delimiter ?? ','), maxField, onBytes);
}

/**
 * The text of a file in chunks as it is read (UTF-8, or UTF-16 when textEncoding finds it in the
 * first chunk; a character split between chunks is joined, invalid bytes become U+FFFD), handing
 * the bytes to `onBytes` on the way.
 */
async function* readTextChunks(source: TableFile, onBytes: ((bytes: Buffer) => void) | undefined): AsyncGenerator<string> {
  let decoder: ReturnType<typeof textDecoder> | undefined;
  for await (const bytes of source.chunks()) {
    onBytes?.(bytes);
    decoder ??= textDecoder(textEncoding(bytes));
    const text = decoder.write(bytes);
    if (text !== '') yield text;
  }
  const rest = decoder?.end() ?? '';
  if (rest !== '') yield rest;
}

/** Items per batch of the JSON readers. */
const JSON_BATCH = 256;

function stripBom(text: string): string {
  return text.charCodeAt(0) === 0xfeff ? text.slice(1) : text;
}

/** Line breaks inside the fields of a row: LF, CRLF and a lone CR count one each. */
function countNewlines(fields: readonly string[]): number {
  let n = 0;
  for (const field of fields) {
    for (let i = field.indexOf('\n'); i !== -1; i = field.indexOf('\n', i + 1)) n++;
    for (let i = field.indexOf('\r'); i !== -1; i = field.indexOf('\r', i + 1)) if (field[i + 1] !== '\n') n++;
  }
  return n;
}

function fieldProblem(fields: readonly string[], maxField: number): { code: string; message: string } | undefined {
  for (const field of fields) {
    if (field.length > maxField) {
      return { code: 'field_too_long', message: `a field holds ${field.length} characters, more than the limit of ${maxField}; split such long texts into several entries` };
    }
    if (field.includes('\uFFFD')) {
      return { code: 'invalid_utf8', message: 'the row holds bytes that are not valid UTF-8 (or a U+FFFD replacement character); re-save the file as UTF-8' };
    }
  }
  return undefined;
}

/** Characters a single row may span before reading stops: guards against a quote that is never closed. */
const MAX_ROW_CHARS = 64 * 1024 * 1024;

/**
 * Throws when two header cells hold the same name (RFC 4180 section 2 rule 3: the header names
 * the fields; with a name twice, one column would silently hide the other). Empty cells, as left
 * by trailing delimiters, may repeat. The message gives positions, never the names.
 */
function assertUniqueColumns(header: readonly string[], path: string, line: number): void {
  const seen = new Map<string, number>();
  for (let i = 0; i < header.length; i++) {
    const name = header[i] as string;
    if (name === '') continue;
    const earlier = seen.get(name);
    if (earlier !== undefined) throw inputError(`Cannot read \`${path}\`: the header on line ${line} gives columns ${earlier + 1} and ${i + 1} the same name; rename one of them so that every column has its own name.`);
    seen.set(name, i);
  }
}

/**
 * Reads CSV/TSV rows with papaparse's RFC 4180 parser, yielding header, records and rejects with
 * line numbers. The file is read chunk by chunk with `for await` (so a slow consumer pauses the
 * file, and memory stays bounded by one row plus a chunk); each batch of complete rows is parsed
 * synchronously and the unfinished last row is carried into the next batch. A carried row is
 * parsed again only once the buffer has doubled, so a long quoted field costs linear time.
 */
async function* readDelimited(source: TableFile, delimiter: string, maxField: number, onBytes?: (bytes: Buffer) => void): AsyncGenerator<RecordItem[]> {
  const path = source.path;
  const file = basename(path);
  const chunks = readTextChunks(source, onBytes);
  let header: string[] | undefined;
  let line = 1;
  let pending = '';
  const breaks = lineBreakState();
  let retryAt = 0;
  let first = true;

  function emit(rows: string[][], errors: Papa.ParseError[]): RecordItem[] {
    const items: RecordItem[] = [];
    const errorByRow = new Map<number, Papa.ParseError>();
    for (const e of errors) if ((e.code === 'MissingQuotes' || e.code === 'InvalidQuotes') && typeof e.row === 'number' && !errorByRow.has(e.row)) errorByRow.set(e.row, e);
    for (let r = 0; r < rows.length; r++) {
      const data = rows[r] as string[];
      const start = line;
      line += 1 + countNewlines(data);
      const quoteError = errorByRow.get(r);
      const isBlank = data.length === 1 && data[0] === '';
      if (isBlank && !quoteError) continue;
      if (!header) {
        header = data.map((h) => h.trim());
        assertUniqueColumns(header, path, start);
        items.push({ kind: 'header', columns: header, source: { file, line: start } });
        continue;
      }
      if (quoteError) {
        items.push(reject(file, start, 'unclosed_quote', `a quoted field is not closed (${quoteError.message}); the file may be truncated or a quote is unescaped (double it as "")`));
        continue;
      }
      if (data.length !== header.length) {
        items.push(reject(file, start, 'field_count', `the row has ${data.length} fields but the header has ${header.length}; check the delimiter and quoting of this row`));
        continue;
      }
      const problem = fieldProblem(data, maxField);
      if (problem) {
        items.push(reject(file, start, problem.code, problem.message));
        continue;
      }
      const record: Record<string, string> = {};
      for (let i = 0; i < header.length; i++) record[header[i] as string] = data[i] as string;
      items.push({ kind: 'record', record, source: { file, line: start } });
    }
    return items;
  }

  try {
    for await (const chunk of chunks) {
      pending += normalizeLineBreaks(first ? stripBom(chunk) : chunk, delimiter, breaks);
      first = false;
      if (pending.length < retryAt) continue;
      const parsed = new Papa.Parser({ delimiter, newline: '\n' }).parse(pending, 0, true);
      const cursor = parsed.meta.cursor;
      pending = pending.slice(cursor);
      retryAt = cursor === 0 ? pending.length * 2 : 0;
      if (pending.length > MAX_ROW_CHARS) {
        throw inputError(`Cannot read \`${path}\`: the row starting on line ${line} runs on for more than ${MAX_ROW_CHARS} characters; a quote is probably not closed (double quotes inside a field as "") or the file is not ${delimiter === '\t' ? 'tab' : `\`${delimiter}\``}-delimited text.`);
      }
      const items = emit(parsed.data as string[][], parsed.errors);
      if (items.length > 0) yield items;
    }
    pending += normalizeLineBreaks('', delimiter, breaks, true);
    if (pending !== '') {
      const parsed = new Papa.Parser({ delimiter, newline: '\n' }).parse(pending, 0, false);
      pending = '';
      const items = emit(parsed.data as string[][], parsed.errors);
      if (items.length > 0) yield items;
    }
    if (!header) throw inputError(`Cannot read \`${path}\`: the file is empty; expected a header row and at least one data row.`);
  } finally {
    await chunks.return(undefined);
  }
}

/**
 * Where JSON.parse stopped, from its error (` at character 13`), or nothing: its message is not
 * shown, since V8 quotes the text it could not read (a participant's words).
 */
function jsonErrorPlace(error: unknown): string {
  const position = /position (\d+)/.exec((error as Error).message);
  return position ? ` at character ${Number(position[1]) + 1}` : '';
}


/** A JSON value nested deeper than this (objects and arrays) makes its row `bad_json`: no mapped field is that deep. */
const MAX_JSON_DEPTH = 64;

/** True when `value` holds objects or arrays nested more than `limit` deep (checked without recursion). */
function nestedDeeper(value: unknown, limit: number): boolean {
  const stack: Array<[unknown, number]> = [[value, 1]];
  while (stack.length > 0) {
    const [v, depth] = stack.pop() as [unknown, number];
    if (v === null || typeof v !== 'object') continue;
    if (depth > limit) return true;
    for (const child of Object.values(v as object)) if (child !== null && typeof child === 'object') stack.push([child, depth + 1]);
  }
  return false;
}

/** The fields of a JSON object as text (nested values as JSON); 'deep' when nested beyond MAX_JSON_DEPTH; undefined when not an object. */
function toRecord(value: unknown): Record<string, string> | 'deep' | undefined {
  if (value === null || typeof value !== 'object' || Array.isArray(value)) return undefined;
  if (nestedDeeper(value, MAX_JSON_DEPTH)) return 'deep';
  const record: Record<string, string> = {};
  for (const [key, v] of Object.entries(value as Record<string, unknown>)) {
    if (v === null || v === undefined) record[key] = '';
    else if (typeof v === 'object') record[key] = JSON.stringify(v);
    else record[key] = String(v);
  }
  return record;
}

const DEEP_JSON_MESSAGE = `the line holds JSON nested more than ${MAX_JSON_DEPTH} levels deep; flatten the object so that each entry's fields are at most a few levels deep`;

/** Reads JSON Lines: one object per line; blank lines are skipped, bad lines rejected. */
async function* readJsonLines(source: TableFile, maxField: number, onBytes?: (bytes: Buffer) => void): AsyncGenerator<RecordItem[]> {
  const path = source.path;
  const file = basename(path);
  const lines = createInterface({ input: Readable.from(readTextChunks(source, onBytes)), crlfDelay: Infinity });
  let line = 0;
  let headerSent = false;
  let items: RecordItem[] = [];
  for await (const raw of lines) {
    if (items.length >= JSON_BATCH) {
      yield items;
      items = [];
    }
    line++;
    const text = line === 1 ? stripBom(raw) : raw;
    if (text.trim() === '') continue;
    if (!headerSent) {
      headerSent = true;
      items.push({ kind: 'header', columns: [], source: { file, line } });
    }
    let parsed: unknown;
    try {
      parsed = JSON.parse(text);
    } catch (error) {
      items.push(reject(file, line, 'bad_json', `the line is not valid JSON${jsonErrorPlace(error)}; each line must hold one JSON object`));
      continue;
    }
    const record = toRecord(parsed);
    if (record === 'deep') {
      items.push(reject(file, line, 'bad_json', DEEP_JSON_MESSAGE));
      continue;
    }
    if (!record) {
      items.push(reject(file, line, 'bad_json', 'the line holds JSON that is not an object; each line must hold one JSON object such as {"person": …, "time": …, "text": …}'));
      continue;
    }
    const problem = fieldProblem(Object.values(record), maxField);
    if (problem) {
      items.push(reject(file, line, problem.code, problem.message));
      continue;
    }
    items.push({ kind: 'record', record, source: { file, line } });
  }
  if (items.length > 0) yield items;
  if (!headerSent) throw inputError(`Cannot read \`${path}\`: the file holds no JSON lines; expected one JSON object per line.`);
}

/**
 * Reads a JSON array of objects. The whole file is parsed at once (JSON arrays cannot be
 * streamed without a streaming parser); prefer JSON Lines for large inputs. Line numbers are
 * the 1-based position of each element in the array.
 */
async function* readJsonArray(source: TableFile, maxField: number, onBytes?: (bytes: Buffer) => void): AsyncGenerator<RecordItem[]> {
  const path = source.path;
  const file = basename(path);
  const bytes = await source.bytes();
  onBytes?.(bytes);
  const decoder = textDecoder(textEncoding(bytes));
  const text = stripBom(decoder.write(bytes) + decoder.end());
  let parsed: unknown;
  try {
    parsed = JSON.parse(text);
  } catch (error) {
    throw inputError(`Cannot read \`${path}\`: not valid JSON${jsonErrorPlace(error)}; expected an array of objects, or use JSON Lines (.jsonl).`);
  }
  if (!Array.isArray(parsed)) throw inputError(`Cannot read \`${path}\`: the JSON is not an array; expected [ {…}, {…} ] with one object per entry.`);
  let items: RecordItem[] = [{ kind: 'header', columns: [], source: { file, line: 1 } }];
  for (let i = 0; i < parsed.length; i++) {
    if (items.length >= JSON_BATCH) {
      yield items;
      items = [];
    }
    const record = toRecord(parsed[i]);
    if (record === 'deep') {
      items.push(reject(file, i + 1, 'bad_json', DEEP_JSON_MESSAGE));
      continue;
    }
    if (!record) {
      items.push(reject(file, i + 1, 'bad_json', `element ${i + 1} of the array is not an object; each element must be an object such as {"person": …, "time": …, "text": …}`));
      continue;
    }
    const problem = fieldProblem(Object.values(record), maxField);
    if (problem) {
      items.push(reject(file, i + 1, problem.code, problem.message));
      continue;
    }
    items.push({ kind: 'record', record, source: { file, line: i + 1 } });
  }
  yield items;
}
