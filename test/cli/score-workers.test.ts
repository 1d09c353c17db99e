import { execFileSync, spawnSync } from 'node:child_process';
import { existsSync, readFileSync } from 'node:fs';
import { resolve } from 'node:path';
import { beforeAll, describe, expect, it } from 'vitest';
import { tempFolder } from '../support/temp-files.js';

const root = resolve(__dirname, '../..');
const bin = resolve(root, 'bin/lexichron.js');
const tmp = tempFolder();

beforeAll(() => {
  // The workers run the compiled code in dist/ (npm test builds it first).
  if (!existsSync(resolve(root, 'dist/io/score-worker.js'))) execFileSync('npx', ['tsc', '-p', 'tsconfig.json'], { cwd: root, stdio: 'inherit' });
});

function score(workers: string, out: string): void {
  const r = spawnSync(process.execPath, [bin, 'score', tmp.path('in.csv'), '--time-zone', 'Europe/Brussels', '-l', 'afinn-165', '-l', 'vader', '-l', 'daily-constructs', '--workers', workers, '-o', tmp.path(out)], { encoding: 'utf8' });
  expect(r.status, r.stderr).toBe(0);
}

describe('scoring threads', () => {
  it('give byte-identical scores, in input order, with 0, 1 and 3 worker threads', () => {
    // With pieces whose split by wink-nlp depends on the words it met before (`'em` after
    // `e.g.'em`, `don’twell...` after `don’twell`): each thread meets them in another order.
    // And pieces that VADER splits further (it splits on every whitespace character, wink on
    // some), a piece too long to be memoised, and runs of line breaks.
    const words = ['great', 'awful', 'not', 'happy', 'worried', 'tired', 'friends', 'the', 'day', 'SO', 'good', '!', ':)', 'but', 'kind of', 'sad', "e.g.'em", "'em", 'don’twell', 'don’twell...', 'good\u2028bad', 'so\u3000happy', `${'x'.repeat(300)}great`, 'fine\n\n\nnot'];
    const rows = ['id,person,time,text'];
    for (let i = 0; i < 3000; i++) {
      const text = Array.from({ length: 4 + (i % 9) }, (_, k) => words[(i * 7 + k * 5) % words.length]).join(' ');
      rows.push(`e${i},p${i % 17},2026-03-${String(1 + (i % 28)).padStart(2, '0')}T${String(8 + (i % 12)).padStart(2, '0')}:00:00+01:00,"${text}"`);
    }
    tmp.write('in.csv', rows.join('\n') + '\n');
    score('0', 'w0.csv');
    score('1', 'w1.csv');
    score('3', 'w3.csv');
    const w0 = readFileSync(tmp.path('w0.csv'), 'utf8');
    expect(w0.trim().split('\n')).toHaveLength(3001);
    expect(readFileSync(tmp.path('w1.csv'), 'utf8')).toBe(w0);
    expect(readFileSync(tmp.path('w3.csv'), 'utf8')).toBe(w0);
  });

  it('ends promptly when the thread started before the command line was read is not wanted (--workers 0, a usage error, --help)', () => {
    // `lexichron score` starts one scoring thread first thing (src/cli/main.ts); a run that ends
    // without a pool taking it must not be kept alive by it.
    tmp.write('small.csv', 'id,person,time,text\ne1,p1,2026-03-01T08:00:00+01:00,fine\n');
    const run = (...args: string[]) => spawnSync(process.execPath, [bin, 'score', ...args], { encoding: 'utf8', timeout: 30_000 });
    const none = run(tmp.path('small.csv'), '--time-zone', 'UTC', '--workers', '0', '-o', tmp.path('small-out.csv'));
    expect(none.error).toBeUndefined();
    expect(none.status, none.stderr).toBe(0);
    expect(readFileSync(tmp.path('small-out.csv'), 'utf8').split('\n')[1]).toMatch(/^e1,p1,/);
    tmp.write('no-offset.csv', 'id,person,time,text\ne1,p1,2026-03-01 08:00,fine\n');
    const usage = run(tmp.path('no-offset.csv'), '-o', tmp.path('x.csv'));
    expect(usage.error).toBeUndefined();
    expect(usage.status).toBe(2);
    expect(usage.stderr).toContain('No time zone given');
    const help = run('--help');
    expect(help.error).toBeUndefined();
    expect(help.status).toBe(0);
    expect(help.stdout).toContain('--workers');
  });

  it('stops the threads it started when a lexicon cannot be loaded (the command ends with its message instead of hanging)', () => {
    tmp.write('one.csv', 'id,person,time,text\ne1,p1,2026-03-01T08:00:00+01:00,fine\n');
    const r = spawnSync(process.execPath, [bin, 'score', tmp.path('one.csv'), '--time-zone', 'UTC', '-l', 'no-such-lexicon', '--workers', '2', '-o', tmp.path('none.csv')], { encoding: 'utf8', timeout: 30_000 });
    expect(r.error).toBeUndefined();
    expect(r.status).toBe(2);
    expect(r.stderr).toContain('no-such-lexicon');
  });

  it('rejects a --workers value that is not auto or a small whole number', () => {
    const r = spawnSync(process.execPath, [bin, 'score', 'x.csv', '--time-zone', 'UTC', '--workers', 'many', '-o', tmp.path('x.csv')], { encoding: 'utf8' });
    expect(r.status).toBe(2);
    expect(r.stderr).toContain('--workers `many` must be auto or a whole number');
  });
});
