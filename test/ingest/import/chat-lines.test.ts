import { describe, expect, it } from 'vitest';
import { decodeTextLine } from '../../../src/ingest/import/decode-text-line.js';
import type { ImportItem } from '../../../src/ingest/import/import-item.js';
import { parseChatLine } from '../../../src/ingest/import/parse-chat-line.js';
import { readChatLines, type NumberedLine } from '../../../src/ingest/import/read-chat-lines.js';
import { repairMojibake } from '../../../src/ingest/import/repair-mojibake.js';
import { settleDateOrder } from '../../../src/ingest/import/settle-date-order.js';
import { openImportSource } from '../../../src/io/open-import-source.js';
import { collect, tempFolder } from '../../support/temp-files.js';

const tmp = tempFolder();
const numbered = (text: string): NumberedLine[] => text.split('\n').map((t, i) => ({ line: i + 1, ...decodeTextLine(Buffer.from(t, 'utf8')) }));
const OPTIONS = { file: 'chat.txt', person: 'P01', zone: 'Europe/Brussels', senders: ['Ann Lee'], dst: { gap: 'reject', overlap: 'reject' } } as const;
const read = (text: string, dateOrder: 'dmy' | 'mdy' | 'ymd' = 'dmy'): Promise<ImportItem[]> => collect(readChatLines(numbered(text), { ...OPTIONS, dateOrder }));
const entries = (items: ImportItem[]) => items.flatMap((i) => (i.kind === 'entry' ? [{ id: i.entry.id, utc: new Date(i.entry.instant).toISOString(), offset: i.entry.offsetMinutes, text: i.entry.text }] : []));
const others = (items: ImportItem[]) => items.flatMap((i) => (i.kind === 'reject' ? [i.diagnostic.code] : i.kind === 'drop' ? [`drop:${i.reason}`] : []));

describe('parseChatLine reads the date, time and sender of line-based chat exports in their locale forms', () => {
  const cases: Array<[string, string, object]> = [
    ['month first, 2-digit year, 12-hour clock', '12/31/21, 11:59 PM - Ann Lee: hi', { parts: [12, 31, 21], hour: 11, minute: 59, meridiem: 'pm' }],
    ['the narrow no-break space U+202F before PM (Unicode CLDR 42 and later)', '12/31/21, 11:59\u202fPM - Ann Lee: hi', { hour: 11, meridiem: 'pm' }],
    ['a no-break space U+00A0 before am', '3/1/24, 9:05\u00a0am - Ann Lee: hi', { parts: [3, 1, 24], hour: 9, minute: 5, meridiem: 'am' }],
    ['day first, 4-digit year, 24-hour clock', '31/12/2021, 23:59 - Ann Lee: hi', { parts: [31, 12, 2021], hour: 23, minute: 59 }],
    ['brackets, dots and seconds', '[31.12.21, 23:59:10] Ann Lee: hi', { parts: [31, 12, 21], second: 10 }],
    ['year first', '2021-12-31, 23:59 - Ann Lee: hi', { parts: [2021, 12, 31], firstDigits: 4 }],
    ['the Spanish marker "p. m."', '31/12/2021, 11:59 p. m. - Ann Lee: hi', { hour: 11, meridiem: 'pm' }],
    ['a left-to-right mark before the bracket', '\u200e[31/12/2021, 23:59:10] Ann Lee: hi', { parts: [31, 12, 2021] }],
  ];
  for (const [what, line, stamp] of cases) {
    it(`reads ${what}`, () => {
      const parsed = parseChatLine(line);
      expect(parsed.kind).toBe('message');
      if (parsed.kind !== 'message') return;
      expect(parsed.stamp).toMatchObject(stamp);
      expect([parsed.sender, parsed.text]).toEqual(['Ann Lee', 'hi']);
    });
  }
  it('takes a dated line without "sender: " for a system line', () => {
    expect(parseChatLine('31/12/2021, 23:59 - Ann Lee created group "Friends"').kind).toBe('system');
  });
  it('takes an undated line for the continuation of a message', () => {
    expect(parseChatLine('and a second line: with a colon')).toEqual({ kind: 'continuation', text: 'and a second line: with a colon' });
  });
});

describe('settleDateOrder settles day and month from the whole file', () => {
  const d = (a: number, b: number, c = 24) => ({ parts: [a, b, c] as [number, number, number], firstDigits: String(a).length });
  it('finds day first from a day above 12', () => expect(settleDateOrder([d(3, 4), d(13, 4)])).toMatchObject({ ok: true, order: 'dmy' }));
  it('finds month first from a day above 12 in second place', () => expect(settleDateOrder([d(3, 4), d(4, 21)])).toMatchObject({ ok: true, order: 'mdy' }));
  it('finds year first from four-digit first numbers', () => expect(settleDateOrder([{ parts: [2024, 4, 3], firstDigits: 4 }])).toMatchObject({ ok: true, order: 'ymd' }));
  it('calls a file ambiguous when no number exceeds 12', () => expect(settleDateOrder([d(3, 4), d(5, 6)])).toMatchObject({ ok: false, reason: 'ambiguous' }));
  it('calls a file conflicting when both places exceed 12', () => expect(settleDateOrder([d(13, 4), d(4, 21)])).toMatchObject({ ok: false, reason: 'conflict' }));
});

