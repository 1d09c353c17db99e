import { createHash } from 'node:crypto';
import { cpSync, lstatSync, mkdirSync, readdirSync, readFileSync, rmSync, symlinkSync, writeFileSync } from 'node:fs';
import { join } from 'node:path';
import Papa from 'papaparse';
import { beforeAll, describe, expect, it } from 'vitest';
import { runStudy } from '../../src/pipeline.js';
import { pseudonymizePerson } from '../../src/privacy/pseudonymize-person.js';
import { runCli } from '../support/run-cli.js';
import { tempFolder } from '../support/temp-files.js';

// Withdrawal of consent: the right to erasure, GDPR (Regulation (EU) 2016/679) Art. 17. `forget`
// must remove the person, every trace of the person that it can edit, and nothing else (issue 18 item 3).
const tmp = tempFolder('lexichron-forget-');
const KEY = 'a-study-key-kept-apart-from-the-data';

/** Every regular file under `dir` with its bytes (symbolic links as `-> target`). */
function snapshot(dir: string): Map<string, string> {
  const files = new Map<string, string>();
  const walk = (sub: string): void => {
    for (const e of readdirSync(join(dir, sub), { withFileTypes: true })) {
      const rel = sub ? `${sub}/${e.name}` : e.name;
      if (e.isSymbolicLink()) files.set(rel, '-> link');
      else if (e.isDirectory()) walk(rel);
      else files.set(rel, readFileSync(join(dir, rel), 'latin1'));
    }
  };
  walk('');
  return files;
}

const rowsOf = (csv: string): Array<Record<string, string>> => Papa.parse<Record<string, string>>(csv, { header: true, skipEmptyLines: true }).data;
const sha256 = (path: string): string => createHash('sha256').update(readFileSync(path)).digest('hex');

beforeAll(async () => {
  const rows = ['person,time,text'];
  for (let d = 1; d <= 9; d++) for (const p of ['ana', 'ben', 'cleo']) rows.push(`${p},2026-03-0${d}T10:00:00+01:00,a good day and a long bad night number ${d}`);
  tmp.write('texts.csv', rows.join('\n') + '\n');
  tmp.write('ratings.csv', ['person,time,mood', ...['ana', 'ben', 'cleo'].flatMap((p) => [1, 2, 3, 4, 5, 6, 7, 8, 9].map((d) => `${p},2026-03-0${d}T20:00:00+01:00,${(d * 7) % 10}`))].join('\n') + '\n');
  tmp.write('key.txt', KEY);
  const base = { timeZone: 'Europe/Brussels', lexicons: ['afinn-165'], ratings: { path: 'ratings.csv', scales: { mood: [0, 10] } }, dynamics: false, audit: false, report: false };
  tmp.write('plain.json', JSON.stringify({ ...base, inputs: ['texts.csv'], out: 'plain' }));
  tmp.write('keyed.json', JSON.stringify({ ...base, inputs: ['texts.csv'], privacy: { keyFile: 'key.txt' }, out: 'keyed' }));
  await runStudy(tmp.path('plain.json'), { now: '2026-12-01T00:00:00.000Z', seed: 1 });
  await runStudy(tmp.path('keyed.json'), { now: '2026-12-01T00:00:00.000Z', seed: 1 });
}, 120_000);

/** A fresh copy of a study's output folder. */
function copy(from: string, name: string): string {
  const dir = tmp.path(name);
  rmSync(dir, { recursive: true, force: true });
  cpSync(tmp.path(from), dir, { recursive: true });
  return dir;
}

