import { describe, expect, it } from 'vitest';
import { ratingsReconciliationTable } from '../../../src/report/html/ratings-reconciliation-table.js';
import type { RatingsReconciliation } from '../../../src/report/report-data.js';

const base: RatingsReconciliation = { read: 1204, kept: 1200, rowsLeftOut: { bad_time: 3, no_zone: 1 }, valuesLeftOut: { rating_out_of_scale: 2 }, notPaired: { rating_person_not_in_series: 5 }, other: {}, occasions: 900, occasionsWithText: 850, persons: 12, more: [] };

/** The table's rows as [label, count]. */
function rows(html: string): string[][] {
  return [...html.matchAll(/<tr[^>]*>(.*?)<\/tr>/g)].map((m) => [...(m[1] as string).matchAll(/<t[hd][^>]*>(.*?)<\/t[hd]>/g)].map((c) => (c[1] as string).replace(/<[^>]+>/g, '')));
}

describe('ratingsReconciliationTable', () => {
  it('labels every count in words, with reasons under their totals, and no code or JSON key in sight', () => {
    const html = ratingsReconciliationTable(base);
    const r = rows(html);
    expect(r).toContainEqual(['Rows read', '1,204']);
    expect(r).toContainEqual(['Rows kept (usable person and time)', '1,200']);
    expect(r).toContainEqual(['Rows left out', '4']);
    expect(r).toContainEqual(['time not readable', '3']);
    expect(r).toContainEqual(['no time zone known for the person', '1']);
    expect(r).toContainEqual(['outside the declared scale', '2']);
    expect(r).toContainEqual(['Self-reports with no text to pair with', '5']);
    expect(r).toContainEqual(['of which with text', '850']);
    expect(html).not.toMatch(/bad_time|rating_out_of_scale|rowsWithText|[{]/);
    expect(html).not.toContain('do not add up');
  });

  it('shows a count it has no label for under its own name in words, by code', () => {
    const r = rows(ratingsReconciliationTable({ ...base, more: [{ name: 'missingCodes', value: { NA: 7 } }, { name: 'prompts_sent', value: 1300 }] }));
    expect(r).toContainEqual(['Missing codes', '7']);
    expect(r).toContainEqual(['NA', '7']);
    expect(r).toContainEqual(['Prompts sent', '1,300']);
  });

  it('shows unanswered prompts on a row of their own under the pairing, and missing ratings by column in words', () => {
    const r = rows(ratingsReconciliationTable({ ...base, unanswered: 31, more: [{ name: 'missing', value: { mood: 31, calm: 40 } }] }));
    expect(r).toContainEqual(['Prompts with no rating at all (kept for the study window, not paired)', '31']);
    expect(r).toContainEqual(['Ratings missing (an empty cell or a missing-value code), by column', '71']);
    expect(r).toContainEqual(['calm', '40']);
    expect(r.findIndex((x) => x[0]?.startsWith('Prompts with no rating'))).toBeGreaterThan(r.findIndex((x) => x[0] === 'Pairing with the text'));
    expect(r.some((x) => x[0] === 'Other problems of the validate stage')).toBe(false);
  });

  it('says so when rows read less rows kept differ from the rows left out by reason', () => {
    expect(ratingsReconciliationTable({ ...base, kept: 1190 })).toContain('The counts do not add up: rows read − rows kept = 14, but the rows left out by reason number 4');
  });
});
