import { addToBin, binEntries, binMatched, binWords, createBinStore, newBinSlot, reduceBin, type BinReducer, type BinStore } from './bin-accumulator.js';
import { binInExcludedHours, inExcludedHours, type BinSpec } from './bin-spec.js';
import { dateOfDayNumber, dayStartInstant, localDayOf } from './local-day.js';

/** Why a bin has no value. */
export type MissingReason = '' | 'no_text' | 'too_few_words' | 'excluded_hours' | 'outside_window' | 'before_first_entry' | 'after_last_entry';

export type FillMethod = 'none' | 'carry' | 'linear';

export interface SeriesOptions {
  bin: BinSpec;
  /** Minutes after local midnight at which a day starts. */
  dayStart: number;
  /** Bins with fewer words are missing (`too_few_words`). */
  minWords: number;
  /** Local clock range [start, end) in minutes whose entries and bins are excluded. */
  excludeHours?: [number, number];
  fill: FillMethod;
  /** Longest run of missing bins that may be filled. */
  maxFill: number;
  detrend: boolean;
  /** One reducer per score column. */
  reducers: BinReducer[];
  /** Per-person study windows as local day numbers (inclusive). */
  windows?: ReadonlyMap<string, { from: number; to: number }>;
  /** A common grid for everyone (local day numbers, inclusive); bins outside a person's window are `outside_window`. */
  span?: { from: number; to: number };
  /** The person's zone on a local day (from a zone table with effective dates), when known; else taken from their entries. */
  zoneOn?: (person: string, day: number) => string | undefined;
}

/** One entry as the series stage needs it. */
export interface SeriesEntry {
  person: string;
  instant: number;
  zone: string;
  words: number;
  values: ReadonlyArray<number | undefined>;
  matched: ReadonlyArray<number>;
}

/** Where an entry fell. */
export interface EntryPlacement {
  /** Local day number (days since 1970-01-01 of the local date, after the day start). */
  day: number;
  /** Start instant of the unit bin (sub-daily bin or day). */
  binStart: number;
  excluded: boolean;
}

/** The unit bins of one person: slot of each bin key in the store, and the zone of each local day. */
export interface PersonBins {
  /** Unit-bin key (day · 2048 + bin index within the day) → slot in the store. */
  slots: Map<number, number>;
  /** Local day number → zone of the last entry on that day. */
  dayZones: Map<number, string>;
  firstDay: number;
  lastDay: number;
}

/** Accumulators of every person: one pooled store, and per person the slots of its unit bins. */
export interface SeriesState {
  options: SeriesOptions;
  columns: number;
  store: BinStore;
  persons: Map<string, PersonBins>;
  excludedEntries: number;
  /** Memo of day-start instants: zone → local day number → instant. */
  dayStarts: Map<string, Map<number, number>>;
}

/** One row of the long series (one bin of one person). */
export interface SeriesRow {
  person: string;
  t: number;
  start: number;
  end: number;
  zone: string;
  localDate: string;
  day: number;
  binOfDay: number;
  hours: number;
  hoursSincePrev: number | undefined;
  entries: number;
  words: number;
  missing: MissingReason;
  lagValid: boolean;
  values: Array<number | undefined>;
  matched: number[];
  personMean: Array<number | undefined>;
  within: Array<number | undefined>;
  lag1: Array<number | undefined>;
  withinLag1: Array<number | undefined>;
  filled: Array<'' | 'carry' | 'linear'>;
  detrended: Array<number | undefined>;
}

const KEY_SCALE = 2048;

/** A new, empty series state. */
export function createSeriesState(options: SeriesOptions, columns: number): SeriesState {
  return { options, columns, store: createBinStore(columns), persons: new Map(), excludedEntries: 0, dayStarts: new Map() };
}

function memoDayStart(state: SeriesState, day: number, zone: string): number {
  let days = state.dayStarts.get(zone);
  if (!days) state.dayStarts.set(zone, (days = new Map()));
  let at = days.get(day);
  if (at === undefined) {
    at = dayStartInstant(day, zone, state.options.dayStart);
    if (days.size > 100_000) days.clear();
    days.set(day, at);
  }
  return at;
}

/**
 * Adds one scored entry to its person's bin. Entries in excluded hours are placed but not
 * accumulated. Returns where the entry fell (for the event-level file).
 */
