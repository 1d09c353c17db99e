import { describe, expect, it } from 'vitest';
import type { ImportItem } from '../../../src/ingest/import/import-item.js';
import { compileDiaryEntryTime, compileDiaryHeading, DEFAULT_DIARY_HEADING, readDiary } from '../../../src/ingest/import/read-diary.js';
import { openImportSource } from '../../../src/io/open-import-source.js';
import { collect, tempFolder } from '../../support/temp-files.js';

const tmp = tempFolder();
const lines = (text: string) => text.split('\n').map((t, i) => ({ line: i + 1, text: t }));
const DST = { gap: 'reject', overlap: 'reject' } as const;
const entries = (items: ImportItem[]) => items.flatMap((i) => (i.kind === 'entry' ? [{ id: i.entry.id, local: new Date(i.entry.instant + i.entry.offsetMinutes * 60000).toISOString().slice(0, 16), offset: i.entry.offsetMinutes, text: i.entry.text }] : []));
const others = (items: ImportItem[]) => items.flatMap((i) => (i.kind === 'reject' ? [i.diagnostic.code] : i.kind === 'drop' ? [`drop:${i.reason}`] : []));

describe('readDiary reads plain-text diaries with dated headings', () => {
  const base = { file: 'diary.txt', person: 'P01', zone: 'Europe/Brussels', dst: DST };
  it('starts an entry at each ISO 8601 heading and places a date without time at 12:00 local time', async () => {
    const items = await collect(readDiary(lines('# 2025-03-29\nA calm day.\n\n# 2025-03-30\nClocks changed.\nTired.'), { ...base, heading: compileDiaryHeading(DEFAULT_DIARY_HEADING), dateFormat: 'yyyy-MM-dd' }));
    expect(entries(items)).toEqual([
      { id: 'diary.txt:1', local: '2025-03-29T12:00', offset: 60, text: 'A calm day.' },
      { id: 'diary.txt:4', local: '2025-03-30T12:00', offset: 120, text: 'Clocks changed.\nTired.' },
    ]);
  });
  it('rejects the text under a dated line the heading pattern misses (\\w does not match the ä of März) as diary_unmatched_heading, instead of dating it to the day before', async () => {
    const heading = compileDiaryHeading('^(\\w+, \\d{1,2}\\. \\w+ \\d{4})$');
    const text = [
      'Samstag, 28. Februar 2026', // 1
      'Kalt heute.', // 2
      '', // 3
      'Sonntag, 1. März 2026', // 4: a heading the pattern misses
      'Frühling kommt.', // 5
      '08:15 - Kaffee am Fenster.', // 6
      'Mittwoch, 1. April 2026', // 7
      'Regen.', // 8
    ].join('\n');
    const options = { ...base, heading, dateFormat: 'cccc, d. MMMM yyyy', locale: 'de', entryTime: compileDiaryEntryTime('^(\\d{2}:\\d{2}) - ') };
    const items = await collect(readDiary(lines(text), options));
    expect(entries(items)).toEqual([
      { id: 'diary.txt:1', local: '2026-02-28T12:00', offset: 60, text: 'Kalt heute.' },
      { id: 'diary.txt:7', local: '2026-04-01T12:00', offset: 120, text: 'Regen.' },
    ]);
    expect(others(items)).toEqual(['diary_unmatched_heading', 'diary_unmatched_heading']);
    const rejects = items.flatMap((i) => (i.kind === 'reject' ? [i.diagnostic] : []));
    expect(rejects.map((d) => d.source.line)).toEqual([4, 6]);
    expect(rejects[0]?.message).toContain('does not match the heading pattern');
    expect(rejects[0]?.message).toContain('\\p{L}');
    expect(rejects[0]?.message).not.toContain('Sonntag');
  });
  it('keeps ordinary lines that merely hold a date among other words as text of the entry', async () => {
    const items = await collect(readDiary(lines('# 2025-03-01\nBack on 2025-03-02 we met.\n2025-03-03 is the deadline.'), { ...base, heading: compileDiaryHeading('^# (\\d{4}-\\d{2}-\\d{2})$'), dateFormat: 'yyyy-MM-dd' }));
    expect(others(items)).toEqual([]);
    expect(entries(items).map((e) => e.text)).toEqual(['Back on 2025-03-02 we met.\n2025-03-03 is the deadline.']);
  });
  it('reads a custom heading with month names in a locale and a clock time', async () => {
    const heading = compileDiaryHeading('^== (?<date>.+) ==$');
    const items = await collect(readDiary(lines('== lundi 3 mars 2025, 21h15 ==\nJe suis content.'), { ...base, heading, dateFormat: "cccc d MMMM yyyy', 'HH'h'mm", locale: 'fr' }));
    expect(entries(items)).toEqual([{ id: 'diary.txt:1', local: '2025-03-03T21:15', offset: 60, text: 'Je suis content.' }]);
  });
  it('rejects a heading with an impossible date (30 February) with luxon\'s reason, an empty entry, and text before the first heading', async () => {
    const items = await collect(readDiary(lines('front matter\n# 2025-02-30\nlost day\n# 2025-03-01\n\n# 2025-03-02\nfine'), { ...base, heading: compileDiaryHeading(DEFAULT_DIARY_HEADING), dateFormat: 'yyyy-MM-dd' }));
    expect(others(items)).toEqual(['diary_bad_date', 'diary_empty_entry', 'diary_before_first_heading']);
    const bad = items.find((i) => i.kind === 'reject');
    expect(bad?.kind === 'reject' && bad.diagnostic).toMatchObject({ source: { line: 2 }, message: expect.stringContaining('(a value of 10 characters shaped `9999-99-99`) does not fit the format `yyyy-MM-dd` or does not exist') });
    expect(entries(items).map((e) => e.text)).toEqual(['fine']);
  });
  it('splits a day into timed entries with --entry-time, in the zone\'s offset on each side of the spring-forward change (IANA tz: Europe/Brussels went from +01:00 to +02:00 at 01:00 UTC on 30 March 2025)', async () => {
    const text = [
      '# 2025-03-29', // 1
      '09:15 – Walked the dog.', // 2
      'Still cold.', // 3
      '14:30 - Lunch with Sam.', // 4
      '# 2025-03-30', // 5
      'Woke late.', // 6: the heading's own text, an entry at 12:00
      '08:05 — Clocks changed overnight.', // 7
      '02:30 - in the gap', // 8: 02:00–03:00 does not exist that night
      '25:70 - no such time', // 9
      '16:00 -', // 10: nothing written
    ].join('\n');
    const path = tmp.write('timed.md', text + '\n');
    const items = await collect((await openImportSource({ format: 'diary', path, person: 'P01', zone: 'Europe/Brussels', entryTime: '^(\\d{1,2}:\\d{2})\\s*[-–—]\\s*' })).items);
    expect(entries(items)).toEqual([
      { id: 'timed.md:2', local: '2025-03-29T09:15', offset: 60, text: 'Walked the dog.\nStill cold.' },
      { id: 'timed.md:4', local: '2025-03-29T14:30', offset: 60, text: 'Lunch with Sam.' },
      { id: 'timed.md:5', local: '2025-03-30T12:00', offset: 120, text: 'Woke late.' },
      { id: 'timed.md:7', local: '2025-03-30T08:05', offset: 120, text: 'Clocks changed overnight.' },
    ]);
    expect(others(items)).toEqual(['time_in_gap', 'diary_bad_time', 'diary_empty_entry']);
    const badTime = items.find((i) => i.kind === 'reject' && i.diagnostic.code === 'diary_bad_time');
    expect(badTime?.kind === 'reject' && badTime.diagnostic).toMatchObject({ source: { line: 9 }, message: expect.stringContaining('(a value of 5 characters shaped `99:99`) does not fit the format `H:mm`') });
  });

  it('refuses an entry-time pattern without a capture group, saying how to fix it', () => {
    expect(() => compileDiaryEntryTime('^\\d{2}:\\d{2} - ')).toThrow(/no capture group for the time; put the time in parentheses/);
  });

  it('refuses a heading pattern without a capture group, saying how to fix it', () => {
    expect(() => compileDiaryHeading('^## \\d{4}-\\d{2}-\\d{2}$')).toThrow(/no capture group/);
    expect(() => compileDiaryHeading('^(unclosed')).toThrow(/Cannot use the diary heading pattern/);
  });
});

