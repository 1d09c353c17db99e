import { describe, expect, it } from 'vitest';
import { parseColumnMapping } from '../../src/ingest/column-mapping.js';
import { readEntries } from '../../src/ingest/read-entries.js';
import { buildZoneTable } from '../../src/ingest/zone-table.js';
import type { ReadItem } from '../../src/types.js';
import { collect, tempFolder } from '../support/temp-files.js';
import { tableFile } from '../../src/io/table-file.js';

const tmp = tempFolder();
const brussels = buildZoneTable([], '', 'Europe/Brussels');

async function read(name: string, content: string, options: Partial<Parameters<typeof readEntries>[1]> = {}): Promise<ReadItem[]> {
  return collect(readEntries(tableFile(tmp.write(name, content)), { zones: brussels, ...options }));
}

const entries = (items: ReadItem[]) => items.flatMap((i) => (i.kind === 'entry' ? [i.entry] : []));
const rejects = (items: ReadItem[]) => items.flatMap((i) => (i.kind === 'reject' ? [[i.diagnostic.code, i.diagnostic.source?.line]] : []));

describe('readEntries', () => {
  it('turns rows into entries with id, person, instant, zone and offset', async () => {
    const items = await read('a.csv', 'id,person,time,text\nm1,p1,2026-03-29 08:15,Slept well\n');
    expect(entries(items)).toEqual([
      { id: 'm1', person: 'p1', instant: Date.UTC(2026, 2, 29, 6, 15), zone: 'Europe/Brussels', offsetMinutes: 120, text: 'Slept well', source: { file: 'a.csv', line: 2 } },
    ]);
  });

  it('uses <file>:<line> as id when there is no id column', async () => {
    const items = await read('noid.csv', 'person,time,text\np1,2026-03-01 10:00,"two\nlines"\np1,2026-03-01 11:00,next\n');
    expect(entries(items).map((e) => e.id)).toEqual(['noid.csv:2', 'noid.csv:4']);
  });

  it('maps other column names with --columns', async () => {
    const items = await read('mapped.csv', 'who,sent_at,body\np1,2026-03-01T10:00:00Z,hello\n', { columns: 'person=who,time=sent_at,text=body' });
    expect(entries(items)).toMatchObject([{ person: 'p1', text: 'hello', instant: Date.UTC(2026, 2, 1, 10) }]);
  });

  it('names the missing columns and the header, and shows how to map them', async () => {
    await expect(read('misnamed.csv', 'participant,sent,body\np1,2026-03-01,hi\n')).rejects.toThrow(
      'Cannot read `misnamed.csv`: no column `person` (person), `time` (time), `text` (text); the header has `participant`, `sent`, `body`. Map your columns with --columns person=COLUMN,time=COLUMN,text=COLUMN.',
    );
  });

  it('names a column that --columns maps but the file lacks', async () => {
    await expect(read('partly.csv', 'person,time,text\np1,2026-03-01T10:00Z,hi\n', { columns: 'text=body' })).rejects.toThrow(/no column `body` \(text\); the header has `person`, `time`, `text`/);
  });

  it('suggests --delimiter when a semicolon file is read as CSV', async () => {
    await expect(read('semicolon.csv', 'person;time;text\np1;2026-03-01T10:00Z;hi\n')).rejects.toThrow(
      "the file seems to use another delimiter; pass --delimiter ';'",
    );
  });

  it('reads the same semicolon file with --delimiter ;', async () => {
    const items = await read('semicolon2.csv', 'person;time;text\np1;2026-03-01T10:00Z;hi\n', { delimiter: ';' });
    expect(entries(items)).toHaveLength(1);
  });

  it('rejects empty text, a missing person and unreadable times with their lines', async () => {
    const items = await read(
      'bad.csv',
      'person,time,text\np1,2026-03-01T10:00Z,\np1,2026-03-01T10:00Z,"   "\n,2026-03-01T10:00Z,who wrote this\np1,last tuesday,hello\np1,,hello\np1,2026-03-29 02:30,in the gap\np1,2026-03-01T10:00Z,fine\n',
    );
    expect(rejects(items)).toEqual([
      ['empty_text', 2],
      ['empty_text', 3],
      ['missing_person', 4],
      ['bad_time', 5],
      ['missing_time', 6],
      ['time_in_gap', 7],
    ]);
    expect(entries(items)).toHaveLength(1);
  });

  it('uses a zone column when present and rejects an unknown zone there', async () => {
    const items = await read('zones.csv', 'person,time,zone,text\np1,2026-11-01 01:30,America/New_York,x\np2,2026-03-01 10:00,Europe/Brusels,y\np3,2026-03-01 10:00,,z\n', {
      time: { epoch: 'auto', gap: 'reject', overlap: 'later' },
    });
    expect(entries(items).map((e) => [e.person, e.zone, e.instant])).toEqual([
      ['p1', 'America/New_York', Date.UTC(2026, 10, 1, 6, 30)],
      ['p3', 'Europe/Brussels', Date.UTC(2026, 2, 1, 9, 0)],
    ]);
    expect(rejects(items)).toEqual([['unknown_zone', 3]]);
  });

  it('rejects rows of a person without a zone when there is no fallback', async () => {
    const zones = buildZoneTable([{ person: 'p1', zone: 'UTC', line: 2 }], 'zones.csv');
    const items = await read('nozone.csv', 'person,time,text\np1,2026-03-01 10:00,a\np2,2026-03-01 10:00,b\n', { zones });
    expect(rejects(items)).toEqual([['no_zone', 3]]);
  });

  it('reads JSON Lines with the default columns', async () => {
    const items = await read('e.jsonl', '{"id":"x1","person":"p1","time":"2026-03-29T08:15:00+02:00","zone":"Europe/Brussels","text":"hi"}\n');
    expect(entries(items)).toMatchObject([{ id: 'x1', instant: Date.UTC(2026, 2, 29, 6, 15), zone: 'Europe/Brussels', offsetMinutes: 120 }]);
  });
});

describe('parseColumnMapping', () => {
  it('reads FIELD=COLUMN pairs over the defaults', () => {
    expect(parseColumnMapping('person=who, text=body')).toEqual({ person: 'who', time: 'time', text: 'body' });
  });

  it('names the bad part and gives an example', () => {
    expect(() => parseColumnMapping('writer=who')).toThrow('`writer=who` is not FIELD=COLUMN with FIELD one of person, time, text, id, zone; for example --columns person=participant,time=sent_at,text=body');
  });
});
