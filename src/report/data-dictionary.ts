/** A Table Schema field (Frictionless Data, https://specs.frictionlessdata.io/table-schema/). */
export interface SchemaField {
  name: string;
  type: 'string' | 'integer' | 'number' | 'boolean' | 'date' | 'datetime';
  format?: string;
  description: string;
}

/** A tabular data resource of a Frictionless Data Package. */
export interface TableResource {
  name: string;
  path: string;
  profile: 'tabular-data-resource';
  format: 'csv';
  mediatype: 'text/csv';
  encoding: 'utf-8';
  schema: { fields: SchemaField[]; missingValues: string[] };
}

const FIXED: Record<string, Omit<SchemaField, 'name'>> = {
  entry_id: { type: 'string', description: 'Entry id from the input (id column) or <file>:<line>' },
  person: { type: 'string', description: 'Person id (pseudonymized when a key was given)' },
  time_utc: { type: 'datetime', format: 'any', description: 'Instant of the entry, RFC 3339 in UTC' },
  time_local: { type: 'string', description: 'Local time of the entry with UTC offset, RFC 3339' },
  zone: { type: 'string', description: 'IANA time zone of the person at that time, or the fixed offset written with the time (UTC+02:00) for a person with no zone' },
  words: { type: 'integer', description: 'Word tokens (entries: of the entry; series: summed over the bin)' },
  t: { type: 'integer', description: 'Within-person time index, 0-based over every bin of the window (missing bins included)' },
  bin_start: { type: 'string', description: 'Local start of the bin with UTC offset' },
  bin_end: { type: 'string', description: 'Local end of the bin with UTC offset (exclusive)' },
  local_date: { type: 'date', description: 'Local calendar date of the bin (days start at the configured day start)' },
  day: { type: 'integer', description: 'Day number within person, 1-based from the first day of the window' },
  bin_of_day: { type: 'integer', description: 'Bin number within the local day, 1-based' },
  bin_hours: { type: 'number', description: 'Real length of the bin in hours (23 or 25 for daily bins on clock-change days)' },
  hours_since_prev: { type: 'number', description: 'Hours from the start of the previous observed bin to the start of this bin' },
  entries: { type: 'integer', description: 'Entries in the bin' },
  missing: { type: 'string', description: 'Empty when observed; otherwise no_text, too_few_words, excluded_hours, outside_window, before_first_entry or after_last_entry (inside the study window, before the first or after the last entry)' },
  lag_valid: { type: 'integer', description: '1 when bin t-1 is observed and directly adjacent, else 0: only then are the lag columns filled' },
  text: { type: 'string', description: 'Entry text (only with --keep-text; redacted)' },
  excluded: { type: 'integer', description: '1 when the entry fell in excluded hours and was not aggregated' },
  file: { type: 'string', description: 'Input file of the rejected row' },
  line: { type: 'integer', description: 'Line of the rejected row in that file (1 = header)' },
  stage: { type: 'string', description: 'Stage that rejected the row (ingest, score, series)' },
  code: { type: 'string', description: 'Fixed code of the problem (counted in the manifest reconciliation)' },
  message: { type: 'string', description: 'What was wrong with the row and how to fix it' },
};

const SUFFIXES: Array<[string, Omit<SchemaField, 'name'>]> = [
  ['.n', { type: 'number', description: 'Matched terms' }],
  ['.negated', { type: 'integer', description: 'Hits preceded by a negator within the lexicon\'s window' }],
  ['.person_mean', { type: 'number', description: 'Person mean over observed bins (between-person part)' }],
  ['.within', { type: 'number', description: 'Value minus the person mean (within-person part)' }],
  ['.within_lag1', { type: 'number', description: 'Within-person value of bin t-1; empty unless lag_valid' }],
  ['.lag1', { type: 'number', description: 'Value of bin t-1; empty unless lag_valid' }],
  ['.filled', { type: 'string', description: 'carry or linear when the value was filled; empty when observed or left missing' }],
  ['.detrended', { type: 'number', description: 'Residual from the person\'s linear trend over t (raw value kept in its own column)' }],
];

/**
 * The Table Schema field for a column of a lexichron output, with a description.
 * `describe` may supply descriptions for score columns (e.g. the lexicon and aggregation).
 */
export function describeColumn(name: string, describe?: (name: string) => string | undefined): SchemaField {
  const fixed = FIXED[name];
  if (fixed) return { name, ...fixed };
  for (const [suffix, field] of SUFFIXES) {
    if (name.endsWith(suffix)) {
      const base = name.slice(0, -suffix.length);
      return { name, ...field, description: `${field.description} (${base})` };
    }
  }
  return { name, type: 'number', description: describe?.(name) ?? `Score ${name}` };
}

/** A tabular data resource for a CSV file with the given header. */
export function tableResource(name: string, path: string, header: readonly string[], describe?: (name: string) => string | undefined, description?: string): TableResource & { description?: string } {
  return {
    name,
    path,
    profile: 'tabular-data-resource',
    format: 'csv',
    mediatype: 'text/csv',
    encoding: 'utf-8',
    ...(description ? { description } : {}),
    schema: { fields: header.map((h) => describeColumn(h, describe)), missingValues: [''] },
  };
}

/** A Frictionless Tabular Data Package descriptor (datapackage.json). */
export function dataPackage(name: string, title: string, resources: ReadonlyArray<TableResource>): Record<string, unknown> {
  return {
    profile: 'tabular-data-package',
    name: name.toLowerCase().replace(/[^a-z0-9._-]+/g, '-').replace(/^-+|-+$/g, '') || 'lexichron-study',
    title,
    resources,
  };
}
