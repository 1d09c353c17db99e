import { describe, expect, it } from 'vitest';
import { buildReportData } from '../../../src/report/data/build-report-data.js';
import { renderReport } from '../../../src/report/html/render-report.js';
import { MAX_SMALL_MULTIPLES } from '../../../src/report/html/series-section.js';
import { alignedCsv, manifestFixture, seriesCsv, termsFixture } from '../report-fixtures.js';

const tool = { name: 'lexichron', version: 'test' };
const series = { persons: 4, days: 14, missing: (p: number, d: number) => (p === 0 && d === 6 ? 'no_text' : p === 2 && d === 2 ? 'too_few_words' : '') };

function fullReport(): string {
  return renderReport(
    buildReportData({
      source: 'out',
      tool,
      seriesCsv: seriesCsv(series),
      manifest: manifestFixture(),
      alignedCsv: alignedCsv(series),
      termsJson: termsFixture(),
      dynamicsFiles: [{ name: 'dynamics-summary.csv', text: 'person,variable,mssd\np01,vader.compound,0.123456789\n' }],
    }),
  );
}

describe('renderReport', () => {
  const html = fullReport();

  it('writes the six sections in order', () => {
    const ids = [...html.matchAll(/<section id="([a-z]+)"/g)].map((m) => m[1]);
    expect(ids).toEqual(['coverage', 'series', 'validation', 'lexicons', 'dynamics', 'provenance']);
  });

  it('is self-contained: no script, no external stylesheet, font or image, and a policy that forbids loading any', () => {
    expect(html).not.toMatch(/<script/i);
    expect(html).not.toMatch(/<link\b/i);
    expect(html).not.toMatch(/(src|href)=["']?(https?:)?\/\//i);
    expect(html).not.toMatch(/url\((?!#)/i);
    expect(html).not.toMatch(/@import/i);
    expect(html).toContain(`content="default-src 'none'; style-src 'unsafe-inline'; img-src data:"`);
  });

  it('draws every chart with marks', () => {
    const charts = html.match(/<svg class="chart"[\s\S]*?<\/svg>/g) ?? [];
    // heatmap, large series view, 4 small multiples, 2 scatters, 2 term charts, lag pairs
    expect(charts.length).toBe(11);
    for (const chart of charts) expect(chart).toMatch(/class="mark/);
  });

  it('marks the clock-change day and missing bins', () => {
    expect(html).toContain('23 h day');
    expect(html).toContain('class="mark gap"');
  });

  it('prints the cautions in our own words', () => {
    for (const phrase of ['not clinical assessments', 'mental health', 'sarcasm', 'dialect', 'ethics approval', 'consent', 'data-protection law', 'ethics committee']) expect(html).toContain(phrase);
  });

  it('shows the within- and between-person correlations with the pooled r', () => {
    expect(html).toContain('Within persons: vader.compound against mood');
    expect(html).toContain('Between persons: each person&#39;s mean vader.compound against mean mood');
    expect(html).toMatch(/Pooled over all 54 pairs/);
  });

  it('is the same string for the same data (byte-stable output)', () => {
    expect(fullReport()).toBe(html);
  });

  it('says plainly which sections have no input instead of failing', () => {
    const bare = renderReport(buildReportData({ source: 'out', tool, seriesCsv: seriesCsv(series) }));
    expect(bare).toContain('Validation is not available.');
    expect(bare).toContain('The term audit is not available.');
    expect(bare).toContain('Dynamics results are not available.');
    expect(bare).toContain('The manifest is not available.');
    expect(bare).toContain('The input reconciliation is not available.');
    // Each reason after the heading reads as a sentence of its own.
    expect(bare).not.toMatch(/not available\.<\/strong> [a-z]/);
  });

  it('lists the terms that never matched per category, escaped, with a count of those not shown', () => {
    const many = Array.from({ length: 15 }, (_, k) => `w${k}`);
    const hits = 'category,term,hits\n' + ['worry,worr*,8', 'worry,<b>bold</b>,0', ...many.map((w) => `calm,${w},0`)].join('\n') + '\n';
    const page = renderReport(buildReportData({ source: 'out', tool, termsJson: termsFixture(), termHitsFiles: [{ lexicon: 'daily-constructs', text: hits }] }));
    const list = page.slice(page.indexOf('<ul class="never-matched">'));
    expect(list).toContain('<b>daily-constructs · worry</b>: 1 of 2 terms never matched: <code>&lt;b&gt;bold&lt;/b&gt;</code>');
    expect(list).toContain('<b>daily-constructs · fatigue</b>: 1 of 4 terms never matched: <code>drained</code>');
    expect(list).toContain('<b>daily-constructs · calm</b>: none of its 15 terms matched: <code>w0</code>');
    expect(list).toContain('<code>w11</code> and 3 more</li>');
    expect(page).not.toContain('data-chart="terms-daily-constructs-calm"');
  });

  it('escapes person ids and terms taken from the data', () => {
    const csv = seriesCsv({ persons: 1, days: 3 }).replace(/p01/g, '<img src=x onerror=alert(1)>');
    const page = renderReport(buildReportData({ source: 'out', tool, seriesCsv: csv }));
    expect(page).not.toContain('<img');
    expect(page).toContain('&lt;img src=x onerror=alert(1)&gt;');
  });

  it(`keeps a 500-person study light: at most ${MAX_SMALL_MULTIPLES} small multiples and a note saying how many are left out`, () => {
    const big = renderReport(buildReportData({ source: 'out', tool, seriesCsv: seriesCsv({ persons: 500, days: 42, missing: (p, d) => ((p + d) % 9 === 0 ? 'no_text' : '') }) }));
    expect((big.match(/data-chart="series-small-/g) ?? []).length).toBe(MAX_SMALL_MULTIPLES);
    expect(big).toContain(`Showing the first ${MAX_SMALL_MULTIPLES} of 500 persons`);
    expect(big.length).toBeLessThan(4_000_000);
  });
});