describe('readChatLines keeps only the participant\'s messages', () => {
  const log = [
    '\ufeff03/04/2024, 09:00 - Messages to this group are protected.',
    '03/04/2024, 09:01 - Ann Lee: Good morning!',
    'I slept well.',
    '03/04/2024, 09:02 - Bob: Bob\'s private reply',
    'with a second private line',
    '13/04/2024, 12:05 am - Ann Lee: after midnight',
    '13/04/2024, 12:30 pm - Ann Lee: lunch time',
    '31/02/2024, 10:00 - Ann Lee: no such day',
    '31/03/2024, 02:30 - Ann Lee: in the spring-forward gap',
  ].join('\n');

  it('joins continuation lines, converts 12-hour times, and keeps the zone offset of the day', async () => {
    const items = await read(log);
    expect(entries(items)).toEqual([
      { id: 'chat.txt:2', utc: '2024-04-03T07:01:00.000Z', offset: 120, text: 'Good morning!\nI slept well.' },
      { id: 'chat.txt:6', utc: '2024-04-12T22:05:00.000Z', offset: 120, text: 'after midnight' },
      { id: 'chat.txt:7', utc: '2024-04-13T10:30:00.000Z', offset: 120, text: 'lunch time' },
    ]);
  });
  it('drops third-party messages with no trace of their text, counts system lines, and rejects impossible dates and gap times', async () => {
    const items = await read(log);
    expect(others(items)).toEqual(['drop:system_line', 'drop:third_party', 'chat_bad_date', 'time_in_gap']);
    expect(JSON.stringify(items)).not.toMatch(/private/);
  });
  it('matches the sender name ignoring case, spacing and direction marks', async () => {
    expect(entries(await read('03/04/2024, 09:01 - \u2068ann  LEE\u2069: hi'))).toHaveLength(1);
  });
  it('rejects undated lines before the first message', async () => {
    expect(others(await read('exported chat\n03/04/2024, 09:01 - Ann Lee: hi'))).toEqual(['chat_orphan_lines']);
  });
});

describe('readChatLines never glues text of an unproven author onto the participant\'s message', () => {
  const own = '03/04/2024, 09:01 - Ann Lee: Good morning!';
  const fromBytes = (lines: Buffer[]): NumberedLine[] => lines.map((bytes, i) => ({ line: i + 1, ...decodeTextLine(bytes) }));
  const damaged: Array<[string, Buffer]> = [
    ['a flipped byte in the date', Buffer.from('03/0\u00144/2024, 09:02 - Bob: SECRET of Bob')],
    ['a NUL in the date', Buffer.from('03/04\u0000/2024, 09:02 - Bob: SECRET of Bob')],
    ['invalid UTF-8 in the date', Buffer.concat([Buffer.from('03/04/20'), Buffer.from([0xff]), Buffer.from('24, 09:02 - Bob: SECRET of Bob')])],
    ['a flipped byte in the time', Buffer.from('03/04/2024, 09;02 - Bob: SECRET of Bob')],
    ['a flipped opening bracket', Buffer.from('{03/04/2024, 09:02:00] Bob: SECRET of Bob')],
    ['a flipped dash', Buffer.from('03/04/2024, 09:02 = Bob: SECRET of Bob')],
  ];
  for (const [what, bytes] of damaged) {
    it(`rejects a header line with ${what} as chat_bad_header, with its continuation lines`, async () => {
      const items = await collect(readChatLines(fromBytes([Buffer.from(own), bytes, Buffer.from('more SECRET words'), Buffer.from('03/04/2024, 09:03 - Ann Lee: bye')]), { ...OPTIONS, dateOrder: 'dmy' }));
      expect(entries(items).map((e) => e.text)).toEqual(['Good morning!', 'bye']);
      expect(others(items)).toEqual(['chat_bad_header']);
      expect(JSON.stringify(items)).not.toMatch(/SECRET/);
    });
  }
  it('splits a line where a lost or damaged line break joined another sender\'s header onto it', async () => {
    for (const glue of ['', 'X', '\u0000']) {
      const items = await read(`${own}${glue}03/04/2024, 09:02 - Bob: SECRET of Bob\nmore SECRET words\n03/04/2024, 09:03 - Ann Lee: bye`);
      expect(entries(items).map((e) => e.text)).toEqual([`Good morning!${glue}`.trim(), 'bye']);
      expect(others(items)).toEqual(['drop:third_party']);
    }
  });
  it('still joins ordinary continuation lines, including ones that start with a number', async () => {
    const items = await read(`${own}\n2 coffees later\nand a walk at 10:30`);
    expect(entries(items).map((e) => e.text)).toEqual(['Good morning!\n2 coffees later\nand a walk at 10:30']);
  });
  it('reads a bare CR as a line break, so a header after it starts a new message (file read through openImportSource)', async () => {
    const path = tmp.write('cr.txt', `${own}\r03/04/2024, 09:02 - Bob: SECRET of Bob\r\n13/04/2024, 09:03 - Ann Lee: bye\rsecond line\n`);
    const opened = await openImportSource({ format: 'chat-lines', path, person: 'P01', zone: 'Europe/Brussels', senders: ['Ann Lee'] });
    const items = await collect(opened.items);
    expect(entries(items).map((e) => [e.id, e.text])).toEqual([['cr.txt:1', 'Good morning!'], ['cr.txt:3', 'bye\nsecond line']]);
    expect(others(items)).toEqual(['drop:third_party']);
    expect(JSON.stringify(items)).not.toMatch(/SECRET/);
  });
});

