import { describe, expect, it } from 'vitest';
import { buildZoneTable, zoneAtInstant } from '../../src/ingest/zone-table.js';
import type { BinReducer } from '../../src/series/bin-accumulator.js';
import { parseBinSpec, parseExcludedHours } from '../../src/series/bin-spec.js';
import { addSeriesEntry } from '../../src/series/add-series-entry.js';
import { buildPersonSeries } from '../../src/series/build-person-series.js';
import { createSeriesState } from '../../src/series/create-series-state.js';
import type { FillMethod, SeriesRow } from '../../src/series/series-types.js';

const H = 3_600_000;

interface Options {
  bin?: string;
  dayStart?: number;
  minWords?: number;
  exclude?: string;
  fill?: FillMethod;
  maxFill?: number;
  detrend?: boolean;
  reducer?: BinReducer;
}

/** Bins one person's entries [utc instant, words, value] in `zone` and returns the rows. */
function series(zone: string | ((instant: number) => string), entries: Array<[string, number, number | undefined]>, o: Options = {}): SeriesRow[] {
  const state = createSeriesState(
    {
      bin: parseBinSpec(o.bin ?? '1d'),
      dayStart: o.dayStart ?? 0,
      minWords: o.minWords ?? 1,
      excludeHours: o.exclude ? parseExcludedHours(o.exclude) : undefined,
      fill: o.fill ?? 'none',
      maxFill: o.maxFill ?? 1,
      detrend: o.detrend ?? false,
      reducers: [o.reducer ?? 'weighted'],
    },
    1,
  );
  for (const [time, words, x] of entries) {
    const instant = Date.parse(time);
    addSeriesEntry(state, { person: 'p', instant, zone: typeof zone === 'string' ? zone : zone(instant), words, values: [x], matched: [x === undefined ? 0 : 1] });
  }
  return buildPersonSeries(state, 'p');
}

const day = (rows: SeriesRow[], date: string): SeriesRow => rows.find((r) => r.localDate === date) as SeriesRow;

