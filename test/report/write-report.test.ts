import { mkdtempSync, mkdirSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll, describe, expect, it } from 'vitest';
import { main } from '../../src/cli/main.js';
import { locateReportFiles, readReportData } from '../../src/io/read-report-data.js';
import { writeReport } from '../../src/io/write-report.js';
import { alignedCsv, manifestFixture, seriesCsv } from './report-fixtures.js';

const dir = mkdtempSync(join(tmpdir(), 'lexichron-report-'));
afterAll(() => rmSync(dir, { recursive: true, force: true }));
const series = { persons: 3, days: 10 };
writeFileSync(join(dir, 'series-long.csv'), seriesCsv(series));
writeFileSync(join(dir, 'manifest.json'), JSON.stringify(manifestFixture()));
mkdirSync(join(dir, 'validation'));
writeFileSync(join(dir, 'validation', 'validation-pairs.csv'), alignedCsv(series));
writeFileSync(join(dir, 'validation', 'validation.json'), '{ not json');

describe('locateReportFiles', () => {
  it('finds each stage\'s files by name, preferring top-level ones', () => {
    const found = locateReportFiles(['manifest.json', 'series-long.csv', 'sub/series-long.csv', 'scores.csv.meta.json', 'validation/validation.json', 'validation/validation-pairs.csv', 'validation/datapackage.json', 'dynamics/dynamics-summary.csv', 'terms/term-audit.json', 'terms/dc/term-hits.csv', 'term-hits.csv']);
    expect(found).toEqual({
      series: 'series-long.csv',
      manifest: 'manifest.json',
      scoresMeta: 'scores.csv.meta.json',
      validationJson: 'validation/validation.json',
      alignedCsv: 'validation/validation-pairs.csv',
      topTermsCsv: undefined,
      termsJson: 'terms/term-audit.json',
      termHits: ['terms/dc/term-hits.csv'],
      dynamics: ['dynamics/dynamics-summary.csv'],
    });
  });
});

describe('readReportData and writeReport', () => {
  it('reads what exists and reports an unreadable validation.json as the reason, not an error', async () => {
    const data = await readReportData(dir);
    expect(data.source).toBe(dir.split('/').pop());
    expect(data.series.ok).toBe(true);
    // the pairs file is still used for the statistics
    expect(data.validation.ok && data.validation.value.pairs[0]?.rating).toBe('mood');
  });

  it('writes report.html atomically into the folder and lists the absent sections', async () => {
    const result = await writeReport(dir);
    expect(result.path).toBe(join(dir, 'report.html'));
    expect(readFileSync(result.path, 'utf8')).toMatch(/^<!DOCTYPE html>/);
    expect(result.absent.map((a) => a.section)).toEqual(['lexicons', 'dynamics']);
  });

  it('fails with a usage error naming the folder when it does not exist', async () => {
    await expect(readReportData(join(dir, 'nope'))).rejects.toThrow(/Cannot read `.*nope`: no such folder/);
  });

  it('runs as `lexichron report OUTDIR --person p02 --out FILE`', async () => {
    const out = join(dir, 'custom.html');
    const code = await main(['node', 'lexichron', 'report', dir, '--person', 'p02', '--out', out]);
    expect(code).toBe(0);
    expect(readFileSync(out, 'utf8')).toContain('Person p02: vader.compound');
  });

  it('exits with code 2 on a bad --min-lag-pairs', async () => {
    const code = await main(['node', 'lexichron', 'report', dir, '--min-lag-pairs', 'lots']);
    expect(code).toBe(2);
  });
});