describe('decodeTextLine and repairMojibake repair double-encoded UTF-8 and mixed encodings', () => {
  it('undoes UTF-8 read as Windows-1252: Ã© → é, â€™ → ’, and â€¯ → the narrow no-break space U+202F', () => {
    expect(repairMojibake('trÃ¨s bien, câ€™est Ã§a')).toBe('très bien, c’est ça');
    expect(repairMojibake('11:59â€¯PM')).toBe('11:59\u202fPM');
    expect(repairMojibake('emoji ðŸ˜€')).toBe('emoji 😀');
  });
  it('leaves genuine Latin-1 letters alone', () => {
    expect(repairMojibake('café, Größe, Ærø, naïve')).toBe('café, Größe, Ærø, naïve');
  });
  it('reads a line that is not UTF-8 as Windows-1252 and says so', () => {
    expect(decodeTextLine(Buffer.from('d\xe9j\xe0 vu \x93ok\x94\r', 'latin1'))).toEqual({ text: 'déjà vu “ok”', repaired: 'windows_1252' });
  });
  it('reads a whole mojibake chat line with its 12-hour marker', async () => {
    const items = await collect(readChatLines([{ line: 1, ...decodeTextLine(Buffer.from('4/13/24, 9:05â€¯PM - Ann Lee: Ã§a va', 'utf8')) }], { ...OPTIONS, dateOrder: 'mdy' }));
    expect(entries(items)).toEqual([{ id: 'chat.txt:1', utc: '2024-04-13T19:05:00.000Z', offset: 120, text: 'ça va' }]);
    expect(items[0]?.kind === 'entry' && items[0].notes).toEqual(['mojibake']);
  });
});

describe('openImportSource settles the date order of a chat-lines file before reading it', () => {
  const spec = (path: string) => ({ format: 'chat-lines' as const, path, person: 'P01', zone: 'Europe/Brussels', senders: ['Ann Lee'] });
  it('reads day-first dates once a line proves them', async () => {
    const path = tmp.write('dmy.txt', '03/04/2024, 09:01 - Ann Lee: one\n21/04/2024, 09:01 - Ann Lee: two\n');
    const opened = await openImportSource(spec(path));
    expect(opened.dateOrder).toMatchObject({ order: 'dmy' });
    expect(entries(await collect(opened.items)).map((e) => e.utc)).toEqual(['2024-04-03T07:01:00.000Z', '2024-04-21T07:01:00.000Z']);
  });
  it('asks for --date-order when the whole file stays ambiguous, and then follows it', async () => {
    const path = tmp.write('ambiguous.txt', '03/04/2024, 09:01 - Ann Lee: one\n05/04/2024, 09:01 - Ann Lee: two\n');
    await expect(openImportSource(spec(path))).rejects.toThrow(/--date-order dmy/);
    const opened = await openImportSource({ ...spec(path), dateOrder: 'mdy' });
    expect(entries(await collect(opened.items))[0]?.utc).toBe('2024-03-04T08:01:00.000Z');
  });
  it('refuses a file that mixes date orders', async () => {
    const path = tmp.write('mixed.txt', '13/04/2024, 09:01 - Ann Lee: one\n04/21/2024, 09:01 - Ann Lee: two\n');
    await expect(openImportSource(spec(path))).rejects.toThrow(/mixes date orders/);
  });
});

describe('decodeWindows1252', () => {
  it('decodes every assigned byte as the reference library iconv-lite does for windows-1252 (WHATWG index windows-1252)', async () => {
    const iconv = (await import('iconv-lite')).default;
    const { decodeWindows1252 } = await import('../../../src/ingest/import/decode-windows-1252.js');
    // 0x81, 0x8D, 0x8F, 0x90 and 0x9D are unassigned: iconv-lite gives U+FFFD, the WHATWG index the C1 control of the same number
    const unassigned = [0x81, 0x8d, 0x8f, 0x90, 0x9d];
    const assigned = Buffer.from(Array.from({ length: 256 }, (_, i) => i).filter((b) => !unassigned.includes(b)));
    expect(decodeWindows1252(assigned)).toBe(iconv.decode(assigned, 'windows-1252'));
    expect(decodeWindows1252(Buffer.from(unassigned))).toBe('\u0081\u008d\u008f\u0090\u009d');
  });
});
