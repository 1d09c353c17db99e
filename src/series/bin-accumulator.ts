/** How the entries of a bin are combined into one value per score column. */
export type BinReducer = 'weighted' | 'mean' | 'sum';

/**
 * One small accumulator per (person, unit bin): memory grows with bins, never with entries.
 * Unit bins are sub-daily bins or whole local days; weekly and multi-day bins are merged later.
 */
export interface BinAccumulator {
  entries: number;
  words: number;
  /** Zone of the last entry added (for the bin's local times). */
  zone: string;
  /** Per score column: Σ words·x over entries with a value. */
  weightedSum: Float64Array;
  /** Per score column: Σ words over entries with a value. */
  weightTotal: Float64Array;
  /** Per score column: Σ x over entries with a value (Neumaier-compensated via comp). */
  sum: Float64Array;
  comp: Float64Array;
  /** Per score column: entries with a value. */
  count: Int32Array;
  /** Per score column: matched terms. */
  matched: Float64Array;
}

/** A fresh accumulator for `columns` score columns. */
export function createAccumulator(columns: number, zone: string): BinAccumulator {
  return {
    entries: 0,
    words: 0,
    zone,
    weightedSum: new Float64Array(columns),
    weightTotal: new Float64Array(columns),
    sum: new Float64Array(columns),
    comp: new Float64Array(columns),
    count: new Int32Array(columns),
    matched: new Float64Array(columns),
  };
}

/** Adds one entry: its word count, score values (undefined = no value) and matched terms. */
export function addToAccumulator(acc: BinAccumulator, words: number, values: ReadonlyArray<number | undefined>, matched: ReadonlyArray<number>, zone: string): void {
  acc.entries++;
  acc.words += words;
  acc.zone = zone;
  for (let c = 0; c < values.length; c++) {
    const x = values[c];
    acc.matched[c] = (acc.matched[c] as number) + (matched[c] ?? 0);
    if (x === undefined || !Number.isFinite(x)) continue;
    acc.weightedSum[c] = (acc.weightedSum[c] as number) + words * x;
    acc.weightTotal[c] = (acc.weightTotal[c] as number) + words;
    // Neumaier compensated summation for the plain sum.
    const s = acc.sum[c] as number;
    const t = s + x;
    acc.comp[c] = (acc.comp[c] as number) + (Math.abs(s) >= Math.abs(x) ? s - t + x : x - t + s);
    acc.sum[c] = t;
    acc.count[c] = (acc.count[c] as number) + 1;
  }
}

/** Merges `b` into `a` (for weekly and multi-day bins). */
export function mergeAccumulators(a: BinAccumulator, b: BinAccumulator): void {
  a.entries += b.entries;
  a.words += b.words;
  a.zone = b.zone;
  for (let c = 0; c < a.sum.length; c++) {
    a.weightedSum[c] = (a.weightedSum[c] as number) + (b.weightedSum[c] as number);
    a.weightTotal[c] = (a.weightTotal[c] as number) + (b.weightTotal[c] as number);
    a.sum[c] = (a.sum[c] as number) + (b.sum[c] as number);
    a.comp[c] = (a.comp[c] as number) + (b.comp[c] as number);
    a.count[c] = (a.count[c] as number) + (b.count[c] as number);
    a.matched[c] = (a.matched[c] as number) + (b.matched[c] as number);
  }
}

/**
 * The bin value of column `c`: `weighted` → Σ words·x / Σ words (entries without words carry no
 * weight; undefined when the total weight is 0); `mean` → Σ x / n; `sum` → Σ x. Undefined when
 * no entry had a value.
 */
export function reduceAccumulator(acc: BinAccumulator, c: number, reducer: BinReducer): number | undefined {
  const n = acc.count[c] as number;
  if (n === 0) return undefined;
  const sum = (acc.sum[c] as number) + (acc.comp[c] as number);
  if (reducer === 'sum') return sum;
  if (reducer === 'mean') return sum / n;
  const w = acc.weightTotal[c] as number;
  return w > 0 ? (acc.weightedSum[c] as number) / w : undefined;
}
