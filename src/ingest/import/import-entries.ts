import { inTimeWindow, type TimeWindow } from '../time-window.js';
import type { RawEntry } from '../../types.js';
import { createBurstMerger } from './create-burst-merger.js';
import { createDeduplicator, type DedupeOptions } from './create-deduplicator.js';
import type { EntryNote, ImportItem, ImportReconciliation } from './import-item.js';

/** Steps applied to the entries of an importer, in this order. */
export interface ImportStepOptions {
  /** Drop exact and near duplicates (createDeduplicator); absent = keep all. */
  dedupe?: DedupeOptions;
  /** Merge messages within this many minutes into one entry (createBurstMerger); absent = no merging. */
  mergeBurstMinutes?: number;
  /** Applied to the text of every entry that leaves (redaction), after duplicates are found. */
  redact?: (text: string) => string;
  /** Plausible times (see timeWindow): an entry outside is rejected as `time_outside_window`; absent = years 0000–9999. */
  window?: TimeWindow;
}

/**
 * Runs the shared steps over an importer's items: duplicates are dropped (`duplicate_exact`,
 * `duplicate_near`), bursts merged (`merged_burst`), then the text redacted. Every input unit
 * leaves exactly one item (an entry, a reject or a drop), so `read = kept + rejected + dropped`
 * holds when the output is tallied with tallyImportItem. Drops and rejects pass through at once;
 * a merged entry leaves when its burst ends.
 */
export async function* importEntries(items: AsyncIterable<ImportItem>, options: ImportStepOptions = {}): AsyncGenerator<ImportItem> {
  const isDuplicate = options.dedupe ? createDeduplicator(options.dedupe) : undefined;
  const merger = options.mergeBurstMinutes !== undefined ? createBurstMerger(options.mergeBurstMinutes) : undefined;
  // notes of the entry that opened the current burst (a merged entry carries the notes of its first message)
  let burstNotes: ImportItem & { kind: 'entry' } | undefined;
  const out = (entry: RawEntry, notes: readonly EntryNote[] | undefined): ImportItem => {
    const finished = options.redact ? { ...entry, text: options.redact(entry.text) } : entry;
    return notes && notes.length > 0 ? { kind: 'entry', entry: finished, notes: [...notes] } : { kind: 'entry', entry: finished };
  };
  for await (const item of items) {
    if (item.kind !== 'entry') {
      yield item;
      continue;
    }
    const { entry } = item;
    if (!inTimeWindow(entry.instant, options.window)) {
      const message = 'the time lies outside the plausible window (by default 1970-01-01 to ten years from today); check the date format, or widen the window with --time-window FROM/TO';
      yield { kind: 'reject', diagnostic: { code: 'time_outside_window', message, source: entry.source, stage: 'ingest' } };
      continue;
    }
    if (isDuplicate) {
      const verdict = isDuplicate(entry.person, entry.text);
      if (verdict !== 'unique') {
        yield { kind: 'drop', reason: verdict, source: entry.source };
        continue;
      }
    }
    if (!merger) {
      yield out(entry, item.notes);
      continue;
    }
    const { done, merged } = merger.push(entry);
    if (merged) {
      yield { kind: 'drop', reason: 'merged_burst', source: entry.source };
      continue;
    }
    if (done) yield out(done, burstNotes?.notes);
    burstNotes = item;
  }
  const last = merger?.flush();
  if (last) yield out(last, burstNotes?.notes);
}

/** Adds one item to a reconciliation (mutating it) and returns it. */
export function tallyImportItem(reconciliation: ImportReconciliation, item: ImportItem): ImportReconciliation {
  reconciliation.read++;
  if (item.kind === 'entry') {
    reconciliation.kept++;
    for (const note of item.notes ?? []) reconciliation.notes[note] = (reconciliation.notes[note] ?? 0) + 1;
  } else if (item.kind === 'reject') {
    reconciliation.rejected[item.diagnostic.code] = (reconciliation.rejected[item.diagnostic.code] ?? 0) + 1;
  } else {
    reconciliation.dropped[item.reason] = (reconciliation.dropped[item.reason] ?? 0) + 1;
  }
  return reconciliation;
}
