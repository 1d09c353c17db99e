import { mkdirSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { ownTableFile } from '../../src/io/own-table-file.js';
import { collect, tempFolder } from '../support/temp-files.js';

const tmp = tempFolder('lexichron-own-table-');
for (const dir of ['a/validation', 'b', 'c']) mkdirSync(tmp.path(dir), { recursive: true });

/** A data package in `dir` as `--names syntactic` leaves it: renamed fields keep the original as title. */
function writePackage(dir: string, file: string, fields: { name: string; title?: string }[]): void {
  tmp.write(`${dir}/datapackage.json`, JSON.stringify({ names: { style: 'syntactic' }, resources: [{ path: file, schema: { fields } }] }));
}

describe('ownTableFile', () => {
  it('reads a renamed output with lexichron\'s names in the header, rows byte for byte, in chunks and at once', async () => {
    writePackage('a', 'validation/pairs.csv', [{ name: 'person' }, { name: 'afinn_165_valence', title: 'afinn-165.valence' }]);
    tmp.write('a/validation/pairs.csv', 'person,afinn_165_valence\r\np1,"1,5"\r\n');
    const file = await ownTableFile(tmp.path('a/validation/pairs.csv'));
    expect((await file.bytes()).toString('utf8')).toBe('person,afinn-165.valence\r\np1,"1,5"\r\n');
    expect(Buffer.concat(await collect(file.chunks())).toString('utf8')).toBe('person,afinn-165.valence\r\np1,"1,5"\r\n');
  });

  it('restores a header longer than one read chunk (64 KiB)', async () => {
    const names = Array.from({ length: 9000 }, (_, k) => `lex-${k}.cat`);
    const bare = names.map((n) => n.replace(/[-.]/g, '_'));
    writePackage('b', 'wide.csv', names.map((n, k) => ({ name: bare[k] as string, title: n })));
    tmp.write('b/wide.csv', `${bare.join(',')}\n${bare.map(() => '1').join(',')}\n`);
    const text = Buffer.concat(await collect((await ownTableFile(tmp.path('b/wide.csv'))).chunks())).toString('utf8');
    expect(text).toBe(`${names.join(',')}\n${names.map(() => '1').join(',')}\n`);
  });

  it('leaves a file no data package describes as it is, and a missing file fails as with tableFile', async () => {
    tmp.write('c/plain.csv', 'person,afinn_165_valence\np1,2\n');
    expect((await (await ownTableFile(tmp.path('c/plain.csv'))).bytes()).toString('utf8')).toBe('person,afinn_165_valence\np1,2\n');
    await expect((await ownTableFile(tmp.path('c/none.csv'))).check()).rejects.toThrow(/no such file/);
  });
});
