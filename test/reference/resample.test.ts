import { describe, expect, it } from 'vitest';
import type { BinReducer } from '../../src/series/bin-accumulator.js';
import { parseBinSpec } from '../../src/series/bin-spec.js';
import { addSeriesEntry } from '../../src/series/add-series-entry.js';
import { buildPersonSeries } from '../../src/series/build-person-series.js';
import { createSeriesState } from '../../src/series/create-series-state.js';
import type { SeriesRow } from '../../src/series/series-types.js';
import { readReferenceCsv } from './reference-csv.js';

/**
 * Reference: pandas `DataFrame.resample` (Debian python3-pandas 1.5.3, see resample/versions.txt)
 * on a tz-aware local index. resample/make-fixture.py wrote the invented fixture (4 persons in
 * Europe/Brussels and America/New_York around 2026-03-08, 2026-03-29, 2026-10-25, 2026-11-01);
 * resample/make-expected.py wrote expected-daily.csv (`resample('D', offset='4h')`) and
 * expected-hourly.csv (`resample('H')`). Regenerate with /usr/bin/python3 in that folder.
 */
const SCORES = ['fix.valence', 'fix.worry'] as const;
const REDUCERS: BinReducer[] = ['weighted', 'mean', 'sum'];

const fixture = readReferenceCsv('resample/fixture.csv');

function binFixture(bin: string): Map<string, SeriesRow[]> {
  // Each score column three times, once per reducer, so one pass gives all three aggregates.
  const state = createSeriesState(
    { bin: parseBinSpec(bin), dayStart: 4 * 60, minWords: 0, fill: 'none', maxFill: 0, detrend: false, reducers: SCORES.flatMap(() => REDUCERS) },
    SCORES.length * REDUCERS.length,
  );
  for (const r of fixture) {
    const values = SCORES.flatMap((s) => REDUCERS.map(() => (r[s] === '' ? undefined : Number(r[s]))));
    const matched = SCORES.flatMap((s) => REDUCERS.map(() => Number(r[`${s}.n`])));
    addSeriesEntry(state, { person: r.person as string, instant: Date.parse(r.time_utc as string), zone: r.zone as string, words: Number(r.words), values, matched });
  }
  return new Map([...state.persons.keys()].sort().map((p) => [p, buildPersonSeries(state, p)]));
}

function close(actual: number | undefined, expected: string, label: string): void {
  if (expected === '') {
    expect(actual, `${label}: empty in pandas`).toBeUndefined();
    return;
  }
  const e = Number(expected);
  expect(actual, label).toBeDefined();
  expect(Math.abs((actual as number) - e), `${label}: ${actual} vs ${e}`).toBeLessThanOrEqual(1e-9 * Math.max(1, Math.abs(e)));
}

function compare(ours: Map<string, SeriesRow[]>, expected: Record<string, string>[]): number {
  const byStart = new Map<string, SeriesRow>();
  for (const [person, rows] of ours) for (const row of rows) byStart.set(`${person}@${row.start}`, row);
  let compared = 0;
  for (const e of expected) {
    const key = `${e.person}@${Date.parse(e.bin_start as string)}`;
    const row = byStart.get(key);
    expect(row, `bin ${e.person} ${e.bin_start} exists in lexichron's grid`).toBeDefined();
    if (!row) continue;
    const label = `${e.person} ${e.bin_start}`;
    if (e.bin_end !== '') expect(row.end, `${label} end`).toBe(Date.parse(e.bin_end as string));
    expect(row.entries, `${label} entries`).toBe(Number(e.entries));
    expect(row.words, `${label} words`).toBe(Number(e.words));
    // An empty bin is missing in lexichron (never 0); pandas gives NaN with min_count=1.
    expect(row.missing, label).toBe(Number(e.entries) === 0 ? 'no_text' : '');
    SCORES.forEach((s, i) => {
      REDUCERS.forEach((red, j) => close(row.values[i * REDUCERS.length + j], e[`${s}.${red}`] as string, `${label} ${s} ${red}`));
    });
    compared++;
  }
  return compared;
}

describe('series bins against pandas DataFrame.resample (python3-pandas, tz-aware local index)', () => {
  it('daily bins starting 04:00 local equal resample("D", offset="4h"): same bin starts and ends, entries, words, word-weighted means, entry means and sums (1e-9)', () => {
    const expected = readReferenceCsv('resample/expected-daily.csv');
    const ours = binFixture('1d');
    expect(compare(ours, expected)).toBe(expected.length);
    // The same grid: first to last bin per person, every bin in between (967 bins from pandas).
    expect([...ours.values()].reduce((n, rows) => n + rows.length, 0)).toBe(expected.length);
    expect(expected.length).toBe(967);
  });

  it('daily bins on the change days are 23 and 25 hours long in both lexichron and pandas (IANA tz: 2026-03-29/10-25 EU, 2026-03-08/11-01 US)', () => {
    const expected = readReferenceCsv('resample/expected-daily.csv');
    const hours = (p: string, start: string): number => {
      const e = expected.find((r) => r.person === p && r.bin_start === start) as Record<string, string>;
      return (Date.parse(e.bin_end as string) - Date.parse(e.bin_start as string)) / 3_600_000;
    };
    // With 04:00 day starts, the day holding the 02:00/03:00 change is the one that begins the evening before.
    expect(hours('b1', '2026-03-28T04:00:00+01:00')).toBe(23);
    expect(hours('b1', '2026-10-24T04:00:00+02:00')).toBe(25);
    expect(hours('n1', '2026-03-07T04:00:00-05:00')).toBe(23);
    expect(hours('n1', '2026-10-31T04:00:00-04:00')).toBe(25);
    const ours = binFixture('1d').get('b1') as SeriesRow[];
    expect(ours.find((r) => r.localDate === '2026-03-28')?.hours).toBe(23);
    expect(ours.find((r) => r.localDate === '2026-10-24')?.hours).toBe(25);
  });

  it('hourly bins equal resample("H") on the three days around each change, including the repeated 01:00 hour in New York on 2026-11-01', () => {
    // pandas lays hourly bins on the absolute time line, so a 25-hour day has 25 hourly bins and the
    // repeated local hour appears twice (01:00-04:00 and 01:00-05:00); lexichron tiles each local day
    // from its start in elapsed time, which gives the same bins for whole-hour offsets. Nothing differs.
    const expected = readReferenceCsv('resample/expected-hourly.csv');
    const ours = binFixture('1h');
    expect(compare(ours, expected)).toBe(expected.length);
    expect(expected.filter((e) => e.person === 'n1' && e.bin_start.startsWith('2026-11-01T01:00:00')).map((e) => e.bin_start)).toEqual(['2026-11-01T01:00:00-04:00', '2026-11-01T01:00:00-05:00']);
    // Every entry lies in the compared windows: the non-empty bins are the same on both sides.
    const nonEmpty = [...ours.values()].flat().filter((r) => r.entries > 0).length;
    expect(nonEmpty).toBe(expected.filter((e) => e.entries !== '0').length);
    expect([...ours.values()].flat().reduce((n, r) => n + r.entries, 0)).toBe(fixture.length);
  });
});
