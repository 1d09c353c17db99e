import { basename } from 'node:path';
import type { Diagnostic, RawEntry, ReadItem, SourceRef } from '../types.js';
import { parseColumnMapping, resolveColumns, type ColumnMapping } from './column-mapping.js';
import { DEFAULT_TIME_OPTIONS, parseInstant, type TimeOptions } from './parse-instant.js';
import { readRecordBatches, type ReadRecordsOptions, type TableFile } from './read-records.js';
import { fixedOffsetZone, isValidZone, zoneOffset } from './zone-offset.js';
import { zoneAtInstant, zoneOnLocalDate, type ZoneTable } from './zone-table.js';
import { describeValue, ID_LIKE, ZONE_LIKE } from '../privacy/describe-value.js';

export interface ReadEntriesOptions extends ReadRecordsOptions {
  columns?: ColumnMapping | string;
  zones: ZoneTable;
  time?: TimeOptions;
}

/** Column of entries pseudonymized at import that holds the key's check value (see entryLine). */
export const PSEUDONYM_KEY_COLUMN = 'pseudonym_key';

function reject(code: string, message: string, source: SourceRef): ReadItem {
  const diagnostic: Diagnostic = { code, message, source, stage: 'ingest' };
  return { kind: 'reject', diagnostic };
}

/**
 * Turns one record into an entry, or a reject with its reason.
 *
 * The zone is the record's own `zone` column when present, otherwise the person's zone from
 * the zone table (for a wall-clock time, the zone in force on that local date), otherwise, for a
 * time written with its offset, that fixed offset (`UTC+01:00`); else the row is `no_zone`. Times with an
 * offset keep their instant; the entry's offset is always the person's zone offset at that instant.
 * A `pseudonym_key` column marks an entry pseudonymized at import (RawEntry.pseudonymKey).
 */
export function recordToEntry(record: Record<string, string>, source: SourceRef, columns: ColumnMapping, zones: ZoneTable, time: TimeOptions): ReadItem {
  const person = (record[columns.person] ?? '').trim();
  if (person === '') return reject('missing_person', `the \`${columns.person}\` field is empty; every row needs a person id`, source);
  const text = record[columns.text] ?? '';
  if (text.trim() === '') return reject('empty_text', `the \`${columns.text}\` field is empty; there is nothing to score`, source);
  const timeText = (record[columns.time] ?? '').trim();
  let zone = columns.zone ? (record[columns.zone] ?? '').trim() : '';
  if (zone !== '') {
    if (!isValidZone(zone)) return reject('unknown_zone', `unknown time zone ${describeValue(zone, ZONE_LIKE)}; expected an IANA name such as Europe/Brussels`, source);
  } else {
    const date = /^\d{4}-\d{2}-\d{2}/.test(timeText) ? timeText.slice(0, 10) : undefined;
    zone = (date ? zoneOnLocalDate(zones, person, date) : undefined) ?? zoneAtInstant(zones, person, 0) ?? '';
    if (zone === '') return offsetEntry(record, source, columns, person, text, timeText, time);
  }
  const parsed = parseInstant(timeText, zone, time);
  if (!parsed.ok) return reject(parsed.code, parsed.message, source);
  if (columns.zone === undefined || (record[columns.zone] ?? '').trim() === '') {
    const atInstant = zoneAtInstant(zones, person, parsed.instant);
    if (atInstant && atInstant !== zone && parsed.hadOffset) zone = atInstant;
  }
  const idText = columns.id ? (record[columns.id] ?? '').trim() : '';
  const entry: RawEntry = {
    id: idText !== '' ? idText : `${source.file}:${source.line}`,
    person,
    instant: parsed.instant,
    zone,
    offsetMinutes: zoneOffset(zone, parsed.instant),
    text,
    source,
  };
  // The mark of entries pseudonymized at import (entryLine): they are not pseudonymized again.
  const pseudonymKey = (record[PSEUDONYM_KEY_COLUMN] ?? '').trim();
  if (pseudonymKey !== '') entry.pseudonymKey = pseudonymKey;
  return parsed.fallback ? { kind: 'entry', entry, notes: ['time_iso_fallback'] } : { kind: 'entry', entry };
}

/**
 * The entry of a person without a known zone whose time carries its UTC offset (RFC 3339 `Z` or
 * `+01:00`, or a format with an offset token): its instant and local time are known, so it keeps
 * the written offset as a fixed-offset zone (`UTC+01:00`, fixedOffsetZone). A wall-clock time or
 * an epoch number needs the person's zone: `no_zone`.
 */
function offsetEntry(record: Record<string, string>, source: SourceRef, columns: ColumnMapping, person: string, text: string, timeText: string, time: TimeOptions): ReadItem {
  const parsed = parseInstant(timeText, 'UTC', time);
  if (!parsed.ok) return reject(parsed.code, parsed.message, source);
  if (!parsed.hadOffset || parsed.epoch) {
    return reject('no_zone', `person ${describeValue(person, ID_LIKE)} has no time zone; list them in --zones or pass --time-zone (in a study file: "zones" or "timeZone"), or write the time with its UTC offset (${parsed.epoch ? 'an epoch number has none' : 'the time has none'})`, source);
  }
  const idText = columns.id ? (record[columns.id] ?? '').trim() : '';
  const entry: RawEntry = { id: idText !== '' ? idText : `${source.file}:${source.line}`, person, instant: parsed.instant, zone: fixedOffsetZone(parsed.offsetMinutes), offsetMinutes: parsed.offsetMinutes, text, source };
  const pseudonymKey = (record[PSEUDONYM_KEY_COLUMN] ?? '').trim();
  if (pseudonymKey !== '') entry.pseudonymKey = pseudonymKey;
  return parsed.fallback ? { kind: 'entry', entry, notes: ['time_iso_fallback'] } : { kind: 'entry', entry };
}

/**
 * Reads entries from a CSV, TSV, JSON Lines or JSON file (opened by src/io/: `tableFile(path)`) as a stream: each row becomes an entry
 * or a reject with file, line and reason. Throws (before any row) when the header lacks a mapped
 * column.
 */
export async function* readEntries(source: TableFile, options: ReadEntriesOptions): AsyncGenerator<ReadItem> {
  for await (const batch of readEntryBatches(source, options)) yield* batch;
}

/** readEntries in batches: the entries and rejects of one chunk of the file at a time, in order, never empty. */
export async function* readEntryBatches(source: TableFile, options: ReadEntriesOptions): AsyncGenerator<ReadItem[]> {
  const time = options.time ?? DEFAULT_TIME_OPTIONS;
  const mapping = typeof options.columns === 'string' || options.columns === undefined ? parseColumnMapping(options.columns) : options.columns;
  let columns: ColumnMapping | undefined;
  const file = basename(source.path);
  for await (const records of readRecordBatches(source, options)) {
    const items: ReadItem[] = [];
    for (const item of records) {
      if (item.kind === 'header') {
        if (item.columns.length > 0) columns = resolveColumns(mapping, item.columns, file);
        continue;
      }
      if (item.kind === 'reject') {
        items.push({ kind: 'reject', diagnostic: item.diagnostic });
        continue;
      }
      // JSON sources have no header: resolve against the first record's keys.
      columns ??= resolveColumns(mapping, Object.keys(item.record), file);
      items.push(recordToEntry(item.record, item.source, columns, options.zones, time));
    }
    if (items.length > 0) yield items;
  }
}
