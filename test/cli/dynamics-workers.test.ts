import { execFileSync, spawnSync } from 'node:child_process';
import { existsSync, readFileSync } from 'node:fs';
import { resolve } from 'node:path';
import { beforeAll, describe, expect, it } from 'vitest';
import { crossMapProgress, formatDuration, longRunWarning, progressLine } from '../../src/cli/cross-map-progress.js';
import { tempFolder } from '../support/temp-files.js';
import { syntheticPersons } from '../dynamics/synthetic-series.js';

const root = resolve(__dirname, '../..');
const bin = resolve(root, 'bin/lexichron.js');
const tmp = tempFolder();

beforeAll(() => {
  // The workers run the compiled code in dist/ (npm test builds it first).
  if (!existsSync(resolve(root, 'dist/io/ccm-worker.js'))) execFileSync('npx', ['tsc', '-p', 'tsconfig.json'], { cwd: root, stdio: 'inherit' });
});

function seriesCsv(): string {
  const lines = ['person,t,bin_of_day,missing,lag_valid,mood,tone'];
  for (const p of syntheticPersons(3, 150)) {
    p.t.forEach((t) => {
      const mood = p.values['mood']![t];
      const tone = p.values['tone']![t];
      lines.push([p.person, t, p.binOfDay![t], mood === undefined ? 'no_text' : '', p.lagValid[t] ? 1 : 0, mood ?? '', tone ?? ''].join(','));
    });
  }
  return lines.join('\n') + '\n';
}

describe('cross-mapping threads', () => {
  it('give byte-identical dynamics files with 0 and 2 worker threads', () => {
    const input = tmp.write('series-long.csv', seriesCsv());
    const run = (workers: string) => {
      const r = spawnSync(process.execPath, [bin, 'dynamics', input, '--out', tmp.path(`w${workers}`), '--libraries', '5', '--surrogates', '9', '--library-sizes', '4', '--workers', workers], { encoding: 'utf8' });
      expect(r.status, r.stderr).toBe(0);
    };
    run('0');
    run('2');
    for (const file of ['dynamics-ccm.csv', 'dynamics-ccm-skill.csv', 'dynamics.json']) {
      expect(readFileSync(tmp.path(`w2/${file}`), 'utf8')).toBe(readFileSync(tmp.path(`w0/${file}`), 'utf8'));
    }
    expect(readFileSync(tmp.path('w0/dynamics-ccm.csv'), 'utf8').trim().split('\n')).toHaveLength(7);
  });
});

describe('cross-mapping progress on stderr', () => {
  it('warns before a run estimated at a minute or more, with what to do, and says nothing before a short one', () => {
    expect(longRunWarning({ kind: 'start', persons: 200, directions: 6, workers: 2, estimatedSeconds: 1100 })).toBe(
      'Warning: cross mapping 200 persons × 6 directions will take about 18 min 20 s with 2 worker threads (a rough estimate). To do less, name pairs with --pair, lower --surrogates or --libraries, or skip it with --no-cross-mapping.\n',
    );
    expect(longRunWarning({ kind: 'start', persons: 2, directions: 2, workers: 0, estimatedSeconds: 12 })).toBeUndefined();
  });

  it('shows persons done, time so far and time left at the rate so far', () => {
    expect(progressLine(10, 200, 90_000)).toBe('cross mapping: 10 of 200 persons, 1 min 30 s so far, about 28 min 30 s left');
    expect(progressLine(200, 200, 3_600_000 + 300_000)).toBe('cross mapping: 200 of 200 persons, 1 h 05 min so far');
    expect(formatDuration(59.6)).toBe('1 min');
  });

  it('writes a line every tenth of the persons when stderr is not a terminal (a log file or a pipe)', () => {
    let written = '';
    const stream = { isTTY: false, write: (s: string) => ((written += s), true) } as unknown as NodeJS.WriteStream;
    const report = crossMapProgress(stream);
    report({ kind: 'start', persons: 20, directions: 6, workers: 2, estimatedSeconds: 120 });
    for (let done = 1; done <= 20; done++) report({ kind: 'person', done, total: 20, elapsedMs: done * 1000 });
    const lines = written.trim().split('\n');
    expect(lines[0]).toMatch(/^Warning: cross mapping 20 persons × 6 directions will take about 2 min/);
    expect(lines.slice(1)).toHaveLength(10);
    expect(lines[lines.length - 1]).toBe('cross mapping: 20 of 20 persons, 20 s so far');
  });
});
