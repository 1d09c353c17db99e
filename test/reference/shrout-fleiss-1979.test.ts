import { describe, expect, it } from 'vitest';
import { intraclassCorrelation } from '../../src/stats/intraclass-correlation.js';
import { oneWayIntraclassCorrelation } from '../../src/stats/one-way-intraclass-correlation.js';
import { readReferenceCsv } from './reference-csv.js';
import { readSharedReferenceCsv } from './shared/read-shared-reference.js';

// Shrout, P.E. & Fleiss, J.L. (1979). Intraclass correlations: uses in assessing rater reliability.
// Psychological Bulletin 86(2):420–428, Table 2 (6 targets × 4 judges), read from
// ../shared/reference/shrout_fleiss_1979.csv. Expected values: R psych::ICC 2.2.9 as quoted in
// ../shared/reference/SOURCES.md (the paper rounds them to .17 .29 .71 .44 .62 .91).
const data = readSharedReferenceCsv('shrout_fleiss_1979.csv');
const matrix = data?.rows.map((row) => row.slice(1).map(Number)) ?? [];

describe.skipIf(!data)('Shrout & Fleiss (1979) Table 2, 6 targets rated by 4 judges (../shared/reference/shrout_fleiss_1979.csv)', () => {
  const result = intraclassCorrelation(matrix);
  it('reads six complete targets and four judges', () => {
    expect(result.ok && [result.targets, result.raters, result.incomplete]).toEqual([6, 4, 0]);
  });
  it.each([
    ['icc1', 0.1657418, 'ICC(1,1) = .17'],
    ['icc2', 0.2897638, 'ICC(2,1) = .29'],
    ['icc3', 0.7148407, 'ICC(3,1) = .71'],
    ['icc1k', 0.4427971, 'ICC(1,4) = .44'],
    ['icc2k', 0.6200505, 'ICC(2,4) = .62'],
    ['icc3k', 0.9093155, 'ICC(3,4) = .91'],
  ] as const)('gives %s = %f as R psych::ICC 2.2.9 (paper: %s)', (form, expected) => {
    if (!result.ok) throw new Error(result.reason);
    expect(result[form].value).toBeCloseTo(expected, 6);
  });
  it('gives the ANOVA mean squares of the paper’s Table 3 (BMS 11.24, WMS 6.26, JMS 32.49, EMS 1.02; rounded values from memory of the paper, checked here to the digits of the data)', () => {
    if (!result.ok) throw new Error(result.reason);
    expect(result.bms).toBeCloseTo(11.24167, 4);
    expect(result.wms).toBeCloseTo(6.263889, 5);
    expect(result.jms).toBeCloseTo(32.48611, 4);
    expect(result.ems).toBeCloseTo(1.019444, 5);
  });
  it('gives the one-way F test of psych::ICC for ICC1 (F = 1.79 on 5 and 18 df)', () => {
    if (!result.ok) throw new Error(result.reason);
    expect(result.icc1.f).toBeCloseTo(11.24167 / 6.263889, 5);
    expect([result.icc1.df1, result.icc1.df2]).toEqual([5, 18]);
  });
  it('gives the same ICC(1,1) and ICC(1,k) from the unbalanced one-way form on the long table (balanced case)', () => {
    const long = matrix.flatMap((row, i) => row.map((y) => ({ target: String(i + 1), y })));
    const oneWay = oneWayIntraclassCorrelation(long, (d) => d.target, (d) => d.y);
    if (!oneWay.ok) throw new Error(oneWay.reason);
    expect(oneWay.icc1).toBeCloseTo(0.1657418, 6);
    expect(oneWay.icc1k).toBeCloseTo(0.4427971, 6);
    expect(oneWay.n0).toBe(4);
  });
  // F tests and 95% bounds of R psych::ICC 2.2.9, written by test/reference/psych/make-expected.R
  // (expected-icc.csv) from the same shared table. psych::ICC takes its mean squares from an lme4 fit
  // (lmer = TRUE), so it agrees with the exact ANOVA values computed here to about 1e-6.
  const forms = { ICC1: 'icc1', ICC2: 'icc2', ICC3: 'icc3', ICC1k: 'icc1k', ICC2k: 'icc2k', ICC3k: 'icc3k' } as const;
  const close = (actual: number | undefined, expected: string, tolerance: number) => expect(Math.abs((actual as number) - Number(expected))).toBeLessThan(tolerance);
  it.each(readReferenceCsv('psych/expected-icc.csv').map((e) => [e.type as keyof typeof forms, e] as const))('gives the value, F test and 95 percent bounds of psych::ICC for %s', (type, e) => {
    if (!result.ok) throw new Error(result.reason);
    const f = result[forms[type]];
    close(f.value, e.ICC as string, 2e-6);
    close(f.f / Number(e.F), "1", 1e-5); // relative
    expect([f.df1, f.df2]).toEqual([Number(e.df1), Number(e.df2)]);
    close(f.p, e.p as string, 2e-6);
    close(f.ciLow, e.lower as string, 1e-5);
    close(f.ciHigh, e.upper as string, 1e-5);
  });
});
