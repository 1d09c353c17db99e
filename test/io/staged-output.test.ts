import { spawnSync } from 'node:child_process';
import { createHash } from 'node:crypto';
import { existsSync, mkdirSync, readdirSync, readFileSync, utimesSync, writeFileSync } from 'node:fs';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { lockOutputFolder, LOCK_NAME } from '../../src/io/lock-output-folder.js';
import { openStagedOutput } from '../../src/io/staged-output.js';
import { tempFolder } from '../support/temp-files.js';

const tmp = tempFolder('lexichron-staged-');

function folder(name: string, files: Record<string, string>): string {
  const dir = tmp.path(name);
  mkdirSync(dir, { recursive: true });
  for (const [file, text] of Object.entries(files)) {
    mkdirSync(join(dir, file, '..'), { recursive: true });
    writeFileSync(join(dir, file), text);
  }
  return dir;
}

describe('openStagedOutput', () => {
  it('replaces same-named outputs on commit, merges sub-folders file by file and leaves other files alone', async () => {
    const dir = folder('commit', { 'scores.csv': 'old', 'manifest.json': 'old', 'notes.txt': 'mine', 'validation/a.csv': 'old', 'validation/keep.csv': 'mine' });
    const staged = await openStagedOutput(dir, ['report.html', 'manifest.json']);
    expect(existsSync(join(dir, 'manifest.json'))).toBe(true); // nothing changes before the commit
    for (const [file, text] of Object.entries({ 'scores.csv': 'new', 'manifest.json': 'new', 'report.html': 'new', 'validation/a.csv': 'new', 'dynamics/d.csv': 'new' })) {
      mkdirSync(join(staged.dir, file, '..'), { recursive: true });
      writeFileSync(join(staged.dir, file), text);
    }
    expect(readFileSync(join(dir, 'scores.csv'), 'utf8')).toBe('old');
    await staged.commit();
    const read = (f: string): string => readFileSync(join(dir, f), 'utf8');
    expect([read('scores.csv'), read('manifest.json'), read('report.html'), read('validation/a.csv'), read('dynamics/d.csv')]).toEqual(['new', 'new', 'new', 'new', 'new']);
    expect([read('notes.txt'), read('validation/keep.csv')]).toEqual(['mine', 'mine']);
    expect(readdirSync(dir).filter((f) => f.startsWith('.lexichron'))).toEqual([]);
  });

  it('abort removes the staging folder and leaves the output folder as it was', async () => {
    const dir = folder('abort', { 'scores.csv': 'old' });
    const staged = await openStagedOutput(dir, ['manifest.json']);
    writeFileSync(join(staged.dir, 'scores.csv'), 'new');
    await staged.abort();
    expect(readdirSync(dir)).toEqual(['scores.csv']);
    expect(readFileSync(join(dir, 'scores.csv'), 'utf8')).toBe('old');
  });
});

/** A manifest listing each file with its SHA-256, as the study runner writes one. */
function manifestOf(files: Record<string, string>): string {
  return JSON.stringify({ outputs: Object.entries(files).map(([path, text]) => ({ path, sha256: createHash('sha256').update(text).digest('hex') })) });
}

/** Files the folder's manifest lists whose content is not what it records (none when there is no manifest). */
function mismatches(dir: string): string[] {
  if (!existsSync(join(dir, 'manifest.json'))) return [];
  const manifest = JSON.parse(readFileSync(join(dir, 'manifest.json'), 'utf8')) as { outputs: Array<{ path: string; sha256: string }> };
  return manifest.outputs.filter((o) => !existsSync(join(dir, o.path)) || createHash('sha256').update(readFileSync(join(dir, o.path))).digest('hex') !== o.sha256).map((o) => o.path);
}

describe('openStagedOutput stopped at any step of its commit', () => {
  // A killed process stops between two file-system calls; the commit's step hook stops it at
  // each of them in turn, so every interruption point is checked on every run (issue 18 item 8).
  const old = { 'scores.csv': 'old scores', 'series-long.csv': 'old series', 'validation/a.csv': 'old a', 'sub/x.csv': 'old x' };
  const fresh = { 'scores.csv': 'new scores', 'series-long.csv': 'new series', 'validation/a.csv': 'new a', 'dynamics/d.csv': 'new d', sub: 'now a file' };

  it('never leaves a manifest that describes files of another run, whichever step it stops at', async () => {
    let completed = false;
    for (let stopAt = 0; !completed && stopAt < 50; stopAt++) {
      const dir = folder(`stop-${stopAt}`, { ...old, 'manifest.json': manifestOf(old), 'report.html': 'old report' });
      const staged = await openStagedOutput(dir, ['report.html', 'manifest.json']);
      for (const [file, text] of Object.entries({ ...fresh, 'manifest.json': manifestOf(fresh), 'report.html': 'new report' })) {
        mkdirSync(join(staged.dir, file, '..'), { recursive: true });
        writeFileSync(join(staged.dir, file), text);
      }
      const stopped = await staged.commit((step) => {
        if (step === stopAt) throw new Error(`stopped at step ${step}`);
      }).then(() => false, () => true);
      expect(mismatches(dir), `stopped at step ${stopAt}`).toEqual([]);
      if (!stopped) {
        completed = true;
        // The commit has 2 removals of describing files, 6 moves/replacements and 2 describing files put last.
        expect(stopAt).toBe(10);
        expect(JSON.parse(readFileSync(join(dir, 'manifest.json'), 'utf8'))).toEqual(JSON.parse(manifestOf(fresh)));
      }
    }
    expect(completed).toBe(true);
  });
});

describe('lockOutputFolder', () => {
  it('lets one holder in at a time and frees the folder on release', async () => {
    const dir = folder('lock', {});
    const lock = await lockOutputFolder(dir, 'lexichron run a.json');
    await expect(lockOutputFolder(dir, 'lexichron run b.json')).rejects.toThrow(/another lexichron command \(process \d+, `lexichron run a\.json`\) is writing there/);
    await lock.release();
    expect(existsSync(join(dir, LOCK_NAME))).toBe(false);
    await (await lockOutputFolder(dir, 'lexichron run b.json')).release();
  });

  it('takes over the lock of a process that is gone, and of a lock that cannot be read after a minute, but not of a fresh unreadable one', async () => {
    const dir = folder('stale', {});
    const gone = spawnSync(process.execPath, ['-e', '0']).pid as number;
    writeFileSync(join(dir, LOCK_NAME), JSON.stringify({ pid: gone, command: 'lexichron run killed.json' }));
    await (await lockOutputFolder(dir, 'lexichron run next.json')).release();
    writeFileSync(join(dir, LOCK_NAME), ''); // a writer that died between creating and filling it, or one still starting
    await expect(lockOutputFolder(dir, 'x')).rejects.toThrow(/a process that is starting/);
    const old = new Date(Date.now() - 120_000);
    utimesSync(join(dir, LOCK_NAME), old, old);
    await (await lockOutputFolder(dir, 'x')).release();
  });
});
