import { execFileSync, spawn, spawnSync } from 'node:child_process';
import { createHash } from 'node:crypto';
import { cpSync, existsSync, mkdirSync, readdirSync, readFileSync, statSync, symlinkSync, writeFileSync } from 'node:fs';
import { join, resolve } from 'node:path';
import { beforeAll, describe, expect, it } from 'vitest';
import { tempFolder } from '../support/temp-files.js';

// One run at a time, and never an output folder whose manifest describes files of another run
// (issue 18 item 8). Real child processes: a second `lexichron run`, and a run killed with SIGKILL.
const root = resolve(__dirname, '../..');
const bin = resolve(root, 'bin/lexichron.js');
const tmp = tempFolder('lexichron-exclusive-');
const out = tmp.path('out');

beforeAll(() => {
  if (!existsSync(resolve(root, 'dist/cli/main.js'))) execFileSync('npx', ['tsc', '-p', 'tsconfig.json'], { cwd: root, stdio: 'inherit' });
  cpSync(resolve(root, 'demo-data'), tmp.path('demo-data'), { recursive: true });
  // A smaller copy of the demo study: its first 1,000 messages, without dynamics, written to ../out.
  const messages = readFileSync(tmp.path('demo-data/messages.csv'), 'utf8').split('\n');
  writeFileSync(tmp.path('demo-data/messages.csv'), messages.slice(0, 1001).join('\n') + '\n');
  const study = JSON.parse(readFileSync(tmp.path('demo-data/study.json'), 'utf8')) as Record<string, unknown>;
  writeFileSync(tmp.path('demo-data/study.json'), JSON.stringify({ ...study, dynamics: false }));
});

interface Exit {
  code: number | null;
  signal: NodeJS.Signals | null;
  stderr: string;
}

function start(...args: string[]): { child: ReturnType<typeof spawn>; exit: Promise<Exit> } {
  const child = spawn(process.execPath, [bin, ...args], { cwd: tmp.dir, stdio: ['ignore', 'ignore', 'pipe'] });
  let stderr = '';
  child.stderr?.on('data', (chunk: Buffer) => (stderr += String(chunk)));
  const exit = new Promise<Exit>((done) => child.on('exit', (code, signal) => done({ code, signal, stderr })));
  return { child, exit };
}

async function until(test: () => boolean, timeoutMs: number): Promise<boolean> {
  const end = Date.now() + timeoutMs;
  while (Date.now() < end) {
    if (test()) return true;
    await new Promise((r) => setTimeout(r, 5));
  }
  return false;
}

const sha256 = (path: string): string => createHash('sha256').update(readFileSync(path)).digest('hex');

/** Files the manifest lists whose content is not what it records (none when there is no manifest). */
function mismatches(): string[] {
  if (!existsSync(join(out, 'manifest.json'))) return [];
  const manifest = JSON.parse(readFileSync(join(out, 'manifest.json'), 'utf8')) as { outputs: Array<{ path: string; sha256?: string; bytes?: number }> };
  return manifest.outputs.filter((o) => o.sha256 !== undefined && (!existsSync(join(out, o.path)) || sha256(join(out, o.path)) !== o.sha256 || statSync(join(out, o.path)).size !== o.bytes)).map((o) => o.path);
}

/** Leftovers of this tool in the output folder: temporaries, staging folders, the lock. */
function leftovers(dir = out): string[] {
  const found: string[] = [];
  for (const e of readdirSync(dir, { withFileTypes: true })) {
    if (/\.tmp$|^\.lexichron-/.test(e.name)) found.push(e.name);
    else if (e.isDirectory()) found.push(...leftovers(join(dir, e.name)));
  }
  return found;
}

describe('lexichron run holds its output folder alone and replaces outputs only when every stage has finished', () => {
  it('a second run on the same output folder exits 2 with a clear message while the first finishes', async () => {
    const first = start('run', 'demo-data/study.json');
    // The first run has started writing (its lock, or any file in the output folder).
    expect(await until(() => existsSync(out) && readdirSync(out).length > 0, 60_000)).toBe(true);
    const second = spawnSync(process.execPath, [bin, 'run', 'demo-data/study.json'], { cwd: tmp.dir, encoding: 'utf8' });
    const a = await first.exit;
    expect(a.code, a.stderr).toBe(0);
    expect(second.status, second.stderr).toBe(2);
    expect(second.stderr).toMatch(/another lexichron command \(process \d+, `lexichron run demo-data\/study\.json`\) is writing there/);
    expect(mismatches()).toEqual([]);
    expect(leftovers()).toEqual([]);
  }, 120_000);

  it('a run killed with SIGKILL at any stage never leaves a manifest that describes other files, and the next run cleans up', async () => {
    // The previous test left a complete output; this run has different input, so every output changes.
    const messages = readFileSync(tmp.path('demo-data/messages.csv'), 'utf8').split('\n');
    writeFileSync(tmp.path('demo-data/messages.csv'), messages.slice(0, 801).join('\n') + '\n');
    const before = new Map(['scores.csv', 'series-long.csv', 'manifest.json'].map((f) => [f, statSync(join(out, f)).mtimeMs]));
    const changed = (): boolean => [...before].some(([f, t]) => !existsSync(join(out, f)) || statSync(join(out, f)).mtimeMs !== t);
    const run = start('run', 'demo-data/study.json');
    // Killed as soon as any output in the folder changed (old code: scores.csv renamed into place
    // while the old manifest still describes the old one). Where exactly the kill lands depends on
    // the machine; test/io/staged-output.test.ts stops the commit at every one of its steps in turn.
    await until(changed, 60_000);
    run.child.kill('SIGKILL');
    const killed = await run.exit;
    // Killed during its commit or just after (a run that had already ended by then must have ended well).
    expect(killed.signal === 'SIGKILL' || killed.code === 0, killed.stderr).toBe(true);
    expect(mismatches()).toEqual([]);
    // The next run takes over the dead run's lock, removes its staging folder and temporaries.
    const next = spawnSync(process.execPath, [bin, 'run', 'demo-data/study.json'], { cwd: tmp.dir, encoding: 'utf8' });
    expect(next.status, next.stderr).toBe(0);
    expect(mismatches()).toEqual([]);
    expect(leftovers()).toEqual([]);
  }, 120_000);

  it('refuses an output folder that is a symbolic link unless --allow-symlinks (exit 2)', () => {
    mkdirSync(tmp.path('elsewhere'));
    writeFileSync(tmp.path('demo-data/linked.json'), JSON.stringify({ ...JSON.parse(readFileSync(tmp.path('demo-data/study.json'), 'utf8')), out: '../linked', lexicons: ['afinn-165'], audit: false, report: false, ratings: undefined }));
    symlinkSync(tmp.path('elsewhere'), tmp.path('linked'));
    const refused = spawnSync(process.execPath, [bin, 'run', 'demo-data/linked.json'], { cwd: tmp.dir, encoding: 'utf8' });
    expect(refused.status, refused.stderr).toBe(2);
    expect(refused.stderr).toContain('is a symbolic link');
    expect(readdirSync(tmp.path('elsewhere'))).toEqual([]);
    const allowed = spawnSync(process.execPath, [bin, 'run', 'demo-data/linked.json', '--allow-symlinks'], { cwd: tmp.dir, encoding: 'utf8' });
    expect(allowed.status, allowed.stderr).toBe(0);
    expect(readdirSync(tmp.path('elsewhere'))).toContain('manifest.json');
  }, 120_000);
});
