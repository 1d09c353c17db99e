import { describe, expect, it } from 'vitest';
import { random } from '../../src/stats/random.js';
import { delayEmbedding } from '../../src/dynamics/delay-embedding.js';
import { neighbourTable } from '../../src/dynamics/neighbour-table.js';
import { nearestNeighbours } from '../../src/dynamics/nearest-neighbours.js';
import { simplexProjection } from '../../src/dynamics/simplex-projection.js';
import { tableProjection } from '../../src/dynamics/table-projection.js';

function noisySeries(n: number, seed: number, missingEvery = 0, breakEvery = 0) {
  const source = random(seed);
  const values: (number | undefined)[] = [];
  const lagValid: boolean[] = [];
  let x = 0.3;
  for (let t = 0; t < n; t++) {
    x = 3.9 * x * (1 - x);
    // Rounded values create exact distance ties, which the tie rule must settle identically.
    values.push(missingEvery > 0 && t % missingEvery === 3 ? undefined : Math.round((x + 0.05 * source()) * 50) / 50);
    lagValid.push(t > 0 && !(breakEvery > 0 && t % breakEvery === 0) && values[t - 1] !== undefined);
  }
  return { values, lagValid };
}

describe('neighbour table shortcut (cross-checked against brute force, as every shortcut must be)', () => {
  it('lists every point’s other points in exactly the brute-force (distance, index) order, ties included', () => {
    const points = delayEmbedding(noisySeries(150, 1), 2, 1);
    const table = neighbourTable(points, { exclusionRadius: 2 });
    const all = Array.from({ length: points.count }, (_, i) => i);
    for (let i = 0; i < points.count; i++) {
      const brute = nearestNeighbours(points, i, all, points.count, 2);
      const row = Array.from(table.order.subarray(i * table.width, i * table.width + table.filled[i]!));
      expect(row).toEqual(brute.indices);
    }
  });

  it('gives the same estimates as brute-force simplex projection for random libraries, with missing bins, breaks and an exclusion radius', () => {
    const series = noisySeries(240, 2, 17, 40);
    const points = delayEmbedding(series, 3, 2);
    const target = Float64Array.from(points.positions, (t) => Math.sin(t / 5));
    const all = Int32Array.from({ length: points.count }, (_, i) => i);
    const source = random(3);
    for (const [radius, maxEntries] of [
      [0, undefined],
      [3, undefined],
      [1, points.count * 8], // truncated rows: the brute-force fallback must kick in
    ] as const) {
      const table = neighbourTable(points, { exclusionRadius: radius, ...(maxEntries ? { maxEntries } : {}) });
      if (maxEntries) expect(table.complete).toBe(false);
      for (const L of [4, 10, 40, points.count]) {
        const members = Array.from(all).sort(() => source() - 0.5).slice(0, L);
        const mask = new Uint8Array(points.count);
        for (const j of members) mask[j] = 1;
        const fast = tableProjection(table, points, target, { mask, members }, all, 4);
        const slow = simplexProjection(points, target, members, all, { neighbours: 4, exclusionRadius: radius });
        slow.forEach((v, p) => {
          if (v === undefined) expect(Number.isNaN(fast[p]!)).toBe(true);
          else expect(fast[p]).toBe(v);
        });
      }
    }
  });

  it('forms embedding vectors only over observed, unbroken bins', () => {
    const values = [1, 2, undefined, 4, 5, 6, 7, 8];
    const lagValid = [false, true, false, false, true, true, false, true];
    const points = delayEmbedding({ values, lagValid }, 2, 1);
    expect(Array.from(points.positions)).toEqual([1, 4, 5, 7]);
    expect(Array.from(points.vectors)).toEqual([2, 1, 5, 4, 6, 5, 8, 7]);
  });
});
