import { describe, expect, it } from 'vitest';
import { parseBinSpec } from '../../src/series/bin-spec.js';
import { addSeriesEntry } from '../../src/series/add-series-entry.js';
import { buildPersonSeries } from '../../src/series/build-person-series.js';
import { createSeriesState } from '../../src/series/create-series-state.js';
import type { SeriesOptions } from '../../src/series/series-types.js';
import { dayNumberOfDate } from '../../src/series/local-day.js';
import { promptWindows } from '../../src/series/prompt-windows.js';

// A 21-day study, 2026-05-01 to 2026-05-21 (invented). Expected rows counted by hand.
const FROM = dayNumberOfDate('2026-05-01');
const TO = dayNumberOfDate('2026-05-21');

function rows(days: number[], extra: Partial<SeriesOptions> = {}) {
  const state = createSeriesState({ bin: parseBinSpec('1d'), dayStart: 0, minWords: 1, fill: 'carry', maxFill: 10, detrend: false, reducers: ['weighted'], ...extra }, 1);
  for (const d of days) {
    addSeriesEntry(state, { person: 'p', instant: Date.parse(`2026-05-${String(d).padStart(2, '0')}T12:00:00Z`), zone: 'UTC', words: 5, values: [d], matched: [1] });
  }
  return buildPersonSeries(state, 'p');
}

describe('the study window makes dropouts visible', () => {
  it('a person who stopped writing after day 16 of 21 has 5 missing days marked after_last_entry', () => {
    const r = rows([1, 2, 5, 16], { span: { from: FROM, to: TO } });
    expect(r).toHaveLength(21);
    expect(r.slice(16).map((x) => x.missing)).toEqual(Array(5).fill('after_last_entry'));
    // A gap between entries is still no_text; days 3 and 4 lie between entries.
    expect(r[2]?.missing).toBe('no_text');
  });

  it('a person who started writing on day 4 has 3 days marked before_first_entry', () => {
    const r = rows([4, 6, 21], { span: { from: FROM, to: TO } });
    expect(r.slice(0, 3).map((x) => x.missing)).toEqual(['before_first_entry', 'before_first_entry', 'before_first_entry']);
    expect(r[20]?.missing).toBe('');
  });

  it('the same with a per-person window (windows file or ratings prompts)', () => {
    const r = rows([1, 16], { windows: new Map([['p', { from: FROM, to: TO }]]) });
    expect(r.filter((x) => x.missing === 'after_last_entry')).toHaveLength(5);
  });

  it('a dropout is never filled, however long max-fill is', () => {
    const r = rows([1, 5, 16], { span: { from: FROM, to: TO } });
    expect(r.slice(16).map((x) => x.filled[0])).toEqual(['', '', '', '', '']);
    expect(r[1]?.filled[0]).toBe('carry');
  });

  it('without a window the series runs from first to last entry, as before', () => {
    expect(rows([1, 16])).toHaveLength(16);
  });
});

describe('promptWindows: each person\'s window is their first to last prompt, in local days', () => {
  it('takes local dates in the prompt\'s zone and the day start (IANA tz: New York is UTC−4 in May)', () => {
    const w = promptWindows(
      [
        { person: 'a', instant: Date.parse('2026-05-02T02:00:00Z'), zone: 'America/New_York' }, // 2026-05-01 22:00 local
        { person: 'a', instant: Date.parse('2026-05-21T15:00:00Z'), zone: 'America/New_York' },
        { person: 'b', instant: Date.parse('2026-05-03T03:00:00Z'), zone: 'UTC' }, // before a 04:00 day start: 2026-05-02
      ],
      240,
    );
    expect(w.get('a')).toEqual({ from: dayNumberOfDate('2026-05-01'), to: dayNumberOfDate('2026-05-21') });
    expect(w.get('b')).toEqual({ from: dayNumberOfDate('2026-05-02'), to: dayNumberOfDate('2026-05-02') });
  });
});
