import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { runCli } from '../support/run-cli.js';
import { tempFolder } from '../support/temp-files.js';

// Issue 21: `score --file-columns FILE=MAP` read each file with its own column map, but the scores
// sidecar (.meta.json) did not say which map, so its provenance was incomplete.

const tmp = tempFolder('lexichron-sidecar-columns-');
// Invented exports: a diary app with `who,when,note`, a chat export with `sender,sent_at,body`, and one with the default names.
const diary = tmp.write('wren-diary.csv', 'who,when,note\nwren,2026-05-01T08:00:00Z,a calm and happy morning\n');
const chat = tmp.write('olan-chat.csv', 'sender,sent_at,body,msg\nolan,2026-05-01T19:00:00Z,great walk by the river,m1\n');
const plain = tmp.write('plain.csv', 'person,time,text\nmika,2026-05-01T12:00:00Z,lunch was fine\n');
const key = tmp.write('key.txt', 'an-invented-study-key-kept-apart');

interface SidecarInput {
  path: string;
  rows: number;
  columns?: Record<string, string>;
}
const sidecarInputs = (out: string): SidecarInput[] => (JSON.parse(readFileSync(`${out}.meta.json`, 'utf8')) as { inputs: SidecarInput[] }).inputs;

describe('the scores sidecar records each input\'s column map', () => {
  it('records the map of each --file-columns file, and of the others the --columns map, by the file\'s name', async () => {
    const out = tmp.path('named/scores.csv');
    const { code, stderr } = await runCli('score', diary, chat, plain, '--time-zone', 'UTC', '-l', 'afinn-165', '--workers', '0', '-o', out, '--file-columns', `${diary}=person=who,time=when,text=note`, '--file-columns', `${chat}=person=sender,time=sent_at,text=body,id=msg`);
    expect(code, stderr).toBe(0);
    const inputs = sidecarInputs(out);
    expect(inputs.map((i) => i.path)).toEqual(['wren-diary.csv', 'olan-chat.csv', 'plain.csv']);
    expect(inputs[0]?.columns).toEqual({ person: 'who', time: 'when', text: 'note' });
    expect(inputs[1]?.columns).toEqual({ person: 'sender', time: 'sent_at', text: 'body', id: 'msg' });
    expect(inputs[2]?.columns).toBeUndefined(); // read by the default names
  });

  it('shows each file\'s column map in the provenance of `lexichron report` on the scores folder (from the sidecar, as there is no manifest)', async () => {
    const { code, stderr } = await runCli('report', tmp.path('named'));
    expect(code, stderr).toBe(0);
    const html = readFileSync(tmp.path('named/report.html'), 'utf8');
    const provenance = html.slice(html.indexOf('id="provenance"'));
    expect(provenance).toContain('<code>wren-diary.csv</code></td><td><code>columns person=who,time=when,text=note</code>');
    expect(provenance).toContain('<code>olan-chat.csv</code></td><td><code>columns person=sender,time=sent_at,text=body,id=msg</code>');
    expect(provenance).toContain('<code>plain.csv</code></td><td><span class="muted">default column names</span>');
  });

  it('records a shared --columns map on every input it applies to', async () => {
    const out = tmp.path('shared/scores.csv');
    const { code, stderr } = await runCli('score', diary, '--time-zone', 'UTC', '-l', 'afinn-165', '--workers', '0', '-o', out, '--columns', 'person=who,time=when,text=note');
    expect(code, stderr).toBe(0);
    expect(sidecarInputs(out)[0]?.columns).toEqual({ person: 'who', time: 'when', text: 'note' });
  });

  it('names the files input-1, input-2 … when a pseudonym key is used, with their maps, and no file name appears', async () => {
    const out = tmp.path('keyed/scores.csv');
    const { code, stderr } = await runCli('score', diary, chat, '--time-zone', 'UTC', '-l', 'afinn-165', '--workers', '0', '--pseudonym-key-file', key, '-o', out, '--file-columns', `${diary}=person=who,time=when,text=note`, '--file-columns', `${chat}=person=sender,time=sent_at,text=body`);
    expect(code, stderr).toBe(0);
    const inputs = sidecarInputs(out);
    expect(inputs.map((i) => [i.path, i.columns])).toEqual([
      ['input-1', { person: 'who', time: 'when', text: 'note' }],
      ['input-2', { person: 'sender', time: 'sent_at', text: 'body' }],
    ]);
    const text = readFileSync(`${out}.meta.json`, 'utf8');
    expect(text).not.toMatch(/wren|olan/);
  });
});
