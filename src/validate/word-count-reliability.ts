import { fisherInterval, pearsonCorrelation } from '../stats/pearson-correlation.js';
import { quantile } from '../stats/quantile.js';
import type { RandomSource } from '../stats/random.js';
import { repeatedMeasuresCorrelation } from '../stats/repeated-measures-correlation.js';
import { spearmanBrown, spearmanBrownFactor } from '../stats/spearman-brown.js';
import type { BinReducer } from '../series/bin-accumulator.js';
import type { EntryScore } from './entry-score.js';
import { splitBin, type BinPiece } from './split-bin.js';

/** Split-half reliability of bin scores within one band of bin word counts. */
export interface BandReliability {
  /** Band of the bin's total words: low ≤ words < high (high undefined for the open top band). */
  low: number;
  high: number | undefined;
  /** Bins in the band with at least two scored entries. */
  bins: number;
  medianWords: number | undefined;
  /** Correlation of the two half scores across bins, averaged over the random splits. */
  halfR: number | undefined;
  /** Spearman–Brown corrected to the whole bin, 2r/(1 + r); undefined when not estimable. */
  reliability: number | undefined;
  /** Approximate 95% interval of the reliability (Fisher-z interval of the half r over the band's bins, stepped up); ends below 0 are left out. */
  reliabilityLow: number | undefined;
  reliabilityHigh: number | undefined;
  /** The same from within-person deviations only (repeated-measures correlation of the halves, averaged, corrected); undefined when not positive. */
  withinReliability: number | undefined;
  /** Words a bin would need to reach the target reliability, projected from this band by Spearman–Brown. */
  wordsForTarget: number | undefined;
  /** Empty, or why there is no estimate. */
  note: string;
}

/** Word-count reliability of one score column. */
export interface WordCountReliability {
  column: string;
  target: number;
  /** The series' reducer used to score each half. */
  reducer: BinReducer;
  /** Random splits averaged per band. */
  splits: number;
  bands: BandReliability[];
  /** Bins with two or more scored entries, over all bands. */
  bins: number;
  /** The recommended `--min-words`, or undefined when it cannot be estimated or larger bands contradict it. */
  minWords: number | undefined;
  /** `observed`: the lower edge of the first band from which every band (with enough bins) reaches the target; `projected`: Spearman–Brown projection from the largest estimable band; `none`. */
  basis: 'observed' | 'projected' | 'none';
  text: string;
  /** Set when the `--min-words` in use is below the recommendation. */
  warning?: string;
}

/** Options of {@link wordCountReliability}. */
export interface WordCountReliabilityOptions {
  random: RandomSource;
  /** Lower edges of the word-count bands (default 0, 25, 50, 100, 200, 400, 800). */
  bands?: readonly number[];
  /** Target reliability (default 0.7, common practice: Nunnally 1978's threshold for research use). */
  target?: number;
  /** Fewest bins for a band estimate (default 20, common practice). */
  minBins?: number;
  /** How the series combines a bin's entries (default `weighted`); each half is scored the same way. */
  reducer?: BinReducer;
  /** Random splits averaged per band (default 100; Parsons, Kruijt & Fox 2019 use 5,000 for single tasks). */
  splits?: number;
  /** The `--min-words` in use, for the warning when it is below the recommendation. */
  minWordsInUse?: number;
}

interface Bin {
  person: string;
  words: number;
  pieces: BinPiece[];
}

const f2 = (x: number): string => x.toFixed(2);

/**
 * How many words make a reliable bin score? For every bin (person × bin start) with at least two
 * scored entries, the entries are split at random into two halves of about equal length (by words
 * for the word-based reducers, by entries for `mean`; see `splitBin`), and each half is scored with
 * the series' own reducer. Within each band of bin word counts, the correlation of the half scores
 * across bins is computed for each of `splits` random splits and averaged (the permutation-based
 * split-half approach of Parsons, Kruijt & Fox 2019, Adv Methods Pract Psychol Sci 2:378–395; here
 * the half correlations are averaged and stepped up once), then corrected with Spearman–Brown,
 * 2r/(1 + r), to the reliability of a whole bin (Spearman 1910; Brown 1910). The within-person
 * variant correlates the halves after removing each person's means (repeated-measures
 * correlation): the reliability of a bin's deviation from the person's usual level, which is what
 * within-person analyses need; it is usually lower.
 *
 * Not estimable (never stepped up): a band whose averaged half correlation is ≤ 0 (the halves do
 * not agree), or whose approximate 95% interval (Fisher z over the band's bins) reaches 0
 * (unstable).
 *
 * Recommendation: the lower edge of the first band from which every band with enough bins is
 * estimable and reaches the target (`observed`); otherwise a Spearman–Brown projection from the
 * largest estimable band (`projected`, an extrapolation) — but none when a larger band with
 * enough bins is not estimable, since it contradicts the projection.
 */
