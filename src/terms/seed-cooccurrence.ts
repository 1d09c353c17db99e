/** Entry counts for one word: entries holding it, and entries holding it and a seed. */
export interface WordCounts {
  entries: number;
  withSeed: number;
}

/** Co-occurrence of corpus words with a seed set, with the entry as the window. */
export interface SeedCooccurrence {
  /** Entries counted (N). */
  entries: number;
  /** Entries holding at least one seed (n_s). */
  seedEntries: number;
  /** Per word (normalised token): n_w and n_ws. Seeds are counted too. */
  words: Map<string, WordCounts>;
}

/**
 * Counts, over entries given as the sets of their distinct word tokens, how many entries hold each
 * word and how many hold it together with at least one of `seeds` (window = the whole entry, each
 * word counted once per entry). One pass; memory grows with the vocabulary, not the corpus.
 */
export function seedCooccurrence(entries: Iterable<ReadonlySet<string>>, seeds: ReadonlySet<string>): SeedCooccurrence {
  const words = new Map<string, WordCounts>();
  let n = 0;
  let seedEntries = 0;
  for (const tokens of entries) {
    n++;
    let hasSeed = false;
    for (const t of tokens) {
      if (seeds.has(t)) {
        hasSeed = true;
        break;
      }
    }
    if (hasSeed) seedEntries++;
    for (const t of tokens) {
      let c = words.get(t);
      if (!c) words.set(t, (c = { entries: 0, withSeed: 0 }));
      c.entries++;
      if (hasSeed) c.withSeed++;
    }
  }
  return { entries: n, seedEntries, words };
}
