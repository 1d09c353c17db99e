import { addToAccumulator, createAccumulator, mergeAccumulators, reduceAccumulator, type BinAccumulator, type BinReducer } from './bin-accumulator.js';
import { inExcludedHours, type BinSpec } from './bin-spec.js';
import { dateOfDayNumber, dayStartInstant, localDayOf } from './local-day.js';

/** Why a bin has no value. */
export type MissingReason = '' | 'no_text' | 'too_few_words' | 'excluded_hours' | 'outside_window';

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

/** Accumulators of every person: Map person → Map unit-bin key → accumulator. */
export interface SeriesState {
  options: SeriesOptions;
  columns: number;
  persons: Map<string, Map<number, BinAccumulator>>;
  excludedEntries: number;
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
  return { options, columns, persons: new Map(), excludedEntries: 0 };
}

/**
 * Adds one scored entry to its person's bin. Entries in excluded hours are placed but not
 * accumulated. Returns where the entry fell (for the event-level file).
 */
export function addSeriesEntry(state: SeriesState, entry: SeriesEntry): EntryPlacement {
  const { bin, dayStart, excludeHours } = state.options;
  const { day, minuteOfDay } = localDayOf(entry.instant, entry.zone, dayStart);
  const start = dayStartInstant(day, entry.zone, dayStart);
  let index = 0;
  let binStart = start;
  if (bin.minutes > 0) {
    index = Math.floor((entry.instant - start) / (bin.minutes * 60000));
    if (index < 0) index = 0;
    binStart = start + index * bin.minutes * 60000;
  }
  const wallMinute = (minuteOfDay + dayStart) % 1440;
  const excluded = excludeHours !== undefined && inExcludedHours(bin.minutes > 0 ? localDayOf(binStart, entry.zone, 0).minuteOfDay : wallMinute, excludeHours);
  if (excluded) {
    state.excludedEntries++;
    return { day, binStart, excluded };
  }
  let bins = state.persons.get(entry.person);
  if (!bins) state.persons.set(entry.person, (bins = new Map()));
  const key = day * KEY_SCALE + index;
  let acc = bins.get(key);
  if (!acc) bins.set(key, (acc = createAccumulator(state.columns, entry.zone)));
  addToAccumulator(acc, entry.words, entry.values, entry.matched, entry.zone);
  return { day, binStart, excluded };
}

function zoneTimeline(bins: Map<number, BinAccumulator>): (day: number) => string {
  const days = [...bins.entries()].map(([k, acc]) => [Math.floor(k / KEY_SCALE), acc.zone] as const).sort((a, b) => a[0] - b[0]);
  return (day: number) => {
    let zone = days[0]?.[1] ?? 'UTC';
    for (const [d, z] of days) {
      if (d > day) break;
      zone = z;
    }
    return zone;
  };
}

interface GridBin {
  start: number;
  end: number;
  zone: string;
  day: number;
  binOfDay: number;
  acc?: BinAccumulator;
  excluded: boolean;
  outside: boolean;
}

/** Lays the person's regular grid over the window and attaches accumulators. */
function personGrid(bins: Map<number, BinAccumulator>, options: SeriesOptions, person: string, columns: number): GridBin[] {
  const keys = [...bins.keys()];
  const dataFirst = Math.min(...keys.map((k) => Math.floor(k / KEY_SCALE)));
  const dataLast = Math.max(...keys.map((k) => Math.floor(k / KEY_SCALE)));
  const own = options.windows?.get(person);
  const window = own ?? (options.span ? undefined : { from: dataFirst, to: dataLast });
  const grid = options.span ?? window ?? { from: dataFirst, to: dataLast };
  const zoneOn = zoneTimeline(bins);
  const { bin, dayStart } = options;
  const out: GridBin[] = [];
  const inWindow = (day: number): boolean => (window ? day >= window.from && day <= window.to : true);
  let from = grid.from;
  if (bin.week) from = grid.from - ((grid.from + 3) % 7);
  for (let day = from; day <= grid.to; ) {
    const zone = zoneOn(day);
    const dayStartAt = dayStartInstant(day, zone, dayStart);
    if (bin.minutes > 0) {
      const dayEnd = dayStartInstant(day + 1, zone, dayStart);
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
          acc: bins.get(day * KEY_SCALE + k),
          excluded: inExcludedHours(wallMinute, options.excludeHours),
          outside: !inWindow(day),
        });
      }
      day++;
      continue;
    }
    const length = bin.week ? 7 : bin.days;
    const end = dayStartInstant(day + length, zoneOn(day + length - 1), dayStart);
    let acc: BinAccumulator | undefined;
    for (let d = day; d < day + length; d++) {
      const part = bins.get(d * KEY_SCALE);
      if (!part) continue;
      if (!acc) acc = createAccumulator(columns, part.zone);
      mergeAccumulators(acc, part);
    }
    out.push({ start: dayStartAt, end, zone, day, binOfDay: 1, acc, excluded: false, outside: !inWindow(day) && !inWindow(day + length - 1) });
    day += length;
  }
  return out;
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
  if (!bins || bins.size === 0) return [];
  const { options, columns } = state;
  const grid = personGrid(bins, options, person, columns);
  const firstDay = grid[0]?.day ?? 0;
  const rows: SeriesRow[] = [];
  let prevObservedStart: number | undefined;
  for (let t = 0; t < grid.length; t++) {
    const g = grid[t] as GridBin;
    const entries = g.acc?.entries ?? 0;
    const words = g.acc?.words ?? 0;
    let missing: MissingReason = '';
    if (g.excluded) missing = 'excluded_hours';
    else if (g.outside) missing = 'outside_window';
    else if (entries === 0) missing = 'no_text';
    else if (words < options.minWords) missing = 'too_few_words';
    const values: Array<number | undefined> = [];
    const matched: number[] = [];
    for (let c = 0; c < columns; c++) {
      values.push(missing === '' && g.acc ? reduceAccumulator(g.acc, c, options.reducers[c] ?? 'weighted') : undefined);
      matched.push(g.acc ? (g.acc.matched[c] as number) : 0);
    }
    rows.push({
      person,
      t,
      start: g.start,
      end: g.end,
      zone: g.zone,
      localDate: dateOfDayNumber(g.day),
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
    const flags = fillGaps(filledValues, rows.map((r) => r.missing !== ''), options.fill, options.maxFill);
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
    r.lagValid = prev !== undefined && prev.missing === '' && r.missing === '' && prev.end === r.start;
    for (let c = 0; c < columns; c++) {
      r.lag1[c] = r.lagValid && prev && prev.filled[c] === '' ? prev.values[c] : undefined;
      r.withinLag1[c] = r.lagValid && prev && prev.filled[c] === '' ? prev.within[c] : undefined;
    }
  }
  return rows;
}
