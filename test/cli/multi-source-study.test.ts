import { execFileSync, spawnSync } from 'node:child_process';
import { cpSync, existsSync, readFileSync } from 'node:fs';
import { resolve } from 'node:path';
import { beforeAll, describe, expect, it } from 'vitest';
import { readCsv } from '../support/csv.js';
import { tempFolder } from '../support/temp-files.js';

/**
 * End to end: `lexichron run study.json` on the invented multi-source study of
 * test/fixtures/multi-source-study (8 persons in Europe/Berlin and America/Chicago, 21 local days
 * across the EU clock change of 2026-10-25 and the US one of 2026-11-01, a dropout, a person who
 * moves from Berlin to Chicago, ratings with NA)
 * with one export of each kind lexichron reads, as it comes: JSON Lines (epoch ms), TSV (German
 * times), CSV (US times, byte-order mark, CRLF), mbox, diary, chat log and a chat app's JSON array,
 * each with its own column map or importer options and `time` options, and no pre-processing. Expected values: pandas 1.5.3,
 * zoneinfo (IANA tz) and statsmodels 0.13.5 in test/reference/multi-source-study/make-expected.py,
 * which reads the same export files on its own and wrote expected.json (regenerate with
 * /usr/bin/python3 in that folder). The test needs no Python.
 */
const root = resolve(__dirname, '../..');
const bin = resolve(root, 'bin/lexichron.js');
const fixture = resolve(root, 'test/fixtures/multi-source-study');
const tmp = tempFolder('lexichron-multi-source-');
const SCORE = 'afinn-165-plain.valence';

interface Expected {
  reconciliation: { read: number; scored: number; dropped: Record<string, number> };
  third_party_ids: string[];
  entries: Array<{ id: string; person: string; time_utc: string; words: number; score: number }>;
  bins: Array<{ person: string; local_date: string; bin_start: string; bin_hours: number; entries: number; words: number; score: number | null; missing: string }>;
  rating_bins: Array<{ person: string; local_date: string; reports: number; mood: number | null; energy: number | null; text_missing: string }>;
  statistics: Record<string, {
    pairs: number; persons: number; pooled_r: number; between_r: number; between_n: number; within_r_rm: number; within_df: number; within_slope: number;
    per_person_r: Record<string, number>; per_person_median: number; per_person_min: number; per_person_max: number; per_person_share_positive: number;
  }>;
}

interface PairJson {
  score: string;
  rating: string;
  pairs: number;
  persons: number;
  pooled: { r: number; n: number };
  between: { r: number; n: number };
  within: { r: number; df: number; n: number; slope: number };
  perPerson: { personsWithR: number; median: number; min: number; max: number; sharePositive: number };
}

const expected = JSON.parse(readFileSync(resolve(root, 'test/reference/multi-source-study/expected.json'), 'utf8')) as Expected;
const out = (name: string): string => tmp.path(`study/out/${name}`);

/** Equal to 1e-9, relative for values above 1 (CSV outputs carry 10 significant digits). */
function near(actual: number, wanted: number, label: string): void {
  expect(Number.isFinite(actual), `${label}: ${actual}`).toBe(true);
  expect(Math.abs(actual - wanted), `${label}: ${actual} vs ${wanted}`).toBeLessThanOrEqual(1e-9 * Math.max(1, Math.abs(wanted)));
}

let run: { status: number | null; stderr: string };
let scores: Record<string, string>[];
let series: Record<string, string>[];
let events: Record<string, string>[];

beforeAll(() => {
  if (!existsSync(resolve(root, 'dist/cli/main.js'))) execFileSync('npx', ['tsc', '-p', 'tsconfig.json'], { cwd: root, stdio: 'inherit' });
  cpSync(fixture, tmp.path('study'), { recursive: true });
  const r = spawnSync(process.execPath, [bin, 'run', 'study/study.json'], { cwd: tmp.dir, encoding: 'utf8' });
  run = { status: r.status, stderr: r.stderr };
  expect(run.status, run.stderr).toBe(0);
  scores = readCsv(out('scores.csv'));
  series = readCsv(out('series-long.csv'));
  events = readCsv(out('series-long.events.csv'));
}, 120_000);

