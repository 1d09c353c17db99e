import { random, type RandomSource } from '../../src/stats/random.js';
import type { AlignedPair } from '../../src/validate/aligned-pair.js';

/** Standard normal draw by Box–Muller from a seeded source. */
export function normal(source: RandomSource): number {
  const u = 1 - source();
  const v = source();
  return Math.sqrt(-2 * Math.log(u)) * Math.cos(2 * Math.PI * v);
}

/**
 * Synthetic pairs: person means of x and y correlated with `between` sign, and within-person
 * deviations with slope `withinSlope` plus noise.
 */
export function buildPairs(options: { persons: number; occasions: number; withinSlope: number; betweenSlope: number; noise?: number; seed?: number }): AlignedPair[] {
  const source = random(options.seed ?? 1);
  const pairs: AlignedPair[] = [];
  for (let p = 0; p < options.persons; p++) {
    const mx = normal(source) * 2;
    const my = options.betweenSlope * mx + normal(source) * 0.5;
    for (let t = 0; t < options.occasions; t++) {
      const dx = normal(source);
      const dy = options.withinSlope * dx + normal(source) * (options.noise ?? 1);
      pairs.push({ person: `p${String(p).padStart(2, '0')}`, x: mx + dx, y: my + dy });
    }
  }
  return pairs;
}
