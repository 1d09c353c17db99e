import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { main } from '../../src/cli/main.js';
import { tempFolder } from '../support/temp-files.js';
import { syntheticPersons } from '../dynamics/synthetic-series.js';

function seriesCsv(): string {
  const lines = ['person,t,bin_of_day,missing,lag_valid,mood,mood.n,mood.within,tone'];
  for (const p of syntheticPersons(2, 120)) {
    p.t.forEach((t) => {
      const mood = p.values['mood']![t];
      const tone = p.values['tone']![t];
      lines.push([p.person, t, p.binOfDay![t], mood === undefined ? 'no_text' : '', p.lagValid[t] ? 1 : 0, mood ?? '', 1, '', tone ?? ''].join(','));
    });
  }
  return lines.join('\n') + '\n';
}

describe('lexichron dynamics', () => {
  const folder = tempFolder();
  const input = folder.write('series-long.csv', seriesCsv());
  const run = (out: string, ...extra: string[]) => main(['node', 'lexichron', 'dynamics', input, '--out', folder.path(out), '--libraries', '5', '--surrogates', '4', '--library-sizes', '4', ...extra]);

  it('writes the four tidy tables, dynamics.json and datapackage.json, byte-identical on a second run with the same seed', async () => {
    expect(await run('a')).toBe(0);
    expect(await run('b')).toBe(0);
    for (const file of ['dynamics-persons.csv', 'dynamics-var.csv', 'dynamics-ccm.csv', 'dynamics-ccm-skill.csv', 'dynamics.json', 'datapackage.json']) {
      expect(readFileSync(folder.path(`b/${file}`), 'utf8')).toBe(readFileSync(folder.path(`a/${file}`), 'utf8'));
    }
    const persons = readFileSync(folder.path('a/dynamics-persons.csv'), 'utf8').trim().split('\n');
    expect(persons[0]).toBe('person,variable,bins,observed,pct_missing,mean,sd,mssd,rmssd,lag_pairs,autocorr_acf,autocorr_pearson,ready,note');
    expect(persons).toHaveLength(5);
    const pkg = JSON.parse(readFileSync(folder.path('a/datapackage.json'), 'utf8'));
    expect(pkg.resources.map((r: { path: string }) => r.path)).toEqual(['dynamics-persons.csv', 'dynamics-var.csv', 'dynamics-ccm.csv', 'dynamics-ccm-skill.csv']);
  });

  it('restricts the cross analyses to --pair and fixes E with --embedding', async () => {
    expect(await run('c', '--pair', 'tone:mood', '--embedding', '2', '--variables', 'mood,tone')).toBe(0);
    const ccm = readFileSync(folder.path('c/dynamics-ccm.csv'), 'utf8').trim().split('\n');
    expect(ccm).toHaveLength(5);
    const header = ccm[0]!.split(',');
    expect(ccm.slice(1).map((l) => l.split(',')[header.indexOf('E')])).toEqual(['2', '2', '2', '2']);
  });

  it('exits with code 2 and names the columns when --pair names an unknown column', async () => {
    let message = '';
    const write = process.stderr.write;
    process.stderr.write = ((chunk: string) => ((message += chunk), true)) as typeof process.stderr.write;
    try {
      expect(await run('d', '--pair', 'mood:sleep')).toBe(2);
    } finally {
      process.stderr.write = write;
    }
    expect(message).toContain('--pair `mood:sleep` names `sleep`, which is not a score column');
    expect(message).toContain('`mood`, `tone`');
  });
});
