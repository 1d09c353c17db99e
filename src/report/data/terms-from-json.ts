import type { CategoryAudit, LexiconAuditData } from '../report-data.js';

type Json = Record<string, unknown>;
const isObject = (v: unknown): v is Json => typeof v === 'object' && v !== null && !Array.isArray(v);

/** Plain meanings of the term audit's flags (src/terms/term-auditor.ts). */
export const FLAG_MEANINGS: Record<string, string> = {
  over_share: 'carries a large share of its category\'s hits on its own: the score may mostly measure this one word',
  few_persons: 'used by only one or two persons: the category may reflect their writing habits',
  no_hits: 'never matched in this corpus',
};

/**
 * The lexicon section's data from term audit JSON: one `TermAudit` (src/terms/term-auditor.ts),
 * an array of them, or `{ audits: [...] }`. Terms without hits are listed as never matched
 * (CategoryAudit.neverMatched), not drawn; keyword-in-context samples are never carried into the
 * report, so no raw text reaches the page. Returns undefined when nothing usable is found.
 */
export function termsFromJson(json: unknown): LexiconAuditData | undefined {
  const audits = Array.isArray(json) ? json : isObject(json) && Array.isArray(json.audits) ? json.audits : [json];
  const categories: CategoryAudit[] = [];
  const seenFlags = new Set<string>();
  for (const audit of audits) {
    if (!isObject(audit) || !Array.isArray(audit.terms)) continue;
    const lexicon = isObject(audit.lexicon) && typeof audit.lexicon.name === 'string' ? audit.lexicon.name : typeof audit.lexicon === 'string' ? audit.lexicon : 'lexicon';
    const byCategory = new Map<string, CategoryAudit>();
    for (const t of audit.terms) {
      if (!isObject(t) || typeof t.term !== 'string' || typeof t.category !== 'string') continue;
      const hits = typeof t.hits === 'number' ? t.hits : 0;
      const c = byCategory.get(t.category) ?? { lexicon, category: t.category, totalHits: 0, terms: [] };
      byCategory.set(t.category, c);
      c.totalHits += hits;
      c.termCount = (c.termCount ?? 0) + 1;
      if (hits <= 0) {
        (c.neverMatched ??= []).push(t.term);
        continue;
      }
      const flags = Array.isArray(t.flags) ? t.flags.filter((f): f is string => typeof f === 'string') : [];
      for (const f of flags) seenFlags.add(f);
      c.terms.push({ term: t.term, hits, share: typeof t.share === 'number' ? t.share : 0, flags });
    }
    for (const c of byCategory.values()) {
      if (c.totalHits > 0) for (const t of c.terms) if (t.share === 0) t.share = t.hits / c.totalHits;
      if (c.terms.length || c.neverMatched?.length) categories.push(c);
    }
  }
  if (categories.length === 0) return undefined;
  const flagMeanings: Record<string, string> = {};
  for (const f of [...seenFlags].sort()) flagMeanings[f] = FLAG_MEANINGS[f] ?? 'flagged by the audit';
  return { categories, flagMeanings };
}