describe('daily and hourly bins follow the IANA tz database clock changes', () => {
  // IANA tz database (Europe/Brussels: EU rule, last Sunday of March and October; America/New_York:
  // US rule since 2007, second Sunday of March and first Sunday of November).
  it('a daily bin on 2026-03-29 in Europe/Brussels spans 23 hours and on 2026-10-25 25 hours (IANA tz, EU rule)', () => {
    const rows = series('Europe/Brussels', [['2026-03-28T12:00:00Z', 5, 1], ['2026-03-30T12:00:00Z', 5, 1], ['2026-10-24T12:00:00Z', 5, 1], ['2026-10-26T12:00:00Z', 5, 1]]);
    expect(day(rows, '2026-03-28').hours).toBe(24);
    expect(day(rows, '2026-03-29').hours).toBe(23);
    expect(day(rows, '2026-03-30').hours).toBe(24);
    expect(day(rows, '2026-10-25').hours).toBe(25);
    expect(new Date(day(rows, '2026-03-29').start).toISOString()).toBe('2026-03-28T23:00:00.000Z');
    expect(new Date(day(rows, '2026-03-29').end).toISOString()).toBe('2026-03-29T22:00:00.000Z');
  });

  it('a daily bin on 2026-03-08 in America/New_York spans 23 hours and on 2026-11-01 25 hours (IANA tz, US rule)', () => {
    const rows = series('America/New_York', [['2026-03-07T17:00:00Z', 5, 1], ['2026-03-09T17:00:00Z', 5, 1], ['2026-10-31T17:00:00Z', 5, 1], ['2026-11-02T17:00:00Z', 5, 1]]);
    expect(day(rows, '2026-03-08').hours).toBe(23);
    expect(day(rows, '2026-11-01').hours).toBe(25);
    expect(day(rows, '2026-11-02').hours).toBe(24);
  });

  it('hourly bins number 23 on a spring-forward day and 25 on a fall-back day (IANA tz)', () => {
    const count = (rows: SeriesRow[], date: string): number => rows.filter((r) => r.localDate === date).length;
    const brussels = series('Europe/Brussels', [['2026-03-29T10:00:00Z', 5, 1], ['2026-10-25T10:00:00Z', 5, 1]], { bin: '1h' });
    expect(count(brussels, '2026-03-29')).toBe(23);
    expect(count(brussels, '2026-10-25')).toBe(25);
    expect(count(brussels, '2026-05-01')).toBe(24);
    const ny = series('America/New_York', [['2026-03-08T15:00:00Z', 5, 1], ['2026-11-01T15:00:00Z', 5, 1]], { bin: '1h' });
    expect(count(ny, '2026-03-08')).toBe(23);
    expect(count(ny, '2026-11-01')).toBe(25);
    // The repeated hour 01:00-02:00 is two bins, 01:00-04:00 then 01:00-05:00; every hourly bin is 1 hour long.
    const nov1 = ny.filter((r) => r.localDate === '2026-11-01');
    expect(nov1.map((r) => new Date(r.start).toISOString().slice(11, 13)).slice(0, 4)).toEqual(['04', '05', '06', '07']);
    expect(nov1.every((r) => r.hours === 1)).toBe(true);
  });

  it('with the day starting at 04:00, an entry at 01:30 local belongs to the previous local day', () => {
    // 2026-05-06 01:30 in Brussels (+02:00) is 2026-05-05T23:30Z.
    const rows = series('Europe/Brussels', [['2026-05-05T08:00:00Z', 5, 1], ['2026-05-05T23:30:00Z', 7, 3]], { dayStart: 240 });
    expect(rows).toHaveLength(1);
    expect(rows[0]?.localDate).toBe('2026-05-05');
    expect(rows[0]?.entries).toBe(2);
    expect(new Date(rows[0]?.start as number).toISOString()).toBe('2026-05-05T02:00:00.000Z');
    // Without the day start it is on the next day.
    expect(series('Europe/Brussels', [['2026-05-05T08:00:00Z', 5, 1], ['2026-05-05T23:30:00Z', 7, 3]]).map((r) => r.localDate)).toEqual(['2026-05-05', '2026-05-06']);
  });

  it('a person who moves zone (zone table with `from`) gets local days in the new zone from that date', () => {
    const table = buildZoneTable(
      [
        { person: 'p', zone: 'Europe/Brussels', line: 2 },
        { person: 'p', zone: 'America/New_York', from: '2026-04-10', line: 3 },
      ],
      'zones.csv',
    );
    // 2026-04-08 23:30 in Brussels; 2026-04-11 23:30 in New York (= 04-12T03:30Z, which is 04-12 in Brussels).
    const rows = series((t) => zoneAtInstant(table, 'p', t) as string, [['2026-04-08T21:30:00Z', 5, 1], ['2026-04-12T03:30:00Z', 5, 2]]);
    const before = day(rows, '2026-04-08');
    const after = day(rows, '2026-04-11');
    expect(before.zone).toBe('Europe/Brussels');
    expect(new Date(before.start).toISOString()).toBe('2026-04-07T22:00:00.000Z');
    expect(after.zone).toBe('America/New_York');
    expect(after.entries).toBe(1);
    expect(new Date(after.start).toISOString()).toBe('2026-04-11T04:00:00.000Z');
    expect(rows.find((r) => r.localDate === '2026-04-12')).toBeUndefined();
  });
});

