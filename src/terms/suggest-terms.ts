import { ENGLISH_FUNCTION_WORDS } from './function-words.js';
import { inflectedForms, type InflectedForm } from './inflected-forms.js';
import { logLikelihoodRatio } from './log-likelihood-ratio.js';
import { positivePmi } from './positive-pmi.js';
import type { SeedCooccurrence } from './seed-cooccurrence.js';
import { wordnetPartsOfSpeech, wordnetRelatedLemmas, type WordNetRelation, type WordNetRelatedOptions } from './wordnet-related-lemmas.js';
import type { WordNetPos, WordNetSource } from './wordnet-types.js';

/** Why a term was suggested. */
export type SuggestionReason =
  | { kind: 'wordnet'; relation: WordNetRelation; seed: string; pos: WordNetPos; sense: number; synset: number }
  | { kind: 'inflection'; of: string; form: InflectedForm['kind'] }
  | { kind: 'corpus'; pmi: number; g2: number; together: number; entries: number };

/** A suggested term with every reason found for it. */
export interface TermSuggestion {
  /** Lower case; phrases with single spaces. */
  term: string;
  reasons: SuggestionReason[];
  /** Entries of the corpus holding the term (single words only; undefined without a corpus or for phrases). */
  corpusEntries?: number;
  /** Positive PMI with the seeds in the corpus, when the term co-occurs with them at all. */
  pmi?: number;
  /** Association strength with the seeds (G², see logLikelihoodRatio), when the term shares at least `minCount` entries with them. */
  strength?: number;
  /** 1-based rank. */
  rank: number;
}

/** Options of {@link suggestTerms}. */
export interface SuggestTermsOptions {
  seeds: readonly string[];
  /** WordNet database; without it there are no WordNet or inflection suggestions. */
  wordnet?: WordNetSource;
  /** Which relations and senses to follow (see wordnetRelatedLemmas; default: the first sense of each part of speech). */
  wordnetOptions?: WordNetRelatedOptions;
  /** Also suggest inflected forms (default true). */
  inflections?: boolean;
  /** Corpus co-occurrence counts with the seeds (see seedCooccurrence). */
  corpus?: SeedCooccurrence;
  /** Fewest entries a corpus word must share with the seeds to be suggested (default 3; common practice). */
  minCount?: number;
  /** Lowest PMI (bits) of a corpus suggestion (default 1, i.e. twice as often as chance; common practice). */
  minPmi?: number;
  /** At most this many corpus-only suggestions, strongest association first (default 50). */
  maxCorpus?: number;
  /** Corpus words never suggested (default: ENGLISH_FUNCTION_WORDS; pass an empty set for other languages' lists). */
  stopWords?: ReadonlySet<string>;
}

const RELATION_ORDER: readonly WordNetRelation[] = ['synonym', 'similar', 'derived', 'pertainym', 'see-also'];

function kinds(s: TermSuggestion): number {
  return new Set(s.reasons.map((r) => r.kind)).size;
}

function bestSense(s: TermSuggestion): number {
  let best = Infinity;
  for (const r of s.reasons) {
    if (r.kind === 'inflection') best = Math.min(best, 0);
    if (r.kind === 'wordnet') best = Math.min(best, r.sense + RELATION_ORDER.indexOf(r.relation) / 10);
  }
  return best;
}

/**
 * Suggests terms for a construct from seed words, each with its reasons:
 * WordNet 3.1 synonyms and related lemmas of each seed, inflected forms of the seeds for the
 * parts of speech WordNet gives them (en-inflectors), and words that co-occur with the seeds in the
 * researcher's own corpus with positive PMI ≥ `minPmi` in at least `minCount` entries (function words left out).
 *
 * Ranking (deterministic): more kinds of evidence first; then stronger association with the seeds
 * (G², counted only for terms sharing at least `minCount` entries with them; others last); then the lowest WordNet sense number (inflections of a seed count as
 * sense 0; synonym before similar, derived, pertainym, see-also); then more corpus entries; then
 * alphabetical. Seeds are never suggested.
 */
