import { existsSync, readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { runStudy } from '../../src/pipeline.js';
import { parseStudy } from '../../src/study/parse-study.js';
import { tempFolder } from '../support/temp-files.js';

const tmp = tempFolder();

// An invented two-person chat between a participant (Rosa) and a friend (Tomas): only Rosa's words may be scored.
const chat = [
  '12/03/2026, 08:01 - Rosa: Good morning, I feel great today',
  '12/03/2026, 08:02 - Tomas: I am so sad and angry about everything',
  '12/03/2026, 08:03 - Rosa: worried about the exam though',
  '13/03/2026, 21:40 - Rosa: tired but happy, lovely evening',
  '13/03/2026, 21:41 - Tomas: terrible terrible terrible',
  '13/03/2026, 21:42 - Messages to this group are now secured',
  '',
].join('\n');

describe('study files that name donated exports', () => {
  it('scores only the participant\'s own chat messages and counts the friend\'s as third-party drops', async () => {
    tmp.write('chat.txt', chat);
    tmp.write('study.json', JSON.stringify({
      name: 'chat import check',
      inputs: [{ path: 'chat.txt', format: 'chat-lines', person: 'r01', senders: ['Rosa'] }],
      timeZone: 'Europe/Brussels',
      lexicons: ['afinn-165'],
      dynamics: false,
      audit: false,
      report: false,
      out: 'out',
    }));
    const result = await runStudy(tmp.path('study.json'), { now: '2026-12-01T00:00:00.000Z', seed: 1 });
    const r = result.score.reconciliation;
    expect(r.scored).toBe(3);
    expect(r.dropped.third_party).toBe(2);
    expect(r.dropped.system_line).toBe(1);
    expect(r.read).toBe(6);
    const scores = readFileSync(tmp.path('out/scores.csv'), 'utf8').trim().split('\n');
    expect(scores).toHaveLength(4);
    // AFINN-165: great +3, good +3 → 6; worried -3; tired -2, happy +3, lovely +3 → 4.
    const afinn = scores.slice(1).map((line) => Number(line.split(',')[6]));
    expect(afinn).toEqual([6, -3, 4]);
    expect(readFileSync(tmp.path('out/scores.csv'), 'utf8')).not.toMatch(/Tomas|terrible|sad/);
  });

  it('asks for the participant and their sender names when a chat export lacks them', () => {
    const { problems } = parseStudy({ inputs: [{ path: 'chat.txt', format: 'chat-lines' }], timeZone: 'UTC', out: 'out' });
    expect(problems.map((p) => p.path)).toEqual(['$.inputs[0].person', '$.inputs[0].senders']);
    expect(problems[1]?.message).toContain('sender names');
  });

  it('accepts a diary\'s entry-time pattern and format, and asks for strings', () => {
    const ok = parseStudy({ inputs: [{ path: 'd.md', format: 'diary', person: 'P1', entryTime: '^(\\d{1,2}:\\d{2}) - ', entryTimeFormat: 'H:mm' }], timeZone: 'UTC', out: 'out' });
    expect(ok.problems).toEqual([]);
    const bad = parseStudy({ inputs: [{ path: 'd.md', format: 'diary', person: 'P1', entryTime: 9 }], timeZone: 'UTC', out: 'out' });
    expect(bad.problems).toEqual([{ path: '$.inputs[0].entryTime', message: 'expected a string' }]);
  });

  it('names a mistyped key with its JSON path and the key it probably means', () => {
    const { problems } = parseStudy({ inputs: ['a.csv'], timeZone: 'UTC', out: 'out', seires: {} });
    expect(problems).toEqual([{ path: '$.seires', message: 'unknown key `seires`; did you mean `series`?' }]);
  });
});

describe('study settings are checked before anything is scored', () => {
  it('names the study key of a bad bin and leaves no scores behind', async () => {
    tmp.write('t.csv', 'person,time,text\na,2026-03-02T10:00:00+01:00,good day\n');
    tmp.write('bad-bin.json', JSON.stringify({ inputs: ['t.csv'], timeZone: 'Europe/Brussels', series: { bin: '1 day' }, out: 'out-bad' }));
    await expect(runStudy(tmp.path('bad-bin.json'), { now: '2026-12-01T00:00:00.000Z' })).rejects.toThrow(/\$\.series: .*"bin" `1 day`|\$\.series: Bin `1 day`/);
    expect(existsSync(tmp.path('out-bad/scores.csv'))).toBe(false);
  });

  it('names $.timeZone for an unknown zone', async () => {
    tmp.write('bad-zone.json', JSON.stringify({ inputs: ['t.csv'], timeZone: 'Europe/Brusels', out: 'out-zone' }));
    await expect(runStudy(tmp.path('bad-zone.json'), { now: '2026-12-01T00:00:00.000Z' })).rejects.toThrow('$.timeZone: unknown time zone `Europe/Brusels`');
  });
});
