import { execFileSync, spawn, spawnSync } from 'node:child_process';
import { existsSync, mkdirSync, readdirSync, writeFileSync } from 'node:fs';
import { resolve } from 'node:path';
import { beforeAll, describe, expect, it } from 'vitest';
import { writeFileAtomic } from '../../src/io/atomic-write.js';
import { removeStaleTemporaries, temporaryOwner } from '../../src/io/own-temporaries.js';
import { tempFolder } from '../support/temp-files.js';

// Interrupted writes must not leave participants' data behind in temporary files (issue 18 item 4).
const root = resolve(__dirname, '../..');
const bin = resolve(root, 'bin/lexichron.js');
const tmp = tempFolder('lexichron-temps-');

beforeAll(() => {
  if (!existsSync(resolve(root, 'dist/cli/main.js'))) execFileSync('npx', ['tsc', '-p', 'tsconfig.json'], { cwd: root, stdio: 'inherit' });
});

/** A child that opens an atomic line writer in `dir`, writes a few lines and waits to be stopped. */
function writerChild(dir: string, onSignals: boolean): ReturnType<typeof spawn> {
  const script = `
    import { openAtomicLineWriter } from ${JSON.stringify(resolve(root, 'dist/io/atomic-write.js'))};
    import { removeTemporariesOnSignals } from ${JSON.stringify(resolve(root, 'dist/io/own-temporaries.js'))};
    ${onSignals ? 'removeTemporariesOnSignals();' : ''}
    const w = await openAtomicLineWriter(${JSON.stringify(resolve(dir, 'scores.csv'))});
    for (let i = 0; i < 1000; i++) await w.write('p07,a private line ' + i);
    await w.write('x'.repeat(2_000_000)); // more than the buffer: goes to the file
    await new Promise((r) => setTimeout(r, 100));
    process.stdout.write('ready\\n');
    setInterval(() => {}, 1000);`;
  return spawn(process.execPath, ['--input-type=module', '-e', script], { stdio: ['ignore', 'pipe', 'inherit'] });
}

async function untilReady(child: ReturnType<typeof spawn>): Promise<void> {
  await new Promise<void>((done, fail) => {
    child.stdout?.on('data', (chunk: Buffer) => (String(chunk).includes('ready') ? done() : undefined));
    child.on('exit', () => fail(new Error('the writer child ended early')));
  });
}

async function stop(child: ReturnType<typeof spawn>, signal: NodeJS.Signals): Promise<number | null> {
  const ended = new Promise<number | null>((done) => child.on('exit', (code, sig) => done(code ?? (sig === 'SIGKILL' ? -9 : null))));
  child.kill(signal);
  return ended;
}

const temporaries = (dir: string): string[] => readdirSync(dir).filter((f) => f.endsWith('.tmp'));

describe('temporary files of interrupted writes', () => {
  it('a write killed with SIGKILL leaves a temporary that the next command writing to the folder removes', async () => {
    const dir = tmp.path('killed');
    mkdirSync(dir);
    const child = writerChild(dir, false);
    await untilReady(child);
    expect(await stop(child, 'SIGKILL')).toBe(-9);
    expect(temporaries(dir)).toHaveLength(1); // SIGKILL cannot be caught: the temporary stays until the next start
    writeFileSync(resolve(dir, 'in.csv'), 'person,time,text\np01,2026-03-01T10:00:00Z,a good day\n');
    const r = spawnSync(process.execPath, [bin, 'score', resolve(dir, 'in.csv'), '--time-zone', 'UTC', '-l', 'afinn-165', '--workers', '0', '-o', resolve(dir, 'scores.csv')], { encoding: 'utf8' });
    expect(r.status, r.stderr).toBe(0);
    expect(temporaries(dir)).toEqual([]);
  }, 30_000);

  it('a write stopped with SIGTERM or SIGINT removes its own temporary before the process ends', async () => {
    for (const signal of ['SIGTERM', 'SIGINT'] as const) {
      const dir = tmp.path(`stopped-${signal}`);
      mkdirSync(dir);
      const child = writerChild(dir, true);
      await untilReady(child);
      expect(await stop(child, signal)).toBe(signal === 'SIGTERM' ? 143 : 130);
      expect(temporaries(dir)).toEqual([]);
    }
  }, 30_000);

  it('removes only this tool\'s temporaries whose process is gone, never a running writer\'s or another file', async () => {
    const dir = tmp.path('mixed');
    mkdirSync(resolve(dir, 'sub'), { recursive: true });
    const gone = spawnSync(process.execPath, ['-e', '0']).pid as number; // a process that has ended
    const files = {
      stale: `scores.csv.lexichron-${gone}-abc123.tmp`,
      staleStage: `.lexichron-stage-${gone}-x1`,
      running: `scores.csv.lexichron-${process.pid}-def456.tmp`,
      notOurs: 'notes.tmp',
      lookalike: `scores.csv.${gone}.abc.tmp`,
      subStale: `sub/a.json.lexichron-${gone}-q.tmp`,
    };
    for (const f of Object.values(files)) writeFileSync(resolve(dir, f), 'x');
    expect(temporaryOwner(files.stale)).toBe(gone);
    expect(temporaryOwner(files.notOurs)).toBeUndefined();
    await writeFileAtomic(resolve(dir, 'manifest.json'), '{}\n'); // the first write into a folder cleans it (not its sub-folders)
    expect(readdirSync(dir).sort()).toEqual([files.lookalike, 'manifest.json', files.notOurs, files.running, 'sub'].sort());
    expect(readdirSync(resolve(dir, 'sub'))).toEqual([files.subStale.slice(4)]);
    expect(await removeStaleTemporaries(dir, { recursive: true })).toEqual([resolve(dir, files.subStale)]);
  });
});
