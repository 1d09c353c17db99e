import { beforeAll, describe, expect, it } from 'vitest';
import { validateStage } from '../../src/io/study-stages.js';
import { runStudy } from '../../src/pipeline.js';
import { parseStudy } from '../../src/study/parse-study.js';
import { readCsv } from '../support/csv.js';
import { tempFolder } from '../support/temp-files.js';

// A study whose every time carries its UTC offset (RFC 3339 section 4.2: local time = UTC + offset)
// needs no zone file: a person without a zone keeps the written offset. Invented persons; "cai"
// writes in Brussels across the 2026-03-29 clock change (IANA tz: +01:00, then +02:00), "dev" in
// New York (−04:00 after 2026-03-08).
const tmp = tempFolder('lexichron-no-zones-');
const days = [27, 28, 29, 30, 31];
const brussels = (d: number): string => (d >= 29 ? '+02:00' : '+01:00');
const now = '2026-12-01T00:00:00.000Z';

beforeAll(() => {
  const texts = days.flatMap((d) => [
    `{"person":"cai","time":"2026-03-${d}T23:30:00${brussels(d)}","text":"${d % 2 === 0 ? 'a good happy evening' : 'a sad bad evening'}"}`,
    `{"person":"dev","time":"2026-03-${d}T21:00:00-04:00","text":"${d % 2 === 0 ? 'a bad sad night' : 'a happy good night'}"}`,
  ]);
  tmp.write('texts.jsonl', texts.join('\n') + '\n');
  const ratings = ['person,time,mood', ...days.flatMap((d) => [`cai,2026-03-${d}T22:00:00${brussels(d)},${d % 2 === 0 ? 80 : 20}`, `dev,2026-03-${d}T20:00:00-04:00,${d % 2 === 0 ? 25 : 75}`])];
  tmp.write('ratings.csv', ratings.join('\n') + '\n');
  const study = { inputs: [{ path: 'texts.jsonl' }], lexicons: ['afinn-165'], ratings: { path: 'ratings.csv', scales: { mood: [0, 100] }, replicates: 0, minPairs: 2 }, dynamics: false, audit: false, report: false };
  tmp.write('offsets.json', JSON.stringify({ ...study, out: 'out-offsets' }));
  tmp.write('wall.csv', 'person,time,text\ncai,2026-03-27T23:30:00+01:00,a good day\ncai,2026-03-28 23:30,a bad day\n');
  tmp.write('wall-text.json', JSON.stringify({ ...study, inputs: [{ path: 'wall.csv' }], ratings: undefined, series: { window: 'entries' }, out: 'out-wall' }));
  tmp.write('wall-ratings.csv', 'person,time,mood\ncai,2026-03-27T22:00:00+01:00,50\ncai,2026-03-28 22:00,60\n');
  tmp.write('wall-ratings.json', JSON.stringify({ ...study, ratings: { ...study.ratings, path: 'wall-ratings.csv' }, out: 'out-wall-ratings' }));
});

describe('a study whose times all carry offsets needs no zones', () => {
  it('accepts a study file without zones or timeZone', () => {
    expect(parseStudy({ inputs: ['texts.jsonl'], out: 'out' }).problems).toEqual([]);
  });

  it('runs, keeps each written offset as the local time, and pairs self-reports with their local days', async () => {
    const result = await runStudy(tmp.path('offsets.json'), { now, seed: 1, stages: [['validate', validateStage]] });
    expect(result.score.reconciliation).toMatchObject({ read: 10, scored: 10, rejected: {} });
    const scores = readCsv(tmp.path('out-offsets/scores.csv'));
    // The local time is the written one (23:30 in Brussels is 22:30Z or 21:30Z: the next UTC day never takes it).
    expect(scores.filter((r) => r.person === 'cai').map((r) => r.time_local)).toEqual(days.map((d) => `2026-03-${d}T23:30:00.000${brussels(d)}`));
    expect(new Set(scores.filter((r) => r.person === 'dev').map((r) => r.zone))).toEqual(new Set(['UTC-04:00']));
    // Each person has one daily bin per local day, none missing.
    const series = readCsv(tmp.path('out-offsets/series-long.csv'));
    expect(series.filter((r) => r.person === 'cai').map((r) => [(r.bin_start ?? '').slice(0, 10), r.missing])).toEqual(days.map((d) => [`2026-03-${d}`, '']));
    const pairs = readCsv(tmp.path('out-offsets/validation/validation-pairs.csv'));
    const got = pairs.map((r) => [r.person, (r.time ?? '').slice(0, 10), r.mood]).sort();
    const want = days.flatMap((d) => [['cai', `2026-03-${d}`, d % 2 === 0 ? '80' : '20'], ['dev', `2026-03-${d}`, d % 2 === 0 ? '25' : '75']]).sort();
    expect(got).toEqual(want);
  });

  it('stops with a message saying what to add when a text time lacks an offset and no zone is known', async () => {
    await expect(runStudy(tmp.path('wall-text.json'), { now, seed: 1 })).rejects.toThrow(/wall\.csv.*line 3.*no UTC offset.*"timeZone".*"zones"/s);
  });

  it('stops with a message saying what to add when a self-report time lacks an offset and no zone is known', async () => {
    await expect(runStudy(tmp.path('wall-ratings.json'), { now, seed: 1, stages: [['validate', validateStage]] })).rejects.toThrow(/wall-ratings\.csv.*line 3.*no UTC offset.*"timeZone".*"zones"/s);
  });
});
