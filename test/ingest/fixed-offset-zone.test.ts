import { describe, expect, it } from 'vitest';
import { recordToEntry } from '../../src/ingest/read-entries.js';
import { fixedOffsetMinutes, fixedOffsetZone, isValidZone, zoneOffset } from '../../src/ingest/zone-offset.js';
import { buildZoneTable } from '../../src/ingest/zone-table.js';
import { DEFAULT_TIME_OPTIONS, formatLocal } from '../../src/ingest/parse-instant.js';
import { random, randomInteger } from '../../src/stats/random.js';

// Fixed offsets are labelled with the RFC 3339 time-numoffset form after `UTC` (RFC 3339 section 5.6).
const columns = { person: 'person', time: 'time', text: 'text' };
const source = { file: 'texts.csv', line: 2 };
const noZones = buildZoneTable([], '');

describe('fixed-offset zones for persons without a zone', () => {
  it('writes and reads back every quarter-hour offset from −14:00 to +14:00, constant at every instant', () => {
    for (let minutes = -14 * 60; minutes <= 14 * 60; minutes += 15) {
      const zone = fixedOffsetZone(minutes);
      expect(zone).toMatch(/^UTC[+-]\d{2}:\d{2}$/);
      expect(fixedOffsetMinutes(zone)).toBe(minutes === 0 ? 0 : minutes);
      expect(isValidZone(zone)).toBe(true);
      for (const t of [Date.UTC(2026, 2, 29, 0, 30), Date.UTC(2026, 9, 25, 0, 30), 0]) expect(zoneOffset(zone, t)).toBe(minutes);
    }
    expect(fixedOffsetZone(-330)).toBe('UTC-05:30');
  });

  it('refuses labels that are not such offsets', () => {
    for (const zone of ['UTC+1', 'UTC+24:00', 'UTC+01:60', 'GMT+01:00', '+01:00']) expect(isValidZone(zone)).toBe(false);
  });

  it('keeps the written offset of a time of a person without a zone, and rejects a wall-clock time or an epoch number as no_zone', () => {
    const entry = recordToEntry({ person: 'ann', time: '2026-03-29T08:15:00+02:00', text: 'hi' }, source, columns, noZones, DEFAULT_TIME_OPTIONS);
    expect(entry).toMatchObject({ kind: 'entry', entry: { zone: 'UTC+02:00', offsetMinutes: 120, instant: Date.UTC(2026, 2, 29, 6, 15) } });
    for (const time of ['2026-03-29 08:15', '1774764900']) {
      const item = recordToEntry({ person: 'ann', time, text: 'hi' }, source, columns, noZones, DEFAULT_TIME_OPTIONS);
      expect(item).toMatchObject({ kind: 'reject', diagnostic: { code: 'no_zone', message: expect.stringContaining('"timeZone"') } });
    }
  });

  it('reads random RFC 3339 times with offsets without any zone: the instant of ECMA-262 Date.parse, the written local time back (fuzz)', () => {
    const rng = random('fixed-offset-entries');
    for (let k = 0; k < 300; k++) {
      const instant = Date.UTC(1980, 0, 1) + randomInteger(rng, 50 * 365 * 1440) * 60000;
      const offset = (randomInteger(rng, 105) - 48) * 15; // −12:00 … +14:00 in quarter hours
      const written = formatLocal(instant, offset);
      const item = recordToEntry({ person: 'ann', time: written, text: 'hi' }, source, columns, noZones, DEFAULT_TIME_OPTIONS);
      if (item.kind !== 'entry') throw new Error(`rejected ${written}: ${item.diagnostic.message}`);
      expect(item.entry.instant).toBe(Date.parse(written));
      expect(item.entry.zone).toBe(fixedOffsetZone(offset));
      expect(formatLocal(item.entry.instant, item.entry.offsetMinutes)).toBe(written);
    }
  });
});
