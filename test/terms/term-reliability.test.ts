import { describe, expect, it } from 'vitest';
import { itemAlpha } from '../../src/terms/item-alpha.js';
import { termReliability } from '../../src/terms/term-reliability.js';
import { readReferenceCsv } from '../reference/reference-csv.js';

const matrix = readReferenceCsv('terms/term-counts.csv').map((row) => Object.values(row).map(Number));
const sparse = matrix.map((row) => row.map((x, j) => [j, x] as [number, number]).filter(([, x]) => x !== 0));
const frequency = matrix[0]!.map((_, j) => matrix.reduce((s, r) => s + r[j]!, 0));
const expected = Object.fromEntries(readReferenceCsv('terms/expected-term-reliability.csv').map((r) => [r.quantity as string, Number(r.value)]));

describe('termReliability', () => {
  it('equals R psych::alpha raw and standardized alpha on a committed term-count matrix (psych 2.2.9, test/reference/terms/make-expected.R)', () => {
    const r = termReliability(sparse, frequency);
    expect(r.items).toBe(6);
    expect(r.rows).toBe(40);
    expect(r.alpha).toBeCloseTo(expected.raw_alpha!, 10);
    expect(r.standardizedAlpha).toBeCloseTo(expected.std_alpha!, 10);
  });
  it('equals the half correlation and Spearman-Brown split-half computed in R with base cor() (test/reference/terms/make-expected.R)', () => {
    const r = termReliability(sparse, frequency);
    expect(r.halfCorrelation).toBeCloseTo(expected.half_r!, 10);
    expect(r.splitHalf).toBeCloseTo(expected.split_half!, 10);
  });
  it('gives the same raw alpha through the sparse path used for long lists as R psych::alpha', () => {
    const a = itemAlpha(sparse, 6);
    expect(a.ok && a.alpha).toBeCloseTo(expected.raw_alpha!, 10);
    const viaLongPath = termReliability(sparse, frequency, 2);
    expect(viaLongPath.alpha).toBeCloseTo(expected.raw_alpha!, 10);
    expect(viaLongPath.standardizedAlpha).toBeUndefined();
  });
  it('steps a half correlation of .80 up to 2(.8)/1.8 = .889 (Spearman 1910; Brown 1910 formula, hand-computed)', () => {
    // two one-term halves whose sums are the pairs (1,2) (2,1) (3,4) (4,3) (5,5): r = 0.8
    const rows = [[1, 2], [2, 1], [3, 4], [4, 3], [5, 5]].map(([a, b]) => [[0, a!], [1, b!]] as Array<[number, number]>);
    const r = termReliability(rows, [15, 14]);
    expect(r.halfCorrelation).toBeCloseTo(0.8, 12);
    expect(r.splitHalf).toBeCloseTo(1.6 / 1.8, 12);
  });
  it('says why alpha cannot be computed for a list with one matched term', () => {
    const r = termReliability([[[0, 1]], [], [[0, 2]]], [3]);
    expect(r.alpha).toBeUndefined();
    expect(r.alphaReason).toMatch(/at least two items/);
    expect(r.splitHalfReason).toMatch(/at least two items/);
  });
});
