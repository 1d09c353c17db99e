import { describe, expect, it } from 'vitest';
import { readReferenceCsv } from '../reference/reference-csv.js';
import { var1 } from '../../src/dynamics/var1.js';
import { pooledVar1 } from '../../src/dynamics/pooled-var1.js';

function fixture() {
  const rows = readReferenceCsv('dynamics-var/fixture.csv');
  const persons = new Map<string, { values: { a: (number | undefined)[]; b: (number | undefined)[] }; lagValid: boolean[] }>();
  for (const row of rows) {
    const p = persons.get(row['person']!) ?? { values: { a: [], b: [] }, lagValid: [] };
    const num = (s: string | undefined): number | undefined => (s === undefined || s === '' ? undefined : Number(s));
    p.values.a.push(num(row['a']));
    p.values.b.push(num(row['b']));
    p.lagValid.push(row['lag_valid'] === '1');
    persons.set(row['person']!, p);
  }
  return persons;
}

describe('VAR(1) against statsmodels 0.13.5 (test/reference/dynamics-var/make-expected.py)', () => {
  it('equals statsmodels VAR(1) with a constant on a person’s mean-centred series: coefficients, SEs and t', () => {
    const persons = fixture();
    const p1 = persons.get('P1')!;
    const fit = var1(p1.values, p1.lagValid, ['a', 'b']);
    expect(fit.ok).toBe(true);
    if (!fit.ok) return;
    expect(fit.pairs).toBe(149);
    expect(fit.df).toBe(146);
    const expected = readReferenceCsv('dynamics-var/expected-var.csv');
    for (const row of expected) {
      const mine = fit.coefficients.find((c) => c.outcome === row['outcome'] && c.predictor === row['predictor'])!;
      expect(mine.estimate).toBeCloseTo(Number(row['estimate']), 9);
      expect(mine.se).toBeCloseTo(Number(row['se']), 9);
      expect(mine.t).toBeCloseTo(Number(row['t']), 7);
      // statsmodels VAR reports normal p-values; ours use Student t on the residual df.
    }
  });

  it('equals statsmodels OLS with person dummies for the pooled fixed-effects VAR(1), over valid lag pairs only (gaps and breaks)', () => {
    const persons = fixture();
    const fit = pooledVar1([...persons.values()], ['a', 'b']);
    expect(fit.ok).toBe(true);
    if (!fit.ok) return;
    const expected = readReferenceCsv('dynamics-var/expected-pooled.csv');
    expect(fit.pairs).toBe(Number(expected[0]!['n']));
    expect(fit.df).toBe(Number(expected[0]!['df']));
    expect(fit.persons).toBe(3);
    for (const row of expected) {
      const mine = fit.coefficients.find((c) => c.outcome === row['outcome'] && c.predictor === row['predictor'])!;
      expect(mine.estimate).toBeCloseTo(Number(row['estimate']), 9);
      expect(mine.se).toBeCloseTo(Number(row['se']), 9);
      expect(mine.p).toBeCloseTo(Number(row['p']), 7); // statsmodels OLS uses Student t, as we do (jstat's t CDF to ~1e-9)
    }
  });

  it('is not estimable when there are no more lag pairs than parameters', () => {
    const fit = var1({ a: [1, 2, 3], b: [3, 1, 2] }, [false, true, true], ['a', 'b']);
    expect(fit.ok).toBe(false);
    if (!fit.ok) expect(fit.code).toBe('too_few_lag_pairs');
  });
});
