import { groupBy } from '../stats/group-by.js';
import { isNumber } from '../stats/is-number.js';
import { mean } from '../stats/mean.js';
import { pearsonCorrelation, type Correlation } from '../stats/pearson-correlation.js';
import type { StatResult } from '../stats/stat-result.js';
import type { AlignedPair } from './aligned-pair.js';

/** A person's means of x and y over their complete pairs. */
export interface PersonMeans {
  person: string;
  pairs: number;
  x: number;
  y: number;
}

/**
 * Person means of x and y, over each person's complete pairs only (so both means rest on the same
 * occasions), in sorted person order. Persons without a complete pair are left out.
 */
export function personMeans(pairs: Iterable<AlignedPair>): PersonMeans[] {
  const groups = groupBy(pairs, (d) => d.person);
  const out: PersonMeans[] = [];
  for (const person of [...groups.keys()].sort()) {
    const complete = (groups.get(person) ?? []).filter((d) => isNumber(d.x) && isNumber(d.y));
    if (complete.length === 0) continue;
    out.push({ person, pairs: complete.length, x: mean(complete, (d) => d.x) as number, y: mean(complete, (d) => d.y) as number });
  }
  return out;
}

/**
 * Between-person correlation: Pearson's r of the person means of x and y, one unweighted point
 * per person, as Bland & Altman's (1995) correlation of subject means; n, df and the Fisher-z
 * interval (n − 3) count persons, not observations.
 */
export function betweenPersonCorrelation(pairs: Iterable<AlignedPair>, level = 0.95): StatResult<Correlation> {
  return pearsonCorrelation(personMeans(pairs), (d) => d.x, (d) => d.y, { level });
}
