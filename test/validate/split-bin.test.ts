import { describe, expect, it } from 'vitest';
import { random } from '../../src/stats/random.js';
import { reducePieces, splitBin } from '../../src/validate/split-bin.js';

describe('splitBin', () => {
  const pieces = [3, 40, 7, 12, 25, 5, 60, 9].map((words, i) => ({ words, score: i % 3 }));
  it('balances the halves by words for a word-weighted series: they differ by at most the longest entry (fuzzed over 200 seeds)', () => {
    for (let seed = 0; seed < 200; seed++) {
      const h = splitBin(pieces, 'weighted', random(seed));
      if (!h) throw new Error('no split');
      expect(h.wordsA + h.wordsB).toBe(161);
      expect(Math.abs(h.wordsA - h.wordsB)).toBeLessThanOrEqual(60);
    }
  });
  it('balances the halves by entries for an entry-mean series and scores them by the entry mean', () => {
    const h = splitBin([{ words: 100, score: 1 }, { words: 1, score: 3 }, { words: 1, score: 5 }, { words: 1, score: 7 }], 'mean', random(1));
    if (!h) throw new Error('no split');
    expect([h.a, h.b].every((v) => [2, 3, 4, 5, 6].includes(v))).toBe(true);
    expect(h.a + h.b).toBe(8);
  });
  it('reduces pieces as the series does: weighted, mean and sum', () => {
    const p = [{ words: 1, score: 2 }, { words: 3, score: 6 }];
    expect(reducePieces(p, 'weighted')).toBe(5);
    expect(reducePieces(p, 'mean')).toBe(4);
    expect(reducePieces(p, 'sum')).toBe(8);
    expect(reducePieces([], 'mean')).toBeUndefined();
  });
  it('gives no split for a bin of one entry', () => {
    expect(splitBin([{ words: 5, score: 1 }], 'weighted', random(1))).toBeUndefined();
  });
});
