import { mkdtemp, readFile, rm, writeFile } from 'node:fs/promises';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { buildZoneTable } from '../../src/ingest/zone-table.js';
import { runValidate } from '../../src/io/run-validate.js';
import { random } from '../../src/stats/random.js';
import { normal } from '../validate/build-pairs.js';

let dir: string;
const DAY = 86_400_000;
const t0 = Date.parse('2026-03-01T00:00:00Z');

/** A small long series (12 persons × 15 daily bins, UTC) and matching self-reports whose mood follows the score within persons. */
async function writeFixtures(): Promise<void> {
  const source = random(42);
  const series = ['person,t,bin_start,bin_end,local_date,day,bin_of_day,bin_hours,hours_since_prev,entries,words,missing,lag_valid,s,s.n,s.person_mean,s.within'];
  const events = ['entry_id,person,time_utc,time_local,zone,bin_start,local_date,excluded,words,s'];
  const ratings = ['person,time,mood,calm'];
  for (let p = 0; p < 12; p++) {
    const person = `p${String(p + 1).padStart(2, '0')}`;
    const level = normal(source);
    for (let d = 0; d < 15; d++) {
      const start = new Date(t0 + d * DAY).toISOString().replace('.000Z', '+00:00');
      const end = new Date(t0 + (d + 1) * DAY).toISOString().replace('.000Z', '+00:00');
      const missing = d === 3 ? 'no_text' : '';
      const s = level + normal(source);
      series.push(`${person},${d},${start},${end},${start.slice(0, 10)},${d + 1},1,24,24,${missing ? 0 : 2},${missing ? 0 : 40},${missing},1,${missing ? '' : s.toFixed(4)},3,,`);
      if (!missing) for (let e = 0; e < 2; e++) events.push(`e${p}-${d}-${e},${person},${new Date(t0 + d * DAY + (8 + e) * 3_600_000).toISOString()},,UTC,${start},${start.slice(0, 10)},0,20,${(s + normal(source) * 0.5).toFixed(4)}`);
      const mood = Math.max(0, Math.min(100, Math.round(50 + 8 * (s - level) - 5 * level + normal(source) * 6)));
      ratings.push(`${person},${new Date(t0 + d * DAY + 12 * 3_600_000).toISOString()},${mood},${1 + ((d + p) % 7)}`);
    }
  }
  ratings.push('p01,2026-03-02T13:00:00Z,140,4'); // out of scale
  ratings.push('p01,2026-03-02T14:00:00Z,fine,4'); // not numeric
  ratings.push('p02,not a time,50,4'); // bad time
  ratings.push('zz,2026-03-02T14:00:00Z,50,4'); // unknown person
  await writeFile(path.join(dir, 'series-long.csv'), series.join('\n') + '\n');
  await writeFile(path.join(dir, 'series-long.events.csv'), events.join('\n') + '\n');
  await writeFile(path.join(dir, 'reports.csv'), ratings.join('\n') + '\n');
}

beforeAll(async () => {
  dir = await mkdtemp(path.join(tmpdir(), 'lexichron-validate-'));
  await writeFixtures();
});
afterAll(async () => {
  await rm(dir, { recursive: true, force: true });
});

const run = (out: string, extra: Partial<Parameters<typeof runValidate>[0]> = {}) =>
  runValidate({
    series: path.join(dir, 'series-long.csv'),
    events: path.join(dir, 'series-long.events.csv'),
    ratings: path.join(dir, 'reports.csv'),
    zones: buildZoneTable([], '', 'UTC'),
    scales: 'mood=0:100,calm=1:7',
    out: path.join(dir, out),
    validate: { replicates: 200, seed: 7, minPairs: 5 },
    ...extra,
  });

