import type { CompiledLexicon } from '../lexicon/compile-lexicon.js';
import { isWildcard } from '../lexicon/parse-lexicon.js';
import { matchLexicon } from '../score/match-lexicon.js';
import type { RandomSource } from '../stats/random.js';
import { tokenize } from '../text/tokenize.js';
import type { LexiconRef } from '../types.js';
import { kwicSnippet, tokenOffsets } from './kwic-snippet.js';
import { dropTopTerms, type ContributionRow, type DropTopTerms } from './drop-top-terms.js';
import { hitContributions } from './hit-contributions.js';
import { reservoir, reservoirAdd, type Reservoir } from './reservoir-sample.js';
import { termReliability, type TermReliability } from './term-reliability.js';

/** One text entry of an audit corpus. `bin` groups entries of a person (e.g. the local date) for reliability over bins. */
export interface AuditEntry {
  id: string;
  person: string;
  text: string;
  bin?: string;
}

/** A keyword-in-context sample (context redacted). */
export interface KwicSample {
  entryId: string;
  person: string;
  left: string;
  match: string;
  right: string;
}

/** Audit figures of one term of one category. */
export interface AuditedTerm {
  term: string;
  category: string;
  wildcard: boolean;
  /** Scored hits (negated hits dropped by the lexicon's rule are not scored). */
  hits: number;
  /** hits / all scored hits of the category (undefined when the category has none). */
  share?: number;
  /** 1-based rank by hits within the category. */
  rank: number;
  entries: number;
  persons: number;
  /** Largest share of the term's hits written by one person. */
  topPersonShare?: number;
  negated: number;
  /** `over_share`, `no_hits`, `few_persons`. */
  flags: string[];
  /** For wildcards: corpus words it matched, most frequent first. */
  matchedWords: Array<{ word: string; hits: number }>;
  kwic: KwicSample[];
}

/** Reliability and sensitivity of one category. */
export interface AuditedCategory {
  category: string;
  aggregation: string;
  terms: number;
  termsWithHits: number;
  hits: number;
  reliability: TermReliability & { over: 'entries' | 'bins' };
  dropTopK: Array<DropTopTerms & { droppedTerms: string[] }>;
}

/** The result of a term audit. */
export interface TermAudit {
  lexicon: LexiconRef;
  entries: number;
  persons: number;
  words: number;
  options: Required<Omit<TermAuditOptions, 'random' | 'redact'>>;
  terms: AuditedTerm[];
  categories: AuditedCategory[];
  /** Sentences for the researcher (no hits at all, flagged terms …). */
  warnings: string[];
}

/** Options of {@link termAuditor}. */
export interface TermAuditOptions {
  /** Flag a term holding more than this share of its category's hits (default 0.2; common practice). */
  maxShare?: number;
  /** Flag a term used by fewer than this many persons when the corpus has at least this many (default 3, i.e. carried by 1–2 persons). */
  minPersons?: number;
  /** Keyword-in-context samples per term (default 5). */
  kwic?: number;
  /** Tokens of context on each side (default 6). */
  context?: number;
  /** Largest k of the drop-top-k check (default 3). */
  dropTop?: number;
  /** Items over `entries` (default) or over `bins` (person × entry.bin). */
  over?: 'entries' | 'bins';
  /** Seeded random source for the keyword-in-context samples. */
  random: RandomSource;
  /** Redacts context text before it is kept (emails, phones, URLs, handles, names). */
  redact?: (text: string) => string;
}

interface TermState {
  term: string;
  category: number;
  hits: number;
  negated: number;
  entries: number;
  lastEntry: number;
  persons: Map<string, number>;
  words: Map<string, number>;
  kwic: Reservoir<KwicSample>;
}

const UNSPACED = /^(ja|zh|th|lo|km|my|bo)(-|$)/i;

