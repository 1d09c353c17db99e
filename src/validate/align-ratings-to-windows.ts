import type { AlignedRow } from './aligned-row.js';
import type { EntryScore } from './entry-score.js';
import type { Rating } from './rating.js';

/** Options of {@link alignRatingsToWindows}. */
export interface WindowOptions {
  /** Window length before each self-report, in minutes (e.g. 180). */
  windowMinutes: number;
  /** Fewest words in the window for a text score (else `too_few_words`). */
  minWords: number;
  scoreColumns: readonly string[];
  ratingColumns: readonly string[];
  /** Formats a self-report's local time for the `label` column. */
  label: (rating: Rating) => string;
}

/**
 * Prompt-window alignment: for each self-report at instant t, the person's entries written in
 * [t − window, t) are pooled into one text score per column, weighted by their word counts,
 * Σ wᵢsᵢ / Σ wᵢ over entries with a score and at least one word (entries the series stage
 * excluded are left out). A window with no entries is `no_text`, one with fewer than `minWords`
 * words `too_few_words`; its scores are then missing. One row per self-report, in person then
 * time order.
 */
export function alignRatingsToWindows(entries: readonly EntryScore[], ratings: readonly Rating[], options: WindowOptions): AlignedRow[] {
  const byPerson = new Map<string, EntryScore[]>();
  for (const e of entries) {
    if (e.excluded) continue;
    const list = byPerson.get(e.person);
    if (list) list.push(e);
    else byPerson.set(e.person, [e]);
  }
  for (const list of byPerson.values()) list.sort((a, b) => a.instant - b.instant);
  const windowMs = options.windowMinutes * 60_000;
  const sorted = [...ratings].sort((a, b) => (a.person < b.person ? -1 : a.person > b.person ? 1 : a.instant - b.instant));
  return sorted.map((rating) => {
    const list = byPerson.get(rating.person) ?? [];
    const from = rating.instant - windowMs;
    // First entry at or after `from`.
    let lo = 0;
    let hi = list.length;
    while (lo < hi) {
      const mid = (lo + hi) >> 1;
      if ((list[mid] as EntryScore).instant < from) lo = mid + 1;
      else hi = mid;
    }
    let count = 0;
    let words = 0;
    const weighted: Record<string, number> = {};
    const weights: Record<string, number> = {};
    for (let i = lo; i < list.length && (list[i] as EntryScore).instant < rating.instant; i++) {
      const e = list[i] as EntryScore;
      count += 1;
      words += e.words;
      if (e.words <= 0) continue;
      for (const c of options.scoreColumns) {
        const s = e.scores[c];
        if (s === undefined) continue;
        weighted[c] = (weighted[c] ?? 0) + e.words * s;
        weights[c] = (weights[c] ?? 0) + e.words;
      }
    }
    const missing = count === 0 ? 'no_text' : words < options.minWords ? 'too_few_words' : '';
    const scores: Record<string, number | undefined> = {};
    for (const c of options.scoreColumns) scores[c] = missing === '' && weights[c] ? (weighted[c] as number) / (weights[c] as number) : undefined;
    const ratingsOut: Record<string, number | undefined> = {};
    for (const c of options.ratingColumns) ratingsOut[c] = rating.values[c];
    return { person: rating.person, instant: rating.instant, label: options.label(rating), entries: count, words, missing, scores, reports: 1, ratings: ratingsOut };
  });
}
