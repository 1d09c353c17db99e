import { Option, type Command } from 'commander';
import { relative } from 'node:path';
import { runStudy } from '../pipeline.js';
import { reconciliationText } from '../report/reconciliation-text.js';
import { inputError, usageError } from '../errors.js';
import { parseMaxRejects, progressReporter, tooManyRejects } from './common-options.js';
import { defaultStudyStages } from '../io/study-stages.js';
import { crossMapProgress } from './cross-map-progress.js';
import { SHARD_HELP, shardFrom } from './shard-option.js';

/** `lexichron run STUDY.json`: score, series and the optional stages in one command. */
export function registerRun(program: Command): void {
  program
    .command('run')
    .description('run a whole study from its study file: score, series, validation, dynamics, term audit, report')
    .argument('<study>', 'study file (JSON; see README "Study file")')
    .option('--seed <n>', 'seed for bootstrap and surrogate draws', '20261201')
    .addOption(new Option('--names <style>', 'column names of the CSV outputs: as-written, or syntactic (R and pandas accept them unquoted: afinn_165_valence); overrides the study\'s names').choices(['as-written', 'syntactic']))
    .option('--allow-symlinks', 'accept an output folder that is a symbolic link (refused by default)')
    .option('--out <dir>', 'output folder (default: the study file\'s "out"); each shard needs its own')
    .option('--shard <spec>', SHARD_HELP)
    .action(async (studyPath: string, opts: Record<string, unknown>) => {
      const progress = progressReporter('scored');
      const shard = shardFrom(opts.shard);
      if (shard && opts.out === undefined) throw usageError(`--shard ${shard.index}/${shard.count} needs --out DIR: every shard writes a folder of its own (e.g. --out parts/${shard.index}), which \`lexichron merge\` then puts together.`);
      const options = { now: new Date().toISOString(), stages: defaultStudyStages({ dynamics: { onProgress: crossMapProgress() } }), seed: Number(opts.seed), onProgress: progress.update, env: process.env, allowSymlinks: opts.allowSymlinks === true, ...(opts.out !== undefined ? { out: String(opts.out) } : {}), ...(shard ? { shard } : {}), ...(opts.names ? { names: opts.names as 'as-written' | 'syntactic' } : {}) };
      const result = await runStudy(studyPath, options).finally(progress.stop);
      process.stderr.write(`${reconciliationText(result.score.reconciliation)}\n`);
      const s = result.series;
      process.stderr.write(`series: ${s.persons} persons, ${s.bins} bins, ${s.observed} observed\n`);
      for (const warning of s.warnings) process.stderr.write(`warning: series: ${warning}\n`);
      const seriesRejected = Object.values(s.rejected).reduce((a, b) => a + b, 0);
      if (seriesRejected > 0) process.stderr.write(`series: ${seriesRejected} scores rows not used: see ${relative(process.cwd(), s.rejectsPath)}\n`);
      for (const [name, stage] of Object.entries(result.stages)) process.stderr.write(`${name}: ${stage.outputs.length} files\n`);
      if (result.report) process.stderr.write(`report: ${relative(process.cwd(), result.report.path)}\n`);
      if (shard) process.stderr.write(`shard ${shard.index}/${shard.count} done; put the shards together with \`lexichron merge SHARD_DIR... --out DIR\`\n`);
      process.stdout.write(`outputs in ${relative(process.cwd(), result.outDir) || '.'}/ (${shard ? 'shard.json' : 'manifest.json'} lists every file with its SHA-256)\n`);
      const study = result.manifest.parameters.study as { maxRejects: string };
      if (tooManyRejects(result.score.reconciliation, parseMaxRejects(study.maxRejects))) {
        throw inputError(`Too many rejected rows (limit ${study.maxRejects}); see scores.rejects.csv in the output folder for each row's reason.`);
      }
    });
}
