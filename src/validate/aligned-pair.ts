/**
 * One aligned observation of a text score (x) and a self-report rating (y) for a person.
 * `x` or `y` may be missing (`undefined`); analyses use complete pairs only.
 */
export interface AlignedPair {
  person: string;
  x: number | undefined;
  y: number | undefined;
}
