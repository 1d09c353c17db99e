import { describe, expect, it } from 'vitest';
import { analyseDynamics } from '../../src/dynamics/analyse-dynamics.js';
import { dynamicsTables } from '../../src/dynamics/dynamics-tables.js';
import { random } from '../../src/stats/random.js';
import { syntheticPersons } from './synthetic-series.js';

const ccm = { samples: 10, surrogates: 19, librarySizeCount: 5 };

describe('analyseDynamics', () => {
  it('describes every person × variable, fits VAR(1) per person and pooled, and cross maps both directions of each pair', () => {
    const persons = syntheticPersons(2, 300);
    const result = analyseDynamics(persons, { seed: 1, ccm });
    expect(result.options.variables).toEqual(['mood', 'tone']);
    expect(result.options.pairs).toEqual([['mood', 'tone']]);
    expect(result.summaries).toHaveLength(4);
    expect(result.summaries.every((s) => s.ready)).toBe(true);
    // 2 persons × 2 equations × 3 coefficients + pooled 2 × 2
    expect(result.var.filter((v) => v.scope === 'person')).toHaveLength(12);
    expect(result.var.filter((v) => v.scope === 'pooled')).toHaveLength(4);
    expect(result.ccm).toHaveLength(4);
    const moodDrivesTone = result.ccm.filter((c) => c.cause === 'mood' && c.effect === 'tone');
    expect(moodDrivesTone.every((c) => c.status === 'ok' && c.converges === true && c.verdict === 'drives')).toBe(true);
    expect(moodDrivesTone.every((c) => c.pRho === 0.05)).toBe(true); // best possible with 19 surrogates
    expect(result.embedding.map((e) => `${e.person}:${e.variable}`)).toEqual(['P1:tone', 'P1:mood', 'P2:tone', 'P2:mood']);
  });

  it('gives identical results for the same seed, and runs a pair the same whether or not other pairs are run', () => {
    const persons = syntheticPersons(2, 200);
    const a = analyseDynamics(persons, { seed: 'study-7', ccm });
    const b = analyseDynamics(persons, { seed: 'study-7', ccm });
    expect(JSON.stringify(b)).toBe(JSON.stringify(a));
    const c = analyseDynamics(persons, { seed: 'study-7', ccm, pairs: [['tone', 'mood']] });
    const pick = (rows: typeof a.ccm) => rows.filter((r) => r.cause === 'mood' && r.person === 'P1')[0];
    expect(JSON.stringify(pick(c.ccm))).toBe(JSON.stringify(pick(a.ccm)));
  });

  it('reports "not enough data" instead of numbers for a person with a short series, and stacks persons when asked', () => {
    const persons = [...syntheticPersons(2, 200), ...syntheticPersons(1, 30, 9).map((p) => ({ ...p, person: 'short' }))];
    const result = analyseDynamics(persons, { seed: 3, ccm, stack: true });
    const short = result.ccm.filter((c) => c.person === 'short');
    expect(short).toHaveLength(2);
    expect(short.every((c) => c.status === 'not_enough_data' && c.rhoAtMax === undefined && /fewer than the 50 needed/.test(c.reason ?? ''))).toBe(true);
    expect(result.summaries.find((s) => s.person === 'short')?.ready).toBe(false);
    const stacked = result.ccm.filter((c) => c.scope === 'stacked');
    expect(stacked).toHaveLength(2);
    expect(stacked[0]!.points).toBeGreaterThan(result.ccm.find((c) => c.person === 'P1' && c.cause === stacked[0]!.cause)!.points);
  });

  it('skips stacked cross mapping with a reason and a note when the stack has more bins than it handles in reasonable time', () => {
    const persons = syntheticPersons(2, 120);
    const result = analyseDynamics(persons, { seed: 3, ccm, stack: true, maxStackedBins: 200 });
    const stacked = result.ccm.filter((c) => c.scope === 'stacked');
    expect(stacked.map((c) => `${c.cause}->${c.effect}`)).toEqual(['mood->tone', 'tone->mood']);
    expect(stacked.every((c) => c.status === 'not_enough_data' && /^the stacked series has 2\d\d observed bins, more than the 200/.test(c.reason ?? ''))).toBe(true);
    expect(result.notes.some((n) => n.startsWith('Stacked cross mapping was skipped'))).toBe(true);
    expect(result.ccm.filter((c) => c.scope === 'person').every((c) => c.status === 'ok')).toBe(true);
  });

  it('notes a series with no positive forecast skill at any E, and not a chaotic one (common practice: a positive simplex skill before cross mapping)', () => {
    // Invented: uniform noise (seed 20; its best simplex skill over E = 1…8 is −0.026, at E = 1, with the default exclusion radius max(E·τ, decorrelation time))
    // beside the logistic map x ← 3.7x(1 − x), whose one-bin-ahead skill is high (Sugihara & May 1990).
    const source = random(20);
    const noise = Array.from({ length: 120 }, () => source());
    let x = 0.2;
    const chaos = Array.from({ length: 120 }, () => (x = 3.7 * x * (1 - x)));
    const person = { person: 'P1', t: noise.map((_, t) => t), values: { noise, chaos }, lagValid: noise.map((_, t) => t > 0) };
    const result = analyseDynamics([person], { seed: 1, ccm });
    const byVariable = new Map(result.embedding.map((e) => [e.variable, e]));
    expect(byVariable.get('noise')?.note).toMatch(/^no embedding dimension gives this series a positive forecast skill one bin ahead \(best ρ = -0\.026 at E = 1\)/);
    expect(byVariable.get('chaos')?.note).toBeUndefined();
    expect(Math.max(...(byVariable.get('chaos')?.skills ?? []).map((s) => s.rho ?? -1))).toBeGreaterThan(0.9);
    expect(result.notes).toContain('1 of 2 series have no positive forecast skill one bin ahead at any embedding dimension (see the embedding notes): the cross-map rows with such a series as effect say little about causation.');
  });

  it('renders tidy tables with one row per person × variable, coefficient, direction and library size', () => {
    const result = analyseDynamics(syntheticPersons(1, 150), { seed: 1, ccm });
    const tables = dynamicsTables(result);
    expect(tables.map((t) => t.file)).toEqual(['dynamics-persons.csv', 'dynamics-var.csv', 'dynamics-ccm.csv', 'dynamics-ccm-skill.csv']);
    const ccmTable = tables[2]!;
    expect(ccmTable.rows).toHaveLength(2);
    expect(ccmTable.rows[0]![ccmTable.header.indexOf('direction')]).toBe('mood -> tone');
    const varTable = tables[1]!;
    expect(varTable.rows.map((r) => r[varTable.header.indexOf('predictor')])).toContain('mood.lag1');
    for (const table of tables) for (const row of table.rows) expect(row).toHaveLength(table.header.length);
  });
});
