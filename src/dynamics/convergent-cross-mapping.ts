import { isNumber } from '../stats/is-number.js';
import { quantile } from '../stats/quantile.js';
import { randomInteger, type RandomSource } from '../stats/random.js';
import { chooseEmbeddingDimension, type DimensionSkill } from './choose-embedding-dimension.js';
import { crossMapLags, type LagSkill } from './cross-map-lags.js';
import { delayEmbedding, type StatePoints } from './delay-embedding.js';
import { exclusionRadius } from './exclusion-radius.js';
import { crossMapEstimates, emptyLibraryNeighbours, libraryNeighbours } from './library-neighbours.js';
import { librarySizes } from './library-sizes.js';
import { neighbourTable } from './neighbour-table.js';
import { phaseRandomisedSurrogates } from './phase-randomised-surrogate.js';
import { seasonalSurrogates } from './seasonal-surrogate.js';
import { skillRho } from './skill-rho.js';
import type { PhasedSeries } from './stack-segments.js';

/** Options of {@link convergentCrossMapping}; every field has a default. */
export interface CcmOptions {
  /** Embedding dimension; chosen by simplex forecast skill of the library series when absent. */
  E?: number;
  /** Largest E tried when choosing (default 8). */
  maxE?: number;
  /** Delay in bins (default 1). */
  tau?: number;
  /**
   * Library points within this many bins of a predicted point are not its neighbours. Default:
   * the larger of E·τ and the library series' decorrelation time ({@link exclusionRadius}, Theiler 1986).
   */
  exclusionRadius?: number;
  /** Number of library sizes from the smallest to all usable points (default 10). */
  librarySizeCount?: number;
  /** Smallest library size (default max(E + 2, 10)). */
  minLibrarySize?: number;
  /** Random libraries per size (default 100). */
  samples?: number;
  /** Libraries of the smallest size that the surrogates are cross mapped with for the convergence test (default 20, at most `samples`). */
  testLibraries?: number;
  /** Surrogates of each kind (phase-randomised; seasonal when phases are known) for the tests (default 99; 0 skips them). */
  surrogates?: number;
  /** Usable points needed to run at all (default 50, common practice). */
  minPoints?: number;
  /** 1 − the significance level of the tests (default 0.95). */
  level?: number;
  /** Largest lag of the cross-map lag scan (Ye et al. 2015) in bins (default 0: no scan). */
  lagScan?: number;
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

/** What a direction's tests say, in short. */
export type CcmVerdict = 'drives' | 'same_bin' | 'no_evidence';

/** The result of cross mapping one direction: the library series' manifold estimates the target series. */
export interface CcmDirection {
  status: 'ok' | 'not_enough_data';
  /** Why the analysis could not run (only with `not_enough_data`). */
  reason?: string;
  E: number | undefined;
  tau: number;
  /** Exclusion radius used, in bins. */
  exclusionRadius: number | undefined;
  /** Usable points: embedding vectors of the library series with an observed target. */
  points: number;
  /** Skill of each E tried, when E was chosen. */
  embeddingSkill?: DimensionSkill[];
  skill: CcmSkillPoint[];
  /** ρ with the full library (every usable point, leave-one-out outside the exclusion radius). */
  rhoAtMax: number | undefined;
  /** Mean ρ at the smallest library size. */
  rhoAtMin: number | undefined;
  /** ρ(Lmax) − ρ(Lmin): how much the skill grows with the library. */
  deltaRho: number | undefined;
  /** 95th percentile of ρ(Lmax) over the phase-randomised surrogates. */
  surrogateRhoHigh: number | undefined;
  /** 95th percentile of ρ(Lmax) − ρ(Lmin) over the phase-randomised surrogates (their own curves, same libraries). */
  surrogateDeltaHigh: number | undefined;
  /** (1 + #surrogates with ρ(Lmax) ≥ observed) / (1 + #surrogates), phase-randomised surrogates of the target. */
  pRho: number | undefined;
  /** The same for the growth ρ(Lmax) − ρ(Lmin), ρ(Lmin) over the first `testLibraries` libraries for target and surrogates alike: does the skill grow more than the surrogates' does? */
  pConvergence: number | undefined;
  /** ρ(Lmax) against seasonal surrogates of the target (needs calendar phases). */
  pSeasonal: number | undefined;
  /** pConvergence < 1 − level and ρ grows (ρ(Lmax) > ρ(Lmin)); undefined without surrogates. */
  converges: boolean | undefined;
  /** Skill over lags (only with `lagScan`). */
  lagSkill?: LagSkill[];
  /** Lag of the highest skill in the lag scan (ties: the lag nearest 0). */
  peakLag: number | undefined;
  /**
   * `drives`: converges and ρ(Lmax) beats the surrogates (both kinds), with no lag-scan peak at lag
   * ≥ 0; `same_bin`: the same, but the lag scan peaks at lag 0 or later (a common driver within
   * the bin, or the other direction, explains it as well); `no_evidence` otherwise. Undefined
   * without surrogates.
   */
  verdict: CcmVerdict | undefined;
  surrogates: number;
}

/** A {@link CcmDirection} with status `not_enough_data` and the reason. */
export const ccmNotEnoughData = (reason: string, E: number | undefined, tau: number, points: number, embeddingSkill?: DimensionSkill[]): CcmDirection => ({
  status: 'not_enough_data',
  reason,
  E,
  tau,
  exclusionRadius: undefined,
  points,
  ...(embeddingSkill ? { embeddingSkill } : {}),
  skill: [],
  rhoAtMax: undefined,
  rhoAtMin: undefined,
  deltaRho: undefined,
  surrogateRhoHigh: undefined,
  surrogateDeltaHigh: undefined,
  pRho: undefined,
  pConvergence: undefined,
  pSeasonal: undefined,
  converges: undefined,
  peakLag: undefined,
  verdict: undefined,
  surrogates: 0,
});

/** One-sided Monte Carlo p: (1 + #surrogate statistics ≥ observed) / (1 + #surrogates) (Davison & Hinkley 1997). */
function monteCarloP(observed: number, surrogates: readonly (number | undefined)[]): number | undefined {
  let valid = 0;
  let atLeast = 0;
  for (const s of surrogates) {
    if (s === undefined) continue;
    valid++;
    if (s >= observed) atLeast++;
  }
  return valid === 0 ? undefined : (1 + atLeast) / (1 + valid);
}

/** Random streams of a cross-mapping run: a fresh stream for each set of random libraries, one stream per target for its surrogates. */
export interface CcmRandom {
  libraries: () => RandomSource;
  surrogates: readonly RandomSource[];
}

/**
 * Convergent cross mapping (Sugihara et al. 2012, Science 338:496–500) in one direction: the
 * delay embedding of `library` (its shadow manifold M_X) estimates `target` (Y) at the same bin by
 * simplex projection. If Y drives X, X's history carries Y's, and the cross-map skill ρ rises
 * ("converges") as the library grows. So "X xmap Y" is evidence of Y → X. One direction of
 * {@link convergentCrossMappings}, with one random stream for surrogates and then libraries.
 */
export function convergentCrossMapping(library: PhasedSeries, target: PhasedSeries, options: CcmOptions, random: RandomSource): CcmDirection {
  return convergentCrossMappings(library, [target], options, { libraries: () => random, surrogates: [random] })[0] as CcmDirection;
}

/**
 * Convergent cross mapping of several targets from one library series (the directions
 * "target → library" that share an effect), each result as {@link convergentCrossMapping} defines it.
 *
 * Steps: E by simplex forecast skill of `library` ({@link chooseEmbeddingDimension}) unless given;
 * the exclusion radius (default max(E·τ, decorrelation time), Theiler 1986); usable points are
 * embedding vectors over observed, unbroken bins whose target is observed; surrogates of each
 * target that keep its autocorrelation (phase-randomised, Ebisuzaki 1997; and seasonal ones that
 * also keep its calendar cycle), drawn within each segment (person) of the target; ρ with the
 * full library, and for each smaller library size the mean ρ over `samples` random libraries
 * drawn without replacement. The neighbours of a library do not depend on the series estimated,
 * so each library's neighbours are found once and serve every target with the same usable
 * points and all their surrogates ({@link libraryNeighbours}); a sorted {@link neighbourTable}
 * serves the large libraries. Targets whose usable points differ are run as separate groups, each
 * with a fresh library stream, so a target's result never depends on the other targets.
 *
 * Tests, all against the surrogates' own cross maps with the same libraries: `pRho` for
 * ρ(Lmax), `pConvergence` for the growth ρ(Lmax) − ρ(Lmin) (autocorrelated but unrelated series
 * also show a skill that grows with the library, so growth alone proves nothing), `pSeasonal`
 * for ρ(Lmax) against the seasonal surrogates. Optionally a lag scan ({@link crossMapLags}, Ye et
 * al. 2015). Randomness: each target's surrogates from its own stream, then the libraries.
 */
export function convergentCrossMappings(library: PhasedSeries, targets: readonly PhasedSeries[], options: CcmOptions, random: CcmRandom): CcmDirection[] {
  const tau = options.tau ?? 1;
  const minPoints = options.minPoints ?? 50;
  for (const target of targets) if (library.values.length !== target.values.length) throw new Error('convergentCrossMapping: library and target must have the same bins');
  const radiusFor = (E: number): number => options.exclusionRadius ?? exclusionRadius(library, E, tau);
  let E = options.E;
  let embeddingSkill: DimensionSkill[] | undefined;
  if (E === undefined) {
    const choice = chooseEmbeddingDimension(library, { maxE: options.maxE ?? 8, tau, exclusionRadius: radiusFor });
    if (!choice.ok) return targets.map(() => ccmNotEnoughData(choice.reason, undefined, tau, 0));
    E = choice.E;
    embeddingSkill = choice.skills;
  }
  const radius = radiusFor(E);
  const results: CcmDirection[] = new Array<CcmDirection>(targets.length);
  const groups = new Map<string, { points: StatePoints; members: number[] }>();
  targets.forEach((target, i) => {
    const points = delayEmbedding(library, E as number, tau, (t) => isNumber(target.values[t]));
    const key = points.positions.join(',');
    const group = groups.get(key);
    if (group) group.members.push(i);
    else groups.set(key, { points, members: [i] });
  });
  for (const { points, members } of groups.values()) {
    const run = crossMapGroup(library, members.map((i) => targets[i] as PhasedSeries), points, { ...options, E, exclusionRadius: radius, minPoints }, members.map((i) => random.surrogates[i] as RandomSource), random.libraries);
    run.forEach((result, m) => (results[members[m] as number] = embeddingSkill ? { ...result, embeddingSkill } : result));
  }
  return results;
}

/** Running sums of one target in a group. */
interface TargetRun {
  observed: Float64Array;
  phase: Float64Array[];
  seasonal: Float64Array[];
  rhoAtMax: number | undefined;
  phaseAtMax: (number | undefined)[];
  seasonalAtMax: (number | undefined)[];
  /** ρ at the smallest size over the test libraries, for the target and each phase surrogate. */
  testSum: number;
  testCount: number;
  phaseTestSum: Float64Array;
  phaseTestCount: Int32Array;
  perSize: number[][];
}

/** Cross maps targets that share the usable points `points` of the library series (E and the radius fixed). */
function crossMapGroup(library: PhasedSeries, targets: readonly PhasedSeries[], points: StatePoints, options: CcmOptions & { E: number; exclusionRadius: number; minPoints: number }, surrogateRandoms: readonly RandomSource[], libraryRandom: () => RandomSource): CcmDirection[] {
  const { E, exclusionRadius: radius, minPoints } = options;
  const tau = options.tau ?? 1;
  const alpha = 1 - (options.level ?? 0.95);
  const n = points.count;
  if (n < Math.max(minPoints, E + 3)) {
    return targets.map(() => ccmNotEnoughData(`${n} usable points (embedding vectors with an observed target), fewer than the ${Math.max(minPoints, E + 3)} needed`, E, tau, n));
  }
  const sizes = librarySizes(options.minLibrarySize ?? Math.max(E + 2, 10), n, options.librarySizeCount ?? 10);
  if (sizes.length < 2) return targets.map(() => ccmNotEnoughData(`${n} usable points leave no library size below the full library`, E, tau, n));
  const surrogateCount = options.surrogates ?? 99;
  const samples = options.samples ?? 100;
  const testLibraries = Math.min(samples, options.testLibraries ?? 20);
  const at = (series: readonly (number | undefined)[]): Float64Array => Float64Array.from(points.positions, (t) => series[t] as number);
  const runs: TargetRun[] = targets.map((target, i) => {
    const random = surrogateRandoms[i] as RandomSource;
    const phase = phaseRandomisedSurrogates(target.values, surrogateCount, random, target.segment).map(at);
    const seasonal = target.phase ? seasonalSurrogates(target.values, target.phase, surrogateCount, random, target.segment).map(at) : [];
    return {
      observed: at(target.values),
      phase,
      seasonal,
      rhoAtMax: undefined,
      phaseAtMax: [],
      seasonalAtMax: [],
      testSum: 0,
      testCount: 0,
      phaseTestSum: new Float64Array(surrogateCount),
      phaseTestCount: new Int32Array(surrogateCount),
      perSize: sizes.map(() => []),
    };
  });

  const k = E + 1;
  const all = Int32Array.from({ length: n }, (_, i) => i);
  const table = neighbourTable(points, { exclusionRadius: radius });
  const sets = emptyLibraryNeighbours(n, k);
  const estimates = new Float64Array(n);
  const skillOf = (values: Float64Array): number | undefined => skillRho(values, crossMapEstimates(sets, values, estimates));

  libraryNeighbours(points, { mask: new Uint8Array(n).fill(1), members: all }, all, radius, sets, table);
  for (const run of runs) {
    run.rhoAtMax = skillOf(run.observed);
    run.phaseAtMax = run.phase.map(skillOf);
    run.seasonalAtMax = run.seasonal.map(skillOf);
  }

  const random = libraryRandom();
  const permutation = Int32Array.from(all);
  const mask = new Uint8Array(n);
  sizes.forEach((L, sizeIndex) => {
    if (L >= n) {
      for (const run of runs) if (run.rhoAtMax !== undefined) (run.perSize[sizeIndex] as number[]).push(run.rhoAtMax);
      return;
    }
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
      libraryNeighbours(points, { mask, members }, all, radius, sets, table);
      for (let i = 0; i < L; i++) mask[members[i] as number] = 0;
      const testing = sizeIndex === 0 && s < testLibraries;
      for (const run of runs) {
        const rho = skillOf(run.observed);
        if (rho !== undefined) (run.perSize[sizeIndex] as number[]).push(rho);
        if (!testing || rho === undefined) continue;
        run.testSum += rho;
        run.testCount++;
        run.phase.forEach((values, v) => {
          const r = skillOf(values);
          if (r === undefined) return;
          run.phaseTestSum[v] = (run.phaseTestSum[v] as number) + r;
          run.phaseTestCount[v] = (run.phaseTestCount[v] as number) + 1;
        });
      }
    }
  });

