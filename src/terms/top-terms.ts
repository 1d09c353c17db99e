import type { AuditedTerm, TermAudit } from './term-auditor.js';

/**
 * The `n` most frequent terms of each category of an audit (rank order, categories in lexicon
 * order), leaving out terms without hits: what `top-terms.csv` holds and the report shows.
 */
export function topTerms(audit: TermAudit, n = 10): AuditedTerm[] {
  const out: AuditedTerm[] = [];
  for (const c of audit.categories) out.push(...audit.terms.filter((t) => t.category === c.category && t.hits > 0 && t.rank <= n));
  return out;
}
