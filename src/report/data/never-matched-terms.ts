import type { CategoryAudit, LexiconAuditData } from '../report-data.js';
import { parseCsvTable } from './parse-csv-table.js';

/**
 * Per category, its number of terms and those that never matched (in file order), from a
 * lexicon's `term-hits.csv` of `lexichron terms audit` (columns category, term, hits: every term
 * of the lexicon, matched or not). Undefined when the file lacks those columns.
 */
export function neverMatchedFromTermHits(text: string): Map<string, { termCount: number; neverMatched: string[] }> | undefined {
  const table = parseCsvTable(text);
  if (!table) return undefined;
  const col = new Map(table.header.map((h, i) => [h, i]));
  const [category, term, hits] = ['category', 'term', 'hits'].map((name) => col.get(name));
  if (category === undefined || term === undefined || hits === undefined) return undefined;
  const out = new Map<string, { termCount: number; neverMatched: string[] }>();
  for (const row of table.rows) {
    const c = row[category] ?? '';
    let entry = out.get(c);
    if (entry === undefined) out.set(c, (entry = { termCount: 0, neverMatched: [] }));
    entry.termCount++;
    if (!(Number(row[hits]) > 0)) entry.neverMatched.push(row[term] ?? '');
  }
  return out;
}

/**
 * `audit` (or, without one, an audit of no matched terms) with each category's never-matched
 * terms from the lexicons' term-hits files; a category none of whose terms matched, which the
 * top-terms file leaves out, is added with no matched terms.
 */
export function withNeverMatched(audit: LexiconAuditData | undefined, files: ReadonlyArray<{ lexicon: string; text: string }>): LexiconAuditData | undefined {
  const categories: CategoryAudit[] = audit ? audit.categories.map((c) => ({ ...c })) : [];
  for (const { lexicon, text } of files) {
    for (const [category, { termCount, neverMatched }] of neverMatchedFromTermHits(text) ?? []) {
      const found = categories.find((c) => c.lexicon === lexicon && c.category === category);
      if (found) Object.assign(found, { termCount, neverMatched });
      else categories.push({ lexicon, category, totalHits: 0, terms: [], termCount, neverMatched });
    }
  }
  if (categories.length === 0) return audit;
  return { categories, flagMeanings: audit?.flagMeanings ?? {} };
}
