#!/usr/bin/env node
// Series memory against rows at a fixed number of bins: writes a synthetic scores file of R rows
// (1,000 persons × 365 daily bins in Europe/Brussels, rows spread evenly, so the bins stay the
// same whatever R is) and bins it with `lexichron series` in a child process, reporting its peak
// memory (VmHWM). Memory should stay flat as R grows (bins, not rows).
//
//   npm run build && node scripts/bench-series-rows.mjs 1000000 3000000 [10000000]
import { spawnSync } from 'node:child_process';
import { createWriteStream, mkdtempSync, rmSync, statSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { fileURLToPath } from 'node:url';

const root = fileURLToPath(new URL('..', import.meta.url));
const sizes = process.argv.slice(2).map(Number).filter((n) => n > 0);
if (sizes.length === 0) sizes.push(1_000_000, 3_000_000);
const PERSONS = 1000;
const DAYS = 365;
const start = Date.parse('2026-01-01T08:00:00Z');

async function writeScores(path, rows) {
  const out = createWriteStream(path);
  const write = (s) => (out.write(s) ? undefined : new Promise((r) => out.once('drain', r)));
  await write('entry_id,person,time_utc,zone,time_local,words,lab.calm,lab.calm.n\n');
  let seed = 12345;
  const rnd = () => ((seed = (seed * 1103515245 + 12345) % 2147483648) / 2147483648);
  let chunk = '';
  for (let i = 0; i < rows; i++) {
    const person = i % PERSONS;
    const day = Math.floor(((i / PERSONS) * DAYS * PERSONS) / rows) % DAYS;
    const t = new Date(start + day * 86_400_000 + Math.floor(rnd() * 12 * 3_600_000)).toISOString();
    chunk += `e${i},p${String(person).padStart(4, '0')},${t},Europe/Brussels,,${12 + (i % 20)},${(rnd() * 3).toFixed(3)},${i % 4}\n`;
    if (chunk.length > 1 << 20) {
      await write(chunk);
      chunk = '';
    }
  }
  await write(chunk);
  await new Promise((r) => out.end(r));
}

const dir = mkdtempSync(join(tmpdir(), 'lexichron-series-rows-'));
try {
  console.log('rows        bins       file MB  wall s  peak MB');
  for (const rows of sizes) {
    const scores = join(dir, 'scores.csv');
    await writeScores(scores, rows);
    const started = performance.now();
    const r = spawnSync('/usr/bin/time', ['-f', '%M', process.execPath, join(root, 'bin/lexichron.js'), 'series', scores, '--bin', '1d', '--min-words', '1', '--out', join(dir, 'series-long.csv')], { encoding: 'utf8' });
    const wall = (performance.now() - started) / 1000;
    if (r.status !== 0) throw new Error(r.stderr);
    const peakKb = Number(r.stderr.trim().split('\n').pop());
    const bins = /(\d+) bins/.exec(r.stderr)?.[1] ?? '?';
    console.log(`${String(rows).padEnd(12)}${bins.padEnd(11)}${(statSync(scores).size / 1e6).toFixed(0).padStart(7)}  ${wall.toFixed(1).padStart(6)}  ${(peakKb / 1024).toFixed(0).padStart(7)}`);
    rmSync(scores);
  }
} finally {
  rmSync(dir, { recursive: true, force: true });
}
