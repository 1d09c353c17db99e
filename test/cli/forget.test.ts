import { readFileSync } from 'node:fs';
import { join } from 'node:path';
import { describe, expect, it, vi } from 'vitest';
import { main } from '../../src/cli/main.js';
import { pseudonymizePerson } from '../../src/privacy/pseudonymize-person.js';
import { tempFolder } from '../support/temp-files.js';

const tmp = tempFolder();

describe('lexichron forget', () => {
  it('removes the pseudonymized person with the key from --pseudonym-key-file and records only the pseudonym', async () => {
    const key = 'a long random key for this study 7';
    const keyFile = tmp.write('key.txt', `${key}\n`);
    const pseudonym = pseudonymizePerson('P07', new TextEncoder().encode(key));
    tmp.write('scores.csv', `entry_id,person,words\n1,${pseudonym},3\n2,pzzzz,4\n`);
    let stderr = '';
    const spy = vi.spyOn(process.stderr, 'write').mockImplementation((chunk: string | Uint8Array) => {
      stderr += String(chunk);
      return true;
    });
    let code: number;
    try {
      code = await main(['node', 'lexichron', 'forget', 'P07', '--study', tmp.dir, '--pseudonym-key-file', keyFile]);
    } finally {
      spy.mockRestore();
    }
    expect(code).toBe(0);
    expect(stderr).toContain('removed 1 row(s) from scores.csv');
    expect(readFileSync(join(tmp.dir, 'scores.csv'), 'utf8')).toBe('entry_id,person,words\n2,pzzzz,4\n');
    const manifest = readFileSync(join(tmp.dir, 'manifest.json'), 'utf8');
    expect(JSON.parse(manifest).forgotten[0]).toMatchObject({ person: pseudonym, files: ['scores.csv'] });
    expect(JSON.parse(manifest).forgotten[0].at).toMatch(/^\d{4}-\d{2}-\d{2}T/);
    expect(manifest).not.toContain('P07');
    expect(manifest).not.toContain(key);
  });
});