describe('lexichron run on an invented multi-source study (reference: pandas + zoneinfo, make-expected.py)', () => {
  it('the exports are as they come: US and German times, a CSV with byte-order mark and CRLF, a CRLF diary, U+202F before AM/PM, NA ratings', () => {
    const csv = readFileSync(resolve(fixture, 'us-site.csv'), 'utf8');
    expect(csv.charCodeAt(0)).toBe(0xfeff);
    expect(csv).toContain('\r\n');
    expect(csv).toMatch(/\d{2}\/\d{2}\/2026 \d{1,2}:\d{2} [AP]M/);
    expect(readFileSync(resolve(fixture, 'lab-ema.tsv'), 'utf8')).toMatch(/\t\d{2}\.\d{2}\.2026 \d{2}:\d{2}\t/);
    expect(readFileSync(resolve(fixture, 'p04-diary.txt'), 'utf8')).toContain('\r\n');
    expect(readFileSync(resolve(fixture, 'p07-chat.txt'), 'utf8')).toContain('\u202fPM - ');
    expect(readFileSync(resolve(fixture, 'ratings.csv'), 'utf8')).toContain(',NA');
    expect(readFileSync(resolve(fixture, 'p03-mail.mbox'), 'utf8')).toContain('Content-Transfer-Encoding: quoted-printable');
  });

  it('runs from the one study file and reconciles read = scored + dropped, third parties and the system line counted as dropped', () => {
    const manifest = JSON.parse(readFileSync(out('manifest.json'), 'utf8')) as { reconciliation: { read: number; scored: number; rejected: Record<string, number>; dropped: Record<string, number> } };
    expect(manifest.reconciliation.read).toBe(expected.reconciliation.read);
    expect(manifest.reconciliation.scored).toBe(expected.reconciliation.scored);
    expect(manifest.reconciliation.rejected).toEqual({});
    expect(manifest.reconciliation.dropped).toEqual(expected.reconciliation.dropped);
    expect(expected.reconciliation.dropped.third_party).toBeGreaterThan(30);
    expect(run.stderr).toMatch(new RegExp(`third_party\\s+${expected.reconciliation.dropped.third_party}\\b`));
  });

  it('scores every own entry with the reference time, words and plain AFINN-165 sum, and no message of anyone else', () => {
    expect(scores).toHaveLength(expected.entries.length);
    const byId = new Map(scores.map((r) => [r.entry_id, r]));
    for (const e of expected.entries) {
      const row = byId.get(e.id);
      expect(row, e.id).toBeDefined();
      expect([row?.person, row?.time_utc, Number(row?.words), Number(row?.[SCORE])], e.id).toEqual([e.person, e.time_utc, e.words, e.score]);
    }
    for (const id of expected.third_party_ids) expect(byId.has(id), id).toBe(false);
    // Others' words are strongly valenced (terrible, catastrophe, wonderful ...), so any of them
    // scored by mistake (a reply, a quoted line, a signature) would have changed a sum above.
    expect(new Set(scores.map((r) => r.person))).toEqual(new Set(['p01', 'p02', 'p03', 'p04', 'p05', 'p06', 'p07', 'p08']));
  });

  it('lays every person over the 21 study days in their own zone, bin for bin as pandas resample("D", offset="4h")', () => {
    expect(series).toHaveLength(8 * 21);
    expect(series).toHaveLength(expected.bins.length);
    const byKey = new Map(series.map((r) => [`${r.person} ${r.local_date}`, r]));
    for (const b of expected.bins) {
      const key = `${b.person} ${b.local_date}`;
      const row = byKey.get(key);
      expect(row, key).toBeDefined();
      if (!row) continue;
      expect([row.bin_start, Number(row.bin_hours), Number(row.entries), Number(row.words), row.missing], key).toEqual([b.bin_start, b.bin_hours, b.entries, b.words, b.missing]);
      if (b.score === null) expect(row[SCORE], key).toBe('');
      else near(Number(row[SCORE]), b.score, `${key} ${SCORE}`);
    }
  });

  it('bins the clock-change days by local time: 25-hour days, and repeated-hour entries read with each input\'s own dstOverlap (IANA tz 2026)', () => {
    const hours = (person: string, day: string): number => Number(series.find((r) => r.person === person && r.local_date === day)?.bin_hours);
    // Day start 04:00: the Berlin day of 2026-10-24 runs to 04:00 on the 25th and holds 03:00 CEST -> 02:00 CET.
    expect(hours('p01', '2026-10-24')).toBe(25);
    expect(hours('p01', '2026-10-25')).toBe(24);
    expect(hours('p05', '2026-10-24')).toBe(24);
    // Chicago: 2026-11-01 02:00 CDT -> 01:00 CST falls in the day of 2026-10-31.
    expect(hours('p05', '2026-10-31')).toBe(25);
    expect(hours('p01', '2026-10-31')).toBe(24);
    const event = (id: string): Record<string, string> | undefined => events.find((r) => r.entry_id === id);
    const diary = events.find((r) => r.person === 'p04' && r.time_local === '2026-10-25T02:30:00.000+01:00');
    expect(diary?.time_utc, 'diary 02:30 on 2026-10-25, dstOverlap later: the second 02:30 (CET)').toBe('2026-10-25T01:30:00.000Z');
    expect(diary?.local_date).toBe('2026-10-24');
    const site = events.find((r) => r.person === 'p05' && r.time_local.startsWith('2026-11-01T01:30'));
    expect(site?.time_utc, 'CSV 11/01/2026 1:30 AM, dstOverlap later: CST').toBe('2026-11-01T07:30:00.000Z');
    expect(site?.local_date).toBe('2026-10-31');
    const chat = events.find((r) => r.person === 'p07' && r.time_local.startsWith('2026-11-01T01:15'));
    expect(chat?.time_utc, 'chat 11/1/26 1:15 AM, dstOverlap earlier: CDT').toBe('2026-11-01T06:15:00.000Z');
    const after = events.find((r) => r.person === 'p02' && r.time_local === '2026-10-25T04:10:00.000+01:00');
    expect(after?.local_date, '04:10 CET is after the 04:00 day start').toBe('2026-10-25');
    expect(event(after?.entry_id ?? '')?.bin_start).toBe('2026-10-25T04:00:00+01:00');
  });

  it('places the diary of a person who moves (Europe/Berlin, then America/Chicago from 2026-11-04) in the zone of each date: the day before the move lasts 31 hours', () => {
    const p04 = series.filter((r) => r.person === 'p04');
    expect(p04.find((r) => r.local_date === '2026-11-03')).toMatchObject({ bin_start: '2026-11-03T04:00:00+01:00', bin_hours: '31' });
    expect(p04.find((r) => r.local_date === '2026-11-04')?.bin_start).toBe('2026-11-04T04:00:00-06:00');
    const after = scores.filter((r) => r.person === 'p04' && r.time_local >= '2026-11-04');
    expect(after.length).toBeGreaterThan(3);
    for (const r of after) {
      expect(r.zone, r.entry_id).toBe('America/Chicago');
      expect(r.time_local.endsWith('-06:00'), r.entry_id).toBe(true);
    }
  });

  it('shows the dropout\'s last 5 days as after_last_entry and the late starter\'s first 2 as before_first_entry', () => {
    const missing = (person: string, reason: string): string[] => series.filter((r) => r.person === person && r.missing === reason).map((r) => r.local_date);
    expect(missing('p06', 'after_last_entry')).toEqual(['2026-11-04', '2026-11-05', '2026-11-06', '2026-11-07', '2026-11-08']);
    expect(missing('p08', 'before_first_entry')).toEqual(['2026-10-19', '2026-10-20']);
    expect(expected.bins.filter((b) => b.person === 'p06' && b.missing === 'after_last_entry')).toHaveLength(5);
  });

  it('averages the self-reports per bin without the NA codes, and pairs only bins with both a text score and a rating', () => {
    const pairs = readCsv(out('validation/validation-pairs.csv'));
    expect(pairs).toHaveLength(expected.rating_bins.length);
    const byKey = new Map(pairs.map((r) => [`${r.person} ${r.time.slice(0, 10)}`, r]));
    for (const b of expected.rating_bins) {
      const key = `${b.person} ${b.local_date}`;
      const row = byKey.get(key);
      expect(row, key).toBeDefined();
      if (!row) continue;
      expect([Number(row.reports), row.text_missing], key).toEqual([b.reports, b.text_missing]);
      for (const rating of ['mood', 'energy'] as const) {
        const want = b[rating];
        if (want === null) expect(row[rating], `${key} ${rating}: only NA`).toBe('');
        else near(Number(row[rating]), want, `${key} ${rating}`);
      }
    }
    // Some bins hold only NA for a rating, and the dropout's prompts after their last entry have no text: neither is a pair.
    expect(expected.rating_bins.some((b) => b.mood === null)).toBe(true);
    expect(expected.rating_bins.some((b) => b.person === 'p06' && b.text_missing === 'after_last_entry')).toBe(true);
    const diagnostics = readCsv(out('validation/validation-diagnostics.csv'));
    expect(diagnostics.filter((d) => d.code === 'rating_not_numeric')).toEqual([]);
  });

  it('gives the pooled, between-person and repeated-measures correlations of the reference (Bakdash & Marusich 2017; statsmodels ANCOVA)', () => {
    const validation = JSON.parse(readFileSync(out('validation/validation.json'), 'utf8')) as { pairs: PairJson[] };
    for (const rating of ['mood', 'energy']) {
      const want = expected.statistics[`${SCORE}:${rating}`];
      const got = validation.pairs.find((p) => p.score === SCORE && p.rating === rating);
      expect(want && got, rating).toBeTruthy();
      if (!want || !got) continue;
      expect([got.pairs, got.persons, got.between.n, got.within.n, got.within.df], rating).toEqual([want.pairs, want.persons, want.between_n, want.pairs, want.within_df]);
      near(got.pooled.r, want.pooled_r, `${rating} pooled r`);
      near(got.between.r, want.between_r, `${rating} r of person means`);
      near(got.within.r, want.within_r_rm, `${rating} r_rm`);
      near(got.within.slope, want.within_slope, `${rating} within slope`);
      expect(got.perPerson.personsWithR).toBe(Object.keys(want.per_person_r).length);
      near(got.perPerson.median, want.per_person_median, `${rating} median of persons' r`);
      near(got.perPerson.min, want.per_person_min, `${rating} min of persons' r`);
      near(got.perPerson.max, want.per_person_max, `${rating} max of persons' r`);
      near(got.perPerson.sharePositive, want.per_person_share_positive, `${rating} share positive`);
    }
    const persons = readCsv(out('validation/validation-persons.csv'));
    for (const row of persons) {
      const want = expected.statistics[`${row.score}:${row.rating}`]?.per_person_r[row.person as string];
      if (want === undefined) expect(row.r, `${row.person} ${row.rating}`).toBe('');
      else near(Number(row.r), want, `${row.person} ${row.rating} own r`);
    }
  });
});
