import { readFileSync } from 'node:fs';
import Papa from 'papaparse';
import { beforeAll, describe, expect, it } from 'vitest';
import { runStudy } from '../../src/pipeline.js';
import { parseStudy } from '../../src/study/parse-study.js';
import { tempFolder } from '../support/temp-files.js';

// Invented 21-day diary study (2026-05-01 … 2026-05-21, Europe/Lisbon): "dana" answers every
// evening prompt but stops writing after day 16; "eli" writes every day.
const tmp = tempFolder('lexichron-window-');
const day = (d: number): string => `2026-05-${String(d).padStart(2, '0')}`;

beforeAll(() => {
  const text = ['person,time,text'];
  for (let d = 1; d <= 21; d++) {
    if (d <= 16) text.push(`dana,${day(d)}T09:00:00+01:00,a good calm morning with friends`);
    text.push(`eli,${day(d)}T10:00:00+01:00,a sad tired day`);
  }
  tmp.write('texts.csv', text.join('\n') + '\n');
  const ratings = ['person,time,mood'];
  for (let d = 1; d <= 21; d++) for (const p of ['dana', 'eli']) ratings.push(`${p},${day(d)}T20:00:00+01:00,${(d % 5) + 1}`);
  tmp.write('ratings.csv', ratings.join('\n') + '\n');
  const study = (extra: Record<string, unknown>, out: string) => JSON.stringify({ inputs: [{ path: 'texts.csv' }], timeZone: 'Europe/Lisbon', ratings: { path: 'ratings.csv', scales: { mood: [1, 5] } }, report: false, audit: false, out, ...extra });
  tmp.write('default.json', study({}, 'default'));
  tmp.write('dates.json', study({ series: { window: { from: '2026-05-01', to: '2026-05-21' } } }, 'dates'));
  tmp.write('entries.json', study({ series: { window: 'entries' } }, 'entries'));
});

function missingOf(out: string, person: string): string[] {
  const rows = Papa.parse<Record<string, string>>(readFileSync(tmp.path(`${out}/series-long.csv`), 'utf8'), { header: true, skipEmptyLines: true }).data;
  return rows.filter((r) => r.person === person).map((r) => r.missing ?? '');
}

describe('run: the study window shows dropouts', () => {
  it('by default with ratings, each series runs from the first to the last prompt: dana shows 5 days after_last_entry', async () => {
    await runStudy(tmp.path('default.json'), { now: '2026-12-01T00:00:00.000Z', seed: 1 });
    const dana = missingOf('default', 'dana');
    expect(dana).toHaveLength(21);
    expect(dana.filter((m) => m === 'after_last_entry')).toHaveLength(5);
    expect(missingOf('default', 'eli').filter((m) => m !== '')).toHaveLength(0);
  });

  it('series.window {from, to} sets the same window from dates', async () => {
    await runStudy(tmp.path('dates.json'), { now: '2026-12-01T00:00:00.000Z', seed: 1 });
    expect(missingOf('dates', 'dana').slice(16)).toEqual(Array(5).fill('after_last_entry'));
  });

  it('series.window "entries" keeps the old first-to-last-entry series (16 days, none missing)', async () => {
    await runStudy(tmp.path('entries.json'), { now: '2026-12-01T00:00:00.000Z', seed: 1 });
    expect(missingOf('entries', 'dana')).toEqual(Array(16).fill(''));
  });

  it('a malformed series.window, or one given twice, is a problem naming $.series.window', () => {
    const base = { inputs: [{ path: 'x.csv' }], timeZone: 'UTC', out: 'o' };
    for (const window of ['always', { from: '2026-05-01' }, 3]) {
      expect(parseStudy({ ...base, series: { window } }).problems.map((p) => p.path)).toEqual(['$.series.window']);
    }
    expect(parseStudy({ ...base, series: { window: { from: '2026-05-01', to: '2026-05-02' }, from: '2026-05-01' } }).problems.map((p) => p.path)).toEqual(['$.series.window']);
    expect(parseStudy({ ...base, series: { window: 'ratings' } }).problems.map((p) => p.path)).toEqual(['$.series.window']);
  });
});
