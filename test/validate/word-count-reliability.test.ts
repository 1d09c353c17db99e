import { describe, expect, it } from 'vitest';
import { random } from '../../src/stats/random.js';
import type { EntryScore } from '../../src/validate/entry-score.js';
import { wordCountReliability } from '../../src/validate/word-count-reliability.js';
import { normal } from './build-pairs.js';

/**
 * Synthetic entries whose score is the bin's true level plus noise with variance 1/words
 * (a per-word rate): a bin of W words then has reliability W·v/(W·v + 1) for true variance v.
 */
function buildEntries(seed: number): EntryScore[] {
  const source = random(seed);
  const entries: EntryScore[] = [];
  for (let p = 0; p < 30; p++) {
    for (let b = 0; b < 40; b++) {
      const level = normal(source) * 0.1;
      const n = 2 + Math.floor(source() * 6);
      const perEntry = [5, 10, 20, 40, 80][b % 5] as number;
      for (let e = 0; e < n; e++) {
        entries.push({ person: `p${p}`, instant: b * 3_600_000 + e, binStart: b * 3_600_000, words: perEntry, excluded: false, scores: { s: level + normal(source) / Math.sqrt(perEntry) } });
      }
    }
  }
  return entries;
}

/** Entries whose scores are pure noise (no true differences between bins): halves cannot agree. */
function noiseEntries(seed: number, perEntry: (b: number) => number, persons = 30, binsPerPerson = 40): EntryScore[] {
  const source = random(seed);
  const entries: EntryScore[] = [];
  for (let p = 0; p < persons; p++) {
    for (let b = 0; b < binsPerPerson; b++) {
      const n = 2 + Math.floor(source() * 4);
      for (let e = 0; e < n; e++) entries.push({ person: `p${p}`, instant: b * 3_600_000 + e, binStart: b * 3_600_000, words: perEntry(b), excluded: false, scores: { s: normal(source) } });
    }
  }
  return entries;
}

