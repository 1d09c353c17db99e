import { IANAZone } from 'luxon';
import { describe, expect, it } from 'vitest';
import { resolveWallClock, zoneOffset } from '../../src/ingest/zone-offset.js';

const QUARTER = 15 * 60_000;

describe('zoneOffset (per-day cache) against luxon IANAZone.offset', () => {
  it('agrees with luxon every 3 hours of 2026, and every quarter hour of each change day, in zones with and without daylight saving (IANA tz database via ICU)', () => {
    const zones = ['Europe/Brussels', 'America/New_York', 'Australia/Sydney', 'Asia/Kolkata', 'Australia/Lord_Howe', 'America/St_Johns', 'UTC'];
    const day = 86_400_000;
    for (const zone of zones) {
      const z = IANAZone.create(zone);
      let mismatches = 0;
      let checks = 0;
      for (let d = Date.UTC(2026, 0, 1); d < Date.UTC(2027, 0, 1); d += day) {
        const changes = z.offset(d) !== z.offset(d + day - QUARTER);
        for (let t = d; t < d + day; t += changes ? QUARTER : 3 * 3_600_000) {
          checks++;
          // Probe inside the quarter hour too (offsets only change on quarter-hour boundaries).
          if (zoneOffset(zone, t + 7 * 60_000) !== z.offset(t)) mismatches++;
        }
      }
      expect(mismatches, zone).toBe(0);
      expect(checks).toBeGreaterThan(2900);
    }
  });

  it('switches exactly at the EU change on 2026-03-29 01:00 UTC in Europe/Brussels (IANA tz: last Sunday of March)', () => {
    const change = Date.UTC(2026, 2, 29, 1, 0);
    expect(zoneOffset('Europe/Brussels', change - 1)).toBe(60);
    expect(zoneOffset('Europe/Brussels', change)).toBe(120);
  });

  it('switches exactly at the US change on 2026-11-01 06:00 UTC in America/New_York (IANA tz: first Sunday of November)', () => {
    const change = Date.UTC(2026, 10, 1, 6, 0);
    expect(zoneOffset('America/New_York', change - 1)).toBe(-240);
    expect(zoneOffset('America/New_York', change)).toBe(-300);
  });

  it('still resolves a repeated wall-clock time to the earlier instant (02:30 on 2026-10-25 in Brussels is 00:30Z)', () => {
    const r = resolveWallClock(Date.UTC(2026, 9, 25, 2, 30), 'Europe/Brussels', { gap: 'reject', overlap: 'earlier' });
    expect(r).toEqual({ ok: true, instant: Date.UTC(2026, 9, 25, 0, 30), offsetMinutes: 120 });
  });
});
