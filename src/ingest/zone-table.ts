import { isCalendarDate } from './is-calendar-date.js';
import { utcFromFields } from './utc-from-fields.js';
import { usageError } from '../errors.js';
import { isValidZone, zoneOffset } from './zone-offset.js';

/** One period of a person's zone: `from` is the local date (YYYY-MM-DD) it takes effect, or undefined for "always before". */
export interface ZonePeriod {
  zone: string;
  from?: string;
  /** Instant of local midnight of `from` in `zone` (−Infinity for the first period). */
  fromInstant: number;
}

/** Each person's zones over time, plus an optional zone for everyone not listed. */
export interface ZoneTable {
  periods: ReadonlyMap<string, readonly ZonePeriod[]>;
  fallback?: string;
}

/** Throws a usage error unless `zone` is an IANA zone name. */
export function assertZone(zone: string, where: string): void {
  if (!isValidZone(zone)) {
    throw usageError(`${where}: unknown time zone \`${zone}\`; expected an IANA name such as \`Europe/Brussels\` or \`America/New_York\``);
  }
}

function midnightInstant(date: string, zone: string): number {
  const [y, m, d] = date.split('-').map(Number) as [number, number, number];
  const wall = utcFromFields(y, m, d) as number; // checked by isCalendarDate
  const offset = zoneOffset(zone, wall - zoneOffset(zone, wall) * 60000);
  return wall - offset * 60000;
}

/**
 * Builds a zone table from rows {person, zone, from?, line}. Checks every zone name, every date,
 * and that no person has two periods starting on the same date (overlapping periods).
 * Throws usage errors that name the file and line.
 */
export function buildZoneTable(
  rows: ReadonlyArray<{ person: string; zone: string; from?: string; line: number }>,
  file: string,
  fallback?: string,
): ZoneTable {
  if (fallback) assertZone(fallback, 'Cannot use --time-zone');
  const periods = new Map<string, ZonePeriod[]>();
  for (const row of rows) {
    assertZone(row.zone, `Cannot read \`${file}\` on line ${row.line}`);
    const from = row.from?.trim() || undefined;
    if (from !== undefined && !isCalendarDate(from)) {
      throw usageError(`Cannot read \`${file}\` on line ${row.line}: \`from\` must be a local date YYYY-MM-DD that exists (or empty for the first period); fix the date on that line`);
    }
    const list = periods.get(row.person) ?? [];
    if (list.some((p) => p.from === from)) {
      throw usageError(`Cannot read \`${file}\` on line ${row.line}: person \`${row.person}\` has two zone periods starting ${from ?? 'at the beginning'}; periods must not overlap: give each a different \`from\` date`);
    }
    list.push({ zone: row.zone, from, fromInstant: from === undefined ? -Infinity : midnightInstant(from, row.zone) });
    periods.set(row.person, list);
  }
  for (const list of periods.values()) list.sort((a, b) => a.fromInstant - b.fromInstant);
  return { periods, fallback };
}

/** The zone of `person` at `instant`, or undefined when the person has none. */
export function zoneAtInstant(table: ZoneTable, person: string, instant: number): string | undefined {
  const list = table.periods.get(person);
  if (!list || list.length === 0) return table.fallback;
  let zone: string | undefined = list[0]?.fromInstant === -Infinity ? list[0].zone : table.fallback ?? list[0]?.zone;
  for (const p of list) if (p.fromInstant <= instant) zone = p.zone;
  return zone;
}

/** The zone of `person` on local date `date` (YYYY-MM-DD), for reading wall-clock times. */
export function zoneOnLocalDate(table: ZoneTable, person: string, date: string): string | undefined {
  const list = table.periods.get(person);
  if (!list || list.length === 0) return table.fallback;
  let zone: string | undefined = list[0]?.from === undefined ? list[0]?.zone : table.fallback ?? list[0]?.zone;
  for (const p of list) if (p.from === undefined || p.from <= date) zone = p.zone;
  return zone;
}
