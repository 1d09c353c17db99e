import { notEstimable, type StatResult } from '../stats/stat-result.js';
import type { BinnedSeries } from './types.js';
import { simplexForecast } from './simplex-forecast.js';

/** Forecast skill of one embedding dimension. */
export interface DimensionSkill {
  E: number;
  /** Undefined when the skill could not be computed at this E. */
  rho: number | undefined;
  /** Forecasts made. */
  n: number;
}

/** The chosen embedding dimension and the skill of every candidate. */
export interface EmbeddingChoice {
  E: number;
  rho: number;
  skills: DimensionSkill[];
}

/** Options of {@link chooseEmbeddingDimension}. */
export interface EmbeddingChoiceOptions {
  /** Largest E tried (default 8). */
  maxE?: number;
  tau?: number;
  /** Horizon of the forecast used to judge E (default 1). */
  Tp?: number;
  /** Exclusion radius in bins, or a function of E giving it (default 0: the point itself). */
  exclusionRadius?: number | ((E: number) => number);
}

/**
 * Chooses the embedding dimension E of a series by simplex forecast skill (Sugihara & May 1990):
 * leave-one-out simplex forecasts Tp bins ahead over all usable vectors for E = 1 … maxE, and
 * the E with the highest ρ wins (the smallest E on ties). Not estimable when no E gives a skill.
 */
export function chooseEmbeddingDimension(series: BinnedSeries, options: EmbeddingChoiceOptions = {}): StatResult<EmbeddingChoice> {
  const maxE = options.maxE ?? 8;
  const skills: DimensionSkill[] = [];
  let best: DimensionSkill | undefined;
  for (let E = 1; E <= maxE; E++) {
    const radius = typeof options.exclusionRadius === 'function' ? options.exclusionRadius(E) : (options.exclusionRadius ?? 0);
    const forecast = simplexForecast(series, { E, tau: options.tau ?? 1, Tp: options.Tp ?? 1, exclusionRadius: radius });
    const entry: DimensionSkill = { E, rho: forecast.skill.ok ? forecast.skill.rho : undefined, n: forecast.skill.ok ? forecast.skill.n : 0 };
    skills.push(entry);
    if (entry.rho !== undefined && (best === undefined || entry.rho > (best.rho as number))) best = entry;
  }
  if (!best) return notEstimable('no_forecast_skill', `no embedding dimension from 1 to ${maxE} gave a forecast skill (too few usable vectors)`);
  return { ok: true, E: best.E, rho: best.rho as number, skills };
}
