import { describe, expect, it } from 'vitest';
import { parseBinSpec } from '../../src/series/bin-spec.js';
import { addSeriesEntry } from '../../src/series/add-series-entry.js';
import { buildPersonSeries } from '../../src/series/build-person-series.js';
import { createSeriesState } from '../../src/series/create-series-state.js';
import type { SeriesOptions } from '../../src/series/series-types.js';

const options: SeriesOptions = { bin: parseBinSpec('1d'), dayStart: 0, minWords: 1, fill: 'none', maxFill: 0, detrend: false, reducers: ['weighted'] };

describe('lags of a person who moves to another zone', () => {
  it('pairs the last day in the old zone with the first day in the new one (IANA tz: New York UTC−4, Brussels UTC+1 in late March 2026)', () => {
    const state = createSeriesState(options, 1);
    // A hand-made mover: 03-20 and 03-21 in New York (EDT, UTC−4), then 03-22 and 03-23 in Brussels (CET, UTC+1).
    const at = (iso: string, zone: string, value: number): void => {
      addSeriesEntry(state, { person: 'm1', instant: Date.parse(iso), zone, words: 10, values: [value], matched: [1] });
    };
    at('2026-03-20T12:00:00-04:00', 'America/New_York', 1);
    at('2026-03-21T12:00:00-04:00', 'America/New_York', 2);
    at('2026-03-22T12:00:00+01:00', 'Europe/Brussels', 3);
    at('2026-03-23T12:00:00+01:00', 'Europe/Brussels', 4);
    const rows = buildPersonSeries(state, 'm1');
    expect(rows.map((r) => r.localDate)).toEqual(['2026-03-20', '2026-03-21', '2026-03-22', '2026-03-23']);
    // The last New York day runs from 03-21 00:00 EDT (04:00Z) to the first Brussels midnight, 03-22 00:00 CET (23:00Z on 03-21): 19 hours.
    expect(rows[1]?.hours).toBe(19);
    expect(rows.map((r) => r.lagValid)).toEqual([false, true, true, true]);
    expect(rows.map((r) => r.lag1[0])).toEqual([undefined, 1, 2, 3]);
  });
});
