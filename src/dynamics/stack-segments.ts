import type { BinnedSeries } from './types.js';

/** A series with an optional cycle phase per bin (for seasonal surrogates). */
export interface PhasedSeries extends BinnedSeries {
  phase?: readonly number[];
}

/**
 * Stacks several persons' series (same variable) into one, end to end, for an analysis pooled
 * over persons: the first bin of each segment gets `lagValid = false`, so no embedding vector,
 * lag pair or forecast crosses from one person to the next, and `gap` missing bins are put between
 * segments so an exclusion radius of up to `gap` never reaches into a neighbouring segment.
 * Phases are kept when every segment has them.
 */
export function stackSegments(segments: readonly PhasedSeries[], gap = 0): PhasedSeries {
  const values: (number | undefined)[] = [];
  const lagValid: boolean[] = [];
  const withPhase = segments.every((s) => s.phase !== undefined);
  const phase: number[] = [];
  segments.forEach((segment, k) => {
    if (k > 0)
      for (let g = 0; g < gap; g++) {
        values.push(undefined);
        lagValid.push(false);
        phase.push(-1);
      }
    segment.values.forEach((v, t) => {
      values.push(v);
      lagValid.push(t === 0 ? false : Boolean(segment.lagValid[t]));
      if (withPhase) phase.push((segment.phase as readonly number[])[t] as number);
    });
  });
  return withPhase ? { values, lagValid, phase } : { values, lagValid };
}
