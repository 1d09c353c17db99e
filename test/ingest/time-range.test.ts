import { describe, expect, it } from 'vitest';
import { DEFAULT_TIME_OPTIONS, epochMillis, formatLocal, parseInstant, type TimeOptions } from '../../src/ingest/parse-instant.js';
import { isCalendarDate } from '../../src/ingest/is-calendar-date.js';
import { timeWindow } from '../../src/ingest/time-window.js';
import { utcFromFields } from '../../src/ingest/utc-from-fields.js';

// Expected instants are worked out by hand as UTC wall times. ECMA-262 section 21.4.1.1 (Time
// Values and Time Range): a time value lies within ±8.64e15 ms of the epoch; outside it Date
// methods throw RangeError. RFC 3339 section 5.6 writes years as exactly four digits (0000–9999)
// and `time-numoffset` as ("+" / "-") time-hour ":" time-minute, whole minutes only.

const NOW = Date.UTC(2026, 11, 3, 7, 0); // the time these tests pretend it is
const windowed: TimeOptions = { ...DEFAULT_TIME_OPTIONS, window: timeWindow(NOW) };

describe('times outside the ECMA-262 time value range are rejected, never thrown', () => {
  for (const value of ['+275760-09-13T00:00:00Z', '+275760-09-13T00:00:01Z', '-271821-04-20T00:00:00Z']) {
    it(`rejects ${value} as bad_time without a window (ECMA-262 §21.4.1.1: ±8.64e15 ms)`, () => {
      expect(parseInstant(value, 'Europe/Brussels')).toMatchObject({ ok: false, code: 'bad_time' });
    });
  }
  for (const value of ['8640000000000001', '-8640000000000001', '8640000000000000', '9999999999999999999']) {
    it(`rejects the epoch ${value} read as milliseconds as bad_time (ECMA-262 §21.4.1.1: ±8.64e15 ms)`, () => {
      expect(parseInstant(value, 'Europe/Brussels', { ...DEFAULT_TIME_OPTIONS, epoch: 'ms' })).toMatchObject({ ok: false, code: 'bad_time' });
    });
  }

  it('reads 8640000000000001 by magnitude as microseconds (the year 2243), outside the default window', () => {
    expect(parseInstant('8640000000000001', 'UTC', windowed)).toMatchObject({ ok: false, code: 'time_outside_window' });
    expect(parseInstant('-8640000000000001', 'UTC', windowed)).toMatchObject({ ok: false, code: 'time_outside_window' });
  });

  it('never echoes the rejected value in the message of a range reject', () => {
    const r = parseInstant('8640000000000001', 'UTC', { ...DEFAULT_TIME_OPTIONS, epoch: 'ms' });
    expect(r.ok).toBe(false);
    if (!r.ok) expect(r.message).not.toContain('8640000000000001');
  });
});

describe('years are read as written (ECMA-262 MakeFullYear maps 0–99 to 1900–1999 in Date.UTC)', () => {
  it('reads 0026-03-01 10:00 as the year 26, not 1926', () => {
    const r = parseInstant('0026-03-01 10:00', 'UTC');
    expect(r.ok && new Date(r.instant).getUTCFullYear()).toBe(26);
  });

  it('reads 0099-12-31T10:00:00Z as the year 99, not 1999', () => {
    const r = parseInstant('0099-12-31T10:00:00Z', 'UTC');
    expect(r.ok && new Date(r.instant).getUTCFullYear()).toBe(99);
  });

  it('rejects both by the default plausible window (1970 to ten years after now)', () => {
    expect(parseInstant('0026-03-01 10:00', 'UTC', windowed)).toMatchObject({ ok: false, code: 'time_outside_window' });
    expect(parseInstant('0099-12-31T10:00:00Z', 'UTC', windowed)).toMatchObject({ ok: false, code: 'time_outside_window' });
    expect(parseInstant('2037-01-01T00:00:00Z', 'UTC', windowed)).toMatchObject({ ok: false, code: 'time_outside_window' });
    expect(parseInstant('2036-12-04T00:00:00Z', 'UTC', windowed)).toMatchObject({ ok: false, code: 'time_outside_window' });
    expect(parseInstant('2036-12-03T23:59:59Z', 'UTC', windowed)).toMatchObject({ ok: true });
    expect(parseInstant('1969-12-31T23:59:59Z', 'UTC', windowed)).toMatchObject({ ok: false, code: 'time_outside_window' });
    expect(parseInstant('1970-01-01T00:00:00Z', 'UTC', windowed)).toMatchObject({ ok: true, instant: 0 });
    expect(parseInstant('2036-12-02T23:59:59Z', 'UTC', windowed)).toMatchObject({ ok: true });
  });

  it('utcFromFields takes years 0–99 as written and checks the calendar', () => {
    expect(utcFromFields(26, 3, 1)).toBe(Date.UTC(2026, 2, 1) - 2000 * 365.2425 * 86_400_000);
    expect(utcFromFields(0, 1, 1)).toBe(-62167219200000); // 0000-01-01T00:00:00Z, Date.parse of the RFC 3339 text
    expect(utcFromFields(0, 1, 1)).toBe(Date.parse('0000-01-01T00:00:00Z'));
    expect(utcFromFields(2026, 2, 30)).toBeUndefined();
    expect(utcFromFields(2028, 2, 29)).toBe(Date.UTC(2028, 1, 29));
    expect(utcFromFields(10000, 1, 1)).toBeUndefined();
  });
});

