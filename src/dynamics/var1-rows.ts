import { isNumber } from '../stats/is-number.js';

/** Lag-pair rows of several variables: `current[r][j]` = x_j at t, `lagged[r][j]` = x_j at t − 1. */
export interface Var1Rows {
  t: number[];
  current: number[][];
  lagged: number[][];
}

/**
 * The rows a VAR(1) can use: bins t where `lagValid[t]` is true and every variable is observed at
 * both t and t − 1 (listwise over the variables). Nothing is interpolated.
 */
export function var1Rows(columns: readonly (readonly (number | undefined)[])[], lagValid: readonly boolean[]): Var1Rows {
  const out: Var1Rows = { t: [], current: [], lagged: [] };
  const length = lagValid.length;
  for (let t = 1; t < length; t++) {
    if (!lagValid[t]) continue;
    const now: number[] = [];
    const before: number[] = [];
    let ok = true;
    for (const column of columns) {
      const a = column[t];
      const b = column[t - 1];
      if (!isNumber(a) || !isNumber(b)) {
        ok = false;
        break;
      }
      now.push(a);
      before.push(b);
    }
    if (!ok) continue;
    out.t.push(t);
    out.current.push(now);
    out.lagged.push(before);
  }
  return out;
}
