import { describe, expect, it } from 'vitest';
import type { BootstrapInterval } from '../../src/stats/cluster-bootstrap.js';
import type { Correlation } from '../../src/stats/pearson-correlation.js';
import type { RepeatedMeasuresCorrelation } from '../../src/stats/repeated-measures-correlation.js';
import type { StatResult } from '../../src/stats/stat-result.js';
import { pairVerdict } from '../../src/validate/pair-verdict.js';

const notEstimable = { ok: false as const, code: 'not_requested', reason: 'not requested' };
const within = (r: number, ciLow: number, ciHigh: number): StatResult<RepeatedMeasuresCorrelation> => ({ ok: true, r, df: 400, n: 440, persons: 40, personsTooFew: 0, p: 0.01, ciLow, ciHigh, level: 0.95, slope: r });
const between = (r: number, ciLow: number, ciHigh: number): StatResult<Correlation> => ({ ok: true, r, n: 40, df: 38, p: 0.2, ciLow, ciHigh, level: 0.95 });
const boot = (ciLow: number, ciHigh: number): StatResult<BootstrapInterval> => ({ ok: true, ciLow, ciHigh, se: 0.1, replicates: 2000, succeeded: 2000, level: 0.95 });
const base = { pairs: 440, persons: 40, pooled: { ok: true as const, r: 0.3, n: 440 }, iccScore: notEstimable, iccRating: notEstimable };

describe('pairVerdict: the sentence cites the interval that decides it', () => {
  it('quotes the cluster-bootstrap interval, not the analytic one, when the bootstrap decides "no clear association"', () => {
    // The defect reproduced: analytic CI [0.20, 0.96] excludes 0, the bootstrap CI does not.
    const v = pairVerdict({ ...base, within: within(0.7, 0.2, 0.96), between: between(0.1, -0.2, 0.4), bootstrapWithin: boot(-0.1, 0.9), bootstrapBetween: boot(-0.25, 0.45) });
    expect(v.within).toBe('none');
    const sentence = v.text.split('. ').find((s) => s.startsWith('Within persons')) as string;
    expect(sentence).toMatch(/no clear association/);
    expect(sentence).toMatch(/cluster-bootstrap 95% CI \[-0\.10, 0\.90\]/);
    expect(sentence).not.toMatch(/95% CI \[0\.20, 0\.96\]\s*[,)]/);
    // The analytic interval is mentioned only as the one that was not used, and named so.
    expect(v.text).toMatch(/analytic interval \[0\.20, 0\.96\] excludes zero, but it assumes one common within-person slope/);
  });
  it('uses the analytic interval, and says so, when there is no bootstrap', () => {
    const v = pairVerdict({ ...base, within: within(0.4, 0.3, 0.5), between: between(0.5, 0.2, 0.7), bootstrapWithin: notEstimable, bootstrapBetween: notEstimable });
    expect(v.within).toBe('moderate');
    expect(v.text).toMatch(/r_rm = 0\.40, analytic 95% CI \[0\.30, 0\.50\]/);
    expect(v.text).toMatch(/r = 0\.50, analytic 95% CI \[0\.20, 0\.70\]/);
  });
  it('calls a level clear from the bootstrap interval alone when the bootstrap is there', () => {
    const v = pairVerdict({ ...base, within: within(0.3, -0.05, 0.6), between: between(0.5, 0.2, 0.7), bootstrapWithin: boot(0.05, 0.55), bootstrapBetween: boot(0.1, 0.8) });
    expect(v.within).toBe('moderate');
    expect(v.text).toMatch(/cluster-bootstrap 95% CI \[0\.05, 0\.55\]/);
  });
});

describe('pairVerdict: levels disagree only when both intervals exclude zero', () => {
  it('does not warn that the levels disagree in sign when the between-person interval includes zero', () => {
    // Before: one clear level was enough for `levels_disagree_sign`.
    const v = pairVerdict({ ...base, within: within(0.4, 0.3, 0.5), between: between(-0.3, -0.6, 0.05), bootstrapWithin: boot(0.3, 0.5), bootstrapBetween: boot(-0.65, 0.1) });
    expect(v.warnings.map((w) => w.code)).not.toContain('levels_disagree_sign');
    expect(v.warnings.map((w) => w.code)).not.toContain('levels_disagree_size');
  });
  it('warns when both deciding intervals exclude zero with opposite signs', () => {
    const v = pairVerdict({ ...base, within: within(0.4, 0.3, 0.5), between: between(-0.5, -0.7, -0.2), bootstrapWithin: boot(0.3, 0.5), bootstrapBetween: boot(-0.75, -0.15) });
    expect(v.warnings.map((w) => w.code)).toContain('levels_disagree_sign');
  });
  it('does not warn about a size gap when one level is not clear', () => {
    const v = pairVerdict({ ...base, within: within(0.1, 0.02, 0.18), between: between(0.5, -0.1, 0.8), bootstrapWithin: boot(0.01, 0.2), bootstrapBetween: boot(-0.05, 0.85) });
    expect(v.warnings.map((w) => w.code)).not.toContain('levels_disagree_size');
  });
});
