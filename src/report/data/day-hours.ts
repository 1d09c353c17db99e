import { offsetMinutes } from './offset-minutes.js';
import type { SeriesRow } from './series-row.js';

/**
 * Real length in hours of a local day from its bins, or undefined when it is an ordinary 24-hour
 * day. A day is a clock-change day when a bin's `bin_hours` differs from the nominal bin length
 * (daily or multi-hour bins spanning the change) or when the UTC offsets of its bin starts differ
 * (sub-daily bins); its length is then 24 h plus the offset change, or the summed bin hours of a
 * single daily bin.
 */
export function dayHours(bins: readonly SeriesRow[], nominalBinHours: number): number | undefined {
  if (bins.length === 0) return undefined;
  const offsets = bins.map((b) => offsetMinutes(b.binStart)).filter((o): o is number => o !== undefined);
  const first = offsets[0];
  const last = offsets[offsets.length - 1];
  if (first !== undefined && last !== undefined && first !== last) return 24 + (first - last) / 60;
  const odd = bins.find((b) => Math.abs(b.binHours - nominalBinHours) > 1e-9);
  if (!odd) return undefined;
  if (nominalBinHours >= 24) return odd.binHours;
  return 24 + (odd.binHours - nominalBinHours);
}