/*
 * Hand-worked example (common practice for diary data; values worked out by hand below).
 * Zone UTC, 3-hour bins, excluded hours 00:00-07:00 (the bins starting 00:00 and 03:00 lie wholly inside;
 * the 06:00 bin only overlaps, so it would keep entries from 07:00 on), min 3 words.
 *
 *  t  bin (UTC)        entries (words·value)            missing          value (weighted)
 *  0  05-04 00:00      -                                excluded_hours
 *  1  05-04 03:00      -                                excluded_hours
 *  2  05-04 06:00      -                                no_text
 *  3  05-04 09:00      09:10 10·2, 10:00 30·4           observed         (20+120)/40 = 3.5  (mean 3, sum 6)
 *  4  05-04 12:00      -                                no_text
 *  5  05-04 15:00      15:30 5·1                        observed         1
 *  6  05-04 18:00      18:20 2·9                        too_few_words
 *  7  05-04 21:00      21:05 10·5                       observed         5
 *  8  05-05 00:00      02:00 10·7 (excluded entry)      excluded_hours
 *  9  05-05 03:00      -                                excluded_hours
 * 10  05-05 06:00      -                                no_text
 * 11  05-05 09:00      09:00 4·3                        observed         3
 * 12  05-05 12:00      12:00 6·0                        observed         0  (a real zero)
 * 13..15 15:00-21:00   -                                no_text
 *
 * Person mean over observed bins: (3.5 + 1 + 5 + 3 + 0) / 5 = 2.5; within = value − 2.5.
 * lag_valid only at t = 12 (t = 11 observed and adjacent): lag1 = 3, within_lag1 = 0.5. Not at
 * t = 11: its previous bin (06:00, after the excluded night) has no text; not at 5 or 7:
 * the previous bin is missing.
 */
const WORKED: Array<[string, number, number]> = [
  ['2026-05-04T09:10:00Z', 10, 2],
  ['2026-05-04T10:00:00Z', 30, 4],
  ['2026-05-04T15:30:00Z', 5, 1],
  ['2026-05-04T18:20:00Z', 2, 9],
  ['2026-05-04T21:05:00Z', 10, 5],
  ['2026-05-05T02:00:00Z', 10, 7],
  ['2026-05-05T09:00:00Z', 4, 3],
  ['2026-05-05T12:00:00Z', 6, 0],
];
const worked = (o: Options = {}): SeriesRow[] => series('UTC', WORKED, { bin: '3h', exclude: '00:00-07:00', minWords: 3, ...o });

