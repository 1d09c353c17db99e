import type { ShardSpec } from '../shard/shard-of-person.js';
import { parseShardSpec } from '../shard/parse-shard-spec.js';

/** Help text of `--shard`, shared by run, score, series and import. */
export const SHARD_HELP = 'do only one shard of the persons: I/N (0-based, e.g. 2/7), or auto (from SLURM_ARRAY_TASK_ID and SLURM_ARRAY_TASK_COUNT); persons go to shards by a keyed hash of their id (see README "Running a study on several machines")';

/** The `--shard` option's value, reading the job array's task id and count from the environment for `auto`. */
export function shardFrom(value: unknown, env: NodeJS.ProcessEnv = process.env): ShardSpec | undefined {
  if (value === undefined) return undefined;
  return parseShardSpec(String(value), { id: env.SLURM_ARRAY_TASK_ID, count: env.SLURM_ARRAY_TASK_COUNT });
}