export function wordCountReliability(entries: readonly EntryScore[], column: string, options: WordCountReliabilityOptions): WordCountReliability {
  const target = options.target ?? 0.7;
  const edges = [...(options.bands ?? [0, 25, 50, 100, 200, 400, 800])].sort((a, b) => a - b);
  const minBins = options.minBins ?? 20;
  const reducer = options.reducer ?? 'weighted';
  const splits = Math.max(1, options.splits ?? 100);
  // Group scored entries by person and bin, in a stable order. Entries without words carry no
  // weight in a word-weighted mean, so they are left out there, as the series leaves them out.
  const byBin = new Map<string, Bin & { entries: EntryScore[] }>();
  for (const e of entries) {
    const score = e.scores[column];
    if (e.excluded || e.binStart === undefined || score === undefined) continue;
    if (reducer === 'weighted' && e.words <= 0) continue;
    const key = `${e.person}\u0000${e.binStart}`;
    const bin = byBin.get(key);
    if (bin) bin.entries.push(e);
    else byBin.set(key, { person: e.person, words: 0, pieces: [], entries: [e] });
  }
  const bins: Bin[] = [];
  for (const key of [...byBin.keys()].sort()) {
    const bin = byBin.get(key) as Bin & { entries: EntryScore[] };
    if (bin.entries.length < 2) continue;
    const ordered = [...bin.entries].sort((x, y) => x.instant - y.instant);
    bins.push({ person: bin.person, words: ordered.reduce((s, e) => s + e.words, 0), pieces: ordered.map((e) => ({ words: e.words, score: e.scores[column] as number })) });
  }
  const bandOf = (words: number): number => {
    let k = -1;
    for (let i = 0; i < edges.length; i++) if (words >= (edges[i] as number)) k = i;
    return k;
  };
  const members: Bin[][] = edges.map(() => []);
  for (const bin of bins) {
    const k = bandOf(bin.words);
    if (k >= 0) (members[k] as Bin[]).push(bin);
  }
  // Split every bin `splits` times; average the per-split correlations of each band.
  const sumR = edges.map(() => 0);
  const countR = edges.map(() => 0);
  const sumWithin = edges.map(() => 0);
  const countWithin = edges.map(() => 0);
  for (let s = 0; s < splits; s++) {
    members.forEach((list, k) => {
      if (list.length < minBins) return;
      const halves: { person: string; a: number; b: number }[] = [];
      for (const bin of list) {
        const h = splitBin(bin.pieces, reducer, options.random);
        if (h) halves.push({ person: bin.person, a: h.a, b: h.b });
      }
      const r = pearsonCorrelation(halves, (h) => h.a, (h) => h.b);
      if (r.ok) {
        sumR[k] = (sumR[k] as number) + r.r;
        countR[k] = (countR[k] as number) + 1;
      }
      const w = repeatedMeasuresCorrelation(halves, (h) => h.person, (h) => h.a, (h) => h.b);
      if (w.ok) {
        sumWithin[k] = (sumWithin[k] as number) + w.r;
        countWithin[k] = (countWithin[k] as number) + 1;
      }
    });
  }
  const bands: BandReliability[] = edges.map((low, k) => {
    const high = edges[k + 1];
    const list = members[k] as Bin[];
    const medianWords = quantile(list, 0.5, (b) => b.words);
    const base = { low, high, bins: list.length, medianWords };
    const empty = { halfR: undefined, reliability: undefined, reliabilityLow: undefined, reliabilityHigh: undefined, withinReliability: undefined, wordsForTarget: undefined };
    if (list.length < minBins) return { ...base, ...empty, note: `fewer than ${minBins} bins` };
    const n = countR[k] as number;
    const nw = countWithin[k] as number;
    const withinR = nw > 0 ? (sumWithin[k] as number) / nw : undefined;
    const withinReliability = withinR !== undefined && withinR > 0 ? spearmanBrown(withinR, 2) : undefined;
    if (n < splits / 2) return { ...base, ...empty, withinReliability, note: 'not estimable: the halves do not vary across bins' };
    const halfR = (sumR[k] as number) / n;
    const [lowR, highR] = fisherInterval(halfR, list.length - 3);
    if (!(halfR > 0)) return { ...base, ...empty, halfR, withinReliability, note: `not estimable: the halves do not agree (mean half r = ${f2(halfR)})` };
    if (lowR === undefined || !(lowR > 0)) return { ...base, ...empty, halfR, withinReliability, note: `not estimable: unstable (the 95% interval of the half r, ${f2(lowR ?? -1)} to ${f2(highR ?? 1)}, includes 0)` };
    const reliability = spearmanBrown(halfR, 2) as number;
    const factor = spearmanBrownFactor(reliability, target);
    return {
      ...base,
      halfR,
      reliability,
      reliabilityLow: spearmanBrown(lowR, 2),
      reliabilityHigh: highR !== undefined ? spearmanBrown(highR, 2) : undefined,
      withinReliability,
      wordsForTarget: factor !== undefined && medianWords !== undefined ? Math.ceil(medianWords * factor) : undefined,
      note: '',
    };
  });
  const considered = bands.filter((b) => b.bins >= minBins);
  let minWords: number | undefined;
  let basis: WordCountReliability['basis'] = 'none';
  let contradiction: BandReliability | undefined;
  for (let i = 0; i < considered.length; i++) {
    if (considered.slice(i).every((b) => b.reliability !== undefined && b.reliability >= target)) {
      minWords = (considered[i] as BandReliability).low;
      basis = 'observed';
      break;
    }
  }
  if (basis === 'none') {
    let last = -1;
    considered.forEach((b, i) => {
      if (b.reliability !== undefined) last = i;
    });
    const baseBand = considered[last];
    contradiction = last >= 0 ? considered.slice(last + 1).find((b) => b.reliability === undefined) : undefined;
    if (baseBand && !contradiction && baseBand.wordsForTarget !== undefined) {
      minWords = baseBand.wordsForTarget;
      basis = 'projected';
    }
  }
  const range = (b: BandReliability) => (b.high === undefined ? `${b.low}+` : `${b.low}–${b.high}`);
  const text =
    basis === 'observed'
      ? `Bins of ${minWords} words or more reach a split-half reliability of ${target} for ${column} (${splits} random splits averaged, halves scored by ${reducer}, Spearman–Brown corrected); consider --min-words ${minWords}.`
      : basis === 'projected'
        ? `No band of observed bins reaches a reliability of ${target} for ${column}; projecting from the largest estimable band with Spearman–Brown, about ${minWords} words per bin would. This is an extrapolation beyond the data; longer bins (a coarser --bin) may be needed.`
        : contradiction
          ? `No --min-words is recommended for ${column}: bands of more words do not confirm a projection (the ${range(contradiction)} word band is ${contradiction.note.replace(/^not estimable: /, 'not estimable: ')}), so they contradict it; the word count alone does not make this score reliable here.`
          : considered.length === 0
            ? `The reliability of ${column} by word count cannot be estimated: too few bins with two or more scored entries (${bins.length}; at least ${minBins} per band are needed).`
            : `The reliability of ${column} by word count is not estimable in any band: the two halves of a bin do not agree beyond chance, so no --min-words is recommended.`;
  const result: WordCountReliability = { column, target, reducer, splits, bands, bins: bins.length, minWords, basis, text };
  if (minWords !== undefined && options.minWordsInUse !== undefined && options.minWordsInUse < minWords)
    result.warning = `--min-words is ${options.minWordsInUse}, below the ${minWords} words that bins of ${column} need to reach a reliability of ${target} (${basis === 'projected' ? 'a projection' : 'observed'}); thinner bins make noisier scores. Raise --min-words in the series step or choose longer bins.`;
  return result;
}
