import { describe, expect, it } from 'vitest';
import { alignRatingsToBins } from '../../src/validate/align-ratings-to-bins.js';
import { alignRatingsToWindows } from '../../src/validate/align-ratings-to-windows.js';
import type { EntryScore } from '../../src/validate/entry-score.js';
import type { Rating } from '../../src/validate/rating.js';
import type { SeriesBin } from '../../src/validate/series-bin.js';

const H = 3_600_000;
const t0 = Date.parse('2026-03-28T00:00:00Z');
const bin = (person: string, k: number, score: number | undefined, missing = ''): SeriesBin => ({
  person,
  binStart: new Date(t0 + k * 3 * H).toISOString(),
  start: t0 + k * 3 * H,
  end: t0 + (k + 1) * 3 * H,
  entries: missing ? 0 : 2,
  words: missing ? 0 : 40,
  missing,
  scores: { 'vader.compound': score },
});
const rating = (person: string, hours: number, mood: number | undefined, line: number): Rating => ({ person, instant: t0 + hours * H, zone: 'UTC', offsetMinutes: 0, values: { mood }, source: { file: 'reports.csv', line } });

describe('alignRatingsToBins', () => {
  const bins = [bin('a', 0, 0.1), bin('a', 1, 0.3), bin('a', 2, undefined, 'no_text'), bin('b', 0, -0.2)];
  it('averages the ratings that fall in the same bin and keeps bins without text as missing', () => {
    const { rows, diagnostics } = alignRatingsToBins(bins, [rating('a', 3.5, 40, 2), rating('a', 5.9, 60, 3), rating('a', 7, 10, 4), rating('b', 0, 70, 5)], ['mood']);
    expect(diagnostics).toEqual([]);
    expect(rows.map((r) => [r.person, r.scores['vader.compound'], r.ratings.mood, r.reports, r.missing])).toEqual([
      ['a', 0.3, 50, 2, ''],
      ['a', undefined, 10, 1, 'no_text'],
      ['b', -0.2, 70, 1, ''],
    ]);
  });
  it('puts a self-report exactly at a bin boundary into the later bin (start ≤ t < end)', () => {
    const { rows } = alignRatingsToBins(bins, [rating('a', 3, 20, 2)], ['mood']);
    expect(rows[0]?.scores['vader.compound']).toBe(0.3);
  });
  it('reports self-reports of unknown persons and outside the series as diagnostics', () => {
    const { rows, diagnostics } = alignRatingsToBins(bins, [rating('z', 1, 20, 2), rating('b', 10, 20, 3), rating('a', -1, 20, 4)], ['mood']);
    expect(rows).toEqual([]);
    expect(diagnostics.map((d) => [d.code, d.source?.line])).toEqual([
      ['rating_person_not_in_series', 2],
      ['rating_outside_series', 3],
      ['rating_outside_series', 4],
    ]);
  });
});

describe('alignRatingsToWindows', () => {
  const entry = (person: string, hours: number, words: number, score: number | undefined): EntryScore => ({ person, instant: t0 + hours * H, binStart: undefined, words, excluded: false, scores: { s: score } });
  const entries = [entry('a', 0, 10, 1), entry('a', 1, 30, 0), entry('a', 2.5, 20, 0.5), entry('a', 3, 5, -1)];
  const options = { windowMinutes: 180, minWords: 30, scoreColumns: ['s'], ratingColumns: ['mood'], label: (r: Rating) => new Date(r.instant).toISOString() };
  it('pools the entries of the window [t − 3 h, t) weighted by words', () => {
    const rows = alignRatingsToWindows(entries, [rating('a', 3, 50, 2)], options);
    // entries at 0, 1, 2.5 h: (10·1 + 30·0 + 20·0.5) / 60 = 1/3; the entry at exactly t is after the report.
    expect(rows[0]?.scores.s).toBeCloseTo(1 / 3, 12);
    expect([rows[0]?.entries, rows[0]?.words, rows[0]?.missing]).toEqual([3, 60, '']);
  });
  it('marks windows with too few words or no text as missing', () => {
    const rows = alignRatingsToWindows(entries, [rating('a', 0.5, 50, 2), rating('a', 10, 50, 3), rating('b', 1, 50, 4)], options);
    expect(rows.map((r) => [r.person, r.missing, r.scores.s])).toEqual([
      ['a', 'too_few_words', undefined],
      ['a', 'no_text', undefined],
      ['b', 'no_text', undefined],
    ]);
  });
});
