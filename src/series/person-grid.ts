import { binInExcludedHours } from './bin-spec.js';
import { dayStartAt } from './day-start-at.js';
import { localDayOf } from './local-day.js';
import type { PersonBins, SeriesState } from './series-types.js';
import { unitBinKey } from './unit-bin-key.js';
import { zoneTimeline } from './zone-timeline.js';

/** One bin of a person's grid, with the accumulator slots of the unit bins it covers. */
export interface GridBin {
  start: number;
  end: number;
  zone: string;
  day: number;
  binOfDay: number;
  /** Slots of the unit bins that make up this bin (empty when no entries). */
  slots: number[];
  excluded: boolean;
  outside: boolean;
  /** Last local day the bin covers. */
  lastDay: number;
}

/**
 * Lays the person's regular grid over the study window (a common span, the person's own window,
 * or first to last activity; always every day with entries) and attaches the accumulators of
 * the unit bins each grid bin covers.
 */
export function personGrid(state: SeriesState, bins: PersonBins, person: string): GridBin[] {
  const { options } = state;
  const dataFirst = bins.firstDay;
  const dataLast = bins.lastDay;
  // The grid covers the study window (a common span, the person's own window, or first to last
  // activity) and always every day with entries: bins outside the window are rows marked
  // `outside_window`, so no entry is lost from the series without a trace.
  const own = options.windows?.get(person);
  const limits = [options.span, own].filter((w): w is { from: number; to: number } => w !== undefined);
  const window = limits.length > 0 ? { from: Math.max(...limits.map((w) => w.from)), to: Math.min(...limits.map((w) => w.to)) } : { from: dataFirst, to: dataLast };
  const grid = { from: Math.min(options.span?.from ?? own?.from ?? dataFirst, dataFirst), to: Math.max(options.span?.to ?? own?.to ?? dataLast, dataLast) };
  const timeline = zoneTimeline(bins.dayZones);
  const zoneOn = (day: number): string => options.zoneOn?.(person, day) ?? timeline(day);
  const { bin } = options;
  const out: GridBin[] = [];
  const inWindow = (day: number): boolean => (window ? day >= window.from && day <= window.to : true);
  let from = grid.from;
  if (bin.week) from = grid.from - ((grid.from + 3) % 7);
  for (let day = from; day <= grid.to; ) {
    const zone = zoneOn(day);
    const startAt = dayStartAt(state, day, zone);
    if (bin.minutes > 0) {
      const dayEnd = dayStartAt(state, day + 1, zone);
      const size = bin.minutes * 60000;
      for (let k = 0; startAt + k * size < dayEnd; k++) {
        const start = startAt + k * size;
        const wallMinute = localDayOf(start, zone, 0).minuteOfDay;
        out.push({
          start,
          end: Math.min(start + size, dayEnd),
          zone,
          day,
          binOfDay: k + 1,
          slots: slotList(bins.slots.get(unitBinKey(day, k))),
          excluded: binInExcludedHours(wallMinute, (Math.min(start + size, dayEnd) - start) / 60000, options.excludeHours),
          outside: !inWindow(day),
          lastDay: day,
        });
      }
      day++;
      continue;
    }
    const length = bin.week ? 7 : bin.days;
    // The bin ends where the next one starts: after a move, in the new zone (an eastward move
    // shortens the last day in the old zone, a westward one lengthens it; bin_hours shows it).
    const end = dayStartAt(state, day + length, zoneOn(day + length));
    const slots: number[] = [];
    for (let d = day; d < day + length; d++) {
      const part = bins.slots.get(unitBinKey(d, 0));
      if (part !== undefined) slots.push(part);
    }
    out.push({ start: startAt, end, zone, day, binOfDay: 1, slots, excluded: false, outside: !inWindow(day) && !inWindow(day + length - 1), lastDay: day + length - 1 });
    day += length;
  }
  return out;
}

const NO_SLOTS: number[] = [];

function slotList(slot: number | undefined): number[] {
  return slot === undefined ? NO_SLOTS : [slot];
}
