import { DEFAULT_NEGATORS, type Lexicon, type TermRow } from '../lexicon/lexicon-types.js';
import type { TermSuggestion } from './suggest-terms.js';

/** Options of {@link draftLexicon}. */
export interface DraftLexiconOptions {
  name: string;
  category: string;
  seeds: readonly string[];
  suggestions: readonly TermSuggestion[];
  /** Free text naming the corpus and WordNet, written to `## source`. */
  source: string;
  license?: string;
  language?: string;
}

/**
 * A draft lexicon of one `count` category: the seeds with status `accepted`, every suggestion in
 * rank order with status `pending` (the scorer ignores pending terms until a researcher accepts
 * them), weight 1, negation `drop`. Notes say that it is a draft and derived in part from WordNet.
 */
export function draftLexicon(options: DraftLexiconOptions): Lexicon {
  const seeds = [...new Set(options.seeds.map((s) => s.trim().toLowerCase()).filter((s) => s !== ''))];
  const terms: TermRow[] = seeds.map((term) => ({ term, category: options.category, weight: 1, status: 'accepted', line: 0 }));
  const seen = new Set(seeds);
  for (const s of options.suggestions) {
    if (seen.has(s.term)) continue;
    seen.add(s.term);
    terms.push({ term: s.term, category: options.category, weight: 1, status: 'pending', line: 0 });
  }
  return {
    name: options.name,
    version: '0.0.1-draft',
    license: options.license ?? 'terms from WordNet 3.1 under the WordNet 3.1 license (Princeton University); selection by the user',
    source: options.source,
    language: options.language ?? 'en',
    scale: [1, 1],
    scoring: 'rules',
    negation: 'drop',
    negators: [...DEFAULT_NEGATORS],
    window: 3,
    categories: [{ name: options.category, aggregation: 'count', description: `Draft list from the seeds ${seeds.join(', ')}` }],
    terms,
    notes: ['DRAFT: seeds are accepted, suggestions are pending; set each pending term to accepted or rejected after review (lexichron terms suggest).'],
  };
}
