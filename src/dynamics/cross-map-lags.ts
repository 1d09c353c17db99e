import { isNumber } from '../stats/is-number.js';
import { delayEmbedding } from './delay-embedding.js';
import { crossMapEstimates, emptyLibraryNeighbours, libraryNeighbours } from './library-neighbours.js';
import { skillRho } from './skill-rho.js';
import { spanValid } from './span-valid.js';
import type { BinnedSeries } from './types.js';

/** Cross-map skill at one lag. */
export interface LagSkill {
  /** l: the library's state at bin t estimates the target at bin t + l. */
  lag: number;
  rho: number | undefined;
  /** Points with the target observed l bins away. */
  points: number;
}

/**
 * Cross-map skill over lags (Ye, Deyle, Gilarranz & Sugihara 2015, "Distinguishing time-delayed
 * causal interactions using convergent cross mapping", Scientific Reports 5:14750): for each l
 * from −maxLag to maxLag, the state of the library series at bin t (its delay embedding `points`)
 * estimates the target at bin t + l, leave-one-out over every point whose target is observed l
 * bins away with no break or missing bin in between, neighbours as in cross mapping (E + 1,
 * `exclusionRadius`). A real driver acts before its effect, so its skill peaks at a negative lag;
 * a peak at lag 0 or later points to a common driver within the same bin (or the other direction).
 */
export function crossMapLags(library: BinnedSeries, target: BinnedSeries, maxLag: number, exclusionRadius: number): LagSkill[] {
  const points = delayEmbedding(library, 1, 1, (t) => isNumber(target.values[t]));
  const n = points.count;
  const k = points.E + 1;
  const out: LagSkill[] = [];
  for (let lag = -maxLag; lag <= maxLag; lag++) {
    const mask = new Uint8Array(n);
    const members: number[] = [];
    const values = new Float64Array(n);
    for (let r = 0; r < n; r++) {
      const t = points.positions[r] as number;
      const u = t + lag;
      if (!isNumber(target.values[u]) || !spanValid(target, Math.min(t, u), Math.max(t, u))) continue;
      mask[r] = 1;
      members.push(r);
      values[r] = target.values[u] as number;
    }
    if (members.length < k + 2) {
      out.push({ lag, rho: undefined, points: members.length });
      continue;
    }
    const sets = libraryNeighbours(points, { mask, members }, members, exclusionRadius, emptyLibraryNeighbours(members.length, k));
    const estimates = crossMapEstimates(sets, values);
    const observed = Float64Array.from(members, (r) => values[r] as number);
    out.push({ lag, rho: skillRho(observed, estimates), points: members.length });
  }
  return out;
}