describe('lexichron forget removes a person and only a person (GDPR Art. 17)', () => {
  it('an id that is no person (a word of a file name or of a column) changes nothing and exits 3', async () => {
    const dir = copy('plain', 'words');
    const before = snapshot(dir);
    for (const word of ['long', 'scores', 'manifest', 'series', 'csv', 'validation', 'words', 'mood', 'person']) {
      const r = await runCli('forget', word, '--study', dir);
      expect(r.code, `${word}: ${r.stderr}`).toBe(3);
      expect(r.stderr).toContain('nothing was removed');
      expect(snapshot(dir), word).toEqual(before);
    }
  });

  it('removes every row of the person, keeps every other row, and updates the manifest\'s hashes and sizes of rewritten files', async () => {
    const dir = copy('plain', 'ana');
    const before = snapshot(dir);
    const r = await runCli('forget', 'ana', '--study', dir);
    expect(r.code, r.stderr).toBe(0);
    const after = snapshot(dir);
    expect([...after.keys()].sort()).toEqual([...before.keys()].sort()); // no file deleted by its name
    let removedRows = 0;
    for (const [file, text] of before) {
      if (!file.endsWith('.csv')) continue;
      const old = rowsOf(text);
      const kept = rowsOf(after.get(file) as string);
      if ('person' in (old[0] ?? {})) {
        expect(kept.filter((row) => row.person === 'ana'), file).toEqual([]);
        expect(kept, file).toEqual(old.filter((row) => row.person !== 'ana'));
        removedRows += old.length - kept.length;
      } else expect(after.get(file), file).toBe(text);
    }
    expect(removedRows).toBeGreaterThan(9);
    const manifest = JSON.parse(readFileSync(join(dir, 'manifest.json'), 'utf8')) as { outputs: Array<{ path: string; sha256?: string; bytes?: number }>; forgotten: Array<{ files: string[] }> };
    const hashed = manifest.outputs.filter((o) => o.sha256 !== undefined);
    expect(hashed.length).toBeGreaterThan(8);
    for (const o of hashed) {
      expect(o.sha256, o.path).toBe(sha256(join(dir, o.path)));
      expect(o.bytes, o.path).toBe(lstatSync(join(dir, o.path)).size);
    }
    expect(manifest.forgotten).toHaveLength(1);
    expect(manifest.forgotten[0]?.files).toContain('scores.csv');
    // Forgetting again finds nobody, records nothing and exits 3.
    const settled = snapshot(dir);
    expect((await runCli('forget', 'ana', '--study', dir)).code).toBe(3);
    expect(snapshot(dir)).toEqual(settled);
  });

  it('matches the pseudonym made with the key, not the raw id as text', async () => {
    const dir = copy('keyed', 'keyed-ana');
    const ana = pseudonymizePerson('ana', Buffer.from(KEY));
    const r = await runCli('forget', 'ana', '--study', dir, '--pseudonym-key-file', tmp.path('key.txt'));
    expect(r.code, r.stderr).toBe(0);
    for (const [file, text] of snapshot(dir)) if (file !== 'manifest.json') expect(text.includes(ana), file).toBe(false);
    // The manifest keeps the pseudonym only in its record of the withdrawal.
    const { forgotten, ...rest } = JSON.parse(readFileSync(join(dir, 'manifest.json'), 'utf8')) as { forgotten: Array<{ person: string }> };
    expect(JSON.stringify(rest)).not.toContain(ana);
    expect(forgotten.map((f) => f.person)).toEqual([ana]);
    // The pseudonym itself, given with the key, is a raw id to pseudonymize: nobody has that id.
    const cleo = pseudonymizePerson('cleo', Buffer.from(KEY));
    const before = snapshot(dir);
    expect((await runCli('forget', cleo, '--study', dir, '--pseudonym-key-file', tmp.path('key.txt'))).code).toBe(3);
    expect(snapshot(dir)).toEqual(before);
  });

  it('scans every regular file, names every symbolic link without following it, and removes stale temporaries', async () => {
    const dir = copy('plain', 'extras');
    const outside = tmp.write('outside.csv', 'person,note\nana,kept outside\n');
    symlinkSync(outside, join(dir, 'linked.csv'));
    writeFileSync(join(dir, 'notes.log'), 'ana wrote to us on Monday\n');
    writeFileSync(join(dir, 'ana-plot.svg'), '<svg></svg>\n'); // a name is not a person value: kept
    mkdirSync(join(dir, 'extra'));
    writeFileSync(join(dir, 'extra', 'table'), 'person,v\nana,1\nben,2\n'); // no extension: scanned all the same
    writeFileSync(join(dir, 'scores.csv.lexichron-999999999-abc.tmp'), 'entry_id,person\nx,ana\n'); // left by a killed run
    const r = await runCli('forget', 'ana', '--study', dir);
    expect(r.code, r.stderr).toBe(0);
    expect(readFileSync(outside, 'utf8')).toBe('person,note\nana,kept outside\n');
    expect(r.stderr).toMatch(/symbolic link.*linked\.csv/);
    expect(r.stderr).toMatch(/notes\.log/);
    expect(r.stderr).toMatch(/extra\/table/);
    expect(readFileSync(join(dir, 'ana-plot.svg'), 'utf8')).toBe('<svg></svg>\n');
    expect(readdirSync(dir).filter((f) => f.endsWith('.tmp'))).toEqual([]);
  });
});
