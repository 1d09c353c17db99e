import { readFileSync } from 'node:fs';
import Papa from 'papaparse';
import { describe, expect, it } from 'vitest';
import { parseSeriesCsv } from '../../src/dynamics/parse-series-csv.js';
import { pseudonymizePerson } from '../../src/privacy/pseudonymize-person.js';
import { runCli } from '../support/run-cli.js';
import { tempFolder } from '../support/temp-files.js';

const tmp = tempFolder();

const cli = runCli;

const input = [
  'person,time,text',
  'p1,2026-03-02T09:00:00+01:00,"Great day with Marta, mail me at marta.v@example.org or call +32 470 12 34 56"',
  'p1,2026-03-02T12:00:00+01:00,see https://example.org/x and ping @marta_v',
  '',
].join('\n');

describe('privacy of score outputs', () => {
  it('redacts e-mail addresses, phone numbers, URLs, handles and listed names from --keep-text', async () => {
    tmp.write('in.csv', input);
    tmp.write('names.txt', '# people to redact\nMarta\n');
    const { code } = await cli('score', tmp.path('in.csv'), '--time-zone', 'Europe/Brussels', '-l', 'afinn-165', '--keep-text', '--redact-names', tmp.path('names.txt'), '-o', tmp.path('kept.csv'));
    expect(code).toBe(0);
    const out = readFileSync(tmp.path('kept.csv'), 'utf8');
    expect(out).not.toMatch(/Marta|marta|example\.org|470/);
    expect(out).toContain('[name]');
    expect(out).toContain('[email]');
    expect(out).toContain('[phone]');
    expect(out).toContain('[url]');
    expect(out).toContain('[handle]');
  });

  it('writes HMAC-SHA256 pseudonyms instead of person ids when a key is given, and refuses --aggregates-only with --keep-text', async () => {
    tmp.write('in.csv', input);
    tmp.write('key.txt', 'a-long-study-key-kept-apart-from-data');
    const { code } = await cli('score', tmp.path('in.csv'), '--time-zone', 'Europe/Brussels', '-l', 'afinn-165', '--pseudonym-key-file', tmp.path('key.txt'), '-o', tmp.path('p.csv'));
    expect(code).toBe(0);
    const rows = readFileSync(tmp.path('p.csv'), 'utf8').trim().split('\n').slice(1);
    const expected = pseudonymizePerson('p1', Buffer.from('a-long-study-key-kept-apart-from-data'));
    expect(rows.map((r) => r.split(',')[1])).toEqual([expected, expected]);
    const refused = await cli('score', tmp.path('in.csv'), '--time-zone', 'UTC', '--keep-text', '--aggregates-only', '-o', tmp.path('x.csv'));
    expect(refused.code).toBe(2);
    expect(refused.stderr).toContain('--aggregates-only and --keep-text');
  });
});

describe('formula injection in score and series outputs (OWASP, CSV Injection)', () => {
  it('writes person ids that could start a spreadsheet formula with a single quote, and reads them back as written', async () => {
    tmp.write('f.csv', ['person,time,text', '=p1,2026-03-02T09:00:00+01:00,a good day', '-p2,2026-03-02T10:00:00+01:00,a bad day', '=p1,2026-03-03T09:00:00+01:00,happy again', ''].join('\n'));
    expect((await cli('score', tmp.path('f.csv'), '--time-zone', 'Europe/Brussels', '-l', 'afinn-165', '-o', tmp.path('f-scores.csv'))).code).toBe(0);
    const scores = Papa.parse<string[]>(readFileSync(tmp.path('f-scores.csv'), 'utf8'), { delimiter: ',', skipEmptyLines: true }).data.slice(1);
    expect(scores.map((r) => r[1])).toEqual(["'=p1", "'-p2", "'=p1"]);
    expect((await cli('series', tmp.path('f-scores.csv'), '--bin', '1d', '-o', tmp.path('f-long.csv'))).code).toBe(0);
    const long = readFileSync(tmp.path('f-long.csv'), 'utf8');
    const persons = new Set(Papa.parse<Record<string, string>>(long, { header: true, skipEmptyLines: true }).data.map((r) => r.person));
    expect([...persons].sort()).toEqual(["'-p2", "'=p1"]);
    expect(parseSeriesCsv(long).persons.map((p) => p.person).sort()).toEqual(['-p2', '=p1']);
  });
});
