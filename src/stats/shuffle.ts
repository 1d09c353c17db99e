import { randomInteger, type RandomSource } from './random.js';

/**
 * A shuffled copy of `values` by the Fisher–Yates (Durstenfeld 1964) algorithm, drawing from the
 * seeded `source`. The input is not modified.
 */
export function shuffle<T>(values: readonly T[], source: RandomSource): T[] {
  const out = values.slice();
  for (let i = out.length - 1; i > 0; i--) {
    const j = randomInteger(source, i + 1);
    const tmp = out[i] as T;
    out[i] = out[j] as T;
    out[j] = tmp;
  }
  return out;
}
