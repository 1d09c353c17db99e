import type { ShardSpec } from './shard-of-person.js';

/** What `lexichron merge` knows of one shard folder: its name and the fields of its shard.json that must agree. */
export interface ShardRecord {
  /** The folder as given on the command line. */
  dir: string;
  shard: ShardSpec;
  /** Fields that every shard of one run has alike, by what they mean (`tool version`, `study file`, `inputs`…), as canonical JSON. */
  same: Record<string, string>;
}

/**
 * Checks that `shards` are every shard of one run, each exactly once: the same tool version,
 * study file, inputs, lexicons and options, the same number of shards, no index twice, none
 * missing. Returns one message per problem, each naming the folder or shard concerned and what
 * to do (empty when the set is whole). Pure, so every case is tested without files.
 */
export function checkShardSet(shards: readonly ShardRecord[]): string[] {
  const problems: string[] = [];
  const first = shards[0];
  if (!first) return ['no shard folders given; name every shard\'s output folder, e.g. `lexichron merge parts/* --out merged`.'];
  for (const s of shards.slice(1)) {
    if (s.shard.count !== first.shard.count) {
      problems.push(`\`${s.dir}\` is shard ${s.shard.index}/${s.shard.count}, but \`${first.dir}\` is shard ${first.shard.index}/${first.shard.count}: the shards were split in different numbers; run every shard with the same N.`);
      continue;
    }
    const differ = Object.keys(first.same).filter((k) => s.same[k] !== first.same[k]);
    if (differ.length > 0) problems.push(`\`${s.dir}\` is not a shard of the same run as \`${first.dir}\`: its ${differ.join(', ')} differ${differ.length === 1 ? 's' : ''}; run every shard with the same version of lexichron, study file, inputs and options.`);
  }
  if (problems.length > 0) return problems;
  const byIndex = new Map<number, string[]>();
  for (const s of shards) byIndex.set(s.shard.index, [...(byIndex.get(s.shard.index) ?? []), s.dir]);
  const n = first.shard.count;
  for (const [index, dirs] of [...byIndex].sort((a, b) => a[0] - b[0])) {
    if (dirs.length > 1) problems.push(`shard ${index}/${n} is given ${dirs.length} times (${dirs.map((d) => `\`${d}\``).join(', ')}); give each shard once.`);
  }
  for (let index = 0; index < n; index++) {
    if (!byIndex.has(index)) problems.push(`shard ${index}/${n} is missing: none of the folders given holds it; run it (\`lexichron run STUDY --shard ${index}/${n} --out DIR\`) and add its folder.`);
  }
  return problems;
}
