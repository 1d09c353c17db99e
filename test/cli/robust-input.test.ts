import { existsSync, readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { DEFAULT_TIME_OPTIONS } from '../../src/ingest/parse-instant.js';
import { timeWindow } from '../../src/ingest/time-window.js';
import { buildZoneTable } from '../../src/ingest/zone-table.js';
import { readRatings } from '../../src/io/run-validate.js';
import { readZoneFile } from '../../src/io/read-zone-file.js';
import { runCli } from '../support/run-cli.js';
import { tempFolder } from '../support/temp-files.js';

// Each case was reproduced on the code before issue 19's fixes: an internal error (exit 1,
// RangeError: Invalid time value), a silently wrong value, or an empty output with exit 0.
// ECMA-262 section 21.4.1.1: time values lie within ±8.64e15 ms of the epoch.

const tmp = tempFolder();
const OUT_OF_RANGE = ['+275760-09-13T00:00:00Z', '8640000000000001', '-8640000000000001'];

function rejectsOf(path: string): string[][] {
  return readFileSync(path, 'utf8').trim().split('\n').slice(1).map((l) => l.split(','));
}

describe('times out of range are counted rejects, never internal errors', () => {
  for (const [k, time] of OUT_OF_RANGE.entries()) {
    it(`score rejects the time ${time} with its row's line and exits 0 or 3`, async () => {
      const input = tmp.write(`range-${k}.csv`, `person,time,text\np1,2026-03-01T10:00:00Z,a fine day\np1,${time},a fine day\n`);
      const out = tmp.path(`range-${k}/scores.csv`);
      const { code } = await runCli('score', input, '--time-zone', 'Europe/Brussels', '-o', out, '--max-rejects', 'none');
      expect(code).toBe(0);
      const rows = rejectsOf(out.replace(/\.csv$/, '.rejects.csv'));
      expect(rows.map((r) => [r[1], r[3]])).toEqual([['3', expect.stringMatching(/^(bad_time|time_outside_window)$/)]]);
    });

    it(`validate's self-report reader rejects the time ${time} with its line`, async () => {
      const ratings = tmp.write(`ratings-${k}.csv`, `person,time,mood\np1,2026-03-01T10:00:00Z,50\np1,${time},40\n`);
      const options = { ...DEFAULT_TIME_OPTIONS, window: timeWindow(Date.UTC(2026, 11, 3)) };
      const read = await readRatings({ ratings, zones: buildZoneTable([], '', 'Europe/Brussels'), scales: 'mood=0:100', time: options });
      expect(read.ratings).toHaveLength(1);
      expect(read.diagnostics.map((d) => [d.source?.line, d.code])).toEqual([[3, expect.stringMatching(/^(bad_time|time_outside_window)$/)]]);
    });

    it(`import chat-table rejects the time ${time} with its line`, async () => {
      const input = tmp.write(`chat-${k}.csv`, `sender,time,text\nAda,2026-03-01T10:00:00Z,hello there\nAda,${time},hello again\n`);
      const out = tmp.path(`chat-${k}/entries.jsonl`);
      const { code } = await runCli('import', 'chat-table', input, '--person', 'p1', '--sender', 'Ada', '--time-zone', 'Europe/Brussels', '-o', out);
      expect(code).toBe(0);
      expect(readFileSync(out, 'utf8').trim().split('\n')).toHaveLength(1);
      expect(rejectsOf(`${out}.rejects.csv`).map((r) => [r[1], r[2]])).toEqual([['3', expect.stringMatching(/^(bad_time|time_outside_window)$/)]]);
    });
  }
});

describe('plausible years only', () => {
  it('score rejects two-digit-year dates and a microsecond epoch read as seconds by default', async () => {
    const input = tmp.write('years.csv', 'person,time,text\np1,0026-03-01 10:00,good\np1,0099-12-31T10:00:00Z,good\np1,1700000000000000,good\np1,2026-03-01 10:00,good\n');
    const out = tmp.path('years/scores.csv');
    const { code } = await runCli('score', input, '--time-zone', 'Europe/Brussels', '-o', out, '--max-rejects', 'none');
    expect(code).toBe(0);
    expect(rejectsOf(out.replace(/\.csv$/, '.rejects.csv')).map((r) => [r[1], r[3]])).toEqual([['2', 'time_outside_window'], ['3', 'time_outside_window']]);
    const times = readFileSync(out, 'utf8').trim().split('\n').slice(1).map((l) => l.split(',')[2]);
    // 1700000000000000 µs = 2023-11-14T22:13:20Z (by magnitude: a 16-digit number is microseconds).
    expect(times).toEqual(['2023-11-14T22:13:20.000Z', '2026-03-01T09:00:00.000Z']);
  });

  it('--time-window widens the window, and early offsets are written as valid RFC 3339 (§5.6 time-numoffset)', async () => {
    // Brussels kept local mean time, +00:17:30, until 1880 (IANA tz data, europe file): 17.5 minutes.
    const input = tmp.write('early.csv', 'person,time,text\np1,1500-06-01 10:00,good\n');
    const out = tmp.path('early/scores.csv');
    const { code } = await runCli('score', input, '--time-zone', 'Europe/Brussels', '-o', out, '--time-window', '1400-01-01/');
    expect(code).toBe(0);
    const local = readFileSync(out, 'utf8').trim().split('\n')[1]?.split(',')[4] ?? '';
    expect(local).toMatch(/^1500-06-01T\d{2}:\d{2}:\d{2}\.\d{3}\+00:1[78]$/);
    const utc = readFileSync(out, 'utf8').trim().split('\n')[1]?.split(',')[2] ?? '';
    expect(utc).toBe('1500-06-01T09:42:30.000Z'); // the instant stays exact: 10:00 − 00:17:30
    expect(Date.parse(local)).toBe(Date.parse(utc));
  });

  it('a malformed --time-window is a usage error', async () => {
    const input = tmp.write('tw.csv', 'person,time,text\np1,2026-03-01 10:00,good\n');
    const { code, stderr } = await runCli('score', input, '--time-zone', 'UTC', '-o', tmp.path('tw/s.csv'), '--time-window', '2026-13-01/');
    expect(code).toBe(2);
    expect(stderr).toMatch(/--time-window `2026-13-01\/`: `2026-13-01` is not a date/);
  });
});

describe('headers and encodings through the command line', () => {
  it('score exits 3 when two columns share a name, naming both positions', async () => {
    const input = tmp.write('dup.csv', 'person,time,text,text\np1,2026-03-01T10:00:00Z,a,b\n');
    const { code, stderr } = await runCli('score', input, '--time-zone', 'UTC', '-o', tmp.path('dup/s.csv'));
    expect(code).toBe(3);
    expect(stderr).toMatch(/columns 3 and 4/);
    expect(existsSync(tmp.path('dup/s.csv'))).toBe(false);
  });

  it('score reads a UTF-16 LE file with a byte-order mark (Unicode BOM FF FE)', async () => {
    const text = 'person,time,text\r\np1,2026-03-01T10:00:00Z,a good day\r\n';
    const input = tmp.write('utf16.csv', Buffer.concat([Buffer.from([0xff, 0xfe]), Buffer.from(text, 'utf16le')]));
    const out = tmp.path('utf16/s.csv');
    const { code } = await runCli('score', input, '--time-zone', 'UTC', '-o', out);
    expect(code).toBe(0);
    expect(readFileSync(out, 'utf8').trim().split('\n')).toHaveLength(2);
  });
});

describe('side files are validated', () => {
  it('rejects a zone file date 2026-02-30 with its line', async () => {
    const zones = tmp.write('zones.csv', 'person,zone,from\np1,Europe/Brussels,\np1,America/New_York,2026-02-30\n');
    await expect(readZoneFile(zones)).rejects.toThrow(/line 3/);
  });

  it('reads declared missing-value codes as missing ratings instead of rating_not_numeric', async () => {
    const ratings = tmp.write('missing.csv', 'person,time,mood,calm\np1,2026-03-01T10:00:00Z,NA,-99\np1,2026-03-01T11:00:00Z,50,4\np1,2026-03-01T12:00:00Z,n/a,4\n');
    const zones = buildZoneTable([], '', 'UTC');
    // With no codes declared at all (an empty list; the default NA is tested in test/validate/missing-codes.test.ts).
    const without = await readRatings({ ratings, zones, scales: 'mood=0:100,calm=1:7', missing: [] });
    expect(without.diagnostics.map((d) => d.code).sort()).toEqual(['rating_not_numeric', 'rating_not_numeric', 'rating_out_of_scale']);
    const read = await readRatings({ ratings, zones, scales: 'mood=0:100,calm=1:7', missing: ['NA', '-99'] });
    expect(read.diagnostics.map((d) => [d.source?.line, d.code])).toEqual([[4, 'rating_not_numeric']]);
    expect(read.ratings.map((r) => r.values)).toEqual([{ mood: undefined, calm: undefined }, { mood: 50, calm: 4 }, { mood: undefined, calm: 4 }]);
  });
});

describe('importers that keep nothing say so', () => {
  it('a diary whose headings do not match exits 3, names the first line not kept and suggests --heading', async () => {
    const input = tmp.write('diary.txt', 'Monday 2 March 2026\nWalked the dog.\n\nTuesday 3 March 2026\nRain.\n');
    const out = tmp.path('diary/entries.jsonl');
    const { code, stderr } = await runCli('import', 'diary', input, '--person', 'p1', '--time-zone', 'UTC', '-o', out);
    expect(code).toBe(3);
    expect(stderr).toMatch(/line 1 \(diary_before_first_heading\)/);
    expect(stderr).toMatch(/--heading/);
    expect(stderr).not.toMatch(/Walked|Rain/);
    expect(existsSync(out)).toBe(false);
  });

  it('a chat table without the participant exits 3 and suggests --sender', async () => {
    const input = tmp.write('others.csv', 'sender,time,text\nBea,2026-03-01T10:00:00Z,hello\n');
    const { code, stderr } = await runCli('import', 'chat-table', input, '--person', 'p1', '--sender', 'Ada', '--time-zone', 'UTC', '-o', tmp.path('others/e.jsonl'));
    expect(code).toBe(3);
    expect(stderr).toMatch(/line 2 \(third_party\)/);
    expect(stderr).toMatch(/--sender/);
  });

  it('a diary dated in the year 26 is read as the year 26 and rejected by the window, not kept as 1926', async () => {
    const input = tmp.write('diary-26.md', '# 0026-03-01\nWalked the dog.\n# 2026-03-02\nRain.\n');
    const out = tmp.path('diary-26/entries.jsonl');
    const { code } = await runCli('import', 'diary', input, '--person', 'p1', '--time-zone', 'UTC', '-o', out);
    expect(code).toBe(0);
    expect(readFileSync(out, 'utf8').trim().split('\n').map((l) => (JSON.parse(l) as { time: string }).time)).toEqual(['2026-03-02T12:00:00+00:00']);
    expect(rejectsOf(`${out}.rejects.csv`).map((r) => [r[1], r[2]])).toEqual([['1', 'time_outside_window']]);
  });
});
