import { describe, expect, it } from 'vitest';
import { cronbachAlpha } from '../../src/stats/cronbach-alpha.js';
import { random } from '../../src/stats/random.js';
import { analysePair, type PairAnalysis } from '../../src/validate/analyse-pair.js';
import { DEFAULT_VALIDATE_OPTIONS } from '../../src/validate/validate-series.js';
import { readReferenceCsv } from './reference-csv.js';

// Expected values from R psych 2.2.9 (statsBy, alpha) and R stats (anova) written by
// test/reference/psych/make-expected.R. The within/between checks go through analysePair, the
// function the validate stage calls for every score × rating pair, with the validate stage's
// default options (DEFAULT_VALIDATE_OPTIONS, seeded per pair as validateSeries seeds it).
const expected = readReferenceCsv('psych/expected-statsby.csv');
const datasets: Record<string, { group: string; rows: Record<string, string>[] }> = {
  'within-between': { group: 'Group', rows: readReferenceCsv('psych/within-between.csv') },
  'sat-act': { group: 'education', rows: readReferenceCsv('psych/sat-act.csv') },
};

const analyses = new Map<string, PairAnalysis>();
/** analysePair of variable x (as the score) against y (as the rating), as validateSeries calls it (memoised). */
function pipelineAnalysis(dataset: string, x: string, y: string): PairAnalysis {
  const key = `${dataset}\u0000${x}\u0000${y}`;
  const known = analyses.get(key);
  if (known) return known;
  const { group, rows } = datasets[dataset]!;
  const o = DEFAULT_VALIDATE_OPTIONS;
  const analysis = analysePair(
    rows.map((d) => ({ person: d[group] as string, x: Number(d[x]), y: Number(d[y]) })),
    { random: random(`${o.seed}\u0000${x}\u0000${y}`), replicates: o.replicates, minPairs: o.minPairs, level: o.level, inference: o.inference },
  );
  analyses.set(key, analysis);
  return analysis;
}

describe('validate-stage within/between statistics (analysePair, default options) against R psych::statsBy 2.2.9 and stats::anova (psych data withinBetween and sat.act)', () => {
  const correlations = expected.filter((e) => e.quantity === 'rwg' || e.quantity === 'r_group_means');
  it.each(correlations.map((e) => [e.dataset as string, e.quantity as string, e.x as string, e.y as string, Number(e.value)] as const))('%s: %s of %s and %s is %f', (dataset, quantity, x, y, value) => {
    const analysis = pipelineAnalysis(dataset, x, y);
    // rwg: statsBy's pooled within-group correlation = the repeated-measures correlation.
    // r_group_means: Pearson r of statsBy's unweighted group means = the between-person correlation.
    const r = quantity === 'rwg' ? analysis.within : analysis.between;
    if (!r.ok) throw new Error(r.reason);
    expect(r.r).toBeCloseTo(value, 8);
    if (quantity === 'r_group_means') expect(r.n).toBe(new Set(datasets[dataset]!.rows.map((d) => d[datasets[dataset]!.group])).size);
  });
  const iccs = expected.filter((e) => e.quantity === 'ICC1_n0' || e.quantity === 'ICC2');
  it.each(iccs.map((e) => [e.dataset as string, e.quantity as string, e.x as string, Number(e.value)] as const))('%s: %s of %s is %f, as the score and as the rating', (dataset, quantity, x, value) => {
    const { group, rows } = datasets[dataset]!;
    const other = Object.keys(rows[0]!).find((k) => k !== group && k !== x) as string;
    for (const icc of [pipelineAnalysis(dataset, x, other).iccScore, pipelineAnalysis(dataset, other, x).iccRating]) {
      if (!icc.ok) throw new Error(icc.reason);
      // ICC1_n0: one-way ANOVA with Snedecor & Cochran's n0 (stats::anova in R); ICC2: statsBy's (MSb − MSw)/MSb.
      expect(quantity === 'ICC1_n0' ? icc.icc1 : icc.icc1k).toBeCloseTo(value, 8);
    }
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
