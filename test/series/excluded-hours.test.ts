import { describe, expect, it } from 'vitest';
import { binInExcludedHours, parseBinSpec, parseExcludedHours } from '../../src/series/bin-spec.js';
import { addSeriesEntry } from '../../src/series/add-series-entry.js';
import { buildPersonSeries } from '../../src/series/build-person-series.js';
import { createSeriesState } from '../../src/series/create-series-state.js';

describe('excluded hours with sub-daily bins (common practice: night hours left out of diary series)', () => {
  it('excludes entries by their own clock time, so a bin that only overlaps the excluded hours keeps its other entries', () => {
    const state = createSeriesState({ bin: parseBinSpec('3h'), dayStart: 0, minWords: 1, fill: 'none', maxFill: 0, detrend: false, reducers: ['weighted'], excludeHours: parseExcludedHours('05:00-07:00') }, 1);
    const add = (iso: string, value: number) => addSeriesEntry(state, { person: 'a', instant: Date.parse(iso), zone: 'UTC', words: 5, values: [value], matched: [0] });
    expect(add('2026-05-04T06:30:00Z', 1).excluded).toBe(true);
    expect(add('2026-05-04T07:30:00Z', 2).excluded).toBe(false);
    expect(add('2026-05-04T08:45:00Z', 4).excluded).toBe(false);
    const rows = buildPersonSeries(state, 'a');
    const bin = rows.find((r) => r.binOfDay === 3); // 06:00–09:00
    expect(bin?.missing).toBe('');
    expect(bin?.entries).toBe(2);
    expect(bin?.values[0]).toBe(3);
    expect(state.excludedEntries).toBe(1);
  });

  it('marks a bin excluded only when it lies wholly inside the excluded range, also across midnight', () => {
    const night = parseExcludedHours('23:00-07:00');
    expect(binInExcludedHours(0, 180, night)).toBe(true); // 00:00–03:00
    expect(binInExcludedHours(240, 180, night)).toBe(true); // 04:00–07:00
    expect(binInExcludedHours(360, 180, night)).toBe(false); // 06:00–09:00 overlaps only
    expect(binInExcludedHours(1380, 60, night)).toBe(true); // 23:00–24:00
    expect(binInExcludedHours(1320, 180, night)).toBe(false); // 22:00–01:00 overlaps only
  });
});
