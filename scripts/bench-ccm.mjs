// Benchmark of convergent cross mapping (run after `npx tsc`; reads dist/).
// Workload: one pair of 2,000-point series (the coupled logistic map of Sugihara et al. 2012),
// both directions, 50 library sizes × 100 random libraries each, plus 100 shuffle and 100
// seasonal surrogates, E chosen by simplex forecast skill. Prints seconds.
import { convergentCrossMapping } from '../dist/dynamics/convergent-cross-mapping.js';
import { random } from '../dist/stats/random.js';

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
const options = { librarySizeCount: 50, samples: 100, surrogates: 100, minLibrarySize: 10 };

const started = performance.now();
const cpuStarted = process.cpuUsage();
const results = [
  ['x xmap y (y -> x)', convergentCrossMapping({ values: x, lagValid, phase }, { values: y, lagValid }, options, random(1))],
  ['y xmap x (x -> y)', convergentCrossMapping({ values: y, lagValid, phase }, { values: x, lagValid }, options, random(2))],
];
const seconds = (performance.now() - started) / 1000;
const cpu = process.cpuUsage(cpuStarted);
const cpuSeconds = (cpu.user + cpu.system) / 1e6;
for (const [label, r] of results) {
  console.log(`${label}: E=${r.E} points=${r.points} sizes=${r.skill.length} rho(Lmax)=${r.rhoAtMax.toFixed(4)} converges=${r.converges} p_shuffle=${r.pShuffle} p_seasonal=${r.pSeasonal}`);
}
console.log(`ccm: 2 directions × 2,000 points × 50 library sizes × 100 libraries + 100 shuffle and 100 seasonal surrogates each: ${seconds.toFixed(2)} s wall, ${cpuSeconds.toFixed(2)} s CPU`);
