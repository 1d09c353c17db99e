import { zoneOnLocalDate, type ZoneTable } from '../ingest/zone-table.js';
import { dateOfDayNumber } from './local-day.js';

/** The zone of a person on a local day number, from a zone table (undefined when the table does not know them). */
export function zoneOnDay(table: ZoneTable): (person: string, day: number) => string | undefined {
  return (person, day) => (table.periods.has(person) ? zoneOnLocalDate(table, person, dateOfDayNumber(day)) : undefined);
}
