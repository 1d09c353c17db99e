import { spawnSync, execFileSync } from 'node:child_process';
import { existsSync, mkdirSync, readFileSync, writeFileSync } from 'node:fs';
import { resolve } from 'node:path';
import { beforeAll, describe, expect, it } from 'vitest';
import { LexichronError } from '../../src/errors.js';
import { DEFAULT_TIME_OPTIONS } from '../../src/ingest/parse-instant.js';
import { buildZoneTable } from '../../src/ingest/zone-table.js';
import { readRatings } from '../../src/io/run-validate.js';
import { runCli } from '../support/run-cli.js';
import { tempFolder } from '../support/temp-files.js';
import { CASE_CLASSES, fuzzCase, largeField, manyColumns, type CaseClass, type FuzzCase } from './input-cases.js';

// Fuzzing every table reader with seeded mutations of valid inputs (test/fuzz/input-cases.ts).
// For every case: the exit code is 0 or 3 (2 only for a header without the mapped columns),
// never 1 (an internal error); rows read = scored + rejected; every written time is RFC 3339
// (section 5.6: four-digit year, offset ±hh:mm) inside the plausible window; damage that must
// not change what is read (mixed CR/LF/CRLF breaks, a BOM, UTF-16: the Unicode BOM table) gives
// byte-identical scores. References: RFC 3339, RFC 4180, ECMA-262 section 21.4.1.1 (time values
// within ±8.64e15 ms), the Unicode Standard's byte order mark table.
//
// LEXICHRON_FUZZ_CASES sets the number of generated cases (default 42: three of each class;
// about 20 s with the regressions on two shared cores); `npm run fuzz` runs 2,000 (145 s) and
// adds 10^6 columns and 10-50 MB fields. test/fuzz/regressions.json holds the seeds of cases
// that failed before the fixes of issue 19; they always run.

const CASES = Number(process.env.LEXICHRON_FUZZ_CASES ?? 42);
const LONG = CASES >= 1000;
const tmp = tempFolder('lexichron-fuzz-');
const root = resolve(__dirname, '../..');
const REGRESSIONS = JSON.parse(readFileSync(resolve(__dirname, 'regressions.json'), 'utf8')) as { cases: Array<{ seed: number; kind: CaseClass; before: string }> };

const NOW = Date.now();
const TEN_YEARS_AHEAD = new Date(NOW).getUTCFullYear() + 10;
const RFC3339_UTC = /^(\d{4})-\d{2}-\d{2}T\d{2}:\d{2}:\d{2}\.\d{3}Z$/;
const RFC3339_LOCAL = /^\d{4}-\d{2}-\d{2}T\d{2}:\d{2}:\d{2}\.\d{3}[+-]\d{2}:\d{2}$/;

let folder = 0;

/** Splits a CSV produced by lexichron (no quoted fields in the id and time columns). */
function rows(csv: string): string[][] {
  return csv.trimEnd().split('\n').slice(1).map((l) => l.split(','));
}

