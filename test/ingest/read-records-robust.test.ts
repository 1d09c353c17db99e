import { describe, expect, it } from 'vitest';
import { lineBreakState, normalizeLineBreaks } from '../../src/ingest/normalize-line-breaks.js';
import { readRecords, type RecordItem } from '../../src/ingest/read-records.js';
import { collect, tempFolder } from '../support/temp-files.js';
import { tableFile } from '../../src/io/table-file.js';

// Sources: RFC 4180 section 2 (CSV records end with a line break; rule 3: the first record may be
// a header, and names its fields); the Unicode Standard's byte order mark table (section 23.8,
// "Specials", Table 23-4 / the Unicode BOM FAQ): UTF-8 EF BB BF, UTF-16 BE FE FF, UTF-16 LE FF FE.

const tmp = tempFolder();

async function read(name: string, content: string | Buffer): Promise<RecordItem[]> {
  return collect(readRecords(tableFile(tmp.write(name, content))));
}

const records = (items: RecordItem[]) => items.flatMap((i) => (i.kind === 'record' ? [{ ...i.record, '@line': i.source.line }] : []));
const rejects = (items: RecordItem[]) => items.flatMap((i) => (i.kind === 'reject' ? [{ code: i.diagnostic.code, line: i.diagnostic.source?.line }] : []));

describe('readRecords reads mixed line breaks as line breaks', () => {
  it('reads 10 rows broken by CR, LF and CRLF in turn as 10 records with their lines', async () => {
    const breaks = ['\n', '\r', '\r\n'];
    let text = 'person,time,text';
    for (let i = 0; i < 10; i++) text += `${breaks[i % 3]}p${i},2026-03-01T10:00:00Z,row ${i}`;
    const items = await read('mixed.csv', `${text}\n`);
    expect(rejects(items)).toEqual([]);
    expect(records(items).map((r) => r['@line'])).toEqual([2, 3, 4, 5, 6, 7, 8, 9, 10, 11]);
  });

  it('numbers the lines of a CR-only file correctly, also after a quoted field with a line break', async () => {
    const items = await read('cr.csv', 'a,b\rx,"one\rtwo"\ry,z\rbad\r');
    expect(records(items)).toEqual([
      { a: 'x', b: 'one\rtwo', '@line': 2 }, // kept as written inside quotes (RFC 4180 §2 rule 6)
      { a: 'y', b: 'z', '@line': 4 },
    ]);
    expect(rejects(items)).toEqual([{ code: 'field_count', line: 5 }]);
  });

  it('keeps a CRLF split between two chunks of the file as one line break', async () => {
    const head = 'a,b\n';
    const filler = `${'x'.repeat(65536 - head.length - 3)}`;
    const items = await read('split.csv', `${head}${filler},1\r\ny,2\r\n`);
    expect(rejects(items)).toEqual([]);
    expect(records(items).map((r) => [r.b, r['@line']])).toEqual([['1', 2], ['2', 3]]);
  });
});

describe('readRecords refuses duplicated header names', () => {
  it('names both positions and never the name itself', async () => {
    await expect(read('dup.csv', 'person,text,time,secret word,text\np,a,2026-03-01,x,b\n')).rejects.toThrow(/columns 2 and 5/);
    await expect(read('dup2.csv', 'person,secret word,time,secret word\np,a,2026,b\n')).rejects.not.toThrow(/secret word/);
  });

  it('accepts several empty header cells (trailing delimiters)', async () => {
    const items = await read('empty-header.csv', 'a,b,,\n1,2,,\n');
    expect(records(items)).toHaveLength(1);
  });
});

describe('readRecords reads UTF-16 (Unicode BOM table: FF FE little endian, FE FF big endian)', () => {
  const csv = 'person,time,text\np1,2026-03-01T10:00:00Z,héllo wörld\n';
  const le = Buffer.from(csv, 'utf16le');
  const be = Buffer.from(le).swap16();
  const expected = [{ person: 'p1', time: '2026-03-01T10:00:00Z', text: 'héllo wörld', '@line': 2 }];

  it('reads UTF-16 LE with a byte-order mark', async () => {
    expect(records(await read('le-bom.csv', Buffer.concat([Buffer.from([0xff, 0xfe]), le])))).toEqual(expected);
  });

  it('reads UTF-16 BE with a byte-order mark', async () => {
    expect(records(await read('be-bom.csv', Buffer.concat([Buffer.from([0xfe, 0xff]), be])))).toEqual(expected);
  });

  it('reads UTF-16 LE and BE without a byte-order mark', async () => {
    expect(records(await read('le.csv', le))).toEqual(expected);
    expect(records(await read('be.csv', be))).toEqual(expected);
  });

  it('reads JSON Lines in UTF-16 LE', async () => {
    const items = await read('le.jsonl', Buffer.concat([Buffer.from([0xff, 0xfe]), Buffer.from('{"person":"p1","text":"ok"}\n', 'utf16le')]));
    expect(records(items)).toEqual([{ person: 'p1', text: 'ok', '@line': 1 }]);
  });

  it('does not take a UTF-8 file with a few NUL bytes for UTF-16', async () => {
    const items = await read('nul.csv', 'person,time,text\np1,2026-03-01T10:00:00Z,a\0b\np2,2026-03-01T10:00:00Z,fine\n');
    expect(records(items).map((r) => r.person)).toEqual(['p1', 'p2']);
  });
});

describe('readRecords survives JSON nested deeper than the call stack', () => {
  it('rejects a JSON Lines row nested 10,000 deep as bad_json and reads the next row', async () => {
    const deep = `${'{"a":'.repeat(10000)}1${'}'.repeat(10000)}`;
    const items = await read('deep.jsonl', `{"person":"p","text":"x","extra":${deep}}\n{"person":"q","text":"y"}\n`);
    expect(rejects(items)).toEqual([{ code: 'bad_json', line: 1 }]);
    expect(records(items).map((r) => r.person)).toEqual(['q']);
  });

  it('rejects a deep element of a JSON array as bad_json', async () => {
    const deep = `${'['.repeat(10000)}${']'.repeat(10000)}`;
    const items = await read('deep.json', `[{"person":"p","text":"x","extra":${deep}},{"person":"q","text":"y"}]`);
    expect(rejects(items)).toEqual([{ code: 'bad_json', line: 1 }]);
    expect(records(items).map((r) => r.person)).toEqual(['q']);
  });
});

describe('normalizeLineBreaks gives the same text however the file is cut into pieces', () => {
  it('agrees with reading the text whole at every cut point', () => {
    const text = 'a,b\r\n"x\r\ny",1\r"q""\r",2\nz,"3"\r\n,\r';
    const whole = normalizeLineBreaks(text, ',', lineBreakState(), true);
    expect(whole).toBe('a,b\n"x\r\ny",1\n"q""\r",2\nz,"3"\n,\n');
    for (let cut = 0; cut <= text.length; cut++) {
      const state = lineBreakState();
      const parts = normalizeLineBreaks(text.slice(0, cut), ',', state) + normalizeLineBreaks(text.slice(cut), ',', state) + normalizeLineBreaks('', ',', state, true);
      expect(parts, `cut at ${cut}`).toBe(whole);
    }
  });

  it('takes a quote inside an unquoted field as a plain character (RFC 4180 §2 rule 5)', () => {
    expect(normalizeLineBreaks('a,b"c\rd,e\r', ',', lineBreakState(), true)).toBe('a,b"c\nd,e\n');
  });
});
