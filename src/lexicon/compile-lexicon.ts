import { termNorms } from '../text/term-norms.js';
import type { LexiconRef } from '../types.js';
import { lexiconHash } from './lexicon-hash.js';
import type { Aggregation, Lexicon, LexiconScoring, NegationRule } from './lexicon-types.js';
import { isWildcard, MIN_WILDCARD_STEM } from './parse-lexicon.js';
import { plainWords } from '../text/plain-words.js';

/** What one pattern contributes: a weight to each of its categories (by index). */
export interface Hit {
  pattern: string;
  categories: number[];
  weights: number[];
}

export interface Phrase extends Hit {
  tokens: string[];
}

/**
 * A lexicon compiled to read-only matchers. Built once per run; scoring never mutates it.
 */
export interface CompiledLexicon {
  ref: LexiconRef;
  lexicon: Lexicon;
  language: string;
  scoring: LexiconScoring;
  categories: ReadonlyArray<{ name: string; aggregation: Aggregation }>;
  /** Single-token patterns by normalised token. */
  single: ReadonlyMap<string, Hit>;
  /** Multi-token phrases by their first token, longest first. */
  phrases: ReadonlyMap<string, Phrase[]>;
  /** Trailing wildcards by stem. */
  wildcards: ReadonlyMap<string, Hit>;
  /** Distinct stem lengths, longest first. */
  stemLengths: number[];
  /** The first MIN_WILDCARD_STEM characters of every stem: a token whose start is not here matches no wildcard. */
  stemPrefixes: ReadonlySet<string>;
  /** Single words and phrases by their (first) token, for one look-up per token when matching. */
  starts: ReadonlyMap<string, { exact?: Hit; phrases?: Phrase[] }>;
  negation: NegationRule;
  negators: ReadonlySet<string>;
  window: number;
  /** Midpoint sum of the scale: `flip` maps a weight w to `reflect − w`. */
  reflect: number;
  /** For VADER scoring: lower-cased term → valence. */
  valence: ReadonlyMap<string, number>;
  /** For `plain-words` scoring: lower-cased term (words joined by one space) → its hit. */
  plain: ReadonlyMap<string, Hit>;
  /** For `plain-words` scoring: the most words in a term. */
  plainMaxWords: number;
}

function addHit(map: Map<string, Hit>, key: string, pattern: string, category: number, weight: number): void {
  const hit = map.get(key);
  if (!hit) map.set(key, { pattern, categories: [category], weights: [weight] });
  else if (!hit.categories.includes(category)) {
    hit.categories.push(category);
    hit.weights.push(weight);
  }
}

/** The matching tables of a compiled lexicon, built from its terms on first use. */
type Tables = Pick<CompiledLexicon, 'single' | 'phrases' | 'wildcards' | 'stemLengths' | 'stemPrefixes' | 'starts' | 'valence' | 'plain' | 'plainMaxWords'>;
const TABLE_KEYS = ['single', 'phrases', 'wildcards', 'stemLengths', 'stemPrefixes', 'starts', 'valence', 'plain', 'plainMaxWords'] as const;

function buildTables(lexicon: Lexicon): Tables {
  const categoryIndex = new Map(lexicon.categories.map((c, i) => [c.name, i]));
  const single = new Map<string, Hit>();
  const wildcards = new Map<string, Hit>();
  const phraseMap = new Map<string, Map<string, Phrase>>();
  const valence = new Map<string, number>();
  const plain = new Map<string, Hit>();
  let plainMaxWords = 0;
  for (const row of lexicon.terms) {
    if (row.status !== 'accepted') continue;
    const c = categoryIndex.get(row.category) as number;
    if (lexicon.scoring === 'plain-words') {
      const words = plainWords(row.term.toLocaleLowerCase(lexicon.language));
      if (words.length === 0) continue;
      addHit(plain, words.join(' '), row.term, c, row.weight);
      plainMaxWords = Math.max(plainMaxWords, words.length);
      continue;
    }
    if (lexicon.scoring === 'vader') {
      if (!valence.has(row.term)) valence.set(row.term, row.weight);
      continue;
    }
    if (isWildcard(row.term)) {
      addHit(wildcards, row.term.slice(0, -1).toLocaleLowerCase(lexicon.language), row.term, c, row.weight);
      continue;
    }
    const tokens = termNorms(row.term, lexicon.language);
    if (tokens.length === 0) continue;
    if (tokens.length === 1) {
      addHit(single, tokens[0] as string, row.term, c, row.weight);
      continue;
    }
    const first = tokens[0] as string;
    let byText = phraseMap.get(first);
    if (!byText) phraseMap.set(first, (byText = new Map()));
    const key = tokens.join(' ');
    const existing = byText.get(key);
    if (!existing) byText.set(key, { pattern: row.term, tokens, categories: [c], weights: [row.weight] });
    else if (!existing.categories.includes(c)) {
      existing.categories.push(c);
      existing.weights.push(row.weight);
    }
  }
  const phrases = new Map<string, Phrase[]>();
  for (const [first, byText] of phraseMap) phrases.set(first, [...byText.values()].sort((a, b) => b.tokens.length - a.tokens.length));
  const stemLengths = [...new Set([...wildcards.keys()].map((k) => k.length))].sort((a, b) => b - a);
  const stemPrefixes = new Set([...wildcards.keys()].map((k) => k.slice(0, MIN_WILDCARD_STEM)));
  const starts = new Map<string, { exact?: Hit; phrases?: Phrase[] }>();
  for (const [token, hit] of single) starts.set(token, { exact: hit });
  for (const [token, list] of phrases) starts.set(token, { ...starts.get(token), phrases: list });
  return { single, phrases, wildcards, stemLengths, stemPrefixes, starts, valence, plain, plainMaxWords };
}

/**
 * Compiles a parsed lexicon. Terms are tokenized with the tokenizer of the lexicon's language,
 * so phrases, contractions and emoji are matched token by token exactly as the text is.
 * Only `accepted` terms are compiled. `sha256` is the lexicon's lexiconHash, for a caller that
 * has it already (a scoring worker is sent it with the lexicon).
 *
 * The matching tables are built on first use, not here: a thread that only reads and writes
 * while workers score (see io/score-pool) then never loads the tokenizer. After the first use
 * they are plain read-only properties.
 */
export function compileLexicon(lexicon: Lexicon, sha256 = lexiconHash(lexicon)): CompiledLexicon {
  const eager: Omit<CompiledLexicon, keyof Tables> = {
    ref: { name: lexicon.name, version: lexicon.version, sha256, license: lexicon.license, source: lexicon.source },
    lexicon,
    language: lexicon.language,
    scoring: lexicon.scoring,
    categories: lexicon.categories.map((c) => ({ name: c.name, aggregation: c.aggregation })),
    negation: lexicon.negation,
    negators: new Set(lexicon.negators),
    window: lexicon.window,
    reflect: lexicon.scale[0] + lexicon.scale[1],
  };
  const compiled = eager as CompiledLexicon;
  const build = (): Tables => {
    const tables = buildTables(lexicon);
    for (const key of TABLE_KEYS) Object.defineProperty(compiled, key, { value: tables[key], enumerable: true, writable: false, configurable: false });
    return tables;
  };
  for (const key of TABLE_KEYS) Object.defineProperty(compiled, key, { get: () => build()[key], enumerable: true, configurable: true });
  return compiled;
}
