import { describe, expect, it, vi } from 'vitest';
import { main } from '../../src/cli/main.js';
import { buildZoneTable } from '../../src/ingest/zone-table.js';
import { readRatings } from '../../src/io/run-validate.js';
import { parseStudy } from '../../src/study/parse-study.js';
import { DEFAULT_MISSING_CODES } from '../../src/validate/rating-values.js';
import { tempFolder } from '../support/temp-files.js';

// Missing ratings as exports write them: empty cells (pandas' to_csv default) and `NA` (R's
// write.csv default; common practice, from memory of both libraries' documentation).
const tmp = tempFolder();
const zones = buildZoneTable([], '', 'UTC');
const file = tmp.write('ratings.csv', 'person,time,mood,calm\np1,2026-03-01T10:00:00Z,NA,-99\np1,2026-03-01T11:00:00Z,50,\np1,2026-03-01T12:00:00Z,,4\np1,2026-03-01T13:00:00Z,NA,NA\n');

describe('missing-value codes of self-reports', () => {
  it('reads empty cells and NA as missing by default, and counts them per rating column', async () => {
    expect(DEFAULT_MISSING_CODES).toEqual(['NA']);
    const read = await readRatings({ ratings: file, zones, scales: 'mood=0:100,calm=1:7' });
    // Only -99 is left: not a declared code by default, and outside calm's scale 1–7.
    expect(read.diagnostics.map((d) => [d.source?.line, d.code])).toEqual([[2, 'rating_out_of_scale']]);
    expect(read.missing).toEqual({ mood: 3, calm: 2 });
  });

  it('replaces the default with the declared codes, and none leaves only empty cells missing', async () => {
    const declared = await readRatings({ ratings: file, zones, scales: 'mood=0:100,calm=1:7', missing: ['-99'] });
    expect(declared.diagnostics.map((d) => [d.source?.line, d.code])).toEqual([[2, 'rating_not_numeric'], [5, 'rating_not_numeric'], [5, 'rating_not_numeric']]);
    expect(declared.missing).toEqual({ mood: 1, calm: 2 });
    const none = await readRatings({ ratings: file, zones, scales: 'mood=0:100,calm=1:7', missing: [] });
    expect(none.missing).toEqual({ mood: 1, calm: 1 });
  });

  it('validate prints the missing values per column and takes --missing none', async () => {
    const series = tmp.write('series.csv', 'person,t,bin_start,bin_end,local_date,day,bin_of_day,bin_hours,hours_since_prev,entries,words,missing,lag_valid,s\np1,0,2026-03-01T00:00:00+00:00,2026-03-02T00:00:00+00:00,2026-03-01,1,1,24,,1,10,,0,0.5\n');
    const spy = vi.spyOn(process.stderr, 'write').mockImplementation(() => true);
    let code: number;
    let stderr: string;
    try {
      code = await main(['node', 'lexichron', 'validate', series, '--ratings', file, '--scale', 'mood=0:100,calm=1:7', '--time-zone', 'UTC', '--replicates', '0', '--out', tmp.path('v1')]);
      stderr = spy.mock.calls.map((c) => String(c[0])).join('');
      spy.mockClear();
      expect(code).toBe(0);
      expect(stderr).toMatch(/missing ratings \(empty or a missing-value code: NA\): mood 3, calm 2/);
      // Lines 2 (NA, and −99 out of scale) and 5 (NA, NA) hold no rating at all: not paired, and said so.
      expect(stderr).toMatch(/rating_unanswered 2/);
      code = await main(['node', 'lexichron', 'validate', series, '--ratings', file, '--scale', 'mood=0:100,calm=1:7', '--time-zone', 'UTC', '--replicates', '0', '--missing', 'none', '--out', tmp.path('v2')]);
      stderr = spy.mock.calls.map((c) => String(c[0])).join('');
    } finally {
      spy.mockRestore();
    }
    expect(code).toBe(0);
    expect(stderr).toMatch(/missing ratings \(empty cells only\): mood 1, calm 1/);
  });

  it('a study file declares the codes per ratings source, [] for none, and names a wrong value by its path', () => {
    const base = { inputs: ['texts.csv'], timeZone: 'UTC', out: 'out' };
    expect(parseStudy({ ...base, ratings: { path: 'r.csv', scales: { mood: [0, 100] }, missing: [] } }).study?.ratings?.missing).toEqual([]);
    expect(parseStudy({ ...base, ratings: { path: 'r.csv', scales: { mood: [0, 100] }, missing: ['-99', 'NA'] } }).study?.ratings?.missing).toEqual(['-99', 'NA']);
    expect(parseStudy({ ...base, ratings: { path: 'r.csv', scales: { mood: [0, 100] }, missing: [99] } }).problems.map((p) => p.path)).toEqual(['$.ratings.missing']);
  });
});
