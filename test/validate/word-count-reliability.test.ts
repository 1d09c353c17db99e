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
