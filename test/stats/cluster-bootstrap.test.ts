import { describe, expect, it } from 'vitest';
import { clusterBootstrap } from '../../src/stats/cluster-bootstrap.js';
import { mean } from '../../src/stats/mean.js';
import { quantile } from '../../src/stats/quantile.js';
import { random } from '../../src/stats/random.js';

describe('clusterBootstrap', () => {
  const clusters = [[1, 2], [3], [4, 5, 6], [10], [2, 2]];
  const meanOfMeans = (sample: readonly (readonly number[])[]) => mean(sample.map((c) => mean(c) as number));
  it('is reproducible with the same seed', () => {
    const a = clusterBootstrap(clusters, meanOfMeans, { random: random(1), replicates: 500 });
    const b = clusterBootstrap(clusters, meanOfMeans, { random: random(1), replicates: 500 });
    expect(a).toEqual(b);
  });
  it('brackets the statistic and keeps it inside the range of the cluster values', () => {
    const result = clusterBootstrap(clusters, meanOfMeans, { random: random(2), replicates: 1000 });
    if (!result.ok) throw new Error(result.reason);
    const estimate = meanOfMeans(clusters) as number;
    expect(result.ciLow).toBeLessThan(estimate);
    expect(result.ciHigh).toBeGreaterThan(estimate);
    expect(result.ciLow).toBeGreaterThanOrEqual(1.5);
    expect(result.ciHigh).toBeLessThanOrEqual(10);
    expect(result.succeeded).toBe(1000);
  });
  it('ends its percentile interval at the type-7 quantiles of the replicate statistics (Hyndman & Fan 1996 type 7, R quantile default; quantile is checked against R)', () => {
    const drawn: number[] = [];
    const result = clusterBootstrap(clusters, (s) => { const v = meanOfMeans(s) as number; drawn.push(v); return v; }, { random: random(5), replicates: 99, level: 0.9 });
    if (!result.ok) throw new Error(result.reason);
    // 99 draws: h = 98 · 0.05 = 4.9 falls between order statistics, so the interpolation shows.
    expect(result.ciLow).toBe(quantile(drawn, (1 - 0.9) / 2));
    expect(result.ciHigh).toBe(quantile(drawn, (1 + 0.9) / 2));
  });
  it('resamples whole clusters: a statistic that is constant within clusters sees only cluster values', () => {
    const seen = new Set<number>();
    clusterBootstrap(clusters, (s) => { for (const c of s) seen.add(c.length); return 0; }, { random: random(3), replicates: 50 });
    expect([...seen].sort()).toEqual([1, 2, 3]);
  });
  it('gives no interval when most resamples fail, and says so', () => {
    const result = clusterBootstrap(clusters, () => undefined, { random: random(4), replicates: 20 });
    expect(result.ok ? '' : result.code).toBe('bootstrap_failed');
  });
});
