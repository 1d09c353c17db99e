import { describe, expect, it } from 'vitest';
import { mean } from '../../src/stats/mean.js';
import { pearsonCorrelation } from '../../src/stats/pearson-correlation.js';
import { repeatedMeasuresCorrelation } from '../../src/stats/repeated-measures-correlation.js';
import { groupBy } from '../../src/stats/group-by.js';
import { random } from '../../src/stats/random.js';
import { analysePair } from '../../src/validate/analyse-pair.js';
import { DEFAULT_VALIDATE_OPTIONS } from '../../src/validate/validate-series.js';
import { readSharedReferenceCsv } from './shared/read-shared-reference.js';

// Bland, J.M. & Altman, D.G. (1995). Calculating correlation coefficients with repeated
// observations: Part 1, correlation within subjects. BMJ 310:446 (Table 1; 47 rows, 8 subjects),
// read from ../shared/reference/bland_altman_1995_pH_PaCO2.csv. Expected values as quoted in
// ../shared/reference/SOURCES.md (R package rmcorr 0.8.1).
const data = readSharedReferenceCsv('bland_altman_1995_pH_PaCO2.csv');
const rows = data?.rows.map(([subject, pH, paco2]) => ({ subject: subject as string, pH: Number(pH), paco2: Number(paco2) })) ?? [];

describe.skipIf(!data)('Bland & Altman (1995) pH and PaCO2 of 8 subjects (../shared/reference/bland_altman_1995_pH_PaCO2.csv)', () => {
  it('gives the repeated-measures correlation r = −0.5067697 on df = 38 with p = 0.000847 (rmcorr 0.8.1)', () => {
    const result = repeatedMeasuresCorrelation(rows, (d) => d.subject, (d) => d.paco2, (d) => d.pH);
    if (!result.ok) throw new Error(result.reason);
    expect(result.r).toBeCloseTo(-0.5067697, 7);
    expect(result.df).toBe(38);
    expect(result.n).toBe(47);
    expect(result.persons).toBe(8);
    expect(result.p).toBeCloseTo(0.000847, 6);
  });
  it('gives the 95% interval [−0.7067146, −0.2318631] = tanh(atanh r ∓ 1.96/√(df − 1)) (rmcorr 0.8.1)', () => {
    const result = repeatedMeasuresCorrelation(rows, (d) => d.subject, (d) => d.paco2, (d) => d.pH);
    if (!result.ok) throw new Error(result.reason);
    expect(result.ciLow).toBeCloseTo(-0.7067146, 6);
    expect(result.ciHigh).toBeCloseTo(-0.2318631, 6);
  });
  it('is symmetric in x and y, as the within-subject correlation of Bland & Altman', () => {
    const a = repeatedMeasuresCorrelation(rows, (d) => d.subject, (d) => d.paco2, (d) => d.pH);
    const b = repeatedMeasuresCorrelation(rows, (d) => d.subject, (d) => d.pH, (d) => d.paco2);
    expect(a.ok && b.ok && a.r - b.r).toBeCloseTo(0, 12);
  });
  it('gives the pooled correlation ignoring subjects, r = −0.0652177 (SOURCES.md)', () => {
    const result = pearsonCorrelation(rows, (d) => d.paco2, (d) => d.pH);
    expect(result.ok && result.r).toBeCloseTo(-0.0652177, 7);
  });
  it('reports the pooled r of the 47 clustered pairs as descriptive only, with no interval or p-value (Bland & Altman 1995)', () => {
    const a = analysePair(rows.map((d) => ({ person: d.subject, x: d.paco2, y: d.pH })), { random: random(1), replicates: 0 });
    if (!a.pooled.ok) throw new Error(a.pooled.reason);
    expect(a.pooled.r).toBeCloseTo(-0.0652177, 7);
    expect(a.pooled).not.toHaveProperty('ciLow');
    expect(a.pooled).not.toHaveProperty('p');
    expect(a.pooled.note).toMatch(/descriptive only/);
  });
  it('gives the correlation of the 8 subject means, r = 0.0817731 (SOURCES.md)', () => {
    const means = [...groupBy(rows, (d) => d.subject).values()].map((g) => [mean(g, (d) => d.paco2), mean(g, (d) => d.pH)] as const);
    const result = pearsonCorrelation(means);
    expect(result.ok && result.r).toBeCloseTo(0.0817731, 7);
    expect(result.ok && result.n).toBe(8);
  });
  it('gives the same three correlations through analysePair, as the validate stage computes them with its default options (rmcorr 0.8.1 and SOURCES.md)', () => {
    const o = DEFAULT_VALIDATE_OPTIONS;
    const analysis = analysePair(
      rows.map((d) => ({ person: d.subject, x: d.paco2, y: d.pH })),
      { random: random(`${o.seed}\u0000PaCO2\u0000pH`), replicates: o.replicates, minPairs: o.minPairs, level: o.level, inference: o.inference },
    );
    expect(analysis.within.ok && [analysis.within.r, analysis.within.df]).toEqual([expect.closeTo(-0.5067697, 7), 38]);
    expect(analysis.within.ok && [analysis.within.ciLow, analysis.within.ciHigh]).toEqual([expect.closeTo(-0.7067146, 6), expect.closeTo(-0.2318631, 6)]);
    expect(analysis.between.ok && [analysis.between.r, analysis.between.n]).toEqual([expect.closeTo(0.0817731, 7), 8]);
    expect(analysis.pooled.ok && analysis.pooled.r).toBeCloseTo(-0.0652177, 7);
  });
});
