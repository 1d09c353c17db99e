import type { ImportReconciliation } from '../ingest/import/import-item.js';

/** The reconciliation as text for the terminal: read, kept, rejected and dropped by reason, notes. */
export function importReconciliationText(r: ImportReconciliation): string {
  const lines = [`read ${r.read}: kept ${r.kept}`];
  const section = (title: string, counts: Record<string, number>): void => {
    const keys = Object.keys(counts).sort();
    if (keys.length === 0) return;
    const total = keys.reduce((sum, k) => sum + (counts[k] ?? 0), 0);
    lines.push(`${title} ${total}: ${keys.map((k) => `${k} ${counts[k]}`).join(', ')}`);
  };
  section('rejected', r.rejected);
  section('dropped', r.dropped);
  section('kept with a note', r.notes);
  return lines.join('\n');
}
