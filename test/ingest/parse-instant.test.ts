import { DateTime } from 'luxon';
import { describe, expect, it } from 'vitest';
import { DEFAULT_TIME_OPTIONS, formatLocal, formatUtc, parseInstant, type InstantResult, type TimeOptions } from '../../src/ingest/parse-instant.js';
import { random, randomInteger } from '../../src/stats/random.js';

// Expected instants are written as the UTC wall time worked out by hand (offset applied by us),
// turned into epoch milliseconds by Date.UTC, which only does calendar arithmetic and never reads
// the machine's zone; the first checks also give the literal number.

function instant(result: InstantResult): number {
  if (!result.ok) throw new Error(`expected a time, got ${result.code}: ${result.message}`);
  return result.instant;
}

const options = (over: Partial<TimeOptions>): TimeOptions => ({ ...DEFAULT_TIME_OPTIONS, ...over });

describe('parseInstant reads the RFC 3339 section 5.8 examples', () => {
  it('reads 1985-04-12T23:20:50.52Z as 482196050520 ms (RFC 3339 §5.8)', () => {
    const r = parseInstant('1985-04-12T23:20:50.52Z', 'UTC');
    expect(instant(r)).toBe(482196050520);
    expect(instant(r)).toBe(Date.UTC(1985, 3, 12, 23, 20, 50, 520));
    expect(r).toMatchObject({ offsetMinutes: 0, hadOffset: true });
  });

  it('reads 1996-12-19T16:39:57-08:00 as 1996-12-20T00:39:57Z (RFC 3339 §5.8)', () => {
    const r = parseInstant('1996-12-19T16:39:57-08:00', 'Europe/Brussels');
    expect(instant(r)).toBe(851042397000);
    expect(instant(r)).toBe(Date.UTC(1996, 11, 20, 0, 39, 57));
    expect(r).toMatchObject({ offsetMinutes: -480, hadOffset: true });
  });

  it('reads the leap second 1990-12-31T23:59:60Z as 1991-01-01T00:00:00Z, as POSIX time has no leap seconds (RFC 3339 §5.7, §5.8)', () => {
    expect(instant(parseInstant('1990-12-31T23:59:60Z', 'UTC'))).toBe(662688000000);
    expect(instant(parseInstant('1990-12-31T23:59:60Z', 'UTC'))).toBe(Date.UTC(1991, 0, 1, 0, 0, 0));
  });

  it('reads 1990-12-31T15:59:60-08:00 as the same instant as 1990-12-31T23:59:60Z (RFC 3339 §5.8)', () => {
    expect(instant(parseInstant('1990-12-31T15:59:60-08:00', 'UTC'))).toBe(662688000000);
  });

  it('reads 1937-01-01T12:00:27.87+00:20 (Netherlands time) as 1937-01-01T11:40:27.870Z (RFC 3339 §5.8)', () => {
    const r = parseInstant('1937-01-01T12:00:27.87+00:20', 'UTC');
    expect(instant(r)).toBe(-1041337172130);
    expect(instant(r)).toBe(Date.UTC(1937, 0, 1, 11, 40, 27, 870));
    expect(r).toMatchObject({ offsetMinutes: 20 });
  });

  it('accepts a lower-case t and z and a space as separator (RFC 3339 §5.6 NOTE)', () => {
    expect(instant(parseInstant('1985-04-12t23:20:50.52z', 'UTC'))).toBe(482196050520);
    expect(instant(parseInstant('1985-04-12 23:20:50.52Z', 'UTC'))).toBe(482196050520);
  });

  it('reads the ISO 8601 decimal comma, basic ±hhmm and hour-only ±hh offsets, and rounds fractions to milliseconds (ISO 8601-1:2019 §4.2.2.4, §4.2.5.1; worked by hand)', () => {
    expect(parseInstant('2026-03-01T08:00:00,5-05', 'UTC')).toEqual({ ok: true, instant: Date.UTC(2026, 2, 1, 13, 0, 0, 500), offsetMinutes: -300, hadOffset: true });
    expect(parseInstant('2026-03-01T08:00:00.123456789+0130', 'UTC')).toEqual({ ok: true, instant: Date.UTC(2026, 2, 1, 6, 30, 0, 123), offsetMinutes: 90, hadOffset: true });
    expect(instant(parseInstant('2026-03-01T08:00:00.9996Z', 'UTC'))).toBe(Date.UTC(2026, 2, 1, 8, 0, 1, 0));
    for (const broken of ['2026-03-01T08:00:00.Z', '2026-03-01T08:00:00Zx', '2026-03-01T08:00:00+1', '2026-03-01T08:00:00+01:0', '2026-03-01T08:0a:00Z']) {
      expect(parseInstant(broken, 'UTC'), broken).toMatchObject({ ok: false, code: 'bad_time' });
    }
  });

  it('agrees with luxon\'s ISO 8601 reader on 2,000 generated date-times with offsets (reference: luxon DateTime.fromISO, npm)', () => {
    // Seeded generator (common practice): years 1900–2099, fractions of 0–3 digits with a point or
    // a comma, offsets as Z, ±hh:mm, ±hhmm and ±hh, the forms most files use.
    let seed = 12345;
    const random = (): number => (seed = (Math.imul(seed, 1103515245) + 12345) >>> 0) / 2 ** 32;
    const pick = (n: number): number => Math.floor(random() * n);
    const pad = (n: number, width: number): string => String(n).padStart(width, '0');
    for (let i = 0; i < 2000; i++) {
      const digits = pick(4);
      const fraction = digits === 0 ? '' : (random() < 0.5 ? '.' : ',') + Array.from({ length: digits }, () => pick(10)).join('');
      const sign = random() < 0.5 ? '+' : '-';
      const hours = pad(pick(14), 2);
      const minutes = pad([0, 15, 30, 45][pick(4)] as number, 2);
      const offset = ['Z', `${sign}${hours}:${minutes}`, `${sign}${hours}${minutes}`, `${sign}${hours}`][pick(4)];
      const value = `${pad(1900 + pick(200), 4)}-${pad(1 + pick(12), 2)}-${pad(1 + pick(28), 2)}T${pad(pick(24), 2)}:${pad(pick(60), 2)}:${pad(pick(60), 2)}${fraction}${offset}`;
      const reference = DateTime.fromISO(value, { setZone: true });
      expect(reference.isValid, value).toBe(true);
      expect(parseInstant(value, 'Europe/Brussels'), value).toEqual({ ok: true, instant: reference.toMillis(), offsetMinutes: reference.offset, hadOffset: true });
    }
  });

  it('rejects impossible dates and clock times with bad_time', () => {
    expect(parseInstant('2026-02-29T10:00:00Z', 'UTC')).toMatchObject({ ok: false, code: 'bad_time', message: expect.stringContaining('day 29 does not exist in 2026-02') });
    expect(parseInstant('2026-13-01T10:00:00Z', 'UTC')).toMatchObject({ ok: false, code: 'bad_time' });
    expect(parseInstant('2026-03-01T24:30:00Z', 'UTC')).toMatchObject({ ok: false, code: 'bad_time' });
    expect(parseInstant('2026-03-01T10:00:00+25:00', 'UTC')).toMatchObject({ ok: false, code: 'bad_time' });
  });

  it('knows February 29 by the leap-year rule of RFC 3339 Appendix C (divisible by 4, not by 100 unless by 400)', () => {
    for (const year of ['2024', '2000', '1600', '2400']) expect(parseInstant(`${year}-02-29T12:00:00Z`, 'UTC').ok, year).toBe(true);
    for (const year of ['2026', '1900', '2100', '1800']) expect(parseInstant(`${year}-02-29T12:00:00Z`, 'UTC').ok, year).toBe(false);
    expect(parseInstant('2026-04-31T12:00:00Z', 'UTC').ok).toBe(false);
    expect(parseInstant('2026-12-31T12:00:00Z', 'UTC').ok).toBe(true);
  });

  it('rejects text that is no time with a message naming the accepted forms', () => {
    expect(parseInstant('yesterday at tea', 'UTC')).toMatchObject({ ok: false, code: 'bad_time', message: expect.stringContaining('--time-format') });
    expect(parseInstant('2026-03-17 ??:??', 'UTC')).toMatchObject({ ok: false, code: 'bad_time' });
    expect(parseInstant('   ', 'UTC')).toMatchObject({ ok: false, code: 'missing_time' });
  });
});

