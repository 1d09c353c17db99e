import { parseWordnetDataLine } from './parse-wordnet-data-line.js';
import { parseWordnetIndexLine } from './parse-wordnet-index-line.js';
import type { WordNetPos, WordNetSource, WordNetSynset } from './wordnet-types.js';

/** How a WordNet lemma is related to the word asked about. */
export type WordNetRelation = 'synonym' | 'similar' | 'see-also' | 'derived' | 'pertainym';

/** Pointer symbols (wninput(5WN)) followed for each relation besides synonymy. */
const POINTER_RELATION: Readonly<Record<string, WordNetRelation>> = { '&': 'similar', '^': 'see-also', '+': 'derived', '\\': 'pertainym' };

/** One related lemma with where it came from. */
export interface WordNetRelated {
  /** The lemma with `_` turned into spaces, as written in the data file (case kept). */
  lemma: string;
  relation: WordNetRelation;
  /** Part of speech of the sense of the word asked about. */
  pos: WordNetPos;
  /** 1-based sense number of the word asked about (WordNet orders senses by frequency). */
  sense: number;
  /** Byte offset of the synset the lemma was found in. */
  synset: number;
}

/** Options of {@link wordnetRelatedLemmas}. */
export interface WordNetRelatedOptions {
  /** Relations to follow (default: all five). */
  relations?: readonly WordNetRelation[];
  /** Only the first n senses of each part of speech (default: all). */
  maxSenses?: number;
  /** Parts of speech to look in (default: n, v, a, r). */
  pos?: readonly WordNetPos[];
}

const ALL_RELATIONS: readonly WordNetRelation[] = ['synonym', 'similar', 'see-also', 'derived', 'pertainym'];
const ALL_POS: readonly WordNetPos[] = ['n', 'v', 'a', 'r'];

/** The lookup form of a word in WordNet index files: lower case, spaces as underscores. */
export function wordnetKey(word: string): string {
  return word.trim().toLowerCase().replace(/\s+/g, '_');
}

function synsetAt(source: WordNetSource, pos: WordNetPos, offset: number): WordNetSynset | undefined {
  const line = source.dataLine(pos, offset);
  return line === undefined ? undefined : parseWordnetDataLine(line);
}

/**
 * Lemmas related to `word` in WordNet (Miller 1995; Princeton WordNet 3.1): the other words of
 * each synset that contains it (synonyms), and the words of synsets reached by the similar-to
 * (`&`), also-see (`^`), derivationally related (`+`) and pertainym (`\`) pointers. Lexical
 * pointers (non-zero source/target word numbers) are followed only from the word itself and lead
 * only to their target word. Returns one item per (lemma, relation, sense), in the order of the
 * index file's senses, without the word itself; an empty array when WordNet does not know it.
 */
export function wordnetRelatedLemmas(source: WordNetSource, word: string, options: WordNetRelatedOptions = {}): WordNetRelated[] {
  const key = wordnetKey(word);
  const relations = new Set(options.relations ?? ALL_RELATIONS);
  const out: WordNetRelated[] = [];
  const seen = new Set<string>();
  const push = (lemma: string, relation: WordNetRelation, pos: WordNetPos, sense: number, synset: number): void => {
    if (wordnetKey(lemma) === key) return;
    const text = lemma.replace(/_/g, ' ');
    const id = `${text.toLowerCase()}\u0000${relation}\u0000${pos}\u0000${sense}`;
    if (seen.has(id)) return;
    seen.add(id);
    out.push({ lemma: text, relation, pos, sense, synset });
  };
  for (const pos of options.pos ?? ALL_POS) {
    const line = source.indexLine(pos, key);
    const entry = line === undefined ? undefined : parseWordnetIndexLine(line);
    if (!entry) continue;
    const offsets = entry.synsetOffsets.slice(0, options.maxSenses ?? entry.synsetOffsets.length);
    offsets.forEach((offset, s) => {
      const synset = synsetAt(source, pos, offset);
      if (!synset) return;
      const sense = s + 1;
      const wordNumber = synset.words.findIndex((w) => wordnetKey(w) === key) + 1;
      if (relations.has('synonym')) for (const w of synset.words) push(w, 'synonym', pos, sense, offset);
      for (const pointer of synset.pointers) {
        const relation = POINTER_RELATION[pointer.symbol];
        if (!relation || !relations.has(relation)) continue;
        if (pointer.source !== 0 && pointer.source !== wordNumber) continue;
        const target = synsetAt(source, pointer.pos, pointer.offset);
        if (!target) continue;
        const words = pointer.target !== 0 ? [target.words[pointer.target - 1]].filter((w): w is string => w !== undefined) : target.words;
        for (const w of words) push(w, relation, pos, sense, pointer.offset);
      }
    });
  }
  return out;
}

/** Parts of speech under which WordNet lists `word` (in n, v, a, r order). */
export function wordnetPartsOfSpeech(source: WordNetSource, word: string): WordNetPos[] {
  const key = wordnetKey(word);
  return ALL_POS.filter((pos) => source.indexLine(pos, key) !== undefined);
}
