/** Unit bins a local day may hold in the key of `unitBinKey` (a 1-minute bin gives 1,440). */
const BINS_PER_DAY_KEY = 2048;

/**
 * The key of a person's unit bin: local day number and bin index within the day (0 for a
 * daily bin) in one number, `day · 2048 + index`.
 */
export function unitBinKey(day: number, index: number): number {
  return day * BINS_PER_DAY_KEY + index;
}