describe('parseInstant reads wall-clock times in the person\'s zone (IANA tz database)', () => {
  it('reads an ordinary local time in Europe/Brussels summer time (+02:00)', () => {
    // 2026-03-29 08:15 CEST = 06:15Z
    const r = parseInstant('2026-03-29 08:15', 'Europe/Brussels');
    expect(instant(r)).toBe(Date.UTC(2026, 2, 29, 6, 15));
    expect(r).toMatchObject({ offsetMinutes: 120, hadOffset: false });
  });

  // Europe/Brussels: clocks go from 02:00 CET (+01:00) to 03:00 CEST (+02:00) at 2026-03-29T01:00Z
  // (last Sunday of March, EU rule), and back from 03:00 CEST to 02:00 CET at 2026-10-25T01:00Z.
  describe('Europe/Brussels 2026-03-29 02:30, a time skipped by the spring change', () => {
    it('is rejected as time_in_gap by default', () => {
      expect(parseInstant('2026-03-29T02:30:00', 'Europe/Brussels')).toMatchObject({ ok: false, code: 'time_in_gap', message: expect.stringContaining('--dst-gap') });
    });
    it('with gap earlier takes the offset after the change: 02:30 − 2 h = 00:30Z', () => {
      const r = parseInstant('2026-03-29T02:30:00', 'Europe/Brussels', options({ gap: 'earlier' }));
      expect(instant(r)).toBe(Date.UTC(2026, 2, 29, 0, 30));
      expect(instant(r)).toBe(1774744200000);
    });
    it('with gap later takes the offset before the change: 02:30 − 1 h = 01:30Z, which reads 03:30+02:00', () => {
      const r = parseInstant('2026-03-29T02:30:00', 'Europe/Brussels', options({ gap: 'later' }));
      expect(instant(r)).toBe(Date.UTC(2026, 2, 29, 1, 30));
      expect(r).toMatchObject({ offsetMinutes: 120 });
      expect(formatLocal(instant(r), 120)).toBe('2026-03-29T03:30:00.000+02:00');
    });
  });

  describe('Europe/Brussels 2026-10-25 02:30, a time repeated by the autumn change', () => {
    it('is rejected as time_ambiguous by default', () => {
      expect(parseInstant('2026-10-25 02:30', 'Europe/Brussels')).toMatchObject({ ok: false, code: 'time_ambiguous', message: expect.stringContaining('--dst-overlap') });
    });
    it('with overlap earlier is the first 02:30, in summer time: 00:30Z, +02:00', () => {
      const r = parseInstant('2026-10-25 02:30', 'Europe/Brussels', options({ overlap: 'earlier' }));
      expect(instant(r)).toBe(Date.UTC(2026, 9, 25, 0, 30));
      expect(r).toMatchObject({ offsetMinutes: 120 });
    });
    it('with overlap later is the second 02:30, in winter time: 01:30Z, +01:00', () => {
      const r = parseInstant('2026-10-25 02:30', 'Europe/Brussels', options({ overlap: 'later' }));
      expect(instant(r)).toBe(Date.UTC(2026, 9, 25, 1, 30));
      expect(r).toMatchObject({ offsetMinutes: 60 });
    });
  });

  // America/New_York: 02:00 EST (−05:00) → 03:00 EDT (−04:00) at 2026-03-08T07:00Z (second Sunday
  // of March), and 02:00 EDT → 01:00 EST at 2026-11-01T06:00Z (first Sunday of November).
  describe('America/New_York 2026-03-08 02:30, a time skipped by the spring change', () => {
    it('is rejected as time_in_gap by default', () => {
      expect(parseInstant('2026-03-08T02:30', 'America/New_York')).toMatchObject({ ok: false, code: 'time_in_gap' });
    });
    it('with gap earlier takes the offset after the change: 02:30 + 4 h = 06:30Z', () => {
      expect(instant(parseInstant('2026-03-08T02:30', 'America/New_York', options({ gap: 'earlier' })))).toBe(Date.UTC(2026, 2, 8, 6, 30));
    });
    it('with gap later takes the offset before the change: 02:30 + 5 h = 07:30Z, which reads 03:30−04:00', () => {
      const r = parseInstant('2026-03-08T02:30', 'America/New_York', options({ gap: 'later' }));
      expect(instant(r)).toBe(Date.UTC(2026, 2, 8, 7, 30));
      expect(formatLocal(instant(r), (r as { offsetMinutes: number }).offsetMinutes)).toBe('2026-03-08T03:30:00.000-04:00');
    });
  });

  describe('America/New_York 2026-11-01 01:30, a time repeated by the autumn change', () => {
    it('is rejected as time_ambiguous by default', () => {
      expect(parseInstant('2026-11-01 01:30', 'America/New_York')).toMatchObject({ ok: false, code: 'time_ambiguous' });
    });
    it('with overlap earlier is 01:30 EDT: 05:30Z, −04:00', () => {
      const r = parseInstant('2026-11-01 01:30', 'America/New_York', options({ overlap: 'earlier' }));
      expect(instant(r)).toBe(Date.UTC(2026, 10, 1, 5, 30));
      expect(r).toMatchObject({ offsetMinutes: -240 });
    });
    it('with overlap later is 01:30 EST: 06:30Z, −05:00', () => {
      const r = parseInstant('2026-11-01 01:30', 'America/New_York', options({ overlap: 'later' }));
      expect(instant(r)).toBe(Date.UTC(2026, 10, 1, 6, 30));
      expect(r).toMatchObject({ offsetMinutes: -300 });
    });
  });

  it('reads 01:59 and 03:00 on the Brussels spring-change day without any policy', () => {
    expect(instant(parseInstant('2026-03-29 01:59', 'Europe/Brussels'))).toBe(Date.UTC(2026, 2, 29, 0, 59));
    expect(instant(parseInstant('2026-03-29 03:00', 'Europe/Brussels'))).toBe(Date.UTC(2026, 2, 29, 1, 0));
  });

  it('keeps the instant of a time written with an offset, whatever the person\'s zone', () => {
    expect(instant(parseInstant('2026-10-25T02:30:00+01:00', 'Europe/Brussels'))).toBe(Date.UTC(2026, 9, 25, 1, 30));
    expect(instant(parseInstant('2026-10-25T02:30:00+02:00', 'Europe/Brussels'))).toBe(Date.UTC(2026, 9, 25, 0, 30));
  });
});

