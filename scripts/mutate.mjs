#!/usr/bin/env node
// Mutation check: plants each mutant of scripts/mutants.json, one at a time, in a temporary copy
// of the repository (never in the working tree), runs only the test files named for it, and
// reports whether the tests kill it.
//
//   npm run mutate                        every mutant
//   npm run mutate -- --only id1,id2      some of them
//   npm run mutate -- --list              the list, and whether each search string still applies
//   npm run mutate -- --keep              keep the temporary copy (its path is printed)
//   npm run mutate -- --no-baseline       skip the unmutated run of the named test files
//   npm run mutate -- --timeout 300       seconds per test run (a run that times out kills the mutant)
//   npm run mutate -- --mutants FILE      another list of mutants (same format) instead of scripts/mutants.json
//
// A mutant is `{id, area, file, search, replace, tests, description}` (`tests`: test files or
// folders). `search` must occur exactly once in `file`; otherwise the mutant is reported as "did
// not apply" (the code changed: refresh the string), as is a mutant whose code does not compile
// when its tests need the build.
// Exit status: 0 every mutant killed; 1 at least one survived; 3 none survived but some did not
// apply; 2 the set-up failed (bad list, or the unmutated tests already fail).
//
// The reference checks need ../shared/reference (or LEXICHRON_SHARED_REFERENCE); the copy is
// pointed at the same folder, and LEXICHRON_SKIP_SHARED_REFERENCE is removed so that no reference
// check is skipped (a skipped check would let its mutants survive for the wrong reason).
import { spawnSync } from 'node:child_process';
import { copyFileSync, existsSync, mkdirSync, mkdtempSync, readFileSync, readdirSync, rmSync, statSync, symlinkSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { fileURLToPath } from 'node:url';

const root = path.resolve(path.dirname(fileURLToPath(import.meta.url)), '..');
let listFile = path.join(root, 'scripts', 'mutants.json');

function parseArgs(argv) {
  const args = { only: undefined, list: false, keep: false, baseline: true, timeout: 600 };
  for (let i = 0; i < argv.length; i++) {
    const a = argv[i];
    if (a === '--only') args.only = new Set(String(argv[++i] ?? '').split(',').filter(Boolean));
    else if (a === '--list') args.list = true;
    else if (a === '--keep') args.keep = true;
    else if (a === '--no-baseline') args.baseline = false;
    else if (a === '--timeout') args.timeout = Number(argv[++i]);
    else if (a === '--mutants') listFile = path.resolve(String(argv[++i] ?? ''));
    else fail(`Unknown option ${a}; see the top of scripts/mutate.mjs for the options.`);
  }
  if (!(args.timeout > 0)) fail('--timeout needs a number of seconds greater than 0.');
  return args;
}

function fail(message) {
  console.error(message);
  process.exit(2);
}

function loadMutants(only) {
  let list;
  try {
    list = JSON.parse(readFileSync(listFile, 'utf8'));
  } catch (error) {
    fail(`Cannot read ${listFile}: ${error.message}`);
  }
  if (!Array.isArray(list)) fail(`${listFile} must hold an array of mutants.`);
  const ids = new Set();
  list.forEach((m, i) => {
    for (const key of ['id', 'area', 'file', 'search', 'replace', 'description']) {
      if (typeof m?.[key] !== 'string' || m[key] === '') fail(`Mutant ${i + 1} in ${listFile} needs a non-empty string "${key}".`);
    }
    if (!Array.isArray(m.tests) || m.tests.length === 0 || !m.tests.every((t) => typeof t === 'string')) fail(`Mutant ${m.id} needs "tests": a non-empty list of test files.`);
    if (m.search === m.replace) fail(`Mutant ${m.id}: "replace" equals "search", so it changes nothing.`);
    if (ids.has(m.id)) fail(`Mutant id ${m.id} occurs twice in ${listFile}.`);
    ids.add(m.id);
  });
  if (only) {
    const unknown = [...only].filter((id) => !ids.has(id));
    if (unknown.length) fail(`Unknown mutant id(s): ${unknown.join(', ')}.`);
    return list.filter((m) => only.has(m.id));
  }
  return list;
}

/** Why a mutant cannot be planted in `dir`, or undefined when its search string occurs exactly once. */
function notApplicable(dir, m) {
  const file = path.join(dir, m.file);
  if (!existsSync(file)) return `${m.file} does not exist`;
  const missingTests = m.tests.filter((t) => !existsSync(path.join(dir, t)));
  if (missingTests.length) return `test file(s) missing: ${missingTests.join(', ')}`;
  const count = readFileSync(file, 'utf8').split(m.search).length - 1;
  if (count === 0) return `search string not found in ${m.file}`;
  if (count > 1) return `search string found ${count} times in ${m.file} (must be unique)`;
  return undefined;
}

/** The repository's own files (tracked and untracked, not ignored), without node_modules and dist. */
function repositoryFiles() {
  const git = spawnSync('git', ['ls-files', '-z', '--cached', '--others', '--exclude-standard'], { cwd: root, encoding: 'utf8' });
  if (git.status === 0) return git.stdout.split('\0').filter((f) => f && existsSync(path.join(root, f)) && statSync(path.join(root, f)).isFile());
  const out = [];
  const walk = (rel) => {
    for (const entry of readdirSync(path.join(root, rel), { withFileTypes: true })) {
      const child = rel ? `${rel}/${entry.name}` : entry.name;
      if (['node_modules', 'dist', '.git'].includes(entry.name)) continue;
      if (entry.isDirectory()) walk(child);
      else if (entry.isFile()) out.push(child);
    }
  };
  walk('');
  return out;
}

function copyRepository(dest) {
  for (const rel of repositoryFiles()) {
    const target = path.join(dest, rel);
    mkdirSync(path.dirname(target), { recursive: true });
    copyFileSync(path.join(root, rel), target);
  }
  symlinkSync(path.join(root, 'node_modules'), path.join(dest, 'node_modules'), 'dir');
}

/** The files under `rel` in `dir` (itself when it is a file). */
function filesUnder(dir, rel) {
  const full = path.join(dir, rel);
  if (!statSync(full).isDirectory()) return [rel];
  return readdirSync(full).flatMap((name) => filesUnder(dir, path.join(rel, name)));
}

/** Whether any of the test files (or folders) runs the compiled code in dist/ (then the copy is built first). */
function needsDist(dir, tests) {
  return tests.flatMap((t) => filesUnder(dir, t)).some((f) => f.endsWith('.ts') && /\bdist\//.test(readFileSync(path.join(dir, f), 'utf8')));
}

function build(dir, env, timeoutMs) {
  const r = spawnSync(process.execPath, [path.join(root, 'node_modules', 'typescript', 'bin', 'tsc'), '-p', 'tsconfig.json'], { cwd: dir, env, encoding: 'utf8', timeout: timeoutMs });
  if (r.signal === 'SIGINT') interrupted = true;
  return r.status === 0 ? undefined : `build failed: ${(r.stdout + r.stderr).split('\n').find((l) => l.includes('error')) ?? (r.error?.message || 'tsc exited with an error')}`;
}

/** Runs vitest on `tests` in `dir`; returns {ok, detail} where detail names the first failure. */
function runTests(dir, tests, env, timeoutMs) {
  const report = path.join(dir, '.mutate-report.json');
  rmSync(report, { force: true });
  const started = Date.now();
  const r = spawnSync(process.execPath, [path.join(root, 'node_modules', 'vitest', 'vitest.mjs'), 'run', ...tests, '--reporter=json', `--outputFile=${report}`], { cwd: dir, env, encoding: 'utf8', timeout: timeoutMs, maxBuffer: 64 * 1024 * 1024 });
  const seconds = (Date.now() - started) / 1000;
  if (r.signal === 'SIGINT' || r.status === 130) interrupted = true; // vitest exits 130 on Ctrl-C
  if (r.error?.code === 'ETIMEDOUT') return { ok: false, seconds, detail: `timed out after ${timeoutMs / 1000} s` };
  if (r.status === 0) return { ok: true, seconds, detail: '' };
  let detail = `vitest exited with status ${r.status}`;
  if (existsSync(report)) {
    const json = JSON.parse(readFileSync(report, 'utf8'));
    for (const file of json.testResults ?? []) {
      const failed = (file.assertionResults ?? []).find((a) => a.status === 'failed');
      const rel = path.relative(dir, file.name);
      if (failed) {
        detail = `${rel} › ${failed.fullName}`;
        break;
      }
      if (file.status === 'failed') {
        detail = `${rel}: ${String(file.message ?? '').split('\n')[0]}`;
        break;
      }
    }
  }
  return { ok: false, seconds, detail };
}

function sharedReferenceDir() {
  const configured = process.env.LEXICHRON_SHARED_REFERENCE;
  return path.resolve(root, configured || '../shared/reference');
}

// Ctrl-C reaches the test run in progress too; when it ends by SIGINT the loop stops and the
// temporary copy is removed (the listener keeps this process alive until then).
let interrupted = false;
process.on('SIGINT', () => {
  interrupted = true;
});

function main() {
  const args = parseArgs(process.argv.slice(2));
  const mutants = loadMutants(args.only);
  if (args.list) {
    for (const m of mutants) {
      const why = notApplicable(root, m);
      console.log(`${why ? 'did not apply' : 'applies      '}  ${m.id.padEnd(32)} ${m.area.padEnd(11)} ${m.description}${why ? ` (${why})` : ''}`);
    }
    return 0;
  }
  const env = { ...process.env, TZ: 'UTC', LEXICHRON_SHARED_REFERENCE: sharedReferenceDir(), FORCE_COLOR: '0' };
  delete env.LEXICHRON_SKIP_SHARED_REFERENCE;
  const timeoutMs = args.timeout * 1000;
  const base = mkdtempSync(path.join(tmpdir(), 'lexichron-mutate-'));
  const dir = path.join(base, 'repo');
  const results = [];
  try {
    console.log(`Copying the repository to ${dir} (node_modules linked) …`);
    copyRepository(dir);
    const applicable = mutants.filter((m) => !notApplicable(dir, m));
    if (args.baseline && applicable.length > 0) {
      const tests = [...new Set(applicable.flatMap((m) => m.tests))].sort();
      console.log(`Baseline: the ${tests.length} named test files on the unmutated copy …`);
      const built = needsDist(dir, tests) ? build(dir, env, timeoutMs) : undefined;
      if (built) {
        console.error(`Baseline ${built}`);
        return 2;
      }
      const run = runTests(dir, tests, env, timeoutMs);
      rmSync(path.join(dir, 'dist'), { recursive: true, force: true });
      if (interrupted) {
        console.error('Interrupted during the baseline run.');
        return 2;
      }
      if (!run.ok) {
        console.error(`The unmutated tests fail, so no mutant can be judged: ${run.detail}. Fix them first (or check that ${env.LEXICHRON_SHARED_REFERENCE} exists).`);
        return 2;
      }
      console.log(`Baseline passed in ${run.seconds.toFixed(1)} s.`);
    }
    for (const m of mutants) {
      if (interrupted) break;
      const why = notApplicable(dir, m);
      if (why) {
        results.push({ ...m, outcome: 'did not apply', detail: why, seconds: 0 });
        console.log(`did not apply  ${m.id}: ${why}`);
        continue;
      }
      const file = path.join(dir, m.file);
      const original = readFileSync(file, 'utf8');
      writeFileSync(file, original.replace(m.search, () => m.replace));
      let outcome;
      try {
        // A mutant that does not compile is not a bug the tests should catch: the list needs fixing.
        const built = needsDist(dir, m.tests) ? build(dir, env, timeoutMs) : undefined;
        if (interrupted) break;
        if (built) outcome = { outcome: 'did not apply', detail: `the mutated code does not compile (${built})`, seconds: 0 };
        else {
          const run = runTests(dir, m.tests, env, timeoutMs);
          if (interrupted) break;
          outcome = { outcome: run.ok ? 'survived' : 'killed', detail: run.detail, seconds: run.seconds };
        }
      } finally {
        writeFileSync(file, original);
        rmSync(path.join(dir, 'dist'), { recursive: true, force: true });
      }
      results.push({ ...m, ...outcome });
      if (outcome.outcome === 'did not apply') console.log(`did not apply  ${m.id}: ${outcome.detail}`);
      else console.log(`${outcome.outcome.padEnd(13)}  ${m.id} (${m.area}, ${outcome.seconds.toFixed(1)} s)${outcome.detail ? `: ${outcome.detail}` : ''}`);
    }
  } finally {
    if (args.keep) console.log(`Kept the copy at ${dir}`);
    else rmSync(base, { recursive: true, force: true });
  }
  if (interrupted) {
    console.error('Interrupted; the results above are incomplete.');
    return 2;
  }
  const count = (o) => results.filter((r) => r.outcome === o);
  const survived = count('survived');
  const skipped = count('did not apply');
  console.log(`\n${results.length} mutants: ${count('killed').length} killed, ${survived.length} survived, ${skipped.length} did not apply.`);
  for (const r of survived) console.log(`  SURVIVED       ${r.id} [${r.area}] ${r.description} (tests: ${r.tests.join(', ')})`);
  for (const r of skipped) console.log(`  DID NOT APPLY  ${r.id} [${r.area}] ${r.detail}; fix this mutant in ${path.relative(process.cwd(), listFile) || listFile}`);
  if (survived.length) return 1;
  if (skipped.length) return 3;
  return 0;
}

process.exitCode = main();
