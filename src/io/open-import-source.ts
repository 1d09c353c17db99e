import { basename } from 'node:path';
import { inputError, usageError } from '../errors.js';
import { DEFAULT_TIME_OPTIONS, type EpochUnit, type TimeOptions } from '../ingest/parse-instant.js';
import type { TimeWindow } from '../ingest/time-window.js';
import { readRecords } from '../ingest/read-records.js';
import { tableFile } from './table-file.js';
import { isValidZone, type WallClockPolicy } from '../ingest/zone-offset.js';
import type { ImportItem } from '../ingest/import/import-item.js';
import { parseChatLine, type ChatStamp } from '../ingest/import/parse-chat-line.js';
import { readChatLines } from '../ingest/import/read-chat-lines.js';
import { readChatTable } from '../ingest/import/read-chat-table.js';
import { compileDiaryEntryTime, compileDiaryHeading, DEFAULT_DIARY_DATE_FORMAT, DEFAULT_DIARY_HEADING, readDiary } from '../ingest/import/read-diary.js';
import { readMbox } from '../ingest/import/read-mbox.js';
import { settleDateOrder, type DateOrder } from '../ingest/import/settle-date-order.js';
import { readByteLines, readDecodedLines } from './read-byte-lines.js';

/** The donated-export formats `import` reads. */
export const IMPORT_FORMATS = ['mbox', 'diary', 'chat-lines', 'chat-table'] as const;
export type ImportFormat = (typeof IMPORT_FORMATS)[number];

/** One donated export to import: the same fields on the command line and in a study file's input. */
export interface ImportSourceSpec {
  format: ImportFormat;
  path: string;
  /** Person id written to the entries (already pseudonymized when a key is used). */
  person: string;
  /** The person's IANA zone. */
  zone: string;
  /** mbox: the participant's addresses. */
  addresses?: readonly string[];
  /** chat-lines, chat-table: the participant's sender names. */
  senders?: readonly string[];
  /** chat-lines: date order; settled from the file when absent. */
  dateOrder?: DateOrder;
  /** diary: heading pattern, luxon date format and locale; pattern and luxon format of a timed entry's line. */
  heading?: string;
  dateFormat?: string;
  locale?: string;
  entryTime?: string;
  entryTimeFormat?: string;
  /** chat-table: field names and time format. */
  senderField?: string;
  timeField?: string;
  textField?: string;
  timeFormat?: string;
  /** chat-table: unit of epoch-number times (default `auto`: told apart by size). */
  epoch?: EpochUnit;
  /** Daylight-saving policies for wall-clock times (default: reject both). */
  dstGap?: WallClockPolicy;
  dstOverlap?: WallClockPolicy;
  /** chat-table: plausible times (TimeOptions.window); the other formats are checked by importEntries. */
  window?: TimeWindow;
}

/** An opened source: its items, streamed, and what was settled on the way. */
export interface OpenedImportSource {
  items: AsyncIterable<ImportItem>;
  /** chat-lines: the date order used and why. */
  dateOrder?: { order: DateOrder; evidence: string };
}

/** Reads a chat-lines file once to settle its date order (settleDateOrder); throws when it cannot be settled. */
async function settleChatDateOrder(path: string): Promise<{ order: DateOrder; evidence: string }> {
  const stamps: Array<Pick<ChatStamp, 'parts' | 'firstDigits'>> = [];
  const seen = new Set<string>();
  for await (const { text } of readDecodedLines(path)) {
    const parsed = parseChatLine(text);
    if (parsed.kind === 'continuation' || parsed.kind === 'damaged') continue;
    const key = `${parsed.stamp.firstDigits}:${parsed.stamp.parts[0]}/${parsed.stamp.parts[1]}`;
    if (seen.has(key)) continue; // the first two numbers decide; keep memory small on long logs
    seen.add(key);
    stamps.push({ parts: parsed.stamp.parts, firstDigits: parsed.stamp.firstDigits });
  }
  const result = settleDateOrder(stamps);
  if (result.ok) return { order: result.order, evidence: result.evidence };
  if (result.reason === 'ambiguous') throw usageError(`Cannot tell day from month in \`${path}\`: ${result.message}; pass --date-order dmy (31/12) or --date-order mdy (12/31).`);
  if (result.reason === 'empty') throw inputError(`Cannot read \`${path}\` as chat-lines: no line starts with a date and time such as \`31/12/2024, 21:05 - Name: text\`; check the format.`);
  throw inputError(`Cannot read \`${path}\` as chat-lines: ${result.message}; the file mixes date orders, so split it or pass --date-order.`);
}

/**
 * Opens a donated export for import, checking the options first (usage errors name what is
 * missing), and returns its items streamed. chat-lines files are read twice: once to settle the
 * date order, once to import.
 */
export async function openImportSource(spec: ImportSourceSpec): Promise<OpenedImportSource> {
  if (!isValidZone(spec.zone)) throw usageError(`Cannot use the time zone \`${spec.zone}\`: it is not an IANA zone name; use one such as \`Europe/Brussels\`.`);
  const file = basename(spec.path);
  const dst = { gap: spec.dstGap ?? 'reject', overlap: spec.dstOverlap ?? 'reject' };
  switch (spec.format) {
    case 'mbox': {
      const addresses = spec.addresses ?? [];
      if (addresses.length === 0) throw usageError('Cannot import mbox without the participant\'s addresses: pass --address ADDR (repeat it for each address the person sends from).');
      return { items: readMbox(readByteLines(spec.path), { file, person: spec.person, zone: spec.zone, addresses }) };
    }
    case 'chat-lines': {
      const senders = requireSenders(spec);
      const dateOrder = spec.dateOrder ? { order: spec.dateOrder, evidence: 'given' } : await settleChatDateOrder(spec.path);
      return { items: readChatLines(readDecodedLines(spec.path), { file, person: spec.person, zone: spec.zone, senders, dateOrder: dateOrder.order, dst }), dateOrder };
    }
    case 'chat-table': {
      const senders = requireSenders(spec);
      const time: TimeOptions = { ...DEFAULT_TIME_OPTIONS, gap: dst.gap, overlap: dst.overlap, ...(spec.epoch ? { epoch: spec.epoch } : {}), ...(spec.timeFormat ? { format: spec.timeFormat } : {}), ...(spec.window ? { window: spec.window } : {}) };
      const options = { file, person: spec.person, zone: spec.zone, senders, time, senderField: spec.senderField, timeField: spec.timeField, textField: spec.textField };
      return { items: readChatTable(readRecords(tableFile(spec.path)), options) };
    }
    case 'diary': {
      const heading = compileDiaryHeading(spec.heading ?? DEFAULT_DIARY_HEADING);
      const entryTime = spec.entryTime !== undefined ? compileDiaryEntryTime(spec.entryTime) : undefined;
      const options = { file, person: spec.person, zone: spec.zone, heading, dateFormat: spec.dateFormat ?? DEFAULT_DIARY_DATE_FORMAT, locale: spec.locale ?? 'en', dst, entryTime, entryTimeFormat: spec.entryTimeFormat };
      return { items: readDiary(readDecodedLines(spec.path), options) };
    }
    default:
      throw usageError(`Cannot import the format \`${String(spec.format)}\`; use one of ${IMPORT_FORMATS.join(', ')}.`);
  }
}

function requireSenders(spec: ImportSourceSpec): readonly string[] {
  const senders = spec.senders ?? [];
  if (senders.length === 0) throw usageError(`Cannot import ${spec.format} without the participant's sender name: pass --sender NAME (as it appears in the export; repeat it for several).`);
  return senders;
}
