import { quantile } from '../stats/quantile.js';
import type { RandomSource } from '../stats/random.js';
import { repeatedMeasuresCorrelation } from '../stats/repeated-measures-correlation.js';
import { shuffle } from '../stats/shuffle.js';
import { spearmanBrown, spearmanBrownFactor } from '../stats/spearman-brown.js';
import { splitHalfReliability } from '../stats/split-half-reliability.js';
import type { EntryScore } from './entry-score.js';

/** Split-half reliability of bin scores within one band of bin word counts. */
export interface BandReliability {
  /** Band of the bin's total words: low ≤ words < high (high undefined for the open top band). */
  low: number;
  high: number | undefined;
  /** Bins in the band with at least two scored entries. */
  bins: number;
  medianWords: number | undefined;
  /** Correlation of the two half scores across bins. */
  halfR: number | undefined;
  /** Spearman–Brown corrected to the whole bin: 2r/(1 + r). */
  reliability: number | undefined;
  /** The same from within-person deviations only (repeated-measures correlation of the halves, corrected). */
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
  bands: BandReliability[];
  /** Bins with two or more scored entries, over all bands. */
  bins: number;
  /** The recommended `--min-words`, or undefined when it cannot be estimated. */
  minWords: number | undefined;
  /** `observed`: the lower edge of the first band from which every band reaches the target; `projected`: Spearman–Brown projection (median over bands); `none`. */
  basis: 'observed' | 'projected' | 'none';
  text: string;
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
}

/**
 * How many words make a reliable bin score? For every bin (person × bin start) with at least two
 * scored entries, the entries are split at random into two halves (seeded; alternate assignment
 * after a Fisher–Yates shuffle) and each half is scored as the word-weighted mean of its entries'
 * scores. Within each band of bin word counts, the correlation of the half scores across bins is
 * corrected with Spearman–Brown (2r/(1 + r)) to the reliability of a whole bin of that many words
 * (Spearman 1910; Brown 1910). The within-person variant correlates the halves after removing
 * each person's means (repeated-measures correlation), i.e. the reliability of a bin's deviation
 * from the person's usual level, which is what within-person analyses need; it is usually lower.
 *
 * Recommendation: the lower edge of the first band from which every band with an estimate reaches
 * the target (`observed`); otherwise the median over bands of words × Spearman–Brown lengthening
 * factor (`projected`, an extrapolation); otherwise none.
 */
export function wordCountReliability(entries: readonly EntryScore[], column: string, options: WordCountReliabilityOptions): WordCountReliability {
  const target = options.target ?? 0.7;
  const edges = [...(options.bands ?? [0, 25, 50, 100, 200, 400, 800])].sort((a, b) => a - b);
  const minBins = options.minBins ?? 20;
  // Group scored entries by person and bin, in a stable order.
  const bins = new Map<string, { person: string; entries: EntryScore[] }>();
  for (const e of entries) {
    if (e.excluded || e.binStart === undefined || e.words <= 0 || e.scores[column] === undefined) continue;
    const key = `${e.person}\u0000${e.binStart}`;
    const bin = bins.get(key);
    if (bin) bin.entries.push(e);
    else bins.set(key, { person: e.person, entries: [e] });
  }
  const halves: { person: string; words: number; a: number; b: number }[] = [];
  for (const key of [...bins.keys()].sort()) {
    const bin = bins.get(key) as { person: string; entries: EntryScore[] };
    if (bin.entries.length < 2) continue;
    const ordered = shuffle([...bin.entries].sort((x, y) => x.instant - y.instant), options.random);
    let wa = 0, sa = 0, wb = 0, sb = 0;
    ordered.forEach((e, i) => {
      const s = e.scores[column] as number;
      if (i % 2 === 0) { wa += e.words; sa += e.words * s; } else { wb += e.words; sb += e.words * s; }
    });
    halves.push({ person: bin.person, words: wa + wb, a: sa / wa, b: sb / wb });
  }
  const bands: BandReliability[] = edges.map((low, i) => {
    const high = edges[i + 1];
    const inBand = halves.filter((h) => h.words >= low && (high === undefined || h.words < high));
    const medianWords = quantile(inBand, 0.5, (h) => h.words);
    const base = { low, high, bins: inBand.length, medianWords };
    if (inBand.length < minBins) return { ...base, halfR: undefined, reliability: undefined, withinReliability: undefined, wordsForTarget: undefined, note: `fewer than ${minBins} bins` };
    const split = splitHalfReliability(inBand, (h) => h.a, (h) => h.b);
    const within = repeatedMeasuresCorrelation(inBand, (h) => h.person, (h) => h.a, (h) => h.b);
    const withinReliability = within.ok ? spearmanBrown(within.r, 2) : undefined;
    if (!split.ok) return { ...base, halfR: undefined, reliability: undefined, withinReliability, wordsForTarget: undefined, note: split.code };
    const factor = spearmanBrownFactor(split.reliability, target);
    return {
      ...base,
      halfR: split.halfCorrelation.r,
      reliability: split.reliability,
      withinReliability,
      wordsForTarget: factor !== undefined && medianWords !== undefined ? Math.ceil(medianWords * factor) : undefined,
      note: split.reliability <= 0 ? 'halves do not agree' : '',
    };
  });
  const estimated = bands.filter((b) => b.reliability !== undefined);
  let minWords: number | undefined;
  let basis: WordCountReliability['basis'] = 'none';
  for (let i = 0; i < estimated.length; i++) {
    if (estimated.slice(i).every((b) => (b.reliability as number) >= target)) {
      minWords = (estimated[i] as BandReliability).low;
      basis = 'observed';
      break;
    }
  }
  if (basis === 'none') {
    const projected = quantile(estimated, 0.5, (b) => b.wordsForTarget);
    if (projected !== undefined) {
      minWords = Math.ceil(projected);
      basis = 'projected';
    }
  }
  const text =
    basis === 'observed'
      ? `Bins of ${minWords} words or more reach a split-half reliability of ${target} for ${column} (Spearman–Brown corrected); consider --min-words ${minWords}.`
      : basis === 'projected'
        ? `No band of observed bins reaches a reliability of ${target} for ${column}; projecting with Spearman–Brown, about ${minWords} words per bin would. This is an extrapolation beyond the data; longer bins (a coarser --bin) may be needed.`
        : `The reliability of ${column} by word count cannot be estimated: too few bins with two or more scored entries (${halves.length}; at least ${minBins} per band are needed).`;
  return { column, target, bands, bins: halves.length, minWords, basis, text };
}
