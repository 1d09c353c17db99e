import { mkdirSync, readFileSync, existsSync } from 'node:fs';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { forgetPerson } from '../../src/io/forget-person.js';
import { createPersonRowFilter } from '../../src/privacy/create-person-row-filter.js';
import { removePersonFromJson } from '../../src/privacy/remove-person-from-json.js';
import { tempFolder } from '../support/temp-files.js';

const tmp = tempFolder();

function study(name: string): string {
  const dir = join(tmp.dir, name);
  mkdirSync(join(dir, 'people'), { recursive: true });
  const write = (file: string, text: string) => tmp.write(join(name, file), text);
  write('scores.csv', 'entry_id,person,time_utc,text\na:1,pA,2025-03-03T08:00:00.000Z,"fine,\nreally"\na:2,pB,2025-03-03T09:00:00.000Z,ok\na:3,pA,2025-03-03T10:00:00.000Z,"she said ""pA"""\n');
  write('series-long.csv', 'person,t,value\npB,0,1\npB,1,2\n');
  write('rejects.csv', 'file,line,code,message\nx,1,no_zone,person `pA` has no time zone\nx,2,bad_time,the time pA is not a time\n');
  write('entries.jsonl', '{"id":"1","person":"pA","text":"x"}\n{"id":"2","person":"pB","text":"y"}\n');
  write('summary.json', JSON.stringify({ persons: ['pA', 'pB'], columns: ['pA', 'n'], stages: { pA: 1 }, rows: [{ person: 'pA', r: 0.1 }, { person: 'pB', r: 0.2 }] }));
  write('people/pA.json', JSON.stringify({ person: 'pA', n: 2 }));
  write('people/plot-pA.svg', '<svg>pA</svg>');
  write('report.html', '<p>pB pA</p>');
  write('manifest.json', JSON.stringify({ tool: 'lexichron', persons: ['pA', 'pB'] }));
  return dir;
}

