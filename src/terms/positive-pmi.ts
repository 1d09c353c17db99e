/**
 * Positive pointwise mutual information of a word and a seed set over documents (here: entries),
 * PPMI = max(0, log₂( P(w,s) / (P(w)·P(s)) )) with P(w) = n_w/N, P(s) = n_s/N, P(w,s) = n_ws/N,
 * i.e. log₂(n_ws·N / (n_w·n_s)) (Church & Hanks 1990, "Word association norms, mutual
 * information, and lexicography"; the positive variant as in Bullinaria & Levy 2007).
 *
 * Returns undefined when a count is zero or the counts are inconsistent (n_ws > n_w or n_s, n_w or
 * n_s > N), since PMI is then undefined.
 */
export function positivePmi(both: number, word: number, seed: number, total: number): number | undefined {
  if (!(both > 0 && word > 0 && seed > 0 && total > 0) || both > word || both > seed || word > total || seed > total) return undefined;
  return Math.max(0, Math.log2((both * total) / (word * seed)));
}
