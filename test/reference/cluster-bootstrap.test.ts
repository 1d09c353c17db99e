import { describe, expect, it } from 'vitest';
import { clusterBootstrap } from '../../src/stats/cluster-bootstrap.js';
import { random } from '../../src/stats/random.js';
import { readReferenceCsv } from './reference-csv.js';

// An independent plain-Python percentile cluster bootstrap (Davison & Hinkley 1997, §3.8) drawing
// persons from the same seeded xoshiro128** stream, checked against the reference C generator:
// test/reference/cluster-bootstrap/make-expected.py (Python 3.11, standard library only).
// The ninth person has extreme values, so a resampler that never draws the last person, or draws
// fewer than k persons per resample, gives another interval.
const byPerson = new Map<string, number[]>();
for (const r of readReferenceCsv('cluster-bootstrap/clusters.csv')) {
  const list = byPerson.get(r.person as string) ?? [];
  list.push(Number(r.value));
  byPerson.set(r.person as string, list);
}
const clusters = [...byPerson.values()];
const statistics: Record<string, (s: readonly (readonly number[])[]) => number> = {
  mean_of_means: (s) => s.reduce((a, c) => a + c.reduce((x, y) => x + y, 0) / c.length, 0) / s.length,
  pooled_mean: (s) => s.reduce((a, c) => a + c.reduce((x, y) => x + y, 0), 0) / s.reduce((a, c) => a + c.length, 0),
};
const expected = readReferenceCsv('cluster-bootstrap/expected.csv');

describe('clusterBootstrap against an independent fixed-seed Python reference (test/reference/cluster-bootstrap/make-expected.py)', () => {
  it('reads 9 persons', () => expect(clusters.length).toBe(9));
  it.each(expected.map((e) => [e.statistic as string, e.seed as string, e]))('gives the reference percentile interval and SE for %s with seed %s', (name, seedText, e) => {
    const seed = /^\d+$/.test(seedText) ? Number(seedText) : seedText;
    const stat = statistics[name] as (s: readonly (readonly number[])[]) => number;
    const result = clusterBootstrap(clusters, stat, { random: random(seed), replicates: Number(e.replicates), level: Number(e.level) });
    if (!result.ok) throw new Error(result.reason);
    expect(result.ciLow).toBeCloseTo(Number(e.ci_low), 10);
    expect(result.ciHigh).toBeCloseTo(Number(e.ci_high), 10);
    expect(result.se).toBeCloseTo(Number(e.se), 10);
    expect(result.succeeded).toBe(Number(e.replicates));
  });
  it.each(expected.map((e) => [e.seed as string, e.first_draw as string]))('draws the reference persons in the first resample with seed %s', (seedText, firstDraw) => {
    const seed = /^\d+$/.test(seedText) ? Number(seedText) : seedText;
    let first: number[] | undefined;
    clusterBootstrap(clusters.map((c, i) => [i]), (s) => { first ??= s.map((c) => c[0] as number); return 0; }, { random: random(seed), replicates: 2 });
    expect(first).toEqual(firstDraw.split(' ').map(Number));
  });
});
