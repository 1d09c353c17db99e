type Json = Record<string, unknown>;
const isObject = (v: unknown): v is Json => typeof v === 'object' && v !== null && !Array.isArray(v);
const text = (v: unknown): string => (v === undefined || v === null ? '' : typeof v === 'number' ? groupDigits(v) : String(v));
const list = (v: unknown): unknown[] => (Array.isArray(v) ? v : []);

/** 1234567 → `1,234,567`; other numbers as written. */
function groupDigits(n: number): string {
  return Number.isInteger(n) ? String(n).replace(/\B(?=(\d{3})+(?!\d))/g, ',') : String(n);
}

/** `excludedEntries` or `too_few_words` → `excluded entries`, `too few words`. */
function plainWords(name: string): string {
  return name.replace(/([a-z0-9])([A-Z])/g, '$1 $2').replace(/[_-]+/g, ' ').toLowerCase().trim();
}

/** A value in words, one line: scalars as written, lists comma-separated, objects as `key=value` pairs. */
function inline(v: unknown): string {
  if (Array.isArray(v)) return v.length === 0 ? 'none' : v.every((x) => typeof x === 'number') && v.length === 2 ? `${text(v[0])} to ${text(v[1])}` : v.map(inline).join(', ');
  if (isObject(v)) {
    const entries = Object.entries(v).filter(([, x]) => x !== undefined);
    return entries.length === 0 ? 'none' : entries.map(([k, x]) => `${k}=${inline(x)}`).join(', ');
  }
  if (typeof v === 'boolean') return v ? 'yes' : 'no';
  return text(v);
}

/** Leaves of a nested object as `[dotted.path, value in words]`; a list of scalars, or a pair of numbers, is one leaf. */
function leaves(v: unknown, path: string, out: Array<[string, string]>): void {
  if (isObject(v) && Object.keys(v).length > 0) {
    for (const [k, x] of Object.entries(v)) if (x !== undefined) leaves(x, path ? `${path}.${k}` : k, out);
    return;
  }
  out.push([path, isObject(v) ? 'defaults' : inline(v)]);
}

/** A column map as the `--columns` option writes it: `person=who,time=when,text=note`. */
function columnMap(map: Json): string {
  return Object.entries(map)
    .filter(([, c]) => typeof c === 'string' && c !== '')
    .map(([field, c]) => `${field}=${String(c)}`)
    .join(',');
}

/** How one input was read: its column map, then its other options of its own (`key=value`). */
function readingOf(columns: unknown, options: Json): string {
  const parts: string[] = [];
  if (isObject(columns)) parts.push(`columns ${columnMap(columns)}`);
  for (const [k, v] of Object.entries(options)) if (k !== 'columns' && v !== undefined) parts.push(`${k} ${inline(v)}`);
  return parts.join('; ');
}

/** One file read by the run. */
export interface ProvenanceInput {
  path: string;
  /** How the file was read: its column map and any options of its own, `key=value`. */
  readWith: string;
  rows: string;
  bytes: string;
  sha256: string;
}

/** The manifest (or a scores sidecar) in the shape the provenance section shows: tables with labels in words. */
export interface ProvenanceView {
  /** What ran: label, value. */
  run: Array<[string, string]>;
  inputs: ProvenanceInput[];
  lexicons: Array<{ name: string; version: string; license: string; source: string; sha256: string }>;
  /** The study file's settings as recorded: dotted key of the study file, value. */
  settings: Array<[string, string]>;
  /** Score columns and how they were scored and binned. */
  columns: Array<{ name: string; scoredAs: string; binnedAs: string }>;
  /** One line per stage: stage, what it did in words. */
  stages: Array<[string, string]>;
  outputs: Array<{ path: string; bytes: string; sha256: string }>;
  /** Persons removed later (`lexichron forget`): pseudonymous id, time, files changed. */
  forgotten: Array<[string, string, string]>;
}

/** Keys of the study shown in their own tables (inputs, lexicons) or in the page title (name). */
const STUDY_SHOWN = new Set(['name', 'inputs', 'lexicons']);
/** Manifest keys with a table of their own, or shown in other sections (reconciliation: section 1; cautions: above). */
const MANIFEST_SHOWN = new Set(['tool', 'created', 'command', 'inputs', 'lexicons', 'parameters', 'reconciliation', 'stages', 'outputs', 'forgotten', 'cautions', 'columns', 'options']);