/**
 * A streaming term audit of one compiled lexicon: `add` each entry of a corpus, then `finish`.
 * Per term: scored hits, share of the category's hits (flag over `maxShare`), entries, persons
 * (flag when fewer than `minPersons`), negated hits, the words each wildcard matched, and a
 * uniform sample of keyword-in-context snippets (reservoir sampling with the seeded `random`,
 * context passed through `redact`). Per category: Cronbach's alpha and split-half reliability
 * with terms as items over entries or person-bins (term-reliability.ts), and the drop-top-k
 * sensitivity check (drop-top-terms.ts).
 *
 * Memory grows with the scored hits of the corpus (kept per entry for reliability and
 * sensitivity), not with its text.
 */
export function termAuditor(lexicon: CompiledLexicon, options: TermAuditOptions): { add(entry: AuditEntry): void; finish(): TermAudit } {
  const opts = {
    maxShare: options.maxShare ?? 0.2,
    minPersons: options.minPersons ?? 3,
    kwic: options.kwic ?? 5,
    context: options.context ?? 6,
    dropTop: options.dropTop ?? 3,
    over: options.over ?? 'entries',
  } as const;
  const redact = options.redact ?? ((s: string) => s);
  const spaced = !UNSPACED.test(lexicon.language);
  const categoryIndex = new Map(lexicon.categories.map((c, i) => [c.name, i]));
  const states: TermState[] = [];
  const byKey = new Map<string, number>();
  const stateFor = (term: string, category: number): number => {
    const key = `${term.toLocaleLowerCase(lexicon.language)}\u0000${category}`;
    let idx = byKey.get(key);
    if (idx === undefined) {
      idx = states.length;
      states.push({ term, category, hits: 0, negated: 0, entries: 0, lastEntry: -1, persons: new Map(), words: new Map(), kwic: reservoir(opts.kwic) });
      byKey.set(key, idx);
    }
    return idx;
  };
  for (const row of lexicon.lexicon.terms) {
    if (row.status === 'accepted') stateFor(row.term, categoryIndex.get(row.category) as number);
  }
  const rows: Array<{ person: string; bin: string; nWords: number; hits: Array<[number, number]> }> = [];
  const persons = new Set<string>();
  let words = 0;

  const add = (entry: AuditEntry): void => {
    const entryIndex = rows.length;
    persons.add(entry.person);
    const tokens = tokenize(entry.text, lexicon.language);
    words += tokens.nWords;
    const hits: Array<[number, number]> = [];
    let offsets: number[] | undefined;
    matchLexicon(tokens, lexicon, (hit, start, length, negated) => {
      const contributions = hitContributions(hit, negated, lexicon);
      for (let k = 0; k < hit.categories.length; k++) {
        const c = hit.categories[k] as number;
        const s = states[stateFor(hit.pattern, c)] as TermState;
        if (negated) s.negated++;
        const counted = contributions.find(([cc]) => cc === c);
        if (!counted) continue;
        const idx = stateFor(hit.pattern, c);
        hits.push([idx, counted[1]]);
        s.hits++;
        if (s.lastEntry !== entryIndex) {
          s.entries++;
          s.lastEntry = entryIndex;
        }
        s.persons.set(entry.person, (s.persons.get(entry.person) ?? 0) + 1);
        if (isWildcard(hit.pattern)) {
          const w = tokens.norm[start] as string;
          s.words.set(w, (s.words.get(w) ?? 0) + 1);
        }
        reservoirAdd(
          s.kwic,
          () => {
            offsets ??= tokenOffsets(entry.text, tokens.raw);
            return { entryId: entry.id, person: entry.person, ...kwicSnippet(entry.text, offsets, tokens.raw, start, length, opts.context, redact, spaced) };
          },
          options.random,
        );
      }
    });
    rows.push({ person: entry.person, bin: entry.bin ?? '', nWords: tokens.nWords, hits });
  };

  const finish = (): TermAudit => {
    const warnings: string[] = [];
    const terms: AuditedTerm[] = [];
    const categories: AuditedCategory[] = [];
    const totalPersons = persons.size;
    const shareLimits = new Map<string, number>();
    lexicon.categories.forEach((cat, c) => {
      const idxs = states.map((_, i) => i).filter((i) => (states[i] as TermState).category === c);
      idxs.sort((a, b) => (states[b] as TermState).hits - (states[a] as TermState).hits || ((states[a] as TermState).term < (states[b] as TermState).term ? -1 : 1));
      const catHits = idxs.reduce((sum, i) => sum + (states[i] as TermState).hits, 0);
      // In a short list every term holds a large share by arithmetic: a term is flagged only above
      // the larger of maxShare and half again an equal share (1.5 / terms), e.g. 50% for three terms.
      const limit = Math.max(opts.maxShare, 1.5 / Math.max(1, idxs.length));
      shareLimits.set(cat.name, limit);
      idxs.forEach((i, r) => {
        const s = states[i] as TermState;
        const flags: string[] = [];
        const share = catHits > 0 ? s.hits / catHits : undefined;
        if (share !== undefined && share > limit) flags.push('over_share');
        if (s.hits === 0) flags.push('no_hits');
        if (s.hits > 0 && totalPersons >= opts.minPersons && s.persons.size < opts.minPersons) flags.push('few_persons');
        const top = Math.max(0, ...s.persons.values());
        terms.push({
          term: s.term,
          category: cat.name,
          wildcard: isWildcard(s.term),
          hits: s.hits,
          share,
          rank: r + 1,
          entries: s.entries,
          persons: s.persons.size,
          topPersonShare: s.hits > 0 ? top / s.hits : undefined,
          negated: s.negated,
          flags,
          matchedWords: [...s.words].map(([word, hits]) => ({ word, hits })).sort((a, b) => b.hits - a.hits || (a.word < b.word ? -1 : 1)),
          kwic: s.kwic.items,
        });
      });
      // Reliability: items are the terms of this category with hits.
      const withHits = idxs.filter((i) => (states[i] as TermState).hits > 0);
      const itemOf = new Map(withHits.map((i, j) => [i, j]));
      const itemRows = new Map<string, Map<number, number>>();
      const sparse: Array<Array<[number, number]>> = [];
      rows.forEach((row) => {
        const counts = new Map<number, number>();
        for (const [t] of row.hits) {
          const j = itemOf.get(t);
          if (j !== undefined) counts.set(j, (counts.get(j) ?? 0) + 1);
        }
        if (opts.over === 'entries') sparse.push([...counts]);
        else {
          const key = `${row.person}\u0000${row.bin}`;
          let m = itemRows.get(key);
          if (!m) itemRows.set(key, (m = new Map()));
          for (const [j, x] of counts) m.set(j, (m.get(j) ?? 0) + x);
        }
      });
      if (opts.over === 'bins') for (const m of itemRows.values()) sparse.push([...m]);
      const reliability = { ...termReliability(sparse, withHits.map((i) => (states[i] as TermState).hits)), over: opts.over };
      const contributionRows: ContributionRow[] = rows.map((row) => ({ nWords: row.nWords, hits: row.hits.filter(([t]) => (states[t] as TermState).category === c) }));
      const drop = dropTopTerms(contributionRows, cat.aggregation, withHits, opts.dropTop).map((d) => ({ ...d, droppedTerms: d.dropped.map((t) => (states[t] as TermState).term) }));
      categories.push({ category: cat.name, aggregation: cat.aggregation, terms: idxs.length, termsWithHits: withHits.length, hits: catHits, reliability, dropTopK: drop });
      const flagged = terms.filter((t) => t.category === cat.name && t.flags.includes('over_share'));
      if (flagged.length > 0) warnings.push(`category \`${cat.name}\`: ${flagged.map((t) => `\`${t.term}\` (${Math.round((t.share ?? 0) * 100)}%)`).join(', ')} ${flagged.length === 1 ? 'holds' : 'each hold'} more than ${Math.round((shareLimits.get(cat.name) ?? opts.maxShare) * 100)}% of its hits; read their keyword-in-context samples before trusting the scores.`);
    });
    if (rows.length > 0 && terms.every((t) => t.hits === 0)) {
      warnings.unshift(`none of the ${terms.length} accepted terms matched any of the ${rows.length} entries; check that the corpus text column is the right one and that the lexicon's \`## language\` (${lexicon.language}) is the corpus language.`);
    }
    return { lexicon: lexicon.ref, entries: rows.length, persons: totalPersons, words, options: opts, terms, categories, warnings };
  };
  return { add, finish };
}
