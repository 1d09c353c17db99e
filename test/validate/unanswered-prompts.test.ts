import { describe, expect, it } from 'vitest';
import type { EntryScore } from '../../src/validate/entry-score.js';
import type { Rating } from '../../src/validate/rating.js';
import type { SeriesBin } from '../../src/validate/series-bin.js';
import { random, randomInteger } from '../../src/stats/random.js';
import { validateSeries } from '../../src/validate/validate-series.js';

// A prompt that was sent but not answered (every rating empty or a missing code) is no
// observation: it is not a pair, not an observed self-report bin, and not a report behind a row.
// Counts below are worked by hand from the invented data.

const DAY = 86_400_000;
const t0 = Date.parse('2026-03-02T00:00:00Z');
const bins: SeriesBin[] = Array.from({ length: 6 }, (_, k) => ({
  person: 'ann',
  binStart: new Date(t0 + k * DAY).toISOString(),
  start: t0 + k * DAY,
  end: t0 + (k + 1) * DAY,
  entries: 1,
  words: 20,
  missing: '',
  scores: { s: [0.1, 0.4, 0.2, 0.5, 0.3, 0.6][k] },
}));
const rating = (day: number, hour: number, mood: number | undefined, calm: number | undefined, line: number): Rating => ({
  person: 'ann',
  instant: t0 + day * DAY + hour * 3_600_000,
  zone: 'UTC',
  offsetMinutes: 0,
  values: { mood, calm },
  source: { file: 'ratings.csv', line },
});
// Days 0–3 answered; day 4 only an unanswered prompt; day 5 one answered and one unanswered prompt.
const ratings = [rating(0, 9, 40, 3, 2), rating(1, 9, 70, 5, 3), rating(2, 9, 50, 4, 4), rating(3, 9, 80, 6, 5), rating(4, 9, undefined, undefined, 6), rating(5, 9, 60, undefined, 7), rating(5, 18, undefined, undefined, 8)];

describe('prompts without a rating are not counted as paired', () => {
  it('bin alignment: an unanswered prompt makes no row, no report and no pair, and is counted with its line', () => {
    const result = validateSeries({ bins, ratings, scoreColumns: ['s'], ratingColumns: ['mood', 'calm'] }, { replicates: 0, minPairs: 2 });
    // Rows: days 0, 1, 2, 3 and 5 (day 4 had only an unanswered prompt).
    expect(result.rows.map((r) => r.label)).toEqual([0, 1, 2, 3, 5].map((k) => new Date(t0 + k * DAY).toISOString()));
    expect(result.rows.map((r) => r.reports)).toEqual([1, 1, 1, 1, 1]);
    expect(result.counts.rows).toBe(5);
    const mood = result.pairs.find((p) => p.rating === 'mood')?.analysis;
    const calm = result.pairs.find((p) => p.rating === 'calm')?.analysis;
    expect(mood?.pairs).toBe(5);
    expect(calm?.pairs).toBe(4); // day 5's calm is missing
    expect(result.diagnostics.filter((d) => d.code === 'rating_unanswered').map((d) => d.source?.line)).toEqual([6, 8]);
  });

  it('window alignment: an unanswered prompt makes no row and no pair', () => {
    // One entry at 08:00 each day: every 09:00 prompt has text in its 3-hour window.
    const entries: EntryScore[] = [0, 1, 2, 3, 4, 5].map((k) => ({ person: 'ann', instant: t0 + k * DAY + 8 * 3_600_000, binStart: undefined, words: 20, excluded: false, scores: { s: [0.1, 0.4, 0.2, 0.5, 0.3, 0.6][k] } }));
    const result = validateSeries({ entries, ratings, scoreColumns: ['s'], ratingColumns: ['mood', 'calm'] }, { align: 'window', windowMinutes: 180, replicates: 0, minPairs: 2 });
    expect(result.rows).toHaveLength(5);
    expect(result.counts.rows).toBe(5);
    expect(result.pairs.find((p) => p.rating === 'mood')?.analysis.pairs).toBe(5);
    expect(result.pairs.find((p) => p.rating === 'calm')?.analysis.pairs).toBe(4);
    expect(result.diagnostics.filter((d) => d.code === 'rating_unanswered')).toHaveLength(2);
  });

  it('for random prompts with random gaps, rows and pairs count only answered prompts (fuzz; counts recomputed by brute force)', () => {
    const rng = random('unanswered-prompts');
    for (let trial = 0; trial < 30; trial++) {
      const prompts: Rating[] = [];
      for (let k = 0; k < 20; k++) {
        const day = randomInteger(rng, 6);
        const mood = randomInteger(rng, 3) === 0 ? undefined : randomInteger(rng, 101);
        const calm = randomInteger(rng, 3) === 0 ? undefined : 1 + randomInteger(rng, 7);
        prompts.push(rating(day, randomInteger(rng, 24), mood, calm, k + 2));
      }
      const result = validateSeries({ bins, ratings: prompts, scoreColumns: ['s'], ratingColumns: ['mood', 'calm'] }, { replicates: 0, minPairs: 2 });
      const dayOf = (r: Rating): number => Math.floor((r.instant - t0) / DAY);
      const answered = prompts.filter((r) => r.values.mood !== undefined || r.values.calm !== undefined);
      expect(result.counts.rows).toBe(new Set(answered.map(dayOf)).size);
      expect(result.rows.reduce((n, r) => n + r.reports, 0)).toBe(answered.length);
      for (const column of ['mood', 'calm']) {
        const pairs = new Set(prompts.filter((r) => r.values[column] !== undefined).map(dayOf)).size;
        expect(result.pairs.find((p) => p.rating === column)?.analysis.pairs).toBe(pairs);
      }
      expect(result.diagnostics.filter((d) => d.code === 'rating_unanswered')).toHaveLength(prompts.length - answered.length);
    }
  });
});
