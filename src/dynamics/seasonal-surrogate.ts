import { isNumber } from '../stats/is-number.js';
import type { RandomSource } from '../stats/random.js';
import { phaseRandomisedSurrogates, segmentPositions } from './phase-randomised-surrogate.js';

/**
 * `count` seasonal surrogates: within each segment (person), the series is split into its cycle (the
 * mean of the observed values at each calendar phase, e.g. the hour of the local day) and
 * residuals; the residuals are replaced by a phase-randomised surrogate of themselves
 * ({@link phaseRandomisedSurrogates}, Ebisuzaki 1997) and the cycle is added back. Keeps each
 * person's rhythm and the autocorrelation of what is left, destroys any other link to another
 * series, so two series that only share a daily or weekly rhythm do not look causally linked
 * (the idea of the seasonal surrogates of the EDM literature, e.g. Deyle et al. 2016, PNAS, cited
 * from memory). `phase[t]` is an integer label of bin t's place in the cycle (from the calendar,
 * see calendarPhase); `segment` as in {@link phaseRandomisedSurrogates}.
 */
export function seasonalSurrogates(
  values: readonly (number | undefined)[],
  phase: readonly number[],
  count: number,
  random: RandomSource,
  segment?: readonly number[],
): (number | undefined)[][] {
  const cycle = new Float64Array(values.length);
  const residuals: (number | undefined)[] = values.map(() => undefined);
  for (const positions of segmentPositions(values.length, segment)) {
    const sums = new Map<number, { n: number; sum: number }>();
    for (const t of positions) {
      const v = values[t];
      if (!isNumber(v)) continue;
      const s = sums.get(phase[t] as number) ?? { n: 0, sum: 0 };
      s.n += 1;
      s.sum += v;
      sums.set(phase[t] as number, s);
    }
    for (const t of positions) {
      const v = values[t];
      if (!isNumber(v)) continue;
      const s = sums.get(phase[t] as number) as { n: number; sum: number };
      cycle[t] = s.sum / s.n;
      residuals[t] = v - (cycle[t] as number);
    }
  }
  return phaseRandomisedSurrogates(residuals, count, random, segment).map((shuffled) => values.map((v, t) => (isNumber(v) ? (cycle[t] as number) + (shuffled[t] as number) : v)));
}
