import { describe, expect, it } from 'vitest';
import { centrePoints } from '../../../src/report/data/centre-points.js';
import { longestGap } from '../../../src/report/data/longest-gap.js';
import { readinessFromRows } from '../../../src/report/data/readiness-from-rows.js';
import type { SeriesRow } from '../../../src/report/data/series-row.js';

const row = (t: number, v: number | undefined, lagValid: boolean, hours = 24): SeriesRow => ({
  person: 'a',
  t,
  binStart: '',
  localDate: '',
  binHours: hours,
  entries: v === undefined ? 0 : 1,
  words: v === undefined ? 0 : 20,
  missing: v === undefined ? 'no_text' : '',
  lagValid,
  values: { s: v },
});

describe('readinessFromRows', () => {
  // hand-worked example: values 1, 3, 2, –, 4, 6 with lag_valid 0,1,1,0,0,1
  // usable lag pairs (1,3), (3,2), (4,6); successive differences 2, −1, 2
  const rows = [row(0, 1, false), row(1, 3, true), row(2, 2, true), row(3, undefined, false, 25), row(4, 4, false), row(5, 6, true)];
  const r = readinessFromRows(rows, 's', 3).persons[0]!;

  it('counts bins, % missing and usable lag pairs (hand-worked)', () => {
    expect(r).toMatchObject({ bins: 6, observed: 5, lagPairs: 3, ready: true });
    expect(r.percentMissing).toBeCloseTo(100 / 6, 12);
  });

  it('gives MSSD = mean squared successive difference over usable pairs: (4 + 1 + 4) / 3 = 3 (von Neumann et al. 1941; hand-worked)', () => {
    expect(r.mssd).toBeCloseTo(3, 12);
  });

  it('gives the lag-1 autocorrelation as the Pearson r of the lag pairs: 33/√(42·78) (hand-worked)', () => {
    // x = 1, 3, 4; y = 3, 2, 6: Sxy = 33/9, Sxx = 42/9, Syy = 78/9
    expect(r.autocorrelation).toBeCloseTo(33 / Math.sqrt(42 * 78), 12);
  });

  it('measures the longest gap in bins and real hours (a 25-hour clock-change day counts 25)', () => {
    expect([r.longestGapBins, r.longestGapHours]).toEqual([1, 25]);
    expect(longestGap([{ missing: 'x', hours: 24 }, { missing: 'x', hours: 23 }, { missing: '', hours: 24 }, { missing: 'x', hours: 24 }])).toEqual({ bins: 2, hours: 47 });
    expect(longestGap([])).toEqual({ bins: 0, hours: 0 });
  });

  it('flags a person below the threshold as not ready', () => {
    expect(readinessFromRows(rows, 's', 50).persons[0]!.ready).toBe(false);
  });
});

describe('centrePoints', () => {
  it('subtracts each person\'s own means and returns one mean point per person (hand-worked)', () => {
    const { within, means } = centrePoints([
      { person: 'b', x: 1, y: 10 },
      { person: 'a', x: 2, y: 4 },
      { person: 'b', x: 3, y: 20 },
      { person: 'a', x: 4, y: 8 },
    ]);
    expect(means).toEqual([
      { person: 'a', x: 3, y: 6, n: 2 },
      { person: 'b', x: 2, y: 15, n: 2 },
    ]);
    expect(within).toEqual([
      { person: 'b', x: -1, y: -5 },
      { person: 'a', x: -1, y: -2 },
      { person: 'b', x: 1, y: 5 },
      { person: 'a', x: 1, y: 2 },
    ]);
  });
});
