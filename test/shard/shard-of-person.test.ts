import { readFileSync } from 'node:fs';
import { resolve } from 'node:path';
import { describe, expect, it } from 'vitest';
import { shardFilter, shardOfPerson } from '../../src/shard/shard-of-person.js';
import { parseShardSpec } from '../../src/shard/parse-shard-spec.js';

// Vectors computed by test/shard/vectors/shard-vectors.py with Python's hashlib (FIPS 180-4 SHA-256),
// committed as test/shard/vectors/shard-vectors.json.
const vectors = JSON.parse(readFileSync(resolve(__dirname, 'vectors/shard-vectors.json'), 'utf8')) as { vectors: Array<{ person: string; shards: Record<string, number> }> };

describe('shardOfPerson', () => {
  it('puts every person in the shard Python\'s hashlib computes for SHA-256 of the label and id (committed vectors)', () => {
    expect(vectors.vectors.length).toBeGreaterThan(10);
    for (const v of vectors.vectors) {
      for (const [n, shard] of Object.entries(v.shards)) expect(shardOfPerson(v.person, Number(n)), `${v.person} of ${n}`).toBe(shard);
    }
  });

  it('spreads many persons over the shards roughly evenly (common practice: within 20% of the mean)', () => {
    const counts = new Array(7).fill(0) as number[];
    for (let i = 0; i < 7000; i++) counts[shardOfPerson(`person-${i}`, 7)]++;
    for (const c of counts) expect(Math.abs(c - 1000)).toBeLessThan(200);
  });

  it('a shard filter answers as shardOfPerson for each of its persons, asked again and again', () => {
    const mine = shardFilter({ index: 2, count: 3 });
    for (let round = 0; round < 2; round++) {
      for (let i = 0; i < 300; i++) expect(mine(`p${i}`)).toBe(shardOfPerson(`p${i}`, 3) === 2);
    }
  });
});

describe('parseShardSpec', () => {
  it('reads I/N with a 0-based index', () => {
    expect(parseShardSpec('0/3')).toEqual({ index: 0, count: 3 });
    expect(parseShardSpec('6/7')).toEqual({ index: 6, count: 7 });
  });

  it('reads auto from the job array task id and count', () => {
    expect(parseShardSpec('auto', { id: '4', count: '5' })).toEqual({ index: 4, count: 5 });
  });

  it('refuses malformed, out-of-range and unset specs with a message saying what to write', () => {
    expect(() => parseShardSpec('3/3')).toThrow(/from 0 to 2/);
    expect(() => parseShardSpec('1-3')).toThrow(/form I\/N/);
    expect(() => parseShardSpec('0/0')).toThrow(/from 1 to/);
    expect(() => parseShardSpec('auto', {})).toThrow(/SLURM_ARRAY_TASK_ID/);
    expect(() => parseShardSpec('auto', { id: '5', count: '5' })).toThrow(/--array=0-/);
  });
});
