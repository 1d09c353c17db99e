import { random } from '../stats/random.js';
import { chooseEmbeddingDimension, type DimensionSkill } from './choose-embedding-dimension.js';
import { ccmNotEnoughData, convergentCrossMapping, type CcmDirection, type CcmOptions } from './convergent-cross-mapping.js';
import { DEFAULT_MIN_LAG_PAIRS, personVariableSummary, type PersonVariableSummary } from './person-variable-summary.js';
import { pooledVar1 } from './pooled-var1.js';
import { stackSegments, type PhasedSeries } from './stack-segments.js';
import type { PersonSeriesInput } from './types.js';
import { var1, type Var1Coefficient } from './var1.js';

/** Options of {@link analyseDynamics}. Everything but `seed` has a default. */
export interface DynamicsOptions {
  /** Variables (score columns) to describe; default every column of the first person. */
  variables?: readonly string[];
  /** Pairs for the cross-lagged VAR(1) and CCM; default every pair of `variables`. */
  pairs?: ReadonlyArray<readonly [string, string]>;
  /** Readiness threshold on valid lag pairs (default 50, common practice). */
  minLagPairs?: number;
  /** CCM settings (E fixed when given, else chosen per person and variable). */
  ccm?: CcmOptions;
  /** Skip convergent cross mapping altogether (default false). */
  skipCrossMapping?: boolean;
  /** Also cross map all persons' segments stacked end to end (default false). */
  stack?: boolean;
  /**
   * Bins per cycle for seasonal surrogates. Default: the bin of the day when bins are shorter
   * than a day, else a 7-bin (weekly) cycle.
   */
  seasonPeriod?: number;
  /** Seed of every random step; each analysis gets its own stream derived from it. */
  seed: number | string;
}

/** Per person and variable. */
export interface SummaryRow extends PersonVariableSummary {
  person: string;
  variable: string;
}

/** One coefficient of a per-person or pooled VAR(1) of a pair. */
export interface VarRow extends Partial<Var1Coefficient> {
  scope: 'person' | 'pooled';
  /** Empty for the pooled fit. */
  person: string;
  /** The two variables, in the order given. */
  pair: [string, string];
  status: 'ok' | 'not_enough_data';
  reason?: string;
  /** Lag pairs used. */
  lagPairs: number;
  df?: number;
  /** Persons in the pooled fit. */
  persons?: number;
  /** lagPairs ≥ minLagPairs (per person); always true for the pooled fit when it is estimable. */
  ready: boolean;
}

/** One direction of CCM for one pair. "effect xmap cause": the effect's manifold estimates the cause. */
export interface CcmRow extends CcmDirection {
  scope: 'person' | 'stacked';
  /** Empty for stacked analyses. */
  person: string;
  /** The putative driver (the cross-mapped, target series). */
  cause: string;
  /** The driven series whose delay embedding is the library. */
  effect: string;
}

/** Everything {@link analyseDynamics} computes. */
export interface DynamicsResult {
  options: {
    variables: string[];
    pairs: Array<[string, string]>;
    minLagPairs: number;
    ccm: CcmOptions;
    skipCrossMapping: boolean;
    stack: boolean;
    seasonPeriod: number | undefined;
    seed: number | string;
  };
  summaries: SummaryRow[];
  var: VarRow[];
  ccm: CcmRow[];
  /** Embedding dimension chosen per person and variable (by simplex forecast skill). */
  /** Per person (or the stacked set) and series: the chosen E, the skill of every E tried, and a note when no E gave a positive skill. */
  embedding: Array<{ person: string; variable: string; E: number | undefined; skills: DimensionSkill[]; reason?: string; note?: string }>;
  notes: string[];
}

const STACKED = '';

/**
 * The note for a series whose best simplex forecast skill is not above 0: it shows no
 * low-dimensional deterministic dynamics at this resolution (a positive forecast skill is the
 * usual first check before cross mapping in empirical dynamic modelling; Chang, Ushio & Hsieh
 * 2017, Ecological Research 32:785–796, cited from memory).
 */
function noSkillNote(rho: number, E: number): string {
  return `no embedding dimension gives this series a positive forecast skill one bin ahead (best ρ = ${rho.toFixed(3)} at E = ${E}): it shows no low-dimensional dynamics at this resolution, and cross maps from its embedding say little`;
}

/**
 * Runs the dynamics analyses over persons' series: per person and variable the descriptive
 * dynamics ({@link personVariableSummary}); per pair the within-person VAR(1) per person
 * ({@link var1}) and pooled with person fixed effects ({@link pooledVar1}); and convergent cross
 * mapping in both directions per person ({@link convergentCrossMapping}), optionally also on all
 * persons stacked ({@link stackSegments}). Pure: randomness comes from `options.seed` only, one
 * stream per (person, cause, effect), so results do not depend on which other pairs are run.
 */
