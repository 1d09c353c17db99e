import { addToBin, newBinSlot } from './bin-accumulator.js';
import { inExcludedHours } from './bin-spec.js';
import { dayStartAt } from './day-start-at.js';
import { localDayOf } from './local-day.js';
import type { EntryPlacement, SeriesEntry, SeriesState } from './series-types.js';
import { unitBinKey } from './unit-bin-key.js';

/**
 * Adds one scored entry to its person's bin. Entries in excluded hours are placed but not
 * accumulated. Returns where the entry fell (for the event-level file).
 */
export function addSeriesEntry(state: SeriesState, entry: SeriesEntry): EntryPlacement {
  const { bin, dayStart, excludeHours } = state.options;
  const { day, minuteOfDay } = localDayOf(entry.instant, entry.zone, dayStart);
  const start = dayStartAt(state, day, entry.zone);
  let index = 0;
  let binStart = start;
  if (bin.minutes > 0) {
    index = Math.floor((entry.instant - start) / (bin.minutes * 60000));
    if (index < 0) index = 0;
    binStart = start + index * bin.minutes * 60000;
  }
  const wallMinute = (minuteOfDay + dayStart) % 1440;
  // An entry is excluded by its own local clock time, whatever the bin length.
  const excluded = excludeHours !== undefined && inExcludedHours(wallMinute, excludeHours);
  if (excluded) {
    state.excludedEntries++;
    return { day, binStart, excluded };
  }
  let bins = state.persons.get(entry.person);
  if (!bins) state.persons.set(entry.person, (bins = { slots: new Map(), dayZones: new Map(), firstDay: day, lastDay: day }));
  const key = unitBinKey(day, index);
  let slot = bins.slots.get(key);
  if (slot === undefined) bins.slots.set(key, (slot = newBinSlot(state.store)));
  addToBin(state.store, slot, entry.words, entry.values, entry.matched);
  bins.dayZones.set(day, entry.zone);
  if (day < bins.firstDay) bins.firstDay = day;
  if (day > bins.lastDay) bins.lastDay = day;
  return { day, binStart, excluded };
}