describe('forgetPerson removes a person from every output of a study folder', () => {
  it('removes rows, list entries and documents of the person (person values only), flags other mentions, and records the removal in the manifest (GDPR Art. 17)', async () => {
    const dir = study('s1');
    const result = await forgetPerson(dir, { ids: ['pA'], record: 'pA', at: '2025-04-01T10:00:00Z' });
    expect(readFileSync(join(dir, 'scores.csv'), 'utf8')).toBe('entry_id,person,time_utc,text\na:2,pB,2025-03-03T09:00:00.000Z,ok\n');
    expect(readFileSync(join(dir, 'entries.jsonl'), 'utf8')).toBe('{"id":"2","person":"pB","text":"y"}\n');
    // Only `persons` lists and `person` values name persons: a column or a key that equals the id stays.
    expect(JSON.parse(readFileSync(join(dir, 'summary.json'), 'utf8'))).toEqual({ persons: ['pB'], columns: ['pA', 'n'], stages: { pA: 1 }, rows: [{ person: 'pB', r: 0.2 }] });
    expect(existsSync(join(dir, 'people/pA.json'))).toBe(false);
    expect(existsSync(join(dir, 'people/plot-pA.svg'))).toBe(true); // never deleted by its name
    expect(readFileSync(join(dir, 'series-long.csv'), 'utf8')).toBe('person,t,value\npB,0,1\npB,1,2\n');
    // No person column: a row whose message names the person as diagnostics do is removed; a word in a message is not the person.
    expect(readFileSync(join(dir, 'rejects.csv'), 'utf8')).toBe('file,line,code,message\nx,2,bad_time,the time pA is not a time\n');
    expect(result).toEqual({
      found: true,
      changed: [{ file: 'entries.jsonl', removed: 1 }, { file: 'rejects.csv', removed: 1 }, { file: 'scores.csv', removed: 2 }, { file: 'summary.json', removed: 2 }, { file: 'manifest.json', removed: 1 }],
      deleted: ['people/pA.json'],
      stale: ['people/plot-pA.svg', 'report.html'],
      symlinks: [],
      temporaries: [],
    });
    expect(JSON.parse(readFileSync(join(dir, 'manifest.json'), 'utf8'))).toEqual({
      tool: 'lexichron',
      persons: ['pB'],
      forgotten: [{ person: 'pA', at: '2025-04-01T10:00:00Z', files: ['entries.jsonl', 'manifest.json', 'people/pA.json', 'rejects.csv', 'scores.csv', 'summary.json'] }],
    });
  });

  it('keeps earlier removal records, and changes and records nothing once the person is gone', async () => {
    const dir = study('s2');
    await forgetPerson(dir, { ids: ['pB'], record: 'pB', at: '2025-03-01T10:00:00Z' });
    await forgetPerson(dir, { ids: ['pA'], record: 'pA', at: '2025-04-01T10:00:00Z' });
    const before = readFileSync(join(dir, 'scores.csv'), 'utf8');
    const manifestBefore = readFileSync(join(dir, 'manifest.json'), 'utf8');
    const again = await forgetPerson(dir, { ids: ['pA'], record: 'pA', at: '2025-04-02T10:00:00Z' });
    expect(again).toMatchObject({ found: false, changed: [], deleted: [] });
    expect(readFileSync(join(dir, 'scores.csv'), 'utf8')).toBe(before);
    expect(readFileSync(join(dir, 'manifest.json'), 'utf8')).toBe(manifestBefore);
    const manifest = JSON.parse(manifestBefore);
    expect(manifest.forgotten.map((f: { at: string }) => f.at)).toEqual(['2025-03-01T10:00:00Z', '2025-04-01T10:00:00Z']);
  });

  it('refuses while another process holds the folder\'s lock, and changes nothing', async () => {
    const dir = study('s3');
    const before = readFileSync(join(dir, 'scores.csv'), 'utf8');
    tmp.write('s3/.lexichron-lock', JSON.stringify({ pid: process.pid, command: 'lexichron run' }));
    await expect(forgetPerson(dir, { ids: ['pA'], record: 'pA', at: 'x' })).rejects.toThrow(/another lexichron command \(process \d+, `lexichron run`\) is writing there/);
    expect(readFileSync(join(dir, 'scores.csv'), 'utf8')).toBe(before);
  });

  it('refuses a path that is not a folder', async () => {
    await expect(forgetPerson(tmp.path('missing'), { ids: ['pA'], record: 'pA', at: 'x' })).rejects.toThrow(/not a folder/);
  });
  it('keeps every other CSV row byte for byte, CRLF line ends and quoted commas, quotes and line breaks included (RFC 4180 section 2)', async () => {
    const dir = join(tmp.dir, 'rfc4180');
    mkdirSync(dir, { recursive: true });
    // RFC 4180: CRLF between records (rule 1); fields holding commas, quotes ("" inside, rule 7) and
    // line breaks (CRLF, and a lone CR or LF as other writers leave them) are enclosed in quotes
    // (rule 6); the last record has no line end (rule 2).
    const keep = ['person,text,n\r\n', 'pB,"a, b\r\nc ""d"", e",1\r\n', 'pC,"x\ry",2\r\n', 'pD,"one\ntwo, ""three""",3'];
    const drop = ['pA,"q, ""pB""\r\npB,z",9\r\n', 'pA,plain,8\r\n'];
    tmp.write(join('rfc4180', 'scores.csv'), [keep[0], drop[0], keep[1], keep[2], drop[1], keep[3]].join(''));
    const result = await forgetPerson(dir, { ids: ['pA'], record: 'pA', at: '2025-04-01T10:00:00Z' });
    expect(result.changed).toEqual([{ file: 'scores.csv', removed: 2 }]);
    expect(readFileSync(join(dir, 'scores.csv'), 'utf8')).toBe(keep.join(''));
  });
  it('leaves a table larger than the writer\'s buffer untouched when the person is not in it, and removes them from another', async () => {
    const dir = join(tmp.dir, 'big');
    mkdirSync(dir, { recursive: true });
    const big = 'person,text\r\n' + Array.from({ length: 40_000 }, (_, i) => `pB,"row ${i}, ""quoted""\r\nsecond line"\r\n`).join('');
    tmp.write(join('big', 'a-big.csv'), big);
    tmp.write(join('big', 'b-small.csv'), 'person,n\npA,1\npB,2\n');
    const result = await forgetPerson(dir, { ids: ['pA'], record: 'pA', at: '2025-04-01T10:00:00Z' });
    expect(result.changed).toEqual([{ file: 'b-small.csv', removed: 1 }]);
    expect(readFileSync(join(dir, 'a-big.csv'), 'utf8')).toBe(big);
    expect(readFileSync(join(dir, 'b-small.csv'), 'utf8')).toBe('person,n\npB,2\n');
  });
});

