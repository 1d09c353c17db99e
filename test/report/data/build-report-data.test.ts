import { describe, expect, it } from 'vitest';
import { buildReportData } from '../../../src/report/data/build-report-data.js';
import { alignedCsv, manifestFixture, seriesCsv, termsFixture } from '../report-fixtures.js';

const tool = { name: 'lexichron', version: 'test' };
const fixture = { persons: 3, days: 12, missing: (p: number, d: number) => (p === 0 && (d === 3 || d === 4) ? 'no_text' : p === 1 && d === 5 ? 'too_few_words' : '') };

describe('buildReportData', () => {
  it('marks every section absent with a reason when the folder holds nothing', () => {
    const data = buildReportData({ source: 'out', tool });
    for (const part of [data.coverage, data.reconciliation, data.series, data.validation, data.lexicons, data.readiness, data.dynamics, data.provenance]) {
      expect(part.ok).toBe(false);
      if (!part.ok) expect(part.reason.length).toBeGreaterThan(10);
    }
  });

  it('builds coverage, tracks and readiness from series-long.csv alone', () => {
    const data = buildReportData({ source: 'out', tool, seriesCsv: seriesCsv(fixture) });
    expect(data.coverage.ok && data.coverage.value.persons.length).toBe(3);
    expect(data.coverage.ok && data.coverage.value.missingBins).toEqual({ no_text: 2, too_few_words: 1 });
    expect(data.series.ok && data.series.value.score).toBe('vader.compound');
    expect(data.series.ok && data.series.value.selected).toBe('p01');
    expect(data.readiness.ok && data.readiness.value.persons[0]).toMatchObject({ person: 'p01', bins: 12, longestGapBins: 2, longestGapHours: 48 });
    expect(data.validation.ok).toBe(false);
  });

  it('finds the 23-hour study day of the EU spring clock change (IANA tz: last Sunday of March 2026 is 29 March)', () => {
    const data = buildReportData({ source: 'out', tool, seriesCsv: seriesCsv(fixture) });
    if (!data.series.ok) throw new Error('no series');
    // with a 04:00 day start, the local day 2026-03-28 04:00 → 2026-03-29 04:00 holds the 02:00 → 03:00 jump
    expect(data.series.value.persons[0]?.clockChanges.map((c) => [c.date, c.hours])).toEqual([['2026-03-28', 23]]);
    const cell = data.coverage.ok ? data.coverage.value.persons[0]?.cells.find((c) => c.date === '2026-03-28') : undefined;
    expect(cell?.hours).toBe(23);
  });

  it('takes the reconciliation and title from the manifest', () => {
    const data = buildReportData({ source: 'out', tool, manifest: manifestFixture() });
    expect(data.title).toBe('Fixture study: study report');
    expect(data.reconciliation.ok && data.reconciliation.value.read).toBe(120);
    expect(data.provenance.ok).toBe(true);
  });

  it('computes the validation from aligned pairs when no statistics file exists, and draws the rating per bin', () => {
    const data = buildReportData({ source: 'out', tool, seriesCsv: seriesCsv(fixture), alignedCsv: alignedCsv(fixture) });
    if (!data.validation.ok || !data.series.ok) throw new Error('missing parts');
    const pair = data.validation.value.pairs[0];
    expect(pair).toMatchObject({ score: 'vader.compound', rating: 'mood', pairs: 33, persons: 3 });
    // y = 50 + 20·x − person: exact within persons, so the repeated-measures r is 1
    expect('r' in pair!.within && pair!.within.r).toBeCloseTo(1, 12);
    expect(data.series.value.rating).toBe('mood');
    const p01 = data.series.value.persons[0]!;
    expect(p01.points[0]!.rating).toBeCloseTo(50 + 20 * (Math.sin(0) / 2), 9);
    expect(p01.points[3]!.rating).toBe(50);
  });

  it('reads statistics from validation.json in the shape the validate stage writes', () => {
    const json = {
      pairs: [
        {
          score: 'vader.compound',
          rating: 'mood',
          pairs: 30,
          persons: 3,
          pooled: { ok: true, r: 0.3, n: 30, ciLow: 0.1, ciHigh: 0.5 },
          between: { ok: true, r: -0.4, n: 3 },
          within: { ok: false, code: 'too_few', reason: 'too few pairs' },
          verdict: { text: 'No clear association.', warnings: [{ code: 'few_persons', message: 'Only 3 persons.' }] },
        },
      ],
      reliability: [{ column: 'vader.compound', target: 0.7, minWords: 120, text: 'projected', bands: [{ low: 0, medianWords: 20, reliability: 0.3, bins: 40 }, { low: 25, bins: 0, note: 'fewer than 20 bins' }] }],
    };
    const data = buildReportData({ source: 'out', tool, validationJson: json });
    if (!data.validation.ok) throw new Error('no validation');
    const pair = data.validation.value.pairs[0]!;
    expect(pair.within).toEqual({ missing: 'too few pairs' });
    expect(pair.pooled).toEqual({ r: 0.3, n: 30, ciLow: 0.1, ciHigh: 0.5 });
    expect(pair.warnings).toEqual(['Only 3 persons.']);
    expect(data.validation.value.reliability).toEqual([{ score: 'vader.compound', points: [{ words: 20, reliability: 0.3, bins: 40 }], target: 0.7, recommendedMinWords: 120, note: 'projected' }]);
  });

  it('keeps terms with hits, their shares and flags, and explains the flags', () => {
    const data = buildReportData({ source: 'out', tool, termsJson: termsFixture() });
    if (!data.lexicons.ok) throw new Error('no terms');
    const fatigue = data.lexicons.value.categories.find((c) => c.category === 'fatigue')!;
    expect(fatigue.totalHits).toBe(50);
    expect(fatigue.terms.map((t) => t.term)).toEqual(['tired', 'exhausted', 'sleepy']);
    expect(fatigue).toMatchObject({ neverMatched: ['drained'], termCount: 4 });
    expect(Object.keys(data.lexicons.value.flagMeanings)).toEqual(['few_persons', 'over_share']);
  });

  it('says which columns are missing when series-long.csv was not written by the series stage', () => {
    const data = buildReportData({ source: 'out', tool, seriesCsv: 'person,t,words\np1,0,3\n' });
    expect(data.series).toEqual({ ok: false, reason: expect.stringContaining('`bin_start`, `local_date`, `bin_hours`, `missing`') });
  });

  it('stops with a usage error listing the score columns when the chosen score is not a column', () => {
    expect(() => buildReportData({ source: 'out', tool, seriesCsv: seriesCsv(fixture) }, { score: 'nope.score' })).toThrow('`vader.compound`, `afinn-165.valence`');
  });
});

