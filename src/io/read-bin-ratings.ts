import Papa from 'papaparse';
import { usageError } from '../errors.js';
import { ownTableFile } from './own-table-file.js';
import type { RatingsByBin } from './run-dynamics.js';
import { describeColumns } from '../privacy/describe-columns.js';

/**
 * Reads self-reports aggregated per bin from the aligned pairs file that `lexichron validate`
 * writes with `--align bins` (`validation-pairs.csv`: person, time = the bin's local start, …,
 * then the score and rating columns), keeping the named rating columns.
 */
export async function readBinRatings(path: string, ratingColumns: readonly string[]): Promise<RatingsByBin> {
  let text: string;
  try {
    text = (await (await ownTableFile(path)).bytes()).toString('utf8');
  } catch {
    throw usageError(`Cannot read \`${path}\`: no such file; give the validation-pairs.csv that \`lexichron validate --align bins\` wrote.`);
  }
  const [header = [], ...rows] = Papa.parse<string[]>(text.replace(/^\uFEFF/, ''), { skipEmptyLines: true }).data;
  for (const needed of ['person', 'time']) {
    if (!header.includes(needed)) throw usageError(`Cannot read \`${path}\` as self-reports per bin: no column \`${needed}\`; give the validation-pairs.csv of \`lexichron validate --align bins\`.`);
  }
  if (ratingColumns.length === 0) throw usageError('Name the rating columns to add with --rating, e.g. --rating mood.');
  const missing = ratingColumns.filter((c) => !header.includes(c));
  if (missing.length > 0) throw usageError(`\`${path}\` has no column ${missing.map((m) => `\`${m}\``).join(', ')}; its columns are ${describeColumns(header)}.`);
  const at = (name: string): number => header.indexOf(name);
  const byBin = new Map<string, Record<string, number | undefined>>();
  for (const row of rows) {
    const values: Record<string, number | undefined> = {};
    for (const c of ratingColumns) {
      const cell = row[at(c)] ?? '';
      values[c] = cell === '' || !Number.isFinite(Number(cell)) ? undefined : Number(cell);
    }
    byBin.set(`${row[at('person')] ?? ''}\u0000${row[at('time')] ?? ''}`, values);
  }
  return { columns: [...ratingColumns], byBin };
}
