import type { Season } from './calendar-phase.js';
import { ccmNotEnoughData, type CcmOptions } from './convergent-cross-mapping.js';
import { crossMapPerson, personCrossMaps, personSeries, type CcmRow, type CrossMapSettings, type EmbeddingRow, type PersonCrossMaps } from './person-cross-maps.js';
import { DEFAULT_MIN_LAG_PAIRS, personVariableSummary, type PersonVariableSummary } from './person-variable-summary.js';
import { pooledVar1 } from './pooled-var1.js';
import { stackSegments, type PhasedSeries } from './stack-segments.js';
import type { PersonSeriesInput } from './types.js';
import { var1, type Var1Coefficient } from './var1.js';

export type { CcmRow } from './person-cross-maps.js';

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
  /** Most observed bins of a stacked series that is cross mapped (default {@link MAX_STACKED_BINS}); above it the stacked rows say why not. */
  maxStackedBins?: number;
  /**
   * Calendar cycle kept by the seasonal surrogates (see calendarPhase): `auto` (default) is the
   * hour of the local day for bins shorter than a day and the local weekday for daily bins.
   */
  season?: Season;
  /** Cross maps of each person computed elsewhere (e.g. by worker threads), in `persons` order; computed here when absent. */
  crossMaps?: readonly PersonCrossMaps[];
  /** Called after each person's cross maps (for progress). */
  onPerson?: (done: number, total: number) => void;
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

/** Everything {@link analyseDynamics} computes. */
export interface DynamicsResult {
  options: {
    variables: string[];
    pairs: Array<[string, string]>;
    minLagPairs: number;
    ccm: CcmOptions;
    skipCrossMapping: boolean;
    stack: boolean;
    season: Season;
    seed: number | string;
  };
  summaries: SummaryRow[];
  var: VarRow[];
  ccm: CcmRow[];
  /** Per person (or the stacked set) and series: the chosen E, the skill of every E tried, and a note when no E gave a positive skill. */
  embedding: EmbeddingRow[];
  notes: string[];
}

const STACKED = '';

/**
 * Most bins a stacked series may have for cross mapping: the work grows with the square of the
 * bins (neighbour tables, choosing E), and 10,000 bins already take minutes (docs/performance.md).
 */
export const MAX_STACKED_BINS = 10_000;

/** The variables, pairs and cross-mapping settings {@link analyseDynamics} uses for these options (for running the cross maps elsewhere, e.g. in worker threads). */
export function crossMapSettings(persons: readonly PersonSeriesInput[], options: DynamicsOptions): CrossMapSettings & { variables: string[]; pairs: Array<[string, string]>; minLagPairs: number } {
  const variables = [...(options.variables ?? Object.keys(persons[0]?.values ?? {}))];
  const pairs: Array<[string, string]> = options.pairs
    ? options.pairs.map(([a, b]) => [a, b])
    : variables.flatMap((a, i) => variables.slice(i + 1).map((b): [string, string] => [a, b]));
  const minLagPairs = options.minLagPairs ?? DEFAULT_MIN_LAG_PAIRS;
  const ccm: CcmOptions = { ...options.ccm, minPoints: options.ccm?.minPoints ?? minLagPairs };
  return { variables, pairs, minLagPairs, ccm, seed: options.seed, season: options.season ?? 'auto' };
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
  const settings = crossMapSettings(persons, options);
  const { variables, pairs, minLagPairs, ccm: ccmOptions } = settings;
  const season = settings.season ?? 'auto';
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

  const embedding: EmbeddingRow[] = [];
  const ccmRows: CcmRow[] = [];
  if (!options.skipCrossMapping && pairs.length > 0) {
    persons.forEach((person, i) => {
      const maps = options.crossMaps?.[i] ?? crossMapPerson(person, settings);
      ccmRows.push(...maps.ccm);
      embedding.push(...maps.embedding);
      options.onPerson?.(i + 1, persons.length);
    });
    if (options.stack) {
      // Gap between persons: an embedding vector's span. A default exclusion radius longer than the gap only
      // keeps a few of the next person's first bins from being neighbours, which is harmless.
      const gap = Math.max(ccmOptions.exclusionRadius ?? 0, (ccmOptions.maxE ?? 8) * (ccmOptions.tau ?? 1));
      const cache = new Map<string, PhasedSeries>();
      const stackOf = (variable: string): PhasedSeries => {
        if (!cache.has(variable)) cache.set(variable, stackSegments(persons.map((p) => personSeries(p, variable, season)), gap));
        return cache.get(variable) as PhasedSeries;
      };
      const bins = Math.max(0, ...variables.map((v) => stackOf(v).values.filter((x) => x !== undefined).length));
      const maxBins = options.maxStackedBins ?? MAX_STACKED_BINS;
      if (bins > maxBins) {
        const reason = `the stacked series has ${bins} observed bins, more than the ${maxBins} that stacked cross mapping handles in reasonable time; read the per-person rows, or stack fewer persons or a coarser bin`;
        for (const [a, b] of pairs)
          for (const [cause, effect] of [
            [a, b],
            [b, a],
          ])
            ccmRows.push({ scope: 'stacked', person: STACKED, cause: cause as string, effect: effect as string, ...ccmNotEnoughData(reason, undefined, ccmOptions.tau ?? 1, bins) });
        notes.push(`Stacked cross mapping was skipped: ${reason}.`);
      } else {
        const stacked = personCrossMaps('stacked', STACKED, stackOf, settings);
        ccmRows.push(...stacked.ccm);
        embedding.push(...stacked.embedding);
      }
    }
  }
  const unskilled = embedding.filter((e) => e.note !== undefined).length;
  if (unskilled > 0) {
    notes.push(`${unskilled} of ${embedding.length} series have no positive forecast skill one bin ahead at any embedding dimension (see the embedding notes): the cross-map rows with such a series as effect say little about causation.`);
  }
  return {
    options: { variables, pairs, minLagPairs, ccm: ccmOptions, skipCrossMapping: Boolean(options.skipCrossMapping), stack: Boolean(options.stack), season, seed: options.seed },
    summaries,
    var: varRows,
    ccm: ccmRows,
    embedding,
    notes,
  };
}