async function scoreCase(c: FuzzCase, bytes = c.bytes): Promise<{ code: number; stderr: string; scores?: string }> {
  const dir = tmp.path(`case-${folder++}`);
  mkdirSync(dir, { recursive: true });
  const input = resolve(dir, c.name);
  writeFileSync(input, bytes);
  const out = resolve(dir, 'out/scores.csv');
  const { code, stderr } = await runCli('score', input, '--time-zone', 'Europe/Brussels', '-o', out, '--max-rejects', 'none', '--workers', '0', '--lexicon', 'afinn-165');
  const context = `${c.kind} seed ${c.seed}: exit ${code}\n${stderr.slice(0, 2000)}`;
  expect(code, context).not.toBe(1);
  if (c.expectInputError) expect(code, context).toBe(3);
  if (code === 2) expect(stderr, context).toMatch(/no column|header/);
  expect([0, 2, 3], context).toContain(code);
  if (!existsSync(out)) return { code, stderr };
  const meta = JSON.parse(readFileSync(`${out}.meta.json`, 'utf8')) as { reconciliation: { read: number; scored: number; rejected: Record<string, number>; dropped?: Record<string, number> } };
  const r = meta.reconciliation;
  const sum = (o: Record<string, number> = {}): number => Object.values(o).reduce((a, b) => a + b, 0);
  expect(r.read, context).toBe(r.scored + sum(r.rejected) + sum(r.dropped));
  const scores = readFileSync(out, 'utf8');
  const scored = rows(scores);
  expect(scored.length, context).toBe(r.scored);
  expect(rows(readFileSync(resolve(dir, 'out/scores.rejects.csv'), 'utf8')).length, context).toBe(sum(r.rejected));
  for (const row of scored) {
    const year = Number(RFC3339_UTC.exec(row[2] ?? '')?.[1]);
    expect(year >= 1970 && year <= TEN_YEARS_AHEAD, `${context}\ntime_utc ${row[2]}`).toBe(true);
    expect(row[4], context).toMatch(RFC3339_LOCAL);
  }
  return { code, stderr, scores };
}

async function checkCase(c: FuzzCase): Promise<void> {
  if (c.kind === 'ratings') return checkRatings(c);
  if (c.kind === 'chat_table') return checkChatTable(c);
  const result = await scoreCase(c);
  if (c.same) {
    const expected = await scoreCase({ ...c, expectInputError: false }, c.same);
    expect(result.code, `${c.kind} seed ${c.seed}`).toBe(expected.code);
    expect(result.scores, `${c.kind} seed ${c.seed}: the damage changed what was read`).toBe(expected.scores);
  }
}

async function checkRatings(c: FuzzCase): Promise<void> {
  const path = tmp.write(`ratings-${folder++}.csv`, c.bytes);
  const time = { ...DEFAULT_TIME_OPTIONS, window: { from: 0, to: Date.UTC(TEN_YEARS_AHEAD, 0, 1) } };
  try {
    const read = await readRatings({ ratings: path, zones: buildZoneTable([], '', 'Europe/Brussels'), scales: 'mood=0:100,calm=1:7', time, missing: ['NA', '-99'] });
    const rowRejects = read.diagnostics.filter((d) => !d.code.startsWith('rating_')).length;
    expect(read.read, `ratings seed ${c.seed}`).toBe(read.ratings.length + rowRejects);
    for (const r of read.ratings) expect(r.instant >= 0 && r.instant < time.window.to, `ratings seed ${c.seed}`).toBe(true);
  } catch (error) {
    expect(error, `ratings seed ${c.seed}: ${(error as Error).stack}`).toBeInstanceOf(LexichronError);
  }
}

async function checkChatTable(c: FuzzCase): Promise<void> {
  const dir = tmp.path(`chat-${folder++}`);
  mkdirSync(dir, { recursive: true });
  const input = resolve(dir, c.name);
  writeFileSync(input, c.bytes);
  const out = resolve(dir, 'entries.jsonl');
  const { code, stderr } = await runCli('import', 'chat-table', input, '--person', 'p1', '--sender', 'Ada', '--time-zone', 'Europe/Brussels', '-o', out);
  const context = `chat_table seed ${c.seed}: exit ${code}\n${stderr.slice(0, 2000)}`;
  expect([0, 2, 3], context).toContain(code);
  if (code === 2) expect(stderr, context).toMatch(/no column|field|header/i);
  if (!existsSync(`${out}.meta.json`)) return;
  const r = (JSON.parse(readFileSync(`${out}.meta.json`, 'utf8')) as { reconciliation: { read: number; kept: number; rejected: Record<string, number>; dropped: Record<string, number> } }).reconciliation;
  const sum = (o: Record<string, number>): number => Object.values(o).reduce((a, b) => a + b, 0);
  expect(r.read, context).toBe(r.kept + sum(r.rejected) + sum(r.dropped));
  expect(code === 3, context).toBe(r.kept === 0);
  if (r.kept > 0) expect(readFileSync(out, 'utf8').trimEnd().split('\n').length, context).toBe(r.kept);
}

