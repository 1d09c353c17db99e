#!/usr/bin/env node
// `npm run bench`: speed and peak memory of scoring, side by side with peer pipelines, from one run.
//
// 1. Generates an invented corpus of 200,000 short messages (CSV, about 3 million tokens; seeded,
//    so every run reads the same file) in the system's temporary folder. A quarter of the words
//    come from a long tail (the single-word lemmas of WordNet 3.1, drawn by a Zipf law), so the
//    corpus has tens of thousands of distinct words as running text does, and a tokenizer that
//    memoises what it has seen is measured with the misses it would have on real messages.
// 2. Runs each pipeline over that file in its own child process, so each has its own peak memory
//    (VmHWM from /proc/self/status, or process.resourceUsage().maxRSS where /proc is missing):
//      lexichron score   end to end: CSV → scores file, lexicons afinn-165 + vader + daily-constructs
//                        (workers as `auto` chooses: one beside the reading thread on 2 cores)
//      lexichron score --workers 0   the same in one thread, for a like-for-like look at CPU
//      papaparse + sentiment         the `sentiment` package's AFINN-165 loop, one call per row
//      papaparse + vader-sentiment   the `vader-sentiment` package's loop, one call per row
//      papaparse alone               the floor set by reading and parsing the file
// 3. Runs every pipeline --rounds times (default 3), interleaved, so that a slow spell of a shared
//    machine hits all of them; prints the median wall and CPU time, tokens per second (the same
//    token count, words split on spaces, for every pipeline), peak memory, and the ratios against
//    the targets of the scoring issue, judged on median wall time (what a user waits for), with
//    the ratio of CPU times beside it.
// 4. Runs the other benches (series, import, CCM, redaction) when their scripts exist: see HOOKS below.
//
//   npm run bench                      # everything (builds first)
//   node scripts/bench.mjs --messages 20000 --rounds 1 --no-hooks
//   node scripts/bench.mjs --corpus-only /tmp/corpus.csv   # write the corpus and stop
//
// Reads the library from dist/ (build first). Needs the devDependencies sentiment and vader-sentiment.
import { spawnSync } from 'node:child_process';
import { createReadStream, createWriteStream, existsSync, mkdtempSync, readFileSync, rmSync, statSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { fileURLToPath } from 'node:url';
import { benchMessages } from '../bench/bench-corpus.mjs';

const root = fileURLToPath(new URL('..', import.meta.url));
const self = fileURLToPath(import.meta.url);

/** Other benches folded into this run when present: [script, args, what it measures]. */
const HOOKS = [
  ['scripts/bench-series.mjs', [], 'series binning'],
  ['scripts/bench-series-rows.mjs', ['1000000', '3000000'], 'series peak memory at 1M and 3M rows, same bins'],
  ['scripts/bench-import.mjs', ['20', '200'], 'import mbox (20 MB and 200 MB)'],
  ['scripts/bench-ccm.mjs', [], 'convergent cross mapping'],
  ['scripts/bench-redact.mjs', [], 'redaction of 1 MB texts'],
];

/** Targets of the scoring issue: lexichron tokens/s divided by the peer's. */
const TARGETS = [
  ['papaparse + vader-sentiment', 5, 'at least 5× faster'],
  ['papaparse + sentiment', 0.5, 'at least half the speed'],
  ['papaparse alone', 1 / 3, 'within 3× (ratio ≥ 0.33)'],
];

// ---------------------------------------------------------------- child mode: one pipeline
if (process.argv[2] === '--child') {
  const [, , , pipeline, input, out] = process.argv;
  const started = performance.now();
  let rows = 0;
  if (pipeline.startsWith('lexichron score')) {
    const { main } = await import('../dist/cli/main.js');
    const workers = pipeline.endsWith('--workers 0') ? ['--workers', '0'] : [];
    const code = await main(['node', 'lexichron', 'score', input, '--time-zone', 'UTC', '-l', 'afinn-165', '-l', 'vader', '-l', 'daily-constructs', '-o', out, '--max-rejects', 'none', ...workers]);
    if (code !== 0) process.exit(code);
    rows = JSON.parse(readFileSync(`${out}.meta.json`, 'utf8')).reconciliation.scored;
  } else {
    const Papa = (await import('papaparse')).default;
    let analyze = () => 0;
    if (pipeline === 'papaparse + sentiment') {
      const Sentiment = (await import('sentiment')).default;
      const s = new Sentiment();
      analyze = (text) => s.analyze(text).score;
    } else if (pipeline === 'papaparse + vader-sentiment') {
      const vader = (await import('vader-sentiment')).default;
      analyze = (text) => vader.SentimentIntensityAnalyzer.polarity_scores(text).compound;
    }
    let checksum = 0;
    await new Promise((resolve, reject) => {
      Papa.parse(createReadStream(input, { encoding: 'utf8' }), {
        header: true,
        skipEmptyLines: true,
        step: (r) => {
          rows++;
          checksum += analyze(r.data.text ?? '');
        },
        complete: resolve,
        error: reject,
      });
    });
    if (!Number.isFinite(checksum)) throw new Error('bad checksum');
  }
  const seconds = (performance.now() - started) / 1000;
  const cpu = process.cpuUsage();
  const cpuSeconds = (cpu.user + cpu.system) / 1e6;
  let peakKb = process.resourceUsage().maxRSS;
  try {
    const hwm = /VmHWM:\s+(\d+) kB/.exec(readFileSync('/proc/self/status', 'utf8'));
    if (hwm) peakKb = Number(hwm[1]);
  } catch {
    // no /proc: keep maxRSS
  }
  process.stdout.write(JSON.stringify({ pipeline, seconds, cpuSeconds, rows, peakMb: peakKb / 1024 }) + '\n');
  process.exit(0);
}

// ---------------------------------------------------------------- corpus
function argValue(name, fallback) {
  const i = process.argv.indexOf(name);
  return i === -1 ? fallback : process.argv[i + 1];
}
const MESSAGES = Number(argValue('--messages', '200000'));
const ROUNDS = Number(argValue('--rounds', '3'));
const runHooks = !process.argv.includes('--no-hooks');

async function writeCorpus(path, count) {
  const { wordnetDictDir } = await import('../dist/io/open-wordnet.js');
  const out = createWriteStream(path, { encoding: 'utf8' });
  let tokens = 0;
  const distinct = new Set();
  out.write('id,person,time,text\n');
  for (const { id, person, time, text } of benchMessages(count, wordnetDictDir())) {
    for (const word of text.split(/\s+/)) {
      if (word === '') continue;
      tokens++;
      distinct.add(word.toLowerCase());
    }
    const quoted = /[",\n]/.test(text) ? `"${text.replace(/"/g, '""')}"` : text;
    if (!out.write(`${id},${person},${time},${quoted}\n`)) await new Promise((r) => out.once('drain', r));
  }
  await new Promise((r) => out.end(r));
  return { tokens, distinct: distinct.size };
}

// ---------------------------------------------------------------- parent
if (!existsSync(join(root, 'dist/cli/main.js'))) {
  console.error('bench: dist/ is missing; run `npm run build` first (npm run bench does).');
  process.exit(2);
}
if (argValue('--corpus-only', undefined)) {
  // Writes the corpus where asked and stops (for profiling one pipeline by hand).
  const { tokens, distinct } = await writeCorpus(argValue('--corpus-only'), MESSAGES);
  console.log(`corpus: ${MESSAGES} messages, ${tokens} tokens, ${distinct} distinct: ${argValue('--corpus-only')}`);
  process.exit(0);
}
const dir = mkdtempSync(join(tmpdir(), 'lexichron-bench-'));
try {
  const input = join(dir, 'messages.csv');
  const { tokens, distinct } = await writeCorpus(input, MESSAGES);
  const mb = statSync(input).size / 1024 / 1024;
  console.log(`corpus: ${MESSAGES.toLocaleString('en-US')} messages, ${tokens.toLocaleString('en-US')} tokens (words split on spaces), ${distinct.toLocaleString('en-US')} distinct, ${mb.toFixed(1)} MB\n  ${input}\n`);

  const pipelines = ['papaparse alone', 'papaparse + sentiment', 'papaparse + vader-sentiment', 'lexichron score', 'lexichron score --workers 0'];
  const runs = new Map(pipelines.map((p) => [p, []]));
  for (let round = 1; round <= ROUNDS; round++) {
    process.stderr.write(`round ${round} of ${ROUNDS}: `);
    for (const pipeline of pipelines) {
      process.stderr.write(`${pipeline}… `);
      const started = performance.now();
      const child = spawnSync(process.execPath, [self, '--child', pipeline, input, join(dir, 'scores.csv')], { cwd: root, encoding: 'utf8', maxBuffer: 1 << 24 });
      const wall = (performance.now() - started) / 1000;
      if (child.status !== 0) {
        console.error(`\nbench: ${pipeline} failed (exit ${child.status}):\n${child.stderr}`);
        process.exitCode = 1;
        continue;
      }
      // Wall time of the child's whole life (start-up and module loading included) and its CPU
      // time (user + system, all threads).
      runs.get(pipeline).push({ ...JSON.parse(child.stdout.trim().split('\n').pop()), wall });
    }
    process.stderr.write('\n');
  }
  const median = (values) => {
    const v = [...values].sort((a, b) => a - b);
    return v.length % 2 ? v[(v.length - 1) / 2] : (v[v.length / 2 - 1] + v[v.length / 2]) / 2;
  };
  const results = new Map();
  for (const [pipeline, list] of runs) {
    if (list.length === 0) continue;
    const wall = median(list.map((r) => r.wall));
    const cpuSeconds = median(list.map((r) => r.cpuSeconds));
    results.set(pipeline, { rows: list[0].rows, wall, cpuSeconds, peakMb: Math.max(...list.map((r) => r.peakMb)), walls: list.map((r) => r.wall), tokensPerSecond: tokens / wall, tokensPerCpuSecond: tokens / cpuSeconds });
  }

  const pad = (s, n) => String(s).padEnd(n);
  const lpad = (s, n) => String(s).padStart(n);
  console.log(`median of ${ROUNDS} interleaved round(s); wall s of each round in brackets\n`);
  console.log(`${pad('pipeline', 30)}${lpad('wall s', 8)}${lpad('CPU s', 8)}${lpad('rows', 10)}${lpad('tokens/s', 11)}${lpad('tokens/CPU s', 14)}${lpad('peak MB', 9)}   rounds`);
  for (const [name, r] of results) {
    console.log(
      `${pad(name, 30)}${lpad(r.wall.toFixed(2), 8)}${lpad(r.cpuSeconds.toFixed(2), 8)}${lpad(r.rows.toLocaleString('en-US'), 10)}` +
        `${lpad(Math.round(r.tokensPerSecond).toLocaleString('en-US'), 11)}${lpad(Math.round(r.tokensPerCpuSecond).toLocaleString('en-US'), 14)}${lpad(r.peakMb.toFixed(0), 9)}   [${r.walls.map((w) => w.toFixed(2)).join(', ')}]`,
    );
  }
  const ours = results.get('lexichron score');
  const single = results.get('lexichron score --workers 0');
  if (ours) {
    console.log('\nlexichron score speed ÷ peer speed by median wall time; by CPU time in brackets (one thread: --workers 0):');
    for (const [peer, target, words] of TARGETS) {
      const r = results.get(peer);
      if (!r) continue;
      const ratio = ours.tokensPerSecond / r.tokensPerSecond;
      const cpu = ours.tokensPerCpuSecond / r.tokensPerCpuSecond;
      const singleCpu = single ? ` (one thread ${(single.tokensPerCpuSecond / r.tokensPerCpuSecond).toFixed(2)}×)` : '';
      console.log(`  vs ${pad(peer, 28)} ${lpad(ratio.toFixed(2), 6)}×  [CPU ${cpu.toFixed(2)}×${singleCpu}]   target ${words}: ${ratio >= target ? 'met' : 'MISSED'}`);
    }
  }

  if (runHooks) {
    for (const [script, args, what] of HOOKS) {
      if (!existsSync(join(root, script))) continue;
      console.log(`\n--- ${what}: node ${script} ${args.join(' ')}`);
      // The series bench bins the scores file that `lexichron score` just wrote from this corpus.
      const r = spawnSync(process.execPath, [join(root, script), ...args], { cwd: root, stdio: 'inherit', env: { ...process.env, LEXICHRON_BENCH_SCORES: join(dir, 'scores.csv') } });
      if (r.status !== 0) {
        console.error(`bench: ${script} exited ${r.status}`);
        process.exitCode = 1;
      }
    }
  }
} finally {
  rmSync(dir, { recursive: true, force: true });
}
