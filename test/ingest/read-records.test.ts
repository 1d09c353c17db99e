import { createHash } from 'node:crypto';
import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { readRecords, type RecordItem } from '../../src/ingest/read-records.js';
import { collect, tempFolder } from '../support/temp-files.js';
import { tableFile } from '../../src/io/table-file.js';

const tmp = tempFolder();

async function read(name: string, content: string | Buffer, options = {}): Promise<RecordItem[]> {
  return collect(readRecords(tableFile(tmp.write(name, content)), options));
}

const records = (items: RecordItem[]) => items.flatMap((i) => (i.kind === 'record' ? [{ ...i.record, '@line': i.source.line }] : []));
const rejects = (items: RecordItem[]) => items.flatMap((i) => (i.kind === 'reject' ? [{ code: i.diagnostic.code, line: i.diagnostic.source?.line, message: i.diagnostic.message }] : []));

describe('readRecords reads CSV as RFC 4180 section 2 describes it', () => {
  it('splits records delimited by CRLF (RFC 4180 §2 rule 1)', async () => {
    const items = await read('rule1.csv', 'a,b,c\r\naaa,bbb,ccc\r\nzzz,yyy,xxx\r\n');
    expect(items[0]).toMatchObject({ kind: 'header', columns: ['a', 'b', 'c'], source: { line: 1 } });
    expect(records(items)).toEqual([
      { a: 'aaa', b: 'bbb', c: 'ccc', '@line': 2 },
      { a: 'zzz', b: 'yyy', c: 'xxx', '@line': 3 },
    ]);
  });

  it('reads the last record when it has no ending line break (RFC 4180 §2 rule 2)', async () => {
    const items = await read('rule2.csv', 'a,b,c\r\naaa,bbb,ccc\r\nzzz,yyy,xxx');
    expect(records(items)).toEqual([
      { a: 'aaa', b: 'bbb', c: 'ccc', '@line': 2 },
      { a: 'zzz', b: 'yyy', c: 'xxx', '@line': 3 },
    ]);
  });

  it('takes the first line as the header line with the same number of fields (RFC 4180 §2 rule 3)', async () => {
    const items = await read('rule3.csv', 'field_name,field_name2,field_name3\naaa,bbb,ccc\n');
    expect(items[0]).toMatchObject({ kind: 'header', columns: ['field_name', 'field_name2', 'field_name3'] });
    expect(records(items)).toEqual([{ field_name: 'aaa', field_name2: 'bbb', field_name3: 'ccc', '@line': 2 }]);
  });

  it('accepts fields with or without enclosing double quotes (RFC 4180 §2 rule 5)', async () => {
    const items = await read('rule5.csv', 'a,b,c\n"aaa","bbb","ccc"\nzzz,yyy,xxx\n');
    expect(records(items)).toEqual([
      { a: 'aaa', b: 'bbb', c: 'ccc', '@line': 2 },
      { a: 'zzz', b: 'yyy', c: 'xxx', '@line': 3 },
    ]);
  });

  it('keeps commas and CRLF line breaks inside quoted fields (RFC 4180 §2 rule 6)', async () => {
    const items = await read('rule6.csv', 'a,b,c\r\n"aaa","b\r\nbb","c,cc"\r\nzzz,yyy,xxx\r\n');
    expect(records(items)).toEqual([
      { a: 'aaa', b: 'b\r\nbb', c: 'c,cc', '@line': 2 },
      { a: 'zzz', b: 'yyy', c: 'xxx', '@line': 4 },
    ]);
  });

  it('keeps a bare LF inside a quoted field of an LF file (RFC 4180 §2 rule 6, Unix line ends)', async () => {
    const items = await read('rule6-lf.csv', 'a,b\n"one\ntwo\nthree",x\nlast,y\n');
    expect(records(items)).toEqual([
      { a: 'one\ntwo\nthree', b: 'x', '@line': 2 },
      { a: 'last', b: 'y', '@line': 5 },
    ]);
  });

  it('reads a doubled double quote inside a quoted field as one quote (RFC 4180 §2 rule 7)', async () => {
    const items = await read('rule7.csv', 'a,b,c\n"aaa","b""bb","ccc"\n');
    expect(records(items)).toEqual([{ a: 'aaa', b: 'b"bb', c: 'ccc', '@line': 2 }]);
  });

  it('gives each record the physical line it starts on after several multi-line fields', async () => {
    const text = 'id,text\n1,"two\nlines"\n2,"three\r\nphysical\nlines"\n3,plain\n\n4,"after a blank line"\n';
    expect(records(await read('lines.csv', text)).map((r) => [r.id, r['@line']])).toEqual([
      ['1', 2],
      ['2', 4],
      ['3', 7],
      ['4', 9],
    ]);
  });

  it('keeps line numbers right across chunk boundaries of a long file', async () => {
    let text = 'id,text\n';
    for (let i = 1; i <= 3000; i++) text += i % 7 === 0 ? `${i},"multi\nline ${'x'.repeat(40)}"\n` : `${i},plain ${'y'.repeat(40)}\n`;
    const rows = records(await read('long.csv', text));
    expect(rows).toHaveLength(3000);
    // Row i starts on line 1 + i + (number of multi-line rows before it).
    for (const i of [1, 6, 7, 8, 1000, 2999, 3000]) {
      expect(rows[i - 1]?.['@line']).toBe(1 + i + Math.floor((i - 1) / 7));
    }
  });

  it('reads TSV with tabs and keeps commas in fields', async () => {
    const items = await read('t.tsv', 'person\ttext\np1\tone, two\n');
    expect(records(items)).toEqual([{ person: 'p1', text: 'one, two', '@line': 2 }]);
  });

  it('honours a semicolon delimiter when one is given', async () => {
    const items = await read('semi.csv', 'a;b\n1;"x;y"\n', { delimiter: ';' });
    expect(records(items)).toEqual([{ a: '1', b: 'x;y', '@line': 2 }]);
  });
});