describe('the plausible window is set by --time-window FROM/TO', () => {
  it('reads dates and open sides', () => {
    expect(timeWindow(NOW, '1900-01-01/')).toEqual({ from: Date.UTC(1900, 0, 1), to: Date.UTC(2036, 11, 4) }); // through the day ten years on
    expect(timeWindow(NOW, '/2026-12-31')).toEqual({ from: 0, to: Date.UTC(2027, 0, 1) });
    expect(timeWindow(NOW, '2020-01-01T00:00:00+02:00/2021-01-01T00:00:00Z')).toEqual({ from: Date.UTC(2019, 11, 31, 22), to: Date.UTC(2021, 0, 1) });
  });

  it('refuses a malformed or reversed window with a usage error', () => {
    expect(() => timeWindow(NOW, '2026-02-30/')).toThrow(/not a date/);
    expect(() => timeWindow(NOW, '2027-01-01/2026-01-01')).toThrow(/before TO/);
    expect(() => timeWindow(NOW, '2026')).toThrow(/FROM\/TO/);
  });
});

describe('--epoch auto tells seconds, milliseconds, microseconds and nanoseconds apart by magnitude', () => {
  const t = Date.UTC(2026, 2, 29, 6, 15); // 1774764900000
  it('reads the same instant in every unit', () => {
    for (const value of ['1774764900', '1774764900000', '1774764900000000', '1774764900000000000']) {
      expect(parseInstant(value, 'UTC', windowed)).toMatchObject({ ok: true, instant: t });
    }
  });

  it('reads a 12-digit millisecond epoch before 2001-09-09 as milliseconds (999999999999 ms = 2001-09-09T01:46:39.999Z)', () => {
    expect(parseInstant('999999999999', 'UTC', windowed)).toMatchObject({ ok: true, instant: 999999999999 });
    expect(parseInstant('946684800000', 'UTC', windowed)).toMatchObject({ ok: true, instant: Date.UTC(2000, 0, 1) });
    expect(parseInstant('100000000000', 'UTC', windowed)).toMatchObject({ ok: true, instant: 100000000000 });
  });

  it('reads an 11-digit number as seconds (99999999999 s is the year 5138, outside the window)', () => {
    expect(epochMillis('99999999999', 'auto')).toBe(99999999999000);
    expect(parseInstant('99999999999', 'UTC', windowed)).toMatchObject({ ok: false, code: 'time_outside_window' });
  });

  it('rounds nanoseconds to the millisecond exactly beyond 2^53', () => {
    expect(epochMillis('1774764900123499999', 'ns')).toBe(1774764900123);
    expect(epochMillis('1774764900123500000', 'ns')).toBe(1774764900124);
    expect(epochMillis('1774764900123456', 'us')).toBe(1774764900123);
  });

  it('rejects a microsecond epoch read as milliseconds by an explicit --epoch ms (the year 58211)', () => {
    expect(parseInstant('1774764900000000', 'UTC', { ...windowed, epoch: 'ms' })).toMatchObject({ ok: false, code: 'bad_time' });
  });
});

describe('offsets of early dates stay valid RFC 3339', () => {
  it('writes local mean time (Amsterdam +00:19:32 in 1900) rounded to whole minutes, naming the same instant', () => {
    const r = parseInstant('1900-06-01T10:00:00', 'Europe/Amsterdam', { ...DEFAULT_TIME_OPTIONS, window: timeWindow(NOW, '1800-01-01/') });
    expect(r.ok).toBe(true);
    if (!r.ok) return;
    const text = formatLocal(r.instant, r.offsetMinutes);
    expect(text).toMatch(/^\d{4}-\d{2}-\d{2}T\d{2}:\d{2}:\d{2}\.\d{3}[+-]\d{2}:\d{2}$/); // RFC 3339 §5.6 date-time
    expect(Date.parse(text)).toBe(r.instant);
  });
});

describe('side-file dates are checked against the calendar', () => {
  it('rejects 2026-02-30 and 2026-13-01 and accepts 2028-02-29', () => {
    expect(isCalendarDate('2026-02-30')).toBe(false);
    expect(isCalendarDate('2026-13-01')).toBe(false);
    expect(isCalendarDate('2028-02-29')).toBe(true);
    expect(isCalendarDate('2026-02-29')).toBe(false);
  });
});