export function suggestTerms(options: SuggestTermsOptions): TermSuggestion[] {
  const seeds = [...new Set(options.seeds.map((s) => s.trim().toLowerCase()).filter((s) => s !== ''))];
  const seedSet = new Set(seeds);
  const byTerm = new Map<string, TermSuggestion>();
  const add = (term: string, reason: SuggestionReason): void => {
    const t = term.trim().toLowerCase().replace(/\s+/g, ' ');
    if (t === '' || seedSet.has(t) || t.includes('*') || t.includes('\t')) return;
    let s = byTerm.get(t);
    if (!s) byTerm.set(t, (s = { term: t, reasons: [], rank: 0 }));
    s.reasons.push(reason);
  };
  const wn = options.wordnet;
  if (wn) {
    for (const seed of seeds) {
      for (const r of wordnetRelatedLemmas(wn, seed, { ...options.wordnetOptions, maxSenses: options.wordnetOptions?.maxSenses ?? 1 })) {
        add(r.lemma, { kind: 'wordnet', relation: r.relation, seed, pos: r.pos, sense: r.sense, synset: r.synset });
      }
    }
    if (options.inflections !== false) {
      for (const base of seeds) {
        const parts = wordnetPartsOfSpeech(wn, base);
        for (const f of inflectedForms(base, parts)) add(f.form, { kind: 'inflection', of: base, form: f.kind });
      }
    }
  }
  const corpus = options.corpus;
  if (corpus) {
    const minCount = options.minCount ?? 3;
    const minPmi = options.minPmi ?? 1;
    const stop = options.stopWords ?? ENGLISH_FUNCTION_WORDS;
    const found: Array<{ word: string; pmi: number; g2: number; together: number; entries: number }> = [];
    for (const [word, c] of corpus.words) {
      if (seedSet.has(word) || c.withSeed < minCount || !/\p{L}/u.test(word) || stop.has(word)) continue;
      const pmi = positivePmi(c.withSeed, c.entries, corpus.seedEntries, corpus.entries);
      if (pmi !== undefined && pmi > 0 && pmi >= minPmi) found.push({ word, pmi, g2: logLikelihoodRatio(c.withSeed, c.entries, corpus.seedEntries, corpus.entries), together: c.withSeed, entries: c.entries });
    }
    // Strongest association first (G² grows with the evidence; PMI favours rare words).
    found.sort((a, b) => b.g2 - a.g2 || b.pmi - a.pmi || (a.word < b.word ? -1 : a.word > b.word ? 1 : 0));
    for (const f of found.slice(0, options.maxCorpus ?? 50)) add(f.word, { kind: 'corpus', pmi: f.pmi, g2: f.g2, together: f.together, entries: f.entries });
    for (const s of byTerm.values()) {
      if (s.term.includes(' ')) continue;
      const c = corpus.words.get(s.term);
      s.corpusEntries = c?.entries ?? 0;
      if (c && c.withSeed > 0) s.pmi = positivePmi(c.withSeed, c.entries, corpus.seedEntries, corpus.entries);
      if (c && c.withSeed >= minCount) s.strength = logLikelihoodRatio(c.withSeed, c.entries, corpus.seedEntries, corpus.entries);
    }
  }
  const list = [...byTerm.values()].sort(
    (a, b) =>
      kinds(b) - kinds(a) ||
      (b.strength ?? -1) - (a.strength ?? -1) ||
      bestSense(a) - bestSense(b) ||
      (b.corpusEntries ?? 0) - (a.corpusEntries ?? 0) ||
      (a.term < b.term ? -1 : a.term > b.term ? 1 : 0),
  );
  list.forEach((s, i) => (s.rank = i + 1));
  return list;
}

/** A reason in words, e.g. `synonym of worried (adjective, sense 1)`, `plural of worry`, `PMI 2.32 with the seeds in 5 entries`. */
export function suggestionReasonText(r: SuggestionReason): string {
  const posName: Record<WordNetPos, string> = { n: 'noun', v: 'verb', a: 'adjective', r: 'adverb' };
  if (r.kind === 'wordnet') return `WordNet ${r.relation} of ${r.seed} (${posName[r.pos]}, sense ${r.sense})`;
  if (r.kind === 'inflection') return `${r.form.replace('-', ' ')} of ${r.of}`;
  return `G² ${r.g2.toFixed(1)}, PMI ${r.pmi.toFixed(2)} with the seeds in ${r.together} of its ${r.entries} entries`;
}
