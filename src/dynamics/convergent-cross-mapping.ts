import { isNumber } from '../stats/is-number.js';
import { quantile } from '../stats/quantile.js';
import { randomInteger, type RandomSource } from '../stats/random.js';
import { bootstrapMeanDifference } from './bootstrap-mean-difference.js';
import { chooseEmbeddingDimension, type DimensionSkill } from './choose-embedding-dimension.js';
import { delayEmbedding } from './delay-embedding.js';
import { forecastSkill } from './forecast-skill.js';
import { kendallTau } from './kendall-tau.js';
import { librarySizes } from './library-sizes.js';
import { neighbourTable } from './neighbour-table.js';
import { seasonalSurrogate } from './seasonal-surrogate.js';
import { shuffleSurrogate } from './shuffle-surrogate.js';
import type { PhasedSeries } from './stack-segments.js';
import { tableProjection } from './table-projection.js';
import type { BinnedSeries } from './types.js';

/** Options of {@link convergentCrossMapping}; every field has a default. */
export interface CcmOptions {
  /** Embedding dimension; chosen by simplex forecast skill of the library series when absent. */
  E?: number;
  /** Largest E tried when choosing (default 8). */
  maxE?: number;
  /** Delay in bins (default 1). */
  tau?: number;
  /** Library points within this many bins of a predicted point are skipped (default 0: itself). */
  exclusionRadius?: number;
  /** Number of library sizes from the smallest to all usable points (default 10). */
  librarySizeCount?: number;
  /** Smallest library size (default max(E + 2, 10)). */
  minLibrarySize?: number;
  /** Random libraries per size (default 100). */
  samples?: number;
  /** Surrogates of each kind for the significance test (default 100; 0 skips the test). */
  surrogates?: number;
  /** Usable points needed to run at all (default 50, common practice). */
  minPoints?: number;
  /** Bootstrap replicates for the interval of ρ(Lmax) − ρ(Lmin) (default 1000). */
  bootstrapReplicates?: number;
  /** Level of that interval (default 0.95). */
  level?: number;
}

/** Cross-map skill at one library size. */
export interface CcmSkillPoint {
  librarySize: number;
  /** Mean ρ over the random libraries. */
  rho: number;
  /** 5th and 95th percentile of ρ over the random libraries. */
  rhoLow: number;
  rhoHigh: number;
  /** Libraries with a skill (1 at the full library). */
  samples: number;
}

/** The result of cross mapping one direction: the library series' manifold estimates the target series. */
export interface CcmDirection {
  status: 'ok' | 'not_enough_data';
  /** Why the analysis could not run (only with `not_enough_data`). */
  reason?: string;
  E: number | undefined;
  tau: number;
  /** Usable points: embedding vectors of the library series with an observed target. */
  points: number;
  /** Skill of each E tried, when E was chosen. */
  embeddingSkill?: DimensionSkill[];
  skill: CcmSkillPoint[];
  /** ρ with the full library (every usable point, leave-one-out). */
  rhoAtMax: number | undefined;
  /** Mean ρ at the smallest library size. */
  rhoAtMin: number | undefined;
  /** Kendall's τ of mean ρ on library size. */
  kendallTau: number | undefined;
  /** ρ(Lmax) − ρ(Lmin) with a bootstrap interval over the random libraries. */
  deltaRho: number | undefined;
  deltaLow: number | undefined;
  deltaHigh: number | undefined;
  /** One-sided p of Kendall's τ > 0 (exact for up to 60 library sizes without ties). */
  kendallP: number | undefined;
  /** Kendall's τ significantly above 0 (p < 1 − level) and the interval of ρ(Lmax) − ρ(Lmin) above 0. */
  converges: boolean | undefined;
  /** (1 + #surrogates with ρ ≥ observed) / (1 + #surrogates), random-shuffle surrogates of the target. */
  pShuffle: number | undefined;
  /** The same with seasonal surrogates of the target (needs phases). */
  pSeasonal: number | undefined;
  surrogates: number;
}