describe('wordCountReliability: honest estimates', () => {
  it('reports a band whose halves do not agree as not estimable, never a stepped-up negative reliability (seeded noise-only data)', () => {
    const result = wordCountReliability(noiseEntries(4, (b) => [5, 10, 20, 40, 80][b % 5] as number), 's', { random: random(1) });
    const withBins = result.bands.filter((b) => b.bins >= 20);
    expect(withBins.length).toBeGreaterThanOrEqual(4);
    for (const b of withBins) {
      if (b.reliability !== undefined) expect(b.reliability).toBeGreaterThan(0);
      if (b.withinReliability !== undefined) expect(b.withinReliability).toBeGreaterThan(0);
    }
    expect(withBins.filter((b) => b.reliability === undefined).length).toBeGreaterThanOrEqual(withBins.length - 1);
    expect(withBins.some((b) => /not estimable/.test(b.note))).toBe(true);
    expect(result.minWords).toBeUndefined();
  });
  it('recommends nothing when larger bands contradict a smaller band that looks reliable', () => {
    // Bins of 10-word entries carry a true level; bins of 100-word entries are pure noise.
    const source = random(12);
    const entries: EntryScore[] = [];
    for (let p = 0; p < 30; p++) {
      for (let b = 0; b < 40; b++) {
        const level = normal(source);
        const long = b % 2 === 1;
        const n = 3 + Math.floor(source() * 3);
        for (let e = 0; e < n; e++) entries.push({ person: `p${p}`, instant: b * 3_600_000 + e, binStart: b * 3_600_000, words: long ? 100 : 10, excluded: false, scores: { s: long ? normal(source) : level + normal(source) } });
      }
    }
    const result = wordCountReliability(entries, 's', { random: random(2), target: 0.95 });
    const small = result.bands.find((b) => b.low === 25);
    expect(small?.reliability).toBeGreaterThan(0.5);
    expect(result.minWords).toBeUndefined();
    expect(result.basis).toBe('none');
    expect(result.text).toMatch(/contradict|not confirm/);
  });
  it('averages many random splits, so the estimate barely depends on the seed (Parsons, Kruijt & Fox 2019)', () => {
    const entries = buildEntries(21);
    const a = wordCountReliability(entries, 's', { random: random(1) });
    const b = wordCountReliability(entries, 's', { random: random(2) });
    a.bands.forEach((band, i) => {
      const other = b.bands[i];
      if (band.halfR !== undefined && other?.halfR !== undefined) expect(Math.abs(band.halfR - other.halfR)).toBeLessThan(0.02);
    });
  });
  it('scores the halves with the series\' aggregator: an entry mean weighs one long off-topic entry as one of eight, a word-weighted mean follows it', () => {
    const source = random(5);
    const entries: EntryScore[] = [];
    for (let p = 0; p < 30; p++) {
      for (let b = 0; b < 30; b++) {
        const level = normal(source);
        for (let e = 0; e < 8; e++) entries.push({ person: `p${p}`, instant: b * 3_600_000 + e, binStart: b * 3_600_000, words: e === 0 ? 300 : 5, excluded: false, scores: { s: e === 0 ? normal(source) : level + 0.3 * normal(source) } });
      }
    }
    const band = (r: ReturnType<typeof wordCountReliability>) => r.bands.find((x) => x.bins >= 20);
    const mean = band(wordCountReliability(entries, 's', { random: random(1), reducer: 'mean', bands: [0, 400] }));
    const weighted = band(wordCountReliability(entries, 's', { random: random(1), reducer: 'weighted', bands: [0, 400] }));
    expect(mean?.reliability).toBeGreaterThan(0.7);
    expect(weighted?.reliability ?? 0).toBeLessThan(0.3);
  });
  it('warns when the --min-words in use is below the recommendation', () => {
    const result = wordCountReliability(buildEntries(9), 's', { random: random(1), target: 0.7, minWordsInUse: 1 });
    expect(result.minWords).toBeGreaterThan(1);
    expect(result.warning).toMatch(/--min-words is 1, below the \d+ words/);
    const fine = wordCountReliability(buildEntries(9), 's', { random: random(1), target: 0.7, minWordsInUse: 5000 });
    expect(fine.warning).toBeUndefined();
  });
});

describe('wordCountReliability', () => {
  const entries = buildEntries(9);
  const result = wordCountReliability(entries, 's', { random: random(1), target: 0.7 });
  it('finds reliability rising with the words in a bin', () => {
    const rel = result.bands.filter((b) => b.reliability !== undefined).map((b) => b.reliability as number);
    expect(rel.length).toBeGreaterThanOrEqual(4);
    expect(rel[rel.length - 1]).toBeGreaterThan(rel[0] as number);
  });
  it('matches the Spearman–Brown expectation W·v/(W·v + 1) in the 200–400 word band within sampling error', () => {
    const band = result.bands.find((b) => b.low === 200);
    const w = band?.medianWords as number;
    const expected = (w * 0.01) / (w * 0.01 + 1);
    expect(Math.abs((band?.reliability as number) - expected)).toBeLessThan(0.15);
  });
  it('recommends a --min-words from the first band that reaches the target', () => {
    expect(result.basis).toBe('observed');
    expect(result.minWords).toBeGreaterThanOrEqual(100);
    expect(result.text).toMatch(/consider --min-words/);
  });
  it('is reproducible with the same seed', () => {
    expect(wordCountReliability(entries, 's', { random: random(1) })).toEqual(wordCountReliability(entries, 's', { random: random(1) }));
  });
  it('says so when there are too few bins with two entries', () => {
    const few = wordCountReliability(entries.slice(0, 10), 's', { random: random(1) });
    expect(few.basis).toBe('none');
    expect(few.minWords).toBeUndefined();
    expect(few.text).toMatch(/cannot be estimated/);
  });
});
