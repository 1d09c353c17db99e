import { execFileSync, spawnSync } from 'node:child_process';
import { existsSync, readFileSync } from 'node:fs';
import { resolve } from 'node:path';
import { beforeAll, describe, expect, it } from 'vitest';
import { tempFolder } from '../support/temp-files.js';

// End to end: the built command line (`npm test` builds first; a missing dist/ is built here).
const root = resolve(__dirname, '../..');
const bin = resolve(root, 'bin/lexichron.js');
const tmp = tempFolder('lexichron-cli-');

beforeAll(() => {
  if (!existsSync(resolve(root, 'dist/cli/main.js'))) execFileSync('npx', ['tsc', '-p', 'tsconfig.json'], { cwd: root, stdio: 'inherit' });
});

function run(args: string[], tz = 'UTC'): { status: number | null; stdout: string; stderr: string } {
  const r = spawnSync(process.execPath, [bin, ...args], { cwd: tmp.dir, encoding: 'utf8', env: { ...process.env, TZ: tz } });
  if (r.status === 1) console.error(`lexichron ${args.join(' ')} exited 1:\n${r.stderr}`);
  return { status: r.status, stdout: r.stdout, stderr: r.stderr };
}

const INPUT = [
  'id,person,time,text',
  'e1,p1,2026-03-29 08:15,Slept well and felt happy with the bees',
  'e2,p1,2026-03-29 02:30,This local time does not exist in Brussels',
  'e3,p2,2026-03-29T09:00:00+02:00,"Not happy, worried about the colony"',
  'e4,p2,2026-03-30 09:00,',
  'e5,p2,1774850400,I am so tired today',
].join('\n');