describe('hand-worked example: centring, gap-aware lags, fill, detrend, reducers', () => {
  it('lays every 3-hour bin of both days as a row with its missing reason; an empty bin is missing, never 0', () => {
    const rows = worked();
    expect(rows.map((r) => r.t)).toEqual([...Array(16).keys()]);
    expect(rows.map((r) => r.missing)).toEqual([
      'excluded_hours', 'excluded_hours', 'no_text', '', 'no_text', '', 'too_few_words', '',
      'excluded_hours', 'excluded_hours', 'no_text', '', '', 'no_text', 'no_text', 'no_text',
    ]);
    expect(rows.map((r) => r.values[0])).toEqual([undefined, undefined, undefined, 3.5, undefined, 1, undefined, 5, undefined, undefined, undefined, 3, 0, undefined, undefined, undefined]);
    expect(rows.map((r) => r.entries)).toEqual([0, 0, 0, 2, 0, 1, 1, 1, 0, 0, 0, 1, 1, 0, 0, 0]);
    expect(rows[6]?.words).toBe(2);
    expect(rows.map((r) => r.binOfDay)).toEqual([1, 2, 3, 4, 5, 6, 7, 8, 1, 2, 3, 4, 5, 6, 7, 8]);
    expect(rows.map((r) => r.day)).toEqual([1, 1, 1, 1, 1, 1, 1, 1, 2, 2, 2, 2, 2, 2, 2, 2]);
  });

  it('centres on the person mean over observed bins: mean 2.5, within = value − 2.5', () => {
    const rows = worked();
    expect(rows.every((r) => r.personMean[0] === 2.5)).toBe(true);
    expect([3, 5, 7, 11, 12].map((t) => rows[t]?.within[0])).toEqual([1, -1.5, 2.5, 0.5, -2.5]);
    expect(rows[4]?.within[0]).toBeUndefined();
  });

  it('fills lag1 and within_lag1 only when bin t−1 is observed and adjacent (lag_valid)', () => {
    const rows = worked();
    expect(rows.map((r) => (r.lagValid ? 1 : 0))).toEqual([0, 0, 0, 0, 0, 0, 0, 0, 0, 0, 0, 0, 1, 0, 0, 0]);
    expect(rows[12]?.lag1[0]).toBe(3);
    expect(rows[12]?.withinLag1[0]).toBe(0.5);
    for (const t of [3, 5, 7, 11]) {
      expect(rows[t]?.lag1[0], `t=${t}`).toBeUndefined();
      expect(rows[t]?.withinLag1[0], `t=${t}`).toBeUndefined();
    }
  });

  it('counts hours since the previous observed bin start', () => {
    expect(worked().map((r) => r.hoursSincePrev)).toEqual([undefined, undefined, undefined, undefined, 3, 6, 3, 6, 3, 6, 9, 12, 3, 3, 6, 9]);
  });

  it('entry mean and sum reducers: bin t = 3 gives 3 (mean of 2 and 4) and 6 (sum); the weighted mean is 3.5', () => {
    expect(worked({ reducer: 'mean' })[3]?.values[0]).toBe(3);
    expect(worked({ reducer: 'sum' })[3]?.values[0]).toBe(6);
    expect(worked({ reducer: 'weighted' })[3]?.values[0]).toBe(3.5);
    // A bin whose entries have no value is missing under every reducer, never 0.
    expect(worked({ reducer: 'sum' })[4]?.values[0]).toBeUndefined();
  });

  it('carry fill copies the last value into runs of at most max-fill bins without text, flagged; excluded hours are never filled', () => {
    const one = worked({ fill: 'carry', maxFill: 1 });
    expect(one.map((r) => r.filled[0])).toEqual(['', '', '', '', 'carry', '', 'carry', '', '', '', '', '', '', '', '', '']);
    expect(one[4]?.values[0]).toBe(3.5);
    expect(one[6]?.values[0]).toBe(1);
    expect(one[4]?.missing).toBe('no_text');
    // Filled values never enter the person mean or the lags.
    expect(one[5]?.lagValid).toBe(false);
    expect(one[5]?.lag1[0]).toBeUndefined();
    expect(one[4]?.personMean[0]).toBe(2.5);
    const three = worked({ fill: 'carry', maxFill: 3 });
    expect(three.slice(13).map((r) => [r.values[0], r.filled[0]])).toEqual([[0, 'carry'], [0, 'carry'], [0, 'carry']]);
    expect(three.slice(8, 11).map((r) => r.values[0])).toEqual([undefined, undefined, undefined]);
  });

  it('linear fill interpolates between the observed neighbours: t=4 = 3.5 + (1 − 3.5)/2 = 2.25, t=6 = 1 + (5 − 1)/2 = 3; no right neighbour, no fill', () => {
    const rows = worked({ fill: 'linear', maxFill: 3 });
    expect(rows[4]?.values[0]).toBe(2.25);
    expect(rows[6]?.values[0]).toBe(3);
    expect(rows[4]?.filled[0]).toBe('linear');
    expect(rows.slice(13).map((r) => r.filled[0])).toEqual(['', '', '']);
    expect(rows[4]?.within[0]).toBe(2.25 - 2.5);
  });

  it('detrends within person by least squares over observed (t, value): slope −11.5/59.2, intercept 2.5 − slope·7.6', () => {
    // t̄ = 38/5 = 7.6, ȳ = 2.5; Σ(t−t̄)² = 59.2, Σ(t−t̄)(y−ȳ) = −11.5 (worked by hand).
    const b = -11.5 / 59.2;
    const a = 2.5 - b * 7.6;
    const rows = worked({ detrend: true });
    for (const t of [3, 5, 7, 11, 12]) expect(rows[t]?.detrended[0], `t=${t}`).toBeCloseTo((rows[t]?.values[0] as number) - (a + b * t), 12);
    expect(rows[3]?.detrended[0]).toBeCloseTo(0.10641891891891892, 12);
    expect(rows[3]?.values[0]).toBe(3.5);
    expect(rows[4]?.detrended[0]).toBeUndefined();
  });

  it('a bin with fewer words than min-words is too_few_words, not an observation', () => {
    const rows = worked({ minWords: 3 });
    expect(rows[6]?.missing).toBe('too_few_words');
    expect(rows[6]?.values[0]).toBeUndefined();
    expect(worked({ minWords: 1 })[6]?.values[0]).toBe(9);
  });
});
