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
});

describe('createPersonRowFilter and removePersonFromJson', () => {
  it('keeps a CSV record whose quoted field spans lines together (RFC 4180 section 2 rule 6)', () => {
    const filter = createPersonRowFilter(new Set(['x']), 'csv');
    const out = ['person,text', 'x,"a', 'b"', 'y,"c', 'd"', '"x","q ""x"", r"', 'z,x'].flatMap((l) => filter.push(l));
    expect(out).toEqual(['person,text', 'y,"c', 'd"', 'z,x']);
    expect(filter.removed).toBe(2);
  });
  it('matches a person id that the CSV writers neutralised as a formula cell (OWASP CSV Injection)', () => {
    const filter = createPersonRowFilter(new Set(['=p1', '-p2']), 'csv');
    const out = ['person,words', `"'=p1",3`, `"'-p2",4`, 'p3,5', `"'=p1x",6`].flatMap((l) => filter.push(l));
    expect(out).toEqual(['person,words', 'p3,5', `"'=p1x",6`]);
    expect(filter.removed).toBe(2);
  });
  it('reads TSV and leaves a table without a person column alone', () => {
    const tsv = createPersonRowFilter(new Set(['x']), 'tsv');
    expect(['person\tv', 'x\t1', 'y\t2'].flatMap((l) => tsv.push(l))).toEqual(['person\tv', 'y\t2']);
    const none = createPersonRowFilter(new Set(['x']), 'csv');
    expect(['id,v', 'x,1'].flatMap((l) => none.push(l))).toEqual(['id,v', 'x,1']);
    expect(none.hasPersonColumn).toBe(false);
  });
  it('treats a top-level JSON object of the person as the whole document', () => {
    expect(removePersonFromJson({ person: 'x', n: 1 }, new Set(['x']))).toMatchObject({ wholeDocument: true });
  });
});
