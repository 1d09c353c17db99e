import type { Command } from 'commander';
import { relative } from 'node:path';
import { mergeShards } from '../io/merge-shards.js';
import { reconciliationText } from '../report/reconciliation-text.js';
import { defaultStudyStages } from '../io/study-stages.js';
import { crossMapProgress } from './cross-map-progress.js';

/** `lexichron merge SHARD_DIR... --out DIR`: one run's outputs from its shards. */
export function registerMerge(program: Command): void {
  program
    .command('merge')
    .description('put the shards of a study run (`run --shard I/N`) together: the same outputs as a run on one machine')
    .argument('<shard-dir...>', 'every shard\'s output folder, each exactly once (e.g. parts/*)')
    .option('-o, --out <dir>', 'output folder (default: the study file\'s "out")')
    .option('--allow-symlinks', 'accept an output folder that is a symbolic link (refused by default)')
    .action(async (shardDirs: string[], opts: Record<string, unknown>) => {
      const result = await mergeShards({ shardDirs, now: new Date().toISOString(), stages: defaultStudyStages({ dynamics: { onProgress: crossMapProgress() } }), env: process.env, allowSymlinks: opts.allowSymlinks === true, ...(opts.out !== undefined ? { out: String(opts.out) } : {}) });
      process.stderr.write(`merged ${shardDirs.length} shard${shardDirs.length === 1 ? '' : 's'}\n${reconciliationText(result.score.reconciliation)}\n`);
      const s = result.series;
      process.stderr.write(`series: ${s.persons} persons, ${s.bins} bins, ${s.observed} observed\n`);
      for (const [name, stage] of Object.entries(result.stages)) process.stderr.write(`${name}: ${stage.outputs.length} files\n`);
      process.stdout.write(`outputs in ${relative(process.cwd(), result.outDir) || '.'}/ (manifest.json lists every file with its SHA-256)\n`);
    });
}