describe('parseInstant reads epoch numbers and explicit formats', () => {
  it('reads 10-digit numbers as epoch seconds and 13-digit numbers as epoch milliseconds', () => {
    expect(instant(parseInstant('1774764900', 'UTC'))).toBe(1774764900000);
    expect(instant(parseInstant('1774764900000', 'UTC'))).toBe(1774764900000);
    expect(instant(parseInstant('1774764900.5', 'UTC'))).toBe(1774764900500);
  });

  it('follows an explicit epoch unit', () => {
    expect(instant(parseInstant('1774764900', 'UTC', options({ epoch: 'ms' })))).toBe(1774764900);
    expect(instant(parseInstant('177476490000', 'UTC', options({ epoch: 's' })))).toBe(177476490000000); // the year 7594
    // 1774764900000 s is the year 58210, which RFC 3339 cannot write (four-digit years): rejected.
    expect(parseInstant('1774764900000', 'UTC', options({ epoch: 's' }))).toMatchObject({ ok: false, code: 'bad_time' });
  });

  it('gives an epoch time the offset of the person\'s zone at that instant', () => {
    // 1774764900 s = 2026-03-29T06:15:00Z, after the Brussels spring change: +02:00.
    expect(parseInstant('1774764900', 'Europe/Brussels')).toMatchObject({ ok: true, offsetMinutes: 120, hadOffset: true });
  });

  it('reads dd/MM/yyyy HH:mm with --time-format as a wall-clock time in the zone', () => {
    const r = parseInstant('29/03/2026 08:15', 'Europe/Brussels', options({ format: 'dd/MM/yyyy HH:mm' }));
    expect(instant(r)).toBe(Date.UTC(2026, 2, 29, 6, 15));
    expect(r).toMatchObject({ hadOffset: false, offsetMinutes: 120 });
  });

  it('applies the gap policy to formatted times too', () => {
    expect(parseInstant('29/03/2026 02:30', 'Europe/Brussels', options({ format: 'dd/MM/yyyy HH:mm' }))).toMatchObject({ ok: false, code: 'time_in_gap' });
  });

  it('keeps the offset of a formatted time whose format has one', () => {
    const r = parseInstant('29.03.2026 08:15 +0200', 'America/New_York', options({ format: 'dd.MM.yyyy HH:mm ZZZ' }));
    expect(instant(r)).toBe(Date.UTC(2026, 2, 29, 6, 15));
    expect(r).toMatchObject({ hadOffset: true, offsetMinutes: 120 });
  });

  it('rejects a time that does not match the given format (and is not RFC 3339, see time-format-fallback.test.ts) and names the format', () => {
    expect(parseInstant('2026.03.29 08:15', 'UTC', options({ format: 'dd/MM/yyyy HH:mm' }))).toMatchObject({ ok: false, code: 'bad_time', message: expect.stringContaining('`dd/MM/yyyy HH:mm`') });
  });
});

