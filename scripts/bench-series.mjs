#!/usr/bin/env node
// Series-stage bench (run by `npm run bench` through scripts/bench.mjs, or alone after `npm run build`).
//
// 1. Benchmark corpus: bins the scores file that `lexichron score` wrote from bench.mjs's corpus
//    (passed as LEXICHRON_BENCH_SCORES, or as the first argument) with runSeries, daily (04:00 day
//    start) and hourly, each in its own child process: entries/s and peak memory.
// 2. Memory bounded by bins, not entries: accumulates a synthetic year of hourly bins
//    (8,760 per person, Europe/Brussels and America/New_York) for 1,000 persons with one entry per
//    bin, and for 100 persons with 1 and with 8 entries per bin: same bins, 8× the entries, same memory.
//
//   node scripts/bench-series.mjs [scores.csv]
import { spawnSync } from 'node:child_process';
import { existsSync, mkdtempSync, readFileSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { fileURLToPath } from 'node:url';

const self = fileURLToPath(import.meta.url);

function peakMb() {
  try {
    const hwm = /VmHWM:\s+(\d+) kB/.exec(readFileSync('/proc/self/status', 'utf8'));
    if (hwm) return Number(hwm[1]) / 1024;
  } catch {
    // no /proc
  }
  return process.resourceUsage().maxRSS / 1024;
}

// ---------------------------------------------------------------- child modes
if (process.argv[2] === '--child-run') {
  const [, , , scores, bin, out] = process.argv;
  const { runSeries } = await import('../dist/io/run-series.js');
  const { parseBinSpec } = await import('../dist/series/bin-spec.js');
  const started = performance.now();
  const r = await runSeries({ scores, out, bin: parseBinSpec(bin), dayStart: 240, minWords: 1, fill: 'none', maxFill: 1, detrend: false });
  const seconds = (performance.now() - started) / 1000;
  const cpu = process.cpuUsage();
  process.stdout.write(JSON.stringify({ entries: r.entries, bins: r.bins, persons: r.persons, seconds, cpuSeconds: (cpu.user + cpu.system) / 1e6, peakMb: peakMb() }) + '\n');
  process.exit(0);
}

if (process.argv[2] === '--child-synthetic') {
  const persons = Number(process.argv[3]);
  const perBin = Number(process.argv[4]);
  const { createSeriesState } = await import('../dist/series/create-series-state.js');
  const { addSeriesEntry } = await import('../dist/series/add-series-entry.js');
  const { buildPersonSeries } = await import('../dist/series/build-person-series.js');
  const { parseBinSpec } = await import('../dist/series/bin-spec.js');
  const baseline = peakMb();
  const state = createSeriesState({ bin: parseBinSpec('1h'), dayStart: 0, minWords: 1, fill: 'none', maxFill: 0, detrend: false, reducers: ['weighted', 'mean'] }, 2);
  const start = Date.UTC(2026, 0, 1);
  const hours = 365 * 24;
  const values = [0.5, 1];
  const matched = [1, 0];
  const entry = { person: '', instant: 0, zone: '', words: 12, values, matched };
  const started = performance.now();
  let entries = 0;
  for (let p = 0; p < persons; p++) {
    entry.person = `p${p}`;
    entry.zone = p % 2 ? 'Europe/Brussels' : 'America/New_York';
    for (let h = 0; h < hours; h++) {
      for (let k = 0; k < perBin; k++) {
        entry.instant = start + h * 3_600_000 + 60_000 * (1 + k * 5);
        addSeriesEntry(state, entry);
        entries++;
      }
    }
  }
  const seconds = (performance.now() - started) / 1000;
  let bins = 0;
  for (const b of state.persons.values()) bins += b.slots.size;
  // Rows of one person, built on demand (the long file is written person by person).
  const rows = buildPersonSeries(state, 'p1').length;
  process.stdout.write(JSON.stringify({ persons, perBin, entries, bins, rows, seconds, storeMb: state.store.chunks.length * state.store.chunks[0].byteLength / 1048576, baselineMb: baseline, peakMb: peakMb() }) + '\n');
  process.exit(0);
}

// ---------------------------------------------------------------- parent
const scores = process.argv[2] ?? process.env.LEXICHRON_BENCH_SCORES;
const child = (args) => {
  const r = spawnSync(process.execPath, ['--max-old-space-size=4096', self, ...args], { encoding: 'utf8', maxBuffer: 1 << 24 });
  if (r.status !== 0) {
    console.error(`bench-series: ${args.join(' ')} failed (exit ${r.status}):\n${r.stderr}`);
    process.exitCode = 1;
    return undefined;
  }
  return JSON.parse(r.stdout.trim().split('\n').pop());
};
const fmt = (n) => Math.round(n).toLocaleString('en-US');

if (scores && existsSync(scores)) {
  const dir = mkdtempSync(join(tmpdir(), 'lexichron-bench-series-'));
  try {
    console.log(`series on the benchmark scores (${scores}):`);
    for (const bin of ['1d', '1h']) {
      const r = child(['--child-run', scores, bin, join(dir, `series-${bin}.csv`)]);
      if (r) console.log(`  --bin ${bin.padEnd(3)} ${fmt(r.entries)} entries, ${r.persons} persons, ${fmt(r.bins)} bins: ${r.seconds.toFixed(2)} s, ${fmt(r.entries / r.seconds)} entries/s (${fmt(r.entries / r.cpuSeconds)} per CPU s), peak ${r.peakMb.toFixed(0)} MB`);
    }
  } finally {
    rmSync(dir, { recursive: true, force: true });
  }
} else {
  console.log('series on the benchmark scores: skipped (no scores file; pass one or run through scripts/bench.mjs)');
}

console.log('\nmemory is bounded by bins, not entries (a year of hourly bins, accumulate only):');
for (const [persons, perBin] of [[100, 1], [100, 8], [1000, 1]]) {
  const r = child(['--child-synthetic', String(persons), String(perBin)]);
  if (r) {
    console.log(
      `  ${String(persons).padStart(5)} persons × ${perBin} entr${perBin === 1 ? 'y' : 'ies'}/bin: ${fmt(r.entries)} entries into ${fmt(r.bins)} bins in ${r.seconds.toFixed(1)} s ` +
        `(${fmt(r.entries / r.seconds)} entries/s); bin store ${r.storeMb.toFixed(0)} MB, peak RSS ${r.peakMb.toFixed(0)} MB (start ${r.baselineMb.toFixed(0)} MB); ${fmt(r.rows)} rows per person`,
    );
  }
}
