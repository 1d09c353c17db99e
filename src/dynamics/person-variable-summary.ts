import { isNumber } from '../stats/is-number.js';
import { moments } from '../stats/variance.js';
import type { BinnedSeries } from './types.js';
import { mssd } from './mssd.js';
import { lag1AutocorrelationAcf } from './lag1-autocorrelation-acf.js';
import { lag1AutocorrelationPearson } from './lag1-autocorrelation-pearson.js';

/**
 * Default minimum of valid lag pairs before a person's series is flagged ready for dynamic
 * analysis. 50 is common practice for autoregressive models of short intensive longitudinal
 * series; it is not taken from a specific simulation study.
 */
export const DEFAULT_MIN_LAG_PAIRS = 50;

/** Descriptive dynamics of one person's variable. Undefined fields could not be estimated (see `notes`). */
export interface PersonVariableSummary {
  /** Bins in the window, observed or not. */
  bins: number;
  observed: number;
  /** 100 · missing bins / bins. */
  percentMissing: number | undefined;
  mean: number | undefined;
  /** Sample SD (n − 1). */
  sd: number | undefined;
  mssd: number | undefined;
  rmssd: number | undefined;
  /** Valid lag pairs (adjacent bins, both observed). */
  lagPairs: number;
  /** Lag-1 autocorrelation, ACF form. */
  autocorrelationAcf: number | undefined;
  /** Lag-1 autocorrelation, Pearson correlation of the lag pairs. */
  autocorrelationPearson: number | undefined;
  /** True when `lagPairs` ≥ the threshold. */
  ready: boolean;
  /** Why a value is missing or the series is not ready, one short sentence each. */
  notes: string[];
}

/** Options of {@link personVariableSummary}. */
export interface SummaryOptions {
  /** Readiness threshold on valid lag pairs (default {@link DEFAULT_MIN_LAG_PAIRS}). */
  minLagPairs?: number;
}

/**
 * Mean, SD, MSSD/RMSSD, both lag-1 autocorrelation estimators, percentage missing, valid lag pairs
 * and a readiness flag for one person's variable. Mean and SD use every observed bin (Welford);
 * the lag statistics use valid lag pairs only (see {@link mssd}, {@link lag1AutocorrelationAcf},
 * {@link lag1AutocorrelationPearson}).
 */
export function personVariableSummary(series: BinnedSeries, options: SummaryOptions = {}): PersonVariableSummary {
  const minLagPairs = options.minLagPairs ?? DEFAULT_MIN_LAG_PAIRS;
  const notes: string[] = [];
  const bins = series.values.length;
  let observed = 0;
  for (const v of series.values) if (isNumber(v)) observed += 1;
  const m = moments(series.values);
  const successive = mssd(series);
  const acf = lag1AutocorrelationAcf(series);
  const pearson = lag1AutocorrelationPearson(series);
  const lagPairs = successive.ok ? successive.pairs : 0;
  if (observed === 0) notes.push('no observed bins');
  else if (observed === 1) notes.push('only one observed bin, so no SD');
  if (!successive.ok) notes.push(successive.reason);
  else {
    if (!acf.ok) notes.push(`ACF autocorrelation: ${acf.reason}`);
    if (!pearson.ok) notes.push(`Pearson autocorrelation: ${pearson.reason}`);
  }
  const constant = m.n > 1 && m.sumSquares === 0;
  if (constant) notes.push('the series never changes, so it carries no dynamics to estimate');
  const ready = lagPairs >= minLagPairs && !constant;
  if (lagPairs < minLagPairs) notes.push(`${lagPairs} valid lag pairs, fewer than the ${minLagPairs} needed for dynamic estimates`);
  return {
    bins,
    observed,
    percentMissing: bins > 0 ? (100 * (bins - observed)) / bins : undefined,
    mean: m.n > 0 ? m.mean : undefined,
    sd: m.n > 1 ? Math.sqrt(m.sumSquares / (m.n - 1)) : undefined,
    mssd: successive.ok ? successive.mssd : undefined,
    rmssd: successive.ok ? successive.rmssd : undefined,
    lagPairs,
    autocorrelationAcf: acf.ok ? acf.r : undefined,
    autocorrelationPearson: pearson.ok ? pearson.r : undefined,
    ready,
    notes,
  };
}
