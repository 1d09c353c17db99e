import { zoneAtInstant, zoneOnLocalDate, type ZoneTable } from '../zone-table.js';
import { resolveWallClock, type WallClockPolicy } from '../zone-offset.js';
import { importReject, type ImportItem } from './import-item.js';

/**
 * Places the entries of one donated export in the zone the zone table gives the person for each
 * entry, for a person who moves (a zone file with effective dates). The importers read a whole
 * export in one zone; this corrects each entry afterwards, as the table readers do for each row:
 *
 * - an entry whose time was written without an offset (`wallClock`: a diary, a chat log, a
 *   chat-table time without offset) is the same wall-clock time read in the zone in force on its
 *   local date (`zoneOnLocalDate`); a time the new zone skips or repeats follows `dst`, and one
 *   that is rejected keeps its file and line;
 * - an entry whose time carried its offset (a mail's Date header) keeps its instant and offset and
 *   gets the zone in force at that instant (`zoneAtInstant`).
 *
 * Rejects and drops pass through; a person with one zone gets every item back unchanged.
 */
export async function* applyZoneTable(
  items: AsyncIterable<ImportItem>,
  table: ZoneTable,
  person: string,
  dst: { gap: WallClockPolicy; overlap: WallClockPolicy },
): AsyncGenerator<ImportItem> {
  const moves = new Set((table.periods.get(person) ?? []).map((p) => p.zone)).size > 1;
  for await (const item of items) {
    if (!moves || item.kind !== 'entry') {
      yield item;
      continue;
    }
    const { entry } = item;
    if (!item.wallClock) {
      const zone = zoneAtInstant(table, person, entry.instant) ?? entry.zone;
      yield zone === entry.zone ? item : { ...item, entry: { ...entry, zone } };
      continue;
    }
    const wall = entry.instant + entry.offsetMinutes * 60000;
    const zone = zoneOnLocalDate(table, person, new Date(wall).toISOString().slice(0, 10)) ?? entry.zone;
    if (zone === entry.zone) {
      yield item;
      continue;
    }
    const resolved = resolveWallClock(wall, zone, dst);
    if (!resolved.ok) {
      yield importReject(entry.source.file, entry.source.line, resolved.code, resolved.message);
      continue;
    }
    yield { ...item, entry: { ...entry, zone, instant: resolved.instant, offsetMinutes: resolved.offsetMinutes } };
  }
}
