import { join } from 'node:path';
import { termAuditFiles } from '../terms/term-audit-files.js';
import type { TermAudit } from '../terms/term-auditor.js';
import { writeFileAtomic } from './atomic-write.js';

/**
 * Writes a term audit's files into `dir` (created when missing), each atomically
 * (temporary file + rename). Returns the paths written, in a stable order.
 */
export async function writeTermAudit(dir: string, audit: TermAudit, top = 10): Promise<string[]> {
  const files = termAuditFiles(audit, top);
  const paths: string[] = [];
  for (const name of Object.keys(files).sort()) {
    const path = join(dir, name);
    await writeFileAtomic(path, files[name] as string);
    paths.push(path);
  }
  return paths;
}
