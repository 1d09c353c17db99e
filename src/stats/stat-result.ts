/**
 * The outcome of a statistic that may not be estimable from the data at hand.
 *
 * Numeric primitives never return a fake 0 or NaN: when a value cannot be computed they return
 * `{ ok: false, code, reason }`, where `code` is a fixed machine-readable word (for example
 * `too_few_values`, `zero_variance`) and `reason` a sentence a researcher can read.
 */
export type StatResult<T> = ({ ok: true } & T) | NotEstimable;

/** Why a statistic could not be computed. */
export interface NotEstimable {
  ok: false;
  code: string;
  reason: string;
}

/** Builds a {@link NotEstimable} outcome. */
export function notEstimable(code: string, reason: string): NotEstimable {
  return { ok: false, code, reason };
}