/** A stage's record in one line of words; what other sections show in full is only pointed to. */
function stageText(name: string, v: unknown): string {
  if (!isObject(v)) return inline(v);
  if (name === 'series') {
    const missing = isObject(v.missing) ? Object.entries(v.missing).filter(([, n]) => typeof n === 'number' && n > 0).map(([k, n]) => `${plainWords(k)} ${text(n)}`) : [];
    const rejected = isObject(v.rejected) ? Object.values(v.rejected).reduce<number>((a, n) => a + (typeof n === 'number' ? n : 0), 0) : 0;
    return `${text(v.persons)} persons, ${text(v.bins)} bins, ${text(v.observed)} with a score${missing.length ? ` (bins without: ${missing.join(', ')})` : ''}; ${text(v.entries)} entries binned, ${text(v.excludedEntries ?? 0)} excluded by hour, ${text(rejected)} scores rows left out.`;
  }
  if (name === 'validation') {
    const pairs = list(v.pairs).length;
    return `${text(pairs)} text score × self-report pairs; the statistics and how the self-reports were read and paired are in section 3.`;
  }
  if (name === 'audit') {
    return list(v.lexicons).filter(isObject).map((l) => `${text(l.name)}: ${text(l.entries)} entries audited, ${list(l.warnings).length === 0 ? 'no warnings' : `${list(l.warnings).length} warnings (section 4)`}`).join('; ') + '.';
  }
  if (typeof v.note === 'string' && Object.keys(v).length === 1) return v.note;
  return Object.entries(v).filter(([, x]) => x !== undefined).map(([k, x]) => `${plainWords(k)}: ${inline(x)}`).join('; ') + '.';
}

/**
 * The provenance of an output folder as tables with labels in words, from its manifest.json (or,
 * for the output of `lexichron score` alone, its scores sidecar, which has the same `tool`,
 * `lexicons`, `inputs` and `columns`): what ran, each input file with how it was read (its column
 * map, from the file's own record or from the study file), the word lists, the study settings as
 * dotted keys of the study file, the score columns, one line per stage, the files written and the
 * persons removed later. Nothing is shown as JSON. Pure.
 */
export function provenanceView(manifest: Readonly<Record<string, unknown>>): ProvenanceView {
  const parameters = isObject(manifest.parameters) ? manifest.parameters : {};
  const study = isObject(parameters.study) ? parameters.study : {};
  const privacy = isObject(parameters.privacy) ? parameters.privacy : isObject(manifest.options) ? manifest.options : {};
  const tool = isObject(manifest.tool) ? manifest.tool : {};
  const run: Array<[string, string]> = [];
  const add = (label: string, v: unknown): void => {
    if (v !== undefined && v !== null && v !== '') run.push([label, typeof v === 'string' ? v : inline(v)]);
  };
  add('Program', [tool.name, tool.version].filter((x) => x !== undefined).join(' '));
  add('Run at (UTC)', manifest.created);
  add('Command', manifest.command);
  if (isObject(parameters.shard)) add('Shard', `${text(parameters.shard.index)} of ${text(parameters.shard.count)}`);
  if (parameters.seed !== undefined) add('Seed of every random step', String(parameters.seed));
  if (privacy.pseudonymized !== undefined) add('Person ids', privacy.pseudonymized ? 'pseudonyms (keyed hash); input files named by position' : 'as written in the inputs');
  if (privacy.aggregatesOnly !== undefined) add('Only aggregates written', privacy.aggregatesOnly);
  if (typeof privacy.redactedNames === 'number') add('Names redacted from kept text', privacy.redactedNames);
  if (privacy.keepText !== undefined) add('Entry text kept in the outputs', privacy.keepText);
  const names = parameters.names ?? study.names;
  if (names !== undefined) add('Column names', names === 'syntactic' ? 'bare names for R and pandas (datapackage.json keeps the names lexichron writes by default)' : 'as lexichron writes them');
  const studyInputs = list(study.inputs).filter(isObject);
  const inputs = list(manifest.inputs)
    .filter(isObject)
    .map((f, k): ProvenanceInput => {
      const own = studyInputs.find((s) => s.path === f.path) ?? (k < studyInputs.length ? studyInputs[k] : undefined);
      const { path: _path, ...options } = own ?? {};
      return { path: text(f.path), readWith: readingOf(f.columns ?? options.columns, options), rows: text(f.rows), bytes: text(f.bytes), sha256: text(f.sha256) };
    });
  const lexicons = list(manifest.lexicons)
    .filter(isObject)
    .map((l) => ({ name: text(l.name), version: text(l.version), license: text(l.license), source: text(l.source), sha256: text(l.sha256) }));
  const settings: Array<[string, string]> = [];
  for (const [k, v] of Object.entries(study)) if (!STUDY_SHOWN.has(k) && v !== undefined) leaves(v, k, settings);
  for (const [k, v] of Object.entries(manifest)) if (!MANIFEST_SHOWN.has(k) && v !== undefined) leaves(v, k, settings);
  const stages = isObject(manifest.stages) ? manifest.stages : {};
  const seriesColumns = isObject(stages.series) ? list(stages.series.columns) : [];
  const columns = (seriesColumns.length ? seriesColumns : list(manifest.columns)).filter(isObject).map((c) => ({ name: text(c.name), scoredAs: text(c.aggregation), binnedAs: text(c.reducer) }));
  return {
    run,
    inputs,
    lexicons,
    settings,
    columns,
    stages: Object.entries(stages).map(([name, v]) => [name, stageText(name, v)]),
    outputs: list(manifest.outputs)
      .filter(isObject)
      .map((o) => ({ path: text(o.path), bytes: text(o.bytes), sha256: text(o.sha256) })),
    forgotten: list(manifest.forgotten)
      .filter(isObject)
      .map((f) => [text(f.person), text(f.at), list(f.files).map(text).join(', ')]),
  };
}
