import { describe, expect, it } from 'vitest';
import { buildReportData } from '../../../src/report/data/build-report-data.js';
import { coverageHeatmap } from '../../../src/report/html/coverage-heatmap.js';
import { lagPairsChart } from '../../../src/report/html/lag-pairs-chart.js';
import { provenanceSection } from '../../../src/report/html/provenance-section.js';
import { seriesChart } from '../../../src/report/html/series-chart.js';
import { seriesSparkline } from '../../../src/report/html/series-sparkline.js';
import type { PersonReadiness, TrackPoint } from '../../../src/report/report-data.js';
import { manifestFixture, seriesCsv } from '../report-fixtures.js';

const tool = { name: 'lexichron', version: 'test' };
const H = 3_600_000;

describe('the report shows every observation (issue 21 item 5)', () => {
  it('an observed bin between two missing ones is drawn as a point, also in a long series (1,000 bins, every other one observed)', () => {
    const points: TrackPoint[] = Array.from({ length: 1000 }, (_, t) => ({ t, start: Date.UTC(2026, 0, 1) + t * H, hours: 1, date: '2026-01-01', score: t % 2 ? undefined : t / 1000, rating: undefined, missing: t % 2 ? 'no_text' : '' }));
    const svg = seriesChart({ person: 'p01', points, clockChanges: [] }, { score: 'vader.compound', binHours: 1 });
    expect(svg.match(/<circle /g) ?? []).toHaveLength(500);
    // The small multiples too: only the isolated bins get a dot there.
    const small = seriesSparkline({ person: 'p01', points: points.slice(0, 10).map((p, i) => (i === 1 ? { ...p, score: 0.5, missing: '' } : p)), clockChanges: [] }, points[0]!.start, points[9]!.start + H, false);
    expect(small.match(/<circle /g) ?? []).toHaveLength(3);
  });

  it('the readiness chart names each person under their bar', () => {
    const persons: PersonReadiness[] = ['ana', 'ben', 'cleo'].map((person, i) => ({ person, bins: 30, observed: 30, percentMissing: 0, longestGapBins: 0, longestGapHours: 0, lagPairs: 20 + 30 * i, autocorrelation: 0.2, mssd: 1, ready: i > 0 }));
    const svg = lagPairsChart({ variable: 'vader.compound', minLagPairs: 50, persons });
    for (const p of ['ana', 'ben', 'cleo']) expect(svg).toMatch(new RegExp(`<text[^>]*>${p}</text>`));
  });

  it('the coverage legend lists only the missing reasons that occur', () => {
    const data = buildReportData({ source: 'out', tool, seriesCsv: seriesCsv({ persons: 2, days: 5, missing: (p, d) => (p === 0 && d === 2 ? 'no_text' : '') }) });
    if (!data.coverage.ok) throw new Error('no coverage');
    const svg = coverageHeatmap(data.coverage.value);
    expect(svg).toContain('no text');
    for (const absent of ['too few words', 'excluded hours', 'outside window', 'after last entry']) expect(svg).not.toContain(absent);
  });

  it('an unknown score or person is an error listing the choices, not a report with sections missing', () => {
    const seriesCsvText = seriesCsv({ persons: 2, days: 5, missing: () => '' });
    expect(() => buildReportData({ source: 'out', tool, seriesCsv: seriesCsvText }, { score: 'vader.compund' })).toThrow(/vader\.compund.*vader\.compound/s);
    expect(() => buildReportData({ source: 'out', tool, seriesCsv: seriesCsvText }, { person: 'p09' })).toThrow(/p09.*`p01`, `p02`/s);
  });

  it('the provenance section shows no raw JSON and no verdict paragraphs (they are in the validation section)', () => {
    const manifest = { ...manifestFixture(), parameters: { study: { series: { bin: '1d', window: { from: '2026-05-01', to: '2026-05-21' } }, ratings: { scales: { mood: [0, 100] } } } }, stages: { validation: { pairs: [{ score: 'vader.compound', rating: 'mood', verdict: 'Within persons the association is moderate and positive (r_rm = 0.41).' }] } } };
    const html = provenanceSection({ ok: true, value: { manifest } });
    const shown = html.slice(html.indexOf('How this output was made'));
    expect(shown).not.toMatch(/[{[]&quot;|[{[]"/);
    expect(shown).not.toContain('Within persons the association');
    expect(shown).toContain('2026-05-21');
  });
});
