import type { Command } from 'commander';
import { usageError } from '../errors.js';
import { writeReport } from '../io/write-report.js';

/** `lexichron report OUTDIR [--score COL] [--rating COL] [--person ID] [--min-lag-pairs N] [--out FILE]` */
export function registerReport(program: Command): void {
  program
    .command('report')
    .description('write a self-contained HTML report (one file, no network) of a study output folder')
    .argument('<outdir>', 'output folder of `lexichron run` (or one holding series-long.csv and the other stages\' files)')
    .option('--score <column>', 'score drawn in the series and readiness sections (default: the first validated score, else vader.compound)')
    .option('--rating <column>', 'self-report drawn beside the score (default: the first one validated with it)')
    .option('--person <id>', 'person shown in the large series view (default: the first in id order)')
    .option('--min-lag-pairs <n>', 'usable lag pairs a person needs to count as ready for dynamic models', '50')
    .option('--title <text>', 'page title (default: the study name)')
    .option('-o, --out <file>', 'where to write the page (default: OUTDIR/report.html)')
    .action(async (outDir: string, opts: Record<string, unknown>) => {
      const minLagPairs = Number(opts.minLagPairs);
      if (!Number.isInteger(minLagPairs) || minLagPairs < 1) throw usageError(`--min-lag-pairs \`${String(opts.minLagPairs)}\` is not a whole number of 1 or more; give e.g. --min-lag-pairs 50.`);
      const result = await writeReport(outDir, {
        minLagPairs,
        ...(opts.score ? { score: String(opts.score) } : {}),
        ...(opts.rating ? { rating: String(opts.rating) } : {}),
        ...(opts.person ? { person: String(opts.person) } : {}),
        ...(opts.title ? { title: String(opts.title) } : {}),
        ...(opts.out ? { file: String(opts.out) } : {}),
      });
      for (const a of result.absent) process.stderr.write(`note: ${a.section}: ${a.reason}\n`);
      process.stdout.write(`report: ${result.path} (${Math.round(result.bytes / 1024)} KB)\n`);
    });
}