export function addSeriesEntry(state: SeriesState, entry: SeriesEntry): EntryPlacement {
  const { bin, dayStart, excludeHours } = state.options;
  const { day, minuteOfDay } = localDayOf(entry.instant, entry.zone, dayStart);
  const start = memoDayStart(state, day, entry.zone);
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
  const key = day * KEY_SCALE + index;
  let slot = bins.slots.get(key);
  if (slot === undefined) bins.slots.set(key, (slot = newBinSlot(state.store)));
  addToBin(state.store, slot, entry.words, entry.values, entry.matched);
  bins.dayZones.set(day, entry.zone);
  if (day < bins.firstDay) bins.firstDay = day;
  if (day > bins.lastDay) bins.lastDay = day;
  return { day, binStart, excluded };
}

/** The zone in force on each local day: that of the latest day with entries on or before it (the first day's zone before that). */
function zoneTimeline(dayZones: ReadonlyMap<number, string>): (day: number) => string {
  const days = [...dayZones.entries()].sort((a, b) => a[0] - b[0]);
  return (day: number) => {
    let lo = 0;
    let hi = days.length - 1;
    if (hi < 0) return 'UTC';
    if (day < (days[0] as [number, string])[0]) return (days[0] as [number, string])[1];
    while (lo < hi) {
      const mid = (lo + hi + 1) >> 1;
      if ((days[mid] as [number, string])[0] <= day) lo = mid;
      else hi = mid - 1;
    }
    return (days[lo] as [number, string])[1];
  };
}

