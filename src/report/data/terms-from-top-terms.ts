import type { CategoryAudit, LexiconAuditData } from '../report-data.js';
import { parseCsvTable } from './parse-csv-table.js';
import { FLAG_MEANINGS } from './terms-from-json.js';

/**
 * The lexicon section's data from `top-terms.csv` of `lexichron terms audit` (docs/architecture.md,
 * "Term audit": lexicon, category, rank, term, hits, share, flags separated by `;`). Categories keep
 * file order, terms rank order. The category total is hits ÷ share of its top term (the file holds
 * only the top terms); without a share it is the sum of the listed hits. Returns undefined when the
 * file lacks those columns or rows.
 */
export function termsFromTopTerms(text: string): LexiconAuditData | undefined {
  const table = parseCsvTable(text);
  if (!table) return undefined;
  const col = new Map(table.header.map((h, i) => [h, i]));
  for (const c of ['lexicon', 'category', 'term', 'hits']) if (!col.has(c)) return undefined;
  const cell = (row: string[], name: string): string => row[col.get(name) ?? -1] ?? '';
  const categories = new Map<string, CategoryAudit>();
  const seenFlags = new Set<string>();
  for (const row of table.rows) {
    const lexicon = cell(row, 'lexicon');
    const category = cell(row, 'category');
    const key = `${lexicon}\u0000${category}`;
    const c = categories.get(key) ?? { lexicon, category, totalHits: 0, terms: [] };
    categories.set(key, c);
    const hits = Number(cell(row, 'hits'));
    const share = Number(cell(row, 'share'));
    const flags = cell(row, 'flags').split(';').map((f) => f.trim()).filter(Boolean);
    for (const f of flags) seenFlags.add(f);
    if (!(hits > 0)) continue;
    c.terms.push({ term: cell(row, 'term'), hits, share: Number.isFinite(share) && cell(row, 'share') !== '' ? share : Number.NaN, flags });
  }
  const out: CategoryAudit[] = [];
  for (const c of categories.values()) {
    if (c.terms.length === 0) continue;
    const top = c.terms[0] as CategoryAudit['terms'][number];
    const listed = c.terms.reduce((s, t) => s + t.hits, 0);
    c.totalHits = Number.isFinite(top.share) && top.share > 0 ? Math.round(top.hits / top.share) : listed;
    for (const t of c.terms) if (!Number.isFinite(t.share)) t.share = t.hits / Math.max(1, c.totalHits);
    out.push(c);
  }
  if (out.length === 0) return undefined;
  const flagMeanings: Record<string, string> = {};
  for (const f of [...seenFlags].sort()) flagMeanings[f] = FLAG_MEANINGS[f] ?? 'flagged by the audit';
  return { categories: out, flagMeanings };
}
