import { describe, expect, it } from 'vitest';
import { checkShardSet, type ShardRecord } from '../../src/shard/check-shard-set.js';

// Common practice (no published source): a merge takes every shard 0 … N − 1 exactly once, from one run.
const same = { 'tool version': '"0.1.0"', 'study file': '"a"', inputs: '"x"' };
const shard = (dir: string, index: number, count: number, over: Record<string, string> = {}): ShardRecord => ({ dir, shard: { index, count }, same: { ...same, ...over } });

describe('checkShardSet', () => {
  it('accepts every shard once, in any order', () => {
    expect(checkShardSet([shard('c', 2, 3), shard('a', 0, 3), shard('b', 1, 3)])).toEqual([]);
  });

  it('names each missing shard and each shard given twice', () => {
    const problems = checkShardSet([shard('a', 0, 4), shard('b', 0, 4), shard('d', 3, 4)]);
    expect(problems).toEqual([
      expect.stringMatching(/^shard 0\/4 is given 2 times \(`a`, `b`\)/),
      expect.stringMatching(/^shard 1\/4 is missing/),
      expect.stringMatching(/^shard 2\/4 is missing/),
    ]);
  });

  it('names the folder of another run and what differs', () => {
    expect(checkShardSet([shard('a', 0, 2), shard('b', 1, 2, { inputs: '"y"', 'tool version': '"0.2.0"' })])).toEqual([
      expect.stringMatching(/^`b` is not a shard of the same run as `a`: its tool version, inputs differ;/),
    ]);
  });

  it('names a shard split in another number', () => {
    expect(checkShardSet([shard('a', 0, 2), shard('b', 1, 3)])[0]).toMatch(/`b` is shard 1\/3, but `a` is shard 0\/2/);
  });

  it('asks for folders when none are given', () => {
    expect(checkShardSet([])[0]).toMatch(/no shard folders given/);
  });
});
