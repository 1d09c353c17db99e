import { csvDocument } from '../report/csv.js';
import { formatNumber } from '../report/format-number.js';
import type { TermAudit } from './term-auditor.js';
import { topTerms } from './top-terms.js';

/** File names of a term audit's outputs (the `top-terms.csv` contract is in docs/architecture.md). */
export const TERM_AUDIT_FILES = {
  hits: 'term-hits.csv',
  top: 'top-terms.csv',
  wildcards: 'wildcard-words.csv',
  kwic: 'kwic.csv',
  reliability: 'term-reliability.csv',
  dropTopK: 'drop-top-k.csv',
  summary: 'term-audit.json',
} as const;

/** Columns of `top-terms.csv`, in order. */
export const TOP_TERMS_COLUMNS = ['lexicon', 'lexicon_sha256', 'category', 'rank', 'term', 'hits', 'share', 'entries', 'persons', 'flags'] as const;

const num = (v: number | undefined): string => formatNumber(v);

/**
 * Renders a term audit to its output files (name → content): CSV tables with fixed columns and
 * number formatting, and a JSON summary, so the same audit always gives byte-identical files.
 * `top` terms per category go to `top-terms.csv` (default 10).
 */
export function termAuditFiles(audit: TermAudit, top = 10): Record<string, string> {
  const files: Record<string, string> = {};
  files[TERM_AUDIT_FILES.hits] = csvDocument(
    ['category', 'term', 'wildcard', 'hits', 'share', 'rank', 'entries', 'persons', 'top_person_share', 'negated', 'flags'],
    audit.terms.map((t) => [t.category, t.term, t.wildcard ? '1' : '0', String(t.hits), num(t.share), String(t.rank), String(t.entries), String(t.persons), num(t.topPersonShare), String(t.negated), t.flags.join(';')]),
  );
  files[TERM_AUDIT_FILES.top] = csvDocument(
    TOP_TERMS_COLUMNS,
    topTerms(audit, top).map((t) => [audit.lexicon.name, audit.lexicon.sha256, t.category, String(t.rank), t.term, String(t.hits), num(t.share), String(t.entries), String(t.persons), t.flags.join(';')]),
  );
  files[TERM_AUDIT_FILES.wildcards] = csvDocument(
    ['category', 'pattern', 'word', 'hits'],
    audit.terms.filter((t) => t.wildcard).flatMap((t) => t.matchedWords.map((w) => [t.category, t.term, w.word, String(w.hits)])),
  );
  files[TERM_AUDIT_FILES.kwic] = csvDocument(
    ['category', 'term', 'entry_id', 'person', 'left', 'match', 'right'],
    audit.terms.flatMap((t) => t.kwic.map((k) => [t.category, t.term, k.entryId, k.person, k.left, k.match, k.right])),
  );
  files[TERM_AUDIT_FILES.reliability] = csvDocument(
    ['category', 'over', 'items', 'rows', 'alpha', 'standardized_alpha', 'half_correlation', 'split_half', 'note'],
    audit.categories.map((c) => {
      const r = c.reliability;
      return [c.category, r.over, String(r.items), String(r.rows), num(r.alpha), num(r.standardizedAlpha), num(r.halfCorrelation), num(r.splitHalf), [r.alphaReason, r.splitHalfReason, (r.alpha ?? 0) < 0 || (r.splitHalf ?? 0) < 0 ? 'below 0: the terms do not hang together in these rows (common with few hits per entry); read it as no internal consistency, not as a reliability' : undefined].filter(Boolean).join('; ')];
    }),
  );
  files[TERM_AUDIT_FILES.dropTopK] = csvDocument(
    ['category', 'k', 'dropped_terms', 'r', 'n', 'mean_before', 'mean_after', 'note'],
    audit.categories.flatMap((c) => c.dropTopK.map((d) => [c.category, String(d.k), d.droppedTerms.join(';'), num(d.r), String(d.n), num(d.meanBefore), num(d.meanAfter), d.reason ?? ''])),
  );
  files[TERM_AUDIT_FILES.summary] = JSON.stringify(
    {
      lexicon: audit.lexicon,
      entries: audit.entries,
      persons: audit.persons,
      words: audit.words,
      options: audit.options,
      warnings: audit.warnings,
      categories: audit.categories.map((c) => ({ ...c, dropTopK: c.dropTopK.map(({ dropped: _d, ...rest }) => rest) })),
      flagged: audit.terms.filter((t) => t.flags.length > 0).map((t) => ({ category: t.category, term: t.term, hits: t.hits, share: t.share, persons: t.persons, flags: t.flags })),
      files: Object.values(TERM_AUDIT_FILES),
    },
    null,
    2,
  ) + '\n';
  return files;
}
