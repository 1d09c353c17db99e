import { basename } from 'node:path';
import { inputError } from '../errors.js';
import { diagnosticText } from '../privacy/diagnostic-text.js';
import type { AuditEntry } from '../terms/term-auditor.js';
import type { Diagnostic } from '../types.js';
import type { CorpusItem } from './read-corpus.js';

/**
 * Reads a whole corpus, handing each entry to `onEntry` and keeping the rejects; throws (exit 3)
 * when the corpus at `path` holds no entry, naming the first reject.
 */
export async function collectCorpus(path: string, items: AsyncIterable<CorpusItem>, onEntry: (entry: AuditEntry) => void): Promise<{ entries: number; rejects: Diagnostic[] }> {
  let entries = 0;
  const rejects: Diagnostic[] = [];
  for await (const item of items) {
    if (item.kind === 'reject') rejects.push(item.diagnostic);
    else {
      entries++;
      onEntry(item.entry);
    }
  }
  if (entries === 0) {
    const first = rejects[0];
    const why = first ? ` ${rejects.length} row${rejects.length === 1 ? ' was' : 's were'} rejected, the first on line ${first.source?.line}: ${diagnosticText(first.message)}.` : ' The file has no rows.';
    throw inputError(`The corpus \`${basename(path)}\` has no entries with text.${why} Check the file, --columns text=COLUMN and --format.`);
  }
  return { entries, rejects };
}