  return runs.map((run, i) => {
    const target = targets[i] as PhasedSeries;
    const skill: CcmSkillPoint[] = [];
    sizes.forEach((L, sizeIndex) => {
      const rhos = run.perSize[sizeIndex] as number[];
      if (rhos.length === 0) return;
      let sum = 0;
      for (const r of rhos) sum += r;
      skill.push({ librarySize: L, rho: sum / rhos.length, rhoLow: quantile(rhos, 0.05) as number, rhoHigh: quantile(rhos, 0.95) as number, samples: rhos.length });
    });
    const rhoAtMax = run.rhoAtMax;
    const first = run.perSize[0] as number[];
    if (rhoAtMax === undefined || first.length === 0 || run.testCount === 0) {
      return ccmNotEnoughData('the cross-map skill could not be computed at the smallest and the full library (constant series or too few points)', E, tau, n);
    }
    const rhoAtMin = first.reduce((a, b) => a + b, 0) / first.length;
    const testDelta = rhoAtMax - run.testSum / run.testCount;
    const phaseDelta = run.phaseAtMax.map((r, v) => (r === undefined || run.phaseTestCount[v] === 0 ? undefined : r - (run.phaseTestSum[v] as number) / (run.phaseTestCount[v] as number)));
    const pRho = monteCarloP(rhoAtMax, run.phaseAtMax);
    const pConvergence = monteCarloP(testDelta, phaseDelta);
    const pSeasonal = run.seasonal.length > 0 ? monteCarloP(rhoAtMax, run.seasonalAtMax) : undefined;
    const high = (values: readonly (number | undefined)[]): number | undefined => quantile(values.filter((v): v is number => v !== undefined), 0.95);
    const lagSkill = options.lagScan && options.lagScan > 0 ? crossMapLags(library, target, options.lagScan, radius) : undefined;
    let peakLag: number | undefined;
    if (lagSkill) {
      let best = -Infinity;
      for (const l of lagSkill) {
        if (l.rho === undefined) continue;
        if (l.rho > best || (l.rho === best && Math.abs(l.lag) < Math.abs(peakLag as number))) {
          best = l.rho;
          peakLag = l.lag;
        }
      }
    }
    const converges = pConvergence === undefined ? undefined : pConvergence < alpha && testDelta > 0;
    const beatsSurrogates = pRho !== undefined && pRho < alpha && (pSeasonal === undefined || pSeasonal < alpha);
    const verdict: CcmVerdict | undefined =
      converges === undefined ? undefined : converges && beatsSurrogates ? (peakLag !== undefined && peakLag >= 0 ? 'same_bin' : 'drives') : 'no_evidence';
    const result: CcmDirection = {
      status: 'ok',
      E,
      tau,
      exclusionRadius: radius,
      points: n,
      skill,
      rhoAtMax,
      rhoAtMin,
      deltaRho: rhoAtMax - rhoAtMin,
      surrogateRhoHigh: high(run.phaseAtMax),
      surrogateDeltaHigh: high(phaseDelta),
      pRho,
      pConvergence,
      pSeasonal,
      converges,
      ...(lagSkill ? { lagSkill } : {}),
      peakLag,
      verdict,
      surrogates: surrogateCount,
    };
    return result;
  });
}
