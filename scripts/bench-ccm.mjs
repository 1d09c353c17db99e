// Benchmark of convergent cross mapping (run after `npx tsc`; reads dist/). `npm run bench` runs it.
//
// 1. One pair of 2,000-point series (the coupled logistic map of Sugihara et al. 2012), both
//    directions, 50 library sizes × 100 random libraries, 99 phase-randomised and 99 seasonal
//    surrogates, E chosen by simplex forecast skill, in this thread.
// 2. Study scale: `lexichron dynamics` on an invented series file of P persons × 2,016 hourly bins
//    (twelve weeks) × 3 variables (default options: every pair, 10 library sizes × 100 libraries,
//    99 surrogates of each kind), in a child process once with --workers 0 and once with the
//    default (auto), interleaved for --rounds; prints wall and CPU times and the ratio of the
//    single-thread wall time to the threaded one.
//
//   node scripts/bench-ccm.mjs                  # P = 6, 1 round
//   node scripts/bench-ccm.mjs --persons 200    # the full study of issue 20 (about 20 min per run here)
import { spawnSync } from 'node:child_process';
import { existsSync, mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { fileURLToPath } from 'node:url';
import { convergentCrossMapping } from '../dist/dynamics/convergent-cross-mapping.js';
import { random } from '../dist/stats/random.js';

const root = fileURLToPath(new URL('..', import.meta.url));
const arg = (name, fallback) => {
  const i = process.argv.indexOf(name);
  return i >= 0 ? Number(process.argv[i + 1]) : fallback;
};
const personsCount = arg('--persons', 6);
const rounds = arg('--rounds', 1);

// ---------------------------------------------------------------- 1. one pair, in this thread
{
  const n = 2000;
  const x = [0.4];
  const y = [0.2];
  for (let t = 1; t < n; t++) {
    const xp = x[t - 1];
    const yp = y[t - 1];
    x.push(xp * (3.8 - 3.8 * xp - 0.02 * yp));
    y.push(yp * (3.5 - 3.5 * yp - 0.1 * xp));
  }
  const lagValid = x.map((_, t) => t > 0);
  const phase = x.map((_, t) => t % 24);
  const options = { librarySizeCount: 50, samples: 100, surrogates: 99, minLibrarySize: 10 };
  const started = performance.now();
  const cpuStarted = process.cpuUsage();
  const results = [
    ['x xmap y (y -> x)', convergentCrossMapping({ values: x, lagValid, phase }, { values: y, lagValid, phase }, options, random(1))],
    ['y xmap x (x -> y)', convergentCrossMapping({ values: y, lagValid, phase }, { values: x, lagValid, phase }, options, random(2))],
  ];
  const seconds = (performance.now() - started) / 1000;
  const cpu = process.cpuUsage(cpuStarted);
  for (const [label, r] of results) {
    console.log(`${label}: E=${r.E} radius=${r.exclusionRadius} points=${r.points} rho(Lmax)=${r.rhoAtMax.toFixed(4)} p_rho=${r.pRho} p_convergence=${r.pConvergence} p_seasonal=${r.pSeasonal} verdict=${r.verdict}`);
  }
  console.log(`ccm pair: 2 directions × 2,000 points × 50 library sizes × 100 libraries + 99 + 99 surrogates: ${seconds.toFixed(2)} s wall, ${((cpu.user + cpu.system) / 1e6).toFixed(2)} s CPU`);
}

// ---------------------------------------------------------------- 2. study scale, through the CLI
const dir = mkdtempSync(join(tmpdir(), 'lexichron-bench-ccm-'));
try {
  const source = random('bench-ccm-study');
  const normal = () => Math.sqrt(-2 * Math.log(1 - source())) * Math.cos(2 * Math.PI * source());
  const bins = 2016;
  const lines = ['person,t,bin_start,bin_of_day,missing,lag_valid,mood,worry,energy'];
  for (let p = 0; p < personsCount; p++) {
    // mood: AR(1) with a daily rhythm; worry responds to the previous hour's mood; energy on its own.
    let mood = 0;
    let worry = 0;
    let energy = 0;
    for (let t = 0; t < bins; t++) {
      const at = new Date(Date.UTC(2026, 0, 5, t));
      const hour = at.getUTCHours();
      const previous = mood;
      mood = 0.6 * mood + 0.5 * Math.sin((2 * Math.PI * hour) / 24) + normal();
      worry = 0.5 * worry - 0.4 * previous + normal();
      energy = 0.7 * energy + normal();
      lines.push([`P${p + 1}`, t, at.toISOString().slice(0, 19), hour + 1, '', t > 0 ? 1 : 0, mood.toFixed(4), worry.toFixed(4), energy.toFixed(4)].join(','));
    }
  }
  const input = join(dir, 'series-long.csv');
  writeFileSync(input, lines.join('\n') + '\n');
  const bin = join(root, 'bin/lexichron.js');
  const timed = existsSync('/usr/bin/time');
  const times = { 0: [], auto: [] };
  for (let r = 0; r < rounds; r++) {
    for (const workers of ['0', 'auto']) {
      const started = performance.now();
      // CPU time of the child from GNU time when it is installed (user + system seconds).
      const command = [process.execPath, bin, 'dynamics', input, '--out', join(dir, `out-${workers}`), '--workers', workers];
      const child = timed ? spawnSync('/usr/bin/time', ['-f', '%e %U %S', ...command], { encoding: 'utf8' }) : spawnSync(command[0], command.slice(1), { encoding: 'utf8' });
      if (child.status !== 0) throw new Error(`lexichron dynamics --workers ${workers} exited ${child.status}: ${child.stderr.slice(-400)}`);
      const last = timed ? (child.stderr.trim().split('\n').pop() ?? '') : '';
      const [, user, system] = last.split(' ').map(Number);
      const wall = (performance.now() - started) / 1000;
      times[workers].push({ wall, cpu: Number.isFinite(user) ? user + system : Number.NaN });
      console.log(`  round ${r + 1}, --workers ${workers}: ${wall.toFixed(1)} s wall, ${Number.isFinite(user) ? (user + system).toFixed(1) : '?'} s CPU`);
    }
  }
  const median = (xs) => [...xs].sort((a, b) => a - b)[Math.floor(xs.length / 2)];
  const single = median(times[0].map((t) => t.wall));
  const threaded = median(times.auto.map((t) => t.wall));
  console.log(`ccm study: ${personsCount} persons × 2,016 hourly bins × 3 variables (6 directions each), defaults: one thread ${single.toFixed(1)} s (${(single / personsCount).toFixed(1)} s per person), worker threads (auto) ${threaded.toFixed(1)} s; speed-up ${(single / threaded).toFixed(2)}× over the single-threaded run`);
} finally {
  rmSync(dir, { recursive: true, force: true });
}