/** A {@link CcmDirection} with status `not_enough_data` and the reason. */
export const ccmNotEnoughData = (reason: string, E: number | undefined, tau: number, points: number, embeddingSkill?: DimensionSkill[]): CcmDirection => ({
  status: 'not_enough_data',
  reason,
  E,
  tau,
  points,
  ...(embeddingSkill ? { embeddingSkill } : {}),
  skill: [],
  rhoAtMax: undefined,
  rhoAtMin: undefined,
  kendallTau: undefined,
  kendallP: undefined,
  deltaRho: undefined,
  deltaLow: undefined,
  deltaHigh: undefined,
  converges: undefined,
  pShuffle: undefined,
  pSeasonal: undefined,
  surrogates: 0,
});

/**
 * Convergent cross mapping (Sugihara et al. 2012, Science 338:496–500) in one direction: the
 * delay embedding of `library` (its shadow manifold M_X) estimates `target` (Y) at the same bin by
 * simplex projection. If Y drives X, X's history carries Y's, and the cross-map skill ρ rises and
 * levels off ("converges") as the library grows. So "X xmap Y" is evidence of Y → X.
 *
 * Steps: E by simplex forecast skill of `library` ({@link chooseEmbeddingDimension}) unless given;
 * usable points are embedding vectors over observed, unbroken bins whose target is observed; for
 * each library size L below the full set, `samples` random libraries drawn without replacement
 * predict every usable point (the point itself and its exclusion radius skipped); the full
 * library gives ρ(Lmax). Distances are computed and sorted once ({@link neighbourTable}) and reused
 * for every library and surrogate. Convergence: Kendall's τ of mean ρ on L significantly above 0
 * (one-sided, at 1 − level) and a percentile bootstrap interval of ρ(Lmax) − ρ(Lmin) above 0; a
 * skill that rises a little and then sags, as in a direction without coupling, does not count. Significance: ρ(Lmax) against cross mapping
 * of random-shuffle and seasonal surrogates of the target (one-sided p with the +1 correction of
 * Davison & Hinkley 1997). All randomness comes from `random`, in a fixed order.
 */