describe('runValidate', () => {
  it('writes every table, with reasons for rejected self-reports and no NaN anywhere', async () => {
    const result = await run('out1');
    const diagnostics = await readFile(result.files.diagnostics as string, 'utf8');
    expect(diagnostics).toMatch(/rating_out_of_scale,"rating `mood` is 140, outside its declared scale 0 to 100; the value is left out",reports.csv,182,validate/);
    expect(diagnostics).toMatch(/rating_not_numeric/);
    expect(diagnostics).toMatch(/bad_time/);
    expect(diagnostics).toMatch(/rating_person_not_in_series/);
    for (const file of Object.values(result.files)) {
      if (file) expect(await readFile(file, 'utf8')).not.toMatch(/NaN|Infinity/);
    }
    expect(result.scoreColumns).toEqual(['s']);
    expect(result.ratingColumns).toEqual(['mood', 'calm']);
    const stats = await readFile(result.files.statistics as string, 'utf8');
    expect(stats.split('\n')[0]).toBe('score,rating,level,statistic,estimate,se,ci_low,ci_high,df,n,p,note');
    const within = stats.split('\n').find((l) => l.startsWith('s,mood,within,r_rm,'));
    expect(Number(within?.split(',')[4])).toBeGreaterThan(0.5);
    expect(within?.split(',')[8]).toBe(String(12 * 14 - 12 - 1));
  });
  it('pairs each self-report with its bin and leaves bins without text empty, saying why', async () => {
    const result = await run('out2');
    const pairs = (await readFile(result.files.pairs as string, 'utf8')).split('\n');
    expect(pairs[0]).toBe('person,time,time_utc,entries,words,text_missing,reports,s,mood,calm');
    const missing = pairs.find((l) => l.startsWith('p01,2026-03-04'));
    expect(missing).toMatch(/^p01,2026-03-04T00:00:00\+00:00,2026-03-04T00:00:00.000Z,0,0,no_text,1,,\d+,\d$/);
  });
  it('gives byte-identical outputs for the same seed', async () => {
    const a = await run('out3');
    const b = await run('out4');
    for (const key of Object.keys(a.files) as (keyof typeof a.files)[]) {
      if (!a.files[key]) continue;
      expect(await readFile(b.files[key] as string, 'utf8')).toBe(await readFile(a.files[key] as string, 'utf8'));
    }
  });
  it('estimates the word-count reliability from the event file', async () => {
    const result = await run('out5');
    expect(result.files.reliability).toBeDefined();
    expect(result.result.reliability[0]?.bins).toBe(12 * 14);
  });
  it('aligns by prompt windows from the event file', async () => {
    const result = await run('out6', { series: undefined, validate: { align: 'window', windowMinutes: 240, minWords: 10, replicates: 0, minPairs: 5 } });
    const row = result.result.rows.find((r) => r.person === 'p01' && r.label.startsWith('2026-03-01T12:00'));
    expect([row?.entries, row?.words, row?.missing]).toEqual([2, 40, '']);
  });
  it('scores the split halves with the series\' reducer and warns about its --min-words, both read from the series .meta.json', async () => {
    const meta = path.join(dir, 'series-long.csv.meta.json');
    await writeFile(meta, JSON.stringify({ options: { minWords: 3 }, columns: [{ name: 's', aggregation: 'sum', reducer: 'mean' }] }));
    try {
      const result = await run('out8', { validate: { replicates: 0, seed: 7, minPairs: 5, reliability: 0.3 } });
      const rel = result.result.reliability[0];
      expect(rel?.reducer).toBe('mean');
      const table = await readFile(result.files.reliability as string, 'utf8');
      expect(table.split('\n')[1]).toMatch(/,mean,100,/);
      // Every bin holds 40 words (band 25–50), reliable enough: the recommendation is 25 words.
      expect([rel?.basis, rel?.minWords]).toEqual(['observed', 25]);
      expect(rel?.warning).toMatch(/--min-words is 3, below the 25 words/);
    } finally {
      await rm(meta, { force: true });
    }
    const without = await run('out9', { validate: { replicates: 0, seed: 7, minPairs: 5 } });
    expect(without.result.reliability[0]?.reducer).toBe('weighted');
  });
  it('asks for a scale for every rating column', async () => {
    await expect(run('out7', { scales: 'mood=0:100' })).rejects.toThrow(/No scale declared for rating `calm`/);
  });
});
