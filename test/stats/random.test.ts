import { readFileSync } from 'node:fs';
import path from 'node:path';
import { fileURLToPath } from 'node:url';
import { describe, expect, it } from 'vitest';
import { random, randomInteger } from '../../src/stats/random.js';
import { shuffle } from '../../src/stats/shuffle.js';

const here = path.dirname(fileURLToPath(import.meta.url));
// Expected outputs of the reference C implementation of xoshiro128** 1.1 (Blackman & Vigna 2018,
// prng.di.unimi.it), with the same seeding, produced by test/reference/xoshiro/xoshiro128starstar.c.
const expected = readFileSync(path.join(here, '../reference/xoshiro/expected.txt'), 'utf8')
  .trim()
  .split('\n')
  .map((line) => line.split(' ').map(Number));

describe('random (seeded xoshiro128**)', () => {
  it.each(expected.map((row) => [row[0] as number, row.slice(1)]))('matches the reference C xoshiro128** 1.1 for seed %i', (seed, outputs) => {
    const source = random(seed);
    expect(Array.from({ length: 5 }, () => source() * 4294967296)).toEqual(outputs);
  });
  it('gives the same sequence for the same string seed and a different one for another seed', () => {
    const a = random('study-1');
    const b = random('study-1');
    const c = random('study-2');
    const xs = Array.from({ length: 10 }, () => a());
    expect(Array.from({ length: 10 }, () => b())).toEqual(xs);
    expect(Array.from({ length: 10 }, () => c())).not.toEqual(xs);
  });
  it('draws numbers in [0, 1) whose mean over 100000 draws is close to 1/2', () => {
    const source = random(7);
    let sum = 0;
    let outside = 0;
    for (let i = 0; i < 100000; i++) {
      const x = source();
      if (!(x >= 0 && x < 1)) outside += 1;
      sum += x;
    }
    expect(outside).toBe(0);
    expect(sum / 100000).toBeCloseTo(0.5, 2);
  });
  it('draws integers below n', () => {
    const source = random(3);
    const counts = [0, 0, 0];
    for (let i = 0; i < 3000; i++) counts[randomInteger(source, 3)]! += 1;
    expect(counts.every((c) => c > 900 && c < 1100)).toBe(true);
  });
  it('shuffles a copy reproducibly without changing the input', () => {
    const input = [1, 2, 3, 4, 5, 6, 7, 8];
    const a = shuffle(input, random(11));
    expect(a).toEqual(shuffle(input, random(11)));
    expect([...a].sort((x, y) => x - y)).toEqual(input);
    expect(input).toEqual([1, 2, 3, 4, 5, 6, 7, 8]);
  });
});
