import { describe, expect, it } from 'vitest';
import { simplexForecast } from '../../src/dynamics/simplex-forecast.js';
import { chooseEmbeddingDimension } from '../../src/dynamics/choose-embedding-dimension.js';
import { allValid, readReferenceCsv } from './reference-data.js';

describe('simplexForecast', () => {
  // Missing reference data fails this file (readReferenceCsv throws, naming the path); skipped only with LEXICHRON_SKIP_SHARED_REFERENCE=1.
  const referenceMissing = !readReferenceCsv('block_3sp.csv') || !readReferenceCsv('simplex_E3_block_3sp_expected.csv');
  it.skipIf(referenceMissing)('matches pyEDM 2.5.7 Simplex on the rEDM three-species block (block_3sp.csv, E = 3, Tp = 1, library rows 1–100, prediction rows 101–195) to 1e-5', () => {
    const block = readReferenceCsv('block_3sp.csv')!;
    const expected = readReferenceCsv('simplex_E3_block_3sp_expected.csv')!;
    const values = block.map((row) => Number(row['x_t']));
    const forecast = simplexForecast({ values, lagValid: allValid(values.length) }, { E: 3, Tp: 1, library: { from: 0, to: 99 }, prediction: { from: 100, to: 194 } });
    const timeOf = (bin: number): number => Number(block[bin]?.['time']);
    const byTime = new Map(forecast.rows.map((row) => [timeOf(row.bin), row]));
    let compared = 0;
    for (const row of expected) {
      if (row['Predictions'] === '') continue;
      const mine = byTime.get(Number(row['Time']));
      expect(mine, `prediction for time ${row['Time']}`).toBeDefined();
      expect(mine!.predicted).toBeCloseTo(Number(row['Predictions']), 5);
      expect(mine!.observed).toBeCloseTo(Number(row['Observations']), 5);
      compared++;
    }
    expect(compared).toBe(95);
    expect(forecast.rows).toHaveLength(95);
  });

  it('forecasts the tent map (Sugihara & May 1990) with high skill at low E, and skill falls as the horizon grows', () => {
    // Tent map x_{t+1} = μ·min(x_t, 1 − x_t) with μ = 1.99 (μ = 2 collapses to 0 in floating point).
    const values: number[] = [0.3141];
    for (let t = 1; t < 200; t++) values.push(1.99 * Math.min(values[t - 1]!, 1 - values[t - 1]!));
    const series = { values, lagValid: allValid(values.length) };
    const choice = chooseEmbeddingDimension(series, { maxE: 6 });
    expect(choice.ok).toBe(true);
    if (!choice.ok) return;
    expect(choice.E).toBeLessThanOrEqual(2);
    expect(choice.rho).toBeGreaterThan(0.99);
    const rhos = [1, 2, 3, 5, 8].map((Tp) => {
      const skill = simplexForecast(series, { E: choice.E, Tp }).skill;
      return skill.ok ? skill.rho : Number.NaN;
    });
    for (let h = 1; h < rhos.length; h++) expect(rhos[h]!).toBeLessThan(rhos[h - 1]!);
    expect(rhos[4]!).toBeLessThan(0.5);
  });
});
