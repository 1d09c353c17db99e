import { usageError } from '../errors.js';
import { describeColumns, headerLooksLikeData } from '../privacy/describe-columns.js';

/** Which input column holds each field of an entry. */
export interface ColumnMapping {
  person: string;
  time: string;
  text: string;
  /** Absent: ids are `<file>:<line>` unless a column named `id` exists. */
  id?: string;
  /** Absent: a column named `zone` is used when present. */
  zone?: string;
}

const FIELDS = ['person', 'time', 'text', 'id', 'zone'] as const;

/**
 * Parses `person=COL,time=COL,text=COL[,id=COL][,zone=COL]` (the `--columns` option) over the
 * defaults person, time, text. Throws a usage error naming the bad part.
 */
export function parseColumnMapping(spec: string | undefined): ColumnMapping {
  const mapping: ColumnMapping = { person: 'person', time: 'time', text: 'text' };
  if (!spec) return mapping;
  for (const part of spec.split(',')) {
    const [key, ...rest] = part.split('=');
    const field = (key ?? '').trim();
    const column = rest.join('=').trim();
    if (!(FIELDS as readonly string[]).includes(field) || column === '') {
      throw usageError(`Cannot read --columns \`${spec}\`: \`${part}\` is not FIELD=COLUMN with FIELD one of ${FIELDS.join(', ')}; for example --columns person=participant,time=sent_at,text=body`);
    }
    mapping[field as (typeof FIELDS)[number]] = column;
  }
  return mapping;
}

/**
 * Checks a table header against a mapping; returns the mapping completed with `id` and `zone`
 * columns found by their default names, or throws an error that lists what is missing, what the
 * header holds, and (when the header looks split by another delimiter) which delimiter to use.
 */
export function resolveColumns(mapping: ColumnMapping, header: readonly string[], file: string, needText = true): ColumnMapping {
  const wanted: Array<[string, string]> = [['person', mapping.person], ['time', mapping.time]];
  if (needText) wanted.push(['text', mapping.text]);
  if (mapping.id) wanted.push(['id', mapping.id]);
  if (mapping.zone) wanted.push(['zone', mapping.zone]);
  const missing = wanted.filter(([, column]) => !header.includes(column));
  if (missing.length > 0) {
    const only = header.length === 1 ? header[0] ?? '' : '';
    const delimiter = [';', '\t', '|', ','].find((d) => only.includes(d));
    const hint = delimiter
      ? ` The header is one column that contains \`${delimiter === '\t' ? '\\t' : delimiter}\`: the file seems to use another delimiter; pass --delimiter '${delimiter === '\t' ? '\\t' : delimiter}'.`
      : ` Map your columns with --columns ${missing.map(([f]) => `${f}=COLUMN`).join(',')}.`;
    throw usageError(`Cannot read \`${file}\`: no column ${missing.map(([f, c]) => `\`${c}\` (${f})`).join(', ')}; the header has ${describeColumns(header)}.${headerLooksLikeData(header) ? '' : hint}`);
  }
  return {
    ...mapping,
    id: mapping.id ?? (header.includes('id') ? 'id' : undefined),
    zone: mapping.zone ?? (header.includes('zone') ? 'zone' : undefined),
  };
}
