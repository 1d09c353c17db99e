import Papa from 'papaparse';
import { restoreCell } from '../report/csv.js';

/** A line-by-line filter that removes one person's rows from a CSV, TSV or JSON Lines file. */
export interface PersonRowFilter {
  /** Feeds one physical line (without its line end); returns the lines to write (none while a quoted field spans lines). */
  push(line: string): string[];
  /** Lines still held at the end (an unclosed quoted field is written back unchanged). */
  end(): string[];
  /** Rows removed so far. */
  readonly removed: number;
  /** For CSV/TSV: whether the header has a `person` column or a diagnostics `message` column (known after the first record); always true for JSON Lines. */
  readonly hasPersonColumn: boolean;
}

function quoteCount(text: string): number {
  let n = 0;
  for (let i = text.indexOf('"'); i !== -1; i = text.indexOf('"', i + 1)) n++;
  return n;
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

/** The fields of one CSV/TSV record (possibly spanning lines), read by papaparse (RFC 4180 quoting for CSV; none for TSV). */
function fieldsOf(record: string, format: 'csv' | 'tsv'): string[] {
  const parsed = Papa.parse<string[]>(record, format === 'tsv' ? { delimiter: '\t', quoteChar: '\u0000', newline: '\n' } : { delimiter: ',', newline: '\n' });
  return (parsed.data[0] as string[] | undefined) ?? [];
}

/**
 * Creates a filter that removes the rows of a person from a file, line by line, leaving every
 * other line byte for byte as it was. A row is the person's only through a person value:
 * - CSV (`,`) and TSV (tab) with a header: rows whose `person` column equals one of `ids` (records
 *   spanning lines inside RFC 4180 quotes are kept together and read with papaparse); without a
 *   `person` column, rows of a diagnostics table whose `message` column names the person as this
 *   tool's diagnostics do (personMentionPattern); any other table is left alone;
 * - JSON Lines: lines holding an object whose `person` equals one of `ids`; other lines are kept.
 */
export function createPersonRowFilter(ids: ReadonlySet<string>, format: 'csv' | 'tsv' | 'jsonl'): PersonRowFilter {
  let removed = 0;
  let personIndex: number | undefined;
  let messageIndex: number | undefined;
  let header = true;
  let held: string[] = [];
  let quotes = 0;
  const mention = personMentionPattern(ids);
  const filter: PersonRowFilter = {
    get removed() {
      return removed;
    },
    get hasPersonColumn() {
      return format === 'jsonl' || personIndex !== undefined || messageIndex !== undefined;
    },
    push(line) {
      if (format === 'jsonl') {
        const trimmed = line.trim();
        if (trimmed.startsWith('{')) {
          try {
            const value = JSON.parse(trimmed) as { person?: unknown };
            if (typeof value.person === 'string' && ids.has(value.person)) {
              removed++;
              return [];
            }
          } catch {
            // not JSON: keep the line as it is
          }
        }
        return [line];
      }
      held.push(line);
      quotes += format === 'csv' ? quoteCount(line) : 0;
      if (quotes % 2 === 1) return [];
      const lines = held;
      held = [];
      quotes = 0;
      const fields = fieldsOf(lines.join('\n'), format);
      if (header) {
        header = false;
        const names = fields.map((f) => f.trim());
        const person = names.indexOf('person');
        const message = names.indexOf('message');
        if (person >= 0) personIndex = person;
        else if (message >= 0) messageIndex = message;
        return lines;
      }
      const own =
        personIndex !== undefined
          ? ids.has(restoreCell((fields[personIndex] ?? '').trim()))
          : messageIndex !== undefined && mention !== undefined && mention.test(fields[messageIndex] ?? '');
      if (own) {
        removed++;
        return [];
      }
      return lines;
    },
    end() {
      const lines = held;
      held = [];
      return lines;
    },
  };
  return filter;
}
