import { describe, expect, it } from 'vitest';
import { quantile } from '../../src/stats/quantile.js';
import { readReferenceCsv } from '../reference/reference-csv.js';

// Expected values: R stats::quantile(type = 7), written by test/reference/quantile/make-expected.R.
const expected = readReferenceCsv('quantile/expected.csv');

describe('quantile', () => {
  it.each(expected.map((e) => [e.set as string, Number(e.p), Number(e.quantile), (e.values as string).split(' ').map(Number)] as const))(
    'gives R quantile(type = 7) of the %s set at p = %f: %f (Hyndman & Fan 1996 type 7)',
    (_, p, value, values) => {
      expect(quantile(values, p)).toBeCloseTo(value, 12);
    },
  );
  it('skips missing values and reads through valueof, as d3-array quantile does', () => {
    expect(quantile([{ v: 1 }, { v: undefined }, { v: 5 }, { v: Number.NaN }], 0.3, (d) => d.v)).toBeCloseTo(2.2, 12);
  });
  it('returns undefined for no values or a p outside [0, 1]', () => {
    expect(quantile([], 0.5)).toBeUndefined();
    expect(quantile([undefined, null], 0.5)).toBeUndefined();
    expect(quantile([1, 2], -0.1)).toBeUndefined();
    expect(quantile([1, 2], 1.1)).toBeUndefined();
    expect(quantile([1, 2], Number.NaN)).toBeUndefined();
  });
});
