import { existsSync, readFileSync } from 'node:fs';
import { describe, expect, it, vi } from 'vitest';
import { shardOfPerson } from '../../src/shard/shard-of-person.js';
import { runCli } from '../support/run-cli.js';
import { tempFolder } from '../support/temp-files.js';

// `--shard` on score, series and import: whole persons per shard (shardOfPerson), counted rows.
const tmp = tempFolder('lexichron-shard-cli-');
const persons = Array.from({ length: 12 }, (_, i) => `hive-keeper-${i}`);
const rows = ['person,time,text'];
for (let day = 1; day <= 3; day++) {
  for (const p of persons) rows.push(`${p},2026-04-0${day}T09:00:00Z,a calm happy morning with the bees and some worry about the rain today`);
}
rows.push('hive-keeper-0,not a time,this row is rejected');
const input = tmp.write('diary.csv', `${rows.join('\n')}\n`);
const personsIn = (csv: string): Set<string> => new Set(readFileSync(csv, 'utf8').trim().split('\n').slice(1).map((l) => l.split(',')[1] as string));

describe('--shard on score, series and import', () => {
  it('score --shard 1/3 scores only shard 1\'s persons, writes each row\'s position, and counts the rest as other shard', async () => {
    const out = tmp.path('s1/scores.csv');
    const { code, stderr } = await runCli('score', input, '--time-zone', 'UTC', '--out', out, '--shard', '1/3', '--workers', '0');
    expect(code, stderr).toBe(0);
    const mine = persons.filter((p) => shardOfPerson(p, 3) === 1);
    expect([...personsIn(out)].sort()).toEqual(mine.sort());
    const meta = JSON.parse(readFileSync(`${out}.meta.json`, 'utf8')) as { reconciliation: { read: number; scored: number; rejected: Record<string, number>; otherShard: number }; shard: unknown };
    // The rejected row is shard 0's to report; here it is one more row of another shard.
    expect(meta.reconciliation).toEqual({ read: 37, scored: mine.length * 3, rejected: {}, dropped: {}, otherShard: 37 - mine.length * 3 });
    expect(meta.shard).toEqual({ index: 1, count: 3 });
    expect(stderr).toMatch(/other shard\s+\d+/);
    const seqs = readFileSync(`${out}.seq`, 'utf8').trim().split('\n').map(Number);
    expect(seqs).toHaveLength(mine.length * 3);
    for (const s of seqs) expect(rows[s]?.split(',')[0] && shardOfPerson(rows[s]?.split(',')[0] as string, 3)).toBe(1);
  });

  it('score --shard auto takes the shard from SLURM_ARRAY_TASK_ID and SLURM_ARRAY_TASK_COUNT', async () => {
    const out = tmp.path('auto/scores.csv');
    vi.stubEnv('SLURM_ARRAY_TASK_ID', '0');
    vi.stubEnv('SLURM_ARRAY_TASK_COUNT', '2');
    try {
      const { code, stderr } = await runCli('score', input, '--time-zone', 'UTC', '--out', out, '--shard', 'auto', '--workers', '0');
      expect(code, stderr).toBe(0);
    } finally {
      vi.unstubAllEnvs();
    }
    expect([...personsIn(out)].sort()).toEqual(persons.filter((p) => shardOfPerson(p, 2) === 0).sort());
    // Shard 0 reports the rejected row.
    expect(JSON.parse(readFileSync(`${out}.meta.json`, 'utf8')).reconciliation.rejected).toEqual({ bad_time: 1 });
  });

  it('--shard auto without the job array variables is a usage error saying how to submit', async () => {
    vi.stubEnv('SLURM_ARRAY_TASK_ID', '');
    try {
      const { code, stderr } = await runCli('score', input, '--time-zone', 'UTC', '--out', tmp.path('x/scores.csv'), '--shard', 'auto');
      expect(code).toBe(2);
      expect(stderr).toMatch(/SLURM_ARRAY_TASK_ID/);
    } finally {
      vi.unstubAllEnvs();
    }
  });

  it('series --shard 2/3 bins only shard 2\'s persons of a whole scores file', async () => {
    const scores = tmp.path('all/scores.csv');
    expect((await runCli('score', input, '--time-zone', 'UTC', '--out', scores, '--workers', '0')).code).toBe(0);
    const out = tmp.path('all/series-long.csv');
    const { code, stderr } = await runCli('series', scores, '--bin', '1d', '--out', out, '--shard', '2/3');
    expect(code, stderr).toBe(0);
    const mine = persons.filter((p) => shardOfPerson(p, 3) === 2);
    expect([...new Set(readFileSync(out, 'utf8').trim().split('\n').slice(1).map((l) => l.split(',')[0]))].sort()).toEqual(mine.sort());
    expect(stderr).toContain(`${36 - mine.length * 3} scores rows belong to other shards`);
  });

  it('run --shard without --out is a usage error asking for a folder per shard', async () => {
    const { code, stderr } = await runCli('run', tmp.path('no-such-study.json'), '--shard', '1/4');
    expect(code).toBe(2);
    expect(stderr).toMatch(/--shard 1\/4 needs --out DIR: every shard writes a folder of its own \(e\.g\. --out parts\/1\)/);
  });

  it('import --shard imports an export only in its person\'s shard', async () => {
    const chat = tmp.write('chat.txt', '21/03/2025, 08:00 - Ann: Good morning\n21/03/2025, 08:30 - Bob: hi Ann\n');
    const home = shardOfPerson('P01', 4);
    const other = (home + 1) % 4;
    const skipped = await runCli('import', 'chat-lines', chat, '--person', 'P01', '--sender', 'Ann', '--time-zone', 'UTC', '--out', tmp.path('imp/other.jsonl'), '--shard', `${other}/4`);
    expect(skipped.code).toBe(0);
    expect(skipped.stderr).toContain(`belongs to shard ${home}/4`);
    expect(existsSync(tmp.path('imp/other.jsonl'))).toBe(false);
    const kept = await runCli('import', 'chat-lines', chat, '--person', 'P01', '--sender', 'Ann', '--time-zone', 'UTC', '--out', tmp.path('imp/home.jsonl'), '--shard', `${home}/4`);
    expect(kept.code, kept.stderr).toBe(0);
    expect(readFileSync(tmp.path('imp/home.jsonl'), 'utf8')).toContain('Good morning');
  });
});
