import type { Command } from 'commander';
import { readFile } from 'node:fs/promises';
import { join } from 'node:path';
import { analyseDynamics, type DynamicsOptions } from '../dynamics/analyse-dynamics.js';
import { dynamicsColumn } from '../dynamics/dynamics-column.js';
import { dynamicsTables } from '../dynamics/dynamics-tables.js';
import { parseSeriesCsv } from '../dynamics/parse-series-csv.js';
import { inputError, usageError } from '../errors.js';
import { writeFileAtomic } from '../io/atomic-write.js';
import { csvDocument } from '../report/csv.js';
import { dataPackage, tableResource, type TableResource } from '../report/data-dictionary.js';

const collect = (value: string, previous: string[] = []): string[] => [...previous, value];

function wholeNumber(flag: string, min: number): (value: string) => number {
  return (value: string) => {
    const v = Number(value);
    if (!/^\d+$/.test(value.trim()) || v < min) throw usageError(`${flag} \`${value}\` is not a whole number of at least ${min}`);
    return v;
  };
}

/** `lexichron dynamics SERIES --out DIR`: inertia, instability, cross-lagged VAR(1) and convergent cross mapping. */
export function registerDynamics(program: Command): void {
  program
    .command('dynamics')
    .description('describe how each person’s series move (MSSD, autocorrelation) and which variable drives which (VAR(1), convergent cross mapping)')
    .argument('<series>', 'long series CSV written by `lexichron series`')
    .requiredOption('-o, --out <dir>', 'folder for dynamics-*.csv, dynamics.json and datapackage.json')
    .option('--variables <list>', 'comma-separated series columns to analyse (default: every score column)')
    .option('--pair <A:B>', 'restrict the cross analyses (VAR(1), CCM) to this pair; repeat for more', collect)
    .option('--min-pairs <n>', 'valid lag pairs a series needs to be flagged ready (and usable points for CCM)', wholeNumber('--min-pairs', 1), 50)
    .option('--embedding <E>', 'fix the CCM embedding dimension instead of choosing it by forecast skill', wholeNumber('--embedding', 1))
    .option('--max-embedding <E>', 'largest embedding dimension tried when choosing', wholeNumber('--max-embedding', 1), 8)
    .option('--tau <bins>', 'embedding delay in bins', wholeNumber('--tau', 1), 1)
    .option('--exclusion-radius <bins>', 'library points this close in time to a predicted point are skipped', wholeNumber('--exclusion-radius', 0), 0)
    .option('--library-sizes <n>', 'number of library sizes from the smallest to all points', wholeNumber('--library-sizes', 2), 10)
    .option('--libraries <n>', 'random libraries per library size', wholeNumber('--libraries', 1), 100)
    .option('--surrogates <n>', 'surrogates of each kind (shuffle, seasonal) for the CCM p-values; 0 skips the test', wholeNumber('--surrogates', 0), 100)
    .option('--season <bins>', 'cycle length in bins for seasonal surrogates (default: bin of the day, or 7 for daily bins)', wholeNumber('--season', 2))
    .option('--stack', 'also cross map all persons stacked end to end (breaks between persons)')
    .option('--no-cross-mapping', 'skip convergent cross mapping')
    .option('--seed <seed>', 'seed of every random step', '1')
    .action(async (seriesPath: string, opts: Record<string, unknown>) => {
      let text: string;
      try {
        text = await readFile(seriesPath, 'utf8');
      } catch {
        throw inputError(`Cannot read \`${seriesPath}\`: no such file or it is not readable; give the long series CSV written by \`lexichron series\``);
      }
      const parsed = parseSeriesCsv(text, seriesPath);
      const variables = opts.variables === undefined ? parsed.scores : String(opts.variables).split(',').map((s) => s.trim()).filter(Boolean);
      const known = new Set(parsed.scores);
      for (const v of variables) if (!known.has(v)) throw usageError(`--variables names \`${v}\`, which is not a score column of \`${seriesPath}\`; the columns are ${parsed.scores.map((s) => `\`${s}\``).join(', ')}`);
      const pairs = (opts.pair as string[] | undefined)?.map((p): [string, string] => {
        const parts = p.split(':');
        if (parts.length !== 2 || !parts[0] || !parts[1]) throw usageError(`--pair \`${p}\` is not of the form A:B, e.g. --pair vader.compound:mood`);
        for (const v of parts) if (!known.has(v)) throw usageError(`--pair \`${p}\` names \`${v}\`, which is not a score column of \`${seriesPath}\`; the columns are ${parsed.scores.map((s) => `\`${s}\``).join(', ')}`);
        if (parts[0] === parts[1]) throw usageError(`--pair \`${p}\` pairs a column with itself; name two different columns`);
        return [parts[0], parts[1]];
      });
      const options: DynamicsOptions = {
        variables,
        ...(pairs ? { pairs } : {}),
        minLagPairs: opts.minPairs as number,
        ccm: {
          ...(opts.embedding !== undefined ? { E: opts.embedding as number } : {}),
          maxE: opts.maxEmbedding as number,
          tau: opts.tau as number,
          exclusionRadius: opts.exclusionRadius as number,
          librarySizeCount: opts.librarySizes as number,
          samples: opts.libraries as number,
          surrogates: opts.surrogates as number,
        },
        skipCrossMapping: opts.crossMapping === false,
        stack: Boolean(opts.stack),
        ...(opts.season !== undefined ? { seasonPeriod: opts.season as number } : {}),
        seed: /^\d+$/.test(String(opts.seed)) ? Number(opts.seed) : String(opts.seed),
      };
      const result = analyseDynamics(parsed.persons, options);
      const out = String(opts.out);
      const tables = dynamicsTables(result);
      const resources: TableResource[] = [];
      for (const table of tables) {
        await writeFileAtomic(join(out, table.file), csvDocument(table.header, table.rows));
        const resource = tableResource(table.file.replace(/\.csv$/, ''), table.file, table.header, undefined, table.description);
        resources.push({ ...resource, schema: { fields: table.header.map(dynamicsColumn), missingValues: [''] } });
      }
      await writeFileAtomic(join(out, 'dynamics.json'), JSON.stringify({ tool: 'lexichron dynamics', input: seriesPath, diagnostics: parsed.diagnostics, ...result }, null, 2) + '\n');
      await writeFileAtomic(join(out, 'datapackage.json'), JSON.stringify(dataPackage('lexichron-dynamics', 'lexichron dynamics', resources), null, 2) + '\n');
      const ready = result.summaries.filter((s) => s.ready).length;
      const converging = result.ccm.filter((c) => c.converges).length;
      process.stderr.write(
        `${parsed.persons.length} persons × ${variables.length} variables: ${ready} of ${result.summaries.length} series ready (≥ ${options.minLagPairs} lag pairs); ` +
          `${result.options.pairs.length} pairs; CCM directions converging: ${converging} of ${result.ccm.length}` +
          (parsed.diagnostics.length > 0 ? `; ${parsed.diagnostics.length} row problems (see dynamics.json)` : '') +
          `\nout: ${out}\n`,
      );
    });
}
