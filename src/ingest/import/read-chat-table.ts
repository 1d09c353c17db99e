import { inputError } from '../../errors.js';
import type { RawEntry } from '../../types.js';
import { parseInstant, type TimeOptions } from '../parse-instant.js';
import type { RecordItem } from '../read-records.js';
import { importReject, type EntryNote, type ImportItem } from './import-item.js';
import { normalizeSender } from './parse-chat-line.js';
import { repairMojibake } from './repair-mojibake.js';
import { describeColumns } from '../../privacy/describe-columns.js';

/** Options of the chat-table importer (JSON, JSON Lines or CSV with one message per row). */
export interface ChatTableOptions {
  file: string;
  person: string;
  zone: string;
  /** The participant's sender name(s) or id(s); every other sender is a third party. */
  senders: readonly string[];
  /** Field names; when absent the first of the usual names present is used (see CHAT_TABLE_FIELDS). */
  senderField?: string;
  timeField?: string;
  textField?: string;
  time: TimeOptions;
}

/** Field names tried, in order, when no field is named. */
export const CHAT_TABLE_FIELDS = {
  sender: ['sender', 'from', 'author', 'sender_name', 'user', 'name'],
  time: ['time', 'timestamp', 'date', 'datetime', 'sent_at', 'created_at'],
  text: ['text', 'message', 'body', 'content'],
} as const;

function pickField(kind: keyof typeof CHAT_TABLE_FIELDS, named: string | undefined, columns: readonly string[], file: string): string {
  if (named !== undefined) {
    if (columns.includes(named)) return named;
    throw inputError(`Cannot read \`${file}\`: there is no ${kind} field \`${named}\`; the fields are ${describeColumns(columns)}.`);
  }
  const lower = columns.map((c) => c.toLowerCase());
  for (const candidate of CHAT_TABLE_FIELDS[kind]) {
    const i = lower.indexOf(candidate);
    if (i >= 0) return columns[i] as string;
  }
  throw inputError(
    `Cannot read \`${file}\`: no ${kind} field; expected one of ${CHAT_TABLE_FIELDS[kind].map((c) => `\`${c}\``).join(', ')}, found ${describeColumns(columns)}; name it with --${kind}-field.`,
  );
}

/**
 * Reads a chat or message table: rows from readRecords (CSV/TSV with a header, JSON Lines, or a
 * JSON array of objects) with a sender, a time and a text field.
 *
 * The fields are settled from the CSV header or the first JSON object; a table without a sender
 * field (or time, or text field) is an input error, since the participant's messages could not be
 * told from everyone else's. Rows of other senders are dropped as `third_party` without their text;
 * an empty sender → `chat_no_sender`; the time is read with parseInstant (RFC 3339 with offset,
 * local times in the person's zone, epoch numbers, or `time.format`); an empty text → `empty_text`.
 * Double-encoded UTF-8 in the text is repaired.
 */
export async function* readChatTable(records: AsyncIterable<RecordItem>, options: ChatTableOptions): AsyncGenerator<ImportItem> {
  const own = new Set(options.senders.map(normalizeSender));
  let fields: { sender: string; time: string; text: string } | undefined;
  const settle = (columns: readonly string[]): void => {
    fields = {
      sender: pickField('sender', options.senderField, columns, options.file),
      time: pickField('time', options.timeField, columns, options.file),
      text: pickField('text', options.textField, columns, options.file),
    };
  };
  for await (const item of records) {
    if (item.kind === 'header') {
      if (item.columns.length > 0) settle(item.columns);
      continue;
    }
    if (item.kind === 'reject') {
      yield { kind: 'reject', diagnostic: item.diagnostic };
      continue;
    }
    if (!fields) settle(Object.keys(item.record));
    const f = fields as { sender: string; time: string; text: string };
    const { file, line } = item.source;
    const sender = item.record[f.sender] ?? '';
    if (normalizeSender(sender) === '') {
      yield importReject(file, line, 'chat_no_sender', `the row has no value in the sender field \`${f.sender}\``);
      continue;
    }
    if (!own.has(normalizeSender(sender))) {
      yield { kind: 'drop', reason: 'third_party', source: item.source };
      continue;
    }
    const time = parseInstant(item.record[f.time] ?? '', options.zone, options.time);
    if (!time.ok) {
      yield importReject(file, line, time.code, time.message);
      continue;
    }
    const raw = item.record[f.text] ?? '';
    const repaired = repairMojibake(raw);
    const text = repaired.trim();
    if (text === '') {
      yield importReject(file, line, 'empty_text', `the row has no text in the field \`${f.text}\``);
      continue;
    }
    const entry: RawEntry = { id: `${file}:${line}`, person: options.person, instant: time.instant, zone: options.zone, offsetMinutes: time.offsetMinutes, text, source: item.source };
    const notes: EntryNote[] = repaired !== raw ? ['mojibake'] : [];
    if (time.ok && time.fallback) notes.push('time_iso_fallback');
    const wallClock = time.hadOffset ? {} : { wallClock: true };
    yield notes.length > 0 ? { kind: 'entry', entry, notes, ...wallClock } : { kind: 'entry', entry, ...wallClock };
  }
}
