import { describe, expect, it } from 'vitest';
import { buildZoneTable, zoneAtInstant, zoneOnLocalDate } from '../../src/ingest/zone-table.js';
import { isValidZone, zoneOffset } from '../../src/ingest/zone-offset.js';
import { readZoneFile } from '../../src/io/read-zone-file.js';
import { tempFolder } from '../support/temp-files.js';

const tmp = tempFolder();

describe('zoneOffset (IANA tz database)', () => {
  it('gives Europe/Brussels +01:00 before and +02:00 after 2026-03-29T01:00Z', () => {
    expect(zoneOffset('Europe/Brussels', Date.UTC(2026, 2, 29, 0, 59))).toBe(60);
    expect(zoneOffset('Europe/Brussels', Date.UTC(2026, 2, 29, 1, 0))).toBe(120);
  });

  it('gives America/New_York −04:00 before and −05:00 after 2026-11-01T06:00Z', () => {
    expect(zoneOffset('America/New_York', Date.UTC(2026, 10, 1, 5, 59))).toBe(-240);
    expect(zoneOffset('America/New_York', Date.UTC(2026, 10, 1, 6, 0))).toBe(-300);
  });

  it('gives Asia/Kathmandu its quarter-hour offset +05:45 and knows real zone names only', () => {
    expect(zoneOffset('Asia/Kathmandu', Date.UTC(2026, 0, 1))).toBe(345);
    expect(isValidZone('Europe/Brussels')).toBe(true);
    expect(isValidZone('Europe/Brusels')).toBe(false);
  });
});

describe('buildZoneTable', () => {
  const table = buildZoneTable(
    [
      { person: 'p1', zone: 'Europe/Brussels', line: 2 },
      { person: 'p1', zone: 'America/New_York', from: '2026-03-15', line: 3 },
      { person: 'p2', zone: 'Australia/Sydney', line: 4 },
    ],
    'zones.csv',
    'UTC',
  );

  it('switches a person\'s zone at local midnight of the `from` date in the new zone', () => {
    // Local midnight of 2026-03-15 in New York (EDT since 2026-03-08, −04:00) is 04:00Z.
    expect(zoneAtInstant(table, 'p1', Date.UTC(2026, 2, 15, 3, 59))).toBe('Europe/Brussels');
    expect(zoneAtInstant(table, 'p1', Date.UTC(2026, 2, 15, 4, 0))).toBe('America/New_York');
  });

  it('picks the zone in force on a local date for wall-clock times', () => {
    expect(zoneOnLocalDate(table, 'p1', '2026-03-14')).toBe('Europe/Brussels');
    expect(zoneOnLocalDate(table, 'p1', '2026-03-15')).toBe('America/New_York');
    expect(zoneOnLocalDate(table, 'p2', '2026-03-15')).toBe('Australia/Sydney');
  });

  it('gives persons who are not listed the --time-zone fallback', () => {
    expect(zoneAtInstant(table, 'p9', 0)).toBe('UTC');
    expect(zoneOnLocalDate(table, 'p9', '2026-03-15')).toBe('UTC');
    expect(zoneAtInstant(buildZoneTable([], ''), 'p9', 0)).toBeUndefined();
  });

  it('names the file, line and a correct example for an unknown zone', () => {
    expect(() => buildZoneTable([{ person: 'p1', zone: 'Europe/Brusels', line: 4 }], 'zones.csv')).toThrow(
      'Cannot read `zones.csv` on line 4: unknown time zone `Europe/Brusels`; expected an IANA name such as `Europe/Brussels` or `America/New_York`',
    );
  });

  it('rejects two periods of one person starting on the same date', () => {
    expect(() =>
      buildZoneTable(
        [
          { person: 'p1', zone: 'Europe/Brussels', from: '2026-03-01', line: 2 },
          { person: 'p1', zone: 'Europe/Paris', from: '2026-03-01', line: 3 },
        ],
        'zones.csv',
      ),
    ).toThrow(/on line 3: person `p1` has two zone periods starting 2026-03-01/);
  });

  it('rejects a `from` that is not a date and a bad --time-zone', () => {
    expect(() => buildZoneTable([{ person: 'p1', zone: 'UTC', from: '15/03/2026', line: 2 }], 'zones.csv')).toThrow(/`from` must be a local date YYYY-MM-DD/);
    expect(() => buildZoneTable([], '', 'Mars/Olympus')).toThrow(/Cannot use --time-zone: unknown time zone `Mars\/Olympus`/);
  });
});

describe('readZoneFile', () => {
  it('reads person, zone and from columns into a table', async () => {
    const path = tmp.write('zones.csv', 'person,zone,from\np1,Europe/Brussels,\np1,America/New_York,2026-03-15\n');
    const table = await readZoneFile(path);
    expect(zoneOnLocalDate(table, 'p1', '2026-03-20')).toBe('America/New_York');
  });

  it('names the missing columns of a zone file', async () => {
    const path = tmp.write('bad-zones.csv', 'participant,tz\np1,UTC\n');
    await expect(readZoneFile(path)).rejects.toThrow('a zone file needs the columns `person` and `zone`');
  });
});