describe('readRecords turns bad rows into rejects with a reason and line', () => {
  it('removes a UTF-8 byte-order mark so the first column keeps its name', async () => {
    const items = await read('bom.csv', Buffer.concat([Buffer.from([0xef, 0xbb, 0xbf]), Buffer.from('person,text\np1,hi\n')]));
    expect(items[0]).toMatchObject({ kind: 'header', columns: ['person', 'text'] });
    expect(records(items)).toEqual([{ person: 'p1', text: 'hi', '@line': 2 }]);
  });

  it('rejects a row holding bytes that are not valid UTF-8 and keeps the others', async () => {
    const bytes = Buffer.concat([Buffer.from('person,text\np1,fine\np2,caf'), Buffer.from([0xe9]), Buffer.from(' au lait\np3,also fine\n')]);
    const items = await read('latin1.csv', bytes);
    expect(records(items).map((r) => r.person)).toEqual(['p1', 'p3']);
    expect(rejects(items)).toEqual([{ code: 'invalid_utf8', line: 3, message: expect.stringContaining('re-save the file as UTF-8') }]);
  });

  it('rejects a 10 MB field as field_too_long without failing the rows around it', async () => {
    const big = 'word '.repeat(2_000_000); // 10,000,000 characters
    const items = await read('big.csv', `person,text\np1,short\np2,"${big}"\np3,after\n`);
    expect(records(items).map((r) => [r.person, r['@line']])).toEqual([
      ['p1', 2],
      ['p3', 4],
    ]);
    expect(rejects(items)).toEqual([{ code: 'field_too_long', line: 3, message: expect.stringContaining('10000000 characters') }]);
  });

  it('rejects a truncated last line whose quote is never closed', async () => {
    const items = await read('truncated.csv', 'person,text\np1,complete\np2,"cut off in the mid');
    expect(records(items).map((r) => r.person)).toEqual(['p1']);
    expect(rejects(items)).toEqual([{ code: 'unclosed_quote', line: 3, message: expect.stringContaining('not closed') }]);
  });

  it('rejects a row with the wrong number of fields and names the header count', async () => {
    const items = await read('count.csv', 'person,time,text\np1,2026-03-01,hello,extra\np2,2026-03-01,ok\n');
    expect(rejects(items)).toEqual([{ code: 'field_count', line: 2, message: expect.stringContaining('4 fields but the header has 3') }]);
    expect(records(items)).toHaveLength(1);
  });

  it('throws a clear error for an empty file', async () => {
    await expect(read('empty.csv', '')).rejects.toThrow(/the file is empty; expected a header row/);
  });

  it('throws a usage error naming the path for a missing file', async () => {
    await expect(collect(readRecords(tableFile(tmp.path('nope.csv'))))).rejects.toThrow(/no such file; check the path/);
  });

  it('asks for --format when the extension says nothing', async () => {
    await expect(read('data.txt', 'a\n1\n')).rejects.toThrow(/pass --format csv\|tsv\|jsonl\|json/);
  });
});

