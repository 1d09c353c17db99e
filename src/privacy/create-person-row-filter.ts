/** A line-by-line filter that removes one person's rows from a CSV, TSV or JSON Lines file. */
export interface PersonRowFilter {
  /** Feeds one physical line (without its line end); returns the lines to write (none while a quoted field spans lines). */
  push(line: string): string[];
  /** Lines still held at the end (an unclosed quoted field is written back unchanged). */
  end(): string[];
  /** Rows removed so far. */
  readonly removed: number;
  /** For CSV/TSV: whether the header has a `person` column (known after the first record); always true for JSON Lines. */
  readonly hasPersonColumn: boolean;
}

/** Splits one CSV record (possibly spanning lines) into fields, with RFC 4180 quoting. */
export function splitCsvRecord(record: string, delimiter: string): string[] {
  const fields: string[] = [];
  let field = '';
  let quoted = false;
  for (let i = 0; i < record.length; i++) {
    const c = record[i] as string;
    if (quoted) {
      if (c === '"') {
        if (record[i + 1] === '"') {
          field += '"';
          i++;
        } else quoted = false;
      } else field += c;
    } else if (c === '"' && field === '') quoted = true;
    else if (c === delimiter) {
      fields.push(field);
      field = '';
    } else field += c;
  }
  fields.push(field);
  return fields;
}

function quoteCount(text: string): number {
  let n = 0;
  for (let i = text.indexOf('"'); i !== -1; i = text.indexOf('"', i + 1)) n++;
  return n;
}

/**
 * Creates a filter that removes the rows of a person from a file, line by line, leaving every
 * other line byte for byte as it was:
 * - CSV (`,`) and TSV (tab) with a header: rows whose `person` column equals one of `ids`
 *   (records spanning lines inside RFC 4180 quotes are kept together); without a `person`
 *   column, rows with a field that names one of the ids as a whole word (`mentions`, e.g. a
 *   diagnostic message "the self-report of `p07` …"), or nothing when `mentions` is not given;
 * - JSON Lines: lines holding an object whose `person` equals one of `ids`; other lines are kept.
 */
export function createPersonRowFilter(ids: ReadonlySet<string>, format: 'csv' | 'tsv' | 'jsonl', mentions?: RegExp): PersonRowFilter {
  let removed = 0;
  let personIndex: number | undefined;
  let header = true;
  let held: string[] = [];
  let quotes = 0;
  const delimiter = format === 'tsv' ? '\t' : ',';
  const filter: PersonRowFilter = {
    get removed() {
      return removed;
    },
    get hasPersonColumn() {
      return format === 'jsonl' || personIndex !== undefined;
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
      const fields = splitCsvRecord(lines.join('\n'), delimiter);
      if (header) {
        header = false;
        const i = fields.findIndex((f) => f.trim() === 'person');
        if (i >= 0) personIndex = i;
        return lines;
      }
      if (personIndex !== undefined ? ids.has((fields[personIndex] ?? '').trim()) : mentions !== undefined && fields.some((f) => mentions.test(f))) {
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
