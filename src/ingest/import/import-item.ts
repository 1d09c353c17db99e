import type { Diagnostic, RawEntry, SourceRef } from '../../types.js';

/**
 * Why a row read from a donated export was removed on purpose (not an error):
 * - `third_party`: written by someone other than the participant; dropped before anything is stored or scored;
 * - `system_line`: a line the chat program wrote itself (joins, encryption notices, …);
 * - `duplicate_exact`, `duplicate_near`: the same (or nearly the same) text as an earlier entry of the person;
 * - `merged_burst`: folded into the entry of the burst it belongs to (`--merge-burst`).
 */
export type DropReason = 'third_party' | 'system_line' | 'duplicate_exact' | 'duplicate_near' | 'merged_burst';

/**
 * A remark on an entry that was kept:
 * - `mojibake`: double-encoded UTF-8 was repaired;
 * - `windows_1252`: bytes that were not UTF-8 were read as Windows-1252 (a file with mixed encodings);
 * - `undecodable_bytes`: the decoded text holds U+FFFD replacement characters (bytes the declared charset could not decode);
 * - `time_iso_fallback`: the time did not match the given time format and was read as RFC 3339 / ISO 8601.
 */
export type EntryNote = 'mojibake' | 'windows_1252' | 'undecodable_bytes' | 'time_iso_fallback';

/**
 * What an importer yields for each unit it reads (message, chat line, diary entry):
 * an entry, a reject with its reason, or a drop. A drop never carries text, so third-party
 * words cannot leak into any output. `wallClock` marks an entry whose time was written without
 * an offset and read in the person's zone (see applyZoneTable).
 */
export type ImportItem =
  | { kind: 'entry'; entry: RawEntry; notes?: EntryNote[]; wallClock?: boolean }
  | { kind: 'reject'; diagnostic: Diagnostic }
  | { kind: 'drop'; reason: DropReason; source: SourceRef };

/** Counts of an import: `read` = kept + Σ rejected + Σ dropped; `notes` counts kept rows with an EntryNote, by note. */
export interface ImportReconciliation {
  read: number;
  kept: number;
  rejected: Record<string, number>;
  dropped: Record<string, number>;
  /** Kept rows with a note, by note (`mojibake`, `windows_1252`, `undecodable_bytes`). */
  notes: Record<string, number>;
}

/** A fresh, empty reconciliation. */
export function emptyImportReconciliation(): ImportReconciliation {
  return { read: 0, kept: 0, rejected: {}, dropped: {}, notes: {} };
}

/** Builds a reject item for the ingest stage. */
export function importReject(file: string, line: number, code: string, message: string): ImportItem {
  return { kind: 'reject', diagnostic: { code, message, source: { file, line }, stage: 'ingest' } };
}
