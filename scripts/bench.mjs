#!/usr/bin/env node
// `npm run bench`: speed and peak memory of scoring, side by side with peer pipelines, from one run.
//
// 1. Generates an invented corpus of 200,000 short messages (CSV, about 3 million tokens; seeded,
//    so every run reads the same file) in the system's temporary folder.
// 2. Runs each pipeline over that file in its own child process, so each has its own peak memory
//    (VmHWM from /proc/self/status, or process.resourceUsage().maxRSS where /proc is missing):
//      lexichron score   end to end: CSV → scores file, lexicons afinn-165 + vader + daily-constructs
//      papaparse + sentiment         the `sentiment` package's AFINN-165 loop, one call per row
//      papaparse + vader-sentiment   the `vader-sentiment` package's loop, one call per row
//      papaparse alone               the floor set by reading and parsing the file
// 3. Prints tokens per second (the same token count, words split on spaces, for every pipeline),
//    peak memory and the ratios against the targets of the scoring issue.
// 4. Runs the other benches (series, import, CCM) when their scripts exist: see HOOKS below.
//
//   npm run bench                      # everything (builds first)
//   node scripts/bench.mjs --messages 20000 --no-hooks
//
// Reads the library from dist/ (build first). Needs the devDependencies sentiment and vader-sentiment.
import { spawnSync } from 'node:child_process';
import { createReadStream, createWriteStream, existsSync, mkdtempSync, readFileSync, rmSync, statSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { fileURLToPath } from 'node:url';

const root = fileURLToPath(new URL('..', import.meta.url));
const self = fileURLToPath(import.meta.url);

/** Other benches folded into this run when present: [script, args, what it measures]. */
const HOOKS = [
  ['scripts/bench-series.mjs', [], 'series binning'],
  ['scripts/bench-import.mjs', ['20', '200'], 'import mbox (20 MB and 200 MB)'],
  ['scripts/bench-ccm.mjs', [], 'convergent cross mapping'],
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
  if (pipeline === 'lexichron score') {
    const { main } = await import('../dist/cli/main.js');
    const code = await main(['node', 'lexichron', 'score', input, '--time-zone', 'UTC', '-l', 'afinn-165', '-l', 'vader', '-l', 'daily-constructs', '-o', out, '--max-rejects', 'none']);
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
const runHooks = !process.argv.includes('--no-hooks');

/** mulberry32: a small seeded generator, so the corpus is the same on every run. */
function seeded(seed) {
  let a = seed >>> 0;
  return () => {
    a = (a + 0x6d2b79f5) >>> 0;
    let t = a;
    t = Math.imul(t ^ (t >>> 15), t | 1);
    t ^= t + Math.imul(t ^ (t >>> 7), t | 61);
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296;
  };
}

const NEUTRAL = 'the a to and of in on at with for after before today this morning evening garden hive frames bees kitchen bus work walk coffee rain sun wind soup emails meeting neighbour dog path shed box queen pollen brood notebook list tea call train'.split(' ');
const AFFECT = 'happy glad calm good great nice lovely fine proud relaxed grateful cheerful sad upset angry tired worried anxious stressed awful bad gloomy lonely nervous fed up exhausted hopeful excited annoyed'.split(' ');
const MODIFIERS = "very really so extremely slightly not never don't can't wasn't didn't a little kind of".split(' ');
const EMOJI = ['🐝', '😊', '😞', '😴', '❤️', '👍🏽', '🙂', ':)', ':(', '😤', '👨‍👩‍👧'];

function message(rand) {
  const pick = (list) => list[Math.floor(rand() * list.length)];
  const n = 8 + Math.floor(rand() * 15); // 8–22 words, 15 on average
  const words = [];
  for (let k = 0; k < n; k++) {
    const r = rand();
    if (r < 0.12) words.push(pick(AFFECT));
    else if (r < 0.18) words.push(pick(MODIFIERS));
    else words.push(pick(NEUTRAL));
    if (rand() < 0.06) words[words.length - 1] += pick([',', '.', '!']);
  }
  if (rand() < 0.4) words.push(pick(EMOJI));
  let text = words.join(' ');
  if (rand() < 0.08) text = text[0].toUpperCase() + text.slice(1).toUpperCase();
  if (rand() < 0.01) text = text.replace(' ', '\n');
  return text;
}

async function writeCorpus(path, count) {
  const rand = seeded(20260329);
  const out = createWriteStream(path, { encoding: 'utf8' });
  let tokens = 0;
  const start = Date.UTC(2026, 2, 1);
  out.write('id,person,time,text\n');
  for (let i = 0; i < count; i++) {
    const text = message(rand);
    tokens += text.split(/\s+/).filter(Boolean).length;
    const time = new Date(start + i * 60_000).toISOString();
    const quoted = /[",\n]/.test(text) ? `"${text.replace(/"/g, '""')}"` : text;
    if (!out.write(`b${i},p${i % 300},${time},${quoted}\n`)) await new Promise((r) => out.once('drain', r));
  }
  await new Promise((r) => out.end(r));
  return tokens;
}

// ---------------------------------------------------------------- parent
if (!existsSync(join(root, 'dist/cli/main.js'))) {
  console.error('bench: dist/ is missing; run `npm run build` first (npm run bench does).');
  process.exit(2);
}
const dir = mkdtempSync(join(tmpdir(), 'lexichron-bench-'));
try {
  const input = join(dir, 'messages.csv');
  const tokens = await writeCorpus(input, MESSAGES);
  const mb = statSync(input).size / 1024 / 1024;
  console.log(`corpus: ${MESSAGES.toLocaleString('en-US')} messages, ${tokens.toLocaleString('en-US')} tokens (words split on spaces), ${mb.toFixed(1)} MB\n  ${input}\n`);

  const pipelines = ['papaparse alone', 'papaparse + sentiment', 'papaparse + vader-sentiment', 'lexichron score'];
  const results = new Map();
  for (const pipeline of pipelines) {
    const started = performance.now();
    const child = spawnSync(process.execPath, [self, '--child', pipeline, input, join(dir, 'scores.csv')], { cwd: root, encoding: 'utf8', maxBuffer: 1 << 24 });
    const wall = (performance.now() - started) / 1000;
    if (child.status !== 0) {
      console.error(`bench: ${pipeline} failed (exit ${child.status}):\n${child.stderr}`);
      process.exitCode = 1;
      continue;
    }
    const report = JSON.parse(child.stdout.trim().split('\n').pop());
    // Tokens per second over the child's whole life (start-up and module loading included), by
    // wall-clock time and by CPU time (user + system) of the child: on a shared machine the CPU
    // figure is the steadier one, so the ratios use it.
    results.set(pipeline, { ...report, wall, tokensPerSecond: tokens / wall, tokensPerCpuSecond: tokens / report.cpuSeconds });
  }

  const pad = (s, n) => String(s).padEnd(n);
  const lpad = (s, n) => String(s).padStart(n);
  console.log(`${pad('pipeline', 30)}${lpad('wall s', 8)}${lpad('CPU s', 8)}${lpad('rows', 10)}${lpad('tokens/s', 11)}${lpad('tokens/CPU s', 14)}${lpad('peak MB', 9)}`);
  for (const [name, r] of results) {
    console.log(
      `${pad(name, 30)}${lpad(r.wall.toFixed(2), 8)}${lpad(r.cpuSeconds.toFixed(2), 8)}${lpad(r.rows.toLocaleString('en-US'), 10)}` +
        `${lpad(Math.round(r.tokensPerSecond).toLocaleString('en-US'), 11)}${lpad(Math.round(r.tokensPerCpuSecond).toLocaleString('en-US'), 14)}${lpad(r.peakMb.toFixed(0), 9)}`,
    );
  }
  const ours = results.get('lexichron score');
  if (ours) {
    console.log('\nlexichron score speed ÷ peer speed, by CPU time (by wall time in brackets):');
    for (const [peer, target, words] of TARGETS) {
      const r = results.get(peer);
      if (!r) continue;
      const ratio = ours.tokensPerCpuSecond / r.tokensPerCpuSecond;
      const wallRatio = ours.tokensPerSecond / r.tokensPerSecond;
      console.log(`  vs ${pad(peer, 28)} ${lpad(ratio.toFixed(2), 6)}× (${wallRatio.toFixed(2)}×)   target ${words}: ${ratio >= target ? 'met' : 'MISSED'}`);
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
