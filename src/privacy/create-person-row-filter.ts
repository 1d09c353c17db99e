import Papa from 'papaparse';
import { restoreCell } from '../report/csv.js';

/**
 * A filter that removes one person's rows from a CSV, TSV or JSON Lines file read piece by piece:
 * every row it keeps comes out byte for byte, with its own line end.
 */
export interface PersonRowFilter {
  /** Feeds the next piece of the file's text (any length); returns the text to write: the whole records it completed that are kept. */
  push(text: string): string;
  /** The text still held at the end of the file (a last record without a line end; an unclosed quoted field is read to the end). */
  end(): string;
  /** Rows removed so far. */
  readonly removed: number;
  /** For CSV/TSV: whether the header has a `person` column or a diagnostics `message` column (known after the first record); always true for JSON Lines. */
  readonly hasPersonColumn: boolean;
}

function escapeRegExp(text: string): string {
  return text.replace(/[.*+?^${}()|[\]\\]/g, '\\$&');
}

/**
 * How a diagnostic message of this tool names a person: "person `ID`" or "the self-report of `ID`"
 * (validation and dynamics diagnostics). Only this form counts: an id that appears in a message as
 * a column name, a word of the text or anything else is not the person.
 */
export function personMentionPattern(ids: Iterable<string>): RegExp | undefined {
  const list = [...ids].filter((id) => id !== '').map(escapeRegExp);
  return list.length === 0 ? undefined : new RegExp(`(?:\\bperson|\\bself-report of) \`(?:${list.join('|')})\``, 'u');
}

/**
 * Creates a filter that removes the rows of a person from a file, leaving every other byte as it
 * was. A row is the person's only through a person value:
 * - CSV (`,`) and TSV (tab) with a header, read by papaparse (RFC 4180 quoting for CSV, so a
 *   quoted field may hold commas, quotes and line breaks; no quoting for TSV): rows whose
 *   `person` column equals one of `ids`; without a `person` column, rows of a diagnostics table
 *   whose `message` column names the person as this tool's diagnostics do (personMentionPattern);
 *   any other table is left alone;
 * - JSON Lines: lines holding an object whose `person` equals one of `ids`; other lines are kept.
 */
export function createPersonRowFilter(ids: ReadonlySet<string>, format: 'csv' | 'tsv' | 'jsonl'): PersonRowFilter {
  let removed = 0;
  let personIndex: number | undefined;
  let messageIndex: number | undefined;
  let header = true;
  let pending = '';
  /** The file's line end, as papaparse found it in the first complete record (then kept for the whole file). */
  let linebreak: string | undefined;
  const mention = personMentionPattern(ids);

  /** Whether a CSV/TSV record (its fields) is the person's; the first record is the header. */
  const isOwnRecord = (fields: readonly string[]): boolean => {
    if (header) {
      header = false;
      const names = fields.map((f) => f.trim());
      const person = names.indexOf('person');
      const message = names.indexOf('message');
      if (person >= 0) personIndex = person;
      else if (message >= 0) messageIndex = message;
      return false;
    }
    return personIndex !== undefined
      ? ids.has(restoreCell((fields[personIndex] ?? '').trim()))
      : messageIndex !== undefined && mention !== undefined && mention.test(fields[messageIndex] ?? '');
  };

  const isOwnJsonLine = (line: string): boolean => {
    const trimmed = line.trim();
    if (!trimmed.startsWith('{')) return false;
    try {
      const value = JSON.parse(trimmed) as { person?: unknown };
      return typeof value.person === 'string' && ids.has(value.person);
    } catch {
      return false; // not JSON: keep the line as it is
    }
  };

  /** Filters the complete records at the start of `pending` (all of it when `final`); keeps the rest pending. */
  const take = (final: boolean): string => {
    let out = '';
    let done = 0;
    if (format === 'jsonl') {
      for (let nl = pending.indexOf('\n'); nl >= 0 || (final && done < pending.length); nl = pending.indexOf('\n', done)) {
        const stop = nl >= 0 ? nl + 1 : pending.length;
        const line = pending.slice(done, stop);
        done = stop;
        if (isOwnJsonLine(line)) removed++;
        else out += line;
      }
      pending = pending.slice(done);
      return out;
    }
    let stopped = false;
    Papa.parse<string[]>(pending, {
      delimiter: format === 'tsv' ? '\t' : ',',
      ...(format === 'tsv' ? { quoteChar: '\u0000' } : {}),
      ...(linebreak !== undefined ? { newline: linebreak as '\n' } : {}),
      step(result) {
        if (stopped) return;
        const cursor = result.meta.cursor;
        const record = pending.slice(done, cursor);
        if (record === '') return;
        const complete = final || (record.endsWith(result.meta.linebreak) && !result.errors.some((e) => e.code === 'MissingQuotes') && !(record.endsWith('\r') && cursor === pending.length));
        if (!complete) {
          stopped = true;
          return;
        }
        linebreak ??= result.meta.linebreak;
        done = cursor;
        if (isOwnRecord(result.data)) removed++;
        else out += record;
      },
    });
    pending = pending.slice(done);
    return out;
  };

  return {
    get removed() {
      return removed;
    },
    get hasPersonColumn() {
      return format === 'jsonl' || personIndex !== undefined || messageIndex !== undefined;
    },
    push(text) {
      pending += text;
      return take(false);
    },
    end() {
      return take(true);
    },
  };
}