describe('buildReportData with top-terms.csv (docs/architecture.md "Term audit" contract)', () => {
  it('reads the top terms per category with shares and ;-separated flags, and recovers the category total from the top share', () => {
    const csv = 'lexicon,lexicon_sha256,category,rank,term,hits,share,entries,persons,flags\n' + 'dc,abc,worry,1,worr*,30,0.6,20,5,over_share\n' + 'dc,abc,worry,2,nervous,10,0.2,8,2,few_persons;over_share\n' + 'dc,abc,fatigue,1,tired,4,1,4,3,\n';
    const data = buildReportData({ source: 'out', tool, topTermsCsv: csv });
    if (!data.lexicons.ok) throw new Error('no terms');
    expect(data.lexicons.value.categories.map((c) => [c.category, c.totalHits, c.terms.length])).toEqual([
      ['worry', 50, 2],
      ['fatigue', 4, 1],
    ]);
    expect(data.lexicons.value.categories[0]!.terms[1]).toEqual({ term: 'nervous', hits: 10, share: 0.2, flags: ['few_persons', 'over_share'] });
  });

  it('adds the never-matched terms from each lexicon\'s term-hits.csv, and a category none of whose terms matched', () => {
    const top = 'lexicon,lexicon_sha256,category,rank,term,hits,share,entries,persons,flags\n' + 'dc,abc,worry,1,worr*,30,0.75,20,5,over_share\n' + 'dc,abc,worry,2,nervous,10,0.25,8,2,\n';
    const hits =
      'category,term,wildcard,hits,share,rank,entries,persons,top_person_share,negated,flags\n' +
      'worry,worr*,1,30,0.75,1,20,5,0.4,0,over_share\n' +
      'worry,nervous,0,10,0.25,2,8,2,0.5,0,\n' +
      'worry,on edge,0,0,0,3,0,0,,0,no_hits\n' +
      'fatigue,drained,0,0,0,1,0,0,,0,no_hits\n' +
      'fatigue,tired,0,0,0,2,0,0,,0,no_hits\n';
    const data = buildReportData({ source: 'out', tool, topTermsCsv: top, termHitsFiles: [{ lexicon: 'dc', text: hits }] });
    if (!data.lexicons.ok) throw new Error('no terms');
    expect(data.lexicons.value.categories.map((c) => [c.category, c.terms.length, c.termCount, c.neverMatched])).toEqual([
      ['worry', 2, 3, ['on edge']],
      ['fatigue', 0, 2, ['drained', 'tired']],
    ]);
  });
});
