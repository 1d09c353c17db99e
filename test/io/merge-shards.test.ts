import { cpSync, readdirSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { join } from 'node:path';
import { resolve } from 'node:path';
import { beforeAll, describe, expect, it } from 'vitest';
import { runStudy } from '../../src/pipeline.js';
import { defaultStudyStages } from '../../src/io/study-stages.js';
import { mergeShards } from '../../src/io/merge-shards.js';
import { shardOfPerson } from '../../src/shard/shard-of-person.js';
import { tempFolder } from '../support/temp-files.js';

// A reduced copy of the demo study (demo-data/: the first 700 messages, all self-reports and
// zones, pseudonymized with a key from the environment, so shards are chosen by pseudonym), run
// whole and in N = 1, 3 and 7 shards merged: every output file must be byte-identical except the
// run time the manifest records (and the report shows).
const root = resolve(__dirname, '../..');
const tmp = tempFolder('lexichron-merge-');
const study = tmp.path('demo/study.json');
const NOW = '2026-12-01T00:00:00.000Z';
const env = { HIVE_STUDY_KEY: 'an invented key for the merge test, 2026' };

function files(dir: string): Map<string, string> {
  const out = new Map<string, string>();
  const walk = (sub: string): void => {
    for (const e of readdirSync(join(dir, sub), { withFileTypes: true })) {
      const rel = sub ? `${sub}/${e.name}` : e.name;
      if (e.isDirectory()) walk(rel);
      else out.set(rel, readFileSync(join(dir, rel), 'utf8'));
    }
  };
  walk('');
  return out;
}

async function runShards(n: number, tag: string, seed = 7): Promise<string[]> {
  const dirs: string[] = [];
  for (let i = 0; i < n; i++) {
    const out = tmp.path(`${tag}/${i}`);
    await runStudy(study, { now: `2026-12-0${1 + (i % 9)}T10:00:00.000Z`, seed, stages: defaultStudyStages(), env, out, shard: { index: i, count: n } });
    dirs.push(out);
  }
  return dirs;
}

let whole: Map<string, string>;

beforeAll(async () => {
  cpSync(resolve(root, 'demo-data'), tmp.path('demo'), { recursive: true });
  const messages = readFileSync(tmp.path('demo/messages.csv'), 'utf8').split('\n');
  writeFileSync(tmp.path('demo/messages.csv'), `${messages.slice(0, 701).join('\n')}\n`);
  const json = JSON.parse(readFileSync(study, 'utf8')) as Record<string, unknown>;
  writeFileSync(study, JSON.stringify({ ...json, privacy: { keyEnv: 'HIVE_STUDY_KEY' } }, null, 2));
  await runStudy(study, { now: NOW, seed: 7, stages: defaultStudyStages(), env, out: tmp.path('whole') });
  whole = files(tmp.path('whole'));
}, 120_000);

describe('mergeShards (lexichron merge)', () => {
  for (const n of [1, 3, 7]) {
    it(`merging the ${n} shard${n === 1 ? '' : 's'} of the reduced demo study gives the whole run's files byte for byte, but for the run time`, async () => {
      const dirs = await runShards(n, `parts${n}`);
      // Shards given in any order.
      await mergeShards({ shardDirs: [...dirs].reverse(), now: '2026-12-02T00:00:00.000Z', stages: defaultStudyStages(), env, out: tmp.path(`merged${n}`) });
      const merged = files(tmp.path(`merged${n}`));
      expect([...merged.keys()].sort()).toEqual([...whole.keys()].sort());
      expect(whole.size).toBeGreaterThan(15);
      for (const [name, text] of whole) {
        const other = (merged.get(name) as string).replaceAll('2026-12-02T00:00:00.000Z', NOW);
        expect(other === text, `${name} differs`).toBe(true);
      }
      expect(merged.get('manifest.json')).toContain('"created": "2026-12-02T00:00:00.000Z"');
      expect(merged.get('scores.csv')).not.toMatch(/\bp\d\d\b/); // pseudonyms only
    }, 120_000);
  }

  it('each shard scores only its own persons and counts the others\' rows, so read = scored + rejected + dropped + other shard', () => {
    const wholeMeta = JSON.parse(whole.get('scores.csv.meta.json') as string) as { reconciliation: { read: number; scored: number } };
    let scored = 0;
    for (let i = 0; i < 3; i++) {
      const dir = tmp.path(`parts3/${i}`);
      const meta = JSON.parse(readFileSync(join(dir, 'scores.csv.meta.json'), 'utf8')) as { reconciliation: { read: number; scored: number; rejected: Record<string, number>; dropped: Record<string, number>; otherShard: number } };
      const r = meta.reconciliation;
      const sum = (x: Record<string, number>): number => Object.values(x).reduce((a, b) => a + b, 0);
      expect(r.read).toBe(wholeMeta.reconciliation.read);
      expect(r.scored + sum(r.rejected) + sum(r.dropped) + r.otherShard).toBe(r.read);
      if (i > 0) expect(sum(r.rejected)).toBe(0);
      scored += r.scored;
      const persons = new Set(readFileSync(join(dir, 'scores.csv'), 'utf8').trim().split('\n').slice(1).map((line) => line.split(',')[1] as string));
      expect(persons.size).toBeGreaterThan(0);
      for (const p of persons) expect(shardOfPerson(p, 3), p).toBe(i);
    }
    expect(scored).toBe(wholeMeta.reconciliation.scored);
  });

  it('refuses a missing shard, naming it', async () => {
    const dirs = [tmp.path('parts3/0'), tmp.path('parts3/2')];
    await expect(mergeShards({ shardDirs: dirs, now: NOW, env, out: tmp.path('refused') })).rejects.toThrow(/shard 1\/3 is missing/);
  });

  it('refuses a shard given twice, naming both folders', async () => {
    const dirs = [tmp.path('parts3/0'), tmp.path('parts3/1'), tmp.path('parts3/1'), tmp.path('parts3/2')];
    await expect(mergeShards({ shardDirs: dirs, now: NOW, env, out: tmp.path('refused') })).rejects.toThrow(/shard 1\/3 is given 2 times \(`.*parts3\/1`, `.*parts3\/1`\)/);
  });

  it('refuses a shard of another run (another seed), naming its folder and what differs', async () => {
    await runStudy(study, { now: NOW, seed: 8, stages: defaultStudyStages(), env, out: tmp.path('seed8-1'), shard: { index: 1, count: 3 } });
    await expect(mergeShards({ shardDirs: [tmp.path('parts3/0'), tmp.path('seed8-1'), tmp.path('parts3/2')], now: NOW, env, out: tmp.path('refused') })).rejects.toThrow(/`.*seed8-1` is not a shard of the same run as `.*parts3\/0`: its seed differs/);
    // A shard of a 1-shard run cannot join shards of 3.
    await expect(mergeShards({ shardDirs: [tmp.path('parts3/0'), tmp.path('parts1/0')], now: NOW, env, out: tmp.path('refused') })).rejects.toThrow(/split in different numbers/);
  }, 60_000);

  it('a shard that holds no person (more shards than persons) still finishes, with a shard manifest and no series', async () => {
    const persons = new Set(readFileSync(join(tmp.path('whole'), 'scores.csv'), 'utf8').trim().split('\n').slice(1).map((l) => l.split(',')[1] as string));
    const count = 1000;
    let empty = 0;
    while ([...persons].some((p) => shardOfPerson(p, count) === empty)) empty++;
    const out = tmp.path('empty-shard');
    await runStudy(study, { now: NOW, seed: 7, env, out, shard: { index: empty, count } });
    const manifest = JSON.parse(readFileSync(join(out, 'shard.json'), 'utf8')) as { reconciliation: { scored: number; otherShard: number; read: number }; outputs: Array<{ path: string }> };
    expect(manifest.reconciliation.scored).toBe(0);
    expect(manifest.reconciliation.otherShard).toBe(manifest.reconciliation.read);
    expect(manifest.outputs.map((o) => o.path)).toEqual(['scores.csv', 'scores.csv.seq', 'scores.rejects.csv', 'scores.csv.meta.json']);
  });

  it('refuses a shard whose scores file has lost its .meta.json sidecar, naming it and saying how to proceed', async () => {
    // Issue 21: without the sidecar the lexicons and score columns of a scores file are unknown.
    const dirs = [0, 1, 2].map((i) => tmp.path(`no-sidecar/${i}`));
    dirs.forEach((d, i) => cpSync(tmp.path(`parts3/${i}`), d, { recursive: true }));
    rmSync(join(dirs[1] as string, 'scores.csv.meta.json'));
    await expect(mergeShards({ shardDirs: dirs, now: NOW, env, out: tmp.path('refused') })).rejects.toThrow(/`.*no-sidecar\/1` has no `scores\.csv\.meta\.json`.*run that shard again/);
  });

  it('refuses a folder that is not a shard\'s output, naming it', async () => {
    await expect(mergeShards({ shardDirs: [tmp.path('whole')], now: NOW, out: tmp.path('refused') })).rejects.toThrow(/`.*whole` has no shard.json/);
  });
});
