import type { Command } from 'commander';
import { join } from 'node:path';
import type { DynamicsOptions } from '../dynamics/analyse-dynamics.js';
import type { Season } from '../dynamics/calendar-phase.js';
import { usageError } from '../errors.js';
import { writeFileAtomic } from '../io/atomic-write.js';
import { runDynamics } from '../io/run-dynamics.js';
import { readBinRatings } from '../io/read-bin-ratings.js';
import { dataPackage } from '../report/data-dictionary.js';
import { parseWorkers } from './common-options.js';
import { crossMapProgress } from './cross-map-progress.js';

const collect = (value: string, previous: string[] = []): string[] => [...previous, value];

const SEASONS: readonly Season[] = ['auto', 'day', 'week', 'none'];

function season(value: string): Season {
  if (!(SEASONS as readonly string[]).includes(value)) throw usageError(`--season \`${value}\` is not a cycle; use auto, day, week or none`);
  return value as Season;
}

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
    .option('--ratings-by-bin <file>', 'add self-reports as variables: the validation-pairs.csv written by `lexichron validate --align bins` (name the columns with --rating)')
    .option('--rating <column>', 'a rating column of --ratings-by-bin to add (repeatable)', collect)
    .option('--pair <A:B>', 'restrict the cross analyses (VAR(1), CCM) to this pair; repeat for more', collect)
    .option('--min-pairs <n>', 'valid lag pairs a series needs to be flagged ready (and usable points for CCM)', wholeNumber('--min-pairs', 1), 50)
    .option('--embedding <E>', 'fix the CCM embedding dimension instead of choosing it by forecast skill', wholeNumber('--embedding', 1))
    .option('--max-embedding <E>', 'largest embedding dimension tried when choosing', wholeNumber('--max-embedding', 1), 8)
    .option('--tau <bins>', 'embedding delay in bins', wholeNumber('--tau', 1), 1)
    .option('--exclusion-radius <bins>', 'library points this close in time to a predicted point are skipped (default: the larger of E × tau and the series’ decorrelation time)', wholeNumber('--exclusion-radius', 0))
    .option('--library-sizes <n>', 'number of library sizes from the smallest to all points', wholeNumber('--library-sizes', 2), 10)
    .option('--libraries <n>', 'random libraries per library size', wholeNumber('--libraries', 1), 100)
    .option('--surrogates <n>', 'surrogates of each kind (phase-randomised, seasonal) for the CCM tests; 0 skips them', wholeNumber('--surrogates', 0), 99)
    .option('--season <cycle>', 'calendar cycle the seasonal surrogates keep: auto (hour of the day for bins under a day, weekday for daily bins), day, week or none', season, 'auto')
    .option('--lag-scan <bins>', 'also cross map at lags -N…N and flag directions whose skill peaks at lag 0 or later (Ye et al. 2015)', wholeNumber('--lag-scan', 0), 0)
    .option('--stack', 'also cross map all persons stacked end to end (breaks between persons)')
    .option('--no-cross-mapping', 'skip convergent cross mapping')
    .option('--seed <seed>', 'seed of every random step', '1')
    .option('--workers <n>', 'cross-mapping threads: a number (0 = this thread only) or auto (one per core, at most 4, for runs of more than a few seconds)', 'auto')
    .action(async (seriesPath: string, opts: Record<string, unknown>) => {
      const pairs = (opts.pair as string[] | undefined)?.map((p): [string, string] => {
        const parts = p.split(':');
        if (parts.length !== 2 || !parts[0] || !parts[1]) throw usageError(`--pair \`${p}\` is not of the form A:B, e.g. --pair vader.compound:daily-constructs.worry_per100w (self-reports such as mood need --ratings-by-bin)`);
        return [parts[0], parts[1]];
      });
      const options: Omit<DynamicsOptions, 'variables'> & { variables?: string[] } = {
        ...(opts.variables === undefined ? {} : { variables: String(opts.variables).split(',').map((s) => s.trim()).filter(Boolean) }),
        ...(pairs ? { pairs } : {}),
        minLagPairs: opts.minPairs as number,
        ccm: {
          ...(opts.embedding !== undefined ? { E: opts.embedding as number } : {}),
          maxE: opts.maxEmbedding as number,
          tau: opts.tau as number,
          ...(opts.exclusionRadius !== undefined ? { exclusionRadius: opts.exclusionRadius as number } : {}),
          librarySizeCount: opts.librarySizes as number,
          samples: opts.libraries as number,
          surrogates: opts.surrogates as number,
          lagScan: opts.lagScan as number,
        },
        skipCrossMapping: opts.crossMapping === false,
        stack: Boolean(opts.stack),
        season: opts.season as Season,
        seed: /^\d+$/.test(String(opts.seed)) ? Number(opts.seed) : String(opts.seed),
      };
      const out = String(opts.out);
      const ratings = opts.ratingsByBin ? await readBinRatings(String(opts.ratingsByBin), (opts.rating as string[] | undefined)?.flatMap((r) => r.split(',')) ?? []) : undefined;
      const workers = parseWorkers(String(opts.workers));
      const { result, persons, variables, diagnostics, resources } = await runDynamics(seriesPath, out, options, ratings, { workers, onProgress: crossMapProgress() });
      await writeFileAtomic(join(out, 'datapackage.json'), JSON.stringify(dataPackage('lexichron-dynamics', 'lexichron dynamics', resources), null, 2) + '\n');
      const ready = result.summaries.filter((s) => s.ready).length;
      const drives = result.ccm.filter((c) => c.verdict === 'drives').length;
      const sameBin = result.ccm.filter((c) => c.verdict === 'same_bin').length;
      const unskilled = result.embedding.filter((e) => e.note !== undefined).length;
      process.stderr.write(
        `${persons} persons × ${variables.length} variables: ${ready} of ${result.summaries.length} series ready (≥ ${options.minLagPairs ?? 50} lag pairs); ` +
          `${result.options.pairs.length} pairs; CCM directions with evidence of driving: ${drives} of ${result.ccm.length}` +
          (sameBin > 0 ? ` (${sameBin} more peak at lag 0 or later: a common driver in the same bin is as likely)` : '') +
          (unskilled > 0 ? `; ${unskilled} series without a positive forecast skill at any E, whose cross maps say little (see the embedding notes in dynamics.json)` : '') +
          (diagnostics.length > 0 ? `; ${diagnostics.length} row problems (see dynamics.json)` : '') +
          `\nout: ${out}\n`,
      );
    });
}
