import type { FillMethod } from './series-types.js';

/**
 * Fills runs of at most `maxFill` fillable missing values in place: `carry` repeats the value
 * before the run (a run at the start stays empty), `linear` interpolates between the values on
 * both sides (a run at either end stays empty). `missing` marks the positions that may be filled. Returns the flag of each position (`carry`, `linear` or empty).
 */
export function fillGaps(values: Array<number | undefined>, missing: readonly boolean[], method: FillMethod, maxFill: number): Array<'' | 'carry' | 'linear'> {
  const flags: Array<'' | 'carry' | 'linear'> = values.map(() => '');
  if (method === 'none' || maxFill <= 0) return flags;
  let i = 0;
  while (i < values.length) {
    if (!missing[i] || values[i] !== undefined) {
      i++;
      continue;
    }
    let j = i;
    while (j < values.length && missing[j] && values[j] === undefined) j++;
    const run = j - i;
    const left = i > 0 ? values[i - 1] : undefined;
    const right = j < values.length ? values[j] : undefined;
    if (run <= maxFill && left !== undefined) {
      if (method === 'carry') {
        for (let k = i; k < j; k++) {
          values[k] = left;
          flags[k] = 'carry';
        }
      } else if (right !== undefined) {
        for (let k = i; k < j; k++) {
          values[k] = left + ((right - left) * (k - i + 1)) / (run + 1);
          flags[k] = 'linear';
        }
      }
    }
    i = j;
  }
  return flags;
}