export function convergentCrossMapping(library: PhasedSeries, target: BinnedSeries, options: CcmOptions, random: RandomSource): CcmDirection {
  const tau = options.tau ?? 1;
  const radius = options.exclusionRadius ?? 0;
  const minPoints = options.minPoints ?? 50;
  if (library.values.length !== target.values.length) throw new Error('convergentCrossMapping: library and target must have the same bins');
  let E = options.E;
  let embeddingSkill: DimensionSkill[] | undefined;
  if (E === undefined) {
    const choice = chooseEmbeddingDimension(library, { maxE: options.maxE ?? 8, tau, exclusionRadius: radius });
    if (!choice.ok) return ccmNotEnoughData(choice.reason, undefined, tau, 0);
    E = choice.E;
    embeddingSkill = choice.skills;
  }
  const points = delayEmbedding(library, E, tau, (t) => isNumber(target.values[t]));
  const n = points.count;
  if (n < Math.max(minPoints, E + 3)) {
    return ccmNotEnoughData(`${n} usable points (embedding vectors with an observed target), fewer than the ${Math.max(minPoints, E + 3)} needed`, E, tau, n, embeddingSkill);
  }
  const targetAt = (series: readonly (number | undefined)[]): Float64Array => {
    const out = new Float64Array(n);
    for (let r = 0; r < n; r++) out[r] = series[points.positions[r] as number] as number;
    return out;
  };
  const observed = targetAt(target.values);
  const table = neighbourTable(points, { exclusionRadius: radius });
  const k = E + 1;
  const all = Int32Array.from({ length: n }, (_, i) => i);
  const fullMask = new Uint8Array(n).fill(1);
  const estimates = new Float64Array(n);
  const rhoWith = (mask: Uint8Array, members: ArrayLike<number>, values: Float64Array): number | undefined => {
    tableProjection(table, points, values, { mask, members }, all, k, estimates);
    const skill = forecastSkill(values, estimates);
    return skill.ok ? skill.rho : undefined;
  };
  const rhoAtMax = rhoWith(fullMask, all, observed);
  const sizes = librarySizes(options.minLibrarySize ?? Math.max(E + 2, 10), n, options.librarySizeCount ?? 10);
  const samples = options.samples ?? 100;
  const permutation = Int32Array.from(all);
  const mask = new Uint8Array(n);
  const perSize: number[][] = [];
  const skill: CcmSkillPoint[] = [];
  for (const L of sizes) {
    const rhos: number[] = [];
    if (L >= n) {
      if (rhoAtMax !== undefined) rhos.push(rhoAtMax);
    } else {
      for (let s = 0; s < samples; s++) {
        // Partial Fisher–Yates: the first L entries are a uniform sample without replacement.
        for (let i = 0; i < L; i++) {
          const j = i + randomInteger(random, n - i);
          const tmp = permutation[i] as number;
          permutation[i] = permutation[j] as number;
          permutation[j] = tmp;
        }
        const members = permutation.subarray(0, L);
        for (let i = 0; i < L; i++) mask[members[i] as number] = 1;
        const rho = rhoWith(mask, members, observed);
        for (let i = 0; i < L; i++) mask[members[i] as number] = 0;
        if (rho !== undefined) rhos.push(rho);
      }
    }
    perSize.push(rhos);
    if (rhos.length > 0) {
      let sum = 0;
      for (const r of rhos) sum += r;
      skill.push({ librarySize: L, rho: sum / rhos.length, rhoLow: quantile(rhos, 0.05) as number, rhoHigh: quantile(rhos, 0.95) as number, samples: rhos.length });
    }
  }
  if (skill.length < 2 || rhoAtMax === undefined) {
    return ccmNotEnoughData('the cross-map skill could not be computed at two library sizes (constant series or too few points)', E, tau, n, embeddingSkill);
  }
  const trend = kendallTau(
    skill.map((p) => p.librarySize),
    skill.map((p) => p.rho),
  );
  const first = perSize.find((r) => r.length > 0) as number[];
  const lastRhos = perSize[perSize.length - 1] as number[];
  const delta = bootstrapMeanDifference(first, lastRhos.length > 0 ? lastRhos : [rhoAtMax], random, options.bootstrapReplicates ?? 1000, options.level ?? 0.95);
  const surrogateCount = options.surrogates ?? 100;
  const pValue = (make: () => (number | undefined)[]): number => {
    let atLeast = 0;
    for (let s = 0; s < surrogateCount; s++) {
      const rho = rhoWith(fullMask, all, targetAt(make()));
      if (rho !== undefined && rho >= rhoAtMax) atLeast++;
    }
    return (1 + atLeast) / (1 + surrogateCount);
  };
  const pShuffle = surrogateCount > 0 ? pValue(() => shuffleSurrogate(target.values, random)) : undefined;
  const phase = library.phase;
  const pSeasonal = surrogateCount > 0 && phase ? pValue(() => seasonalSurrogate(target.values, phase, random)) : undefined;
  const kendall = trend.ok ? trend.tau : undefined;
  const kendallP = trend.ok ? trend.pIncreasing : undefined;
  const alpha = 1 - (options.level ?? 0.95);
  return {
    status: 'ok',
    E,
    tau,
    points: n,
    ...(embeddingSkill ? { embeddingSkill } : {}),
    skill,
    rhoAtMax,
    rhoAtMin: (skill[0] as CcmSkillPoint).rho,
    kendallTau: kendall,
    kendallP,
    deltaRho: delta?.difference,
    deltaLow: delta?.low,
    deltaHigh: delta?.high,
    converges: kendallP !== undefined && delta !== undefined ? kendallP < alpha && delta.low > 0 : undefined,
    pShuffle,
    pSeasonal,
    surrogates: surrogateCount,
  };
}
