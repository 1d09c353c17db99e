import type { ShownCorrelation } from '../report-data.js';

/** A correlation-like statistic as analyses return it: estimable with r, or not with a reason. */
export type CorrelationLike =
  | { ok: true; r: number; n: number; df?: number; persons?: number; ciLow?: number | undefined; ciHigh?: number | undefined }
  | { ok: false; reason: string };

/**
 * The part of a correlation the report shows (r, interval, n, df, persons), or the reason it could
 * not be estimated.
 */
export function shownCorrelation(stat: CorrelationLike): ShownCorrelation | { missing: string } {
  if (!stat.ok) return { missing: stat.reason };
  const out: ShownCorrelation = { r: stat.r, n: stat.n };
  if (stat.ciLow !== undefined) out.ciLow = stat.ciLow;
  if (stat.ciHigh !== undefined) out.ciHigh = stat.ciHigh;
  if (stat.df !== undefined) out.df = stat.df;
  if (stat.persons !== undefined) out.persons = stat.persons;
  return out;
}
