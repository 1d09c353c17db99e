import { personCentre } from './person-centre.js';
import type { BinnedSeries } from './types.js';

/** A series with an optional calendar phase per bin (for seasonal surrogates) and segment per bin (for surrogates within persons). */
export interface PhasedSeries extends BinnedSeries {
  phase?: readonly number[];
  /** Which person (segment) each bin belongs to; −1 for the gaps between stacked persons. Absent: one segment. */
  segment?: readonly number[];
}

/**
 * Stacks several persons' series (same variable) into one, end to end, for an analysis pooled
 * over persons. Each person's series is centred on its own mean first ({@link personCentre}), so
 * differences between persons' levels, which carry no dynamics, cannot make one variable
 * "predict" another across the stack. The first bin of each segment gets `lagValid = false`, so no
 * embedding vector, lag pair or forecast crosses from one person to the next; `gap` missing bins
 * are put between segments so an exclusion radius of up to `gap` never reaches into a
 * neighbouring segment; `segment` records whose bin each is, so surrogates are drawn within
 * persons. Phases are kept when every segment has them.
 */
export function stackSegments(segments: readonly PhasedSeries[], gap = 0): PhasedSeries {
  const values: (number | undefined)[] = [];
  const lagValid: boolean[] = [];
  const segment: number[] = [];
  const withPhase = segments.every((s) => s.phase !== undefined);
  const phase: number[] = [];
  segments.forEach((part, k) => {
    if (k > 0)
      for (let g = 0; g < gap; g++) {
        values.push(undefined);
        lagValid.push(false);
        segment.push(-1);
        phase.push(-1);
      }
    personCentre(part.values).forEach((v, t) => {
      values.push(v);
      lagValid.push(t === 0 ? false : Boolean(part.lagValid[t]));
      segment.push(k);
      if (withPhase) phase.push((part.phase as readonly number[])[t] as number);
    });
  });
  return withPhase ? { values, lagValid, segment, phase } : { values, lagValid, segment };
}
