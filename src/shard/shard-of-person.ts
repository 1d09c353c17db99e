import { createHash } from 'node:crypto';

/** Which part of a sharded run a process does: `index` from 0 to `count` − 1. */
export interface ShardSpec {
  index: number;
  count: number;
}

/** The fixed label hashed before every person id (changing it would move persons between shards). */
export const SHARD_HASH_LABEL = 'lexichron shard v1';

/**
 * The shard (0 … `count` − 1) a person belongs to: the first 8 bytes of
 * SHA-256(`lexichron shard v1` + NUL + person id in UTF-8), read as a big-endian unsigned
 * 64-bit integer, modulo `count`. It depends on nothing but the id and `count`, so every
 * machine and every run puts a person in the same shard (test vectors computed with Python's
 * hashlib are committed beside the test). The id is the one written in the outputs
 * (the pseudonym when a key is given).
 */
export function shardOfPerson(person: string, count: number): number {
  if (count === 1) return 0;
  const digest = createHash('sha256').update(`${SHARD_HASH_LABEL}\u0000${person}`, 'utf8').digest();
  return Number(digest.readBigUInt64BE(0) % BigInt(count));
}

/**
 * A test of "is this person in my shard", remembering each person's answer (persons are few
 * next to rows, so the hash is taken once per person).
 */
export function shardFilter(shard: ShardSpec): (person: string) => boolean {
  const known = new Map<string, boolean>();
  return (person) => {
    let mine = known.get(person);
    if (mine === undefined) {
      mine = shardOfPerson(person, shard.count) === shard.index;
      known.set(person, mine);
    }
    return mine;
  };
}