describe('lexichron score (command line)', () => {
  const input = tmp.write('diary.csv', INPUT + '\n');

  it('scores every entry, writes rejects and the sidecar, reconciles read = scored + rejected, exit 0', () => {
    const r = run(['score', input, '--time-zone', 'Europe/Brussels', '-l', 'afinn-165', '-l', 'vader', '-l', 'daily-constructs', '-o', 'out/scores.csv', '--max-rejects', 'none']);
    expect(r.status, r.stderr).toBe(0);
    expect(r.stderr).toMatch(/rows read\s+5\n\s+scored\s+3\n\s+rejected\s+2\n\s+empty_text\s+1\n\s+time_in_gap\s+1\n/);
    const scores = readFileSync(tmp.path('out/scores.csv'), 'utf8').trimEnd().split('\n');
    expect(scores[0]).toBe(
      'entry_id,person,time_utc,zone,time_local,words,afinn-165.valence,afinn-165.valence.n,afinn-165.negated,vader.compound,vader.pos,vader.neu,vader.neg,daily-constructs.worry_per100w,daily-constructs.fatigue_per100w,daily-constructs.connection_per100w,daily-constructs.worry_per100w.n,daily-constructs.fatigue_per100w.n,daily-constructs.connection_per100w.n,daily-constructs.negated',
    );
    expect(scores).toHaveLength(4);
    // e1: 08:15 CEST = 06:15Z; happy +3 (AFINN-165); 8 words.
    expect(scores[1]).toMatch(/^e1,p1,2026-03-29T06:15:00\.000Z,Europe\/Brussels,2026-03-29T08:15:00\.000\+02:00,8,3,1,0,/);
    // e3: "Not happy" flipped to −3, worried −3 (AFINN-165), one negated hit; worry 1 of 6 words = 16.67 per 100.
    expect(scores[2]).toMatch(/^e3,p2,2026-03-29T07:00:00\.000Z,Europe\/Brussels,2026-03-29T09:00:00\.000\+02:00,6,-6,2,1,/);
    expect(scores[2]?.split(',')[13]).toBe('16.66666667');
    // e5: epoch seconds 1774850400 = 2026-03-30T06:00:00Z; tired: fatigue 1 of 5 words = 20.
    expect(scores[3]).toMatch(/^e5,p2,2026-03-30T06:00:00\.000Z,Europe\/Brussels,2026-03-30T08:00:00\.000\+02:00,5,/);
    expect(scores[3]?.split(',')[14]).toBe('20');

    const rejects = readFileSync(tmp.path('out/scores.rejects.csv'), 'utf8').trimEnd().split('\n');
    expect(rejects[0]).toBe('file,line,stage,code,message');
    expect(rejects.slice(1).map((l) => l.split(',').slice(0, 4).join(','))).toEqual(['diary.csv,3,ingest,time_in_gap', 'diary.csv,5,ingest,empty_text']);

    const meta = JSON.parse(readFileSync(tmp.path('out/scores.csv.meta.json'), 'utf8'));
    expect(meta.reconciliation).toEqual({ read: 5, scored: 3, rejected: { time_in_gap: 1, empty_text: 1 }, dropped: {} });
    expect(meta.lexicons.map((l: { name: string; sha256: string }) => l.name)).toEqual(['afinn-165', 'vader', 'daily-constructs']);
    expect(meta.lexicons[0].sha256).toMatch(/^[0-9a-f]{64}$/);
    expect(meta.columns.find((c: { name: string }) => c.name === 'daily-constructs.worry_per100w').aggregation).toBe('count');
  });

  it('writes no text unless --keep-text is given', () => {
    run(['score', input, '--time-zone', 'Europe/Brussels', '-o', 'plain.csv', '--max-rejects', 'none']);
    for (const file of ['plain.csv', 'plain.rejects.csv', 'plain.csv.meta.json']) {
      const content = readFileSync(tmp.path(file), 'utf8');
      expect(content, file).not.toMatch(/bees|colony|tired|Brussels,2026.*Slept/);
    }
    const kept = run(['score', input, '--time-zone', 'Europe/Brussels', '-o', 'kept.csv', '--keep-text', '--max-rejects', 'none']);
    expect(kept.status).toBe(0);
    const lines = readFileSync(tmp.path('kept.csv'), 'utf8').split('\n');
    expect(lines[0]?.endsWith(',text')).toBe(true);
    expect(lines[2]?.endsWith(',"Not happy, worried about the colony"')).toBe(true);
  });

  it('writes byte-identical scores whatever the machine zone (TZ=UTC and TZ=America/New_York)', () => {
    run(['score', input, '--time-zone', 'Europe/Brussels', '-o', 'utc.csv', '--max-rejects', 'none'], 'UTC');
    run(['score', input, '--time-zone', 'Europe/Brussels', '-o', 'ny.csv', '--max-rejects', 'none'], 'America/New_York');
    expect(readFileSync(tmp.path('ny.csv'), 'utf8')).toBe(readFileSync(tmp.path('utc.csv'), 'utf8'));
  });

  it('exits 3 when more rows are rejected than --max-rejects allows, after writing the outputs', () => {
    const r = run(['score', input, '--time-zone', 'Europe/Brussels', '-o', 'strict.csv', '--max-rejects', '1']);
    expect(r.status).toBe(3);
    expect(r.stderr).toContain('Too many rejected rows (limit 1); see strict.rejects.csv');
    expect(existsSync(tmp.path('strict.rejects.csv'))).toBe(true);
    expect(run(['score', input, '--time-zone', 'Europe/Brussels', '-o', 's2.csv', '--strict']).status).toBe(3);
    // 2 of 5 rows = 40% > the default 5%.
    expect(run(['score', input, '--time-zone', 'Europe/Brussels', '-o', 's3.csv']).status).toBe(3);
    expect(run(['score', input, '--time-zone', 'Europe/Brussels', '-o', 's4.csv', '--max-rejects', '50%']).status).toBe(0);
  });

  it('needs no zone when every time carries its UTC offset, and stops at the first time without one (RFC 3339 section 4.2)', () => {
    tmp.write('offsets.csv', 'id,person,time,text\ne1,p1,2026-03-01T08:00:00+01:00,a good day\ne2,p2,2026-03-01T08:00:00-05:00,a bad day\n');
    const placed = run(['score', tmp.path('offsets.csv'), '-o', 'offsets-out.csv']);
    expect(placed.status, placed.stderr).toBe(0);
    const rows = readFileSync(tmp.path('offsets-out.csv'), 'utf8').trim().split('\n').slice(1).map((l) => l.split(',').slice(0, 5));
    // 08:00+01:00 = 07:00Z and 08:00-05:00 = 13:00Z; the zone column holds the written offset.
    expect(rows).toEqual([
      ['e1', 'p1', '2026-03-01T07:00:00.000Z', 'UTC+01:00', '2026-03-01T08:00:00.000+01:00'],
      ['e2', 'p2', '2026-03-01T13:00:00.000Z', 'UTC-05:00', '2026-03-01T08:00:00.000-05:00'],
    ]);
    tmp.write('one-local.csv', 'id,person,time,text\ne1,p1,2026-03-01T08:00:00+01:00,fine\ne2,p1,2026-03-01 09:00,fine\n');
    const stopped = run(['score', tmp.path('one-local.csv'), '-o', 'one-local-out.csv']);
    expect(stopped.status).toBe(2);
    expect(stopped.stderr).toContain('line 3 has a time with no UTC offset');
    expect(stopped.stderr).toContain('--time-zone ZONE');
  });

  it('exits 2 with a message for usage errors', () => {
    const noZone = run(['score', input, '-o', 'x.csv']);
    expect(noZone.status).toBe(2);
    expect(noZone.stderr).toContain('No time zone given');
    const noOut = run(['score', input, '--time-zone', 'UTC']);
    expect(noOut.status).toBe(2);
    expect(noOut.stderr).toContain("required option '-o, --out <file>' not specified");
    const badLexicon = run(['score', input, '--time-zone', 'UTC', '-o', 'x.csv', '-l', 'afin']);
    expect(badLexicon.status).toBe(2);
    expect(badLexicon.stderr).toMatch(/Unknown lexicon `afin`; bundled lexicons are afinn-165, .*vader, or give the path of a \.lex\.tsv file/);
    const badZone = run(['score', input, '--time-zone', 'Europe/Brusels', '-o', 'x.csv']);
    expect(badZone.status).toBe(2);
    expect(badZone.stderr).toContain('unknown time zone `Europe/Brusels`');
    const missing = run(['score', 'nope.csv', '--time-zone', 'UTC', '-o', 'x.csv']);
    expect(missing.status).toBe(2);
    expect(missing.stderr).toContain('no such file');
    const badMax = run(['score', input, '--time-zone', 'UTC', '-o', 'x.csv', '--max-rejects', 'lots']);
    expect(badMax.status).toBe(2);
  });

  it('exits 2 and suggests --delimiter for a semicolon file, then reads it with --delimiter', () => {
    const semi = tmp.write('semi.csv', 'person;time;text\np1;2026-03-01T10:00:00Z;happy day\n');
    const r = run(['score', semi, '--time-zone', 'UTC', '-o', 'semi-out.csv']);
    expect(r.status, r.stderr).toBe(2);
    expect(r.stderr).toContain("pass --delimiter ';'");
    expect(run(['score', semi, '--time-zone', 'UTC', '-o', 'semi-out.csv', '--delimiter', ';']).status).toBe(0);
  });

  it('reads wall-clock times in each person\'s zone from --zones and applies --dst-gap', () => {
    const zones = tmp.write('zones.csv', 'person,zone\np1,America/New_York\np2,Europe/Brussels\n');
    const data = tmp.write('gap.csv', 'person,time,text\np1,2026-03-08 02:30,ok\np2,2026-03-29 02:30,ok\n');
    const r = run(['score', data, '--zones', zones, '--dst-gap', 'later', '-o', 'gap-out.csv', '-l', 'afinn-165']);
    expect(r.status, r.stderr).toBe(0);
    const rows = readFileSync(tmp.path('gap-out.csv'), 'utf8').trimEnd().split('\n').slice(1).map((l) => l.split(',').slice(2, 5).join(','));
    expect(rows).toEqual(['2026-03-08T07:30:00.000Z,America/New_York,2026-03-08T03:30:00.000-04:00', '2026-03-29T01:30:00.000Z,Europe/Brussels,2026-03-29T03:30:00.000+02:00']);
  });

  it('lists the bundled lexicons with license, categories and term counts', () => {
    const r = run(['lexicons']);
    expect(r.status).toBe(0);
    expect(r.stdout).toContain('afinn-165  version 165');
    expect(r.stdout).toContain('categories: valence (sum, 3382 terms)');
    expect(r.stdout).toContain('license:    MIT (VADER lexicon, C.J. Hutto)');
    expect(r.stdout).toContain('ILLUSTRATIVE AND UNVALIDATED');
  });
});
