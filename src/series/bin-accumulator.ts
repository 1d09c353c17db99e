/** How the entries of a bin are combined into one value per score column. */
export type BinReducer = 'weighted' | 'mean' | 'sum';

/** Fields per score column in a bin's slot. */
const WSUM = 0; // Σ words·x over entries with a value
const WTOTAL = 1; // Σ words over entries with a value
const SUM = 2; // Σ x (Neumaier-compensated with COMP)
const COMP = 3;
const COUNT = 4; // entries with a value
const MATCHED = 5; // matched terms
const PER_COLUMN = 6;
/** Leading fields of a slot: entries, words. */
const HEAD = 2;

/** Slots per chunk of the store (a power of two). */
const CHUNK_BITS = 12;
const CHUNK = 1 << CHUNK_BITS;

/**
 * The accumulators of every (person, unit bin), pooled in fixed-size Float64Array chunks of
 * 4,096 slots (no copying or over-allocation as the store grows): a bin is a slot of
 * `2 + 6·columns` numbers (entries, words, and per score column Σ words·x, Σ words, Σ x with
 * its Neumaier compensation, count of values, matched terms). Memory grows with the number of
 * bins that hold entries (`8·(2 + 6·columns)` bytes each, plus the key map), never with the
 * number of entries.
 */
export interface BinStore {
  columns: number;
  stride: number;
  chunks: Float64Array[];
  /** Slots in use. */
  size: number;
}

/** A fresh, empty store for `columns` score columns. */
export function createBinStore(columns: number): BinStore {
  return { columns, stride: HEAD + PER_COLUMN * columns, chunks: [], size: 0 };
}

/** Reserves a new zeroed slot and returns its number. */
export function newBinSlot(store: BinStore): number {
  if (store.size >>> CHUNK_BITS >= store.chunks.length) store.chunks.push(new Float64Array(store.stride * CHUNK));
  return store.size++;
}

/** Adds one entry to slot `slot`: its word count, score values (undefined = no value) and matched terms. */
export function addToBin(store: BinStore, slot: number, words: number, values: ReadonlyArray<number | undefined>, matched: ReadonlyArray<number>): void {
  const d = store.chunks[slot >>> CHUNK_BITS] as Float64Array;
  const base = (slot & (CHUNK - 1)) * store.stride;
  d[base] = (d[base] as number) + 1;
  d[base + 1] = (d[base + 1] as number) + words;
  for (let c = 0; c < store.columns; c++) {
    const o = base + HEAD + c * PER_COLUMN;
    d[o + MATCHED] = (d[o + MATCHED] as number) + (matched[c] ?? 0);
    const x = values[c];
    if (x === undefined || !Number.isFinite(x)) continue;
    d[o + WSUM] = (d[o + WSUM] as number) + words * x;
    d[o + WTOTAL] = (d[o + WTOTAL] as number) + words;
    // Neumaier compensated summation for the plain sum.
    const s = d[o + SUM] as number;
    const t = s + x;
    d[o + COMP] = (d[o + COMP] as number) + (Math.abs(s) >= Math.abs(x) ? s - t + x : x - t + s);
    d[o + SUM] = t;
    d[o + COUNT] = (d[o + COUNT] as number) + 1;
  }
}

/** Entries in the given slots (one slot for a unit bin, several for weekly and multi-day bins). */
export function binEntries(store: BinStore, slots: readonly number[]): number {
  let n = 0;
  for (const s of slots) n += (store.chunks[s >>> CHUNK_BITS] as Float64Array)[(s & (CHUNK - 1)) * store.stride] as number;
  return n;
}

/** Words in the given slots. */
export function binWords(store: BinStore, slots: readonly number[]): number {
  let n = 0;
  for (const s of slots) n += (store.chunks[s >>> CHUNK_BITS] as Float64Array)[(s & (CHUNK - 1)) * store.stride + 1] as number;
  return n;
}

/** Matched terms of score column `c` in the given slots. */
export function binMatched(store: BinStore, slots: readonly number[], c: number): number {
  let n = 0;
  for (const s of slots) n += (store.chunks[s >>> CHUNK_BITS] as Float64Array)[(s & (CHUNK - 1)) * store.stride + HEAD + c * PER_COLUMN + MATCHED] as number;
  return n;
}

/**
 * The value of score column `c` over the given slots: `weighted` → Σ words·x / Σ words (entries
 * without words carry no weight; undefined when the total weight is 0); `mean` → Σ x / n;
 * `sum` → Σ x. Undefined when no entry had a value (an empty bin is missing, never 0).
 */
export function reduceBin(store: BinStore, slots: readonly number[], c: number, reducer: BinReducer): number | undefined {
  let n = 0;
  let sum = 0;
  let comp = 0;
  let wsum = 0;
  let wtotal = 0;
  for (const s of slots) {
    const d = store.chunks[s >>> CHUNK_BITS] as Float64Array;
    const o = (s & (CHUNK - 1)) * store.stride + HEAD + c * PER_COLUMN;
    n += d[o + COUNT] as number;
    sum += d[o + SUM] as number;
    comp += d[o + COMP] as number;
    wsum += d[o + WSUM] as number;
    wtotal += d[o + WTOTAL] as number;
  }
  if (n === 0) return undefined;
  if (reducer === 'sum') return sum + comp;
  if (reducer === 'mean') return (sum + comp) / n;
  return wtotal > 0 ? wsum / wtotal : undefined;
}
