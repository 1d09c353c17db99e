import { usageError } from '../errors.js';
import { applyZoneTable } from '../ingest/import/apply-zone-table.js';
import { importEntries } from '../ingest/import/import-entries.js';
import { zoneAtInstant, type ZoneTable } from '../ingest/zone-table.js';
import type { TimeOptions } from '../ingest/parse-instant.js';
import type { TableFormat } from '../ingest/read-records.js';
import { STUDY_IMPORT_FORMATS, type StudyInput } from '../study/parse-study.js';
import { openImportSource, type ImportFormat } from './open-import-source.js';
import type { ScoreInput } from './run-score.js';

/**
 * Turns one input of a study file into what the score stage reads: a table (CSV, TSV, JSON Lines,
 * JSON) with its column mapping, or a donated export (mbox, diary, chat-lines, chat-table) read
 * through its importer, with duplicates and bursts handled and third parties' messages dropped
 * before scoring. `path` is already resolved against the study folder; `time` is this input's
 * time options (the study's, with the input's own `time` over them). An export is read in the
 * person's first zone and each entry then placed in the zone in force for it (applyZoneTable).
 */
export function studyInput(input: StudyInput, path: string, zones: ZoneTable, time: TimeOptions, where: string): ScoreInput {
  const format = input.format;
  if (!format || !(STUDY_IMPORT_FORMATS as readonly string[]).includes(format)) {
    const c = input.columns;
    return {
      path,
      format: format as TableFormat | undefined,
      delimiter: input.delimiter,
      columns: c ? { person: c.person ?? 'person', time: c.time ?? 'time', text: c.text ?? 'text', id: c.id, zone: c.zone } : undefined,
      time,
    };
  }
  const person = input.person as string;
  const zone = zoneAtInstant(zones, person, 0);
  if (!zone) throw usageError(`${where}: person \`${person}\` has no time zone; list them in the zone file or set "timeZone".`);
  return {
    path,
    items: async () => {
      const opened = await openImportSource({
        format: format as ImportFormat,
        path,
        person,
        zone,
        addresses: input.addresses,
        senders: input.senders,
        dateOrder: input.dateOrder,
        heading: input.heading,
        dateFormat: input.dateFormat,
        locale: input.locale,
        entryTime: input.entryTime,
        entryTimeFormat: input.entryTimeFormat,
        senderField: input.senderField,
        timeField: input.timeField,
        textField: input.textField,
        timeFormat: input.timeFormat ?? input.time?.format,
        epoch: time.epoch,
        dstGap: time.gap,
        dstOverlap: time.overlap,
        ...(time.window ? { window: time.window } : {}),
      });
      // A person who moves: each entry in the zone in force for it, as table rows are read.
      return importEntries(applyZoneTable(opened.items, zones, person, { gap: time.gap, overlap: time.overlap }), { ...(time.window ? { window: time.window } : {}), ...(input.dedupe ? { dedupe: {} } : {}), ...(input.mergeBurstMinutes !== undefined ? { mergeBurstMinutes: input.mergeBurstMinutes } : {}) });
    },
  };
}
