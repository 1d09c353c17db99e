import { importEntries, tallyImportItem, type ImportStepOptions } from '../ingest/import/import-entries.js';
import { emptyImportReconciliation, type ImportReconciliation } from '../ingest/import/import-item.js';
import { entryLine } from '../ingest/import/entry-line.js';
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
  try {
    await rejects.write(csvRow(['file', 'line', 'code', 'message']));
    for await (const item of importEntries(opened.items, options.steps)) {
      tallyImportItem(reconciliation, item);
      if (item.kind === 'entry') await entries.write(entryLine(item.entry));
      else if (item.kind === 'reject') {
        const d = item.diagnostic;
        const message = options.aggregatesOnly ? d.code : diagnosticText(options.redactMessages(d.message));
        await rejects.write(csvRow([d.source?.file ?? '', d.source ? String(d.source.line) : '', d.code, message]));
      }
      if (options.onProgress && reconciliation.read % 1000 === 0) options.onProgress(reconciliation.read);
    }
    await entries.commit();
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
    zone: options.source.zone,
    ...(opened.dateOrder ? { dateOrder: opened.dateOrder } : {}),
    steps: { dedupe: options.steps.dedupe ?? false, mergeBurstMinutes: options.steps.mergeBurstMinutes ?? null, redacted: options.steps.redact !== undefined },
    reconciliation,
  };
  await writeFileAtomic(metaPath, `${JSON.stringify(meta, null, 2)}\n`);
  return { reconciliation, entriesPath, rejectsPath, metaPath, ...(opened.dateOrder ? { dateOrder: opened.dateOrder } : {}) };
}
