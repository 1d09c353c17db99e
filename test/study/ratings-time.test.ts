import { readFileSync } from 'node:fs';
import { beforeAll, describe, expect, it } from 'vitest';
import { validateStage } from '../../src/io/study-stages.js';
import { runStudy } from '../../src/pipeline.js';
import { parseStudy } from '../../src/study/parse-study.js';
import { readCsv } from '../support/csv.js';
import { tempFolder } from '../support/temp-files.js';

// Invented study, Europe/Brussels, 2026-03-26 … 2026-03-31 (IANA tz: clocks jump from 02:00 to
// 03:00 on 2026-03-29). The text export writes RFC 3339 with offsets; the self-report export writes
// `dd.MM.yyyy HH:mm` wall-clock times under its own column names, one of them inside the gap, and one
// row written as RFC 3339 by a later export version.
const tmp = tempFolder('lexichron-ratings-time-');
const days = [26, 27, 28, 29, 30, 31];

beforeAll(() => {
  const texts = days.flatMap((d) => {
    const offset = d >= 29 ? '+02:00' : '+01:00';
    return [`{"person":"ann","time":"2026-03-${d}T10:00:00${offset}","text":"${d % 2 === 0 ? 'a good happy day' : 'a sad bad day'}"}`, `{"person":"ben","time":"2026-03-${d}T11:00:00${offset}","text":"${d % 2 === 0 ? 'a bad sad day' : 'a happy good day'}"}`];
  });
  tmp.write('texts.jsonl', texts.join('\n') + '\n');
  const ratings = ['pid;answered;mood'];
  for (const d of days) {
    // ann's 29 March prompt at 02:30 does not exist in Brussels; ben's 31 March row is RFC 3339.
    ratings.push(`ann;${d === 29 ? '29.03.2026 02:30' : `${d}.03.2026 20:00`};${d % 2 === 0 ? 80 : 20}`);
    ratings.push(`ben;${d === 31 ? '2026-03-31T20:00:00+02:00' : `${d}.03.2026 21:00`};${d % 2 === 0 ? 25 : 75}`);
  }
  tmp.write('self-reports.csv', ratings.join('\n') + '\n');
  tmp.write('study.json', JSON.stringify({
    inputs: [{ path: 'texts.jsonl' }],
    timeZone: 'Europe/Brussels',
    lexicons: ['afinn-165'],
    ratings: {
      path: 'self-reports.csv',
      delimiter: ';',
      columns: { person: 'pid', time: 'answered' },
      scales: { mood: [0, 100] },
      replicates: 0,
      minPairs: 2,
      time: { format: 'dd.MM.yyyy HH:mm', dstGap: 'later' },
    },
    dynamics: false,
    audit: false,
    report: false,
    out: 'out',
  }));
});

describe('the ratings of a study take their own time options and column map', () => {
  it('reads self-reports in another time format, gap policy and column names than the text, and pairs each with its own local day', async () => {
    const result = await runStudy(tmp.path('study.json'), { now: '2026-12-01T00:00:00.000Z', seed: 1, stages: [['validate', validateStage]] });
    const validation = result.manifest.stages.validate as { reconciliation: { read: number; kept: number; rejected: Record<string, number>; notes?: Record<string, number> } };
    // The RFC 3339 row is read by the fallback of ratings.time.format, and counted; no rating is missing.
    expect(validation.reconciliation).toEqual({ read: 12, kept: 12, rejected: {}, missing: {}, codes: ['NA'], notes: { time_iso_fallback: 1 } });
    const pairs = readCsv(tmp.path('out/validation/validation-pairs.csv'));
    // One occasion per person and day, each with the rating of that local day.
    const got = pairs.map((r) => [r.person, (r.time ?? '').slice(0, 10), r.mood]);
    const want = days.flatMap((d) => [['ann', `2026-03-${d}`, d % 2 === 0 ? '80' : '20'], ['ben', `2026-03-${d}`, d % 2 === 0 ? '25' : '75']]);
    expect(got.sort()).toEqual(want.sort());
    // The gap time 02:30 read with dstGap "later": the offset before the change, 02:30 − 1 h = 01:30Z.
    const diagnostics = readFileSync(tmp.path('out/validation/validation-diagnostics.csv'), 'utf8');
    expect(diagnostics).not.toMatch(/time_in_gap/);
  });

  it('counts the text rows read by the RFC 3339 fallback of a study\'s time.format in the manifest', async () => {
    tmp.write('us.csv', 'person,time,text\nann,03/02/2026 9:30 AM,good day\nann,2026-03-03T21:30:00Z,bad night\n');
    tmp.write('us.json', JSON.stringify({ inputs: ['us.csv'], timeZone: 'UTC', time: { format: 'MM/dd/yyyy h:mm a' }, lexicons: ['afinn-165'], series: { window: 'entries' }, dynamics: false, audit: false, report: false, out: 'out-us' }));
    const result = await runStudy(tmp.path('us.json'), { now: '2026-12-01T00:00:00.000Z', seed: 1 });
    expect(result.manifest.reconciliation).toMatchObject({ read: 2, scored: 2, notes: { time_iso_fallback: 1 } });
  });

  it('names a key the ratings do not use with its JSON path and where it belongs', () => {
    const base = { inputs: [{ path: 'texts.csv' }], timeZone: 'UTC', out: 'out' };
    const ratings = (extra: Record<string, unknown>) => ({ ...base, ratings: { path: 'r.csv', scales: { mood: [0, 100] }, ...extra } });
    const one = (extra: Record<string, unknown>) => {
      const { problems } = parseStudy(ratings(extra));
      expect(problems).toHaveLength(1);
      return problems[0] as { path: string; message: string };
    };
    expect(one({ timeFormat: 'dd.MM.yyyy' })).toEqual({ path: '$.ratings.timeFormat', message: expect.stringContaining('"time": {"format": …}') });
    expect(one({ epoch: 'ms' }).message).toContain('"time": {"epoch": …}');
    expect(one({ timeZone: 'Europe/Brussels' }).message).toContain('$.timeZone');
    expect(one({ senderField: 'from' }).message).toContain('chat-table inputs');
    expect(one({ bin: '1d' }).message).toContain('$.series.bin');
    expect(one({ time: { formt: 'x' } }).path).toBe('$.ratings.time.formt');
    expect(one({ time: { epoch: 'minutes' } }).path).toBe('$.ratings.time.epoch');
    expect(one({ time: 'dd.MM.yyyy' }).path).toBe('$.ratings.time');
  });
});