describe('input fuzz: seeds that failed before issue 19 (test/fuzz/regressions.json)', () => {
  for (const { seed, kind, before } of REGRESSIONS.cases) {
    it(`${kind} seed ${seed} (before: ${before})`, () => checkCase(fuzzCase(seed, kind)), 60_000);
  }
});

describe(`input fuzz: ${CASES} generated cases`, () => {
  for (let i = 0; i < CASES; i++) {
    const kind = CASE_CLASSES[i % CASE_CLASSES.length] as CaseClass;
    const seed = 1000 + i;
    it(`${kind} seed ${seed}`, () => checkCase(fuzzCase(seed, kind)), 60_000);
  }
});

describe('input fuzz: sizes', () => {
  const columns = LONG ? 1_000_000 : 100_000;
  it(`reads a header and a row of ${columns} columns (10^6 in the long run)`, async () => {
    const result = await scoreCase({ seed: 0, kind: 'byte_flip', name: 'wide.csv', bytes: manyColumns(columns) });
    expect(result.code).toBe(0);
    expect(rows(result.scores ?? '')).toHaveLength(1);
  }, 60_000);

  it.runIf(LONG)('rejects fields of 10 to 50 MB as field_too_long and scores the rest', async () => {
    for (const mb of [10, 50]) {
      const result = await scoreCase({ seed: mb, kind: 'byte_flip', name: 'large.csv', bytes: largeField(mb) });
      expect(result.code).toBe(0);
      expect(rows(result.scores ?? '')).toHaveLength(1);
    }
  }, 300_000);
});

describe('input fuzz: the built command line', () => {
  beforeAll(() => {
    if (!existsSync(resolve(root, 'dist/cli/main.js'))) execFileSync('npx', ['tsc', '-p', 'tsconfig.json'], { cwd: root, stdio: 'inherit' });
  }, 120_000);

  it('exits 0 on out-of-range epochs, a 10,000-deep JSON row and UTF-16 input, each a counted reject or read', () => {
    const epochs = tmp.write('cli-epochs.csv', 'person,time,text\np1,8640000000000001,good\np1,-8640000000000001,good\np1,+275760-09-13T00:00:00Z,good\n');
    const deep = tmp.write('cli-deep.jsonl', `{"person":"p","time":"2026-03-01T10:00:00Z","text":"x","u":${'['.repeat(10_000)}${']'.repeat(10_000)}}\n{"person":"q","time":"2026-03-01T10:00:00Z","text":"good"}\n`);
    const utf16 = tmp.write('cli-utf16.csv', Buffer.concat([Buffer.from([0xff, 0xfe]), Buffer.from('person,time,text\r\np1,2026-03-01T10:00:00Z,good\r\n', 'utf16le')]));
    const args = ['score', epochs, deep, utf16, '--time-zone', 'Europe/Brussels', '--epoch', 'ms', '--max-rejects', 'none', '--workers', '0', '--lexicon', 'afinn-165', '-o', tmp.path('cli/s.csv')];
    const r = spawnSync(process.execPath, [resolve(root, 'bin/lexichron.js'), ...args], { encoding: 'utf8', timeout: 60_000 });
    expect(r.status, r.stderr).toBe(0);
    expect(rows(readFileSync(tmp.path('cli/s.rejects.csv'), 'utf8')).map((x) => `${x[0]}:${x[1]}:${x[3]}`)).toEqual(['cli-epochs.csv:2:bad_time', 'cli-epochs.csv:3:bad_time', 'cli-epochs.csv:4:bad_time', 'cli-deep.jsonl:1:bad_json']);
    expect(rows(readFileSync(tmp.path('cli/s.csv'), 'utf8')).map((x) => x[0])).toEqual(['cli-deep.jsonl:2', 'cli-utf16.csv:2']);
  }, 120_000);
});