describe('chat-table reads JSON, JSON Lines and CSV with a sender field', () => {
  const spec = (path: string, extra = {}) => ({ format: 'chat-table' as const, path, person: 'P01', zone: 'Europe/Brussels', senders: ['ann'], ...extra });
  it('keeps the participant\'s rows of a CSV and drops the others as third_party', async () => {
    const path = tmp.write('chat.csv', 'sender,timestamp,message\nann,2025-03-03T09:00:00+01:00,"Hello, world"\nbob,2025-03-03T09:01:00+01:00,Bob\'s secret\nAnn,2025-03-03 09:02,Ã§a va\n,2025-03-03 09:03,who?\n');
    const items = await collect((await openImportSource(spec(path))).items);
    expect(entries(items).map((e) => [e.id, e.local, e.text])).toEqual([
      ['chat.csv:2', '2025-03-03T09:00', 'Hello, world'],
      ['chat.csv:4', '2025-03-03T09:02', 'ça va'],
    ]);
    expect(others(items)).toEqual(['drop:third_party', 'chat_no_sender']);
    expect(JSON.stringify(items)).not.toContain('secret');
  });
  it('reads JSON Lines and JSON arrays with named fields', async () => {
    const jsonl = tmp.write('chat.jsonl', '{"from":"ann","at":1741000000,"body":"one"}\n{"from":"bob","at":1741000060,"body":"two"}\n');
    const json = tmp.write('chat.json', JSON.stringify([{ author: 'ann', time: '2025-03-03T09:00:00Z', content: 'three' }]));
    const a = await collect((await openImportSource(spec(jsonl, { senderField: 'from', timeField: 'at', textField: 'body' }))).items);
    const b = await collect((await openImportSource(spec(json))).items); // a time with Z keeps its own offset 0
    expect(entries(a).map((e) => e.text)).toEqual(['one']);
    expect(others(a)).toEqual(['drop:third_party']);
    expect(entries(b).map((e) => [e.local, e.text])).toEqual([['2025-03-03T09:00', 'three']]);
  });
  it('stops with a clear error when the file has no sender field', async () => {
    const path = tmp.write('nosender.csv', 'timestamp,message\n2025-03-03T09:00:00+01:00,hi\n');
    await expect(collect((await openImportSource(spec(path))).items)).rejects.toThrow(/no sender field; expected one of `sender`.*found `timestamp`, `message`; name it with --sender-field/);
  });
});
