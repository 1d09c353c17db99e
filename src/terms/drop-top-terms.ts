import { pearsonCorrelation } from '../stats/pearson-correlation.js';
import type { Aggregation } from '../lexicon/lexicon-types.js';

/** One scored hit of an entry: term index and the weight it added to the category. */
export type TermContribution = readonly [term: number, weight: number];

/** An entry as the sensitivity check sees it. */
export interface ContributionRow {
  nWords: number;
  hits: readonly TermContribution[];
}

/** The result of dropping the k most frequent terms. */
export interface DropTopTerms {
  k: number;
  dropped: number[];
  /** Pearson correlation of entry scores with and without the dropped terms. */
  r?: number;
  n: number;
  reason?: string;
  meanBefore?: number;
  meanAfter?: number;
}

/** An entry's category score from its hits: count → 100·Σw/words, sum → Σw, rating → mean w (undefined without hits). */
export function categoryScore(row: ContributionRow, aggregation: Aggregation, skip?: ReadonlySet<number>): number | undefined {
  let sum = 0;
  let n = 0;
  for (const [t, w] of row.hits) {
    if (skip?.has(t)) continue;
    sum += w;
    n++;
  }
  if (aggregation === 'count') return row.nWords > 0 ? (100 * sum) / row.nWords : undefined;
  if (aggregation === 'rating') return n > 0 ? sum / n : undefined;
  return sum;
}

function mean(values: ReadonlyArray<number | undefined>): number | undefined {
  let m = 0;
  let n = 0;
  for (const v of values) {
    if (v === undefined) continue;
    n++;
    m += (v - m) / n;
  }
  return n > 0 ? m : undefined;
}

/**
 * "Drop the top k terms" sensitivity check: for k = 1…maxK, the entry scores of one category are
 * recomputed without its k most frequent terms (`order`: term indices, most frequent first) and
 * correlated (Pearson, entries where both scores exist) with the scores of the full list. A low r
 * means a few terms drive the measure. Common practice in dictionary validation; no single source.
 */
export function dropTopTerms(rows: readonly ContributionRow[], aggregation: Aggregation, order: readonly number[], maxK: number): DropTopTerms[] {
  const before = rows.map((r) => categoryScore(r, aggregation));
  const out: DropTopTerms[] = [];
  for (let k = 1; k <= Math.min(maxK, order.length); k++) {
    const dropped = order.slice(0, k);
    const skip = new Set(dropped);
    const after = rows.map((r) => categoryScore(r, aggregation, skip));
    const c = pearsonCorrelation(before.map((b, i) => [b, after[i]] as const));
    const item: DropTopTerms = { k, dropped, n: c.ok ? c.n : before.filter((b, i) => b !== undefined && after[i] !== undefined).length, meanBefore: mean(before), meanAfter: mean(after) };
    if (c.ok) item.r = c.r;
    else item.reason = c.reason;
    out.push(item);
  }
  return out;
}