describe('createPersonRowFilter and removePersonFromJson', () => {
  const run = (filter: ReturnType<typeof createPersonRowFilter>, pieces: readonly string[]): string => pieces.map((p) => filter.push(p)).join('') + filter.end();
  it('keeps a CSV record whose quoted field spans lines together (RFC 4180 section 2 rule 6)', () => {
    const filter = createPersonRowFilter(new Set(['x']), 'csv');
    const out = run(filter, ['person,text\nx,"a\nb"\ny,"c\nd"\n"x","q ""x"", r"\nz,x\n']);
    expect(out).toBe('person,text\ny,"c\nd"\nz,x\n');
    expect(filter.removed).toBe(2);
  });
  it('gives the same text wherever the file is cut into pieces, inside quoted fields and CRLF line ends too (RFC 4180 section 2)', () => {
    const text = 'person,text\r\nx,"a, ""b""\r\nx,c"\r\ny,"d\re"\r\nx,f\r\ny,"g\nh, ""i"""';
    const expected = 'person,text\r\ny,"d\re"\r\ny,"g\nh, ""i"""';
    for (let cut = 0; cut <= text.length; cut++) {
      for (const second of [cut, Math.min(text.length, cut + 3)]) {
        const filter = createPersonRowFilter(new Set(['x']), 'csv');
        expect(run(filter, [text.slice(0, cut), text.slice(cut, second), text.slice(second)]), `cut at ${cut}, ${second}`).toBe(expected);
        expect(filter.removed).toBe(2);
      }
    }
  });
  it('matches a person id that the CSV writers neutralised as a formula cell (OWASP CSV Injection)', () => {
    const filter = createPersonRowFilter(new Set(['=p1', '-p2']), 'csv');
    const out = run(filter, ['person,words\n', `"'=p1",3\n"'-p2",4\np3,5\n"'=p1x",6\n`]);
    expect(out).toBe(`person,words\np3,5\n"'=p1x",6\n`);
    expect(filter.removed).toBe(2);
  });
  it('reads TSV and JSON Lines, and leaves a table without a person column alone', () => {
    const tsv = createPersonRowFilter(new Set(['x']), 'tsv');
    expect(run(tsv, ['person\tv\nx\t"1\ny\t2\n'])).toBe('person\tv\ny\t2\n');
    const jsonl = createPersonRowFilter(new Set(['x']), 'jsonl');
    expect(run(jsonl, ['{"person":"x"}\r\n{"pers', 'on":"y"}\r\nnot json\n{"person":"x"}'])).toBe('{"person":"y"}\r\nnot json\n');
    const none = createPersonRowFilter(new Set(['x']), 'csv');
    expect(run(none, ['id,v\nx,1\n'])).toBe('id,v\nx,1\n');
    expect(none.hasPersonColumn).toBe(false);
  });
  it('treats a top-level JSON object of the person as the whole document', () => {
    expect(removePersonFromJson({ person: 'x', n: 1 }, new Set(['x']))).toMatchObject({ wholeDocument: true });
  });
});
