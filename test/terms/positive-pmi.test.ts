import { describe, expect, it } from 'vitest';
import { positivePmi } from '../../src/terms/positive-pmi.js';
import { seedCooccurrence } from '../../src/terms/seed-cooccurrence.js';
import { suggestTerms } from '../../src/terms/suggest-terms.js';

// A hand-worked co-occurrence table (window = entry), seed {worry}:
//   e1 worry night        e6 coffee work
//   e2 worry night sleep  e7 night coffee
//   e3 worry night        e8 coffee
//   e4 worry work         e9 work
//   e5 sleep coffee       e10 sleep
// N = 10, n_s = 4.
//   night:  n_w = 4, n_ws = 3 → PMI = log2(3·10 / (4·4)) = log2(1.875) = 0.906890596
//   sleep:  n_w = 3, n_ws = 1 → log2(10/12) < 0 → PPMI 0
//   work:   n_w = 3, n_ws = 1 → PPMI 0
//   coffee: n_w = 4, n_ws = 0 → undefined
const entries = [
  'worry night', 'worry night sleep', 'worry night', 'worry work', 'sleep coffee',
  'coffee work', 'night coffee', 'coffee', 'work', 'sleep',
].map((e) => new Set(e.split(' ')));

describe('positive PMI over entries (Church & Hanks 1990), checked against a hand-worked table', () => {
  const counts = seedCooccurrence(entries, new Set(['worry']));
  it('counts entries, seed entries and joint entries as in the table', () => {
    expect(counts.entries).toBe(10);
    expect(counts.seedEntries).toBe(4);
    expect(counts.words.get('night')).toEqual({ entries: 4, withSeed: 3 });
    expect(counts.words.get('sleep')).toEqual({ entries: 3, withSeed: 1 });
    expect(counts.words.get('coffee')).toEqual({ entries: 4, withSeed: 0 });
  });
  it('gives log2(1.875) = 0.9069 for night, 0 for the negatively associated sleep and work, nothing for coffee', () => {
    expect(positivePmi(3, 4, 4, 10)).toBeCloseTo(0.906890596, 9);
    expect(positivePmi(1, 3, 4, 10)).toBe(0);
    expect(positivePmi(1, 3, 4, 10)).toBe(0);
    expect(positivePmi(0, 4, 4, 10)).toBeUndefined();
    expect(positivePmi(5, 4, 4, 10)).toBeUndefined();
  });
  it('suggests only night from the corpus with minimum count 3 and minimum PMI 0.5', () => {
    const s = suggestTerms({ seeds: ['worry'], corpus: counts, minCount: 3, minPmi: 0.5 });
    expect(s.map((x) => x.term)).toEqual(['night']);
    expect(s[0]!.pmi).toBeCloseTo(0.906890596, 9);
    expect(s[0]!.reasons).toEqual([{ kind: 'corpus', pmi: s[0]!.pmi, g2: s[0]!.strength, together: 3, entries: 4 }]);
  });
  it('never suggests English function words from the corpus', () => {
    const c = seedCooccurrence([new Set(['worry', 'the']), new Set(['worry', 'the']), new Set(['worry', 'the']), new Set(['tea'])], new Set(['worry']));
    expect(suggestTerms({ seeds: ['worry'], corpus: c, minCount: 1, minPmi: 0 }).map((x) => x.term)).toEqual([]);
  });
});