describe('formatUtc and formatLocal', () => {
  it('write RFC 3339 with milliseconds and the offset', () => {
    expect(formatUtc(Date.UTC(2026, 2, 29, 6, 15))).toBe('2026-03-29T06:15:00.000Z');
    expect(formatLocal(Date.UTC(2026, 2, 29, 6, 15), 120)).toBe('2026-03-29T08:15:00.000+02:00');
    expect(formatLocal(Date.UTC(2026, 10, 1, 6, 30), -300)).toBe('2026-11-01T01:30:00.000-05:00');
    expect(formatLocal(Date.UTC(2026, 0, 1, 0, 0), 345)).toBe('2026-01-01T05:45:00.000+05:45');
  });

  it('equal ECMAScript Date.prototype.toISOString (ECMA-262 §21.4.4.36) on instants from 1600 to 2400, before 1970 and at day edges', () => {
    // Reference: the ECMAScript date-time string format, as Node's own Date implements it.
    let seed = 7;
    const next = (): number => ((seed = (Math.imul(seed, 1103515245) + 12345) >>> 0) / 2 ** 32);
    const instants = [0, -1, 1, 86_399_999, 86_400_000, -86_400_000, -86_400_001, Date.UTC(2024, 1, 29, 23, 59, 59, 999), Date.UTC(1969, 11, 31, 23, 59, 59, 999), Date.UTC(9999, 11, 31, 23, 59, 59, 999), Date.UTC(0, 0, 1) - 1];
    for (let k = 0; k < 5000; k++) instants.push(Math.round(Date.UTC(1600, 0, 1) + next() * (Date.UTC(2400, 0, 1) - Date.UTC(1600, 0, 1))));
    for (const t of instants) {
      expect(formatUtc(t)).toBe(new Date(t).toISOString());
      expect(formatLocal(t, 0)).toBe(new Date(t).toISOString().replace('Z', '+00:00'));
    }
    // Years beyond 0000–9999 keep the expanded form of toISOString.
    expect(formatUtc(Date.UTC(10000, 0, 1))).toBe('+010000-01-01T00:00:00.000Z');
    expect(formatUtc(Date.UTC(-1, 0, 1))).toBe('-000001-01-01T00:00:00.000Z');
  });
});

