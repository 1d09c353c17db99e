import { cronbachAlpha } from '../stats/cronbach-alpha.js';
import { splitHalfReliability } from '../stats/split-half-reliability.js';
import { itemAlpha } from './item-alpha.js';

/** Internal consistency of one category's terms, treated as items. */
export interface TermReliability {
  /** Items used: terms with at least one hit. */
  items: number;
  /** Rows (entries or person-bins). */
  rows: number;
  /** Raw Cronbach's alpha (psych::alpha `raw_alpha`), or undefined with `alphaReason`. */
  alpha?: number;
  /** Standardized alpha (psych::alpha `std.alpha`); computed when items ≤ `denseLimit`. */
  standardizedAlpha?: number;
  alphaReason?: string;
  /** Pearson correlation of the two half scores (odd and even terms by frequency rank). */
  halfCorrelation?: number;
  /** Split-half reliability stepped up with Spearman–Brown, 2r/(1 + r). */
  splitHalf?: number;
  splitHalfReason?: string;
}

/**
 * Cronbach's alpha and split-half reliability of a term list, with terms as items and rows as
 * units (entries, or bins of a person). `rows` are sparse `[item, value]` lists over items
 * 0…k−1, `frequency[j]` is item j's total (for the split).
 *
 * Alpha: psych::alpha-equivalent dense computation (src/stats/cronbach-alpha.ts, with the
 * standardized alpha) when k ≤ `denseLimit` (default 60), else the sparse raw alpha
 * (item-alpha.ts). Split-half: items ranked by frequency and dealt alternately to two halves
 * (ranks 1, 3, 5 … and 2, 4, 6 …; common practice to balance the halves), the half sums
 * correlated and stepped up with Spearman–Brown (Spearman 1910; Brown 1910).
 */
export function termReliability(rows: ReadonlyArray<ReadonlyArray<readonly [number, number]>>, frequency: readonly number[], denseLimit = 60): TermReliability {
  const k = frequency.length;
  const out: TermReliability = { items: k, rows: rows.length };
  if (k <= denseLimit && k >= 2) {
    const dense = function* (): Generator<number[]> {
      for (const row of rows) {
        const values = new Array<number>(k).fill(0);
        for (const [j, x] of row) values[j] = (values[j] as number) + x;
        yield values;
      }
    };
    const a = cronbachAlpha(dense());
    if (a.ok) {
      out.alpha = a.alpha;
      out.standardizedAlpha = a.standardizedAlpha;
    } else out.alphaReason = a.reason;
  } else {
    const a = itemAlpha(rows, k);
    if (a.ok) out.alpha = a.alpha;
    else out.alphaReason = a.reason;
  }
  const order = frequency.map((f, j) => [f, j] as const).sort((a, b) => b[0] - a[0] || a[1] - b[1]);
  const half = new Int8Array(k);
  order.forEach(([, j], rank) => (half[j] = rank % 2));
  if (k < 2) {
    out.splitHalfReason = 'split-half needs at least two items (terms) with hits';
    return out;
  }
  const halves = rows.map((row) => {
    let a = 0;
    let b = 0;
    for (const [j, x] of row) {
      if (half[j] === 0) a += x;
      else b += x;
    }
    return [a, b] as const;
  });
  const s = splitHalfReliability(halves, (d) => d[0], (d) => d[1]);
  if (s.ok) {
    out.halfCorrelation = s.halfCorrelation.r;
    out.splitHalf = s.reliability;
  } else out.splitHalfReason = s.reason;
  return out;
}
