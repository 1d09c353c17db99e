import { join } from 'node:path';
import { availableParallelism } from 'node:os';
import { analyseDynamics, crossMapSettings, type DynamicsOptions, type DynamicsResult } from '../dynamics/analyse-dynamics.js';
import { CROSS_MAP_NS_PER_UNIT, crossMapWork } from '../dynamics/cross-map-cost.js';
import type { PersonCrossMaps } from '../dynamics/person-cross-maps.js';
import { dynamicsColumn } from '../dynamics/dynamics-column.js';
import { dynamicsTables } from '../dynamics/dynamics-tables.js';
import { parseSeriesCsv } from '../dynamics/parse-series-csv.js';
import { inputError, usageError } from '../errors.js';
import { csvDocument } from '../report/csv.js';
import { tableResource, type TableResource } from '../report/data-dictionary.js';
import type { PersonSeriesInput } from '../dynamics/types.js';
import type { Diagnostic } from '../types.js';
import { writeFileAtomic } from './atomic-write.js';
import { diagnosticText } from '../privacy/diagnostic-text.js';
import { autoCrossMapWorkers, crossMapPersons, crossMapWorkersAvailable } from './ccm-pool.js';
import { ownTableFile } from './own-table-file.js';

/** Self-reports aggregated into the series' bins, keyed `person + '\u0000' + bin_start`. */
export interface RatingsByBin {
  columns: string[];
  byBin: ReadonlyMap<string, Readonly<Record<string, number | undefined>>>;
}

/** Adds rating columns to a person's series, bin by bin (bins without a self-report stay missing). */
function withRatings(person: PersonSeriesInput, ratings: RatingsByBin): PersonSeriesInput {
  const values: Record<string, (number | undefined)[]> = { ...(person.values as Record<string, (number | undefined)[]>) };
  for (const column of ratings.columns) {
    values[column] = person.t.map((_, i) => ratings.byBin.get(`${person.person}\u0000${person.binStart?.[i] ?? ''}`)?.[column]);
  }
  return { ...person, values };
}

/** What runDynamics tells about its progress (the cli prints it). */
export type DynamicsProgress =
  | { kind: 'start'; persons: number; directions: number; workers: number; estimatedSeconds: number }
  | { kind: 'person'; done: number; total: number; elapsedMs: number };

/** Options of {@link runDynamics} beyond the analyses'. */
export interface RunDynamicsOptions {
  /** Worker threads for cross mapping (default `auto`: one per core, at most 4, for runs of more than a couple of seconds). */
  workers?: number | 'auto';
  onProgress?: (event: DynamicsProgress) => void;
}

export interface RunDynamicsResult {
  result: DynamicsResult;
  persons: number;
  variables: string[];
  diagnostics: Diagnostic[];
  files: string[];
  resources: TableResource[];
}

/**
 * Reads a long series CSV, runs the dynamics analyses and writes `dynamics-*.csv` and
 * `dynamics.json` into `out` (atomically). Self-reports aggregated into the same bins may be
 * added as further variables (`ratings`); a rating lag pair needs both bins observed
 * (`lag_valid`) and both self-reports present. `options.variables` defaults to every score column;
 * unknown variables or pairs are usage errors that list the columns. Cross mapping runs in worker
 * threads (`run.workers`, crossMapPersons) with the same results as in one thread; `run.onProgress`
 * hears the estimated time before it starts and each person as it is done.
 */
export async function runDynamics(
  seriesPath: string,
  out: string,
  options: Omit<DynamicsOptions, 'variables'> & { variables?: string[] },
  ratings?: RatingsByBin,
  run: RunDynamicsOptions = {},
): Promise<RunDynamicsResult> {
  let text: string;
  try {
    text = (await (await ownTableFile(seriesPath)).bytes()).toString('utf8');
  } catch {
    throw inputError(`Cannot read \`${seriesPath}\`: no such file or it is not readable; give the long series CSV written by \`lexichron series\``);
  }
  const parsed = parseSeriesCsv(text, seriesPath);
  if (ratings) {
    parsed.persons = parsed.persons.map((p) => withRatings(p, ratings));
    parsed.scores = [...parsed.scores, ...ratings.columns.filter((c) => !parsed.scores.includes(c))];
  }
  const known = new Set(parsed.scores);
  const list = parsed.scores.map((s) => `\`${s}\``).join(', ');
  const variables = options.variables ?? parsed.scores;
  for (const v of variables) if (!known.has(v)) throw usageError(`Dynamics: \`${v}\` is not a score column of \`${seriesPath}\`; the columns are ${list}`);
  for (const [a, b] of options.pairs ?? []) {
    for (const v of [a, b]) if (!known.has(v)) throw usageError(`Dynamics: --pair \`${a}:${b}\` names \`${v}\`, which is not a score column of \`${seriesPath}\`; the columns are ${list} (in a study file: dynamics.pairs)`);
    if (a === b) throw usageError(`Dynamics: the pair \`${a}:${b}\` pairs a column with itself; name two different columns`);
  }
  const analysis = { ...options, variables };
  let crossMaps: PersonCrossMaps[] | undefined;
  const settings = crossMapSettings(parsed.persons, analysis);
  if (!options.skipCrossMapping && settings.pairs.length > 0 && parsed.persons.length > 0) {
    let work = 0;
    for (const person of parsed.persons) work += crossMapWork(person, settings);
    const workers = run.workers === undefined || run.workers === 'auto' ? autoCrossMapWorkers(parsed.persons.length, work) : run.workers;
    const threads = workers > 0 && crossMapWorkersAvailable() ? workers : 0;
    const estimatedSeconds = (work * CROSS_MAP_NS_PER_UNIT) / 1e9 / Math.max(1, Math.min(threads, availableParallelism()));
    run.onProgress?.({ kind: 'start', persons: parsed.persons.length, directions: 2 * settings.pairs.length, workers: threads, estimatedSeconds });
    const started = performance.now();
    crossMaps = await crossMapPersons(parsed.persons, settings, threads, (done, total) => run.onProgress?.({ kind: 'person', done, total, elapsedMs: performance.now() - started }));
  }
  const result = analyseDynamics(parsed.persons, { ...analysis, ...(crossMaps ? { crossMaps } : {}) });
  const files: string[] = [];
  const resources: TableResource[] = [];
  for (const table of dynamicsTables(result)) {
    await writeFileAtomic(join(out, table.file), csvDocument(table.header, table.rows));
    files.push(table.file);
    const resource = tableResource(table.file.replace(/\.csv$/, ''), table.file, table.header, undefined, table.description);
    resources.push({ ...resource, schema: { fields: table.header.map(dynamicsColumn), missingValues: [''] } });
  }
  await writeFileAtomic(join(out, 'dynamics.json'), JSON.stringify({ tool: 'lexichron dynamics', diagnostics: parsed.diagnostics.map((d) => ({ ...d, message: diagnosticText(d.message) })), ...result }, null, 2) + '\n');
  files.push('dynamics.json');
  return { result, persons: parsed.persons.length, variables, diagnostics: parsed.diagnostics, files, resources };
}
