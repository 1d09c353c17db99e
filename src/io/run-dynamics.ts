import { readFile } from 'node:fs/promises';
import { join } from 'node:path';
import { analyseDynamics, type DynamicsOptions, type DynamicsResult } from '../dynamics/analyse-dynamics.js';
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
 * unknown variables or pairs are usage errors that list the columns.
 */
export async function runDynamics(
  seriesPath: string,
  out: string,
  options: Omit<DynamicsOptions, 'variables'> & { variables?: string[] },
  ratings?: RatingsByBin,
): Promise<RunDynamicsResult> {
  let text: string;
  try {
    text = await readFile(seriesPath, 'utf8');
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
  const result = analyseDynamics(parsed.persons, { ...options, variables });
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
