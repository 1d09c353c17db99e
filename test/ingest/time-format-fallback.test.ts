import { describe, expect, it } from 'vitest';
import { DEFAULT_TIME_OPTIONS, parseInstant, type InstantResult, type TimeOptions } from '../../src/ingest/parse-instant.js';
import { readEntries } from '../../src/ingest/read-entries.js';
import { buildZoneTable } from '../../src/ingest/zone-table.js';
import { tableFile } from '../../src/io/table-file.js';
import { random, randomInteger } from '../../src/stats/random.js';
import { collect, tempFolder } from '../support/temp-files.js';

// An explicit time format still reads RFC 3339 / ISO 8601 times, as a counted fallback.
// Expected instants: ECMA-262 Date.UTC / Date.parse of the RFC 3339 text, never the machine's zone.

const US: TimeOptions = { ...DEFAULT_TIME_OPTIONS, format: 'MM/dd/yyyy h:mm a' };
const tmp = tempFolder();

function ok(result: InstantResult): Extract<InstantResult, { ok: true }> {
  if (!result.ok) throw new Error(`expected a time, got ${result.code}: ${result.message}`);
  return result;
}

describe('an explicit time format falls back to RFC 3339 / ISO 8601', () => {
  it('reads the RFC 3339 section 5.8 examples although they do not match the format, and marks them', () => {
    const a = ok(parseInstant('1985-04-12T23:20:50.52Z', 'UTC', US));
    expect(a.instant).toBe(Date.UTC(1985, 3, 12, 23, 20, 50, 520));
    expect(a).toMatchObject({ hadOffset: true, offsetMinutes: 0, fallback: true });
    const b = ok(parseInstant('1996-12-19T16:39:57-08:00', 'Europe/Brussels', US));
    expect(b.instant).toBe(Date.UTC(1996, 11, 20, 0, 39, 57));
    expect(b).toMatchObject({ hadOffset: true, offsetMinutes: -480, fallback: true });
  });

  it('reads a time without an offset as wall-clock time in the zone, by the same rules as without a format (IANA tz: Brussels is +02:00 on 2026-03-29 after 03:00)', () => {
    const r = ok(parseInstant('2026-03-29 08:15', 'Europe/Brussels', US));
    expect(r.instant).toBe(Date.UTC(2026, 2, 29, 6, 15));
    expect(r).toMatchObject({ hadOffset: false, offsetMinutes: 120, fallback: true });
  });

  it('applies the daylight-saving gap policy to a fallback time (IANA tz: 02:30 does not exist in Brussels on 2026-03-29)', () => {
    expect(parseInstant('2026-03-29T02:30:00', 'Europe/Brussels', US)).toMatchObject({ ok: false, code: 'time_in_gap' });
    expect(ok(parseInstant('2026-03-29T02:30:00', 'Europe/Brussels', { ...US, gap: 'earlier' })).instant).toBe(Date.UTC(2026, 2, 29, 0, 30));
  });

  it('does not mark a time that matches the format', () => {
    const r = ok(parseInstant('03/29/2026 8:15 AM', 'Europe/Brussels', US));
    expect(r.instant).toBe(Date.UTC(2026, 2, 29, 6, 15));
    expect(r.fallback).toBeUndefined();
  });

  it('still rejects a time that is neither in the format nor RFC 3339 / ISO 8601, naming both', () => {
    const r = parseInstant('29.03.2026 08:15', 'UTC', US);
    expect(r).toMatchObject({ ok: false, code: 'bad_time' });
    expect(r.ok ? '' : r.message).toContain('`MM/dd/yyyy h:mm a`');
    expect(r.ok ? '' : r.message).toContain('RFC 3339');
  });

  it('does not read an epoch number as a fallback when its unit is left to guess: a format was given, so a bare number is not taken as a time', () => {
    expect(parseInstant('1774764900', 'UTC', US)).toMatchObject({ ok: false, code: 'bad_time' });
  });

  it('reads an epoch number as a marked fallback when the epoch unit is given too (a study-wide format with one input in epoch milliseconds)', () => {
    // 1792387500000 ms = 2026-10-19T05:25:00Z (ECMA-262 Date.UTC; 07:25 in Berlin, +02:00 by IANA tz).
    const r = ok(parseInstant('1792387500000', 'Europe/Berlin', { ...US, epoch: 'ms' }));
    expect(r.instant).toBe(Date.UTC(2026, 9, 19, 5, 25));
    expect(r).toMatchObject({ offsetMinutes: 120, fallback: true, epoch: true });
    // A number that matches the format is still read by the format.
    expect(ok(parseInstant('202610190925', 'UTC', { ...DEFAULT_TIME_OPTIONS, format: 'yyyyMMddHHmm', epoch: 's' })).instant).toBe(Date.UTC(2026, 9, 19, 9, 25));
  });

  it('gives the same instant with and without a format for random RFC 3339 times (fuzz, RFC 3339 section 5.6 grammar)', () => {
    const rng = random('time-format-fallback');
    const two = (n: number): string => String(n).padStart(2, '0');
    for (let k = 0; k < 400; k++) {
      const t = Date.UTC(1971, 0, 1) + randomInteger(rng, 60 * 365) * 86_400_000 + randomInteger(rng, 86_400) * 1000;
      const d = new Date(t);
      const minutes = (randomInteger(rng, 57) - 28) * 30; // −14:00 … +14:00 in half hours
      const local = new Date(t + minutes * 60000);
      const sep = randomInteger(rng, 2) === 0 ? 'T' : ' ';
      const offset = minutes === 0 && randomInteger(rng, 2) === 0 ? 'Z' : `${minutes < 0 ? '-' : '+'}${two(Math.floor(Math.abs(minutes) / 60))}:${two(Math.abs(minutes) % 60)}`;
      const text = `${local.getUTCFullYear()}-${two(local.getUTCMonth() + 1)}-${two(local.getUTCDate())}${sep}${two(local.getUTCHours())}:${two(local.getUTCMinutes())}:${two(local.getUTCSeconds())}${offset}`;
      const plain = ok(parseInstant(text, 'America/New_York'));
      const formatted = ok(parseInstant(text, 'America/New_York', { ...DEFAULT_TIME_OPTIONS, format: 'dd/MM/yyyy HH:mm' }));
      expect(plain.instant).toBe(d.getTime());
      expect(formatted).toMatchObject({ instant: plain.instant, offsetMinutes: plain.offsetMinutes, hadOffset: true, fallback: true });
    }
  });
});

describe('rows read by the fallback are counted, never silent', () => {
  it('notes each entry whose time was read by the RFC 3339 fallback', async () => {
    const path = tmp.write('mixed.csv', 'person,time,text\nann,03/02/2026 9:30 AM,good day\nann,2026-03-03T21:30:00Z,bad night\nann,2026-03-04 08:00,fine\n');
    const items = await collect(readEntries(tableFile(path), { zones: buildZoneTable([], '', 'UTC'), time: US }));
    expect(items.map((i) => i.kind)).toEqual(['entry', 'entry', 'entry']);
    expect(items.map((i) => (i.kind === 'entry' ? (i.notes ?? []) : []))).toEqual([[], ['time_iso_fallback'], ['time_iso_fallback']]);
  });
});
