import { describe, expect, it } from 'vitest';
import { DEFAULT_TIME_OPTIONS } from '../../src/ingest/parse-instant.js';
import { buildZoneTable } from '../../src/ingest/zone-table.js';
import { studyInput } from '../../src/io/study-input.js';
import type { RawEntry } from '../../src/types.js';
import { collect, tempFolder } from '../support/temp-files.js';

const tmp = tempFolder('lexichron-study-input-');

describe('studyInput reads a donated export of a person who moves in the zone of each date (zone file with effective dates)', () => {
  it('a diary note at 09:00 after a move from Europe/Berlin to America/Chicago is 09:00 Chicago time (IANA tz: -06:00 in November 2026), as for a table input', async () => {
    const path = tmp.write('diary.txt', '2026-11-02\n\n09:00 - Packing boxes.\n\n2026-11-09\n\n09:00 - First morning in the new flat.\n');
    const zones = buildZoneTable([
      { person: 'p04', zone: 'Europe/Berlin', line: 2 },
      { person: 'p04', zone: 'America/Chicago', from: '2026-11-05', line: 3 },
    ], 'zones.csv');
    const input = studyInput({ path: 'diary.txt', format: 'diary', person: 'p04', entryTime: '^(\\d{2}:\\d{2}) - ' }, path, zones, DEFAULT_TIME_OPTIONS, '$.inputs[0]');
    const items = await collect(await (input.items as NonNullable<typeof input.items>)());
    const entries = items.flatMap((i) => (i.kind === 'entry' ? [i.entry as RawEntry] : []));
    expect(entries.map((e) => [e.zone, new Date(e.instant).toISOString(), e.offsetMinutes])).toEqual([
      ['Europe/Berlin', '2026-11-02T08:00:00.000Z', 60],
      ['America/Chicago', '2026-11-09T15:00:00.000Z', -360],
    ]);
  });
});

describe('studyInput passes a chat-table export its own time options', () => {
  it('reads epoch numbers in the unit of the input\'s time.epoch, not by size: 1792387500 as milliseconds is 1970-01-21T17:53:07.500Z (ECMA-262 time values)', async () => {
    const path = tmp.write('messages.csv', 'from,time,text\np08_river,1792387500,Late night walk home.\n');
    const zones = buildZoneTable([{ person: 'p08', zone: 'America/Chicago', line: 2 }], 'zones.csv');
    const read = async (epoch: 'auto' | 'ms'): Promise<string[]> => {
      const input = studyInput({ path: 'messages.csv', format: 'chat-table', person: 'p08', senders: ['p08_river'] }, path, zones, { ...DEFAULT_TIME_OPTIONS, epoch }, '$.inputs[0]');
      const items = await collect(await (input.items as NonNullable<typeof input.items>)());
      return items.map((i) => (i.kind === 'entry' ? new Date(i.entry.instant).toISOString() : i.kind));
    };
    expect(await read('auto')).toEqual(['2026-10-19T05:25:00.000Z']);
    expect(await read('ms')).toEqual(['1970-01-21T17:53:07.500Z']);
  });
});
