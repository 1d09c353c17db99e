import { describe, expect, it } from 'vitest';
import { readReferenceCsv } from '../reference/reference-csv.js';
import { personVariableSummary } from '../../src/dynamics/person-variable-summary.js';
import { mssd } from '../../src/dynamics/mssd.js';
import { lag1AutocorrelationAcf } from '../../src/dynamics/lag1-autocorrelation-acf.js';
import { lag1AutocorrelationPearson } from '../../src/dynamics/lag1-autocorrelation-pearson.js';

describe('per-person dynamics on lme4 sleepstudy (test/reference/dynamics-psych, R psych 2.2.9)', () => {
  const data = readReferenceCsv('dynamics-psych/sleepstudy.csv');
  const expected = readReferenceCsv('dynamics-psych/expected.csv');
  const bySubject = new Map<string, number[]>();
  for (const row of data) {
    const list = bySubject.get(row['Subject']!) ?? [];
    list[Number(row['Days'])] = Number(row['Reaction']);
    bySubject.set(row['Subject']!, list);
  }

  it('gives MSSD equal to psych::mssd and RMSSD equal to psych::autoR rssd for all 18 subjects', () => {
    expect(expected).toHaveLength(18);
    for (const row of expected) {
      const values = bySubject.get(row['Subject']!)!;
      const result = mssd({ values, lagValid: values.map((_, t) => t > 0) });
      expect(result.ok).toBe(true);
      if (!result.ok) continue;
      expect(result.mssd).toBeCloseTo(Number(row['mssd']), 8);
      expect(result.rmssd).toBeCloseTo(Number(row['rssd']), 10);
      expect(result.pairs).toBe(9);
    }
  });

  it('gives the Pearson lag-1 autocorrelation equal to psych::autoR and the ACF form equal to R stats::acf', () => {
    for (const row of expected) {
      const values = bySubject.get(row['Subject']!)!;
      const series = { values, lagValid: values.map((_, t) => t > 0) };
      const pearson = lag1AutocorrelationPearson(series);
      const acf = lag1AutocorrelationAcf(series);
      expect(pearson.ok && acf.ok).toBe(true);
      if (!pearson.ok || !acf.ok) continue;
      expect(pearson.r).toBeCloseTo(Number(row['autoR']), 12);
      expect(acf.r).toBeCloseTo(Number(row['acf1']), 12);
    }
  });

  it('gives the same four values through personVariableSummary with its default options, as analyseDynamics reports them', () => {
    for (const row of expected) {
      const values = bySubject.get(row['Subject']!)!;
      const s = personVariableSummary({ values, lagValid: values.map((_, t) => t > 0) });
      expect(s.mssd).toBeCloseTo(Number(row['mssd']), 8);
      expect(s.rmssd).toBeCloseTo(Number(row['rssd']), 10);
      expect(s.autocorrelationPearson).toBeCloseTo(Number(row['autoR']), 12);
      expect(s.autocorrelationAcf).toBeCloseTo(Number(row['acf1']), 12);
      expect(s.lagPairs).toBe(9);
    }
  });
});

describe('personVariableSummary', () => {
  it('uses only adjacent observed pairs, counts missing bins, and flags a short series as not ready', () => {
    // Bins: 1 2 _ 4 5 | 9 (break before the last bin)
    const values = [1, 2, undefined, 4, 5, 9];
    const lagValid = [false, true, false, false, true, false];
    const s = personVariableSummary({ values, lagValid }, { minLagPairs: 3 });
    expect(s.bins).toBe(6);
    expect(s.observed).toBe(5);
    expect(s.percentMissing).toBeCloseTo(100 / 6, 12);
    expect(s.mean).toBeCloseTo(21 / 5, 12);
    expect(s.lagPairs).toBe(2); // (1,2) and (4,5): hand count
    expect(s.mssd).toBe(1);
    expect(s.rmssd).toBe(1);
    expect(s.ready).toBe(false);
    expect(s.autocorrelationPearson).toBeUndefined(); // 2 pairs: too few
    // ACF form by hand: mean 4.2; ((2−4.2)(1−4.2) + (5−4.2)(4−4.2)) / Σ(x−4.2)²
    const ss = [1, 2, 4, 5, 9].reduce((a, x) => a + (x - 4.2) ** 2, 0);
    expect(s.autocorrelationAcf).toBeCloseTo(((2 - 4.2) * (1 - 4.2) + (5 - 4.2) * (4 - 4.2)) / ss, 12);
    expect(s.notes.join(' ')).toMatch(/2 valid lag pairs, fewer than the 3/);
  });

  it('returns undefined with a reason instead of fake zeros for an empty series', () => {
    const s = personVariableSummary({ values: [undefined, undefined], lagValid: [false, false] });
    expect(s.mean).toBeUndefined();
    expect(s.sd).toBeUndefined();
    expect(s.mssd).toBeUndefined();
    expect(s.percentMissing).toBe(100);
    expect(s.ready).toBe(false);
    expect(s.notes[0]).toBe('no observed bins');
  });

  it('does not call a series that never changes ready, however many lag pairs it has', () => {
    const s = personVariableSummary({ values: [3, 3, 3, 3, 3], lagValid: [false, true, true, true, true] }, { minLagPairs: 2 });
    expect(s.lagPairs).toBe(4);
    expect(s.mssd).toBe(0);
    expect(s.ready).toBe(false);
    expect(s.notes.join(' ')).toContain('never changes');
  });
});
