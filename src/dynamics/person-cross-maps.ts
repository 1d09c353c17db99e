import { random, type RandomSource } from '../stats/random.js';
import { calendarPhase, type Season } from './calendar-phase.js';
import { chooseEmbeddingDimension, type DimensionSkill } from './choose-embedding-dimension.js';
import { ccmNotEnoughData, convergentCrossMappings, type CcmDirection, type CcmOptions } from './convergent-cross-mapping.js';
import { exclusionRadius } from './exclusion-radius.js';
import type { PhasedSeries } from './stack-segments.js';
import type { PersonSeriesInput } from './types.js';

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

/** The embedding dimension chosen for one person's (or the stack's) series, with the skill of every E tried. */
export interface EmbeddingRow {
  person: string;
  variable: string;
  E: number | undefined;
  skills: DimensionSkill[];
  reason?: string;
  note?: string;
}

/** What cross mapping of one person needs besides the series; plain data, so it can be sent to a worker. */
export interface CrossMapSettings {
  pairs: ReadonlyArray<readonly [string, string]>;
  ccm: CcmOptions;
  seed: number | string;
  season?: Season;
}

/** The cross maps of one person (or of the stack): rows in pair order, cause → effect then the reverse. */
export interface PersonCrossMaps {
  ccm: CcmRow[];
  embedding: EmbeddingRow[];
}

/**
 * The note for a series whose best simplex forecast skill is not above 0: it shows no
 * low-dimensional deterministic dynamics at this resolution (a positive forecast skill is the
 * usual first check before cross mapping in empirical dynamic modelling; Chang, Ushio & Hsieh
 * 2017, Ecological Research 32:785–796, cited from memory).
 */
function noSkillNote(rho: number, E: number): string {
  return `no embedding dimension gives this series a positive forecast skill one bin ahead (best ρ = ${rho.toFixed(3)} at E = ${E}): it shows no low-dimensional dynamics at this resolution, and cross maps from its embedding say little`;
}

/** A person's series of one variable with its calendar phase, as cross mapping takes it. */
export function personSeries(person: PersonSeriesInput, variable: string, season: Season = 'auto'): PhasedSeries {
  const phase = calendarPhase(person, season);
  return { values: person.values[variable] ?? [], lagValid: person.lagValid, ...(phase ? { phase } : {}) };
}

/**
 * Cross maps every pair in both directions for one person (or the stack, `scope` 'stacked'):
 * E chosen once per series by simplex forecast skill (with the default exclusion radius of each
 * E unless one is given), then {@link convergentCrossMappings} once per effect for all its causes
 * (one set of libraries and neighbours), with random streams of their own per (scope, person,
 * effect) for the libraries and per (scope, person, cause, effect) for the surrogates, so a
 * direction's result does not depend on which other pairs, persons or threads run. Pure.
 */
export function personCrossMaps(scope: 'person' | 'stacked', personId: string, series: (variable: string) => PhasedSeries, settings: CrossMapSettings): PersonCrossMaps {
  const ccmOptions = settings.ccm;
  const tau = ccmOptions.tau ?? 1;
  const embedding: EmbeddingRow[] = [];
  const ccm: CcmRow[] = [];
  const chosenE = new Map<string, number | undefined>();
  const eFor = (variable: string): number | undefined => {
    if (ccmOptions.E !== undefined) return ccmOptions.E;
    if (!chosenE.has(variable)) {
      const s = series(variable);
      const choice = chooseEmbeddingDimension(s, { maxE: ccmOptions.maxE ?? 8, tau, exclusionRadius: (E) => ccmOptions.exclusionRadius ?? exclusionRadius(s, E, tau) });
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
  // Directions in output order; those with the same effect are cross mapped together (one set of
  // libraries and neighbours), each cause with a surrogate stream of its own.
  const directions = settings.pairs.flatMap(([a, b]) => [
    { cause: a, effect: b },
    { cause: b, effect: a },
  ]);
  const results = new Map<string, CcmDirection>();
  const done = new Set<string>();
  for (const { effect } of directions) {
    const E = eFor(effect);
    if (done.has(effect)) continue;
    done.add(effect);
    const causes = [...new Set(directions.filter((d) => d.effect === effect).map((d) => d.cause))];
    if (E === undefined) {
      for (const cause of causes) results.set(`${effect}\u0000${cause}`, ccmNotEnoughData(`no embedding dimension of \`${effect}\` gave a forecast skill (too few usable bins)`, undefined, tau, 0));
      continue;
    }
    const stream = (cause: string): RandomSource => random(`${String(settings.seed)}|${scope}|${personId}|${cause}|${effect}`);
    const mapped = convergentCrossMappings(series(effect), causes.map(series), { ...ccmOptions, E }, {
      libraries: () => random(`${String(settings.seed)}|${scope}|${personId}|${effect}|libraries`),
      surrogates: causes.map(stream),
    });
    causes.forEach((cause, i) => results.set(`${effect}\u0000${cause}`, mapped[i] as CcmDirection));
  }
  for (const { cause, effect } of directions) ccm.push({ scope, person: personId, cause, effect, ...(results.get(`${effect}\u0000${cause}`) as CcmDirection) });
  return { ccm, embedding };
}

/** {@link personCrossMaps} of one person's series (calendar phases from `settings.season`). */
export function crossMapPerson(person: PersonSeriesInput, settings: CrossMapSettings): PersonCrossMaps {
  return personCrossMaps('person', person.person, (variable) => personSeries(person, variable, settings.season), settings);
}