describe('readRecords reads JSON Lines and JSON arrays', () => {
  it('reads one object per line, skips blank lines and rejects bad JSON with its line', async () => {
    const items = await read('e.jsonl', '{"person":"p1","n":1}\n\n{"person":\n[1,2]\n{"person":"p2","n":null}\n');
    expect(records(items)).toEqual([
      { person: 'p1', n: '1', '@line': 1 },
      { person: 'p2', n: '', '@line': 5 },
    ]);
    expect(rejects(items).map((r) => [r.code, r.line])).toEqual([
      ['bad_json', 3],
      ['bad_json', 4],
    ]);
  });

  it('reads a JSON array with element positions as line numbers', async () => {
    const items = await read('e.json', '[{"person":"p1"}, 3, {"person":"p2"}]');
    expect(records(items)).toEqual([
      { person: 'p1', '@line': 1 },
      { person: 'p2', '@line': 3 },
    ]);
    expect(rejects(items).map((r) => [r.code, r.line])).toEqual([['bad_json', 2]]);
  });

  it('throws when a .json file is not an array', async () => {
    await expect(read('obj.json', '{"person":"p1"}')).rejects.toThrow(/not an array/);
  });
});

describe('readRecords hands the bytes it reads to onBytes', () => {
  // 8 + 2 + 65,524 bytes before the emoji: its four bytes straddle the end of the first 64 KiB chunk.
  const straddle = 'id,text\n1,' + 'a'.repeat(65524) + '\u{1F600} ok\n2,fine\n';

  it('gives every byte once, in order, and decodes a character split between chunks whole', async () => {
    const seen: Buffer[] = [];
    const path = tmp.write('straddle.csv', straddle);
    const items = await collect(readRecords(tableFile(path), { onBytes: (b: Buffer) => seen.push(b) }));
    expect(seen.length).toBeGreaterThan(1);
    expect(Buffer.concat(seen).equals(readFileSync(path))).toBe(true);
    expect(rejects(items)).toEqual([]);
    expect(records(items).map((r) => r.text?.slice(-5))).toEqual(['\u{1F600} ok', 'fine']);
    // Reference: `sha256sum` (GNU coreutils 9) of the same 65,549 bytes.
    expect(createHash('sha256').update(Buffer.concat(seen)).digest('hex')).toBe('23981b71703658cdae17321a075938360039fa5aa92ae3a6124fea337f35e0fa');
  });

  it('does so for JSON Lines and JSON arrays too', async () => {
    for (const [name, content] of [
      ['b.jsonl', '{"person":"p1","text":"caf\u00e9 \u{1F600}"}\n{"person":"p2","text":"x"}\n'],
      ['b.json', '[{"person":"p1","text":"caf\u00e9"}]'],
    ] as const) {
      const seen: Buffer[] = [];
      const path = tmp.write(name, content);
      const items = await collect(readRecords(tableFile(path), { onBytes: (b: Buffer) => seen.push(b) }));
      expect(Buffer.concat(seen).equals(readFileSync(path)), name).toBe(true);
      expect(records(items)[0]?.text, name).toMatch(/^café/);
    }
  });
});
