import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { parseCsv } from '../support/csv.js';
import { runCli } from '../support/run-cli.js';
import { tempFolder } from '../support/temp-files.js';

// Issue 21: `score` took one --columns map for every input, so two exports with their own column
// names needed a script to rename columns first. `--file-columns FILE=MAP` gives one file its map.

const tmp = tempFolder('lexichron-file-columns-');
// Invented exports: a diary app with `who,when,note` and a chat export with `sender,sent_at,body`.
const diary = tmp.write('diary.csv', 'who,when,note\nwren,2026-05-01T08:00:00Z,a calm and happy morning\nwren,2026-05-02T08:00:00Z,tired\n');
const chat = tmp.write('chat.csv', 'sender,sent_at,body\nolan,2026-05-01T19:00:00Z,great walk by the river\n');
const shared = tmp.write('shared.csv', 'person,time,text\nmika,2026-05-01T12:00:00Z,lunch was fine\n');

describe('score takes a column map per input file (--file-columns FILE=MAP)', () => {
  it('reads each file with its own map, and the others with --columns or the default names, rejecting nothing', async () => {
    const out = tmp.path('out/scores.csv');
    const { code, stderr } = await runCli('score', diary, chat, shared, '--time-zone', 'UTC', '-l', 'afinn-165', '--workers', '0', '-o', out, '--file-columns', `${diary}=person=who,time=when,text=note`, '--file-columns', `${chat}=person=sender,time=sent_at,text=body`);
    expect(code, stderr).toBe(0);
    expect(stderr).toMatch(/rows read\s+4\n\s+scored\s+4\n/);
    const rows = parseCsv(readFileSync(out, 'utf8'));
    expect(rows.map((r) => r.person)).toEqual(['wren', 'wren', 'olan', 'mika']);
  });

  it('refuses a map for a file that is not an input, listing the inputs', async () => {
    const { code, stderr } = await runCli('score', diary, '--time-zone', 'UTC', '--workers', '0', '-o', tmp.path('x/scores.csv'), '--file-columns', `${chat}=person=sender,time=sent_at,text=body`);
    expect(code).toBe(2);
    expect(stderr).toContain(`--file-columns names \`${chat}\`, which is not an input of this command; give it among the inputs, or name one of: \`${diary}\``);
  });

  it('refuses two maps for one file, and a value without FILE=', async () => {
    const twice = await runCli('score', diary, '--time-zone', 'UTC', '--workers', '0', '-o', tmp.path('y/scores.csv'), '--file-columns', `${diary}=person=who,time=when,text=note`, '--file-columns', `${diary}=person=who,time=when,text=note`);
    expect(twice.code).toBe(2);
    expect(twice.stderr).toContain(`--file-columns gives \`${diary}\` two maps; give each file one`);
    const bare = await runCli('score', diary, '--time-zone', 'UTC', '--workers', '0', '-o', tmp.path('z/scores.csv'), '--file-columns', 'person=who,time=when,text=note');
    expect(bare.code).toBe(2);
    expect(bare.stderr).toMatch(/--file-columns `person=who,time=when,text=note` does not start with an input file; write FILE=MAP/);
  });
});
