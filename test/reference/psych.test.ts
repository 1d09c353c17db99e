import { describe, expect, it } from 'vitest';
import { cronbachAlpha } from '../../src/stats/cronbach-alpha.js';
import { oneWayIntraclassCorrelation } from '../../src/stats/one-way-intraclass-correlation.js';
import { repeatedMeasuresCorrelation } from '../../src/stats/repeated-measures-correlation.js';
import { betweenPersonCorrelation } from '../../src/validate/between-person-correlation.js';
import { readReferenceCsv } from './reference-csv.js';

// Expected values from R psych 2.2.9 (statsBy, alpha) written by test/reference/psych/make-expected.R.
const statsBy = readReferenceCsv('psych/expected-statsby.csv');
const datasets: Record<string, { group: string; rows: Record<string, string>[] }> = {
  'within-between': { group: 'Group', rows: readReferenceCsv('psych/within-between.csv') },
  'sat-act': { group: 'education', rows: readReferenceCsv('psych/sat-act.csv') },
};

describe('within/between decomposition against R psych::statsBy 2.2.9 (psych data withinBetween and sat.act)', () => {
  const correlations = statsBy.filter((e) => e.quantity === 'rwg' || e.quantity === 'rbg');
  it.each(correlations.map((e) => [e.dataset, e.quantity, e.x, e.y, Number(e.value)] as const))('%s: %s of %s and %s is %f', (dataset, quantity, x, y, value) => {
    const { group, rows } = datasets[dataset as string]!;
    if (quantity === 'rwg') {
      const r = repeatedMeasuresCorrelation(rows, (d) => d[group] as string, (d) => Number(d[x as string]), (d) => Number(d[y as string]));
      if (!r.ok) throw new Error(r.reason);
      expect(r.r).toBeCloseTo(value, 8);
    } else {
      const pairs = rows.map((d) => ({ person: d[group] as string, x: Number(d[x as string]), y: Number(d[y as string]) }));
      const r = betweenPersonCorrelation(pairs, 0.95, 'observations'); // statsBy weights group means by group size
      if (!r.ok) throw new Error(r.reason);
      expect(r.r).toBeCloseTo(value, 8);
    }
  });
  const iccs = statsBy.filter((e) => e.quantity === 'ICC1' || e.quantity === 'ICC2');
  it.each(iccs.map((e) => [e.dataset, e.quantity, e.x, Number(e.value)] as const))('%s: %s (statsBy) of %s is %f', (dataset, quantity, x, value) => {
    const { group, rows } = datasets[dataset as string]!;
    const icc = oneWayIntraclassCorrelation(rows, (d) => d[group] as string, (d) => Number(d[x as string]), { groupSize: 'mean' }); // statsBy uses N/groups
    if (!icc.ok) throw new Error(icc.reason);
    expect(quantity === 'ICC1' ? icc.icc1 : icc.icc1k).toBeCloseTo(value, 8);
  });
});

describe('cronbachAlpha against R psych::alpha 2.2.9 on R’s attitude data (Chatterjee & Price 1977; 30 × 7)', () => {
  const expected = Object.fromEntries(readReferenceCsv('psych/expected-alpha.csv').map((r) => [r.quantity as string, Number(r.value)]));
  const items = readReferenceCsv('psych/attitude.csv').map((r) => Object.values(r).map(Number));
  it('gives raw_alpha 0.8431 and std.alpha 0.8391', () => {
    const alpha = cronbachAlpha(items);
    if (!alpha.ok) throw new Error(alpha.reason);
    expect(alpha.items).toBe(7);
    expect(alpha.n).toBe(30);
    expect(alpha.alpha).toBeCloseTo(expected.raw_alpha as number, 10);
    expect(alpha.standardizedAlpha).toBeCloseTo(expected['std.alpha'] as number, 10);
  });
  it('leaves out incomplete rows and counts them', () => {
    const alpha = cronbachAlpha([...items, [1, undefined, 3, 4, 5, 6, 7]]);
    expect(alpha.ok && alpha.incomplete).toBe(1);
  });
});