export function analyseDynamics(persons: readonly PersonSeriesInput[], options: DynamicsOptions): DynamicsResult {
  const variables = [...(options.variables ?? Object.keys(persons[0]?.values ?? {}))];
  const pairs: Array<[string, string]> = options.pairs
    ? options.pairs.map(([a, b]) => [a, b])
    : variables.flatMap((a, i) => variables.slice(i + 1).map((b): [string, string] => [a, b]));
  const minLagPairs = options.minLagPairs ?? DEFAULT_MIN_LAG_PAIRS;
  const ccmOptions: CcmOptions = { ...options.ccm, minPoints: options.ccm?.minPoints ?? minLagPairs };
  const notes: string[] = [
    'Person-mean centring biases autoregressive effects downward in short series (Hamaker & Grasman 2015); compare with the pooled fixed-effects estimates and treat short series with care.',
  ];
  const summaries: SummaryRow[] = [];
  for (const person of persons)
    for (const variable of variables) {
      const values = person.values[variable] ?? [];
      summaries.push({ person: person.person, variable, ...personVariableSummary({ values, lagValid: person.lagValid }, { minLagPairs }) });
    }

  const varRows: VarRow[] = [];
  for (const pair of pairs) {
    for (const person of persons) {
      const fit = var1(person.values, person.lagValid, pair);
      if (!fit.ok) {
        varRows.push({ scope: 'person', person: person.person, pair, status: 'not_enough_data', reason: fit.reason, lagPairs: 0, ready: false });
        continue;
      }
      for (const c of fit.coefficients) varRows.push({ scope: 'person', person: person.person, pair, status: 'ok', lagPairs: fit.pairs, df: fit.df, ready: fit.pairs >= minLagPairs, ...c });
    }
    const pooled = pooledVar1(persons, pair);
    if (!pooled.ok) varRows.push({ scope: 'pooled', person: '', pair, status: 'not_enough_data', reason: pooled.reason, lagPairs: 0, ready: false });
    else for (const c of pooled.coefficients) varRows.push({ scope: 'pooled', person: '', pair, status: 'ok', lagPairs: pooled.pairs, df: pooled.df, persons: pooled.persons, ready: true, ...c });
  }

  const seasonPeriod = options.seasonPeriod;
  const phased = (person: PersonSeriesInput, variable: string): PhasedSeries => {
    const values = person.values[variable] ?? [];
    const subDaily = person.binOfDay !== undefined && person.binOfDay.some((b) => b > 1);
    const phase = seasonPeriod !== undefined ? person.t.map((t) => t % seasonPeriod) : subDaily ? [...(person.binOfDay as readonly number[])] : person.t.map((t) => t % 7);
    return { values, lagValid: person.lagValid, phase };
  };
  const embedding: DynamicsResult['embedding'] = [];
  const ccmRows: CcmRow[] = [];
  const crossMap = (scope: 'person' | 'stacked', personId: string, series: (variable: string) => PhasedSeries): void => {
    const chosenE = new Map<string, number | undefined>();
    const eFor = (variable: string): number | undefined => {
      if (ccmOptions.E !== undefined) return ccmOptions.E;
      if (!chosenE.has(variable)) {
        const choice = chooseEmbeddingDimension(series(variable), { maxE: ccmOptions.maxE ?? 8, tau: ccmOptions.tau ?? 1, exclusionRadius: ccmOptions.exclusionRadius ?? 0 });
        chosenE.set(variable, choice.ok ? choice.E : undefined);
        embedding.push({
          person: personId,
          variable,
          E: choice.ok ? choice.E : undefined,
          skills: choice.ok ? choice.skills : [],
          ...(choice.ok ? {} : { reason: choice.reason }),
          ...(choice.ok && !(choice.rho > 0) ? { note: noSkillNote(choice.rho, choice.E) } : {}),
        });
      }
      return chosenE.get(variable);
    };
    for (const [a, b] of pairs)
      for (const [cause, effect] of [
        [a, b],
        [b, a],
      ] as const) {
        const E = eFor(effect);
        const base = { scope, person: personId, cause, effect };
        if (E === undefined) {
          ccmRows.push({ ...base, ...ccmNotEnoughData(`no embedding dimension of \`${effect}\` gave a forecast skill (too few usable bins)`, undefined, ccmOptions.tau ?? 1, 0) });
          continue;
        }
        const result = convergentCrossMapping(series(effect), series(cause), { ...ccmOptions, E }, random(`${String(options.seed)}|${scope}|${personId}|${cause}|${effect}`));
        ccmRows.push({ ...base, ...result });
      }
  };
  if (!options.skipCrossMapping && pairs.length > 0) {
    for (const person of persons) crossMap('person', person.person, (variable) => phased(person, variable));
    if (options.stack) {
      const gap = Math.max(ccmOptions.exclusionRadius ?? 0, 0);
      const cache = new Map<string, PhasedSeries>();
      crossMap('stacked', STACKED, (variable) => {
        if (!cache.has(variable)) cache.set(variable, stackSegments(persons.map((p) => phased(p, variable)), gap));
        return cache.get(variable) as PhasedSeries;
      });
    }
  }
  const unskilled = embedding.filter((e) => e.note !== undefined).length;
  if (unskilled > 0) {
    notes.push(`${unskilled} of ${embedding.length} series have no positive forecast skill one bin ahead at any embedding dimension (see the embedding notes): the cross-map rows with such a series as effect say little about causation.`);
  }
  return {
    options: { variables, pairs, minLagPairs, ccm: ccmOptions, skipCrossMapping: Boolean(options.skipCrossMapping), stack: Boolean(options.stack), seasonPeriod, seed: options.seed },
    summaries,
    var: varRows,
    ccm: ccmRows,
    embedding,
    notes,
  };
}
