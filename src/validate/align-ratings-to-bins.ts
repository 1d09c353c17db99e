import type { Diagnostic } from '../types.js';
import type { AlignedRow } from './aligned-row.js';
import type { Rating } from './rating.js';
import type { SeriesBin } from './series-bin.js';

/**
 * Bin alignment: each self-report goes to the bin of the text series that holds its instant
 * (bin_start ≤ t < bin_end, the person's own bins), and the ratings in a bin are averaged per
 * rating column (missing values skipped). Returns one row per bin that received a self-report,
 * in person then time order, with the bin's text scores (missing when the bin is missing).
 *
 * Self-reports of a person absent from the series (`rating_person_not_in_series`) or outside
 * every bin of the person (`rating_outside_series`) become Diagnostics.
 */
export function alignRatingsToBins(
  bins: readonly SeriesBin[],
  ratings: readonly Rating[],
  ratingColumns: readonly string[],
): { rows: AlignedRow[]; diagnostics: Diagnostic[] } {
  const byPerson = new Map<string, SeriesBin[]>();
  for (const bin of bins) {
    const list = byPerson.get(bin.person);
    if (list) list.push(bin);
    else byPerson.set(bin.person, [bin]);
  }
  for (const list of byPerson.values()) list.sort((a, b) => a.start - b.start);
  const diagnostics: Diagnostic[] = [];
  const sums = new Map<SeriesBin, { n: Record<string, number>; sum: Record<string, number>; reports: number }>();
  for (const rating of ratings) {
    const list = byPerson.get(rating.person);
    if (!list) {
      diagnostics.push({ code: 'rating_person_not_in_series', message: `person \`${rating.person}\` has self-reports but no text series; the self-report is not paired`, source: rating.source, stage: 'validate' });
      continue;
    }
    // Binary search for the last bin starting at or before the instant.
    let lo = 0;
    let hi = list.length - 1;
    let found = -1;
    while (lo <= hi) {
      const mid = (lo + hi) >> 1;
      if ((list[mid] as SeriesBin).start <= rating.instant) {
        found = mid;
        lo = mid + 1;
      } else hi = mid - 1;
    }
    const bin = found >= 0 ? (list[found] as SeriesBin) : undefined;
    if (!bin || rating.instant >= bin.end) {
      diagnostics.push({ code: 'rating_outside_series', message: `the self-report of \`${rating.person}\` at ${new Date(rating.instant).toISOString()} falls outside every bin of the person's text series; it is not paired`, source: rating.source, stage: 'validate' });
      continue;
    }
    let acc = sums.get(bin);
    if (!acc) sums.set(bin, (acc = { n: {}, sum: {}, reports: 0 }));
    acc.reports += 1;
    for (const column of ratingColumns) {
      const value = rating.values[column];
      if (value === undefined) continue;
      acc.n[column] = (acc.n[column] ?? 0) + 1;
      acc.sum[column] = (acc.sum[column] ?? 0) + value;
    }
  }
  const rows: AlignedRow[] = [];
  for (const person of [...byPerson.keys()].sort()) {
    for (const bin of byPerson.get(person) as SeriesBin[]) {
      const acc = sums.get(bin);
      if (!acc) continue;
      const ratingsOut: Record<string, number | undefined> = {};
      for (const column of ratingColumns) ratingsOut[column] = acc.n[column] ? (acc.sum[column] as number) / (acc.n[column] as number) : undefined;
      const observed = bin.missing === '';
      const scores: Record<string, number | undefined> = {};
      for (const [k, v] of Object.entries(bin.scores)) scores[k] = observed ? v : undefined;
      rows.push({ person, instant: bin.start, label: bin.binStart, entries: bin.entries, words: bin.words, missing: bin.missing, scores, reports: acc.reports, ratings: ratingsOut });
    }
  }
  return { rows, diagnostics };
}
