import { lexiconHash } from '../lexicon/lexicon-hash.js';
import type { Lexicon, TermStatus } from '../lexicon/lexicon-types.js';

/** One term that differs between two versions of a lexicon. */
export interface TermChange {
  change: 'added' | 'removed' | 'reweighted' | 'status';
  term: string;
  category: string;
  weightBefore?: number;
  weightAfter?: number;
  statusBefore?: TermStatus;
  statusAfter?: TermStatus;
}

/** The differences between two lexicons. */
export interface LexiconDiff {
  before: { name: string; version: string; sha256: string; terms: number };
  after: { name: string; version: string; sha256: string; terms: number };
  /** Same content hash. */
  identical: boolean;
  changes: TermChange[];
  categoriesAdded: string[];
  categoriesRemoved: string[];
  /** Metadata keys whose values differ (name, version, license, source, language, scale, negation …). */
  metadataChanged: string[];
}

function key(term: string, category: string): string {
  return `${category}\u0000${term.toLowerCase()}`;
}

/**
 * Compares two versions of a lexicon term by term (a term is identified by category and
 * lower-cased text): added, removed, reweighted, and review-status changes, plus changed
 * categories and metadata and both content hashes (lexiconHash). Changes are sorted by
 * category, then term.
 */
export function diffLexicons(before: Lexicon, after: Lexicon): LexiconDiff {
  const a = new Map(before.terms.map((t) => [key(t.term, t.category), t]));
  const b = new Map(after.terms.map((t) => [key(t.term, t.category), t]));
  const changes: TermChange[] = [];
  for (const [k, t] of a) {
    const u = b.get(k);
    if (!u) changes.push({ change: 'removed', term: t.term, category: t.category, weightBefore: t.weight, statusBefore: t.status });
    else if (u.weight !== t.weight) changes.push({ change: 'reweighted', term: u.term, category: u.category, weightBefore: t.weight, weightAfter: u.weight, statusBefore: t.status, statusAfter: u.status });
    else if (u.status !== t.status) changes.push({ change: 'status', term: u.term, category: u.category, weightBefore: t.weight, weightAfter: u.weight, statusBefore: t.status, statusAfter: u.status });
  }
  for (const [k, u] of b) if (!a.has(k)) changes.push({ change: 'added', term: u.term, category: u.category, weightAfter: u.weight, statusAfter: u.status });
  changes.sort((x, y) => (x.category < y.category ? -1 : x.category > y.category ? 1 : x.term.toLowerCase() < y.term.toLowerCase() ? -1 : x.term.toLowerCase() > y.term.toLowerCase() ? 1 : 0));
  const metaKeys = ['name', 'version', 'license', 'source', 'language', 'scale', 'scoring', 'negation', 'negators', 'window', 'notes'] as const;
  const metadataChanged = metaKeys.filter((m) => JSON.stringify(before[m]) !== JSON.stringify(after[m]));
  for (const c of after.categories) {
    const old = before.categories.find((x) => x.name === c.name);
    if (old && (old.aggregation !== c.aggregation || old.description !== c.description)) metadataChanged.push(`category ${c.name}` as never);
  }
  const ha = lexiconHash(before);
  const hb = lexiconHash(after);
  return {
    before: { name: before.name, version: before.version, sha256: ha, terms: before.terms.length },
    after: { name: after.name, version: after.version, sha256: hb, terms: after.terms.length },
    identical: ha === hb,
    changes,
    categoriesAdded: after.categories.filter((c) => !before.categories.some((x) => x.name === c.name)).map((c) => c.name),
    categoriesRemoved: before.categories.filter((c) => !after.categories.some((x) => x.name === c.name)).map((c) => c.name),
    metadataChanged,
  };
}
