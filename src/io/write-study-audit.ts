import { join } from 'node:path';
import type { StageOutput } from '../pipeline.js';
import { tableResource, type TableResource } from '../report/data-dictionary.js';
import { inferTableResource } from '../report/infer-table-resource.js';
import { termAuditFiles, TERM_AUDIT_FILES, TOP_TERMS_COLUMNS } from '../terms/term-audit-files.js';
import type { TermAudit } from '../terms/term-auditor.js';
import { writeFileAtomic } from './atomic-write.js';
import { fileDigest } from './run-score.js';

/**
 * Writes the term audits of a study run into `terms/`: one combined `terms/top-terms.csv` (the
 * report reads it) and each lexicon's audit files in `terms/<lexicon>/`. Keyword-in-context
 * samples hold (redacted) text, so they are written only when the study keeps text.
 */
export async function writeStudyAudit(outDir: string, audits: readonly TermAudit[], top: number, keepText: boolean): Promise<StageOutput> {
  const dir = join(outDir, 'terms');
  const describe: Record<string, string> = {
    category_term: 'Term', lexicon: 'Lexicon name', lexicon_sha256: 'Content hash of the lexicon', category: 'Category', rank: 'Rank by hits within the category',
    term: 'Term as written in the lexicon', hits: 'Scored hits', share: 'Share of the category\'s hits', entries: 'Entries with a hit', persons: 'Distinct persons using the term', flags: 'over_share; few_persons',
  };

  const written: string[] = [];
  const resources: TableResource[] = [];
  const topLines: string[] = [];
  for (const audit of audits) {
    const files = termAuditFiles(audit, top);
    for (const name of Object.keys(files).sort()) {
      const content = files[name] as string;
      if (name === TERM_AUDIT_FILES.top) {
        topLines.push(...content.split('\n').slice(1).filter((l) => l !== ''));
        continue;
      }
      if (name === TERM_AUDIT_FILES.kwic && !keepText) continue;
      const rel = `${audit.lexicon.name}/${name}`;
      await writeFileAtomic(join(dir, rel), content);
      written.push(rel);
      if (name.endsWith('.csv')) resources.push(inferTableResource(`terms-${audit.lexicon.name}-${name.replace(/\.csv$/, '')}`, `terms/${rel}`, content, (c) => describe[c], `Term audit of ${audit.lexicon.name}: ${name} (see README.md, "Term lists").`));
    }
  }
  await writeFileAtomic(join(dir, TERM_AUDIT_FILES.top), [TOP_TERMS_COLUMNS.join(','), ...topLines].join('\n') + '\n');
  written.unshift(TERM_AUDIT_FILES.top);
  const outputs = [];
  for (const rel of written) {
    const d = await fileDigest(join(dir, rel));
    outputs.push({ path: `terms/${rel}`, sha256: d.sha256, bytes: d.bytes });
  }
  return {
    resources: [{ ...tableResource('top-terms', `terms/${TERM_AUDIT_FILES.top}`, TOP_TERMS_COLUMNS, (n) => describe[n], 'The most frequent terms of each category of every audited lexicon, with audit flags.'), schema: { fields: TOP_TERMS_COLUMNS.map((name) => ({ name, type: ['rank', 'hits', 'entries', 'persons'].includes(name) ? 'integer' as const : name === 'share' ? 'number' as const : 'string' as const, description: describe[name] ?? name })), missingValues: [''] } }, ...resources],
    outputs,
    summary: { lexicons: audits.map((a) => ({ name: a.lexicon.name, sha256: a.lexicon.sha256, entries: a.entries, warnings: a.warnings })) },
  };
}