interface GridBin {
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

/** Lays the person's regular grid over the window and attaches accumulators. */
function personGrid(state: SeriesState, bins: PersonBins, person: string): GridBin[] {
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
    const dayStartAt = memoDayStart(state, day, zone);
    if (bin.minutes > 0) {
      const dayEnd = memoDayStart(state, day + 1, zone);
      const size = bin.minutes * 60000;
      for (let k = 0; dayStartAt + k * size < dayEnd; k++) {
        const start = dayStartAt + k * size;
        const wallMinute = localDayOf(start, zone, 0).minuteOfDay;
        out.push({
          start,
          end: Math.min(start + size, dayEnd),
          zone,
          day,
          binOfDay: k + 1,
          slots: slotList(bins.slots.get(day * KEY_SCALE + k)),
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
    const end = memoDayStart(state, day + length, zoneOn(day + length));
    const slots: number[] = [];
    for (let d = day; d < day + length; d++) {
      const part = bins.slots.get(d * KEY_SCALE);
      if (part !== undefined) slots.push(part);
    }
    out.push({ start: dayStartAt, end, zone, day, binOfDay: 1, slots, excluded: false, outside: !inWindow(day) && !inWindow(day + length - 1), lastDay: day + length - 1 });
    day += length;
  }
  return out;
}

const NO_SLOTS: number[] = [];

function slotList(slot: number | undefined): number[] {
  return slot === undefined ? NO_SLOTS : [slot];
}

function fillGaps(values: Array<number | undefined>, missing: readonly boolean[], method: FillMethod, maxFill: number): Array<'' | 'carry' | 'linear'> {
  const flags: Array<'' | 'carry' | 'linear'> = values.map(() => '');
  if (method === 'none' || maxFill <= 0) return flags;
  let i = 0;
  while (i < values.length) {
    if (!missing[i] || values[i] !== undefined) {
      i++;
      continue;
    }
    let j = i;
    while (j < values.length && missing[j] && values[j] === undefined) j++;
    const run = j - i;
    const left = i > 0 ? values[i - 1] : undefined;
    const right = j < values.length ? values[j] : undefined;
    if (run <= maxFill && left !== undefined) {
      if (method === 'carry') {
        for (let k = i; k < j; k++) {
          values[k] = left;
          flags[k] = 'carry';
        }
      } else if (right !== undefined) {
        for (let k = i; k < j; k++) {
          values[k] = left + ((right - left) * (k - i + 1)) / (run + 1);
          flags[k] = 'linear';
        }
      }
    }
    i = j;
  }
  return flags;
}

/** Least-squares line of y on t over defined values; undefined with fewer than 2 distinct t. */
function trendLine(values: ReadonlyArray<number | undefined>, observed: readonly boolean[]): { a: number; b: number } | undefined {
  let n = 0;
  let mt = 0;
  let my = 0;
  for (let t = 0; t < values.length; t++) {
    const y = values[t];
    if (!observed[t] || y === undefined) continue;
    n++;
    mt += (t - mt) / n;
    my += (y - my) / n;
  }
  if (n < 2) return undefined;
  let stt = 0;
  let sty = 0;
  for (let t = 0; t < values.length; t++) {
    const y = values[t];
    if (!observed[t] || y === undefined) continue;
    stt += (t - mt) * (t - mt);
    sty += (t - mt) * (y - my);
  }
  if (stt === 0) return undefined;
  const b = sty / stt;
  return { a: my - b * mt, b };
}

/**
 * The long series of one person: every bin of the window as a row, with the missing reason,
 * person mean and person-mean-centred values (over observed bins), lag-1 values that are empty
 * unless bin t−1 is observed and adjacent (`lagValid`), optional gap filling (flagged, never used
 * for means or lags) and optional linear detrending within person (raw values kept).
 */
export function buildPersonSeries(state: SeriesState, person: string): SeriesRow[] {
  const bins = state.persons.get(person);
  if (!bins || bins.slots.size === 0) return [];
  const { options, columns, store } = state;
  const grid = personGrid(state, bins, person);
  const firstDay = grid[0]?.day ?? 0;
  const rows: SeriesRow[] = [];
  let dateDay = NaN;
  let date = '';
  let prevObservedStart: number | undefined;
  for (let t = 0; t < grid.length; t++) {
    const g = grid[t] as GridBin;
    const entries = binEntries(store, g.slots);
    const words = binWords(store, g.slots);
    let missing: MissingReason = '';
    if (g.excluded) missing = 'excluded_hours';
    else if (g.outside) missing = 'outside_window';
    // Inside the study window but before the person's first entry or after their last: a late
    // start or a dropout, told apart from a gap between entries.
    else if (entries === 0 && g.day > bins.lastDay) missing = 'after_last_entry';
    else if (entries === 0 && g.lastDay < bins.firstDay) missing = 'before_first_entry';
    else if (entries === 0) missing = 'no_text';
    else if (words < options.minWords) missing = 'too_few_words';
    const values: Array<number | undefined> = [];
    const matched: number[] = [];
    for (let c = 0; c < columns; c++) {
      values.push(missing === '' ? reduceBin(store, g.slots, c, options.reducers[c] ?? 'weighted') : undefined);
      matched.push(binMatched(store, g.slots, c));
    }
    rows.push({
      person,
      t,
      start: g.start,
      end: g.end,
      zone: g.zone,
      localDate: g.day === dateDay ? date : ((dateDay = g.day), (date = dateOfDayNumber(g.day))),
      day: g.day - firstDay + 1,
      binOfDay: g.binOfDay,
      hours: (g.end - g.start) / 3_600_000,
      hoursSincePrev: prevObservedStart === undefined ? undefined : (g.start - prevObservedStart) / 3_600_000,
      entries,
      words,
      missing,
      lagValid: false,
      values,
      matched,
      personMean: [],
      within: [],
      lag1: [],
      withinLag1: [],
      filled: [],
      detrended: [],
    });
    if (missing === '') prevObservedStart = g.start;
  }
  const observed = rows.map((r) => r.missing === '');
  // Only bins without (enough) text are gaps to fill: excluded hours and bins outside the
  // window are not measured by design, so they are never filled and they end a fillable run.
  const fillable = rows.map((r) => r.missing === 'no_text' || r.missing === 'too_few_words');
  for (let c = 0; c < columns; c++) {
    let n = 0;
    let mean = 0;
    for (const r of rows) {
      const x = r.values[c];
      if (r.missing !== '' || x === undefined) continue;
      n++;
      mean += (x - mean) / n;
    }
    const pm = n > 0 ? mean : undefined;
    const raw = rows.map((r) => r.values[c]);
    const trend = options.detrend ? trendLine(raw, observed) : undefined;
    const filledValues = [...raw];
    const flags = fillGaps(filledValues, fillable, options.fill, options.maxFill);
    for (let t = 0; t < rows.length; t++) {
      const r = rows[t] as SeriesRow;
      const x = filledValues[t];
      r.values[c] = x;
      r.filled[c] = flags[t] ?? '';
      r.personMean[c] = pm;
      r.within[c] = x !== undefined && pm !== undefined ? x - pm : undefined;
      r.detrended[c] = options.detrend && trend && x !== undefined ? x - (trend.a + trend.b * t) : undefined;
    }
  }
  for (let t = 0; t < rows.length; t++) {
    const r = rows[t] as SeriesRow;
    const prev = t > 0 ? rows[t - 1] : undefined;
    // Bins t−1 and t are neighbours on the person's grid; across a move to another zone the local day
    // boundary shifts by the change of offset, but the two days still follow each other.
    r.lagValid = prev !== undefined && prev.missing === '' && r.missing === '';
    for (let c = 0; c < columns; c++) {
      r.lag1[c] = r.lagValid && prev && prev.filled[c] === '' ? prev.values[c] : undefined;
      r.withinLag1[c] = r.lagValid && prev && prev.filled[c] === '' ? prev.within[c] : undefined;
    }
  }
  return rows;
}
