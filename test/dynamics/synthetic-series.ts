import { random } from '../../src/stats/random.js';
import type { PersonSeriesInput } from '../../src/dynamics/types.js';

/**
 * Invented persons for tests: `mood` follows a logistic-map-like chaotic driver observed with a
 * little noise, `tone` responds to the previous bin's mood (mood → tone); every 24th bin is a
 * break (a night), every 13th bin is missing.
 */
export function syntheticPersons(count: number, bins: number, seed = 5): PersonSeriesInput[] {
  const source = random(seed);
  const normal = (): number => Math.sqrt(-2 * Math.log(1 - source())) * Math.cos(2 * Math.PI * source());
  return Array.from({ length: count }, (_, p) => {
    const mood: (number | undefined)[] = [];
    const tone: (number | undefined)[] = [];
    const lagValid: boolean[] = [];
    const binOfDay: number[] = [];
    let m = 0.2 + 0.05 * p;
    let w = 0.5;
    for (let t = 0; t < bins; t++) {
      const previousMood = m;
      m = 3.7 * m * (1 - m);
      w = w * (3.6 - 3.6 * w - 0.3 * previousMood);
      const missing = t % 13 === 6;
      mood.push(missing ? undefined : m + 0.01 * normal());
      tone.push(missing ? undefined : w + 0.01 * normal());
      lagValid.push(t > 0 && t % 24 !== 0 && (t - 1) % 13 !== 6);
      binOfDay.push((t % 24) + 1);
    }
    return { person: `P${p + 1}`, t: Array.from({ length: bins }, (_, t) => t), values: { mood, tone }, lagValid, binOfDay };
  });
}
