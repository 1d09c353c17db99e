import { binEntries, binMatched, binWords, reduceBin } from './bin-accumulator.js';
import { addLagValues } from './add-lag-values.js';
import { fillGaps } from './fill-gaps.js';
import { dateOfDayNumber } from './local-day.js';
import { personGrid, type GridBin } from './person-grid.js';
import type { MissingReason, SeriesRow, SeriesState } from './series-types.js';
import { trendLine } from './trend-line.js';

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
  addLagValues(rows, columns);
  return rows;
}
