import { importEntries, tallyImportItem, type ImportStepOptions } from '../ingest/import/import-entries.js';
import { emptyImportReconciliation, type ImportReconciliation } from '../ingest/import/import-item.js';
import { entryLine } from '../ingest/import/entry-line.js';
import type { Pseudonymizer } from '../privacy/create-pseudonymizer.js';
import { inputError } from '../errors.js';
import { csvRow } from '../report/csv.js';
import { TOOL_VERSION } from '../version.js';
import { openAtomicLineWriter, writeFileAtomic } from './atomic-write.js';
import { openImportSource, type ImportSourceSpec } from './open-import-source.js';
import { diagnosticText } from '../privacy/diagnostic-text.js';

/** Everything `lexichron import` needs. */
export interface RunImportOptions {
  source: ImportSourceSpec;
  steps: ImportStepOptions;
  /** Entries JSONL to write; rejects go to `<out>.rejects.csv`, counts to `<out>.meta.json`. */
  out: string;
  /**
   * With a key (source.person is then already its pseudonym): entry ids become keyed digests, each
   * entry is marked with the key's check value (`pseudonym_key`, so that `score` and `run` do not
   * pseudonymize it again), and the rejects name the export `input` instead of its file name.
   */
  pseudonyms?: Pseudonymizer;
  /** Redaction for reject messages (the same as steps.redact, or identity). */
  redactMessages: (text: string) => string;
  /** Leave text out of reject messages entirely. */
  aggregatesOnly?: boolean;
  onProgress?: (read: number) => void;
}

/** The outcome of an import. */
export interface RunImportResult {
  reconciliation: ImportReconciliation;
  entriesPath: string;
  rejectsPath: string;
  metaPath: string;
  dateOrder?: { order: string; evidence: string };
}

/**
 * Imports one donated export: opens it (openImportSource), runs the shared steps (importEntries),
 * and writes the entries JSONL, the rejects CSV (`file,line,code,message`, messages redacted) and a
 * sidecar `<out>.meta.json` with the reconciliation, all atomically: on any error nothing is left at
 * the output paths. Third-party messages never reach a writer.
 */
export async function runImport(options: RunImportOptions): Promise<RunImportResult> {
  const opened = await openImportSource(options.source);
  const entriesPath = options.out;
  const rejectsPath = `${options.out}.rejects.csv`;
  const metaPath = `${options.out}.meta.json`;
  const reconciliation = emptyImportReconciliation();
  const entries = await openAtomicLineWriter(entriesPath);
  const rejects = await openAtomicLineWriter(rejectsPath);
  let firstNotKept: { line: number | undefined; reason: string } | undefined;
  try {
    await rejects.write(csvRow(['file', 'line', 'code', 'message']));
    for await (const item of importEntries(opened.items, options.steps)) {
      tallyImportItem(reconciliation, item);
      if (item.kind !== 'entry' && firstNotKept === undefined) {
        firstNotKept = item.kind === 'reject' ? { line: item.diagnostic.source?.line, reason: item.diagnostic.code } : { line: item.source.line, reason: item.reason };
      }
      if (item.kind === 'entry') {
        const entry = options.pseudonyms ? { ...item.entry, id: options.pseudonyms.entryId(item.entry.id), pseudonymKey: options.pseudonyms.keyCheck } : item.entry;
        await entries.write(entryLine(entry));
      } else if (item.kind === 'reject') {
        const d = item.diagnostic;
        const message = options.aggregatesOnly ? d.code : diagnosticText(options.redactMessages(d.message));
        const file = d.source ? (options.pseudonyms ? 'input' : d.source.file) : '';
        await rejects.write(csvRow([file, d.source ? String(d.source.line) : '', d.code, message]));
      }
      if (options.onProgress && reconciliation.read % 1000 === 0) options.onProgress(reconciliation.read);
    }
    if (reconciliation.kept === 0) await entries.abort();
    else await entries.commit();
    await rejects.commit();
  } catch (error) {
    await entries.abort();
    await rejects.abort();
    throw error;
  }
  const meta = {
    tool: { name: 'lexichron', version: TOOL_VERSION },
    format: options.source.format,
    person: options.source.person,
    pseudonymized: options.pseudonyms !== undefined,
    zone: options.source.zone,
    ...(opened.dateOrder ? { dateOrder: opened.dateOrder } : {}),
    steps: { dedupe: options.steps.dedupe ?? false, mergeBurstMinutes: options.steps.mergeBurstMinutes ?? null, redacted: options.steps.redact !== undefined },
    reconciliation,
  };
  await writeFileAtomic(metaPath, `${JSON.stringify(meta, null, 2)}\n`);
  if (reconciliation.kept === 0) throw inputError(nothingKeptMessage(options.source, reconciliation.read, firstNotKept, rejectsPath));
  return { reconciliation, entriesPath, rejectsPath, metaPath, ...(opened.dateOrder ? { dateOrder: opened.dateOrder } : {}) };
}

/** What to try when an import of `format` keeps nothing, by the reason of the first row not kept. */
function suggestion(format: string, reason: string | undefined): string {
  if (reason === 'third_party') {
    return format === 'mbox' ? 'check --address (every address the participant sends from)' : 'check --sender (the participant\'s name exactly as the export writes it)';
  }
  if (reason === 'time_outside_window') return 'check the dates, or widen the plausible window with --time-window FROM/TO';
  switch (format) {
    case 'diary':
      return reason === 'diary_before_first_heading' || reason === undefined
        ? 'no line matched the heading pattern: give the pattern of your date headings with --heading (its first group holding the date) and their format with --date-format'
        : 'check --date-format (and --entry-time-format) against the headings';
    case 'chat-lines':
      return 'check --sender and --date-order, and that each message starts with a date and time';
    case 'chat-table':
      return 'check --sender, --sender-field, --time-field, --text-field and --time-format';
    default:
      return 'check --address and that the file is an mbox archive (messages starting with "From " lines)';
  }
}

/** The error of an import that kept no entry: counts and the first row not kept by its position and code, never its text. */
function nothingKeptMessage(source: ImportSourceSpec, read: number, first: { line: number | undefined; reason: string } | undefined, rejectsPath: string): string {
  const where = first ? ` The first row not kept is on line ${first.line ?? '?'} (${first.reason}).` : ' The file held nothing to read.';
  return `Cannot import \`${source.path}\`: no entry was kept (${read} read).${where} To fix: ${suggestion(source.format, first?.reason)}. Reasons per row are in \`${rejectsPath}\`; no entries file was written.`;
}
