/**
 * A folder written by `lexichron run --names syntactic` (column names such as `afinn_165_valence`)
 * stays readable by lexichron's own later commands, as the README documents them: `series` on its
 * scores, `validate` and `dynamics` on its long series, `report` on the folder. Each gives the
 * same numbers as on a folder written with the default names (common practice: renaming columns
 * must not change results).
 */
import { readFileSync } from 'node:fs';
import { beforeAll, describe, expect, it } from 'vitest';
import { ownTableFile } from '../../src/io/own-table-file.js';
import { readCsv } from '../support/csv.js';
import { runCli } from '../support/run-cli.js';
import { tempFolder } from '../support/temp-files.js';

const tmp = tempFolder('lexichron-names-downstream-');

beforeAll(async () => {
  const text = ['person,time,text'];
  const ratings = ['person,time,mood'];
  for (let d = 1; d <= 28; d++) {
    const day = String(d).padStart(2, '0');
    for (const p of ['ana', 'ben', 'cleo']) {
      text.push(`${p},2026-06-${day}T09:00:00Z,${(d + p.length) % 3 ? 'a glad calm good day with friends' : 'a sad worried tired day alone and bad'}`);
      ratings.push(`${p},2026-06-${day}T20:00:00Z,${((d + p.length) % 5) + 1}`);
    }
  }
  tmp.write('texts.csv', text.join('\n') + '\n');
  tmp.write('ratings.csv', ratings.join('\n') + '\n');
  const study = { inputs: [{ path: 'texts.csv' }], timeZone: 'UTC', lexicons: ['afinn-165', 'vader'], series: { bin: '1d', minWords: 1 }, ratings: { path: 'ratings.csv', scales: { mood: [1, 5] }, replicates: 0 }, dynamics: false, audit: false };
  tmp.write('plain.json', JSON.stringify({ ...study, out: 'plain' }));
  tmp.write('bare.json', JSON.stringify({ ...study, out: 'bare' }));
  expect((await runCli('run', tmp.path('plain.json'))).code).toBe(0);
  expect((await runCli('run', tmp.path('bare.json'), '--names', 'syntactic'))).toMatchObject({ code: 0 });
  expect(readFileSync(tmp.path('bare/series-long.csv'), 'utf8')).toMatch(/^[^\n]*afinn_165_valence/);
}, 120_000);

describe('later commands on a folder written with --names syntactic', () => {
  it('every CSV of the renamed folder reads back (ownTableFile) with the header of the folder written with default names', async () => {
    const pkg = JSON.parse(readFileSync(tmp.path('bare/datapackage.json'), 'utf8')) as { resources: { path: string }[] };
    const csvs = pkg.resources.map((r) => r.path).filter((p) => p.endsWith('.csv'));
    expect(csvs.length).toBeGreaterThan(5);
    let renamed = 0;
    for (const file of csvs) {
      const plain = readFileSync(tmp.path(`plain/${file}`), 'utf8');
      const bare = readFileSync(tmp.path(`bare/${file}`), 'utf8');
      if (bare !== plain) renamed += 1;
      expect((await (await ownTableFile(tmp.path(`bare/${file}`))).bytes()).toString('utf8'), file).toBe(plain);
    }
    expect(renamed).toBeGreaterThan(3);
  });

  it('validate reads the renamed long series and reports the scores under lexichron\'s names, with the same statistics', async () => {
    const args = (folder: string) => ['validate', tmp.path(`${folder}/series-long.csv`), '--ratings', tmp.path('ratings.csv'), '--scale', 'mood=1:5', '--time-zone', 'UTC', '--replicates', '0', '--events', tmp.path(`${folder}/series-long.events.csv`), '--out', tmp.path(`${folder}-validation`)];
    const plain = await runCli(...args('plain'));
    const bare = await runCli(...args('bare'));
    expect(plain.code).toBe(0);
    expect(bare.stderr).not.toMatch(/Cannot|no column/);
    expect(bare.code).toBe(0);
    expect(readFileSync(tmp.path('bare-validation/validation-statistics.csv'), 'utf8')).toBe(readFileSync(tmp.path('plain-validation/validation-statistics.csv'), 'utf8'));
    expect(readCsv(tmp.path('bare-validation/validation-statistics.csv')).map((r) => r.score)).toContain('afinn-165.valence');
  });

  it('dynamics reads the renamed long series and accepts lexichron\'s names in --variables, with the same results', async () => {
    const args = (folder: string) => ['dynamics', tmp.path(`${folder}/series-long.csv`), '--variables', 'afinn-165.valence,vader.compound', '--no-cross-mapping', '--min-pairs', '5', '--out', tmp.path(`${folder}-dynamics`)];
    expect((await runCli(...args('plain'))).code).toBe(0);
    const bare = await runCli(...args('bare'));
    expect(bare.stderr).not.toMatch(/not a score column/);
    expect(bare.code).toBe(0);
    expect(readFileSync(tmp.path('bare-dynamics/dynamics-persons.csv'), 'utf8')).toBe(readFileSync(tmp.path('plain-dynamics/dynamics-persons.csv'), 'utf8'));
  });

  it('series re-bins the renamed scores file with the same bins as the default names', async () => {
    expect((await runCli('series', tmp.path('plain/scores.csv'), '--bin', '1d', '--min-words', '1', '--out', tmp.path('plain-series.csv'))).code).toBe(0);
    const bare = await runCli('series', tmp.path('bare/scores.csv'), '--bin', '1d', '--min-words', '1', '--out', tmp.path('bare-series.csv'));
    expect(bare.code).toBe(0);
    expect(readFileSync(tmp.path('bare-series.csv'), 'utf8')).toBe(readFileSync(tmp.path('plain-series.csv'), 'utf8'));
  });

  it('report on the renamed folder draws the series and the validation, and accepts --score by lexichron\'s name', async () => {
    const r = await runCli('report', tmp.path('bare'), '--score', 'vader.compound', '--out', tmp.path('bare-report.html'));
    expect(r.stderr).not.toMatch(/not a score column/);
    expect(r.code).toBe(0);
    const html = readFileSync(tmp.path('bare-report.html'), 'utf8');
    expect(html).toContain('data-chart="series-selected"');
    expect(html).toContain('data-chart="scatter-within"');
  });
});
