import { usageError } from '../errors.js';
import type { ShardSpec } from './shard-of-person.js';

/** Most shards a run may be split into. */
export const MAX_SHARDS = 100_000;

/**
 * Parses `--shard I/N` (0-based: `0/3`, `1/3`, `2/3`), or `auto` with the job array's task id and
 * count (Slurm's `SLURM_ARRAY_TASK_ID` and `SLURM_ARRAY_TASK_COUNT`, passed in by the caller).
 * Throws a usage error saying what is wrong and what to write instead.
 */
export function parseShardSpec(text: string, arrayTask?: { id?: string; count?: string }): ShardSpec {
  if (text === 'auto') {
    const id = arrayTask?.id;
    const count = arrayTask?.count;
    if (id === undefined || count === undefined || id === '' || count === '') {
      throw usageError('--shard auto reads SLURM_ARRAY_TASK_ID and SLURM_ARRAY_TASK_COUNT, and at least one is not set; submit the job with `sbatch --array=0-N` (task ids from 0), or give the shard as --shard I/N.');
    }
    return checked(id, count, `--shard auto (SLURM_ARRAY_TASK_ID=${id}, SLURM_ARRAY_TASK_COUNT=${count})`, ' Submit the array as `--array=0-(N-1)` so that task ids run from 0 to N − 1.');
  }
  const m = /^(\d+)\/(\d+)$/.exec(text.trim());
  if (!m) throw usageError(`--shard \`${text}\` is not of the form I/N (0-based: 0/3, 1/3 and 2/3 split a run in three) or auto.`);
  return checked(m[1] as string, m[2] as string, `--shard ${text}`, '');
}

function checked(id: string, count: string, what: string, hint: string): ShardSpec {
  if (!/^\d+$/.test(id) || !/^\d+$/.test(count)) throw usageError(`${what}: the task id and count must be whole numbers.${hint}`);
  const index = Number(id);
  const n = Number(count);
  if (n < 1 || n > MAX_SHARDS) throw usageError(`${what}: the number of shards must be from 1 to ${MAX_SHARDS}.`);
  if (index >= n) throw usageError(`${what}: the shard index must be from 0 to ${n - 1} (0-based).${hint}`);
  return { index, count: n };
}
