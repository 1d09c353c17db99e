import { oneWayIntraclassCorrelation } from '../stats/one-way-intraclass-correlation.js';
import { quantile } from '../stats/quantile.js';
import { spearmanBrown } from '../stats/spearman-brown.js';
import type { SeriesBin } from './series-bin.js';

/** How many observed bins each person's mean of a score rests on, and how reliable that mean is. */
export interface BinsPerPerson {
  column: string;
  persons: number;
  min: number | undefined;
  median: number | undefined;
  max: number | undefined;
  /** ICC(1) of the score over observed bins (share of variance between persons). */
  icc1: number | undefined;
  perPerson: { person: string; bins: number; meanReliability: number | undefined }[];
}

/**
 * Counts each person's observed bins with a value of `column` and estimates the reliability of
 * the person's mean from them: ICC(1) of the bin scores stepped up by Spearman–Brown to the
 * person's number of bins, kρ/(1 + (k − 1)ρ) (Shrout & Fleiss 1979, ICC(1,k)). Persons in sorted
 * order. The reliability is undefined when ICC(1) is not estimable or not positive.
 */
export function binsPerPerson(bins: readonly SeriesBin[], column: string): BinsPerPerson {
  const observed = bins.filter((b) => b.missing === '' && b.scores[column] !== undefined);
  const counts = new Map<string, number>();
  for (const b of bins) if (!counts.has(b.person)) counts.set(b.person, 0);
  for (const b of observed) counts.set(b.person, (counts.get(b.person) ?? 0) + 1);
  const icc = oneWayIntraclassCorrelation(observed, (b) => b.person, (b) => b.scores[column]);
  const icc1 = icc.ok ? icc.icc1 : undefined;
  const perPerson = [...counts.keys()].sort().map((person) => {
    const k = counts.get(person) as number;
    return { person, bins: k, meanReliability: icc1 !== undefined && icc1 > 0 && k > 0 ? spearmanBrown(icc1, k) : undefined };
  });
  const ks = perPerson.map((p) => p.bins);
  return { column, persons: perPerson.length, min: ks.length ? Math.min(...ks) : undefined, median: quantile(ks, 0.5), max: ks.length ? Math.max(...ks) : undefined, icc1, perPerson };
}