describe('parseInstant reads a UTC offset the same in every accepted layout (generated, seeded)', () => {
  // Class: a date-time with an explicit offset, including offsets with minutes (+05:30, −09:30,
  // +05:45) and the layouts that take the general reader rather than the fast one (no seconds,
  // a space before the offset, ±HHMM, ±HH). Reference: Date.parse of the ECMA-262 Date Time String
  // Format (ECMA-262, section "Date Time String Format") with the same offset, which needs no zone data.
  const source = random('parse-instant-offsets');
  const pad = (n: number, width = 2): string => String(n).padStart(width, '0');
  const cases = Array.from({ length: 400 }, () => {
    const year = 1990 + randomInteger(source, 60);
    const month = 1 + randomInteger(source, 12);
    const day = 1 + randomInteger(source, 28);
    const hour = randomInteger(source, 24);
    const minute = randomInteger(source, 60);
    const second = randomInteger(source, 60);
    const offsetHours = randomInteger(source, 15);
    const offsetMinutes = [0, 15, 30, 45, randomInteger(source, 60)][randomInteger(source, 5)] as number;
    const sign = source() < 0.5 ? '-' : '+';
    const date = `${year}-${pad(month)}-${pad(day)}`;
    const offset = `${sign}${pad(offsetHours)}:${pad(offsetMinutes)}`;
    const reference = Date.parse(`${date}T${pad(hour)}:${pad(minute)}:${pad(second)}.000${offset}`);
    const referenceNoSeconds = Date.parse(`${date}T${pad(hour)}:${pad(minute)}:00.000${offset}`);
    return { date, time: `${pad(hour)}:${pad(minute)}:${pad(second)}`, hm: `${pad(hour)}:${pad(minute)}`, offset, compact: offset.replace(':', ''), reference, referenceNoSeconds, offsetMinutes };
  });
  it('gives the instant of the ECMA-262 reading for ±HH:MM with and without seconds, after a space, and as ±HHMM', () => {
    for (const c of cases) {
      expect(instant(parseInstant(`${c.date}T${c.time}${c.offset}`, 'UTC')), `${c.date}T${c.time}${c.offset}`).toBe(c.reference);
      expect(instant(parseInstant(`${c.date} ${c.time} ${c.offset}`, 'UTC')), `${c.date} ${c.time} ${c.offset}`).toBe(c.reference);
      expect(instant(parseInstant(`${c.date}T${c.time}${c.compact}`, 'UTC')), `${c.date}T${c.time}${c.compact}`).toBe(c.reference);
      expect(instant(parseInstant(`${c.date}T${c.hm}${c.offset}`, 'UTC')), `${c.date}T${c.hm}${c.offset}`).toBe(c.referenceNoSeconds);
      expect(instant(parseInstant(`${c.date}T${c.hm}${c.compact}`, 'UTC')), `${c.date}T${c.hm}${c.compact}`).toBe(c.referenceNoSeconds);
    }
    expect(cases.filter((c) => c.offsetMinutes !== 0).length).toBeGreaterThan(200);
  });
});
