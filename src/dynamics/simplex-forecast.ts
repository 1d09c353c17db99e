import { isNumber } from '../stats/is-number.js';
import type { StatResult } from '../stats/stat-result.js';
import type { BinnedSeries } from './types.js';
import { delayEmbedding } from './delay-embedding.js';
import { forecastSkill, type Skill } from './forecast-skill.js';
import { simplexProjection } from './simplex-projection.js';
import { spanValid } from './span-valid.js';

/** An inclusive range of bins. */
export interface BinRange {
  from: number;
  to: number;
}

/** Options of {@link simplexForecast}. */
export interface SimplexForecastOptions {
  E: number;
  /** Delay between coordinates in bins (default 1). */
  tau?: number;
  /** Prediction horizon in bins (default 1). */
  Tp?: number;
  /** Bins whose vectors form the library (default all); a library vector's t + Tp must lie inside. */
  library?: BinRange;
  /** Bins whose vectors are predicted (default all); their lags may come from before the range. */
  prediction?: BinRange;
  /** Library vectors within this many bins of the predicted one are skipped (default 0: itself). */
  exclusionRadius?: number;
}

/** One forecast: bin t's vector predicts bin t + Tp. */
export interface ForecastRow {
  /** Bin of the predicted value (t + Tp). */
  bin: number;
  observed: number;
  predicted: number | undefined;
}

/** Forecasts and their skill. */
export interface SimplexForecast {
  rows: ForecastRow[];
  skill: StatResult<Skill>;
  libraryPoints: number;
}

/**
 * Simplex projection forecast of a series from its own delay embedding (Sugihara & May 1990,
 * Nature 344:734–741): each prediction vector v_t ({@link delayEmbedding}) is projected Tp bins
 * ahead from its E + 1 nearest library vectors. Only vectors whose whole span t − (E−1)τ … t + Tp
 * is observed and free of breaks are used (library and prediction alike), so no forecast crosses
 * a missing bin or a night. Library and prediction may overlap; the exclusion radius then keeps a
 * vector from predicting itself.
 */
export function simplexForecast(series: BinnedSeries, options: SimplexForecastOptions): SimplexForecast {
  const Tp = options.Tp ?? 1;
  const tau = options.tau ?? 1;
  const last = series.values.length - 1;
  const points = delayEmbedding(series, options.E, tau, (t) => (Tp === 0 ? true : spanValid(series, t, t + Tp)));
  const library: number[] = [];
  const prediction: number[] = [];
  const libraryRange = options.library ?? { from: 0, to: last };
  const predictionRange = options.prediction ?? { from: 0, to: last };
  const target = new Float64Array(points.count);
  for (let r = 0; r < points.count; r++) {
    const t = points.positions[r] as number;
    target[r] = series.values[t + Tp] as number;
    if (t >= libraryRange.from && t + Tp <= libraryRange.to && t <= libraryRange.to) library.push(r);
    if (t >= predictionRange.from && t <= predictionRange.to) prediction.push(r);
  }
  const estimates = simplexProjection(points, target, library, prediction, { exclusionRadius: options.exclusionRadius ?? 0 });
  const rows: ForecastRow[] = prediction.map((r, p) => ({ bin: (points.positions[r] as number) + Tp, observed: target[r] as number, predicted: estimates[p] }));
  const skill = forecastSkill(
    rows.map((row) => row.observed),
    rows.map((row) => (isNumber(row.predicted) ? row.predicted : undefined)),
  );
  return { rows, skill, libraryPoints: library.length };
}
