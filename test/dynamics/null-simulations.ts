import { random } from '../../src/stats/random.js';
import type { PersonSeriesInput } from '../../src/dynamics/types.js';

/** A standard normal draw by Box–Muller from a seeded source. */
export function normalSource(seed: number | string): () => number {
  const source = random(seed);
  return () => Math.sqrt(-2 * Math.log(1 - source())) * Math.cos(2 * Math.PI * source());
}

/** Hourly bin starts of an invented window from 2026-03-02T00:00 (a Monday), offset by `startHour` hours, as written in `bin_start`. */
export function hourlyBinStarts(bins: number, startHour = 0): { binStart: string[]; binOfDay: number[] } {
  const binStart: string[] = [];
  const binOfDay: number[] = [];
  for (let t = 0; t < bins; t++) {
    const at = new Date(Date.UTC(2026, 2, 2, startHour + t));
    binStart.push(at.toISOString().slice(0, 19));
    binOfDay.push(at.getUTCHours() + 1);
  }
  return { binStart, binOfDay };
}

/**
 * Invented persons with two *uncoupled* AR(1) series x and y (x_t = φ x_{t−1} + e_t, independent
 * innovations): no variable drives the other, so every cross-map direction is a true null.
 */
export function uncoupledAr1Persons(count: number, bins: number, phi: number, seed: number): PersonSeriesInput[] {
  const normal = normalSource(seed);
  return Array.from({ length: count }, (_, p) => {
    const x: number[] = [];
    const y: number[] = [];
    let a = normal() / Math.sqrt(1 - phi * phi);
    let b = normal() / Math.sqrt(1 - phi * phi);
    for (let t = 0; t < bins; t++) {
      a = phi * a + normal();
      b = phi * b + normal();
      x.push(a);
      y.push(b);
    }
    return { person: `N${p + 1}`, t: x.map((_, t) => t), values: { x, y }, lagValid: x.map((_, t) => t > 0), ...hourlyBinStarts(bins, p) };
  });
}

/**
 * Invented persons whose series have no dynamics at all (independent noise around the person's
 * mean) but whose person means of x and y are strongly correlated across persons: the pattern
 * that made stacked cross mapping "converge" before persons were centred.
 */
export function correlatedMeanPersons(count: number, bins: number, seed: number): PersonSeriesInput[] {
  const normal = normalSource(seed);
  return Array.from({ length: count }, (_, p) => {
    const level = 3 * normal();
    const mx = level;
    const my = level + 0.3 * normal();
    const x = Array.from({ length: bins }, () => mx + normal());
    const y = Array.from({ length: bins }, () => my + normal());
    return { person: `M${p + 1}`, t: x.map((_, t) => t), values: { x, y }, lagValid: x.map((_, t) => t > 0), ...hourlyBinStarts(bins, 5 * p) };
  });
}

/** The two-sided 99% band [lo, hi] of a Binomial(n, p) count: P(X < lo) ≤ 0.005 and P(X > hi) ≤ 0.005. */
export function binomialBand(n: number, p: number, level = 0.99): [number, number] {
  const pmf: number[] = [];
  let term = (1 - p) ** n;
  for (let k = 0; k <= n; k++) {
    pmf.push(term);
    term = (term * (n - k) * p) / ((k + 1) * (1 - p));
  }
  const tail = (1 - level) / 2;
  let lo = 0;
  let below = 0;
  while (below + (pmf[lo] as number) <= tail) below += pmf[lo++] as number;
  let hi = n;
  let above = 0;
  while (above + (pmf[hi] as number) <= tail) above += pmf[hi--] as number;
  return [lo, hi];
}
