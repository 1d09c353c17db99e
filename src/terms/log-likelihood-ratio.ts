/**
 * Strength of a word's positive association with a seed set over documents (entries): the
 * log-likelihood ratio G² = 2 Σ O·ln(O/E) over the 2×2 table of entries with/without the word
 * and with/without a seed (Dunning 1993, "Accurate methods for the statistics of surprise and
 * coincidence"). Unlike PMI it grows with the evidence, so a word seen three times, each with a
 * seed, does not outrank one seen thirty times with them. Returns 0 when the word co-occurs with
 * the seeds no more often than chance predicts, and for inconsistent counts.
 */
export function logLikelihoodRatio(both: number, word: number, seed: number, total: number): number {
  if (!(both >= 0 && word >= both && seed >= both && total >= word + seed - both) || total <= 0) return 0;
  const cells = [both, word - both, seed - both, total - word - seed + both];
  const expected = [(word * seed) / total, (word * (total - seed)) / total, ((total - word) * seed) / total, ((total - word) * (total - seed)) / total];
  if (both <= (expected[0] as number)) return 0;
  let g = 0;
  for (let k = 0; k < 4; k++) {
    const o = cells[k] as number;
    if (o > 0) g += o * Math.log(o / (expected[k] as number));
  }
  return Math.max(0, 2 * g);
}
